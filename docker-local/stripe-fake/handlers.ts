// Every msw handler of the fake, in match order, ending with Stripe's answer for unknown URLs.
import { http, HttpResponse } from 'msw';
import type { FakeContext } from './context';
import { billingPortalRoutes } from './routes/billing-portal';
import { checkoutSessionRoutes } from './routes/checkout-sessions';
import { customerRoutes } from './routes/customers';
import { eventRoutes } from './routes/events';
import { fakeHookRoutes, type FakeHookOptions } from './routes/fake-hooks';
import { invoiceRoutes } from './routes/invoices';
import { pageRoutes } from './routes/pages';
import { priceRoutes } from './routes/prices';
import { productRoutes } from './routes/products';
import { subscriptionRoutes } from './routes/subscriptions';

export function stripeFakeHandlers(ctx: FakeContext, hookOptions: FakeHookOptions) {
  return [
    ...customerRoutes(ctx),
    ...productRoutes(ctx),
    ...priceRoutes(ctx),
    ...checkoutSessionRoutes(ctx),
    ...subscriptionRoutes(ctx),
    ...invoiceRoutes(ctx),
    ...billingPortalRoutes(ctx),
    ...eventRoutes(ctx),
    ...pageRoutes(ctx),
    ...fakeHookRoutes(ctx, hookOptions),
    // The middleware's own fallback answers `{ error: 'Mock not found' }`, which the SDK would
    // misread as an OAuth error; answer as Stripe does instead.
    http.all('*', ({ request }) => {
      const url = new URL(request.url);
      return HttpResponse.json(
        {
          error: {
            type: 'invalid_request_error',
            message: `Unrecognized request URL (${request.method}: ${url.pathname}). The local Stripe fake does not implement this endpoint.`,
          },
        },
        { status: 404 },
      );
    }),
  ];
}
