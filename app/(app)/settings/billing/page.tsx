import type { Metadata } from 'next';
import { requirePermission } from '@/server/auth/guards';
import { getBillingOverview, type BillingOverview } from '@/server/billing/overview';
import { listPublicPlans, type PlanRow } from '@/db/queries/billing';
import { LIVE_STATUSES, OVERDUE_STATUSES } from '@/server/billing/policy';
import { PlanPicker, type PickablePlan } from '@/components/billing/plan-picker';
import { PortalButton } from '@/components/billing/portal-button';
import { StatusBadge } from '@/components/billing/status-badge';
import { UsageTable } from '@/components/billing/usage-table';
import { RefreshWhilePending } from '@/components/billing/refresh-while-pending';
import { billingDate } from '@/components/billing/format';
import { formatMoney } from '@/server/money-format';
import { PageHeader } from '@/components/ui/page-header';
import { Notice } from '@/components/ui/notice';

export const metadata: Metadata = { title: 'Billing' };
export const dynamic = 'force-dynamic';

function choiceFor(plan: PlanRow, o: BillingOverview): PickablePlan['choice'] {
  const sub = o.subscription && (LIVE_STATUSES as readonly string[]).includes(o.subscription.status) ? o.subscription : null;
  const own = o.limits.companyPlan;
  if (sub) {
    if (plan.id === own.id) return 'current';
    if (sub.pendingPlan?.id === plan.id) return 'pending';
    if (plan.kind === 'free') return sub.cancelAtPeriodEnd ? 'scheduled' : 'via-portal';
    // Changing plan waits until the open invoice is paid (the provider would refuse or bill oddly).
    return (OVERDUE_STATUSES as readonly string[]).includes(sub.status) ? 'none' : 'change';
  }
  if (plan.id === own.id) return 'current';
  return plan.kind === 'paid' ? 'checkout' : 'none';
}

function pickable(plans: PlanRow[], o: BillingOverview): PickablePlan[] {
  return plans.map((p) => ({
    id: p.id,
    name: p.name,
    description: p.description,
    priceLabel: p.kind === 'paid' ? `${formatMoney(p.monthlyPriceUsd)} / month` : 'Free',
    kind: p.kind === 'paid' ? 'paid' : 'free',
    seats: p.seatLimit,
    studiesPerMonth: p.studiesPerMonth,
    activeLinks: p.activeLinksLimit,
    uploadsPerMonth: p.uploadsPerMonth,
    apiAccess: p.apiAccess,
    quoteBranding: p.quoteBranding,
    choice: choiceFor(p, o),
  }));
}

function summaryLine(o: BillingOverview): string {
  const { limits, subscription: sub } = o;
  if (sub) {
    if (sub.status === 'past_due' || sub.status === 'unpaid') return 'The last payment did not go through. Pay the open invoice to keep this plan.';
    if (sub.cancelAtPeriodEnd) return 'Cancelled: the plan stays until the end of the paid period, then the free tier applies. You can undo this in the portal.';
    return 'Billed monthly by our payment provider.';
  }
  switch (limits.companyPlan.kind) {
    case 'trial':
      return limits.basis.kind === 'trial_ended'
        ? 'Your field trial has ended. Choose a plan below to lift the free-tier limits.'
        : 'Field trial: choose a plan before it ends to keep room for your team; otherwise the free tier applies.';
    case 'free':
      return 'No payment needed. Choose a paid plan below for more seats, studies and comparison links.';
    default:
      return 'Assigned to your company by FadeLedger; no subscription is billed.';
  }
}

function CurrentPlan({ o }: { o: BillingOverview }) {
  const { limits, subscription: sub } = o;
  const b = limits.basis;
  const facts: [string, string][] = [];
  const overdue = sub ? (OVERDUE_STATUSES as readonly string[]).includes(sub.status) : false;
  if (sub?.currentPeriodEnd) facts.push([sub.cancelAtPeriodEnd ? 'Ends on' : overdue ? 'Current period ends' : 'Renews on', billingDate(sub.currentPeriodEnd)]);
  if (b.kind === 'trial' && b.endsAt) facts.push(['Trial ends on', billingDate(b.endsAt)]);
  if (b.kind === 'past_due_grace') facts.push(['Grace period until', billingDate(b.graceEndsAt)]);
  if (sub?.lastPaymentFailedAt) facts.push(['Last payment attempt failed', billingDate(sub.lastPaymentFailedAt)]);
  const fallback = limits.planId !== limits.companyPlan.id;
  return (
    <section aria-labelledby="current-plan" className="rounded-md border border-stone-200 bg-white p-4 sm:p-5">
      <div className="flex flex-wrap items-center gap-3">
        <h2 id="current-plan" className="text-lg font-semibold text-stone-900">{limits.companyPlan.name}</h2>
        {sub ? (
          <StatusBadge status={sub.cancelAtPeriodEnd && sub.status === 'active' ? 'canceled' : sub.status} label={sub.cancelAtPeriodEnd && sub.status === 'active' ? 'Active · cancels at period end' : undefined} />
        ) : (
          <StatusBadge status={b.kind === 'trial_ended' ? 'canceled' : 'active'} label={limits.companyPlan.kind === 'trial' ? (b.kind === 'trial_ended' ? 'Trial ended' : 'Trial') : limits.companyPlan.kind === 'free' ? 'Free' : 'Active'} />
        )}
      </div>
      <p className="mt-1 text-sm text-stone-600">{summaryLine(o)}</p>
      {facts.length > 0 && (
        <dl className="mt-3 grid max-w-md grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
          {facts.map(([k, v]) => (
            <div key={k} className="contents"><dt className="text-stone-600">{k}</dt><dd className="font-mono text-stone-900">{v}</dd></div>
          ))}
        </dl>
      )}
      {sub?.pendingPlan && (
        <div className="mt-3 space-y-1 rounded border border-stone-200 bg-stone-50 p-3 text-sm">
          <p>Change to <strong>{sub.pendingPlan.name}</strong> is waiting for the payment provider&apos;s confirmation.</p>
          <RefreshWhilePending everySeconds={3} giveUpAfterSeconds={90} />
        </div>
      )}
      {fallback && (
        <p className="mt-3 rounded border border-amber-300 bg-amber-50 p-3 text-sm text-amber-950">
          The <strong>{limits.planName}</strong> limits apply now
          {b.kind === 'trial_ended' ? ' because the field trial has ended' : b.kind === 'past_due_expired' ? ' because a payment is overdue and the grace period is over' : b.kind === 'paused' ? ' because the subscription is paused' : ''}.
          Nothing has been deleted; anything over a limit stays, and new items wait until the limit allows them.
        </p>
      )}
      {o.hasBillingAccount && (
        <div className="mt-4">
          <PortalButton label={sub?.status === 'past_due' || sub?.status === 'unpaid' ? 'Pay the open invoice' : 'Manage payment, invoices or cancel'} />
        </div>
      )}
    </section>
  );
}

export default async function BillingPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const ctx = await requirePermission('billing.manage');
  const params = await searchParams;
  const [overview, plans] = await Promise.all([getBillingOverview(ctx.companyId), listPublicPlans()]);
  return (
    <div className="space-y-8">
      <PageHeader title="Billing" description={`Plan, limits and payment for ${ctx.company.name}.`} />

      {params.checkout === 'canceled' && (
        <div role="status"><Notice>Checkout was cancelled. Nothing was charged and your plan is unchanged.</Notice></div>
      )}

      <CurrentPlan o={overview} />

      <section aria-labelledby="limits">
        <h2 id="limits" className="text-lg font-semibold text-stone-900">Limits and usage</h2>
        <p className="mt-1 text-sm text-stone-600">What the <strong>{overview.limits.planName}</strong> plan allows, and what your team has used.</p>
        <div className="mt-3 overflow-x-auto rounded-md border border-stone-200 bg-white px-4">
          <UsageTable limits={overview.limits} usage={overview.usage} />
        </div>
      </section>

      <section aria-labelledby="plans">
        <h2 id="plans" className="text-lg font-semibold text-stone-900">Plans</h2>
        <p className="mb-3 mt-1 text-sm text-stone-600">
          Prices in US dollars per month. Paying happens on our payment provider&apos;s secure page; a change between paid plans is prorated.
        </p>
        <PlanPicker plans={pickable(plans, overview)} />
      </section>
    </div>
  );
}
