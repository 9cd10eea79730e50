// Per-IP throttling reads X-Forwarded-For only behind a trusted proxy: this file runs as if
// TRUST_PROXY were set (vitest isolates modules per file, so getEnv() is parsed afresh here).
process.env.TRUST_PROXY = 'true';
import { asSignedOut, callAction, setRequestHeaders } from './support/next-request';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { models } from '@/db/models';
import { closeSequelize } from '@/db/sequelize';
import { signIn, requestPasswordReset } from '@/server/actions/auth';
import { THROTTLE_RULES } from '@/server/auth/throttle';
import { clientIpFrom } from '@/server/auth/request-meta';
import { createCompany, createUserWithRole, uniqueEmail, TEST_PASSWORD } from './support/factories';

afterAll(async () => {
  delete process.env.TRUST_PROXY;
  await closeSequelize();
});
beforeEach(() => asSignedOut());

// A fresh address for every call (a random start, then one up each time): two tests of this file
// drawing the same address at random would share a throttle bucket and fail each other.
let nextIp = Math.floor(Math.random() * 250);
const ip = () => `203.0.113.${(nextIp++ % 250) + 1}`;
const errorOf = (out: Awaited<ReturnType<typeof callAction>>) => (out.state && !out.state.ok ? out.state : null);

describe('sign-in throttle per address', () => {
  it(`locks an address after ${THROTTLE_RULES.sign_in.perEmail!.max} wrong passwords, even with the right one, and says for how long`, async () => {
    const user = await createUserWithRole((await createCompany()).id, 'installer');
    setRequestHeaders({ 'x-forwarded-for': ip() });
    for (let i = 0; i < THROTTLE_RULES.sign_in.perEmail!.max; i++) {
      expect(errorOf(await callAction(signIn, { email: user.email, password: `wrong-${i}` }))?.code).toBe('invalid_input');
    }
    setRequestHeaders({ 'x-forwarded-for': ip() }); // another network: the address itself is locked
    const locked = errorOf(await callAction(signIn, { email: user.email, password: TEST_PASSWORD }));
    expect(locked?.code).toBe('rate_limited');
    expect(locked?.error).toMatch(/^Too many sign-in attempts\. Try again in 15 minutes\.$/);
  });

  it('counts only the window: once the oldest failures age out, the address works again', async () => {
    const user = await createUserWithRole((await createCompany()).id, 'installer');
    const { SignInAttempt } = models();
    const window = THROTTLE_RULES.sign_in.perEmail!.windowMinutes;
    // Five failures: two 14 minutes ago, three now → locked for about one more minute.
    for (let i = 0; i < 5; i++) await SignInAttempt.create({ kind: 'sign_in', email: user.email, ip: null, succeeded: false });
    const rows = await SignInAttempt.findAll({ where: { email: user.email }, order: [['id', 'ASC']] });
    await SignInAttempt.update({ createdAt: new Date(Date.now() - (window - 1) * 60_000) }, { where: { id: [rows[0].id, rows[1].id] } });
    setRequestHeaders({ 'x-forwarded-for': ip() });
    expect(errorOf(await callAction(signIn, { email: user.email, password: TEST_PASSWORD }))?.error).toBe('Too many sign-in attempts. Try again in 1 minute.');
    // …and when they are older than the window, only three count.
    await SignInAttempt.update({ createdAt: new Date(Date.now() - (window + 1) * 60_000) }, { where: { id: [rows[0].id, rows[1].id] } });
    expect((await callAction(signIn, { email: user.email, password: TEST_PASSWORD })).redirect).toBe('/dashboard');
  });

  it('a correct password clears the address’s earlier failures', async () => {
    const user = await createUserWithRole((await createCompany()).id, 'installer');
    setRequestHeaders({ 'x-forwarded-for': ip() });
    for (let i = 0; i < 4; i++) await callAction(signIn, { email: user.email, password: 'wrong-pass' });
    expect((await callAction(signIn, { email: user.email, password: TEST_PASSWORD })).redirect).toBe('/dashboard');
    expect(await models().SignInAttempt.count({ where: { email: user.email, succeeded: false } })).toBe(0);
  });

  it('throttles unknown addresses exactly like known ones (no hint that an account exists)', async () => {
    const nobody = uniqueEmail('nobody');
    setRequestHeaders({ 'x-forwarded-for': ip() });
    for (let i = 0; i < 5; i++) await callAction(signIn, { email: nobody, password: 'guess' });
    expect(errorOf(await callAction(signIn, { email: nobody, password: 'guess' }))?.code).toBe('rate_limited');
  });
});

describe('sign-in throttle per IP', () => {
  it(`locks an IP after ${THROTTLE_RULES.sign_in.perIp!.max} failures across many addresses`, async () => {
    const address = ip();
    setRequestHeaders({ 'x-forwarded-for': `10.9.9.9, ${address}` });
    const { SignInAttempt } = models();
    const max = THROTTLE_RULES.sign_in.perIp!.max;
    await SignInAttempt.bulkCreate(Array.from({ length: max - 1 }, (_, i) => ({ kind: 'sign_in' as const, email: `spray-${i}@test.example`, ip: address, succeeded: false })));
    expect(errorOf(await callAction(signIn, { email: uniqueEmail('spray'), password: 'guess' }))?.code).toBe('invalid_input');
    const user = await createUserWithRole((await createCompany()).id, 'sales');
    expect(errorOf(await callAction(signIn, { email: user.email, password: TEST_PASSWORD }))?.code).toBe('rate_limited');
    // Another IP with the same person is fine: the per-IP lock is only for that network.
    setRequestHeaders({ 'x-forwarded-for': ip() });
    expect((await callAction(signIn, { email: user.email, password: TEST_PASSWORD })).redirect).toBe('/dashboard');
  });

  it('takes the address our proxy appended (the last entry), not what the client wrote first', () => {
    const h = new Headers({ 'x-forwarded-for': '1.2.3.4, 198.51.100.77' });
    expect(clientIpFrom(h, true)).toBe('198.51.100.77');
    expect(clientIpFrom(h, false)).toBeNull();
  });
});

describe('reset request throttle', () => {
  it('allows three reset mails per address an hour, then says when to come back', async () => {
    const user = await createUserWithRole((await createCompany()).id, 'installer');
    setRequestHeaders({ 'x-forwarded-for': ip() });
    for (let i = 0; i < 3; i++) expect((await callAction(requestPasswordReset, { email: user.email })).state?.ok).toBe(true);
    const out = errorOf(await callAction(requestPasswordReset, { email: user.email }));
    expect(out?.code).toBe('rate_limited');
    expect(out?.error).toBe('Too many reset requests. Try again in 60 minutes.');
  });
});
