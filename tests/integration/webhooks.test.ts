import { asSignedOut, asUser, callAction, inRequest } from './support/next-request';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import http from 'node:http';
import { lookup } from 'node:dns/promises';
import { hostname } from 'node:os';
import type { AddressInfo } from 'node:net';
import { QueryTypes } from 'sequelize';
import { models } from '@/db/models';
import { closeSequelize } from '@/db/sequelize';
import * as webhookActions from '@/server/actions/webhooks';
import * as studyActions from '@/server/actions/studies';
import { decideQuote } from '@/server/actions/customer-decision';
import { openSharedPage } from '@/server/quotes/shared-quote';
import { deliverDueWebhooks, retryDelayMs } from '@/server/webhooks/deliverer';
import { enqueueWebhookEvent } from '@/server/webhooks/outbox';
import { safePost } from '@/server/webhooks/safe-post';
import { SIGNATURE_HEADER, verifySignature } from '@/server/webhooks/signature';
import { listRecentDeliveries } from '@/db/queries/webhooks';
import { createCompany, createUserWithRole, signInAs, type TestCompany, type TestUser } from './support/factories';
import { createStudyWorld, type StudyWorld } from './studies-fixtures';
import { sentQuote } from './quotes-fixtures';

/**
 * Outbound webhooks end to end against real receivers (node http servers on 127.0.0.1; the test
 * profile sets WEBHOOKS_ALLOW_PRIVATE_TARGETS, the refusal tests pass allowPrivate: false). Every
 * delivery pass names its endpoint, so parallel test files never deliver each other's rows, and
 * every endpoint has its own path on the receiver. The test profile's app runs no delivery timer
 * (WEBHOOK_DELIVERY_INTERVAL_MS=0), which would otherwise claim these rows first.
 */
type Received = { path: string; headers: http.IncomingHttpHeaders; body: string };

function receiver(answer: (req: http.IncomingMessage, n: number) => { status: number; headers?: Record<string, string> }) {
  const got: Received[] = [];
  const server = http.createServer((req, res) => {
    let body = '';
    req.on('data', (c) => (body += c));
    req.on('end', () => {
      got.push({ path: req.url ?? '', headers: req.headers, body });
      const a = answer(req, got.length);
      res.writeHead(a.status, a.headers).end('ok');
    });
  });
  return {
    got,
    server,
    start: () => new Promise<string>((resolve) => server.listen(0, '127.0.0.1', () => resolve(`http://127.0.0.1:${(server.address() as AddressInfo).port}`))),
    stop: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

let company: TestCompany;
let admin: TestUser;
let installer: TestUser;
let world: StudyWorld;
let other: TestCompany;
let otherAdmin: TestUser;

const main = receiver((req) => (req.url?.startsWith('/flaky') ? { status: 500 } : req.url === '/redirect' ? { status: 302, headers: { Location: `${stolenBase}/stolen` } } : { status: 200 }));
const elsewhere = receiver(() => ({ status: 200 }));
let base: string;
let stolenBase: string;

beforeAll(async () => {
  base = await main.start();
  stolenBase = await elsewhere.start();
  company = await createCompany({ planCode: 'fleet' });
  admin = await createUserWithRole(company.id, 'admin');
  installer = await createUserWithRole(company.id, 'installer');
  world = await createStudyWorld(company.id);
  other = await createCompany({ planCode: 'fleet' });
  otherAdmin = await createUserWithRole(other.id, 'admin');
});
afterAll(async () => {
  await Promise.all([main.stop(), elsewhere.stop()]);
  await closeSequelize();
});
beforeEach(() => asSignedOut());

async function register(user: TestUser, path: string, events: string[] = ['quote.viewed', 'quote.accepted', 'quote.declined', 'study.created']): Promise<{ id: number; secret: string }> {
  asUser(await signInAs(user));
  const res = await callAction(webhookActions.createWebhookEndpoint, { url: `${base}${path}`, description: `Receiver ${path}`, events });
  expect(res.state?.ok, JSON.stringify(res.state)).toBe(true);
  const secret = (res.state as { data: { signingSecret: string } }).data.signingSecret;
  const [row] = await models().sequelize.query<{ id: number }>('SELECT id FROM webhook_endpoints WHERE company_id = :c AND url = :u ORDER BY id DESC LIMIT 1', {
    replacements: { c: user.companyId, u: `${base}${path}` }, type: QueryTypes.SELECT,
  });
  asSignedOut();
  return { id: row.id, secret };
}

type DeliveryDb = { id: number; event_id: string; event_type: string; status: string; attempt_count: number; next_attempt_at: Date | null; last_response_code: number | null; last_error: string | null; body: string };
const deliveriesOf = (endpointId: number) =>
  models().sequelize.query<DeliveryDb>('SELECT * FROM webhook_deliveries WHERE endpoint_id = :endpointId ORDER BY id', { replacements: { endpointId }, type: QueryTypes.SELECT });

const newStudy = () => ({ customerId: String(world.customerId), siteId: String(world.siteId), serviceProfileId: String(world.serviceId), climateProfileId: String(world.climateId), dishIds: world.dishIds.join(','), targetAvailabilityPercent: '99.9' });

describe('registering', () => {
  it('shows the signing secret once and stores it only encrypted', async () => {
    const { id, secret } = await register(admin, '/registered');
    expect(secret).toMatch(/^flwh_[A-Za-z0-9_-]{43}$/);
    const [row] = await models().sequelize.query<Record<string, string>>('SELECT * FROM webhook_endpoints WHERE id = :id', { replacements: { id }, type: QueryTypes.SELECT });
    expect(JSON.stringify(row)).not.toContain(secret.slice(5));
    expect(row.secret_ciphertext).toMatch(/^v1\./);
  });

  it('refuses a plan without API access, and an address that is not a URL', async () => {
    const crewAdmin = await createUserWithRole((await createCompany({ planCode: 'crew' })).id, 'admin');
    asUser(await signInAs(crewAdmin));
    const refused = await callAction(webhookActions.createWebhookEndpoint, { url: `${base}/crew`, description: 'Crew', events: ['study.created'] });
    expect(refused.state).toMatchObject({ ok: false, code: 'plan_limit' });
    asUser(await signInAs(admin));
    const bad = await callAction(webhookActions.createWebhookEndpoint, { url: 'not a url', description: 'Bad', events: ['study.created'] });
    expect(bad.state).toMatchObject({ ok: false });
    expect((bad.state as { fieldErrors: Record<string, string[]> }).fieldErrors.url?.[0]).toMatch(/full address/);
  });
});

describe('the outbox and signed delivery', () => {
  it('queues study.created in the study’s transaction and delivers it with the documented signature', async () => {
    const { id, secret } = await register(admin, '/studies');
    asUser(await signInAs(installer));
    const made = await callAction(studyActions.createStudy, newStudy());
    expect(made.state?.ok, JSON.stringify(made.state)).toBe(true);
    const [queued] = await deliveriesOf(id);
    expect(queued).toMatchObject({ event_type: 'study.created', status: 'pending', attempt_count: 0 });

    const before = main.got.length;
    const run = await deliverDueWebhooks({ endpointId: id });
    expect(run).toMatchObject({ attempted: 1, delivered: 1 });
    const got = main.got.slice(before).filter((g) => g.path === '/studies');
    expect(got).toHaveLength(1);
    const sig = got[0].headers[SIGNATURE_HEADER.toLowerCase()] as string;
    expect(sig).toMatch(/^t=\d+,v1=[0-9a-f]{64}$/);
    expect(verifySignature(secret, sig, got[0].body)).toBe(true);
    // The same header does not pass with another secret, a changed body or an old timestamp.
    expect(verifySignature(secret.replace(/.$/, (c) => (c === 'A' ? 'B' : 'A')), sig, got[0].body)).toBe(false);
    expect(verifySignature(secret, sig, got[0].body.replace('study.created', 'study.createe'))).toBe(false);
    expect(verifySignature(secret, sig, got[0].body, Math.floor(Date.now() / 1000) + 3600)).toBe(false);
    const body = JSON.parse(got[0].body);
    expect(body).toMatchObject({ type: 'study.created', company: { id: company.id }, id: queued.event_id });
    expect(body.data.study.id).toBe(Number((await models().Study.max('id', { where: { companyId: company.id } })) ?? 0));
    expect(got[0].headers['fadeledger-event-id']).toBe(queued.event_id);

    const [after] = await deliveriesOf(id);
    expect(after).toMatchObject({ status: 'delivered', attempt_count: 1, last_response_code: 200, next_attempt_at: null, last_error: null });
  });

  it('writes nothing when the change rolls back', async () => {
    const { id } = await register(admin, '/rollback');
    const { sequelize } = models();
    let eventId = '';
    await expect(
      sequelize.transaction(async (t) => {
        eventId = (await enqueueWebhookEvent(company.id, 'study.created', { study: { id: 0 } }, t)).eventId;
        const inside = await sequelize.query('SELECT id FROM webhook_deliveries WHERE event_id = :eventId', { replacements: { eventId }, type: QueryTypes.SELECT, transaction: t });
        expect(inside.length).toBeGreaterThan(0);
        throw new Error('the change failed');
      }),
    ).rejects.toThrow('the change failed');
    const rows = await sequelize.query('SELECT id FROM webhook_deliveries WHERE event_id = :eventId', { replacements: { eventId }, type: QueryTypes.SELECT });
    expect(rows).toEqual([]);
    expect(await deliveriesOf(id)).toEqual([]);
  });

  it('quote viewed and accepted are queued with the quote’s change; a refused second decision queues nothing', async () => {
    const { id } = await register(admin, '/quotes', ['quote.viewed', 'quote.accepted']);
    const { token } = await sentQuote(installer);
    const person = new Headers({ 'user-agent': 'Mozilla/5.0 (X11; Linux x86_64) vitest' });
    await openSharedPage(token, person, { ip: '203.0.113.9', userAgent: 'vitest' });
    await openSharedPage(token, person, { ip: '203.0.113.9', userAgent: 'vitest' });
    const decided = await inRequest(null, () => callAction(decideQuote, { token, decision: 'accept', name: 'Ottoline Marsh', comment: 'Go ahead', confirm: 'on' }));
    expect(decided.state?.ok, JSON.stringify(decided.state)).toBe(true);
    const again = await inRequest(null, () => callAction(decideQuote, { token, decision: 'decline', name: 'Ottoline Marsh', comment: '' }));
    expect(again.state?.ok).toBe(false);
    const rows = await deliveriesOf(id);
    expect(rows.map((r) => r.event_type)).toEqual(['quote.viewed', 'quote.accepted']);
    expect(JSON.parse(rows[1].body).data).toMatchObject({ quote: { status: 'accepted' }, decision: { by: 'Ottoline Marsh', comment: 'Go ahead' } });
  });
});

describe('retries and refusals', () => {
  it('retries after a 500 with backoff, and delivers on a later attempt', async () => {
    const { id } = await register(admin, '/flaky');
    await models().sequelize.transaction((t) => enqueueWebhookEvent(company.id, 'study.created', { study: { id: 1 } }, t, { onlyEndpointId: id }));
    const now = new Date();
    const first = await deliverDueWebhooks({ endpointId: id, now });
    expect(first).toMatchObject({ attempted: 1, failed: 1 });
    let [row] = await deliveriesOf(id);
    expect(row).toMatchObject({ status: 'pending', attempt_count: 1, last_response_code: 500 });
    expect(row.last_error).toMatch(/500/);
    expect(new Date(row.next_attempt_at!).getTime()).toBe(now.getTime() + retryDelayMs(1));
    // Not due yet: nothing is claimed.
    expect(await deliverDueWebhooks({ endpointId: id, now: new Date(now.getTime() + 10_000) })).toMatchObject({ attempted: 0 });

    // The receiver recovers (the path now answers 200) and the due retry gets through.
    await models().sequelize.query('UPDATE webhook_endpoints SET url = :url WHERE id = :id', { replacements: { url: `${base}/recovered`, id }, type: QueryTypes.UPDATE });
    const second = await deliverDueWebhooks({ endpointId: id, now: new Date(now.getTime() + retryDelayMs(1) + 1) });
    expect(second).toMatchObject({ attempted: 1, delivered: 1 });
    [row] = await deliveriesOf(id);
    expect(row).toMatchObject({ status: 'delivered', attempt_count: 2, last_response_code: 200 });
    const attempts = main.got.filter((g) => g.headers['fadeledger-event-id'] === row.event_id);
    expect(attempts.map((a) => [a.path, a.headers['fadeledger-attempt']])).toEqual([['/flaky', '1'], ['/recovered', '2']]);
    expect(retryDelayMs(2)).toBe(2 * retryDelayMs(1));
  });

  it('never follows a redirect: a 3xx is a failed attempt and the other host gets nothing', async () => {
    const { id } = await register(admin, '/redirect');
    await models().sequelize.transaction((t) => enqueueWebhookEvent(company.id, 'webhook.test', { n: 1 }, t, { onlyEndpointId: id }));
    const run = await deliverDueWebhooks({ endpointId: id });
    expect(run).toMatchObject({ attempted: 1, failed: 1 });
    const [row] = await deliveriesOf(id);
    expect(row).toMatchObject({ status: 'pending', last_response_code: 302 });
    expect(row.last_error).toMatch(/redirect.*not followed/);
    expect(elsewhere.got).toEqual([]);
  });

  it('refuses private and loopback addresses (by address and after DNS) unless allowed, before connecting', async () => {
    const { id } = await register(admin, '/private');
    await models().sequelize.transaction((t) => enqueueWebhookEvent(company.id, 'webhook.test', { n: 2 }, t, { onlyEndpointId: id }));
    const before = main.got.length;
    const run = await deliverDueWebhooks({ endpointId: id, allowPrivate: false });
    expect(run).toMatchObject({ attempted: 1, failed: 1 });
    const [row] = await deliveriesOf(id);
    expect(row.last_error).toMatch(/https|private|loopback/);
    expect(main.got.slice(before).filter((g) => g.path === '/private')).toEqual([]);

    const port = new URL(base).port;
    expect((await safePost(`https://127.0.0.1:${port}/x`, '{}', {}, { allowPrivate: false })).error).toMatch(/private, loopback or link-local/);
    expect((await safePost(`https://169.254.169.254/latest`, '{}', {}, { allowPrivate: false })).error).toMatch(/private, loopback or link-local/);
    expect((await safePost(`https://[::ffff:10.0.0.1]/x`, '{}', {}, { allowPrivate: false })).error).toMatch(/private, loopback or link-local/);
    expect((await safePost(`${base}/x`, '{}', {}, { allowPrivate: false })).error).toMatch(/https/);
    // A name that resolves to a loopback address (this machine's own name, from /etc/hosts) is refused after the lookup.
    const own = hostname();
    const resolved = await lookup(own);
    expect(resolved.address).toMatch(/^127\.|^::1$/);
    const byName = await safePost(`https://${own}:${port}/x`, '{}', {}, { allowPrivate: false });
    expect(byName.error).toContain(`resolves to ${resolved.address}`);
    expect(main.got.slice(before).filter((g) => g.path === '/x')).toEqual([]);
  });
});

describe('many deliverers at once', () => {
  it('claims each due delivery once (SKIP LOCKED), whatever the number of deliverers', async () => {
    const { id } = await register(admin, '/parallel');
    for (let i = 0; i < 6; i++) await models().sequelize.transaction((t) => enqueueWebhookEvent(company.id, 'webhook.test', { i }, t, { onlyEndpointId: id }));
    const before = main.got.length;
    const runs = await Promise.all([0, 1, 2, 3].map(() => deliverDueWebhooks({ endpointId: id, limit: 3 })));
    const delivered = runs.reduce((n, r) => n + r.delivered, 0);
    // Whatever was not claimed by the first wave is still due, never lost.
    const rest = await deliverDueWebhooks({ endpointId: id, limit: 10 });
    expect(delivered + rest.delivered).toBe(6);
    const ids = main.got.slice(before).filter((g) => g.path === '/parallel').map((g) => g.headers['fadeledger-event-id']);
    expect(ids).toHaveLength(6);
    expect(new Set(ids).size).toBe(6);
    expect((await deliveriesOf(id)).every((r) => r.status === 'delivered' && r.attempt_count === 1)).toBe(true);
  });
});

describe('companies stay apart', () => {
  it('an event of one company reaches only its own endpoints, and each log lists its own rows', async () => {
    const mine = await register(admin, '/mine', ['study.created']);
    const theirs = await register(otherAdmin, '/theirs', ['study.created']);
    asUser(await signInAs(installer));
    expect((await callAction(studyActions.createStudy, newStudy())).state?.ok).toBe(true);
    expect((await deliveriesOf(mine.id)).length).toBe(1);
    expect(await deliveriesOf(theirs.id)).toEqual([]);
    const otherLog = await listRecentDeliveries(other.id);
    expect(otherLog.every((d) => d.endpointId === theirs.id)).toBe(true);
    expect((await listRecentDeliveries(company.id)).some((d) => d.endpointId === theirs.id)).toBe(false);
  });
});

describe('send test event', () => {
  it('delivers a webhook.test to that endpoint at once and says so', async () => {
    const { id, secret } = await register(admin, '/test-button');
    asUser(await signInAs(admin));
    const before = main.got.length;
    const res = await callAction(webhookActions.sendTestWebhook, { id: String(id) });
    expect(res.state).toMatchObject({ ok: true, message: expect.stringMatching(/delivered/) });
    const got = main.got.slice(before).filter((g) => g.path === '/test-button');
    expect(got).toHaveLength(1);
    expect(JSON.parse(got[0].body).type).toBe('webhook.test');
    expect(verifySignature(secret, got[0].headers['fadeledger-signature'] as string, got[0].body)).toBe(true);
    expect(res.state).not.toHaveProperty('tone');
  });

  it('says a first attempt that failed as a warning, not as success', async () => {
    // The other company: the first has used its endpoint allowance in the tests above.
    const { id } = await register(otherAdmin, '/flaky-test-event');
    asUser(await signInAs(otherAdmin));
    const res = await callAction(webhookActions.sendTestWebhook, { id: String(id) });
    expect(res.state).toMatchObject({ ok: true, tone: 'warning', message: expect.stringMatching(/did not succeed/) });
    // Its pending retry goes with it, so no later run of this file meets it.
    expect((await callAction(webhookActions.removeWebhookEndpoint, { id: String(id) })).state?.ok).toBe(true);
  });
});
