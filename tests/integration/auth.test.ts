import { asSignedOut, asUser, callAction, callPage, currentSessionToken, setRequestHeaders, writtenCookie } from './support/next-request';
import { afterAll, afterEach, beforeEach, describe, expect, it } from 'vitest';
import { models } from '@/db/models';
import { closeSequelize } from '@/db/sequelize';
import { confirmSignUp, signIn, signOut, signUp } from '@/server/actions/auth';
import { signUpRequestedMessage } from '@/server/auth/sign-up';
import { linkIn, tokenFromLink, waitForMails } from './support/mailbox';
import { requireUser, requireRole, getAuthContext } from '@/server/auth/guards';
import { getLucia } from '@/server/auth/lucia';
import { hashToken } from '@/server/auth/tokens';
import { verifyPassword } from '@/server/auth/password';
import { createCompany, createStaffUser, createUserWithRole, signInAs, uniqueEmail, TEST_PASSWORD } from './support/factories';

afterAll(closeSequelize);
beforeEach(() => {
  asSignedOut();
  setRequestHeaders({});
});

describe('sign up', () => {
  // Without a trusted proxy these attempts land in the one shared unknown-IP bucket: take ours out again.
  const used: string[] = [];
  afterEach(async () => {
    await models().SignInAttempt.destroy({ where: { kind: 'sign_up', email: used.splice(0) } });
  });

  it('mails a link; opening it creates the company on the trial plan with the signer as admin, in one go, and signs in', async () => {
    const email = uniqueEmail('founder');
    used.push(email);
    const { User, Company, Membership, Plan, Session } = models();
    const asked = await callAction(signUp, { name: 'Wren Calloway', companyName: 'Hollowmere Dish Works', email: email.toUpperCase(), password: 'a-long-enough-pass' });
    expect(asked.state).toEqual({ ok: true, message: signUpRequestedMessage(email) });
    // Nothing exists until the address is confirmed.
    expect(await User.findOne({ where: { email } })).toBeNull();
    expect(currentSessionToken()).toBeNull();

    const mail = (await waitForMails(email))[0];
    expect(mail.subject).toBe('Confirm your address to finish creating your FadeLedger account');
    expect(mail.html).toContain('Hollowmere Dish Works');
    const token = tokenFromLink(linkIn(mail, '/sign-up/confirm/'));
    const before = Date.now();
    const out = await callAction(confirmSignUp, { token });
    expect(out.redirect).toBe('/dashboard?welcome=1');
    const user = await User.findOne({ where: { email } });
    expect(user?.name).toBe('Wren Calloway');
    expect(await verifyPassword(user!.passwordHash, 'a-long-enough-pass')).toBe(true);
    const membership = await Membership.findOne({ where: { userId: user!.id } });
    expect(membership?.role).toBe('admin');
    const company = await Company.findByPk(membership!.companyId);
    expect(company?.name).toBe('Hollowmere Dish Works');
    const plan = await Plan.findByPk(company!.planId);
    expect(plan?.code).toBe('trial');
    // trial_ends_at = confirmation time + plan.trial_days (14 in the plan catalogue migration); DATETIME drops the milliseconds
    const expected = before + plan!.trialDays! * 86_400_000;
    expect(Math.abs(company!.trialEndsAt!.getTime() - expected)).toBeLessThan(5_000);

    const session = currentSessionToken();
    expect(session).toBeTruthy();
    const row = await Session.findByPk(hashToken(session!));
    expect(row?.activeCompanyId).toBe(company!.id);
    // The table holds the digest, never the cookie's token.
    expect(await Session.findByPk(session!)).toBeNull();
  });

  it('answers an address that already has an account exactly like a new one, and creates nothing', async () => {
    const { Company, SignupRequest } = models();
    const existing = await createUserWithRole((await createCompany()).id, 'installer');
    const companies = await Company.count();
    used.push(existing.email);
    const out = await callAction(signUp, { name: 'Someone', companyName: 'Duplicate Ltd', email: existing.email, password: 'a-long-enough-pass' });
    expect(out.state).toEqual({ ok: true, message: signUpRequestedMessage(existing.email) });
    expect(await Company.count()).toBe(companies);
    expect(await SignupRequest.count({ where: { email: existing.email } })).toBe(0);
    expect(JSON.stringify(out.state)).not.toContain('a-long-enough-pass');
  });

  it('reports field errors without echoing the password', async () => {
    const out = await callAction(signUp, { name: '', companyName: 'X', email: 'not-an-address', password: 'short' });
    expect(out.state?.ok).toBe(false);
    if (out.state?.ok === false) {
      expect(Object.keys(out.state.fieldErrors ?? {}).sort()).toEqual(['companyName', 'email', 'name', 'password']);
      expect(out.state.values).toMatchObject({ email: 'not-an-address' });
      expect(out.state.values).not.toHaveProperty('password');
    }
  });
});

describe('sign in and out', () => {
  it('signs in with the right password, sets an httpOnly lax cookie, and sweeps expired sessions', async () => {
    const company = await createCompany();
    const user = await createUserWithRole(company.id, 'sales');
    const { Session } = models();
    const stale = await signInAs(user);
    await Session.update({ expiresAt: new Date(Date.now() - 60_000) }, { where: { id: hashToken(stale) } });

    const out = await callAction(signIn, { email: user.email, password: TEST_PASSWORD });
    expect(out.redirect).toBe('/dashboard');
    const cookie = writtenCookie();
    expect(cookie).toMatchObject({ httpOnly: true, sameSite: 'lax', path: '/' });
    // APP_URL of the test profile is http://, so the cookie is not Secure there (it is under https).
    expect(cookie?.secure).toBe(false);
    expect(await Session.findByPk(hashToken(stale))).toBeNull();

    const ctx = await getAuthContext();
    expect(ctx).toMatchObject({ role: 'sales', companyId: company.id, user: { email: user.email } });
  });

  it('answers a wrong password and an unknown address with the same message', async () => {
    const user = await createUserWithRole((await createCompany()).id, 'installer');
    const wrong = await callAction(signIn, { email: user.email, password: 'not-the-password' });
    const unknown = await callAction(signIn, { email: uniqueEmail('nobody'), password: 'not-the-password' });
    expect(wrong.state).toMatchObject({ ok: false });
    expect(unknown.state).toMatchObject({ ok: false });
    expect(wrong.state && !wrong.state.ok && wrong.state.error).toBe(unknown.state && !unknown.state.ok && unknown.state.error);
    expect(currentSessionToken()).toBeNull();
  });

  it('takes about as long for an unknown address as for a wrong password (dummy argon2 verify)', async () => {
    const user = await createUserWithRole((await createCompany()).id, 'installer');
    const time = async (email: string) => {
      const t0 = performance.now();
      await callAction(signIn, { email, password: 'wrong-password-x' });
      return performance.now() - t0;
    };
    await time(uniqueEmail('warm')); // the dummy hash is made once per process
    const known: number[] = [];
    const unknown: number[] = [];
    for (let i = 0; i < 3; i++) {
      known.push(await time(user.email));
      unknown.push(await time(uniqueEmail('nobody')));
    }
    const median = (xs: number[]) => xs.sort((a, b) => a - b)[1];
    // Without the dummy verify the unknown address would answer in a few ms, an argon2 verify
    // takes tens; allow a generous band for a busy 2-core machine.
    expect(median(unknown)).toBeGreaterThan(median(known) * 0.4);
  });

  it('sign-out deletes the session row and blanks the cookie', async () => {
    const user = await createUserWithRole((await createCompany()).id, 'admin');
    const token = await signInAs(user);
    asUser(token);
    const out = await callAction(signOut, {});
    expect(out.redirect).toBe('/sign-in?signed-out=1');
    expect(await models().Session.findByPk(hashToken(token))).toBeNull();
    expect(writtenCookie()?.value).toBe('');
    expect(await getLucia().validateSession(token)).toMatchObject({ session: null });
  });

  it('refuses a person who no longer belongs to any company', async () => {
    const company = await createCompany();
    const user = await createUserWithRole(company.id, 'installer');
    await models().Membership.destroy({ where: { userId: user.id } });
    const out = await callAction(signIn, { email: user.email, password: TEST_PASSWORD });
    expect(out.state).toMatchObject({ ok: false, error: expect.stringContaining('not part of any company') });
  });

  it('sends staff to the staff pages, and only follows same-site "next" paths', async () => {
    const staff = await createStaffUser();
    expect((await callAction(signIn, { email: staff.email, password: TEST_PASSWORD })).redirect).toBe('/staff');
    const user = await createUserWithRole((await createCompany()).id, 'installer');
    expect((await callAction(signIn, { email: user.email, password: TEST_PASSWORD, next: '//evil.example/x' })).redirect).toBe('/dashboard');
    expect((await callAction(signIn, { email: user.email, password: TEST_PASSWORD, next: '/studies/12' })).redirect).toBe('/studies/12');
  });
});

describe('page guards', () => {
  it('requireUser redirects the signed-out to sign-in; requireRole hides other areas with a 404', async () => {
    expect(await callPage(requireUser)).toEqual({ redirect: '/sign-in' });
    const user = await createUserWithRole((await createCompany()).id, 'admin');
    asUser(await signInAs(user));
    expect(await callPage(() => requireRole('staff'))).toEqual({ notFound: 404 });
    expect(await callPage(() => requireRole('admin'))).toMatchObject({ value: { role: 'admin' } });
  });

  it('an expired or unknown session token counts as signed out', async () => {
    const user = await createUserWithRole((await createCompany()).id, 'admin');
    const token = await signInAs(user);
    await models().Session.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { id: hashToken(token) } });
    asUser(token);
    expect(await callPage(requireUser)).toEqual({ redirect: '/sign-in' });
    asUser('x'.repeat(40));
    expect(await callPage(requireUser)).toEqual({ redirect: '/sign-in' });
  });
});
