// Completing a subscription-mode Checkout Session with the always-succeeding test card.
import type { FakeContext } from '../context';
import { StripeApiError, noSuch } from '../http/errors';
import { makeCustomer } from '../objects/catalog';
import { makeSubscription } from '../objects/billing';
import { periodSeconds } from '../objects/catalog';
import type { CheckoutSession, Customer } from '../objects/types';
import { nowSeconds } from '../state/ids';
import { startSubscription } from './lifecycle';

export function findOpenSession(ctx: FakeContext, id: string): CheckoutSession {
  const session = ctx.store.checkoutSessions.get(id);
  if (!session) throw noSuch('cs', id);
  if (session.status === 'open' && session.expires_at <= nowSeconds()) {
    // Expiry is noticed lazily, on the next read, and announced as Stripe does.
    session.status = 'expired';
    session.url = null;
    ctx.events.emit('checkout.session.expired', session);
  }
  return session;
}

/** `{CHECKOUT_SESSION_ID}` in success_url is replaced by the session id, as Stripe does. */
export function successRedirect(session: CheckoutSession): string {
  return session.success_url.split('{CHECKOUT_SESSION_ID}').join(session.id);
}

function customerFor(ctx: FakeContext, session: CheckoutSession, email: string | null): Customer {
  if (session.customer) {
    const existing = ctx.store.customers.get(session.customer);
    if (!existing) throw noSuch('cus', session.customer, 'customer');
    return existing;
  }
  const customer = makeCustomer({ email, name: null, description: null, phone: null, metadata: {} });
  ctx.store.customers.set(customer.id, customer);
  ctx.store.track(customer.id);
  ctx.events.emit('customer.created', customer);
  return customer;
}

export function completeCheckout(ctx: FakeContext, id: string, typedEmail: string | null): CheckoutSession {
  const session = findOpenSession(ctx, id);
  if (session.status === 'complete') return session;
  if (session.status === 'expired') {
    throw new StripeApiError(400, `Checkout Session ${id} has expired.`);
  }
  const extras = ctx.store.checkoutExtras.get(id);
  if (!extras || extras.lineItems.length === 0) throw new StripeApiError(400, `Checkout Session ${id} has no line items.`);
  const customer = customerFor(ctx, session, session.customer_email ?? typedEmail);

  const start = nowSeconds();
  const trialEnd = extras.trialPeriodDays ? start + extras.trialPeriodDays * 86_400 : null;
  const first = extras.lineItems[0].price;
  const subscription = makeSubscription({
    customer: customer.id,
    currency: session.currency,
    start,
    periodEnd: trialEnd ?? start + periodSeconds(first),
    trialEnd,
    // Without a trial it waits on its first payment (see startSubscription).
    status: trialEnd ? 'trialing' : 'incomplete',
    metadata: structuredClone(extras.subscriptionMetadata),
    lines: extras.lineItems.map((li) => ({ price: li.price, quantity: li.quantity })),
  });
  ctx.store.subscriptions.set(subscription.id, subscription);
  ctx.store.track(subscription.id);
  const invoice = startSubscription(ctx, subscription);

  session.status = 'complete';
  session.payment_status = trialEnd ? 'no_payment_required' : 'paid';
  session.customer = customer.id;
  session.customer_details = {
    email: customer.email,
    name: customer.name,
    phone: null,
    address: null,
    tax_exempt: 'none',
    tax_ids: [],
  };
  session.subscription = subscription.id;
  session.invoice = invoice.id;
  session.url = null;

  // Stripe does not promise an order; this is the usual one, the session event last.
  ctx.events.emit('checkout.session.completed', session);
  return session;
}
