import type { Metadata } from 'next';
import Link from 'next/link';
import { PageHeader } from '@/components/ui/page-header';
import { Card, CardBody } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { DishChangeCaution } from '@/components/campaigns/dish-change-caution';
import { CampaignUploadForm } from '@/components/campaigns/campaign-upload-form';
import { CampaignList } from '@/components/campaigns/campaign-list';
import { orbitalSlot } from '@/components/study/format';
import { requirePermission } from '@/server/auth/guards';
import { getPlanLimits } from '@/server/billing/limits';
import { CLIMATE_KIND_LABELS } from '@/server/validation/climate';
import { listServiceProfiles } from '@/db/queries/service-profiles';
import { listClimateProfiles } from '@/db/queries/climate-profiles';
import { listDishes } from '@/db/queries/dishes';
import { listCampaigns } from '@/db/queries/campaigns';
import { getEnv } from '@/server/env';

export const metadata: Metadata = { title: 'Upgrade campaigns' };

export default async function CampaignsPage() {
  const ctx = await requirePermission('study.write');
  const [services, climates, dishes, campaigns, limits] = await Promise.all([
    listServiceProfiles(ctx.companyId),
    listClimateProfiles(ctx.companyId),
    listDishes(ctx.companyId, { activeOnly: true }),
    listCampaigns(ctx.companyId),
    getPlanLimits(ctx.companyId),
  ]);
  // Climate profiles are optional: by default every site takes its own climate from the ITU-R maps.
  const missing = [!services.length && 'a service profile', !dishes.length && 'an active dish'].filter(Boolean);
  return (
    <>
      <PageHeader
        title="Upgrade campaigns"
        description="Upload your customers' existing sites with the dish each has today — up to your whole subscriber base. For every site FadeLedger computes today's outage and the smallest dish in your catalogue that meets the target, with the minutes it saves and its installed price. Campaigns run in the background and are kept: reopen and download them any time."
      />
      <div className="space-y-6">
        {missing.length > 0 && (
          <Notice tone="caution" title="Set-up first">
            A campaign needs {missing.join(' and ')}. See <Link className="underline" href="/services">Services</Link> and <Link className="underline" href="/dishes">Dishes</Link>.
          </Notice>
        )}
        <Card>
          <CardBody>
            <CampaignUploadForm
              siteLimit={limits.campaignSites}
              choices={{
                services: services.map((s) => ({ value: String(s.id), label: `${s.name} (${s.satelliteName}, ${orbitalSlot(Number(s.satelliteLongitudeDeg))})` })),
                climates: climates.map((c) => ({ value: String(c.id), label: `Override for every site: ${c.name} (${CLIMATE_KIND_LABELS[c.kind]})` })),
              }}
            />
          </CardBody>
        </Card>
        <CampaignList campaigns={campaigns} staleAfterSeconds={getEnv().CAMPAIGN_UPLOAD_STALE_SECONDS} />
        <Notice tone="info" title="Statistics, not guarantees">
          Outage minutes and availability are long-term averages from ITU-R methods for an average year, not a guarantee for any one year. Each site is computed with
          its own climate read from the ITU-R maps at its coordinates (rain: P.837-7, P.839-4; altitude when the file gives none: P.1511-1) and the total attenuation of
          P.618 §2.5 (gases P.676, clouds P.840, rain, scintillation); a climate profile chosen above replaces the rain climate of every site. Local measured rain data
          beats a global model. A campaign keeps the service, climate and dish catalogue it was started with, so later catalogue changes never alter its results.
        </Notice>
        <DishChangeCaution />
      </div>
    </>
  );
}
