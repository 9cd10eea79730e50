// /v1/products: create, retrieve, update, delete (only without prices), list.
import { http } from 'msw';
import type { FakeContext } from '../context';
import { api } from '../http/api';
import { EXPANDABLE, PAGINATED, type Shape } from '../http/shape';
import { StripeApiError, noSuch } from '../http/errors';
import { paginate } from '../http/list';
import type { Params } from '../http/params';
import { makeProduct } from '../objects/catalog';
import { previousAttributes } from '../objects/diff';
import type { Product } from '../objects/types';
import { newestFirst } from './newest-first';

function features(params: Params): { name: string }[] | undefined {
  return params.objectArray('marketing_features')?.map((f) => ({ name: f.requiredString('name') }));
}

const FIELDS: Shape = {
  ...EXPANDABLE,
  name: 'scalar',
  description: 'scalar',
  active: 'scalar',
  metadata: 'hash',
  marketing_features: [{ name: 'scalar' }],
};
const CREATE: Shape = { ...FIELDS, id: 'scalar', statement_descriptor: 'scalar', unit_label: 'scalar', url: 'scalar' };
const UPDATE: Shape = { ...FIELDS, default_price: 'scalar' };
const LIST: Shape = { ...PAGINATED, active: 'scalar', ids: 'list' };

export function productRoutes(ctx: FakeContext) {
  const find = (id: string): Product => {
    const product = ctx.store.products.get(id);
    if (!product) throw noSuch('prod', id);
    return product;
  };
  return [
    http.post('/v1/products', api(ctx, CREATE, ({ params }) => {
      const id = params.string('id');
      if (id !== undefined && ctx.store.products.has(id)) {
        throw new StripeApiError(400, `Product already exists.`, { param: 'id', code: 'resource_already_exists' });
      }
      const product = makeProduct({
        id,
        name: params.requiredString('name'),
        description: params.nullableString('description') ?? null,
        active: params.bool('active') ?? true,
        metadata: params.metadata() ?? {},
        statementDescriptor: params.nullableString('statement_descriptor') ?? null,
        unitLabel: params.nullableString('unit_label') ?? null,
        url: params.nullableString('url') ?? null,
        marketingFeatures: features(params) ?? [],
      });
      ctx.store.products.set(product.id, product);
      ctx.store.track(product.id);
      ctx.events.emit('product.created', product);
      return product;
    })),
    http.get('/v1/products', api(ctx, LIST, ({ params }) => {
      const active = params.bool('active');
      const ids = params.stringArray('ids');
      const all = [...ctx.store.products.values()].filter(
        (p) => (active === undefined || p.active === active) && (!ids || ids.includes(p.id)),
      );
      return paginate(newestFirst(ctx.store, all), params, '/v1/products');
    })),
    http.get('/v1/products/:id', api(ctx, EXPANDABLE, ({ path }) => find(path.id))),
    http.post('/v1/products/:id', api(ctx, UPDATE, ({ path, params }) => {
      const product = find(path.id);
      const before = structuredClone(product);
      const name = params.string('name');
      if (name === '') throw new StripeApiError(400, 'You must supply a non-empty name.', { param: 'name' });
      if (name !== undefined) product.name = name;
      const description = params.nullableString('description');
      if (description !== undefined) product.description = description;
      const active = params.bool('active');
      if (active !== undefined) product.active = active;
      const metadata = params.metadata(product.metadata);
      if (metadata !== undefined) product.metadata = metadata;
      const marketing = features(params);
      if (marketing !== undefined) product.marketing_features = marketing;
      const defaultPrice = params.nullableString('default_price');
      if (defaultPrice) {
        const price = ctx.store.prices.get(defaultPrice);
        if (!price) throw noSuch('price', defaultPrice, 'default_price');
        if (price.product !== product.id) {
          throw new StripeApiError(400, `The price ${defaultPrice} does not belong to product ${product.id}.`, { param: 'default_price' });
        }
      }
      if (defaultPrice !== undefined) product.default_price = defaultPrice;
      const previous = previousAttributes(before, product);
      if (Object.keys(previous).length) {
        product.updated = Math.max(product.updated, Math.floor(Date.now() / 1000));
        ctx.events.emit('product.updated', product, previous);
      }
      return product;
    })),
    http.delete('/v1/products/:id', api(ctx, {}, ({ path }) => {
      const product = find(path.id);
      if ([...ctx.store.prices.values()].some((p) => p.product === product.id)) {
        throw new StripeApiError(400, 'This product cannot be deleted because it has one or more user-created prices.');
      }
      ctx.store.products.delete(product.id);
      ctx.events.emit('product.deleted', product);
      return { id: product.id, object: 'product', deleted: true };
    })),
  ];
}
