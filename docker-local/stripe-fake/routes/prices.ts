// /v1/prices: create (optionally with product_data), retrieve, update (active, nickname,
// lookup_key, metadata; amounts are immutable on Stripe), list.
import { http } from 'msw';
import type { FakeContext } from '../context';
import { api } from '../http/api';
import { StripeApiError, missingParam, noSuch } from '../http/errors';
import { paginate } from '../http/list';
import { makePrice, makeProduct } from '../objects/catalog';
import { previousAttributes } from '../objects/diff';
import type { Interval, Price } from '../objects/types';
import { newestFirst } from './newest-first';

const INTERVALS: readonly Interval[] = ['day', 'week', 'month', 'year'];

export function priceRoutes(ctx: FakeContext) {
  const find = (id: string): Price => {
    const price = ctx.store.prices.get(id);
    if (!price) throw noSuch('price', id);
    return price;
  };
  return [
    http.post('/v1/prices', api(ctx, ({ params }) => {
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
    http.get('/v1/prices', api(ctx, ({ params }) => {
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
    http.get('/v1/prices/:id', api(ctx, ({ path }) => find(path.id))),
    http.post('/v1/prices/:id', api(ctx, ({ path, params }) => {
      const price = find(path.id);
      for (const fixed of ['unit_amount', 'currency', 'recurring', 'product']) {
        if (params.has(fixed)) {
          throw new StripeApiError(400, `Received unknown parameter: ${fixed}. Prices cannot change their amount, currency, interval or product; create a new price instead.`, { param: fixed });
        }
      }
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
