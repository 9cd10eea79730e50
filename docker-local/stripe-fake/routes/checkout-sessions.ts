// /v1/checkout/sessions for mode=subscription with existing recurring prices: create, retrieve,
// list, list line items, expire. The session `url` opens the fake's test checkout page.
import { http } from 'msw';
import type { FakeContext } from '../context';
import { findOpenSession } from '../billing/checkout';
import { assertUsablePrice } from '../billing/lifecycle';
import { api } from '../http/api';
import { EXPANDABLE, PAGINATED, type Shape } from '../http/shape';
import { StripeApiError, missingParam, noSuch } from '../http/errors';
import { listOf, paginate } from '../http/list';
import type { Params } from '../http/params';
import type { CheckoutLineItem, CheckoutSession } from '../objects/types';
import { newId, nowSeconds } from '../state/ids';
import { newestFirst } from './newest-first';

function lineItems(ctx: FakeContext, params: Params): CheckoutLineItem[] {
  const items = params.objectArray('line_items');
  if (!items || items.length === 0) throw missingParam('line_items');
  return items.map((item) => {
    if (item.has('price_data')) {
      throw new StripeApiError(400, 'This local fake supports line_items[][price] with an existing price only, not price_data.', { param: item.name('price_data') });
    }
    const priceId = item.requiredString('price');
    const price = ctx.store.prices.get(priceId);
    if (!price) throw noSuch('price', priceId, item.name('price'));
    assertUsablePrice(price, null, item.name('price'));
    const quantity = item.int('quantity', 1, 999_999) ?? 1;
    const amount = price.unit_amount * quantity;
    const product = ctx.store.products.get(price.product);
    return {
      id: newId('li'),
      object: 'item',
      amount_discount: 0,
      amount_subtotal: amount,
      amount_tax: 0,
      amount_total: amount,
      currency: price.currency,
      description: product?.name ?? price.nickname ?? price.id,
      price: structuredClone(price),
      quantity,
    };
  });
}

// `price_data` is taken only to be refused with a clearer message than "unknown".
const CREATE: Shape = {
  ...EXPANDABLE,
  mode: 'scalar',
  ui_mode: 'scalar',
  success_url: 'scalar',
  cancel_url: 'scalar',
  customer: 'scalar',
  customer_email: 'scalar',
  client_reference_id: 'scalar',
  line_items: [{ price: 'scalar', quantity: 'scalar', price_data: 'hash' }],
  subscription_data: { metadata: 'hash', trial_period_days: 'scalar' },
  expires_at: 'scalar',
  allow_promotion_codes: 'scalar',
  locale: 'scalar',
  metadata: 'hash',
};
const LIST: Shape = { ...PAGINATED, customer: 'scalar', subscription: 'scalar', status: 'scalar' };

export function checkoutSessionRoutes(ctx: FakeContext) {
  const find = (id: string): CheckoutSession => findOpenSession(ctx, id);
  return [
    http.post('/v1/checkout/sessions', api(ctx, CREATE, ({ params }) => {
      const mode = params.requiredOneOf('mode', ['payment', 'setup', 'subscription'] as const);
      if (mode !== 'subscription') {
        throw new StripeApiError(400, `This local fake supports mode=subscription only (got ${mode}).`, { param: 'mode' });
      }
      const uiMode = params.oneOf('ui_mode', ['hosted', 'embedded', 'custom'] as const) ?? 'hosted';
      if (uiMode !== 'hosted') throw new StripeApiError(400, 'This local fake supports ui_mode=hosted only.', { param: 'ui_mode' });
      const successUrl = params.requiredString('success_url');
      const cancelUrl = params.nullableString('cancel_url') ?? null;
      for (const [name, value] of [['success_url', successUrl], ['cancel_url', cancelUrl]] as const) {
        if (value !== null && !/^https?:\/\/\S+$/.test(value)) {
          throw new StripeApiError(400, `Not a valid URL`, { param: name, code: 'url_invalid' });
        }
      }
      const customer = params.string('customer') ?? null;
      const customerEmail = params.nullableString('customer_email') ?? null;
      if (customer && customerEmail) {
        throw new StripeApiError(400, 'You may only specify one of these parameters: customer, customer_email.', { param: 'customer' });
      }
      if (customer && !ctx.store.customers.has(customer)) throw noSuch('cus', customer, 'customer');
      const clientReferenceId = params.nullableString('client_reference_id') ?? null;
      if (clientReferenceId && clientReferenceId.length > 200) {
        throw new StripeApiError(400, 'client_reference_id can be at most 200 characters.', { param: 'client_reference_id' });
      }
      const items = lineItems(ctx, params);
      const currency = items[0].currency;
      if (items.some((i) => i.currency !== currency)) {
        throw new StripeApiError(400, 'All prices in line_items must use the same currency.', { param: 'line_items' });
      }
      const subscriptionData = params.object('subscription_data');
      const now = nowSeconds();
      const expiresAt = params.int('expires_at') ?? now + 24 * 3600;
      if (expiresAt < now + 30 * 60 || expiresAt > now + 24 * 3600) {
        throw new StripeApiError(400, 'expires_at must be between 30 minutes and 24 hours from now.', { param: 'expires_at' });
      }
      const id = newId('cs_test');
      const total = items.reduce((sum, i) => sum + i.amount_total, 0);
      const session: CheckoutSession = {
        id,
        object: 'checkout.session',
        allow_promotion_codes: params.bool('allow_promotion_codes') ?? null,
        amount_subtotal: total,
        amount_total: total,
        billing_address_collection: null,
        cancel_url: cancelUrl,
        client_reference_id: clientReferenceId,
        client_secret: null,
        created: now,
        currency,
        customer,
        customer_creation: customer ? null : 'always',
        customer_details: null,
        customer_email: customerEmail,
        expires_at: expiresAt,
        invoice: null,
        livemode: false,
        locale: params.string('locale') ?? null,
        metadata: params.metadata() ?? {},
        mode: 'subscription',
        payment_intent: null,
        payment_link: null,
        payment_method_collection: 'always',
        payment_method_types: ['card'],
        payment_status: 'unpaid',
        status: 'open',
        subscription: null,
        success_url: successUrl,
        total_details: { amount_discount: 0, amount_shipping: 0, amount_tax: 0 },
        ui_mode: 'hosted',
        url: `${ctx.publicUrl}/checkout/${id}`,
      };
      ctx.store.checkoutSessions.set(id, session);
      ctx.store.checkoutExtras.set(id, {
        lineItems: items,
        subscriptionMetadata: subscriptionData?.metadata() ?? {},
        trialPeriodDays: subscriptionData?.int('trial_period_days', 1, 730) ?? null,
      });
      ctx.store.track(id);
      return session;
    })),
    http.get('/v1/checkout/sessions', api(ctx, LIST, ({ params }) => {
      const customer = params.string('customer');
      const subscription = params.string('subscription');
      const status = params.oneOf('status', ['open', 'complete', 'expired'] as const);
      const all = [...ctx.store.checkoutSessions.keys()]
        .map(find)
        .filter(
          (s) =>
            (customer === undefined || s.customer === customer) &&
            (subscription === undefined || s.subscription === subscription) &&
            (status === undefined || s.status === status),
        );
      return paginate(newestFirst(ctx.store, all), params, '/v1/checkout/sessions');
    })),
    http.get('/v1/checkout/sessions/:id', api(ctx, EXPANDABLE, ({ path }) => find(path.id))),
    http.get('/v1/checkout/sessions/:id/line_items', api(ctx, PAGINATED, ({ path, params }) => {
      find(path.id);
      const items = ctx.store.checkoutExtras.get(path.id)?.lineItems ?? [];
      const url = `/v1/checkout/sessions/${path.id}/line_items`;
      return params.has('limit') || params.has('starting_after') ? paginate(items, params, url) : listOf(items, url);
    })),
    http.post('/v1/checkout/sessions/:id/expire', api(ctx, EXPANDABLE, ({ path }) => {
      const session = find(path.id);
      if (session.status !== 'open') {
        throw new StripeApiError(400, `Only Checkout Sessions with a status of \`open\` can be expired. This session has a status of \`${session.status}\`.`);
      }
      session.status = 'expired';
      session.url = null;
      ctx.events.emit('checkout.session.expired', session);
      return session;
    })),
  ];
}
