import { z } from 'zod';
import { parseCoordinate } from './coordinates';
import { checkboxField, idField, idListField, numberIn, optionalText } from './fields';
import { SITE_ALTITUDE_M } from './site';
import { listQuerySchema } from './paging';

/** Availability targets a study may aim at, %: below 90 % nobody sells a service; P.618 ends at 99.999 %. */
export const TARGET_AVAILABILITY_PERCENT = { min: 90, max: 99.999, default: 99.9 } as const;
/** Dishes compared in one study (a table that still reads on a phone). */
export const STUDY_DISHES = { min: 1, max: 12 } as const;
/** Services compared for one site in one study: the main one plus up to three (one table each still reads). */
export const STUDY_SERVICES = { max: 4 } as const;

/**
 * A blank altitude is `undefined` (the server takes the ITU-R P.1511-1 ground height at the site);
 * anything else must be a number in range (NaN otherwise).
 */
function altitudeOf(v: unknown): number | undefined {
  if (v === undefined || v === null || String(v).trim() === '') return undefined;
  const text = String(v).trim();
  const n = /^[+-]?\d+(\.\d+)?$/.test(text) ? Number(text) : Number.NaN;
  return n >= SITE_ALTITUDE_M.min && n <= SITE_ALTITUDE_M.max ? n : Number.NaN;
}

const optionalIdField = (label: string) =>
  z.preprocess((v) => (v === undefined || v === null || v === '' ? undefined : v), idField(label).optional());

/** The climate select's value for the default source: the ITU-R maps at the site (no profile). */
export const MAPS_CLIMATE_VALUE = 'maps';

/** '' or 'maps' → null (the ITU-R maps at the site, the default); otherwise the id of an override profile. */
const climateProfileField = z.preprocess(
  (v) => (v === undefined || v === null || v === '' || v === MAPS_CLIMATE_VALUE ? null : v),
  idField('climate profile').nullable(),
);

/**
 * The new-study form. The customer and the site are either picked (`customerId`, `siteId`) or
 * typed in (`newCustomerName`; `siteName` + coordinates in decimal degrees or DMS + altitude, blank
 * = the ITU-R P.1511-1 map), chosen by `customerMode` / `siteMode`. The rain climate is the ITU-R
 * maps at the site unless a company profile is chosen as an override (`climateProfileId`).
 * The same schema runs in the browser and in the action.
 */
export const newStudySchema = z
  .object({
    title: optionalText('Title', 200),
    customerMode: z.enum(['existing', 'new']).default('existing'),
    customerId: optionalIdField('customer'),
    newCustomerName: optionalText('Customer name', 160),
    /** "A different customer with the same name as one we have" (the Customers form's tick box). */
    sameNameOk: checkboxField(),
    siteMode: z.enum(['existing', 'new']).default('existing'),
    siteId: optionalIdField('site'),
    siteName: optionalText('Site name', 160),
    latDeg: z.union([z.string(), z.number()]).optional(),
    lonDeg: z.union([z.string(), z.number()]).optional(),
    altitudeM: z.union([z.string(), z.number()]).optional(),
    serviceProfileId: idField('service profile'),
    /** Further services to compare with the first for the same site and dishes (none: a single-service study). */
    compareServiceProfileIds: z.preprocess(
      (v) => (v === undefined || v === null || v === '' ? [] : v),
      idListField('services to compare', 0, STUDY_SERVICES.max - 1, 'service'),
    ),
    /** Set when the form edits a study: the saved study becomes its next revision. */
    revisionOfStudyId: optionalIdField('study'),
    climateProfileId: climateProfileField,
    dishIds: idListField('dishes', STUDY_DISHES.min, STUDY_DISHES.max, 'dish'),
    targetAvailabilityPercent: z.preprocess(
      (v) => (v === undefined || v === null || v === '' ? TARGET_AVAILABILITY_PERCENT.default : v),
      numberIn('Target availability', TARGET_AVAILABILITY_PERCENT.min, TARGET_AVAILABILITY_PERCENT.max, '%'),
    ),
  })
  // Runs even when other fields already failed (`when`), so every problem of the form shows at once.
  .superRefine(
    (raw, ctx) => {
      const v = raw as Partial<typeof raw>;
      const newCustomer = v.customerMode === 'new';
      if (newCustomer) {
        if (!v.newCustomerName) ctx.addIssue({ code: 'custom', path: ['newCustomerName'], message: 'Customer name is required.' });
      } else if (v.customerId === undefined) {
        ctx.addIssue({ code: 'custom', path: ['customerId'], message: 'Choose a customer.' });
      }
      if (v.siteMode === 'new' || newCustomer) {
        if (!v.siteName) ctx.addIssue({ code: 'custom', path: ['siteName'], message: 'Site name is required.' });
        const lat = parseCoordinate(String(v.latDeg ?? ''), 'lat');
        const lon = parseCoordinate(String(v.lonDeg ?? ''), 'lon');
        if (!lat.ok) ctx.addIssue({ code: 'custom', path: ['latDeg'], message: lat.error });
        if (!lon.ok) ctx.addIssue({ code: 'custom', path: ['lonDeg'], message: lon.error });
        const altitude = altitudeOf(v.altitudeM);
        if (altitude !== undefined && !Number.isFinite(altitude)) {
          ctx.addIssue({ code: 'custom', path: ['altitudeM'], message: `Altitude must be between ${SITE_ALTITUDE_M.min} and ${SITE_ALTITUDE_M.max} m.` });
        }
      } else if (v.siteId === undefined) {
        ctx.addIssue({ code: 'custom', path: ['siteId'], message: 'Choose a site.' });
      }
      if (v.serviceProfileId !== undefined && v.compareServiceProfileIds?.includes(v.serviceProfileId)) {
        ctx.addIssue({ code: 'custom', path: ['compareServiceProfileIds'], message: 'The main service is already in the study: compare it with other services.' });
      }
    },
    { when: () => true },
  )
  .transform((v) => {
    const newSite = v.siteMode === 'new' || v.customerMode === 'new';
    const customer: { id: number } | { name: string; sameNameOk: boolean } = v.customerMode === 'new' ? { name: v.newCustomerName as string, sameNameOk: v.sameNameOk } : { id: v.customerId as number };
    const site: { id: number } | { name: string; latDeg: number; lonDeg: number; altitudeM: number | undefined } = newSite
      ? {
          name: v.siteName as string,
          latDeg: (parseCoordinate(String(v.latDeg), 'lat') as { value: number }).value,
          lonDeg: (parseCoordinate(String(v.lonDeg), 'lon') as { value: number }).value,
          altitudeM: altitudeOf(v.altitudeM),
        }
      : { id: v.siteId as number };
    return {
      title: v.title,
      customer,
      site,
      serviceProfileId: v.serviceProfileId,
      /** The main service first: its study row leads the comparison. */
      serviceProfileIds: [v.serviceProfileId, ...(v.compareServiceProfileIds ?? [])],
      revisionOfStudyId: v.revisionOfStudyId ?? null,
      climateProfileId: v.climateProfileId ?? null,
      dishIds: v.dishIds,
      targetAvailabilityPercent: v.targetAvailabilityPercent,
    };
  });
export type NewStudyInput = z.infer<typeof newStudySchema>;

/** The form in edit mode: the same fields, and the study whose next revision it saves. */
export const reviseStudySchema = newStudySchema.refine((v) => v.revisionOfStudyId !== null, { path: ['revisionOfStudyId'], message: 'Which study is edited is missing: open the form from the study page.' });

export const studyIdSchema = z.object({ id: idField('study') });

/** The studies list query: search and paging, plus whether archived studies show (`hide` by default). */
export const studyListQuerySchema = listQuerySchema.extend({
  archived: z.enum(['hide', 'include', 'only'], { error: 'archived is hide, include or only' }).default('hide'),
});
