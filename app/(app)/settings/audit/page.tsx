import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/page-header';
import { Card } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { AuditTable } from '@/components/account/audit-table';
import { AuditFilterForm } from '@/components/account/audit-filter-form';
import { requirePermission } from '@/server/auth/guards';
import { listAuditEventsForCompany } from '@/db/queries/audit';
import { auditFilterSchema, auditQueryOf } from '@/server/validation/audit';
import { getEnv } from '@/server/env';

export const metadata: Metadata = { title: 'Audit log' };

const PAGE = 100;

const FIELD_WORDS: Record<string, string> = { kind: 'Kind', actor: 'Who', from: 'From', to: 'To', before: 'Older events' };

type Search = Record<string, string | string[] | undefined>;
const one = (v: string | string[] | undefined) => (typeof v === 'string' ? v : undefined);

/** Team, security, billing, catalogue and quote events of this company, newest first, 100 at a time, filtered. */
export default async function AuditPage({ searchParams }: { searchParams: Promise<Search> }) {
  const ctx = await requirePermission('audit.read');
  const sp = await searchParams;
  const raw = { kind: one(sp.kind), actor: one(sp.actor), from: one(sp.from), to: one(sp.to), before: one(sp.before) };
  const parsed = auditFilterSchema.safeParse(raw);
  const filter = parsed.success ? parsed.data : {};
  const events = parsed.success ? await listAuditEventsForCompany(ctx.companyId, { ...auditQueryOf(filter), limit: PAGE, beforeId: filter.before }) : [];
  const last = events.at(-1);
  const query = new URLSearchParams(Object.entries({ kind: filter.kind, actor: filter.actor, from: filter.from, to: filter.to }).filter((e): e is [string, string] => Boolean(e[1])));
  const filtered = query.size > 0;
  // Each problem names its field: "That is not a date." alone does not say which of the two dates.
  const problems = parsed.success ? [] : parsed.error.issues.map((i) => `${FIELD_WORDS[String(i.path[0])] ?? 'Filter'}: ${i.message}`);
  return (
    <>
      <PageHeader
        title="Audit log"
        description="Who did what, when and from where: team and sign-in events, plan and billing changes, catalogue and price edits, uploads, archived studies, customer links and quote decisions. Times are UTC."
      />
      <AuditFilterForm values={raw} csvHref={`/settings/audit/export${query.size ? `?${query}` : ''}`} />
      {problems.length > 0 && (
        <Notice tone="problem" className="mb-4">
          {problems.join(' ')}
        </Notice>
      )}
      <Card>
        <AuditTable events={events} caption={filtered ? 'Audit log, filtered' : 'Audit log'} empty={problems.length > 0 ? 'Correct the filter above to see events.' : filtered ? 'No events match this filter.' : 'No events yet.'} />
      </Card>
      {!getEnv().TRUST_PROXY && (
        <p className="mt-3 text-xs text-stone-600">
          Addresses are those of the connection that reached FadeLedger. This server is not set up behind a trusted proxy (its TRUST_PROXY setting), so a client
          could give a false address: treat them as indications.
        </p>
      )}
      {events.length === PAGE && last && (
        <p className="mt-4 text-sm">
          <a className="text-ledger-700 underline" href={`/settings/audit?${new URLSearchParams([...query, ['before', String(last.id)]])}`}>
            Older events
          </a>
        </p>
      )}
    </>
  );
}
