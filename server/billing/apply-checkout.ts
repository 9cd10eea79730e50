import 'server-only';
import type { Transaction } from 'sequelize';
import { findCheckoutBySession, findSubscriptionByProviderId, markCheckout } from '@/db/queries/billing';
import { applySubscription, type ApplyOutcome } from './apply-subscription';
import { reshapeSubscription, type ProviderCheckoutSession } from './provider-objects';
import { resolveCompany } from './resolve-company';
import { getStripe } from './stripe';

/**
 * checkout.session.completed: links the provider customer to the company and settles the
 * checkout row the return page is waiting on. If the subscription's own events have not arrived
 * yet — none at all, or only its creation while it still waited on the first payment
 * (`incomplete`) — the subscription is fetched and applied now, so the page never waits on
 * event order.
 */
export async function applyCheckoutCompleted(session: ProviderCheckoutSession, observedAt: number, t: Transaction): Promise<ApplyOutcome> {
  const checkout = await findCheckoutBySession(session.id, t);
  const company = await resolveCompany(session.customerId, {
    companyId: checkout?.companyId ?? null,
    metadata: session.metadata,
    clientReferenceId: session.clientReferenceId,
  }, t);
  if (!company) return 'unmatched_company';
  let outcome: ApplyOutcome = 'applied';
  if (session.subscriptionId) {
    const known = await findSubscriptionByProviderId(session.subscriptionId, t);
    if (!known || known.status === 'incomplete') {
      const current = reshapeSubscription(await getStripe().subscriptions.retrieve(session.subscriptionId));
      outcome = await applySubscription(current, observedAt, t, { fetched: true, companyId: company.id });
    }
  }
  if (checkout && checkout.status !== 'completed') {
    await markCheckout(checkout.id, { status: 'completed', providerSubscriptionId: session.subscriptionId, completedAt: new Date() }, t);
  }
  return outcome;
}

/** checkout.session.expired: the admin left the checkout page; the return page says so. */
export async function applyCheckoutExpired(session: ProviderCheckoutSession, t: Transaction): Promise<ApplyOutcome> {
  const checkout = await findCheckoutBySession(session.id, t);
  if (!checkout) return 'unmatched_company';
  if (checkout.status === 'open') await markCheckout(checkout.id, { status: 'expired' }, t);
  return 'applied';
}
