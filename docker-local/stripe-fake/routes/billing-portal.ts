// POST /v1/billing_portal/sessions: a short-lived link to the fake's customer portal page.
import { http } from 'msw';
import type { FakeContext } from '../context';
import { api } from '../http/api';
import { EXPANDABLE, type Shape } from '../http/shape';
import { StripeApiError, noSuch } from '../http/errors';
import type { PortalSession } from '../objects/types';
import { newId, nowSeconds } from '../state/ids';

const CREATE: Shape = { ...EXPANDABLE, customer: 'scalar', return_url: 'scalar', locale: 'scalar', flow_data: 'hash' };

export function billingPortalRoutes(ctx: FakeContext) {
  return [
    http.post('/v1/billing_portal/sessions', api(ctx, CREATE, ({ params }) => {
      const customer = params.requiredString('customer');
      if (!ctx.store.customers.has(customer)) throw noSuch('cus', customer, 'customer');
      const returnUrl = params.nullableString('return_url') ?? null;
      if (returnUrl !== null && !/^https?:\/\/\S+$/.test(returnUrl)) {
        throw new StripeApiError(400, 'Not a valid URL', { param: 'return_url', code: 'url_invalid' });
      }
      if (params.has('flow_data')) {
        throw new StripeApiError(400, 'This local fake does not support flow_data; the portal page offers plan change and cancellation.', { param: 'flow_data' });
      }
      const id = newId('bps');
      const session: PortalSession = {
        id,
        object: 'billing_portal.session',
        configuration: 'bpc_local_fake_default',
        created: nowSeconds(),
        customer,
        flow: null,
        livemode: false,
        locale: params.string('locale') ?? null,
        on_behalf_of: null,
        return_url: returnUrl,
        url: `${ctx.publicUrl}/portal/${id}`,
      };
      ctx.store.portalSessions.set(id, session);
      return session;
    })),
  ];
}
