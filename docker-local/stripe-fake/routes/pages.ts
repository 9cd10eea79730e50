// Browser-facing hosted pages: GET/POST /checkout/:id… and /portal/:id…. They call the same
// lifecycle functions as the API, so state and webhooks match what an SDK call would produce.
import { http, HttpResponse, type HttpResponseResolver } from 'msw';
import type { FakeContext } from '../context';
import { completeCheckout, findOpenSession, successRedirect } from '../billing/checkout';
import { declineOpenInvoice, payOpenInvoice } from '../billing/lifecycle';
import { updateSubscription } from '../billing/update';
import { StripeApiError } from '../http/errors';
import { parseForm, type FormObject } from '../http/form';
import { checkoutPage, declinedPage } from '../pages/checkout-page';
import { NOTICES, errorPage, portalPage } from '../pages/portal-page';
import type { PortalSession, Subscription } from '../objects/types';
import { newestFirst } from './newest-first';

const HTML_HEADERS = { 'cache-control': 'no-store', 'x-frame-options': 'DENY', 'referrer-policy': 'no-referrer' };

function html(body: string, status = 200): Response {
  return HttpResponse.html(body, { status, headers: HTML_HEADERS });
}

function seeOther(location: string): Response {
  return new HttpResponse(null, { status: 303, headers: { ...HTML_HEADERS, location } });
}

/** Turns a lifecycle error into a readable page instead of JSON. */
function pageRoute(
  ctx: FakeContext,
  run: (input: { path: Record<string, string>; form: FormObject; url: URL }) => Response,
): HttpResponseResolver<Record<string, string>> {
  return async ({ request, params }) => {
    try {
      const form = request.method === 'POST' ? parseForm(await request.text()) : {};
      return run({ path: params, form, url: new URL(request.url) });
    } catch (error) {
      if (error instanceof StripeApiError) {
        const { html: body, status } = errorPage(error.status === 404 ? 'Not found' : 'Cannot do that', error.message, error.status);
        return html(body, status);
      }
      ctx.log(`page error on ${request.method} ${request.url}: ${error instanceof Error ? error.stack : String(error)}`);
      const { html: body } = errorPage('Something went wrong', 'The local payments fake hit an unexpected error.');
      return html(body, 500);
    }
  };
}

function portalSession(ctx: FakeContext, id: string): PortalSession {
  const session = ctx.store.portalSessions.get(id);
  if (!session) throw new StripeApiError(404, 'This billing portal link is not valid (the fake may have been reset).');
  return session;
}

function ownSubscription(ctx: FakeContext, session: PortalSession, id: string): Subscription {
  const sub = ctx.store.subscriptions.get(id);
  if (!sub || sub.customer !== session.customer) throw new StripeApiError(404, 'No such subscription for this customer.');
  return sub;
}

export function pageRoutes(ctx: FakeContext) {
  const portalAction = (apply: (session: PortalSession, sub: Subscription, form: FormObject) => string) =>
    pageRoute(ctx, ({ path, form }) => {
      const session = portalSession(ctx, path.id);
      const done = apply(session, ownSubscription(ctx, session, path.sub), form);
      return seeOther(`/portal/${session.id}?done=${done}`);
    });

  return [
    http.get('/checkout/:id', pageRoute(ctx, ({ path }) => {
      const session = findOpenSession(ctx, path.id);
      const extras = ctx.store.checkoutExtras.get(session.id);
      if (!extras) throw new StripeApiError(404, 'No such checkout.');
      const customer = session.customer ? ctx.store.customers.get(session.customer) : undefined;
      return html(checkoutPage(session, extras, customer));
    })),
    http.post('/checkout/:id/pay', pageRoute(ctx, ({ path, form }) => {
      const email = typeof form.email === 'string' && form.email.trim() ? form.email.trim() : null;
      const session = completeCheckout(ctx, path.id, email);
      return seeOther(successRedirect(session));
    })),
    http.post('/checkout/:id/decline', pageRoute(ctx, ({ path }) => {
      const session = findOpenSession(ctx, path.id);
      if (session.status !== 'open') return seeOther(`/checkout/${session.id}`);
      return html(declinedPage(session), 402);
    })),

    http.get('/portal/:id', pageRoute(ctx, ({ path, url }) => {
      const session = portalSession(ctx, path.id);
      const customer = ctx.store.customers.get(session.customer);
      if (!customer) throw new StripeApiError(404, 'The customer of this portal link no longer exists.');
      const subscriptions = newestFirst(ctx.store, [...ctx.store.subscriptions.values()].filter((s) => s.customer === customer.id));
      const invoices = newestFirst(ctx.store, [...ctx.store.invoices.values()].filter((i) => i.customer === customer.id));
      const prices = [...ctx.store.prices.values()]
        .filter((p) => p.active && p.recurring && ctx.store.products.get(p.product)?.active !== false)
        .sort((a, b) => a.unit_amount - b.unit_amount);
      const done = url.searchParams.get('done');
      return html(portalPage({ session, customer, subscriptions, invoices, prices, products: ctx.store.products, notice: done ? NOTICES[done] ?? null : null }));
    })),
    http.post('/portal/:id/subscriptions/:sub/plan', portalAction((_session, sub, form) => {
      const price = typeof form.price === 'string' ? form.price : '';
      if (!price) throw new StripeApiError(400, 'Pick a plan first.');
      updateSubscription(ctx, sub, { items: [{ id: sub.items.data[0].id, price, param: 'items[0]' }] });
      return 'plan_changed';
    })),
    http.post('/portal/:id/subscriptions/:sub/cancel', portalAction((_session, sub) => {
      updateSubscription(ctx, sub, { cancelAtPeriodEnd: true });
      return 'cancel_scheduled';
    })),
    http.post('/portal/:id/subscriptions/:sub/renew', portalAction((_session, sub) => {
      updateSubscription(ctx, sub, { cancelAtPeriodEnd: false });
      return 'cancel_undone';
    })),
    http.post('/portal/:id/subscriptions/:sub/pay', portalAction((_session, sub) => {
      payOpenInvoice(ctx, sub);
      return 'invoice_paid';
    })),
    http.post('/portal/:id/subscriptions/:sub/decline', portalAction((_session, sub) => {
      declineOpenInvoice(ctx, sub);
      return 'invoice_declined';
    })),
  ];
}
