import { Table, TBody, THead, Td, Th } from '@/components/ui/table';
import { formatMoney } from '@/server/money-format';
import { outageMinutesNumber } from '@/server/study-option';
import type { CampaignSummary } from '@/server/campaigns/campaign-summary';
import { NONE_MEETS_LISTED } from '@/server/campaigns/campaign-summary';
import { OutageDistributionChart } from './outage-distribution-chart';

/** The decision view of a finished (or cancelled) campaign: outage before/after, dish mix, money, sites no dish helps. */
export function CampaignSummaryView({ summary, upgradeCount, partial }: { summary: CampaignSummary; upgradeCount: number; partial: boolean }) {
  return (
    <section aria-labelledby="campaign-summary-title" className="space-y-6">
      <div>
        <h2 id="campaign-summary-title" className="text-base font-semibold text-stone-900">
          Summary{partial ? ' of the sites computed before the campaign was cancelled' : ''}
        </h2>
        <dl className="mt-3 grid grid-cols-1 gap-3 sm:grid-cols-3">
          {(
            [
              ['Hardware', summary.hardwareTotalUsd],
              ['Labour', summary.labourTotalUsd],
              [`Total for ${upgradeCount.toLocaleString('en-US')} upgrades`, summary.upgradeTotalUsd],
            ] as const
          ).map(([label, value]) => (
            <div key={label} className="rounded border border-stone-200 px-3 py-2">
              <dt className="text-xs text-stone-600">{label}</dt>
              <dd className="num text-lg font-semibold text-stone-900" data-testid={`campaign-total-${label.split(' ')[0].toLowerCase()}`}>
                {formatMoney(value)}
              </dd>
            </div>
          ))}
        </dl>
      </div>
      <div>
        <h3 className="text-sm font-semibold text-stone-900">Outage minutes per year, now and after the upgrades</h3>
        <OutageDistributionChart buckets={summary.buckets} before={summary.outageBefore} after={summary.outageAfter} />
      </div>
      <div>
        <h3 className="text-sm font-semibold text-stone-900">Recommended dish mix</h3>
        {summary.dishMix.length === 0 ? (
          <p className="mt-1 text-sm text-stone-600">{partial ? 'No site computed before the cancel needs an upgrade.' : 'No site needs an upgrade.'}</p>
        ) : (
          <Table caption="Recommended dishes, sites and prices">
            <THead>
              <tr>
                <Th>Dish</Th>
                <Th numeric>Sites</Th>
                <Th numeric className="hidden sm:table-cell">Hardware</Th>
                <Th numeric className="hidden sm:table-cell">Labour</Th>
                <Th numeric>Total</Th>
              </tr>
            </THead>
            <TBody>
              {summary.dishMix.map((m) => (
                <tr key={`${m.dishCm}-${m.dishName}`}>
                  <Th scope="row" className="font-medium">
                    {m.dishCm} cm · {m.dishName}
                  </Th>
                  <Td numeric>{m.sites.toLocaleString('en-US')}</Td>
                  <Td numeric className="hidden sm:table-cell">{formatMoney(m.hardwareUsd)}</Td>
                  <Td numeric className="hidden sm:table-cell">{formatMoney(m.labourUsd)}</Td>
                  <Td numeric>{formatMoney(m.totalUsd)}</Td>
                </tr>
              ))}
            </TBody>
          </Table>
        )}
      </div>
      <div>
        <h3 className="text-sm font-semibold text-stone-900">Sites where no catalogue dish meets the target</h3>
        {summary.noneMeets.length === 0 ? (
          <p className="mt-1 text-sm text-stone-600">
            {partial ? 'None among the sites computed before the cancel.' : 'None: every site meets the target today or with a catalogue dish.'}
          </p>
        ) : (
          <>
            <p className="mt-1 text-xs text-stone-600">
              The first {Math.min(NONE_MEETS_LISTED, summary.noneMeets.length)} by line; the result file lists them all. A larger dish outside the catalogue, a different
              service or a lower target may help.
            </p>
            <Table caption="Sites where no catalogue dish meets the target">
              <THead>
                <tr>
                  <Th numeric>Line</Th>
                  <Th>Site</Th>
                  <Th numeric>Dish now (cm)</Th>
                  <Th numeric>Outage now (min/year)</Th>
                </tr>
              </THead>
              <TBody>
                {summary.noneMeets.map((s) => (
                  <tr key={s.line}>
                    <Td numeric>{s.line}</Td>
                    <Th scope="row">{s.siteRef}</Th>
                    <Td numeric>{s.currentDishCm}</Td>
                    <Td numeric>{outageMinutesNumber(s.currentOutageMin, 'about')}</Td>
                  </tr>
                ))}
              </TBody>
            </Table>
          </>
        )}
      </div>
    </section>
  );
}
