import { z } from 'zod';
import { idField, numberIn } from './fields';
import { TARGET_AVAILABILITY_PERCENT } from './study';

/** A file from a form (a File/Blob in the browser and in Node's FormData). */
const campaignFile = z.custom<File>(
  (v) => typeof v === 'object' && v !== null && typeof (v as Blob).arrayBuffer === 'function' && (v as Blob).size > 0,
  { error: 'Choose a CSV file of customer sites.' },
);

/**
 * The campaign form's value for the default rain climate: each site's own, from the ITU-R maps at
 * its coordinates. A blank or missing value means the same.
 */
export const EACH_SITE_CLIMATE = 'maps';
/** What the form and the result call that default (the study form says the same of one site). */
export const EACH_SITE_CLIMATE_LABEL = "From each site's coordinates (ITU-R maps)";

/**
 * An upgrade campaign: the sites file, the service and target every site is computed with, and
 * optionally a company climate profile overriding the rain climate of every site (null: each
 * site's own climate from the ITU-R maps).
 */
export const campaignSchema = z.object({
  file: campaignFile,
  serviceProfileId: idField('service profile'),
  climateProfileId: z.preprocess(
    (v) => (v === undefined || v === null || v === EACH_SITE_CLIMATE || (typeof v === 'string' && v.trim() === '') ? null : v),
    idField('climate profile').nullable(),
  ),
  targetAvailabilityPercent: z.preprocess(
    (v) => (v === undefined || v === null || v === '' ? TARGET_AVAILABILITY_PERCENT.default : v),
    numberIn('Target availability', TARGET_AVAILABILITY_PERCENT.min, TARGET_AVAILABILITY_PERCENT.max, '%'),
  ),
});
export type CampaignInput = z.infer<typeof campaignSchema>;
