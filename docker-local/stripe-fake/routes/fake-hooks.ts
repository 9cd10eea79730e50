// Test-only controls under /_fake/ (never part of the Stripe API; the app must not call them):
// health, reset, the sent-event log, refused requests, and clock-like moves of a subscription.
import { http, HttpResponse, type HttpResponseResolver } from 'msw';
import type { FakeContext } from '../context';
import { advancePeriod, failRenewal, payOpenInvoice } from '../billing/lifecycle';
import { StripeApiError, noSuch } from '../http/errors';
import type { Subscription } from '../objects/types';
import type { EventRecord } from '../webhooks/dispatcher';

export interface FakeHookOptions {
  webhookUrl: string | null;
  startedAt: number;
}

function hook(ctx: FakeContext, run: (path: Record<string, string>, url: URL) => unknown | Promise<unknown>): HttpResponseResolver<Record<string, string>> {
  return async ({ request, params }) => {
    try {
      return HttpResponse.json((await run(params, new URL(request.url))) as object);
    } catch (error) {
      if (error instanceof StripeApiError) return HttpResponse.json(error.toBody(), { status: error.status });
      ctx.log(`hook error on ${request.url}: ${error instanceof Error ? error.stack : String(error)}`);
      return HttpResponse.json({ error: { type: 'api_error', message: 'Unexpected error in the local Stripe fake.' } }, { status: 500 });
    }
  };
}

function summary(record: EventRecord) {
  const object = record.event.data.object as { id?: string; object?: string };
  return {
    id: record.event.id,
    type: record.event.type,
    created: record.event.created,
    object_id: object.id ?? null,
    delivery_status: record.status,
    attempts: record.attempts,
    event: record.event,
  };
}

export function fakeHookRoutes(ctx: FakeContext, options: FakeHookOptions) {
  const subscription = (id: string): Subscription => {
    const sub = ctx.store.subscriptions.get(id);
    if (!sub) throw noSuch('sub', id);
    return sub;
  };
  return [
    http.get('/_fake/health', hook(ctx, () => ({
      ok: true,
      service: 'stripe-fake',
      webhook_url: options.webhookUrl,
      uptime_s: Math.round((Date.now() - options.startedAt) / 1000),
      counts: { ...ctx.store.counts(), events: ctx.events.list().length },
    }))),
    http.post('/_fake/reset', hook(ctx, () => {
      ctx.store.reset();
      ctx.events.reset();
      return { ok: true };
    })),
    http.get('/_fake/events', hook(ctx, async (_path, url) => {
      // `?wait=true` answers once every delivery (including retries) has finished.
      if (url.searchParams.get('wait') === 'true') {
        await Promise.race([ctx.events.idle(), new Promise((r) => setTimeout(r, 15_000))]);
      }
      const type = url.searchParams.get('type');
      const data = ctx.events.list().filter((r) => !type || r.event.type === type).map(summary);
      return { object: 'list', data, has_more: false, url: '/_fake/events' };
    })),
    // Where an API error's request_log_url points (Stripe points at its Dashboard's request log).
    http.get('/_fake/requests/:id', hook(ctx, (path) => {
      const failure = ctx.store.failedRequests.get(path.id);
      if (!failure) throw new StripeApiError(404, `No refused request '${path.id}' is remembered (only the latest few hundred are kept, and reset forgets them).`, { code: 'resource_missing' });
      return { id: path.id, object: 'request_log', ...failure };
    })),
    http.post('/_fake/events/:id/resend', hook(ctx, (path) => {
      const record = ctx.events.resend(path.id);
      if (!record) throw noSuch('evt', path.id);
      return summary(record);
    })),
    http.post('/_fake/subscriptions/:id/fail_payment', hook(ctx, (path) => {
      const sub = subscription(path.id);
      const invoice = failRenewal(ctx, sub);
      return { subscription: sub, invoice };
    })),
    http.post('/_fake/subscriptions/:id/recover_payment', hook(ctx, (path) => {
      const sub = subscription(path.id);
      const invoice = payOpenInvoice(ctx, sub);
      return { subscription: sub, invoice };
    })),
    http.post('/_fake/subscriptions/:id/advance', hook(ctx, (path) => {
      const sub = subscription(path.id);
      advancePeriod(ctx, sub);
      return { subscription: sub, invoice: sub.latest_invoice ? ctx.store.invoices.get(sub.latest_invoice) ?? null : null };
    })),
  ];
}
