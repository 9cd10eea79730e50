import type { Metadata } from 'next';
import Link from 'next/link';
import { PageHeader } from '@/components/ui/page-header';
import { Card, CardBody } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { NewStudyForm, type NewStudyOptions } from '@/components/study/new-study-form';
import { orbitalSlot } from '@/components/study/format';
import { requirePermission } from '@/server/auth/guards';
import { CLIMATE_KIND_LABELS } from '@/server/validation/climate';
import { listCustomerOptions } from '@/db/queries/customers';
import { listSiteOptions } from '@/db/queries/sites';
import { listServiceProfiles } from '@/db/queries/service-profiles';
import { listClimateProfiles } from '@/db/queries/climate-profiles';
import { listDishes } from '@/db/queries/dishes';
import { MAPS_CLIMATE_NAME } from '@/server/studies/maps-climate';
import { formatDms } from '@/server/validation/coordinates';
import { sumAmounts } from '@/server/quotes/totals';

export const metadata: Metadata = { title: 'New study' };

export default async function NewStudyPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  const ctx = await requirePermission('study.write');
  const params = await searchParams;
  const [customers, sites, services, climates, dishes] = await Promise.all([
    listCustomerOptions(ctx.companyId),
    listSiteOptions(ctx.companyId),
    listServiceProfiles(ctx.companyId),
    listClimateProfiles(ctx.companyId),
    listDishes(ctx.companyId, { activeOnly: true }),
  ]);
  const options: NewStudyOptions = {
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
    dishes: dishes.map((d) => ({ id: d.id, name: d.name, diameterM: Number(d.diameterM), price: sumAmounts(d.hardwarePrice, d.labourPrice) })),
  };
  const siteId = Number(params.site);
  const presetSite = sites.find((s) => s.id === siteId);
  // No climate profile is needed: the ITU-R maps at the site are the default.
  const missing = [!services.length && 'a service profile', !dishes.length && 'an active dish'].filter(Boolean);
  return (
    <>
      <PageHeader
        title="New study"
        description="Pick the site and the service; FadeLedger reads the site's climate from its coordinates (ITU-R maps) and computes the link budget and outage of every dish you tick."
      />
      {missing.length > 0 && (
        <Notice tone="caution" className="mb-6" title="Set-up first">
          A study needs {missing.join(', ')}. See <Link className="underline" href="/services">Services</Link> and <Link className="underline" href="/dishes">Dishes</Link>.
        </Notice>
      )}
      <Card>
        <CardBody>
          <NewStudyForm options={options} preset={presetSite ? { customerId: presetSite.customerId, siteId: presetSite.id } : undefined} />
        </CardBody>
      </Card>
    </>
  );
}
