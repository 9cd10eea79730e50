// Per-IP throttling reads X-Forwarded-For only behind a trusted proxy: this file runs as if
// TRUST_PROXY were set (vitest isolates modules per file, so getEnv() is parsed afresh here).
process.env.TRUST_PROXY = 'true';
import { asSignedOut, callAction, setRequestHeaders } from './support/next-request';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { Op } from 'sequelize';
import { models } from '@/db/models';
import { closeSequelize } from '@/db/sequelize';
import { signIn, requestPasswordReset } from '@/server/actions/auth';
import { clientDigest, THROTTLE_RULES, UNLOCK_HINT } from '@/server/auth/throttle';
import { clientIpFrom } from '@/server/auth/request-meta';
import { createCompany, createUserWithRole, uniqueEmail, TEST_PASSWORD } from './support/factories';
import { attemptsTracker } from './support/throttle-cleanup';

const attempts = attemptsTracker();
afterAll(async () => {
  delete process.env.TRUST_PROXY;
  await attempts.forget();
  await closeSequelize();
});
beforeEach(() => asSignedOut());

// A fresh address for every call (a random start, then one up each time): two tests of this file
// drawing the same address at random would share a throttle bucket and fail each other.
let nextIp = Math.floor(Math.random() * 250);
const ip = () => `203.0.113.${(nextIp++ % 250) + 1}`;
const errorOf = (out: Awaited<ReturnType<typeof callAction>>) => (out.state && !out.state.ok ? out.state : null);
const PER_CLIENT = THROTTLE_RULES.sign_in.perClient!;

describe('sign-in throttle per address on one network (behind a trusted proxy the client is its IP)', () => {
  it(`locks an address on a network after ${PER_CLIENT.max} wrong passwords, even with the right one; the owner on another network is not locked out`, async () => {
    const user = await createUserWithRole((await createCompany()).id, 'admin');
    attempts.track(user.email);
    const network = ip();
    setRequestHeaders({ 'x-forwarded-for': network });
    for (let i = 0; i < PER_CLIENT.max; i++) {
      expect(errorOf(await callAction(signIn, { email: user.email, password: `wrong-${i}` }))?.code).toBe('invalid_input');
    }
    asSignedOut(); // even a fresh browser on that network: the network is the client
    const locked = errorOf(await callAction(signIn, { email: user.email, password: TEST_PASSWORD }));
    expect(locked?.code).toBe('rate_limited');
    expect(locked?.error).toBe(`Too many wrong passwords for this address from this browser. Try again in ${PER_CLIENT.windowMinutes} minutes.${UNLOCK_HINT}`);

    asSignedOut();
    setRequestHeaders({ 'x-forwarded-for': ip() }); // the owner, elsewhere
    expect((await callAction(signIn, { email: user.email, password: TEST_PASSWORD })).redirect).toBe('/dashboard');
  });

  it('counts only the window: once the oldest failures age out, that network works again', async () => {
    const user = await createUserWithRole((await createCompany()).id, 'installer');
    attempts.track(user.email);
    const { SignInAttempt } = models();
    const network = ip();
    const client = clientDigest('ip', network);
    // Five failures on this network: two 14 minutes ago, three now → locked for about one more minute.
    for (let i = 0; i < PER_CLIENT.max; i++) await SignInAttempt.create({ kind: 'sign_in', email: user.email, ip: network, client, succeeded: false });
    const rows = await SignInAttempt.findAll({ where: { email: user.email }, order: [['id', 'ASC']] });
    await SignInAttempt.update({ createdAt: new Date(Date.now() - (PER_CLIENT.windowMinutes - 1) * 60_000) }, { where: { id: [rows[0].id, rows[1].id] } });
    setRequestHeaders({ 'x-forwarded-for': network });
    expect(errorOf(await callAction(signIn, { email: user.email, password: TEST_PASSWORD }))?.error).toBe(`Too many wrong passwords for this address from this browser. Try again in 1 minute.${UNLOCK_HINT}`);
    // …and when they are older than the window, only three count.
    await SignInAttempt.update({ createdAt: new Date(Date.now() - (PER_CLIENT.windowMinutes + 1) * 60_000) }, { where: { id: [rows[0].id, rows[1].id] } });
    expect((await callAction(signIn, { email: user.email, password: TEST_PASSWORD })).redirect).toBe('/dashboard');
  });

  it('a correct password clears the failures of the network it came from, not those of others', async () => {
    const user = await createUserWithRole((await createCompany()).id, 'installer');
    attempts.track(user.email);
    const [here, there] = [ip(), ip()];
    setRequestHeaders({ 'x-forwarded-for': there });
    for (let i = 0; i < 2; i++) await callAction(signIn, { email: user.email, password: 'wrong-pass' });
    asSignedOut();
    setRequestHeaders({ 'x-forwarded-for': here });
    for (let i = 0; i < 4; i++) await callAction(signIn, { email: user.email, password: 'wrong-pass' });
    expect((await callAction(signIn, { email: user.email, password: TEST_PASSWORD })).redirect).toBe('/dashboard');
    const failures = (client: string) => models().SignInAttempt.count({ where: { email: user.email, client, succeeded: false } });
    expect(await failures(clientDigest('ip', here))).toBe(0);
    expect(await failures(clientDigest('ip', there))).toBe(2);
  });

  it('throttles unknown addresses exactly like known ones, with the same words (no hint that an account exists)', async () => {
    const known = await createUserWithRole((await createCompany()).id, 'sales');
    attempts.track(known.email);
    const answers: string[] = [];
    for (const email of [attempts.track(uniqueEmail('nobody')), known.email]) {
      asSignedOut();
      setRequestHeaders({ 'x-forwarded-for': ip() });
      for (let i = 0; i < PER_CLIENT.max; i++) await callAction(signIn, { email, password: 'guess' });
      const out = errorOf(await callAction(signIn, { email, password: 'guess' }));
      expect(out?.code).toBe('rate_limited');
      answers.push(out!.error);
    }
    expect(answers[0]).toBe(answers[1]);
  });
});

describe('sign-in throttle per IP', () => {
  it(`locks an IP after ${THROTTLE_RULES.sign_in.perIp!.max} failures across many addresses, for browsers not trusted there`, async () => {
    const address = ip();
    setRequestHeaders({ 'x-forwarded-for': `10.9.9.9, ${address}` });
    const { SignInAttempt } = models();
    const max = THROTTLE_RULES.sign_in.perIp!.max;
    await SignInAttempt.bulkCreate(Array.from({ length: max - 1 }, (_, i) => ({ kind: 'sign_in' as const, email: `spray-${i}-${address}@test.example`, ip: address, succeeded: false })));
    expect(errorOf(await callAction(signIn, { email: attempts.track(uniqueEmail('spray')), password: 'guess' }))?.code).toBe('invalid_input');
    const user = await createUserWithRole((await createCompany()).id, 'sales');
    attempts.track(user.email);
    asSignedOut();
    expect(errorOf(await callAction(signIn, { email: user.email, password: TEST_PASSWORD }))?.code).toBe('rate_limited');

    // The same person on another network is fine, and that browser is trusted from then on…
    asSignedOut();
    setRequestHeaders({ 'x-forwarded-for': ip() });
    expect((await callAction(signIn, { email: user.email, password: TEST_PASSWORD })).redirect).toBe('/dashboard');
    // …so back on the spent network it is let through (a colleague's spraying cannot lock it out).
    setRequestHeaders({ 'x-forwarded-for': address });
    expect((await callAction(signIn, { email: user.email, password: TEST_PASSWORD })).redirect).toBe('/dashboard');
    await SignInAttempt.destroy({ where: { ip: address, email: { [Op.like]: 'spray-%' } } });
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
    attempts.track(user.email);
    setRequestHeaders({ 'x-forwarded-for': ip() });
    for (let i = 0; i < 3; i++) expect((await callAction(requestPasswordReset, { email: user.email })).state?.ok).toBe(true);
    const out = errorOf(await callAction(requestPasswordReset, { email: user.email }));
    expect(out?.code).toBe('rate_limited');
    expect(out?.error).toBe('Too many reset requests. Try again in 60 minutes.');
  });
});
