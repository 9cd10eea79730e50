import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { requirePermission } from '@/server/auth/guards';
import { findCheckoutForCompany, findSubscriptionByProviderId, getPlanById } from '@/db/queries/billing';
import { getPlanLimits, getPlanUsage } from '@/server/billing/limits';
import { providerCheckoutState } from '@/server/billing/checkout';
import { UsageTable } from '@/components/billing/usage-table';
import { RefreshWhilePending } from '@/components/billing/refresh-while-pending';
import { StatusBadge } from '@/components/billing/status-badge';
import { billingDate } from '@/components/billing/format';

export const metadata: Metadata = { title: 'Payment confirmation' };
export const dynamic = 'force-dynamic';

const ACTIVE = ['active', 'trialing'];

/**
 * Where the hosted checkout sends the admin back. The plan is active only once the provider's
 * webhook has been applied, so this page re-checks until then instead of trusting the redirect.
 */
export default async function CheckoutReturnPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const ctx = await requirePermission('billing.manage');
  const sessionId = (await searchParams).session_id;
  if (typeof sessionId !== 'string' || sessionId.length > 255) notFound();
  const checkout = await findCheckoutForCompany(ctx.companyId, sessionId);
  if (!checkout) notFound();
  const plan = await getPlanById(checkout.planId);
  const sub = checkout.providerSubscriptionId ? await findSubscriptionByProviderId(checkout.providerSubscriptionId) : null;
  const confirmed = checkout.status === 'completed' && sub && sub.companyId === ctx.companyId && ACTIVE.includes(sub.status);

  if (checkout.status === 'expired') {
    return (
      <Shell>
        <h1 className="text-2xl font-semibold text-stone-900">This checkout expired</h1>
        <p className="text-stone-700">Nothing was charged. Start again from the billing page if you still want {plan?.name ?? 'the plan'}.</p>
        <Link className="font-medium text-ledger-700 underline" href="/settings/billing">Back to billing</Link>
      </Shell>
    );
  }

  if (!confirmed) {
    const provider = checkout.status === 'open' ? await providerCheckoutState(sessionId) : null;
    if (provider?.status === 'open' && provider.url) {
      return (
        <Shell>
          <h1 className="text-2xl font-semibold text-stone-900">The payment is not finished</h1>
          <p className="text-stone-700">Our payment provider has not received a payment for <strong>{plan?.name}</strong> on this checkout. Nothing was charged.</p>
          <div className="flex flex-wrap gap-4 text-sm">
            <a className="font-medium text-ledger-700 underline" href={provider.url}>Return to the checkout page</a>
            <Link className="font-medium text-ledger-700 underline" href="/settings/billing">Back to billing</Link>
          </div>
        </Shell>
      );
    }
    if (provider?.status === 'expired') {
      return (
        <Shell>
          <h1 className="text-2xl font-semibold text-stone-900">This checkout expired</h1>
          <p className="text-stone-700">Nothing was charged. Start again from the billing page if you still want {plan?.name ?? 'the plan'}.</p>
          <Link className="font-medium text-ledger-700 underline" href="/settings/billing">Back to billing</Link>
        </Shell>
      );
    }
    return (
      <Shell>
        <h1 className="text-2xl font-semibold text-stone-900">Waiting for payment confirmation</h1>
        <p className="text-stone-700">
          Thank you. As soon as our payment provider confirms the payment for <strong>{plan?.name}</strong>, the plan and its limits
          apply and this page shows them. This usually takes a few seconds.
        </p>
        <RefreshWhilePending />
      </Shell>
    );
  }

  const [limits, usage] = await Promise.all([getPlanLimits(ctx.companyId), getPlanUsage(ctx.companyId)]);
  return (
    <Shell>
      <div className="flex flex-wrap items-center gap-3">
        <h1 className="text-2xl font-semibold text-stone-900">{limits.companyPlan.name} is active</h1>
        <StatusBadge status={sub.status} />
      </div>
      <p className="text-stone-700">
        Payment confirmed. {sub.currentPeriodEnd ? `Next renewal on ${billingDate(sub.currentPeriodEnd)}.` : ''} The new limits apply to your whole team now.
      </p>
      <div className="overflow-x-auto rounded border border-stone-200 bg-white px-4">
        <UsageTable limits={limits} usage={usage} />
      </div>
      <div className="flex flex-wrap gap-4 text-sm">
        <Link className="font-medium text-ledger-700 underline" href="/settings/team">Invite your team</Link>
        <Link className="font-medium text-ledger-700 underline" href="/settings/billing">Billing</Link>
      </div>
    </Shell>
  );
}

function Shell({ children }: { children: React.ReactNode }) {
  return <div className="max-w-3xl space-y-4">{children}</div>;
}
