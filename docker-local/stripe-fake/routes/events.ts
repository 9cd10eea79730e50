// /v1/events: retrieve and list the events the fake has sent, as the app may re-fetch an event
// by id instead of trusting the webhook body.
import { http } from 'msw';
import type { FakeContext } from '../context';
import { api } from '../http/api';
import { EXPANDABLE, PAGINATED, type Shape } from '../http/shape';
import { noSuch } from '../http/errors';
import { paginate } from '../http/list';

const LIST: Shape = { ...PAGINATED, type: 'scalar', types: 'list' };

export function eventRoutes(ctx: FakeContext) {
  return [
    http.get('/v1/events', api(ctx, LIST, ({ params }) => {
      const type = params.string('type');
      const types = params.stringArray('types');
      const matches = (t: string): boolean => {
        if (types) return types.includes(t);
        if (type === undefined) return true;
        // Stripe allows one `*` wildcard, e.g. `customer.subscription.*`.
        return type.endsWith('*') ? t.startsWith(type.slice(0, -1)) : t === type;
      };
      const events = ctx.events.list().map((r) => r.event).filter((e) => matches(e.type));
      return paginate(events, params, '/v1/events');
    })),
    http.get('/v1/events/:id', api(ctx, EXPANDABLE, ({ path }) => {
      const record = ctx.events.get(path.id);
      if (!record) throw noSuch('evt', path.id);
      return record.event;
    })),
  ];
}
