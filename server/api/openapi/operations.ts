import type { z } from 'zod';
import type { Access } from '@/server/auth/access';
import type { ApiScope } from '@/server/auth/api-scopes';
import { listQuerySchema } from '@/server/validation/paging';
import { studyListQuerySchema } from '@/server/validation/study';
import { sitesQuerySchema } from '@/server/validation/sites-query';
import { quoteListQuerySchema } from '@/server/quotes/list-query';
import { tradeoffScenarioSchema } from '@/server/validation/tradeoff-scenario';
import * as R from './responses';

/**
 * Every /api/v1 route as the OpenAPI document describes it. `query` / `body` are the very schema
 * objects the route hands to apiRoute (tests/integration/openapi.test.ts checks identity, the
 * permission and that every route file under app/api/v1 has its rows here and no row is stale).
 */
export type ApiOperation = {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  /** The route folder under app/, e.g. /api/v1/studies/[id]. */
  route: string;
  summary: string;
  description?: string;
  tag: 'Account' | 'Studies' | 'Quotes' | 'Customers' | 'Trade-off' | 'Team' | 'Files' | 'Reference';
  permission: Access;
  /** When the route names its key scope itself (ApiRouteOptions.keyScope). */
  keyScope?: ApiScope;
  query?: z.ZodType;
  body?: z.ZodType;
  /** A body that works against the demo (shown as the request example). */
  bodyExample?: unknown;
  /** JSON answer, or a file of this content type. */
  response: { json: z.ZodType } | { file: string; description: string };
  /** Path ids that another company's rows answer 404 for. */
  byId?: boolean;
  /** A curl example against the demo (added to the description). */
  example?: string;
};

const KEY = '-H "Authorization: Bearer $FADELEDGER_KEY"';

/** An invented site in central France, coordinates only (the maps fill in the rest), two dishes. */
const DEMO_SCENARIO = {
  site: { latDeg: 47.1, lonDeg: 2.6 },
  satellite: { longitudeDeg: -19.5 },
  downlink: { frequencyGHz: 11.75, tiltDeg: 20, eirpDbw: 50, symbolRateMsps: 27.5, requiredEsN0Db: 7.91, implementationMarginDb: 1 },
  receiver: { lnbNoiseTempK: 60, antennaNoiseTempK: 40 },
  dishes: [{ diameterM: 0.6, efficiency: 0.65 }, { diameterM: 0.9, efficiency: 0.65 }],
  targetAvailabilityPercent: 99.7,
};

export const API_OPERATIONS: readonly ApiOperation[] = [
  {
    method: 'get', route: '/api/v1/me', tag: 'Account', permission: 'signed-in', response: { json: R.meSchema },
    summary: 'Who is calling',
    description: 'The company, and either the signed-in person (role, permissions) or the API key (name, prefix, scopes, the permissions they open). Any key may call it: check a key here first.',
    example: `curl ${KEY} $FADELEDGER_URL/api/v1/me`,
  },
  {
    method: 'post', route: '/api/v1/tradeoff', tag: 'Trade-off', permission: 'tradeoff.api', body: tradeoffScenarioSchema, response: { json: R.tradeoffResultSchema },
    summary: 'Dish-size trade-off for a scenario (nothing saved)',
    description:
      'The site, satellite, downlink, receiver and dishes in; margins, availability, outage minutes a year per dish and the recommended dish out. Coordinates are enough: a missing altitude, rain climate, rain height and the atmosphere are read from the ITU-R maps at the site (reported in `mapInputs`); send `atmosphere: null` for rain-only figures. A site without map data or a satellite below the horizon is a 422 naming the field. Needs a plan with API access.',
    bodyExample: DEMO_SCENARIO,
    example: `curl ${KEY} -H "Content-Type: application/json" \\
  -d '${JSON.stringify(DEMO_SCENARIO)}' \\
  $FADELEDGER_URL/api/v1/tradeoff`,
  },
  {
    method: 'get', route: '/api/v1/studies', tag: 'Studies', permission: 'study.read', query: studyListQuerySchema, response: { json: R.studyListSchema },
    summary: 'List studies', description: 'Newest first, summary rows; archived studies are hidden unless `archived=include` or `only`.',
    example: `curl ${KEY} "$FADELEDGER_URL/api/v1/studies?pageSize=10"`,
  },
  {
    method: 'get', route: '/api/v1/studies/[id]', tag: 'Studies', permission: 'study.read', byId: true, response: { json: R.studyDetailSchema },
    summary: 'One study with its input and result snapshots',
  },
  { method: 'get', route: '/api/v1/dashboard', tag: 'Studies', permission: 'study.read', response: { json: R.dashboardSchema }, summary: 'Counts and the latest studies' },
  {
    method: 'get', route: '/api/v1/quotes', tag: 'Quotes', permission: 'quote.read', query: quoteListQuerySchema, response: { json: R.quoteListSchema },
    summary: 'List quotes', description: 'Newest first, with the number of quotes per status.',
    example: `curl ${KEY} "$FADELEDGER_URL/api/v1/quotes?status=open"`,
  },
  {
    method: 'get', route: '/api/v1/quotes/[id]', tag: 'Quotes', permission: 'quote.read', byId: true, response: { json: R.quoteDetailSchema },
    summary: 'One quote with its options, comparison links (never their tokens) and timeline',
  },
  {
    method: 'get', route: '/api/v1/quotes/[id]/pdf', tag: 'Quotes', permission: 'quote.read', byId: true, response: { file: 'application/pdf', description: 'The quote as a PDF (attachment).' },
    summary: 'The quote as a PDF',
    description: 'Take a quote id from GET /api/v1/quotes.',
    example: `curl ${KEY} -o quote.pdf "$FADELEDGER_URL/api/v1/quotes/$QUOTE_ID/pdf"`,
  },
  {
    method: 'get', route: '/api/v1/branding/logo', tag: 'Quotes', permission: 'quote.read', response: { file: 'image/png', description: 'The company’s quote logo (PNG or JPEG); 404 when none is kept.' },
    summary: 'The company’s quote logo',
  },
  { method: 'get', route: '/api/v1/customers', tag: 'Customers', permission: 'customer.read', query: listQuerySchema, response: { json: R.customerListSchema }, summary: 'List customers with their site counts' },
  { method: 'get', route: '/api/v1/sites', tag: 'Customers', permission: 'customer.read', query: sitesQuerySchema, response: { json: R.siteListSchema }, summary: 'List sites with their customer' },
  {
    method: 'get', route: '/api/v1/team', tag: 'Team', permission: 'team.read', response: { json: R.teamSchema },
    summary: 'Members, open invitations and seat use', description: 'Sessions: admins only.',
  },
  {
    method: 'get', route: '/api/v1/uploads/[id]', tag: 'Files', permission: 'catalogue.write', keyScope: 'read', byId: true, response: { file: 'text/csv', description: 'The uploaded file, byte for byte, as an attachment.' },
    summary: 'A kept upload’s original file', description: 'Sessions: admins only (dish catalogue and climate files).',
  },
  {
    method: 'get', route: '/api/v1/openapi.json', tag: 'Reference', permission: 'public', response: { json: R.openApiDocumentSchema },
    summary: 'This document (OpenAPI 3.1)', description: 'Public: no key or session needed.',
  },
];
