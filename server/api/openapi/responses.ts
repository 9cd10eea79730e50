import { z } from 'zod';
import { API_SCOPES } from '@/server/auth/api-scopes';
import { PERMISSION_NAMES } from '@/server/auth/permissions';

/**
 * The bodies the /api/v1 routes answer, as zod schemas, for the OpenAPI document. They name the
 * fields an integrator can rely on; objects stay open (more fields may appear, none disappears).
 * tests/integration/api-keys-routes.test.ts parses every real answer with them, so a field whose
 * name or type drifts from what the route returns fails there.
 */
const dateTime = z.string().meta({ format: 'date-time' });
const open = <T extends z.ZodRawShape>(shape: T) => z.looseObject(shape);

export const errorBodySchema = z
  .object({
    error: z.object({
      code: z.string().meta({ description: 'unauthenticated, forbidden, plan_limit, not_found, invalid_input, rate_limited, conflict, internal, …' }),
      message: z.string().meta({ description: 'Plain words, safe to show to a person.' }),
      fieldErrors: z.record(z.string(), z.array(z.string())).optional().meta({ description: 'invalid_input only: messages by dotted field path ("dishes.2.diameterM").' }),
    }),
  })
  .meta({ title: 'ErrorBody' });

const paged = <T extends z.ZodType>(item: T) =>
  open({ items: z.array(item), page: z.number().int(), pageSize: z.number().int(), total: z.number().int(), pageCount: z.number().int() });

export const studyListItemSchema = open({
  id: z.number().int(),
  title: z.string(),
  status: z.enum(['ready', 'archived']),
  customerName: z.string(),
  siteName: z.string(),
  serviceName: z.string(),
  siteId: z.number().int().nullable(),
  customerId: z.number().int().nullable(),
  dishCount: z.number().int(),
  recommendedDiameterM: z.number().nullable(),
  targetAvailabilityPercent: z.number(),
  revision: z.number().int(),
  engineVersion: z.string(),
  createdByName: z.string().nullable(),
  createdAt: dateTime,
}).meta({ title: 'StudySummary' });

export const studyListSchema = paged(studyListItemSchema);
export const studyDetailSchema = studyListItemSchema
  .extend({
    comparisonOfStudyId: z
      .number()
      .int()
      .nullable()
      .meta({ description: 'Set when this study is a further service of a study comparing several services for one site: the id of that (leading) study. The list shows only leading studies.' }),
    serviceProfileId: z.number().int().nullable(),
    climateProfileId: z.number().int().nullable(),
    inputs: open({}).meta({ description: 'What the study was computed from (site, service, climate, dishes), as saved.' }),
    result: open({}).meta({ description: 'The engine result as saved: options per dish, recommendation, warnings.' }),
  })
  .meta({ title: 'Study' });

export const dashboardSchema = open({
  counts: open({ studies: z.number().int(), studiesThisMonth: z.number().int(), customers: z.number().int(), sites: z.number().int(), dishes: z.number().int() }),
  recent: z.array(studyListItemSchema),
});

export const customerListSchema = paged(
  open({ id: z.number().int(), name: z.string(), email: z.string().nullable(), phone: z.string().nullable(), notes: z.string().nullable(), siteCount: z.number().int(), createdAt: dateTime }).meta({ title: 'Customer' }),
);

export const siteListSchema = paged(
  open({
    id: z.number().int(),
    name: z.string(),
    address: z.string().nullable(),
    customerId: z.number().int(),
    customerName: z.string(),
    latDeg: z.number(),
    lonDeg: z.number(),
    altitudeM: z.number(),
    altitudeSource: z.string(),
    studyCount: z.number().int(),
  }).meta({ title: 'Site' }),
);

const money = z.string().meta({ description: 'Decimal amount as a string, e.g. "519.00".' });
export const quoteListItemSchema = open({
  id: z.number().int(),
  number: z.number().int(),
  title: z.string(),
  status: z.string().meta({ description: 'draft, sent, viewed, accepted, declined or expired' }),
  customerName: z.string(),
  siteName: z.string(),
  chosenDishName: z.string(),
  total: money,
  currency: z.string(),
  validUntil: z.string(),
  studyId: z.number().int().nullable(),
  decidedAt: dateTime.nullable(),
  createdAt: dateTime,
}).meta({ title: 'QuoteSummary' });

export const quoteListSchema = paged(quoteListItemSchema).extend({ counts: z.record(z.string(), z.number().int()).meta({ description: 'Quotes per status.' }) });
export const quoteDetailSchema = open({
  quote: quoteListItemSchema.extend({ subtotal: money, taxAmount: money, options: z.array(open({})), chosenOption: open({}) }),
  links: z.array(open({ id: z.number().int(), expiresAt: dateTime })).meta({ description: 'Comparison links (never their tokens).' }),
  events: z.array(open({ kind: z.string() })),
}).meta({ title: 'Quote' });

export const teamSchema = open({
  members: z.array(open({ membershipId: z.number().int(), name: z.string(), email: z.string(), role: z.enum(['admin', 'installer', 'sales']), joinedAt: dateTime })),
  invitations: z.array(open({ id: z.number().int(), email: z.string(), role: z.string(), expiresAt: dateTime, expired: z.boolean() })),
  seats: open({ used: z.number().int(), limit: z.number().int(), plan: z.string() }),
});

export const meSchema = open({
  user: open({ id: z.string(), name: z.string(), email: z.string() }).nullable().meta({ description: 'The signed-in person; null for an API key.' }),
  apiKey: open({ id: z.number().int(), name: z.string(), prefix: z.string(), scopes: z.array(z.enum(API_SCOPES)) }).nullable().meta({ description: 'The calling key; null for a session.' }),
  company: open({ id: z.number().int(), name: z.string() }).nullable(),
  role: z.string().nullable(),
  permissions: z.array(z.enum(PERMISSION_NAMES as [string, ...string[]])),
  companies: z.array(open({})),
});

export const tradeoffResultSchema = open({
  engineVersion: z.string(),
  elevationDeg: z.number(),
  azimuthDeg: z.number(),
  rangeKm: z.number(),
  rainHeightKm: z.number(),
  freeSpaceLossDb: z.number(),
  attenuationModel: z.enum(['total', 'rain']),
  rainAttenuation001Db: z.number(),
  options: z.array(open({})).meta({ description: 'One per dish, in the order sent: margins, availability and outage minutes a year.' }),
  recommendation: open({}),
  warnings: z.array(open({})),
  mapInputs: open({}).meta({ description: 'What the ITU-R maps supplied that the request left out.' }),
}).meta({ title: 'TradeoffResult' });

export const openApiDocumentSchema = open({ openapi: z.string(), info: open({}), paths: open({}) });
