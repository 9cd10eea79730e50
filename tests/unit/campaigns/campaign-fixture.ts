import type { ClimateSnapshot, DishSnapshot, ServiceSnapshot } from '@/server/studies/snapshot';

// Invented satellite, climate, sites and prices (demo data).
export const service: ServiceSnapshot = {
  id: 1, name: 'Corvid TV', satelliteName: 'Corvid-2', satelliteLongitudeDeg: -19.5, downlinkFrequencyGHz: 11.8, polarization: 'linear-vertical',
  polarizationTiltDeg: 0, eirpDbw: 50, symbolRateMsps: 27.5, modcod: '8PSK 3/4', requiredEsN0Db: 7.91, implementationMarginDb: 1, otherLossesDb: 0.3,
  lnbNoiseTempK: 60, antennaNoiseTempK: 40, uplink: null, acmModcods: null,
};
/** A company profile: in campaigns, an override of every site's rain climate. */
export const climate: ClimateSnapshot = { id: 1, name: 'Known', kind: 'known-r001', data: { r001MmH: 42 }, zeroIsothermKm: 3.2, sourceNote: 'invented' };
const dish = (cm: number, price: string): DishSnapshot => ({ dishId: cm, name: `D${cm}`, diameterM: cm / 100, efficiency: 0.65, hardwarePrice: price, labourPrice: '90.00', mountNotes: null });
export const SEVEN = [dish(45, '59.00'), dish(60, '89.00'), dish(75, '129.00'), dish(90, '189.00'), dish(100, '239.00'), dish(120, '329.00'), dish(150, '489.00')];
export const HEADER = 'site_ref,latitude,longitude,altitude_m,current_dish_cm';

/**
 * A campaign file of n invented sites spread over a mid-latitude box (for the size test and the
 * benchmark); every fifth leaves its altitude blank, so the maps' P.1511-1 height is read too.
 */
export function bigCampaignCsv(n: number): string {
  const lines = Array.from({ length: n }, (_, i) => `S${i},${(40 + (i % 150) / 10).toFixed(3)},${(-5 + (i % 97) / 10).toFixed(3)},${i % 5 === 4 ? '' : (i * 7) % 900},${[45, 60, 75, 90][i % 4]}`);
  return `${HEADER}\n${lines.join('\n')}\n`;
}
