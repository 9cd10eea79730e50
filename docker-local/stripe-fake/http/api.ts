// Wraps a /v1 route the way the Stripe API behaves around every call: API-key check, form
// decoding, refusal of parameters the endpoint does not take, idempotent replay of POSTs (the SDK
// retries with the same Idempotency-Key), `expand[]`, a request-id header and Stripe-shaped errors.
import { createHash } from 'node:crypto';
import { HttpResponse, type HttpResponseResolver } from 'msw';
import type { FakeContext } from '../context';
import type { CheckoutSession } from '../objects/types';
import { newId } from '../state/ids';
import { StripeApiError } from './errors';
import { applyExpand } from './expand';
import { parseForm } from './form';
import { listOf } from './list';
import { Params } from './params';
import { assertKnownParams, type Shape } from './shape';

export interface ApiInput {
  params: Params;
  path: Record<string, string>;
  requestId: string;
  method: string;
}

export type ApiHandler = (input: ApiInput) => object | Promise<object>;

class AuthenticationFailure extends StripeApiError {}

/** Stripe echoes a refused key with its middle masked: `sk_test_****…abcd`. */
function masked(key: string): string {
  if (key.length <= 12) return `${key.slice(0, 3)}***`;
  return `${key.slice(0, 8)}${'*'.repeat(key.length - 12)}${key.slice(-4)}`;
}

/**
 * Only the configured secret key opens the API, as only your own account's keys open Stripe's: an
 * app pointed at the fake with a stale or mistyped key fails here the way it would there.
 */
function checkApiKey(request: Request, secretKey: string): void {
  const header = request.headers.get('authorization') ?? '';
  let key = '';
  if (header.startsWith('Bearer ')) key = header.slice(7).trim();
  else if (header.startsWith('Basic ')) key = Buffer.from(header.slice(6), 'base64').toString('utf8').split(':')[0];
  if (!key) {
    throw new AuthenticationFailure(401, 'You did not provide an API key. You need to provide your API key in the Authorization header, using Bearer auth (e.g. \'Authorization: Bearer YOUR_SECRET_KEY\').');
  }
  if (key !== secretKey) throw new AuthenticationFailure(401, `Invalid API Key provided: ${masked(key)}`);
}

/** Line items are not part of a session until expanded, as in the Stripe API. */
function virtualField(ctx: FakeContext) {
  return (owner: Record<string, unknown>, field: string): unknown => {
    if (owner.object === 'checkout.session' && field === 'line_items') {
      const session = owner as unknown as CheckoutSession;
      const items = ctx.store.checkoutExtras.get(session.id)?.lineItems ?? [];
      return listOf(structuredClone(items), `/v1/checkout/sessions/${session.id}/line_items`);
    }
    return undefined;
  };
}

function json(body: unknown, status: number, headers: Record<string, string>): Response {
  return HttpResponse.json(body as object, { status, headers });
}

/**
 * `shape` names the parameters the endpoint takes (see http/shape.ts); `'any'` skips the check for
 * an endpoint that refuses every call with its own explanation.
 */
export function api(ctx: FakeContext, shape: Shape | 'any', handler: ApiHandler): HttpResponseResolver<Record<string, string>> {
  return async ({ request, params: path }) => {
    const requestId = newId('req');
    const headers: Record<string, string> = { 'request-id': requestId };
    const version = request.headers.get('stripe-version');
    if (version) headers['stripe-version'] = version;
    const method = request.method.toUpperCase();
    const idempotencyKey = method === 'POST' ? request.headers.get('idempotency-key') : null;
    let body = '';
    let fingerprint = '';
    let holdsKey = false;
    try {
      checkApiKey(request, ctx.secretKey);
      const url = new URL(request.url);
      body = method === 'POST' ? await request.text() : url.search.slice(1);
      if (idempotencyKey) {
        headers['idempotency-key'] = idempotencyKey;
        fingerprint = createHash('sha256').update(`${method} ${url.pathname}\n${body}`).digest('hex');
        const earlier = ctx.store.idempotency.get(idempotencyKey);
        if (earlier) {
          if (earlier.fingerprint !== fingerprint) {
            throw new StripeApiError(400, `Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${idempotencyKey}' if you meant to execute a different request.`, { type: 'idempotency_error' });
          }
          return new HttpResponse(earlier.body, {
            status: earlier.status,
            headers: { ...headers, 'content-type': 'application/json', 'idempotent-replayed': 'true' },
          });
        }
        if (ctx.store.idempotencyInFlight.has(idempotencyKey)) {
          throw new StripeApiError(409, `There is currently another in-progress request using this Stripe token (probably the same idempotency key: '${idempotencyKey}'). Please try again later.`, { type: 'idempotency_error', code: 'lock_timeout' });
        }
        ctx.store.idempotencyInFlight.add(idempotencyKey);
        holdsKey = true;
      }
      const form = parseForm(body);
      if (shape !== 'any') assertKnownParams(form, shape);
      const params = new Params(form);
      const result = await handler({ params, path, requestId, method });
      const expand = params.stringArray('expand') ?? [];
      const payload = expand.length
        ? applyExpand(result, expand, (id) => ctx.store.find(id), virtualField(ctx))
        : structuredClone(result);
      if (holdsKey) remember(ctx, idempotencyKey, fingerprint, 200, payload);
      return json(payload, 200, headers);
    } catch (error) {
      const failure =
        error instanceof StripeApiError
          ? error
          : new StripeApiError(500, 'An unexpected error occurred in the local Stripe fake.', { type: 'api_error' });
      if (!(error instanceof StripeApiError)) ctx.log(`500 on ${method} ${request.url}: ${error instanceof Error ? error.stack : String(error)}`);
      // A refused key has no account, so no request log to point at (Stripe gives none either).
      const authentication = failure instanceof AuthenticationFailure;
      const logUrl = authentication ? undefined : `${ctx.publicUrl}/_fake/requests/${requestId}`;
      const reply = failure.toBody(logUrl);
      if (authentication) headers['www-authenticate'] = 'Bearer realm="Stripe"';
      else ctx.store.logFailure(requestId, { method, path: new URL(request.url).pathname, status: failure.status, body: reply });
      // Stripe replays 4xx answers for a reused key too, but not 5xx or lock conflicts.
      if (holdsKey && failure.status < 500) {
        remember(ctx, idempotencyKey, fingerprint, failure.status, reply);
      }
      return json(reply, failure.status, headers);
    } finally {
      if (holdsKey && idempotencyKey) ctx.store.idempotencyInFlight.delete(idempotencyKey);
    }
  };
}

function remember(ctx: FakeContext, key: string | null, fingerprint: string, status: number, body: unknown): void {
  if (!key || !fingerprint) return;
  ctx.store.idempotency.set(key, { fingerprint, status, body: JSON.stringify(body) });
}
