import 'server-only';
import type { NewStudyOptions } from '@/components/study/new-study-form';
import { orbitalSlot } from '@/components/study/format';
import { CLIMATE_KIND_LABELS } from '@/server/validation/climate';
import { listCustomerOptions } from '@/db/queries/customers';
import { listSiteOptions } from '@/db/queries/sites';
import { listServiceProfiles } from '@/db/queries/service-profiles';
import { listClimateProfiles } from '@/db/queries/climate-profiles';
import { getDishesByIds, listDishes } from '@/db/queries/dishes';
import { MAPS_CLIMATE_NAME } from '@/server/studies/maps-climate';
import { formatDms } from '@/server/validation/coordinates';
import { sumAmounts } from '@/server/quotes/totals';

/**
 * The choices of the study form for this company: customers, sites, services, override climate
 * profiles and active dishes. `keepDishIds`: dishes an edited study used that are no longer
 * active stay offered (marked), so an edit does not drop them unasked.
 */
export async function studyFormOptions(companyId: number, keepDishIds: number[] = []): Promise<NewStudyOptions> {
  const [customers, sites, services, climates, dishes] = await Promise.all([
    listCustomerOptions(companyId),
    listSiteOptions(companyId),
    listServiceProfiles(companyId),
    listClimateProfiles(companyId),
    listDishes(companyId, { activeOnly: true }),
  ]);
  const activeIds = new Set(dishes.map((d) => d.id));
  const kept = await getDishesByIds(companyId, keepDishIds.filter((id) => !activeIds.has(id)));
  return {
    customers,
    sites: sites.map((s) => ({ id: s.id, name: s.name, customerId: s.customerId, latDeg: s.latDeg, lonDeg: s.lonDeg })),
    services: services.map((s) => ({ id: s.id, name: s.name, satelliteName: s.satelliteName, slot: orbitalSlot(Number(s.satelliteLongitudeDeg)), frequencyGHz: Number(s.downlinkFrequencyGhz) })),
    climates: climates.map((c) => ({
      id: c.id,
      name: c.name,
      kindLabel: CLIMATE_KIND_LABELS[c.kind],
      place: c.latDeg === null || c.lonDeg === null ? 'an unknown place' : `${formatDms(Number(c.latDeg), 'lat')}, ${formatDms(Number(c.lonDeg), 'lon')}`,
      location: c.latDeg === null || c.lonDeg === null ? null : { latDeg: Number(c.latDeg), lonDeg: Number(c.lonDeg) },
    })),
    mapsName: MAPS_CLIMATE_NAME,
    dishes: [
      ...dishes.map((d) => ({ id: d.id, name: d.name, diameterM: Number(d.diameterM), price: sumAmounts(d.hardwarePrice, d.labourPrice) })),
      ...kept.map((d) => ({ id: d.id, name: `${d.name} (no longer active)`, diameterM: Number(d.diameterM), price: sumAmounts(d.hardwarePrice, d.labourPrice) })),
    ],
  };
}
