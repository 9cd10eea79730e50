import { asSignedOut, asUser, callAction, setRequestHeaders } from './support/next-request';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { closeSequelize } from '@/db/sequelize';
import { changePassword } from '@/server/actions/security';
import { resetPassword, signIn } from '@/server/actions/auth';
import { echoValues } from '@/server/actions/safe-action';
import { createCompany, createUserWithRole, signInAs, uniqueEmail, TEST_PASSWORD } from './support/factories';

// A failed action answers with `values` so its form can be refilled. That answer travels to the
// browser (and into React's state): no password typed into any field may be part of it.
afterAll(closeSequelize);
beforeEach(() => {
  asSignedOut();
  setRequestHeaders({});
});

/** Every string anywhere in the answer, so a secret under any key is found. */
const everyString = (v: unknown): string[] => (typeof v === 'string' ? [v] : v && typeof v === 'object' ? Object.values(v).flatMap(everyString) : []);

describe('password forms never send a password back', () => {
  it('changePassword with a mismatched confirmation: current, new and confirmation stay out of the answer', async () => {
    const me = await createUserWithRole((await createCompany()).id, 'installer');
    asUser(await signInAs(me));
    const typed = { username: me.email, current: TEST_PASSWORD, password: 'my-new-secret-one', confirm: 'my-new-secret-two' };
    const out = await callAction(changePassword, typed);
    expect(out.state).toMatchObject({ ok: false, code: 'invalid_input', fieldErrors: { confirm: ['The two passwords differ.'] } });
    const answer = everyString(out.state);
    for (const secret of [typed.current, typed.password, typed.confirm]) expect(answer).not.toContain(secret);
    // The non-secret hidden field is still echoed (the form keeps working for password managers).
    expect(out.state && !out.state.ok ? out.state.values : null).toEqual({ username: me.email });
  });

  it('changePassword with a wrong current password: nothing typed comes back', async () => {
    const me = await createUserWithRole((await createCompany()).id, 'sales');
    asUser(await signInAs(me));
    const out = await callAction(changePassword, { current: 'not-my-password-x', password: 'my-new-secret-1', confirm: 'my-new-secret-1' });
    expect(out.state).toMatchObject({ ok: false, fieldErrors: { current: ['Not right.'] } });
    const answer = everyString(out.state);
    for (const secret of ['not-my-password-x', 'my-new-secret-1']) expect(answer).not.toContain(secret);
  });

  it('resetPassword with a mismatched confirmation: neither password nor the link token comes back', async () => {
    const token = 'A'.repeat(43);
    const out = await callAction(resetPassword, { token, password: 'reset-secret-one', confirm: 'reset-secret-two' });
    expect(out.state).toMatchObject({ ok: false, code: 'invalid_input' });
    const answer = everyString(out.state);
    for (const secret of [token, 'reset-secret-one', 'reset-secret-two']) expect(answer).not.toContain(secret);
  });

  it('signIn with a wrong password echoes the address only', async () => {
    const email = uniqueEmail('echo');
    const out = await callAction(signIn, { email, password: 'typed-password-9' });
    expect(out.state && !out.state.ok ? out.state.values : null).toEqual({ email });
  });
});

describe('echoValues', () => {
  it('drops password-like names and any value equal to one of them', () => {
    expect(
      echoValues({ name: 'Ada', newPassword: 'hunter2-long', repeat: 'hunter2-long', note: 'hunter2-long', pwd: 'x', apiKey: 'k-1', pin: '1234', file: 3 }),
    ).toEqual({ name: 'Ada' });
  });

  it('keeps ordinary fields, even ones that share a short value with a secret field', () => {
    expect(echoValues({ code: 'pro', name: 'pro', latDeg: '51.5' })).toEqual({ name: 'pro', latDeg: '51.5' });
  });
});
