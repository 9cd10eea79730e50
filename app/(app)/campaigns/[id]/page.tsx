import type { Metadata } from 'next';
import { getEnv } from '@/server/env';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { PageHeader } from '@/components/ui/page-header';
import { Card, CardBody } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { DishChangeCaution } from '@/components/campaigns/dish-change-caution';
import { CampaignProgressPanel } from '@/components/campaigns/campaign-progress';
import { CampaignSummaryView } from '@/components/campaigns/campaign-summary';
import { fixed } from '@/components/study/format';
import { requirePermission } from '@/server/auth/guards';
import { getCampaign } from '@/db/queries/campaigns';
import { campaignProblems } from '@/db/queries/campaign-results';
import { campaignProgress, CAMPAIGN_LISTED_PROBLEMS } from '@/server/campaigns/campaign-progress';
import { campaignSummary } from '@/server/campaigns/campaign-summary';
import { campaignIdOf } from '@/server/validation/campaign-upload';

export const metadata: Metadata = { title: 'Upgrade campaign' };

/** One kept campaign: progress while it runs, then the summary for the decision; another company's id is 404. */
export default async function CampaignPage({ params }: { params: Promise<{ id: string }> }) {
  const ctx = await requirePermission('study.write');
  const id = campaignIdOf((await params).id);
  const campaign = id === null ? null : await getCampaign(ctx.companyId, id);
  if (!campaign) notFound();
  const progress = campaignProgress(campaign, await campaignProblems(campaign.id, CAMPAIGN_LISTED_PROBLEMS), getEnv().CAMPAIGN_UPLOAD_STALE_SECONDS);
  // The summary reads every kept row: shown once the campaign stops (the file has rows while it runs).
  const summary = campaign.status === 'done' || campaign.status === 'cancelled' ? await campaignSummary(campaign) : null;
  return (
    <>
      <PageHeader
        title={campaign.filename}
        description={
          <>
            {campaign.serviceName}, target {fixed(campaign.targetAvailabilityPercent, 3)} % of an average year. Rain climate:{' '}
            {campaign.climateOverride ? <>the profile “{campaign.climateName}” for every site (override); gases, clouds and altitude still from each site&apos;s coordinates.</> : <>from each site&apos;s coordinates (ITU-R maps).</>}{' '}
            {campaign.rowsTotal.toLocaleString('en-US')} rows in the file.
          </>
        }
      />
      <div className="space-y-6">
        <p className="text-sm">
          <Link className="text-ledger-800 underline" href="/campaigns">
            ← All campaigns
          </Link>
        </p>
        <Card>
          <CardBody>
            <CampaignProgressPanel initial={progress} />
          </CardBody>
        </Card>
        {summary && campaign.sitesDone === 0 && (
          <Notice tone="info" title="Nothing to summarise">
            {campaign.status === 'cancelled'
              ? 'The campaign was cancelled before any site was computed. Upload the file again to start a new campaign.'
              : 'No line of the file could be computed: see the lines left out above, correct the file and upload it again.'}
          </Notice>
        )}
        {summary && campaign.sitesDone > 0 && (
          <Card>
            <CardBody>
              <CampaignSummaryView summary={summary} upgradeCount={campaign.upgradeCount} partial={campaign.status === 'cancelled'} />
            </CardBody>
          </Card>
        )}
        <Notice tone="info" title="Statistics, not guarantees">
          Outage minutes are long-term averages from ITU-R methods (P.618 §2.5 total attenuation with each site&apos;s own climate) for an average year, not a guarantee for
          any one year. A current dish size that is not in the catalogue is computed at 65 % aperture efficiency (a usual figure for consumer dishes; common practice, no
          source) and says so in the result file.
        </Notice>
        <DishChangeCaution />
      </div>
    </>
  );
}
