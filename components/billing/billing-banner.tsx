import Link from 'next/link';
import { getBillingNotice, type BillingNotice } from '@/server/billing/overview';
import { billingDate } from './format';

/**
 * The app-wide strip shown when billing limits the team: a payment overdue (grace period running
 * or over), a trial ending or ended, a paused subscription. Admins get the link to fix it; other
 * roles are told who can. Rendered by the app layout above every page's content:
 *   <BillingBanner companyId={ctx.companyId} canManage={can(ctx.role, 'billing.manage')} />
 */
export async function BillingBanner({ companyId, canManage }: { companyId: number; canManage: boolean }) {
  const notice = await getBillingNotice(companyId);
  if (!notice) return null;
  const { tone, text, action } = wording(notice);
  return (
    <div role="status" className={`mb-6 rounded-md border px-4 py-2.5 text-sm ${tone === 'warn' ? 'border-amber-300 bg-amber-50 text-amber-950' : 'border-ledger-200 bg-ledger-50 text-ledger-900'}`}>
      <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
        <span>{text}</span>
        {canManage ? (
          <Link href="/settings/billing" className="font-medium underline underline-offset-2 hover:no-underline">{action}</Link>
        ) : (
          <span className="text-stone-600">An admin of your company can sort this out in Settings → Billing.</span>
        )}
      </div>
    </div>
  );
}

function wording(n: BillingNotice): { tone: 'warn' | 'info'; text: string; action: string } {
  switch (n.kind) {
    case 'past_due_grace':
      return { tone: 'warn', text: `The last payment failed. Your plan's limits stay in place until ${billingDate(n.graceEndsAt)}; after that the free tier's limits apply (nothing is deleted).`, action: 'Update payment' };
    case 'past_due_expired':
      return { tone: 'warn', text: `A payment is overdue, so the ${n.freePlanName} limits apply instead of ${n.paidPlanName}. Your studies, quotes and team are kept.`, action: 'Pay and restore' };
    case 'trial_ending':
      return { tone: 'info', text: `Your field trial ends on ${billingDate(n.endsAt)} (${n.daysLeft <= 1 ? 'within a day' : `in ${n.daysLeft} days`}).`, action: 'Choose a plan' };
    case 'trial_ended':
      return { tone: 'warn', text: `Your field trial has ended, so the ${n.freePlanName} limits apply. Everything you made is kept.`, action: 'Choose a plan' };
    case 'paused':
      return { tone: 'warn', text: `The subscription is paused, so the ${n.freePlanName} limits apply.`, action: 'Resume billing' };
  }
}
