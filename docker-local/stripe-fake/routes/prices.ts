// /v1/prices: create (optionally with product_data), retrieve, update (active, nickname,
// lookup_key, metadata; amounts are immutable on Stripe), list.
import { http } from 'msw';
import type { FakeContext } from '../context';
import { api } from '../http/api';
import { EXPANDABLE, PAGINATED, type Shape } from '../http/shape';
import { StripeApiError, missingParam, noSuch } from '../http/errors';
import { paginate } from '../http/list';
import { makePrice, makeProduct } from '../objects/catalog';
import { previousAttributes } from '../objects/diff';
import type { Interval, Price } from '../objects/types';
import { newestFirst } from './newest-first';

const INTERVALS: readonly Interval[] = ['day', 'week', 'month', 'year'];

// Amount, currency, interval and product are not in UPDATE: Stripe refuses them on an existing
// price (a new price is made instead), with the same "unknown parameter" answer.
const UPDATE: Shape = { ...EXPANDABLE, active: 'scalar', nickname: 'scalar', lookup_key: 'scalar', metadata: 'hash' };
const CREATE: Shape = {
  ...UPDATE,
  currency: 'scalar',
  unit_amount: 'scalar',
  unit_amount_decimal: 'scalar',
  product: 'scalar',
  product_data: { name: 'scalar', active: 'scalar', metadata: 'hash', statement_descriptor: 'scalar', unit_label: 'scalar' },
  recurring: { interval: 'scalar', interval_count: 'scalar' },
  transfer_lookup_key: 'scalar',
};
const LIST: Shape = { ...PAGINATED, active: 'scalar', product: 'scalar', currency: 'scalar', type: 'scalar', lookup_keys: 'list' };

export function priceRoutes(ctx: FakeContext) {
  const find = (id: string): Price => {
    const price = ctx.store.prices.get(id);
    if (!price) throw noSuch('price', id);
    return price;
  };
  return [
    http.post('/v1/prices', api(ctx, CREATE, ({ params }) => {
      const currency = params.requiredString('currency').toLowerCase();
      if (!/^[a-z]{3}$/.test(currency)) throw new StripeApiError(400, `Invalid currency: ${currency}`, { param: 'currency' });
      let unitAmount = params.int('unit_amount', 0, 99_999_999);
      const decimal = params.string('unit_amount_decimal');
      if (unitAmount === undefined && decimal !== undefined) {
        if (!/^\d+$/.test(decimal)) {
          throw new StripeApiError(400, 'This fake supports whole minor units only in unit_amount_decimal.', { param: 'unit_amount_decimal' });
        }
        unitAmount = Number(decimal);
      }
      if (unitAmount === undefined) throw missingParam('unit_amount');

      let productId = params.string('product');
      const productData = params.object('product_data');
      if (productId && productData) {
        throw new StripeApiError(400, 'You may only specify one of these parameters: product, product_data.', { param: 'product' });
      }
      if (productData) {
        const product = makeProduct({
          name: productData.requiredString('name'),
          description: null,
          active: productData.bool('active') ?? true,
          metadata: productData.metadata() ?? {},
          statementDescriptor: productData.nullableString('statement_descriptor') ?? null,
          unitLabel: productData.nullableString('unit_label') ?? null,
          url: null,
          marketingFeatures: [],
        });
        ctx.store.products.set(product.id, product);
        ctx.store.track(product.id);
        ctx.events.emit('product.created', product);
        productId = product.id;
      }
      if (!productId) throw missingParam('product');
      if (!ctx.store.products.has(productId)) throw noSuch('prod', productId, 'product');

      const recurring = params.object('recurring');
      const lookupKey = params.nullableString('lookup_key') ?? null;
      if (lookupKey && [...ctx.store.prices.values()].some((p) => p.lookup_key === lookupKey)) {
        if (params.bool('transfer_lookup_key') !== true) {
          throw new StripeApiError(400, `A price (\`${lookupKey}\`) already uses that lookup key.`, { param: 'lookup_key' });
        }
        for (const p of ctx.store.prices.values()) if (p.lookup_key === lookupKey) p.lookup_key = null;
      }
      const price = makePrice({
        product: productId,
        currency,
        unitAmount,
        recurring: recurring
          ? {
              interval: recurring.requiredOneOf('interval', INTERVALS),
              intervalCount: recurring.int('interval_count', 1, 365) ?? 1,
            }
          : null,
        active: params.bool('active') ?? true,
        nickname: params.nullableString('nickname') ?? null,
        lookupKey,
        metadata: params.metadata() ?? {},
      });
      ctx.store.prices.set(price.id, price);
      ctx.store.track(price.id);
      ctx.events.emit('price.created', price);
      return price;
    })),
    http.get('/v1/prices', api(ctx, LIST, ({ params }) => {
      const active = params.bool('active');
      const product = params.string('product');
      const currency = params.string('currency');
      const type = params.oneOf('type', ['one_time', 'recurring'] as const);
      const lookupKeys = params.stringArray('lookup_keys');
      const all = [...ctx.store.prices.values()].filter(
        (p) =>
          (active === undefined || p.active === active) &&
          (product === undefined || p.product === product) &&
          (currency === undefined || p.currency === currency.toLowerCase()) &&
          (type === undefined || p.type === type) &&
          (!lookupKeys || (p.lookup_key !== null && lookupKeys.includes(p.lookup_key))),
      );
      return paginate(newestFirst(ctx.store, all), params, '/v1/prices');
    })),
    http.get('/v1/prices/:id', api(ctx, EXPANDABLE, ({ path }) => find(path.id))),
    http.post('/v1/prices/:id', api(ctx, UPDATE, ({ path, params }) => {
      const price = find(path.id);
      const before = structuredClone(price);
      const active = params.bool('active');
      if (active !== undefined) price.active = active;
      const nickname = params.nullableString('nickname');
      if (nickname !== undefined) price.nickname = nickname;
      const lookupKey = params.nullableString('lookup_key');
      if (lookupKey !== undefined) price.lookup_key = lookupKey;
      const metadata = params.metadata(price.metadata);
      if (metadata !== undefined) price.metadata = metadata;
      const previous = previousAttributes(before, price);
      if (Object.keys(previous).length) ctx.events.emit('price.updated', price, previous);
      return price;
    })),
  ];
}
