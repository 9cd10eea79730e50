import 'server-only';
import Decimal from 'decimal.js';
import type Stripe from 'stripe';
import { QueryTypes } from 'sequelize';
import { models } from '@/db/models';
import { getPlanById, recordPlanSync, type PlanRow } from '@/db/queries/billing';
import { AppError, NotFoundError } from '@/server/errors';
import { BILLING_CURRENCY, BILLING_INTERVAL } from './policy';
import { getStripe, isMissingResource, providerMessage } from './stripe';

export type PlanSyncResult = { planId: number; productId: string | null; priceId: string | null; createdPrice: boolean; archivedPriceId: string | null };

/** Whole cents of a decimal price string ("49.00" → 4900); the provider takes integer minor units. */
export function priceToCents(monthlyPriceUsd: string): number {
  const cents = new Decimal(monthlyPriceUsd).times(100);
  if (!cents.isInteger() || cents.isNegative()) throw new AppError(`The price ${monthlyPriceUsd} is not a whole number of cents.`, 422, 'invalid_input');
  return cents.toNumber();
}

function planMetadata(plan: PlanRow): Record<string, string> {
  return { fadeledger_plan_id: String(plan.id), fadeledger_plan_code: plan.code };
}

async function upsertProduct(stripe: Stripe, plan: PlanRow, active: boolean): Promise<string> {
  const fields = { name: plan.name, description: plan.description || undefined, active, metadata: planMetadata(plan) };
  if (plan.stripeProductId) {
    try {
      const updated = await stripe.products.update(plan.stripeProductId, fields);
      return updated.id;
    } catch (error) {
      // An id from another account or mode (or a reset test server): make the product again.
      if (!isMissingResource(error)) throw error;
    }
  }
  const created = await stripe.products.create(fields);
  return created.id;
}

async function currentPrice(stripe: Stripe, priceId: string | null): Promise<Stripe.Price | null> {
  if (!priceId) return null;
  try {
    return await stripe.prices.retrieve(priceId);
  } catch (error) {
    if (isMissingResource(error)) return null;
    throw error;
  }
}

function priceMatches(price: Stripe.Price, productId: string, cents: number): boolean {
  const product = typeof price.product === 'string' ? price.product : price.product.id;
  return (
    price.active &&
    product === productId &&
    price.unit_amount === cents &&
    price.currency === BILLING_CURRENCY &&
    price.recurring?.interval === BILLING_INTERVAL &&
    (price.recurring?.interval_count ?? 1) === 1
  );
}

async function archivePrice(stripe: Stripe, priceId: string): Promise<boolean> {
  try {
    await stripe.prices.update(priceId, { active: false });
    return true;
  } catch (error) {
    if (isMissingResource(error)) return false;
    throw error;
  }
}

/**
 * Pushes one plan to the payment provider: a product per plan (name, description), and for a paid
 * plan a monthly price. Prices are immutable at the provider, so a new amount means a new price
 * object; the old one is archived (existing subscribers keep it until they change plan, and still
 * map to this plan through the product). Free and trial plans sell nothing: their price is archived.
 *
 * The plan row is locked for the duration, so two staff members syncing at once make one product.
 */
export async function syncPlanToProvider(planId: number): Promise<PlanSyncResult> {
  const { sequelize } = models();
  const stripe = getStripe();
  try {
    return await sequelize.transaction(async (t) => {
      await sequelize.query('SELECT id FROM plans WHERE id = :planId FOR UPDATE', { replacements: { planId }, type: QueryTypes.SELECT, transaction: t });
      const plan = await getPlanById(planId, t);
      if (!plan) throw new NotFoundError('That plan');
      const sells = plan.kind === 'paid';
      if (!sells && !plan.stripeProductId && !plan.stripePriceId) {
        return { planId, productId: null, priceId: null, createdPrice: false, archivedPriceId: null };
      }
      const productId = await upsertProduct(stripe, plan, sells);
      let priceId: string | null = plan.stripePriceId;
      let createdPrice = false;
      let archivedPriceId: string | null = null;
      if (sells) {
        const cents = priceToCents(plan.monthlyPriceUsd);
        const existing = await currentPrice(stripe, plan.stripePriceId);
        if (!existing || !priceMatches(existing, productId, cents)) {
          const created = await stripe.prices.create({
            product: productId,
            currency: BILLING_CURRENCY,
            unit_amount: cents,
            recurring: { interval: BILLING_INTERVAL },
            lookup_key: `fadeledger_${plan.code}_monthly`,
            transfer_lookup_key: true,
            metadata: planMetadata(plan),
          });
          await stripe.products.update(productId, { default_price: created.id });
          if (existing?.active) archivedPriceId = (await archivePrice(stripe, existing.id)) ? existing.id : null;
          priceId = created.id;
          createdPrice = true;
        }
      } else if (plan.stripePriceId) {
        archivedPriceId = (await archivePrice(stripe, plan.stripePriceId)) ? plan.stripePriceId : null;
        priceId = null;
      }
      await sequelize.query(
        'UPDATE plans SET stripe_product_id = :productId, stripe_price_id = :priceId, provider_synced_at = NOW(), provider_sync_error = NULL WHERE id = :planId',
        { replacements: { planId, productId, priceId }, transaction: t },
      );
      return { planId, productId, priceId, createdPrice, archivedPriceId };
    });
  } catch (error) {
    if (error instanceof AppError) throw error;
    const message = providerMessage(error);
    await recordPlanSync(planId, { error: message }).catch(() => undefined);
    throw new AppError(message, 502, 'provider_error');
  }
}

/**
 * The price to sell this plan at, syncing first when the plan has never been pushed or its price
 * is unknown to the provider (new install, or keys of another Stripe account or mode).
 */
export async function ensureSellablePrice(plan: PlanRow): Promise<string> {
  if (plan.kind !== 'paid') throw new AppError(`${plan.name} is not a paid plan.`, 422, 'invalid_input');
  const stripe = getStripe();
  const existing = await currentPrice(stripe, plan.stripePriceId).catch((error: unknown) => {
    throw new AppError(providerMessage(error), 502, 'provider_error');
  });
  if (existing && plan.stripeProductId && priceMatches(existing, plan.stripeProductId, priceToCents(plan.monthlyPriceUsd))) return existing.id;
  const synced = await syncPlanToProvider(plan.id);
  if (!synced.priceId) throw new AppError(`${plan.name} has no price at the payment provider.`, 502, 'provider_error');
  return synced.priceId;
}
