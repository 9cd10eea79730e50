import Link from 'next/link';
import type { CampaignRow } from '@/db/queries/campaigns';
import { Card, CardBody } from '@/components/ui/card';
import { Table, TBody, THead, Td, Th } from '@/components/ui/table';
import { CAMPAIGN_STATUS_WORDS, receivingWords } from '@/server/campaigns/campaign-status-words';

const day = (d: Date) => d.toISOString().slice(0, 16).replace('T', ' ') + ' UTC';

/** The company's kept campaigns, newest first. */
export function CampaignList({ campaigns, staleAfterSeconds, now = new Date() }: { campaigns: CampaignRow[]; staleAfterSeconds: number; now?: Date }) {
  return (
    <Card>
      <CardBody>
        <h2 className="text-base font-semibold text-stone-900">Campaigns</h2>
        {campaigns.length === 0 ? (
          <p className="mt-2 text-sm text-stone-600">No campaigns yet. Upload a sites file above to start one.</p>
        ) : (
          <Table caption="Kept campaigns, newest first">
            <THead>
              <tr>
                <Th>File</Th>
                <Th className="hidden sm:table-cell">Started</Th>
                <Th>Status</Th>
                <Th numeric>Sites</Th>
                <Th numeric className="hidden md:table-cell">To upgrade</Th>
                <Th numeric className="hidden md:table-cell">Problems</Th>
              </tr>
            </THead>
            <TBody>
              {campaigns.map((c) => (
                <tr key={c.id}>
                  <Th scope="row" className="font-medium">
                    <Link className="text-ledger-800 underline" href={`/campaigns/${c.id}`}>
                      {c.filename}
                    </Link>
                    <span className="block text-xs font-normal text-stone-600">{c.serviceName}</span>
                  </Th>
                  <Td className="hidden whitespace-nowrap sm:table-cell">{day(c.createdAt)}</Td>
                  <Td className="whitespace-nowrap">
                    {CAMPAIGN_STATUS_WORDS[c.status]}
                    {(c.status === 'running' || c.status === 'queued') && c.sitesTotal > 0 && <> ({Math.floor((100 * c.sitesDone) / c.sitesTotal)} %)</>}
                    {c.status === 'receiving' && <span className="block max-w-xs whitespace-normal text-xs text-stone-600">{receivingWords(c, staleAfterSeconds, now)}</span>}
                    {c.status === 'failed' && c.failureMessage && <span className="block max-w-xs whitespace-normal text-xs text-stone-600">{c.failureMessage}</span>}
                  </Td>
                  <Td numeric>{c.sitesTotal.toLocaleString('en-US')}</Td>
                  <Td numeric className="hidden md:table-cell">{c.upgradeCount.toLocaleString('en-US')}</Td>
                  <Td numeric className="hidden md:table-cell">{c.problemsCount.toLocaleString('en-US')}</Td>
                </tr>
              ))}
            </TBody>
          </Table>
        )}
      </CardBody>
    </Card>
  );
}
