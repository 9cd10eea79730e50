import 'server-only';
import type { Transaction } from 'sequelize';
import { findSubscriptionByProviderId, updateSubscription } from '@/db/queries/billing';
import type { ApplyOutcome } from './apply-subscription';
import type { ProviderInvoice } from './provider-objects';
import { recordAudit } from '@/server/audit/record';

/**
 * invoice.payment_failed / invoice.paid: remembered for the banner ("the last payment attempt
 * failed on …"). The subscription's status itself moves with customer.subscription.updated,
 * which the provider sends alongside; an invoice event never changes limits on its own.
 */
export async function applyInvoiceEvent(kind: 'paid' | 'payment_failed', invoice: ProviderInvoice, observedAt: number, t: Transaction): Promise<ApplyOutcome> {
  if (!invoice.subscriptionId) return 'unmatched_subscription';
  const row = await findSubscriptionByProviderId(invoice.subscriptionId, t, true);
  if (!row) return 'unmatched_subscription';
  const at = new Date(observedAt * 1000);
  const last = row.lastPaymentFailedAt;
  if (kind === 'payment_failed') {
    if (!last || last.getTime() < at.getTime()) {
      await updateSubscription(row.id, { lastPaymentFailedAt: at }, t);
      await recordAudit({ companyId: row.companyId, actor: null, actorLabel: 'Payment provider' }, { action: 'billing.payment_failed', detail: { subscriptionId: invoice.subscriptionId } }, t);
    }
    return 'applied';
  }
  // A payment that succeeded after the last failure clears it; an older one is stale.
  if (last && last.getTime() <= at.getTime()) {
    await updateSubscription(row.id, { lastPaymentFailedAt: null }, t);
    return 'applied';
  }
  return last ? 'stale' : 'applied';
}
