// One subscription update (plan change, cancel at period end, metadata) validated as a whole
// and applied as one change, so it yields a single `customer.subscription.updated` event.
import type { FakeContext } from '../context';
import { StripeApiError, noSuch } from '../http/errors';
import type { Metadata } from '../http/params';
import { makeItem, periodOf } from '../objects/billing';
import { planOf } from '../objects/catalog';
import type { Subscription } from '../objects/types';
import { nowSeconds } from '../state/ids';
import { assertNotCanceled, assertUsablePrice, changeSubscription } from './lifecycle';

export interface ItemChange {
  id?: string;
  price?: string;
  quantity?: number;
  deleted?: boolean;
  metadata?: Metadata;
  /** Stripe-style parameter name prefix for errors, e.g. `items[0]`. */
  param: string;
}

export interface SubscriptionChanges {
  items?: ItemChange[];
  cancelAtPeriodEnd?: boolean;
  metadata?: Metadata;
  description?: string | null;
}

export function updateSubscription(ctx: FakeContext, subscription: Subscription, changes: SubscriptionChanges, requestId: string | null = null): Subscription {
  const onlyMetadata = changes.items === undefined && changes.cancelAtPeriodEnd === undefined && changes.description === undefined;
  if (!onlyMetadata) assertNotCanceled(subscription);

  // Validate everything before touching state: a bad item must not leave half a change.
  const plan = (changes.items ?? []).map((change) => {
    const item = change.id ? subscription.items.data.find((i) => i.id === change.id) : undefined;
    if (change.id && !item) throw noSuch('si', change.id, `${change.param}[id]`);
    if (!change.id && !change.price) {
      throw new StripeApiError(400, `Missing required param: ${change.param}[price].`, { param: `${change.param}[price]`, code: 'parameter_missing' });
    }
    const price = change.price ? ctx.store.prices.get(change.price) : undefined;
    if (change.price && !price) throw noSuch('price', change.price, `${change.param}[price]`);
    if (price) assertUsablePrice(price, subscription, `${change.param}[price]`);
    return { change, item, price };
  });
  const remaining = subscription.items.data.length
    - plan.filter((p) => p.change.deleted && p.item).length
    + plan.filter((p) => !p.item).length;
  if (remaining < 1) throw new StripeApiError(400, 'A subscription must have at least one item.', { param: 'items' });

  changeSubscription(ctx, subscription, () => {
    for (const { change, item, price } of plan) {
      if (item && change.deleted) {
        subscription.items.data = subscription.items.data.filter((i) => i.id !== item.id);
      } else if (item) {
        // Prorations are not modelled: the new price applies from the next invoice.
        if (price) {
          item.price = structuredClone(price);
          item.plan = planOf(price);
        }
        if (change.quantity !== undefined) item.quantity = change.quantity;
        if (change.metadata !== undefined) item.metadata = change.metadata;
      } else if (price) {
        subscription.items.data.push(
          makeItem(subscription.id, price, change.quantity ?? 1, periodOf(subscription).start, periodOf(subscription).end),
        );
      }
    }
    subscription.items.total_count = subscription.items.data.length;
    if (changes.cancelAtPeriodEnd !== undefined && changes.cancelAtPeriodEnd !== subscription.cancel_at_period_end) {
      const cancel = changes.cancelAtPeriodEnd;
      subscription.cancel_at_period_end = cancel;
      subscription.cancel_at = cancel ? periodOf(subscription).end : null;
      subscription.canceled_at = cancel ? nowSeconds() : null;
      subscription.cancellation_details = { comment: null, feedback: null, reason: cancel ? 'cancellation_requested' : null };
    }
    if (changes.metadata !== undefined) subscription.metadata = changes.metadata;
    if (changes.description !== undefined) subscription.description = changes.description;
  }, requestId);
  return subscription;
}
