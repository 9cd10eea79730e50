import { asSignedOut, callAction, inRequest, setRequestHeaders } from './support/next-request';
import { afterAll, beforeEach, describe, expect, it, vi } from 'vitest';
import { cookies } from 'next/headers';

// Counts how many guesses actually reach argon2 (the real verify still runs).
const verifyCalls = vi.hoisted(() => ({ n: 0 }));
vi.mock('@/server/auth/password', async (importOriginal) => {
  const real = await importOriginal<typeof import('@/server/auth/password')>();
  return {
    ...real,
    verifyPassword: async (hash: string, password: string) => {
      verifyCalls.n++;
      return real.verifyPassword(hash, password);
    },
  };
});

import { models } from '@/db/models';
import { closeSequelize } from '@/db/sequelize';
import { signIn } from '@/server/actions/auth';
import { THROTTLE_RULES } from '@/server/auth/throttle';
import { CLIENT_COOKIE } from '@/server/auth/sign-in-client';
import { createCompany, createUserWithRole, uniqueEmail, TEST_PASSWORD } from './support/factories';
import { attemptsTracker } from './support/throttle-cleanup';

const attempts = attemptsTracker();
afterAll(async () => {
  await attempts.forget();
  await closeSequelize();
});
beforeEach(() => {
  asSignedOut();
  setRequestHeaders({});
  verifyCalls.n = 0;
});

const PER_EMAIL = THROTTLE_RULES.sign_in.perEmail!.max;
const PER_CLIENT = THROTTLE_RULES.sign_in.perClient!.max;
const codeOf = (o: Awaited<ReturnType<typeof callAction>>) => (o.state && !o.state.ok ? o.state.code : o.redirect ? 'signed_in' : 'ok');

/** Runs the action as its own request from a browser holding this client cookie (null: a script that keeps none). */
const fromBrowser = <T,>(clientCookie: string | null, fn: () => Promise<T>) =>
  inRequest(null, async () => {
    if (clientCookie) (await cookies()).set(CLIENT_COOKIE, clientCookie);
    return fn();
  });

// Default configuration (TRUST_PROXY unset): the client IP is unknown. A script that drops the
// client cookie is a new client every time, so the per-address budget is what stands between a
// burst of guesses and the password — and it must not stand in the owner's way.
describe('sign-in throttle under a burst of parallel guesses', () => {
  it(`20 wrong passwords at once from cookie-less clients: only ${PER_EMAIL} are checked, the rest refused; the owner's own browser still signs in`, async () => {
    const user = await createUserWithRole((await createCompany()).id, 'admin');
    attempts.track(user.email);
    const ownersBrowser = 'o'.repeat(43);
    expect((await fromBrowser(ownersBrowser, () => callAction(signIn, { email: user.email, password: TEST_PASSWORD }))).redirect).toBe('/dashboard');
    verifyCalls.n = 0;

    const outcomes = await Promise.all(Array.from({ length: 20 }, (_, i) => fromBrowser(null, () => callAction(signIn, { email: user.email, password: `wrong-guess-${i}` }))));
    const codes = outcomes.map(codeOf);
    // Claims are serialised per address, so exactly the limit get through.
    expect(verifyCalls.n).toBe(PER_EMAIL);
    expect(codes.filter((c) => c === 'invalid_input').length).toBe(PER_EMAIL);
    expect(codes.filter((c) => c === 'rate_limited').length).toBe(20 - PER_EMAIL);
    expect(await models().SignInAttempt.count({ where: { kind: 'sign_in', email: user.email, succeeded: false } })).toBe(PER_EMAIL);

    // A stranger's next try — right password or not — waits without reaching argon2…
    verifyCalls.n = 0;
    expect(codeOf(await fromBrowser(null, () => callAction(signIn, { email: user.email, password: TEST_PASSWORD })))).toBe('rate_limited');
    expect(verifyCalls.n).toBe(0);
    // …while the owner's browser is let through.
    expect((await fromBrowser(ownersBrowser, () => callAction(signIn, { email: user.email, password: TEST_PASSWORD }))).redirect).toBe('/dashboard');
  });

  it(`20 wrong passwords at once from one browser: only ${PER_CLIENT} are checked`, async () => {
    const user = await createUserWithRole((await createCompany()).id, 'installer');
    attempts.track(user.email);
    const browser = 'b'.repeat(42) + 'x';
    const outcomes = await Promise.all(Array.from({ length: 20 }, (_, i) => fromBrowser(browser, () => callAction(signIn, { email: user.email, password: `wrong-guess-${i}` }))));
    expect(verifyCalls.n).toBe(PER_CLIENT);
    expect(outcomes.map(codeOf).filter((c) => c === 'rate_limited').length).toBe(20 - PER_CLIENT);
  });

  it('an address without an account answers a burst the same way (no hint that an account exists)', async () => {
    const nobody = attempts.track(uniqueEmail('nobody'));
    const outcomes = await Promise.all(Array.from({ length: 20 }, (_, i) => fromBrowser(null, () => callAction(signIn, { email: nobody, password: `guess-${i}` }))));
    const codes = outcomes.map(codeOf);
    expect(verifyCalls.n).toBe(PER_EMAIL);
    expect(codes.filter((c) => c === 'invalid_input').length).toBe(PER_EMAIL);
    expect(codes.filter((c) => c === 'rate_limited').length).toBe(20 - PER_EMAIL);
    expect((await callAction(signIn, { email: nobody, password: 'one-more' })).state).toMatchObject({ code: 'rate_limited' });
  });
});
