// The local Stripe fake (docker-local/stripe-fake) driven through the official stripe SDK, the
// way the app uses it. Most tests run a fake of their own in this process on a free loopback port,
// with a small HTTP receiver standing in for the app's webhook endpoint; the last block talks to
// the fake the test services started (docker-local/services.sh) with the app's own client. The
// entry-point tests start server.ts as a process, which is why this file is an integration test.
// Reference for the wire behaviour: the stripe-node 23 sources in node_modules/stripe
// (resources/*.js, Error.js, Webhooks.js) and Stripe's API reference (errors, events).
import { spawn } from 'node:child_process';
import { once } from 'node:events';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { existsSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import Stripe from 'stripe';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { startStripeFake, type RunningFake } from '../../docker-local/stripe-fake/app';
import { ConfigError, readConfig } from '../../docker-local/stripe-fake/config';
import { getEnv } from '@/server/env';
import { getStripe, providerMessage, stripeConfigFromEnv } from '@/server/billing/stripe';

const SECRET = 'whsec_unit_test_secret_0123456789';
/** The one key this file's own fake accepts (the services' fake accepts STRIPE_SECRET_KEY). */
const KEY = 'sk_test_fake_suite_key_0123456789';
const DAY = 86_400;

interface Received {
  body: string;
  signature: string;
}

/** Stands in for the app's /api/webhooks/stripe; can be told to fail the next N deliveries. */
class Receiver {
  received: Received[] = [];
  failNext = 0;
  server = http.createServer((req, res) => {
    let body = '';
    req.setEncoding('utf8');
    req.on('data', (chunk: string) => (body += chunk));
    req.on('end', () => {
      if (this.failNext > 0) {
        this.failNext--;
        res.writeHead(500).end('not now');
        return;
      }
      this.received.push({ body, signature: String(req.headers['stripe-signature'] ?? '') });
      res.writeHead(200, { 'content-type': 'application/json' }).end('{"received":true}');
    });
  });

  async start(): Promise<string> {
    this.server.listen(0, '127.0.0.1');
    await once(this.server, 'listening');
    return `http://127.0.0.1:${(this.server.address() as AddressInfo).port}/api/webhooks/stripe`;
  }

  types(): string[] {
    return this.received.map((r) => (JSON.parse(r.body) as { type: string }).type);
  }
}

async function waitFor<T>(probe: () => T | undefined | null | false, what: string, ms = 5000): Promise<T> {
  const until = Date.now() + ms;
  for (;;) {
    const value = probe();
    if (value) return value;
    if (Date.now() > until) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 20));
  }
}

let fake: RunningFake;
let receiver: Receiver;
let stripe: Stripe;

function client(key: string): Stripe {
  return new Stripe(key, { host: '127.0.0.1', port: fake.port, protocol: 'http' });
}

beforeAll(async () => {
  receiver = new Receiver();
  const webhookUrl = await receiver.start();
  const config = readConfig({ STRIPE_SECRET_KEY: KEY, STRIPE_WEBHOOK_SECRET: SECRET, STRIPE_FAKE_PORT: '0', STRIPE_FAKE_WEBHOOK_URL: webhookUrl });
  // Short retry waits keep the retry test fast; the schedule itself is what is under test.
  fake = await startStripeFake({ ...config, retryDelaysMs: [50, 100] }, () => undefined);
  stripe = client(KEY);
});

afterAll(async () => {
  await fake?.close();
  receiver?.server.close();
});

beforeEach(async () => {
  const res = await fetch(`${fake.url}/_fake/reset`, { method: 'POST' });
  expect(res.status).toBe(200);
  receiver.received = [];
  receiver.failNext = 0;
});

/** Waits until every delivery (retries included) has settled. */
async function settle(): Promise<void> {
  const res = await fetch(`${fake.url}/_fake/events?wait=true`);
  expect(res.status).toBe(200);
}

/** The events received so far, verified, in arrival order. */
function receivedEvents(): Stripe.Event[] {
  return receiver.received.map((r) => verified(r));
}

/** Event types with the status of the subscription they carry, e.g. `customer.subscription.updated:active`. */
function trace(events: Stripe.Event[]): string[] {
  return events.map((e) => {
    const object = e.data.object as { object?: string; status?: string };
    return object.object === 'subscription' || object.object === 'invoice' ? `${e.type}:${object.status}` : e.type;
  });
}

async function catalog() {
  const product = await stripe.products.create({ name: 'Crew plan', metadata: { plan_code: 'crew' } });
  const crew = await stripe.prices.create({ product: product.id, currency: 'eur', unit_amount: 4900, recurring: { interval: 'month' } });
  const fleet = await stripe.prices.create({
    product_data: { name: 'Fleet plan' },
    currency: 'eur',
    unit_amount: 12900,
    recurring: { interval: 'month' },
  });
  return { product, crew, fleet };
}

/**
 * Opens a checkout for a new customer and pays it on the hosted page, as a browser would. Returns
 * the events this sent (from customer.created on) and clears the receiver, so a test sees only its
 * own later events.
 */
async function subscribe(priceId: string, email = 'ops@installer-demo.example') {
  await settle();
  receiver.received = [];
  const customer = await stripe.customers.create({ email, metadata: { company_id: '42' } });
  const session = await stripe.checkout.sessions.create({
    mode: 'subscription',
    customer: customer.id,
    line_items: [{ price: priceId, quantity: 1 }],
    success_url: 'http://127.0.0.1:3999/billing/return?session_id={CHECKOUT_SESSION_ID}',
    cancel_url: 'http://127.0.0.1:3999/billing',
    client_reference_id: 'company_42',
    metadata: { company_id: '42' },
    subscription_data: { metadata: { company_id: '42' } },
  });
  const paid = await fetch(`${fake.url}/checkout/${session.id}/pay`, { method: 'POST', redirect: 'manual' });
  expect(paid.status).toBe(303);
  expect(paid.headers.get('location')).toBe(`http://127.0.0.1:3999/billing/return?session_id=${session.id}`);
  const done = await stripe.checkout.sessions.retrieve(session.id);
  const subscription = await stripe.subscriptions.retrieve(done.subscription as string);
  await settle();
  const events = receivedEvents();
  receiver.received = [];
  return { customer, session, subscription, events };
}

function verified(r: Received, secret = SECRET): Stripe.Event {
  return stripe.webhooks.constructEvent(r.body, r.signature, secret);
}

function eventsOfType(type: string): Stripe.Event[] {
  return receiver.received.map((r) => verified(r)).filter((e) => e.type === type);
}

describe('SDK round trips', () => {
  it('creates, retrieves, updates and lists customers, with email filter and pagination', async () => {
    const a = await stripe.customers.create({ email: 'a@demo.example', name: 'Alpha Dish Co', metadata: { company_id: '1', tier: 'x' } });
    expect(a.id).toMatch(/^cus_[0-9A-Za-z]{14}$/);
    expect(a).toMatchObject({ object: 'customer', livemode: false, email: 'a@demo.example', metadata: { company_id: '1', tier: 'x' } });
    expect(Math.abs(a.created - Date.now() / 1000)).toBeLessThan(5);
    await stripe.customers.create({ email: 'b@demo.example' });
    await stripe.customers.create({ email: 'a@demo.example' });

    const updated = await stripe.customers.update(a.id, { name: 'Alpha Dish Ltd', metadata: { tier: '' , region: 'north' } });
    expect(updated.name).toBe('Alpha Dish Ltd');
    // Stripe semantics: an empty value deletes that key, other keys merge.
    expect(updated.metadata).toEqual({ company_id: '1', region: 'north' });
    expect((await stripe.customers.retrieve(a.id)) as Stripe.Customer).toMatchObject({ name: 'Alpha Dish Ltd' });

    const byEmail = await stripe.customers.list({ email: 'a@demo.example' });
    expect(byEmail).toMatchObject({ object: 'list', has_more: false, url: '/v1/customers' });
    expect(byEmail.data).toHaveLength(2);
    expect(byEmail.data.every((c) => c.email === 'a@demo.example')).toBe(true);

    const firstPage = await stripe.customers.list({ limit: 2 });
    expect(firstPage.data).toHaveLength(2);
    expect(firstPage.has_more).toBe(true);
    const all = await stripe.customers.list({ limit: 1 }).autoPagingToArray({ limit: 10 });
    expect(all.map((c) => c.id)).toHaveLength(3);
    expect(new Set(all.map((c) => c.id)).size).toBe(3);
    // Newest first, like Stripe.
    expect(all[2].id).toBe(a.id);
  });

  it('answers unknown ids, missing params and bad keys with Stripe-style errors', async () => {
    const missing = await stripe.customers.retrieve('cus_doesnotexist').catch((e: unknown) => e);
    expect(missing).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(missing).toMatchObject({ statusCode: 404, code: 'resource_missing', param: 'id', message: "No such customer: 'cus_doesnotexist'" });

    const noName = await stripe.products.create({} as Stripe.ProductCreateParams).catch((e: unknown) => e);
    expect(noName).toMatchObject({ type: 'StripeInvalidRequestError', statusCode: 400, param: 'name', code: 'parameter_missing' });

    const live = new Stripe('sk_live_nope', { host: '127.0.0.1', port: fake.port, protocol: 'http' });
    const denied = await live.customers.list().catch((e: unknown) => e);
    expect(denied).toBeInstanceOf(Stripe.errors.StripeAuthenticationError);

    const unknown = await stripe.coupons.list().catch((e: unknown) => e);
    expect(unknown).toMatchObject({ type: 'StripeInvalidRequestError', statusCode: 404 });
    expect((unknown as Error).message).toContain('Unrecognized request URL (GET: /v1/coupons)');
  });

  it('handles products and prices, including immutable amounts and filters', async () => {
    const { product, crew, fleet } = await catalog();
    expect(product.id).toMatch(/^prod_/);
    expect(crew.id).toMatch(/^price_/);
    expect(crew).toMatchObject({ object: 'price', type: 'recurring', unit_amount: 4900, currency: 'eur', product: product.id, active: true });
    expect(crew.recurring).toMatchObject({ interval: 'month', interval_count: 1 });
    // The SDK coerces the decimal string into its Decimal type; the value must survive.
    expect(String(crew.unit_amount_decimal)).toBe('4900');

    const renamed = await stripe.products.update(product.id, { name: 'Crew plan 2', default_price: crew.id });
    expect(renamed).toMatchObject({ name: 'Crew plan 2', default_price: crew.id, metadata: { plan_code: 'crew' } });
    expect((await stripe.products.retrieve(fleet.product as string)).name).toBe('Fleet plan');

    const off = await stripe.prices.update(crew.id, { active: false, metadata: { replaced_by: fleet.id } });
    expect(off.active).toBe(false);
    expect((await stripe.prices.retrieve(crew.id)).metadata).toEqual({ replaced_by: fleet.id });
    const active = await stripe.prices.list({ active: true });
    expect(active.data.map((p) => p.id)).toEqual([fleet.id]);
    expect((await stripe.prices.list({ product: product.id })).data.map((p) => p.id)).toEqual([crew.id]);

    const amountChange = await stripe.prices.update(crew.id, { unit_amount: 1 } as Stripe.PriceUpdateParams).catch((e: unknown) => e);
    expect(amountChange).toMatchObject({ statusCode: 400, param: 'unit_amount' });

    await stripe.products.update(fleet.product as string, { active: false });
    expect((await stripe.products.list({ active: true })).data.map((p) => p.id)).toEqual([product.id]);
  });

  it('replays a POST with the same Idempotency-Key and refuses it with other params', async () => {
    const first = await stripe.customers.create({ email: 'same@demo.example' }, { idempotencyKey: 'key-1' });
    const again = await stripe.customers.create({ email: 'same@demo.example' }, { idempotencyKey: 'key-1' });
    expect(again.id).toBe(first.id);
    expect((await stripe.customers.list()).data).toHaveLength(1);
    const clash = await stripe.customers.create({ email: 'other@demo.example' }, { idempotencyKey: 'key-1' }).catch((e: unknown) => e);
    expect(clash).toBeInstanceOf(Stripe.errors.StripeIdempotencyError);
  });
});

describe('refusals the app must not be able to miss', () => {
  it('an unknown parameter is a 400 parameter_unknown that the SDK raises as StripeInvalidRequestError, and nothing is created', async () => {
    const error = (await stripe.customers
      .create({ email: 'teal@demo.example', colour: 'teal' } as Stripe.CustomerCreateParams)
      .catch((e: unknown) => e)) as Stripe.errors.StripeInvalidRequestError;
    expect(error).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(error).toMatchObject({
      type: 'StripeInvalidRequestError',
      statusCode: 400,
      code: 'parameter_unknown',
      param: 'colour',
      message: 'Received unknown parameter: colour',
      doc_url: 'https://stripe.com/docs/error-codes/parameter-unknown',
    });
    expect(error.requestId).toMatch(/^req_/);
    // The body is Stripe's error object: type, code, message, param, doc_url, request_log_url.
    expect(error.raw).toMatchObject({ type: 'invalid_request_error', code: 'parameter_unknown', param: 'colour' });
    expect(error.request_log_url).toBe(`${fake.url}/_fake/requests/${error.requestId}`);
    const logged = (await (await fetch(error.request_log_url as string)).json()) as { method: string; path: string; status: number; body: unknown };
    expect(logged).toMatchObject({ method: 'POST', path: '/v1/customers', status: 400, body: { error: { code: 'parameter_unknown', param: 'colour' } } });
    // Refused before anything happened: no customer, no event.
    expect((await stripe.customers.list()).data).toHaveLength(0);
    await settle();
    expect(receiver.types()).toEqual([]);
  });

  it('names nested unknown parameters the way Stripe does, on GET query strings too, and refuses retired ones', async () => {
    const { crew } = await catalog();
    const nested = await stripe.checkout.sessions
      .create({
        mode: 'subscription',
        line_items: [{ price: crew.id, quantiy: 2 } as Stripe.Checkout.SessionCreateParams.LineItem],
        success_url: 'http://127.0.0.1:3999/ok',
      })
      .catch((e: unknown) => e);
    expect(nested).toMatchObject({ statusCode: 400, code: 'parameter_unknown', param: 'line_items[0][quantiy]', message: 'Received unknown parameter: line_items[0][quantiy]' });
    const deeper = await stripe.checkout.sessions
      .create({
        mode: 'subscription',
        line_items: [{ price: crew.id }],
        success_url: 'http://127.0.0.1:3999/ok',
        subscription_data: { trial_days: 14 } as Stripe.Checkout.SessionCreateParams.SubscriptionData,
      })
      .catch((e: unknown) => e);
    expect(deeper).toMatchObject({ statusCode: 400, param: 'subscription_data[trial_days]' });
    expect((await stripe.checkout.sessions.list()).data).toHaveLength(0);

    const query = await stripe.customers.list({ emial: 'a@demo.example' } as Stripe.CustomerListParams).catch((e: unknown) => e);
    expect(query).toMatchObject({ type: 'StripeInvalidRequestError', statusCode: 400, code: 'parameter_unknown', param: 'emial' });

    // A price's amount cannot change: Stripe does not take the parameter on update at all.
    const amount = await stripe.prices.update(crew.id, { unit_amount: 1 } as Stripe.PriceUpdateParams).catch((e: unknown) => e);
    expect(amount).toMatchObject({ statusCode: 400, code: 'parameter_unknown', param: 'unit_amount' });
    expect((await stripe.prices.retrieve(crew.id)).unit_amount).toBe(4900);
  });

  it('a key other than the configured one is a 401 that the SDK raises as StripeAuthenticationError, with the key masked', async () => {
    const other = await client('sk_test_someone_elses_key_9xyz').customers.list().catch((e: unknown) => e) as Stripe.errors.StripeAuthenticationError;
    expect(other).toBeInstanceOf(Stripe.errors.StripeAuthenticationError);
    expect(other).toMatchObject({ type: 'StripeAuthenticationError', statusCode: 401 });
    // Stripe's body for a refused key: an invalid_request_error (the 401 makes it an authentication
    // error in the SDK), no code, no request log, only the first 8 and last 4 characters shown.
    expect(other.message).toBe(`Invalid API Key provided: sk_test_${'*'.repeat(18)}9xyz`);
    expect(other.raw).toMatchObject({ type: 'invalid_request_error' });
    expect(other.code).toBeUndefined();
    expect(other.request_log_url).toBeUndefined();
    expect(other.message).not.toContain('someone_elses');

    const live = await client('sk_live_the_wrong_mode_key_1').customers.create({ email: 'x@demo.example' }).catch((e: unknown) => e);
    expect(live).toBeInstanceOf(Stripe.errors.StripeAuthenticationError);
    expect((await stripe.customers.list()).data).toHaveLength(0);

    const bare = await fetch(`${fake.url}/v1/customers`);
    expect(bare.status).toBe(401);
    expect(bare.headers.get('www-authenticate')).toBe('Bearer realm="Stripe"');
    const body = (await bare.json()) as { error: { type: string; message: string } };
    expect(body.error.type).toBe('invalid_request_error');
    expect(body.error.message).toMatch(/^You did not provide an API key/);

    // The configured key itself works.
    expect((await stripe.customers.list()).object).toBe('list');
  });
});

describe('checkout', () => {
  it('creates a session whose url opens the test checkout page', async () => {
    const { crew } = await catalog();
    const session = await stripe.checkout.sessions.create({
      mode: 'subscription',
      line_items: [{ price: crew.id, quantity: 2 }],
      customer_email: 'new@demo.example',
      success_url: 'http://127.0.0.1:3999/ok?s={CHECKOUT_SESSION_ID}',
    });
    expect(session.id).toMatch(/^cs_test_/);
    expect(session).toMatchObject({ object: 'checkout.session', status: 'open', payment_status: 'unpaid', amount_total: 9800, subscription: null });
    expect(session.url).toBe(`${fake.url}/checkout/${session.id}`);
    const page = await fetch(session.url as string);
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html).toContain('Pay with test card 4242 4242 4242 4242');
    expect(html).toContain('Decline (card 4000 0000 0000 0002)');
    expect(html).toContain('EUR 98.00');

    const items = await stripe.checkout.sessions.listLineItems(session.id);
    expect(items.data).toHaveLength(1);
    expect(items.data[0]).toMatchObject({ quantity: 2, amount_total: 9800, description: 'Crew plan' });
    expect(items.data[0].price?.id).toBe(crew.id);

    const bad = await stripe.checkout.sessions
      .create({ mode: 'subscription', line_items: [{ price: 'price_missing', quantity: 1 }], success_url: 'http://127.0.0.1:3999/ok' })
      .catch((e: unknown) => e);
    expect(bad).toMatchObject({ statusCode: 404, param: 'line_items[0][price]' });
  });

  it('paying passes the subscription through incomplete to active, with the first invoice issued and paid in between', async () => {
    const { crew } = await catalog();
    const { customer, session, subscription, events } = await subscribe(crew.id);

    const done = await stripe.checkout.sessions.retrieve(session.id, { expand: ['subscription', 'line_items'] });
    expect(done).toMatchObject({ status: 'complete', payment_status: 'paid', customer: customer.id, client_reference_id: 'company_42', url: null });
    const expanded = done.subscription as Stripe.Subscription;
    expect(expanded.id).toBe(subscription.id);
    expect(done.line_items?.data[0].price?.id).toBe(crew.id);

    expect(subscription.id).toMatch(/^sub_/);
    expect(subscription).toMatchObject({ status: 'active', customer: customer.id, cancel_at_period_end: false, metadata: { company_id: '42' } });
    const item = subscription.items.data[0];
    expect(item.price.id).toBe(crew.id);
    expect(item.current_period_end - item.current_period_start).toBe(30 * DAY);
    expect(Math.abs(item.current_period_end - (Date.now() / 1000 + 30 * DAY))).toBeLessThan(10);
    // The current API keeps the period on the items only.
    expect(subscription).not.toHaveProperty('current_period_end');
    expect(subscription).not.toHaveProperty('current_period_start');

    const invoices = await stripe.invoices.list({ customer: customer.id });
    expect(invoices.data).toHaveLength(1);
    const invoice = invoices.data[0];
    expect(invoice.id).toMatch(/^in_/);
    expect(invoice).toMatchObject({ status: 'paid', amount_paid: 4900, amount_due: 4900, billing_reason: 'subscription_create' });
    expect(invoice.number).toMatch(/^[A-Z0-9]{8}-0001$/);
    expect(invoice.parent?.subscription_details?.subscription).toBe(subscription.id);
    expect((await stripe.invoices.retrieve(invoice.id)).number).toBe(invoice.number);
    expect(subscription.latest_invoice).toBe(invoice.id);

    for (const event of events) {
      expect(event.id).toMatch(/^evt_/);
      expect(event).toMatchObject({ object: 'event', livemode: false, api_version: Stripe.API_VERSION });
    }
    // Stripe's sequence for a subscription Checkout: created while awaiting the first payment,
    // the invoice drafted, finalized and paid, then the update to active, the session last.
    expect(trace(events)).toEqual([
      'customer.created',
      'customer.subscription.created:incomplete',
      'invoice.created:draft',
      'invoice.finalized:open',
      'invoice.paid:paid',
      'invoice.payment_succeeded:paid',
      'customer.subscription.updated:active',
      'checkout.session.completed',
    ]);
    const activated = events[6];
    expect(activated.data.previous_attributes).toEqual({ status: 'incomplete' });
    const draft = events[2].data.object as Stripe.Invoice;
    expect(draft).toMatchObject({ id: invoice.id, number: null, status_transitions: { finalized_at: null } });
    expect((events[3].data.object as Stripe.Invoice).number).toBe(invoice.number);
    const completed = events[7].data.object as Stripe.Checkout.Session;
    expect(completed).toMatchObject({ id: session.id, subscription: subscription.id, client_reference_id: 'company_42', metadata: { company_id: '42' } });
    const created = events[1].data.object as Stripe.Subscription;
    expect(created.items.data[0].price.id).toBe(crew.id);
    expect(created.latest_invoice).toBe(invoice.id);

    const log = (await (await fetch(`${fake.url}/_fake/events?wait=true`)).json()) as { data: { type: string; delivery_status: string }[] };
    expect(log.data.filter((e) => e.type === 'invoice.paid').map((e) => e.delivery_status)).toEqual(['delivered']);
    // Retrieving the same event through the API gives the same object.
    const viaApi = await stripe.events.retrieve(events[4].id);
    expect((viaApi.data.object as Stripe.Invoice).id).toBe(invoice.id);
  });

  it('gives the events of a flow distinct `created` times in the order they were sent', async () => {
    const startedAt = Math.floor(Date.now() / 1000);
    const { crew } = await catalog();
    const { subscription, events } = await subscribe(crew.id);
    await fetch(`${fake.url}/_fake/subscriptions/${subscription.id}/advance`, { method: 'POST' });
    await settle();
    const all = [...events, ...receivedEvents()];
    expect(all.length).toBeGreaterThanOrEqual(12);
    for (let i = 1; i < all.length; i++) expect(all[i].created, `${all[i].type} after ${all[i - 1].type}`).toBeGreaterThan(all[i - 1].created);
    // Never behind the clock; ahead of it by at most one second per event of the burst.
    const elapsed = Math.floor(Date.now() / 1000) - startedAt;
    expect(all[0].created).toBeGreaterThanOrEqual(startedAt);
    expect(all[all.length - 1].created - all[0].created).toBeLessThanOrEqual(all.length - 1 + elapsed);
    // The API lists them newest first, which is now also descending `created`.
    const listed = (await stripe.events.list({ limit: 100 })).data.map((e) => e.created);
    expect(listed).toEqual([...listed].sort((a, b) => b - a));
  });

  it('signatures verify only with the right secret and untouched body', async () => {
    await stripe.customers.create({ email: 'signed@demo.example' });
    const r = await waitFor(() => receiver.received[0], 'a webhook');
    expect(r.signature).toMatch(/^t=\d+,v1=[0-9a-f]{64}$/);
    expect(() => verified(r)).not.toThrow();
    expect(() => verified(r, 'whsec_some_other_secret')).toThrow(Stripe.errors.StripeSignatureVerificationError);
    const tampered = r.body.replace('"livemode": false', '"livemode": true');
    expect(tampered).not.toBe(r.body);
    expect(() => stripe.webhooks.constructEvent(tampered, r.signature, SECRET)).toThrow(Stripe.errors.StripeSignatureVerificationError);
    // Same header format as the SDK's own test helper produces for this payload and time.
    const t = Number(/t=(\d+)/.exec(r.signature)?.[1]);
    expect(stripe.webhooks.generateTestHeaderString({ payload: r.body, secret: SECRET, timestamp: t })).toBe(r.signature);
  });

  it('declining shows a message, creates nothing and keeps the session open', async () => {
    const { crew } = await catalog();
    const customer = await stripe.customers.create({ email: 'decline@demo.example' });
    const session = await stripe.checkout.sessions.create({
      mode: 'subscription',
      customer: customer.id,
      line_items: [{ price: crew.id }],
      success_url: 'http://127.0.0.1:3999/ok',
      cancel_url: 'http://127.0.0.1:3999/cancelled',
    });
    const declined = await fetch(`${fake.url}/checkout/${session.id}/decline`, { method: 'POST', redirect: 'manual' });
    expect(declined.status).toBe(402);
    const html = await declined.text();
    expect(html).toContain('Your card was declined');
    expect(html).toContain('href="http://127.0.0.1:3999/cancelled"');
    expect((await stripe.checkout.sessions.retrieve(session.id)).status).toBe('open');
    expect((await stripe.subscriptions.list({ customer: customer.id, status: 'all' })).data).toHaveLength(0);
    const log = (await (await fetch(`${fake.url}/_fake/events?wait=true`)).json()) as { data: { type: string }[] };
    expect(log.data.map((e) => e.type)).toEqual(['customer.created', 'price.created', 'product.created', 'price.created', 'product.created']);
  });
  it('without a customer, the page asks for an email, creates the customer and honours a trial', async () => {
    const { crew } = await catalog();
    const session = await stripe.checkout.sessions.create({
      mode: 'subscription',
      line_items: [{ price: crew.id }],
      success_url: 'http://127.0.0.1:3999/ok',
      subscription_data: { trial_period_days: 14 },
    });
    const html = await (await fetch(session.url as string)).text();
    expect(html).toContain('name="email"');
    expect(html).toContain('14-day trial');
    const paid = await fetch(`${fake.url}/checkout/${session.id}/pay`, {
      method: 'POST',
      redirect: 'manual',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: 'email=trial%40demo.example',
    });
    expect(paid.status).toBe(303);
    await settle();
    // Nothing to pay today: trialing from the start, with a paid zero invoice and no update.
    expect(trace(receivedEvents()).slice(-7)).toEqual([
      'customer.created',
      'customer.subscription.created:trialing',
      'invoice.created:draft',
      'invoice.finalized:open',
      'invoice.paid:paid',
      'invoice.payment_succeeded:paid',
      'checkout.session.completed',
    ]);
    receiver.received = [];
    const done = await stripe.checkout.sessions.retrieve(session.id, { expand: ['customer', 'subscription'] });
    expect(done.payment_status).toBe('no_payment_required');
    expect((done.customer as Stripe.Customer).email).toBe('trial@demo.example');
    const sub = done.subscription as Stripe.Subscription;
    expect(sub.status).toBe('trialing');
    expect((sub.trial_end as number) - (sub.trial_start as number)).toBe(14 * DAY);
    expect(sub.items.data[0].current_period_end).toBe(sub.trial_end);

    const items = await stripe.subscriptionItems.list({ subscription: sub.id });
    expect(items.data.map((i) => i.price.id)).toEqual([crew.id]);
    const invoice = await stripe.invoices.retrieve(sub.latest_invoice as string);
    expect(invoice).toMatchObject({ status: 'paid', amount_due: 0 });
    expect((await stripe.invoices.listLineItems(invoice.id)).data[0].amount).toBe(0);

    await fetch(`${fake.url}/_fake/subscriptions/${sub.id}/advance`, { method: 'POST' });
    const after = await stripe.subscriptions.retrieve(sub.id, { expand: ['latest_invoice'] });
    expect(after.status).toBe('active');
    expect((after.latest_invoice as Stripe.Invoice).amount_paid).toBe(4900);

    await settle();
    // The trial's end is the first renewal: active from the new period, then its invoice.
    expect(trace(receivedEvents())).toEqual([
      'customer.subscription.updated:active',
      'invoice.created:draft',
      'invoice.finalized:open',
      'invoice.paid:paid',
      'invoice.payment_succeeded:paid',
    ]);
    expect(receivedEvents()[0].data.previous_attributes).toMatchObject({ status: 'trialing' });
    const created = await stripe.events.list({ type: 'customer.subscription.*' });
    expect(created.data.map((e) => e.type)).toEqual(['customer.subscription.updated', 'customer.subscription.created']);
  });
});

describe('subscription changes', () => {
  it('changes plan through the SDK and sends customer.subscription.updated with previous_attributes', async () => {
    const { crew, fleet } = await catalog();
    const { subscription } = await subscribe(crew.id);
    const updated = await stripe.subscriptions.update(subscription.id, {
      items: [{ id: subscription.items.data[0].id, price: fleet.id }],
      proration_behavior: 'none',
    });
    expect(updated.items.data).toHaveLength(1);
    expect(updated.items.data[0].price.id).toBe(fleet.id);
    expect(updated.items.data[0].plan.amount).toBe(12900);
    expect((await stripe.subscriptions.retrieve(subscription.id)).items.data[0].price.id).toBe(fleet.id);

    const event = await waitFor(() => eventsOfType('customer.subscription.updated')[0], 'updated webhook');
    const previous = event.data.previous_attributes as { items: Stripe.ApiList<Stripe.SubscriptionItem> };
    expect(previous.items.data[0].price.id).toBe(crew.id);
    expect((event.data.object as Stripe.Subscription).items.data[0].price.id).toBe(fleet.id);

    const wrong = await stripe.subscriptions
      .update(subscription.id, { items: [{ id: subscription.items.data[0].id, price: 'price_nope' }] })
      .catch((e: unknown) => e);
    expect(wrong).toMatchObject({ statusCode: 404, param: 'items[0][price]' });
    expect((await stripe.subscriptions.retrieve(subscription.id)).items.data[0].price.id).toBe(fleet.id);
  });

  it('cancel at period end keeps it active until the period passes, then deletes it', async () => {
    const { crew } = await catalog();
    const { customer, subscription } = await subscribe(crew.id);
    const scheduled = await stripe.subscriptions.update(subscription.id, { cancel_at_period_end: true });
    expect(scheduled).toMatchObject({ status: 'active', cancel_at_period_end: true, cancel_at: scheduled.items.data[0].current_period_end });
    await waitFor(() => eventsOfType('customer.subscription.updated')[0], 'updated webhook');
    expect(eventsOfType('customer.subscription.updated')[0].data.previous_attributes).toMatchObject({ cancel_at_period_end: false });

    const advanced = await fetch(`${fake.url}/_fake/subscriptions/${subscription.id}/advance`, { method: 'POST' });
    expect(advanced.status).toBe(200);
    const ended = await stripe.subscriptions.retrieve(subscription.id);
    expect(ended.status).toBe('canceled');
    expect(ended.ended_at).toBe(subscription.items.data[0].current_period_end);
    const deleted = await waitFor(() => eventsOfType('customer.subscription.deleted')[0], 'deleted webhook');
    expect((deleted.data.object as Stripe.Subscription).status).toBe('canceled');

    expect((await stripe.subscriptions.list({ customer: customer.id })).data).toHaveLength(0);
    expect((await stripe.subscriptions.list({ customer: customer.id, status: 'all' })).data).toHaveLength(1);
    const late = await stripe.subscriptions.update(subscription.id, { cancel_at_period_end: false }).catch((e: unknown) => e);
    expect(late).toMatchObject({ statusCode: 400 });
  });

  it('cancels at once with DELETE', async () => {
    const { crew } = await catalog();
    const { subscription } = await subscribe(crew.id);
    const canceled = await stripe.subscriptions.cancel(subscription.id);
    expect(canceled.status).toBe('canceled');
    expect(canceled.canceled_at).not.toBeNull();
    await waitFor(() => eventsOfType('customer.subscription.deleted')[0], 'deleted webhook');
    expect(await stripe.subscriptions.cancel(subscription.id).catch((e: unknown) => e)).toMatchObject({ statusCode: 404 });
  });

  it('an active period advances into a renewal: the period moves on, then its invoice is created, finalized and paid', async () => {
    const { crew } = await catalog();
    const { customer, subscription } = await subscribe(crew.id);
    const res = await fetch(`${fake.url}/_fake/subscriptions/${subscription.id}/advance`, { method: 'POST' });
    expect(res.status).toBe(200);
    const renewed = await stripe.subscriptions.retrieve(subscription.id);
    expect(renewed.status).toBe('active');
    const before = subscription.items.data[0];
    expect(renewed.items.data[0].current_period_start).toBe(before.current_period_end);
    expect(renewed.items.data[0].current_period_end).toBe(before.current_period_end + 30 * DAY);
    const invoices = await stripe.invoices.list({ subscription: subscription.id });
    expect(invoices.data.map((i) => [i.billing_reason, i.status])).toEqual([
      ['subscription_cycle', 'paid'],
      ['subscription_create', 'paid'],
    ]);
    const renewal = invoices.data[0];
    expect(renewal).toMatchObject({ customer: customer.id, amount_paid: 4900, period_start: before.current_period_end, period_end: before.current_period_end + 30 * DAY });
    expect(renewal.number).toMatch(/-0002$/);
    expect(renewed.latest_invoice).toBe(renewal.id);

    await settle();
    const events = receivedEvents();
    expect(trace(events)).toEqual([
      'customer.subscription.updated:active',
      'invoice.created:draft',
      'invoice.finalized:open',
      'invoice.paid:paid',
      'invoice.payment_succeeded:paid',
    ]);
    // The update names what moved: the items (their period) and the latest invoice.
    const previous = events[0].data.previous_attributes as { items: Stripe.ApiList<Stripe.SubscriptionItem>; latest_invoice: string };
    expect(previous.items.data[0].current_period_end).toBe(before.current_period_end);
    expect(previous.latest_invoice).toBe(subscription.latest_invoice);
    expect(events.slice(1).every((e) => (e.data.object as Stripe.Invoice).id === renewal.id)).toBe(true);
  });

  it('a failed renewal payment makes it past_due with invoice.payment_failed, and recovery makes it active', async () => {
    const { crew } = await catalog();
    const { subscription } = await subscribe(crew.id);
    await fetch(`${fake.url}/_fake/events?wait=true`);
    receiver.received = [];

    const res = await fetch(`${fake.url}/_fake/subscriptions/${subscription.id}/fail_payment`, { method: 'POST' });
    expect(res.status).toBe(200);
    const pastDue = await stripe.subscriptions.retrieve(subscription.id, { expand: ['latest_invoice'] });
    expect(pastDue.status).toBe('past_due');
    const open = pastDue.latest_invoice as Stripe.Invoice;
    expect(open).toMatchObject({ status: 'open', attempt_count: 1, amount_paid: 0, amount_remaining: 4900 });
    await settle();
    // The new period starts and its invoice is issued; the charge fails; then past_due.
    expect(trace(receivedEvents())).toEqual([
      'customer.subscription.updated:active',
      'invoice.created:draft',
      'invoice.finalized:open',
      'invoice.payment_failed:open',
      'customer.subscription.updated:past_due',
    ]);
    expect(eventsOfType('customer.subscription.updated')[1].data.previous_attributes).toEqual({ status: 'active' });

    const listed = await stripe.subscriptions.list({ customer: pastDue.customer as string, expand: ['data.latest_invoice'] });
    expect((listed.data[0].latest_invoice as Stripe.Invoice).status).toBe('open');
    expect(((await stripe.customers.retrieve(pastDue.customer as string)) as Stripe.Customer).delinquent).toBe(true);

    receiver.received = [];
    await fetch(`${fake.url}/_fake/subscriptions/${subscription.id}/recover_payment`, { method: 'POST' });
    expect((await stripe.subscriptions.retrieve(subscription.id)).status).toBe('active');
    expect((await stripe.invoices.retrieve(open.id)).status).toBe('paid');
    await settle();
    expect(trace(receivedEvents())).toEqual(['invoice.paid:paid', 'invoice.payment_succeeded:paid', 'customer.subscription.updated:active']);

    // Past due and never paid: at the period end the fake cancels, Stripe's default dunning outcome.
    await fetch(`${fake.url}/_fake/subscriptions/${subscription.id}/fail_payment`, { method: 'POST' });
    await fetch(`${fake.url}/_fake/subscriptions/${subscription.id}/advance`, { method: 'POST' });
    expect((await stripe.subscriptions.retrieve(subscription.id)).status).toBe('canceled');
  });
});

describe('pause and resume', () => {
  it('pausing sends customer.subscription.paused, stops renewals, and resuming starts a paid period with customer.subscription.resumed', async () => {
    const { crew } = await catalog();
    const { subscription } = await subscribe(crew.id);

    const paused = await stripe.subscriptions.pause(subscription.id, { type: 'subscription' });
    expect(paused.status).toBe('paused');
    expect(paused.status_details?.paused).toMatchObject({ type: 'subscription', subscription: { type: 'pause_requested' } });
    await settle();
    expect(trace(receivedEvents())).toEqual(['customer.subscription.updated:paused', 'customer.subscription.paused:paused']);
    expect(receivedEvents()[0].data.previous_attributes).toMatchObject({ status: 'active' });
    // No renewal while paused, and no second pause.
    const advance = await fetch(`${fake.url}/_fake/subscriptions/${subscription.id}/advance`, { method: 'POST' });
    expect(advance.status).toBe(400);
    expect(await stripe.subscriptions.pause(subscription.id).catch((e: unknown) => e)).toMatchObject({ statusCode: 400 });
    expect((await stripe.invoices.list({ subscription: subscription.id })).data).toHaveLength(1);

    receiver.received = [];
    const before = Math.floor(Date.now() / 1000);
    const resumed = await stripe.subscriptions.resume(subscription.id);
    expect(resumed.status).toBe('active');
    expect(resumed).not.toHaveProperty('status_details');
    // Stripe's default billing_cycle_anchor `now`: a new period from today, invoiced and paid.
    expect(resumed.items.data[0].current_period_start).toBeGreaterThanOrEqual(before);
    expect(resumed.items.data[0].current_period_end - resumed.items.data[0].current_period_start).toBe(30 * DAY);
    await settle();
    expect(trace(receivedEvents())).toEqual([
      'customer.subscription.updated:active',
      'customer.subscription.resumed:active',
      'invoice.created:draft',
      'invoice.finalized:open',
      'invoice.paid:paid',
      'invoice.payment_succeeded:paid',
    ]);
    expect((await stripe.invoices.retrieve(resumed.latest_invoice as string)).amount_paid).toBe(4900);
    expect(await stripe.subscriptions.resume(subscription.id).catch((e: unknown) => e)).toMatchObject({ statusCode: 400 });
  });

  it('resuming with the billing cycle anchor unchanged keeps the period and invoices nothing', async () => {
    const { crew } = await catalog();
    const { subscription } = await subscribe(crew.id);
    await stripe.subscriptions.pause(subscription.id);
    await settle();
    receiver.received = [];
    const resumed = await stripe.subscriptions.resume(subscription.id, { billing_cycle_anchor: { type: 'unchanged' } });
    expect(resumed.status).toBe('active');
    expect(resumed.items.data[0].current_period_end).toBe(subscription.items.data[0].current_period_end);
    await settle();
    expect(trace(receivedEvents())).toEqual(['customer.subscription.updated:active', 'customer.subscription.resumed:active']);
    const wrong = await stripe.subscriptions.pause(subscription.id, { type: 'schedule' as 'subscription' }).catch((e: unknown) => e);
    expect(wrong).toMatchObject({ statusCode: 400, param: 'type' });
  });
});

describe('billing portal', () => {
  it('lists the subscription and changes plan and cancels through the page', async () => {
    const { crew, fleet } = await catalog();
    const { customer, subscription } = await subscribe(crew.id);
    const portal = await stripe.billingPortal.sessions.create({ customer: customer.id, return_url: 'http://127.0.0.1:3999/billing' });
    expect(portal.id).toMatch(/^bps_/);
    expect(portal).toMatchObject({ object: 'billing_portal.session', customer: customer.id, livemode: false });
    expect(portal.url).toBe(`${fake.url}/portal/${portal.id}`);

    const page = await (await fetch(portal.url)).text();
    expect(page).toContain('Crew plan — EUR 49.00 / month');
    expect(page).toContain(`value="${fleet.id}"`);
    expect(page).toContain('href="http://127.0.0.1:3999/billing"');

    const base = `${fake.url}/portal/${portal.id}/subscriptions/${subscription.id}`;
    const change = await fetch(`${base}/plan`, {
      method: 'POST',
      redirect: 'manual',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: `price=${fleet.id}`,
    });
    expect(change.status).toBe(303);
    expect(change.headers.get('location')).toBe(`/portal/${portal.id}?done=plan_changed`);
    expect((await stripe.subscriptions.retrieve(subscription.id)).items.data[0].price.id).toBe(fleet.id);

    const cancel = await fetch(`${base}/cancel`, { method: 'POST', redirect: 'manual' });
    expect(cancel.status).toBe(303);
    expect((await stripe.subscriptions.retrieve(subscription.id)).cancel_at_period_end).toBe(true);
    const after = await (await fetch(`${fake.url}${cancel.headers.get('location')}`)).text();
    expect(after).toContain('Keep my subscription');

    await waitFor(() => eventsOfType('customer.subscription.updated').length >= 2, 'two updated webhooks');
    const updates = eventsOfType('customer.subscription.updated');
    expect(Object.keys(updates[0].data.previous_attributes ?? {})).toContain('items');
    expect(updates[1].data.previous_attributes).toMatchObject({ cancel_at_period_end: false });

    // Another customer's subscription cannot be touched through this portal link.
    const other = await subscribe(crew.id, 'other@demo.example');
    const foreign = await fetch(`${fake.url}/portal/${portal.id}/subscriptions/${other.subscription.id}/cancel`, { method: 'POST', redirect: 'manual' });
    expect(foreign.status).toBe(404);
    expect((await stripe.subscriptions.retrieve(other.subscription.id)).cancel_at_period_end).toBe(false);
  });
  it('a past-due customer pays the open invoice in the portal; a declined retry sends invoice.payment_failed', async () => {
    const { crew } = await catalog();
    const { customer, subscription } = await subscribe(crew.id);
    await fetch(`${fake.url}/_fake/subscriptions/${subscription.id}/fail_payment`, { method: 'POST' });
    const portal = await stripe.billingPortal.sessions.create({ customer: customer.id });
    const page = await (await fetch(portal.url)).text();
    expect(page).toContain('Payment failed: EUR 49.00 is due');
    await fetch(`${fake.url}/_fake/events?wait=true`);
    receiver.received = [];

    const base = `${fake.url}/portal/${portal.id}/subscriptions/${subscription.id}`;
    expect((await fetch(`${base}/decline`, { method: 'POST', redirect: 'manual' })).status).toBe(303);
    await waitFor(() => eventsOfType('invoice.payment_failed')[0], 'payment_failed webhook');
    const retried = eventsOfType('invoice.payment_failed')[0].data.object as Stripe.Invoice;
    expect(retried.attempt_count).toBe(2);
    expect((await stripe.subscriptions.retrieve(subscription.id)).status).toBe('past_due');

    expect((await fetch(`${base}/pay`, { method: 'POST', redirect: 'manual' })).status).toBe(303);
    expect((await stripe.subscriptions.retrieve(subscription.id)).status).toBe('active');
    await waitFor(() => eventsOfType('customer.subscription.updated')[0], 'updated webhook');
    expect(eventsOfType('customer.subscription.updated')[0].data.previous_attributes).toMatchObject({ status: 'past_due' });
  });
});

describe('webhook delivery and reset', () => {
  it('retries a failed delivery and records the attempts', async () => {
    receiver.failNext = 2;
    await stripe.customers.create({ email: 'retry@demo.example' });
    const log = (await (await fetch(`${fake.url}/_fake/events?wait=true`)).json()) as {
      data: { type: string; delivery_status: string; attempts: { status: number }[] }[];
    };
    expect(log.data[0].type).toBe('customer.created');
    expect(log.data[0].delivery_status).toBe('delivered');
    expect(log.data[0].attempts.map((a) => a.status)).toEqual([500, 500, 200]);
    expect(receiver.types()).toEqual(['customer.created']);
  });

  it('gives up after the last retry and marks the event failed', async () => {
    receiver.failNext = 10;
    await stripe.customers.create({ email: 'down@demo.example' });
    const log = (await (await fetch(`${fake.url}/_fake/events?wait=true`)).json()) as {
      data: { delivery_status: string; attempts: unknown[] }[];
    };
    expect(log.data[0].delivery_status).toBe('failed');
    expect(log.data[0].attempts).toHaveLength(3);
  });

  it('resends an event with the same id', async () => {
    await stripe.customers.create({ email: 'twice@demo.example' });
    const first = await waitFor(() => receiver.received[0], 'first delivery');
    const id = verified(first).id;
    expect((await fetch(`${fake.url}/_fake/events/${id}/resend`, { method: 'POST' })).status).toBe(200);
    await waitFor(() => receiver.received.length === 2, 'second delivery');
    expect(verified(receiver.received[1]).id).toBe(id);
  });

  it('reset forgets every object, event and hosted page', async () => {
    const { crew } = await catalog();
    const { customer, session } = await subscribe(crew.id);
    const portal = await stripe.billingPortal.sessions.create({ customer: customer.id });
    await fetch(`${fake.url}/_fake/events?wait=true`);

    expect((await fetch(`${fake.url}/_fake/reset`, { method: 'POST' })).status).toBe(200);
    expect((await stripe.customers.list()).data).toHaveLength(0);
    expect((await stripe.prices.list()).data).toHaveLength(0);
    expect(await stripe.customers.retrieve(customer.id).catch((e: unknown) => e)).toMatchObject({ statusCode: 404 });
    expect(await stripe.checkout.sessions.retrieve(session.id).catch((e: unknown) => e)).toMatchObject({ statusCode: 404 });
    expect((await fetch(portal.url)).status).toBe(404);
    const health = (await (await fetch(`${fake.url}/_fake/health`)).json()) as { ok: boolean; counts: Record<string, number> };
    expect(health.ok).toBe(true);
    expect(Object.values(health.counts).every((n) => n === 0)).toBe(true);
  });
});

describe('server.ts entry point', () => {
  const entry = path.resolve(__dirname, '../../docker-local/stripe-fake/server.ts');
  const tsx = path.resolve(__dirname, '../../node_modules/tsx/dist/cli.mjs');

  function run(env: Record<string, string>) {
    const child = spawn(process.execPath, [tsx, entry], { env: { NODE_ENV: 'test', PATH: process.env.PATH ?? '', ...env }, stdio: ['ignore', 'pipe', 'pipe'] });
    let out = '';
    child.stdout.on('data', (c: Buffer) => (out += c.toString()));
    child.stderr.on('data', (c: Buffer) => (out += c.toString()));
    return { child, output: () => out };
  }

  it('refuses to start without a test-mode key or a webhook secret, saying which', async () => {
    // The reasons, from the settings reader the entry point uses.
    expect(() => readConfig({ STRIPE_WEBHOOK_SECRET: SECRET })).toThrow(ConfigError);
    expect(() => readConfig({ STRIPE_WEBHOOK_SECRET: SECRET })).toThrow(/STRIPE_SECRET_KEY is required/);
    expect(() => readConfig({ STRIPE_SECRET_KEY: 'sk_live_0123456789', STRIPE_WEBHOOK_SECRET: SECRET })).toThrow(/test-mode key/);
    expect(() => readConfig({ STRIPE_SECRET_KEY: KEY })).toThrow(/STRIPE_WEBHOOK_SECRET is required/);
    expect(readConfig({ STRIPE_SECRET_KEY: KEY, STRIPE_WEBHOOK_SECRET: SECRET }).secretKey).toBe(KEY);
    // And the process: exit code 1 with the one-line reason.
    const { child, output } = run({ STRIPE_FAKE_PORT: '0', STRIPE_SECRET_KEY: KEY });
    const [code] = (await once(child, 'exit')) as [number];
    expect(code).toBe(1);
    expect(output()).toContain('STRIPE_WEBHOOK_SECRET is required');
  }, 20_000);

  it('serves health, writes the pid file and stops cleanly on SIGTERM to that pid', async () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'stripe-fake-'));
    const pidFile = path.join(dir, 'fake.pid');
    const { child, output } = run({ STRIPE_SECRET_KEY: KEY, STRIPE_WEBHOOK_SECRET: SECRET, STRIPE_FAKE_PORT: '0', STRIPE_FAKE_PID_FILE: pidFile });
    try {
      const line = await waitFor(() => /listening on (http:\/\/127\.0\.0\.1:\d+)/.exec(output()), 'listening line', 15_000);
      const health = (await (await fetch(`${line[1]}/_fake/health`)).json()) as { ok: boolean; webhook_url: string | null };
      expect(health).toMatchObject({ ok: true, webhook_url: null });
      // The file names the process that serves (under tsx, the child tsx starts).
      const pid = Number(readFileSync(pidFile, 'utf8').trim());
      expect(Number.isInteger(pid) && pid > 0).toBe(true);
      process.kill(pid, 'SIGTERM');
      const [code] = (await once(child, 'exit')) as [number];
      expect(code).toBe(0);
      expect(existsSync(pidFile)).toBe(false);
      expect(await fetch(`${line[1]}/_fake/health`).then(() => 'up', () => 'down')).toBe('down');
    } finally {
      // On failure, stop the serving process too: killing only tsx would orphan it.
      if (existsSync(pidFile)) {
        try {
          process.kill(Number(readFileSync(pidFile, 'utf8').trim()), 'SIGKILL');
        } catch {
          // Already gone.
        }
      }
      if (child.exitCode === null) child.kill('SIGKILL');
    }
  }, 20_000);
});

describe('the payments fake the test services started, through the app\'s own client', () => {
  // docker-local/services.sh starts it with the test environment (.local/test.env), as npm test does.
  it('accepts the configured STRIPE_SECRET_KEY and nothing else, and refuses unknown parameters', async () => {
    const env = getEnv();
    expect((await getStripe().prices.list({ limit: 1 })).object).toBe('list');

    const unknown = await getStripe().customers.list({ emial: 'x@demo.example' } as Stripe.CustomerListParams).catch((e: unknown) => e);
    expect(unknown).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(unknown).toMatchObject({ statusCode: 400, code: 'parameter_unknown', param: 'emial' });
    expect(providerMessage(unknown)).toBe('The payment provider said: Received unknown parameter: emial');

    const stale = new Stripe(`${env.STRIPE_SECRET_KEY}_rotated`, stripeConfigFromEnv(env));
    const refused = await stale.customers.list().catch((e: unknown) => e);
    expect(refused).toBeInstanceOf(Stripe.errors.StripeAuthenticationError);
    expect(refused).toMatchObject({ statusCode: 401 });
    // What the app shows an admin for it (server/billing/stripe.ts).
    expect(providerMessage(refused)).toBe('The payment provider refused our API key (check STRIPE_SECRET_KEY).');
  });
});
