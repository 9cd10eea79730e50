import type { Metadata } from 'next';
import Link from 'next/link';
import { PageHeader } from '@/components/ui/page-header';
import { Card, CardBody } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { CampaignForm } from '@/components/campaigns/campaign-form';
import { orbitalSlot } from '@/components/study/format';
import { requirePermission } from '@/server/auth/guards';
import { computeUpgradeCampaign } from '@/server/actions/campaigns';
import { CLIMATE_KIND_LABELS } from '@/server/validation/climate';
import { listServiceProfiles } from '@/db/queries/service-profiles';
import { listClimateProfiles } from '@/db/queries/climate-profiles';
import { listDishes } from '@/db/queries/dishes';

export const metadata: Metadata = { title: 'Upgrade campaign' };

export default async function CampaignsPage() {
  const ctx = await requirePermission('study.write');
  const [services, climates, dishes] = await Promise.all([listServiceProfiles(ctx.companyId), listClimateProfiles(ctx.companyId), listDishes(ctx.companyId, { activeOnly: true })]);
  // Climate profiles are optional: by default every site takes its own climate from the ITU-R maps.
  const missing = [!services.length && 'a service profile', !dishes.length && 'an active dish'].filter(Boolean);
  return (
    <>
      <PageHeader
        title="Upgrade campaign"
        description="Upload your customers' existing sites with the dish each has today. For every site FadeLedger computes today's outage and the smallest dish in your catalogue that meets the target, with the minutes it saves and its installed price."
      />
      <div className="space-y-6">
        {missing.length > 0 && (
          <Notice tone="caution" title="Set-up first">
            A campaign needs {missing.join(' and ')}. See <Link className="underline" href="/services">Services</Link> and <Link className="underline" href="/dishes">Dishes</Link>.
          </Notice>
        )}
        <Card>
          <CardBody>
            <CampaignForm
              action={computeUpgradeCampaign}
              choices={{
                services: services.map((s) => ({ value: String(s.id), label: `${s.name} (${s.satelliteName}, ${orbitalSlot(Number(s.satelliteLongitudeDeg))})` })),
                climates: climates.map((c) => ({ value: String(c.id), label: `Override for every site: ${c.name} (${CLIMATE_KIND_LABELS[c.kind]})` })),
              }}
            />
          </CardBody>
        </Card>
        <Notice tone="info" title="Statistics, not guarantees">
          Outage minutes and availability are long-term averages from ITU-R methods for an average year, not a guarantee for any one year. Each site is computed with
          its own climate read from the ITU-R maps at its coordinates (rain: P.837-7, P.839-4; altitude when the file gives none: P.1511-1) and the total attenuation of
          P.618 §2.5 (gases P.676, clouds P.840, rain, scintillation); a climate profile chosen above replaces the rain climate of every site. Local measured rain data
          beats a global model. Nothing from the file is kept: each campaign is computed afresh, and runs while your plan&apos;s monthly upload limit has room.
        </Notice>
        <Notice tone="caution" title="Before you change a dish">
          Larger reflectors need a stronger mount and catch more wind. Mounting, grounding and lightning protection follow the manufacturer&apos;s instructions and
          local building and electrical codes; the work belongs to qualified, licensed installers.
        </Notice>
      </div>
    </>
  );
}
