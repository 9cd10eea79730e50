// /v1/invoices: retrieve and list (customer, subscription, status). Invoices are issued by the
// subscription lifecycle; lines come embedded as Stripe returns them.
import { http } from 'msw';
import type { FakeContext } from '../context';
import { api } from '../http/api';
import { EXPANDABLE, PAGINATED, type Shape } from '../http/shape';
import { noSuch } from '../http/errors';
import { paginate } from '../http/list';
import type { Invoice } from '../objects/types';
import { newestFirst } from './newest-first';

const LIST: Shape = { ...PAGINATED, customer: 'scalar', subscription: 'scalar', status: 'scalar' };

export function invoiceRoutes(ctx: FakeContext) {
  const find = (id: string): Invoice => {
    const invoice = ctx.store.invoices.get(id);
    if (!invoice) throw noSuch('in', id);
    return invoice;
  };
  return [
    http.get('/v1/invoices', api(ctx, LIST, ({ params }) => {
      const customer = params.string('customer');
      const subscription = params.string('subscription');
      const status = params.oneOf('status', ['draft', 'open', 'paid', 'uncollectible', 'void'] as const);
      const all = [...ctx.store.invoices.values()].filter(
        (i) =>
          (customer === undefined || i.customer === customer) &&
          (subscription === undefined || i.parent.subscription_details.subscription === subscription) &&
          (status === undefined || i.status === status),
      );
      return paginate(newestFirst(ctx.store, all), params, '/v1/invoices');
    })),
    http.get('/v1/invoices/:id', api(ctx, EXPANDABLE, ({ path }) => find(path.id))),
    http.get('/v1/invoices/:id/lines', api(ctx, PAGINATED, ({ path, params }) => paginate(find(path.id).lines.data, params, `/v1/invoices/${path.id}/lines`))),
  ];
}
