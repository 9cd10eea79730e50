// /v1/customers: create, retrieve, update, delete, list (filter by email).
import { http } from 'msw';
import type { FakeContext } from '../context';
import { api } from '../http/api';
import { EXPANDABLE, PAGINATED, type Shape } from '../http/shape';
import { StripeApiError, noSuch } from '../http/errors';
import { paginate } from '../http/list';
import type { Params } from '../http/params';
import { makeCustomer } from '../objects/catalog';
import type { Customer } from '../objects/types';
import { previousAttributes } from '../objects/diff';
import { newestFirst } from './newest-first';
import { cancelNow } from '../billing/lifecycle';

function checkEmail(params: Params): string | null | undefined {
  const email = params.nullableString('email');
  if (email && (email.length > 512 || !/^[^\s@]+@[^\s@]+$/.test(email))) {
    throw new StripeApiError(400, `Invalid email address: ${email}`, { param: params.name('email'), code: 'email_invalid' });
  }
  return email;
}

const FIELDS: Shape = { ...EXPANDABLE, email: 'scalar', name: 'scalar', description: 'scalar', phone: 'scalar', metadata: 'hash' };
const UPDATE: Shape = { ...FIELDS, invoice_settings: { default_payment_method: 'scalar' } };
const LIST: Shape = { ...PAGINATED, email: 'scalar' };

export function customerRoutes(ctx: FakeContext) {
  const find = (id: string): Customer => {
    const customer = ctx.store.customers.get(id);
    if (!customer) throw noSuch('cus', id);
    return customer;
  };
  return [
    http.post('/v1/customers', api(ctx, FIELDS, ({ params }) => {
      const customer = makeCustomer({
        email: checkEmail(params) ?? null,
        name: params.nullableString('name') ?? null,
        description: params.nullableString('description') ?? null,
        phone: params.nullableString('phone') ?? null,
        metadata: params.metadata() ?? {},
      });
      ctx.store.customers.set(customer.id, customer);
      ctx.store.track(customer.id);
      ctx.events.emit('customer.created', customer);
      return customer;
    })),
    http.get('/v1/customers', api(ctx, LIST, ({ params }) => {
      const email = params.string('email');
      const all = [...ctx.store.customers.values()].filter((c) => email === undefined || c.email === email);
      return paginate(newestFirst(ctx.store, all), params, '/v1/customers');
    })),
    http.get('/v1/customers/:id', api(ctx, EXPANDABLE, ({ path }) => find(path.id))),
    http.post('/v1/customers/:id', api(ctx, UPDATE, ({ path, params }) => {
      const customer = find(path.id);
      const before = structuredClone(customer);
      const email = checkEmail(params);
      if (email !== undefined) customer.email = email;
      const name = params.nullableString('name');
      if (name !== undefined) customer.name = name;
      const description = params.nullableString('description');
      if (description !== undefined) customer.description = description;
      const phone = params.nullableString('phone');
      if (phone !== undefined) customer.phone = phone;
      const metadata = params.metadata(customer.metadata);
      if (metadata !== undefined) customer.metadata = metadata;
      const settings = params.object('invoice_settings');
      const paymentMethod = settings?.nullableString('default_payment_method');
      if (paymentMethod !== undefined) customer.invoice_settings.default_payment_method = paymentMethod;
      const previous = previousAttributes(before, customer);
      if (Object.keys(previous).length) ctx.events.emit('customer.updated', customer, previous);
      return customer;
    })),
    http.delete('/v1/customers/:id', api(ctx, {}, ({ path }) => {
      const customer = find(path.id);
      // Deleting a customer cancels its subscriptions at once, as on Stripe.
      for (const sub of ctx.store.subscriptions.values()) {
        if (sub.customer === customer.id && sub.status !== 'canceled') cancelNow(ctx, sub);
      }
      ctx.store.customers.delete(customer.id);
      ctx.events.emit('customer.deleted', customer);
      return { id: customer.id, object: 'customer', deleted: true };
    })),
  ];
}
