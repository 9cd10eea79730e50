import type { ClimateSnapshot, DishSnapshot, ServiceSnapshot } from '@/server/studies/snapshot';

/**
 * What a kept campaign is computed with, copied from the company's rows when it was submitted:
 * later edits of the service, climate profile or catalogue never reach it, so a reopened
 * campaign (or a chunk retried a day later) computes exactly as the first time.
 */
export interface CampaignInputs {
  schemaVersion: 1;
  service: ServiceSnapshot;
  /** A company profile overriding every site's rain climate; null: each site's own from the ITU-R maps. */
  climate: ClimateSnapshot | null;
  dishes: DishSnapshot[];
  targetAvailabilityPercent: number;
}
