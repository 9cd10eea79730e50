import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { PageHeader } from '@/components/ui/page-header';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { Table, THead, TBody, Th, Td, EmptyRow } from '@/components/ui/table';
import { UsageTable } from '@/components/billing/usage-table';
import { StatusBadge } from '@/components/billing/status-badge';
import { STATUS_LABELS, billingDate, count } from '@/components/billing/format';
import { AuditTable } from '@/components/account/audit-table';
import { ChangePlanForm, ExtendTrialForm } from '@/components/staff/operator-forms';
import { requireStaffPermission } from '@/server/auth/guards';
import { ROLE_LABELS } from '@/server/auth/permissions';
import { getBillingOverview } from '@/server/billing/overview';
import { listMembers, countPendingInvitations } from '@/db/queries/team';
import { listAllPlans } from '@/db/queries/billing';
import { listAuditEventsForCompany } from '@/db/queries/audit';
import { listCheckoutHistory, listSubscriptionHistory } from '@/db/queries/staff-accounts';
import { getCompanyBilling } from '@/db/queries/billing';

export const metadata: Metadata = { title: 'Account' };
export const dynamic = 'force-dynamic';

/**
 * Staff: one company's account — members, plan, usage against limits, subscription and checkout
 * history, and the operator actions (extend a trial, change the plan), each audited with a reason.
 * Company work (sites, studies, quotes) is not shown to staff.
 */
export default async function AccountPage({ params }: { params: Promise<{ companyId: string }> }) {
  await requireStaffPermission('accounts.read');
  const { companyId: raw } = await params;
  if (!/^\d{1,10}$/.test(raw)) notFound();
  const companyId = Number(raw);
  const company = await getCompanyBilling(companyId);
  if (!company) notFound();
  const [overview, members, pending, plans, subscriptions, checkouts, events] = await Promise.all([
    getBillingOverview(companyId),
    listMembers(companyId),
    countPendingInvitations(companyId),
    listAllPlans(),
    listSubscriptionHistory(companyId),
    listCheckoutHistory(companyId),
    listAuditEventsForCompany(companyId, { limit: 30, prefixes: ['billing.', 'staff.'] }),
  ]);
  const { limits, usage, subscription } = overview;
  const onTrial = limits.companyPlan.kind === 'trial';
  const paysThroughProvider = subscription !== null;
  const planOptions = plans
    .filter((p) => p.id !== limits.companyPlan.id && (!paysThroughProvider || p.kind === 'paid'))
    .map((p) => ({ value: String(p.id), label: `${p.name} (${p.kind}${p.isPublic ? '' : ', not public'})` }));
  return (
    <div className="space-y-6">
      <PageHeader
        eyebrow={<Link href="/accounts" className="hover:underline">Accounts</Link>}
        title={company.name}
        description={`On ${limits.companyPlan.name}${onTrial ? `, trial until ${billingDate(overview.trialEndsAt)} (UTC)` : ''}${subscription ? ` · subscription ${STATUS_LABELS[subscription.status] ?? subscription.status}` : ' · no subscription at the payment provider'}.`}
      />

      <div className="grid gap-6 lg:grid-cols-2">
        <Card>
          <CardHeader title="Usage against limits" />
          <CardBody>
            {limits.planId !== limits.companyPlan.id && <p className="mb-2 text-sm text-amber-800">The limits of {limits.planName} apply now (basis: {limits.basis.kind.replace(/_/g, ' ')}).</p>}
            <UsageTable limits={limits} usage={usage} />
          </CardBody>
        </Card>
        <Card>
          <CardHeader title="Members" />
          <CardBody>
            <p className="mb-2 text-sm text-stone-600">{count(members.length)} {members.length === 1 ? 'member' : 'members'}, {count(pending)} pending {pending === 1 ? 'invitation' : 'invitations'}.</p>
            <ul className="divide-y divide-stone-200 text-sm">
              {members.map((m) => (
                <li key={m.membershipId} className="flex flex-wrap justify-between gap-2 py-2">
                  <span className="break-all">
                    <span className="font-medium text-stone-900">{m.name}</span> <span className="text-stone-600">{m.email}</span>
                  </span>
                  <span className="text-stone-700">{ROLE_LABELS[m.role]} · since {billingDate(m.joinedAt)}</span>
                </li>
              ))}
            </ul>
          </CardBody>
        </Card>
      </div>

      <div className="grid gap-6 lg:grid-cols-2">
        <Card>
          <CardHeader title="Extend the trial" />
          <CardBody>
            {onTrial ? (
              <ExtendTrialForm companyId={companyId} />
            ) : (
              <p className="text-sm text-stone-600">{company.name} is not on a trial plan. Change its plan instead.</p>
            )}
          </CardBody>
        </Card>
        <Card>
          <CardHeader title="Change the plan" />
          <CardBody>
            {subscription?.pendingPlan && <p className="mb-2 text-sm text-amber-800">Waiting for the provider to confirm the move to {subscription.pendingPlan.name}.</p>}
            <ChangePlanForm companyId={companyId} plans={planOptions} paysThroughProvider={paysThroughProvider} />
          </CardBody>
        </Card>
      </div>

      <Card>
        <CardHeader title="Subscriptions at the payment provider" />
        <CardBody>
          <div className="overflow-x-auto">
            <Table caption="Subscriptions">
              <THead>
                <tr>
                  <Th>Started</Th>
                  <Th>Plan</Th>
                  <Th>Status</Th>
                  <Th>Period end</Th>
                  <Th className="hidden sm:table-cell">Provider id</Th>
                </tr>
              </THead>
              <TBody>
                {subscriptions.length === 0 && <EmptyRow colSpan={5}>No subscription yet.</EmptyRow>}
                {subscriptions.map((s) => (
                  <tr key={s.id}>
                    <Td className="font-mono text-xs">{billingDate(s.createdAt)}</Td>
                    <Td>{s.planName ?? '—'}</Td>
                    <Td>
                      <StatusBadge status={s.status} label={s.cancelAtPeriodEnd && s.status === 'active' ? 'Active · cancels' : undefined} />
                    </Td>
                    <Td className="font-mono text-xs">{billingDate(s.endedAt ?? s.currentPeriodEnd)}</Td>
                    <Td className="hidden break-all font-mono text-xs sm:table-cell">{s.providerSubscriptionId}</Td>
                  </tr>
                ))}
              </TBody>
            </Table>
          </div>
          <h3 className="mt-5 mb-2 text-sm font-semibold text-stone-900">Checkouts</h3>
          {checkouts.length === 0 ? (
            <p className="text-sm text-stone-600">No checkout opened.</p>
          ) : (
            <ul className="text-sm text-stone-700">
              {checkouts.map((c) => (
                <li key={c.id}>
                  {billingDate(c.createdAt)} · {c.planName ?? 'a removed plan'} · {c.status}
                  {c.completedAt ? ` on ${billingDate(c.completedAt)}` : ''}
                </li>
              ))}
            </ul>
          )}
        </CardBody>
      </Card>

      <Card>
        <CardHeader title="Plan and billing events" description="Operator actions and the payment provider’s changes; the company’s admins see the same rows in their audit log." />
        <AuditTable events={events} caption="Plan and billing events of this company" empty="No plan or billing events yet." />
      </Card>
    </div>
  );
}
