import { z } from 'zod';
import { idField, numberIn } from './fields';
import { TARGET_AVAILABILITY_PERCENT } from './study';

/** A file from a form (a File/Blob in the browser and in Node's FormData). */
const campaignFile = z.custom<File>(
  (v) => typeof v === 'object' && v !== null && typeof (v as Blob).arrayBuffer === 'function' && (v as Blob).size > 0,
  { error: 'Choose a CSV file of customer sites.' },
);

/** An upgrade campaign: the sites file, and the service, climate and target every site is computed with. */
export const campaignSchema = z.object({
  file: campaignFile,
  serviceProfileId: idField('service profile'),
  climateProfileId: idField('climate profile'),
  targetAvailabilityPercent: z.preprocess(
    (v) => (v === undefined || v === null || v === '' ? TARGET_AVAILABILITY_PERCENT.default : v),
    numberIn('Target availability', TARGET_AVAILABILITY_PERCENT.min, TARGET_AVAILABILITY_PERCENT.max, '%'),
  ),
});
export type CampaignInput = z.infer<typeof campaignSchema>;
