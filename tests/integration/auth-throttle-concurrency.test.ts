import { asSignedOut, callAction, inRequest, setRequestHeaders } from './support/next-request';
import { afterAll, beforeEach, describe, expect, it, vi } from 'vitest';

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
import { createCompany, createUserWithRole, uniqueEmail, TEST_PASSWORD } from './support/factories';

afterAll(closeSequelize);
beforeEach(() => {
  asSignedOut();
  setRequestHeaders({});
  verifyCalls.n = 0;
});

const MAX = THROTTLE_RULES.sign_in.perEmail!.max;
const codeOf = (o: Awaited<ReturnType<typeof callAction>>) => (o.state && !o.state.ok ? o.state.code : o.redirect ? 'signed_in' : 'ok');

// Default configuration (TRUST_PROXY unset): the client IP is unknown, so the address limit is
// the only thing between a burst of guesses and the password.
describe('sign-in throttle under a burst of parallel guesses', () => {
  it(`20 wrong passwords at once for one address: only ${MAX} are checked, the rest are refused, and then the right one waits too`, async () => {
    const user = await createUserWithRole((await createCompany()).id, 'installer');
    const outcomes = await Promise.all(Array.from({ length: 20 }, (_, i) => inRequest(null, () => callAction(signIn, { email: user.email, password: `wrong-guess-${i}` }))));
    const codes = outcomes.map(codeOf);

    // Claims are serialised per address, so exactly the limit get through (the brief's bar is "at most").
    expect(verifyCalls.n).toBe(MAX);
    expect(codes.filter((c) => c === 'invalid_input').length).toBe(verifyCalls.n);
    expect(codes.filter((c) => c === 'rate_limited').length).toBe(20 - verifyCalls.n);
    expect(await models().SignInAttempt.count({ where: { kind: 'sign_in', email: user.email, succeeded: false } })).toBe(MAX);

    verifyCalls.n = 0;
    const locked = await callAction(signIn, { email: user.email, password: TEST_PASSWORD });
    expect(locked.state).toMatchObject({ ok: false, code: 'rate_limited', error: expect.stringMatching(/^Too many sign-in attempts\. Try again in \d+ minutes?\.$/) });
    expect(verifyCalls.n).toBe(0);
  });

  it('an address without an account answers a burst the same way (no hint that an account exists)', async () => {
    const nobody = uniqueEmail('nobody');
    const outcomes = await Promise.all(Array.from({ length: 20 }, (_, i) => inRequest(null, () => callAction(signIn, { email: nobody, password: `guess-${i}` }))));
    const codes = outcomes.map(codeOf);
    expect(verifyCalls.n).toBe(MAX);
    expect(codes.filter((c) => c === 'invalid_input').length).toBe(MAX);
    expect(codes.filter((c) => c === 'rate_limited').length).toBe(20 - MAX);
    expect((await callAction(signIn, { email: nobody, password: 'one-more' })).state).toMatchObject({ code: 'rate_limited' });
  });
});
