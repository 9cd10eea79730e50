import 'server-only';
import type { Transaction } from 'sequelize';
import { models } from '@/db/models';
import { findLiveSubscription, findOpenCheckouts, getCompanyBilling, getPlanById, insertCheckout, markCheckout, setPendingPlan } from '@/db/queries/billing';
import { getEnv } from '@/server/env';
import { AppError, ConflictError, NotFoundError } from '@/server/errors';
import { ensureProviderCustomer } from './customer';
import { ensureSellablePrice } from './plan-sync';
import { OVERDUE_STATUSES } from './policy';
import { getStripe, providerMessage } from './stripe';
import { recordAudit } from '@/server/audit/record';

export type BillingActor = { companyId: number; userId: string; email: string; name?: string };

const auditWho = (actor: BillingActor) => ({ companyId: actor.companyId, actor: { id: actor.userId, name: actor.name ?? actor.email, email: actor.email } });

function appUrl(path: string): string {
  return new URL(path, getEnv().APP_URL).toString();
}

async function sellablePlan(planId: number) {
  const plan = await getPlanById(planId);
  // Non-public plans are sold by staff arrangement only, not from the picker.
  if (!plan || plan.kind !== 'paid' || !plan.isPublic) throw new NotFoundError('That plan');
  return plan;
}

function providerFailure(error: unknown): never {
  if (error instanceof AppError) throw error;
  throw new AppError(providerMessage(error), 502, 'provider_error');
}

/**
 * Opens a hosted checkout for a paid plan and returns its URL. The plan becomes active only when
 * the provider's webhook says the subscription is paid; the return page waits for that.
 *
 * One open checkout per company: under the company row lock, any earlier open checkout is expired
 * at the provider before the new one is made, so a double click or two admins cannot end up
 * paying for two subscriptions.
 */
export async function startCheckout(actor: BillingActor, planId: number): Promise<{ url: string; sessionId: string }> {
  const plan = await sellablePlan(planId);
  if (await findLiveSubscription(actor.companyId)) throw alreadySubscribed();
  try {
    // Before the lock: both may write the company row in their own statements.
    const price = await ensureSellablePrice(plan);
    const customer = await ensureProviderCustomer(actor.companyId, actor.email);
    return await models().sequelize.transaction(async (t) => {
      await getCompanyBilling(actor.companyId, t, true);
      if (await findLiveSubscription(actor.companyId, t)) throw alreadySubscribed();
      const stripe = getStripe();
      for (const open of await findOpenCheckouts(actor.companyId, t)) {
        const earlier = await stripe.checkout.sessions.retrieve(open.providerSessionId);
        if (earlier.status === 'complete') {
          throw new ConflictError('A payment from an earlier checkout is being confirmed: wait a moment and reload this page.');
        }
        if (earlier.status === 'open') await stripe.checkout.sessions.expire(open.providerSessionId);
        await markCheckout(open.id, { status: 'expired' }, t);
      }
      const metadata = { fadeledger_company_id: String(actor.companyId), fadeledger_plan_id: String(plan.id) };
      const session = await stripe.checkout.sessions.create({
        mode: 'subscription',
        customer,
        line_items: [{ price, quantity: 1 }],
        success_url: `${appUrl('/settings/billing/return')}?session_id={CHECKOUT_SESSION_ID}`,
        cancel_url: appUrl('/settings/billing?checkout=canceled'),
        client_reference_id: String(actor.companyId),
        metadata,
        subscription_data: { metadata },
      });
      if (!session.url) throw new AppError('The payment provider returned no checkout page.', 502, 'provider_error');
      await insertCheckout(
        {
          companyId: actor.companyId,
          planId: plan.id,
          providerSessionId: session.id,
          createdByUserId: actor.userId,
          expiresAt: new Date((session.expires_at ?? Math.floor(Date.now() / 1000) + 86_400) * 1000),
        },
        t,
      );
      await recordAudit(auditWho(actor), { action: 'billing.checkout_started', target: plan.name, detail: { planId: plan.id, checkoutSessionId: session.id } }, t);
      return { url: session.url, sessionId: session.id };
    });
  } catch (error) {
    providerFailure(error);
  }
}

function alreadySubscribed(): ConflictError {
  return new ConflictError('Your company already has a subscription: change its plan instead of starting a new checkout.');
}

/**
 * Moves the live subscription to another paid plan at the provider (prorated). The company's plan
 * changes when the provider's `customer.subscription.updated` arrives; until then it is pending.
 */
export async function changePlan(actor: BillingActor, planId: number): Promise<{ planName: string }> {
  const plan = await sellablePlan(planId);
  const live = await findLiveSubscription(actor.companyId);
  if (!live) throw new ConflictError('There is no subscription to change yet: choose a plan to check out.');
  if ((OVERDUE_STATUSES as readonly string[]).includes(live.status)) {
    throw new ConflictError('A payment is overdue: pay the open invoice in the billing portal before changing plan.');
  }
  if (live.planId === plan.id) throw new ConflictError(`You are already on ${plan.name}.`);
  await moveSubscriptionAtProvider(actor.companyId, live, plan, async (t) => {
    await recordAudit(auditWho(actor), { action: 'billing.plan_change_requested', target: plan.name, detail: { planId: plan.id, fromPlanId: live.planId, subscriptionId: live.providerSubscriptionId } }, t);
  });
  return { planName: plan.name };
}

/**
 * Moves a live subscription to a paid plan at the provider (prorated) and remembers it as pending;
 * the company's plan follows when the provider's `customer.subscription.updated` arrives. `andThen`
 * runs in the transaction that records the pending plan (its audit row). Used by admins (billing
 * page) and by staff (account page), so both go the same way through the provider.
 */
export async function moveSubscriptionAtProvider(
  companyId: number,
  live: { id: number; providerSubscriptionId: string },
  plan: { id: number; name: string; kind: string } & Parameters<typeof ensureSellablePrice>[0],
  andThen: (t: Transaction) => Promise<void>,
): Promise<void> {
  try {
    const price = await ensureSellablePrice(plan);
    const stripe = getStripe();
    const current = await stripe.subscriptions.retrieve(live.providerSubscriptionId);
    const item = current.items.data[0];
    if (!item) throw new AppError('The subscription has no item to change at the payment provider.', 502, 'provider_error');
    await stripe.subscriptions.update(live.providerSubscriptionId, {
      items: [{ id: item.id, price }],
      proration_behavior: 'create_prorations',
      metadata: { fadeledger_company_id: String(companyId), fadeledger_plan_id: String(plan.id) },
    });
    // The provider has the change; the pending plan and its audit row are written together.
    await models().sequelize.transaction(async (t) => {
      await setPendingPlan(companyId, live.id, plan.id, t);
      await andThen(t);
    });
  } catch (error) {
    providerFailure(error);
  }
}

/** A short-lived link to the provider's billing portal (card, invoices, plan change, cancel). */
export async function openBillingPortal(actor: BillingActor): Promise<string> {
  const company = await getCompanyBilling(actor.companyId);
  if (!company?.stripeCustomerId) throw new ConflictError('There is no billing account yet: choose a paid plan first.');
  try {
    const customer = await ensureProviderCustomer(actor.companyId, actor.email);
    const session = await getStripe().billingPortal.sessions.create({ customer, return_url: appUrl('/settings/billing') });
    return session.url;
  } catch (error) {
    providerFailure(error);
  }
}

/**
 * The provider's own view of a checkout, for the return page while the webhook is awaited: an
 * admin who came back without paying is offered the checkout again instead of a spinner.
 */
export async function providerCheckoutState(sessionId: string): Promise<{ status: 'open' | 'complete' | 'expired' | 'unknown'; url: string | null }> {
  try {
    const session = await getStripe().checkout.sessions.retrieve(sessionId);
    return { status: (session.status ?? 'unknown') as 'open' | 'complete' | 'expired', url: session.url ?? null };
  } catch {
    return { status: 'unknown', url: null };
  }
}
