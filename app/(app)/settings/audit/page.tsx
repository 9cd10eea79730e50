import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/page-header';
import { Card } from '@/components/ui/card';
import { Table, THead, TBody, Th, Td, EmptyRow } from '@/components/ui/table';
import { AUDIT_LABELS, describeDetail, describeDevice, formatWhen } from '@/components/account/describe';
import { requirePermission } from '@/server/auth/guards';
import { listAuditEventsForCompany } from '@/db/queries/audit';

export const metadata: Metadata = { title: 'Audit log' };

const PAGE = 100;

/** Team and security events of this company, newest first, 100 at a time. */
export default async function AuditPage({ searchParams }: { searchParams: Promise<{ before?: string }> }) {
  const ctx = await requirePermission('audit.read');
  const { before } = await searchParams;
  const beforeId = before && /^\d{1,15}$/.test(before) ? Number(before) : undefined;
  const events = await listAuditEventsForCompany(ctx.companyId, { limit: PAGE, beforeId });
  const last = events.at(-1);
  return (
    <>
      <PageHeader title="Audit log" description="Who did what, when and from where: team changes, invitations, sign-ins and password events of your members. Times are UTC." />
      <Card>
        <Table caption="Audit log">
          <THead>
            <tr>
              <Th className="whitespace-nowrap">When</Th>
              <Th>Who</Th>
              <Th>What</Th>
              <Th className="hidden lg:table-cell">From</Th>
            </tr>
          </THead>
          <TBody>
            {events.length === 0 && <EmptyRow colSpan={4}>No events yet.</EmptyRow>}
            {events.map((e) => {
              const extra = describeDetail(e.action, e.detail);
              return (
                <tr key={e.id}>
                  <Td className="whitespace-nowrap font-mono text-xs text-stone-600">{formatWhen(e.createdAt)}</Td>
                  <Td className="max-w-[16rem] break-words text-stone-800">
                    {e.actorLabel ? <Actor label={e.actorLabel} /> : <span className="text-stone-500">Not signed in</span>}
                  </Td>
                  <Td className="text-stone-800">
                    {AUDIT_LABELS[e.action] ?? e.action}
                    {e.targetLabel && <span className="font-medium"> {e.targetLabel}</span>}
                    {extra && <span className="text-stone-500"> ({extra})</span>}
                  </Td>
                  <Td className="hidden lg:table-cell text-xs text-stone-600">
                    {describeDevice(e.userAgent)}
                    <span className="block font-mono">{e.ip ?? 'address not recorded'}</span>
                  </Td>
                </tr>
              );
            })}
          </TBody>
        </Table>
      </Card>
      {events.length === PAGE && last && (
        <p className="mt-4 text-sm">
          <a className="text-ledger-700 underline" href={`/settings/audit?before=${last.id}`}>
            Older events
          </a>
        </p>
      )}
    </>
  );
}

/** "Name <address>" as the name with the address beneath it. */
function Actor({ label }: { label: string }) {
  const m = /^(.*) <([^>]*)>$/.exec(label);
  if (!m) return <>{label}</>;
  return (
    <>
      {m[1]}
      <span className="block text-xs text-stone-500">{m[2]}</span>
    </>
  );
}
