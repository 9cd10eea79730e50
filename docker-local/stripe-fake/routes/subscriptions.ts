// /v1/subscriptions: retrieve, list, update (change plan, cancel at period end, metadata),
// cancel (DELETE), pause and resume; /v1/subscription_items list. Subscriptions are created by
// Checkout.
import { http } from 'msw';
import type { FakeContext } from '../context';
import { cancelNow, pauseSubscription, resumeSubscription } from '../billing/lifecycle';
import { updateSubscription, type ItemChange } from '../billing/update';
import { api } from '../http/api';
import { EXPANDABLE, PAGINATED, type Shape } from '../http/shape';
import { StripeApiError, noSuch } from '../http/errors';
import { listOf, paginate } from '../http/list';
import type { Subscription } from '../objects/types';
import { newestFirst } from './newest-first';

// proration_behavior, payment_behavior, invoicing_behavior and bill_for are taken and checked but
// change nothing: prorations are not modelled and the test card always pays.
const UPDATE: Shape = {
  ...EXPANDABLE,
  items: [{ id: 'scalar', price: 'scalar', quantity: 'scalar', deleted: 'scalar', metadata: 'hash' }],
  cancel_at_period_end: 'scalar',
  cancel_at: 'scalar',
  metadata: 'hash',
  description: 'scalar',
  proration_behavior: 'scalar',
  payment_behavior: 'scalar',
};
const PAUSE: Shape = {
  ...EXPANDABLE,
  type: 'scalar',
  invoicing_behavior: 'scalar',
  bill_for: { outstanding_usage_through: { type: 'scalar' }, unused_time_from: { type: 'scalar' } },
};
const RESUME: Shape = { ...EXPANDABLE, billing_cycle_anchor: { type: 'scalar' }, payment_behavior: 'scalar', proration_behavior: 'scalar' };
const LIST: Shape = { ...PAGINATED, customer: 'scalar', price: 'scalar', status: 'scalar' };
const ITEMS: Shape = { ...PAGINATED, subscription: 'scalar' };

const STATUSES = ['active', 'all', 'canceled', 'ended', 'incomplete', 'incomplete_expired', 'past_due', 'paused', 'trialing', 'unpaid'] as const;

export function subscriptionRoutes(ctx: FakeContext) {
  const find = (id: string): Subscription => {
    const subscription = ctx.store.subscriptions.get(id);
    if (!subscription) throw noSuch('sub', id);
    return subscription;
  };
  return [
    // Refused whatever its parameters, so no parameter check hides the explanation.
    http.post('/v1/subscriptions', api(ctx, 'any', () => {
      throw new StripeApiError(400, 'This local fake creates subscriptions through Checkout Sessions only (POST /v1/checkout/sessions with mode=subscription).');
    })),
    http.get('/v1/subscriptions', api(ctx, LIST, ({ params }) => {
      const customer = params.string('customer');
      const price = params.string('price');
      const status = params.oneOf('status', STATUSES);
      const all = [...ctx.store.subscriptions.values()].filter((s) => {
        if (customer !== undefined && s.customer !== customer) return false;
        if (price !== undefined && !s.items.data.some((i) => i.price.id === price)) return false;
        // Without a status filter Stripe leaves canceled subscriptions out.
        if (status === undefined) return s.status !== 'canceled';
        if (status === 'all') return true;
        if (status === 'ended') return s.status === 'canceled' || s.status === 'incomplete_expired';
        return s.status === status;
      });
      return paginate(newestFirst(ctx.store, all), params, '/v1/subscriptions');
    })),
    http.get('/v1/subscriptions/:id', api(ctx, EXPANDABLE, ({ path }) => find(path.id))),
    http.post('/v1/subscriptions/:id', api(ctx, UPDATE, ({ path, params, requestId }) => {
      const subscription = find(path.id);
      params.oneOf('proration_behavior', ['always_invoice', 'create_prorations', 'none'] as const);
      params.oneOf('payment_behavior', ['allow_incomplete', 'default_incomplete', 'error_if_incomplete', 'pending_if_incomplete'] as const);
      const items: ItemChange[] | undefined = params.objectArray('items')?.map((item, i) => ({
        id: item.string('id'),
        price: item.string('price'),
        quantity: item.int('quantity', 0, 999_999),
        deleted: item.bool('deleted'),
        metadata: item.metadata(),
        param: `items[${i}]`,
      }));
      const cancelAt = params.string('cancel_at');
      if (cancelAt !== undefined && cancelAt !== '') {
        throw new StripeApiError(400, 'This local fake supports cancel_at_period_end, not cancel_at with a date.', { param: 'cancel_at' });
      }
      return updateSubscription(ctx, subscription, {
        items,
        cancelAtPeriodEnd: cancelAt === '' ? false : params.bool('cancel_at_period_end'),
        metadata: params.metadata(subscription.metadata),
        description: params.nullableString('description'),
      }, requestId);
    })),
    http.post('/v1/subscriptions/:id/pause', api(ctx, PAUSE, ({ path, params, requestId }) => {
      const subscription = find(path.id);
      params.oneOf('type', ['subscription'] as const);
      params.oneOf('invoicing_behavior', ['invoice', 'pending_invoice_item'] as const);
      pauseSubscription(ctx, subscription, requestId);
      return subscription;
    })),
    http.post('/v1/subscriptions/:id/resume', api(ctx, RESUME, ({ path, params, requestId }) => {
      const subscription = find(path.id);
      const anchor = params.object('billing_cycle_anchor')?.requiredOneOf('type', ['now', 'unchanged'] as const) ?? 'now';
      params.oneOf('payment_behavior', ['resume_on_payment_attempt', 'resume_on_payment_success'] as const);
      params.oneOf('proration_behavior', ['always_invoice', 'create_prorations', 'none'] as const);
      resumeSubscription(ctx, subscription, anchor, requestId);
      return subscription;
    })),
    http.delete('/v1/subscriptions/:id', api(ctx, EXPANDABLE, ({ path, requestId }) => {
      const subscription = find(path.id);
      cancelNow(ctx, subscription, requestId);
      return subscription;
    })),
    http.get('/v1/subscription_items', api(ctx, ITEMS, ({ params }) => {
      const id = params.requiredString('subscription');
      const subscription = find(id);
      return params.has('limit') || params.has('starting_after')
        ? paginate(subscription.items.data, params, '/v1/subscription_items')
        : listOf(subscription.items.data, '/v1/subscription_items');
    })),
  ];
}
