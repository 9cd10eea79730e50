import { z } from 'zod';
import { idField, numberIn, requiredText } from './fields';
import { TARGET_AVAILABILITY_PERCENT } from './study';
import { EACH_SITE_CLIMATE } from './campaign';

/**
 * The query of POST /api/campaign-uploads: the file itself is the request body (text/csv,
 * streamed), so the choices travel in the URL. Same fields and rules as the campaign form.
 */
export const campaignUploadQuerySchema = z.object({
  filename: z.preprocess((v) => (typeof v === 'string' && v.trim() !== '' ? v : 'campaign.csv'), requiredText('File name', 255)),
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
export type CampaignUploadQuery = z.infer<typeof campaignUploadQuerySchema>;

/** The id in /api/campaigns/[id]…: digits only, else the campaign does not exist (404). */
export const campaignIdOf = (raw: string | undefined): number | null => (raw && /^\d{1,10}$/.test(raw) ? Number(raw) : null);

/** The cancel button's form: which campaign. */
export const cancelCampaignSchema = z.object({ campaignId: idField('campaign') });
