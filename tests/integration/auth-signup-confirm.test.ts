// A known client IP per test (as behind our proxy), so these sign-ups stay out of the one
// bucket shared by every request without a known IP (vitest parses getEnv() afresh per file).
process.env.TRUST_PROXY = 'true';
import { asSignedOut, callAction, currentSessionToken, setRequestHeaders } from './support/next-request';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { models } from '@/db/models';
import { closeSequelize } from '@/db/sequelize';
import { confirmSignUp, signUp } from '@/server/actions/auth';
import {
  confirmSignUp as spendSignUpLink,
  inspectSignUpLink,
  SIGN_UP_LINK_DEAD,
  SIGN_UP_LINK_HOURS,
  SIGN_UP_LINK_SUPERSEDED,
} from '@/server/auth/sign-up';
import { hashToken } from '@/server/auth/tokens';
import { createCompany, createUserWithRole, uniqueEmail } from './support/factories';
import { linkIn, mailsTo, tokenFromLink, waitForMails } from './support/mailbox';

afterAll(closeSequelize);
afterAll(() => {
  delete process.env.TRUST_PROXY;
});
beforeEach(() => {
  asSignedOut();
  setRequestHeaders({ 'x-forwarded-for': `198.51.100.${Math.floor(Math.random() * 250) + 1}, 10.${Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250)}` });
});

const form = (email: string, companyName = 'Thornwick Aerial Co') => ({ name: 'Odile Farrant', companyName, email, password: 'a-long-enough-pass' });
const meta = { ip: null, userAgent: 'vitest' };

async function confirmLinkFor(email: string, count = 1): Promise<string> {
  const mails = await waitForMails(email, count);
  return tokenFromLink(linkIn(mails[count - 1], '/sign-up/confirm/'));
}

async function companiesOf(email: string): Promise<number> {
  const { User, Membership } = models();
  const user = await User.findOne({ where: { email } });
  return user ? Membership.count({ where: { userId: user.id } }) : 0;
}

describe('sign-up by e-mail confirmation', () => {
  it('gives the same answer, in similar time, for a new address and one that has an account', async () => {
    const existing = await createUserWithRole((await createCompany()).id, 'sales');
    const fresh = uniqueEmail('fresh');
    const t0 = Date.now();
    const a = await callAction(signUp, form(fresh));
    const t1 = Date.now();
    const b = await callAction(signUp, form(existing.email));
    const t2 = Date.now();
    expect(a.state).toEqual({ ok: true, message: `Check your inbox at ${fresh} to finish creating your account.` });
    expect(b.state).toEqual({ ok: true, message: `Check your inbox at ${existing.email} to finish creating your account.` });
    // Same words apart from the address the person typed.
    expect((a.state as { message: string }).message.replace(fresh, '@')).toBe((b.state as { message: string }).message.replace(existing.email, '@'));
    // Both take at least the response floor (900 ms) and neither is far slower (common practice, no source: a floor hides the branch).
    expect(t1 - t0).toBeGreaterThanOrEqual(890);
    expect(t2 - t1).toBeGreaterThanOrEqual(890);
    expect(Math.abs(t1 - t0 - (t2 - t1))).toBeLessThan(600);
  });

  it('mails an existing address "you already have an account" with sign-in and reset links, and makes no second company', async () => {
    const company = await createCompany();
    const existing = await createUserWithRole(company.id, 'admin');
    const { Company, SignupRequest } = models();
    const before = await Company.count();
    await callAction(signUp, form(existing.email, 'Second Company Ltd'));
    const [mail] = await waitForMails(existing.email);
    expect(mail.subject).toBe('You already have a FadeLedger account');
    expect(mail.text).toContain('Someone (maybe you) tried to create a FadeLedger account with this address');
    expect(mail.text).toMatch(/\/sign-in\b/);
    expect(mail.text).toContain('/forgot-password');
    expect(mail.html).toContain('/forgot-password');
    expect(mail.text).not.toContain('/sign-up/confirm/');
    expect(await Company.count()).toBe(before);
    expect(await Company.count({ where: { name: 'Second Company Ltd' } })).toBe(0);
    expect(await SignupRequest.count({ where: { email: existing.email } })).toBe(0);
    expect(await companiesOf(existing.email)).toBe(1);
    expect(currentSessionToken()).toBeNull();
  });

  it('stores only digests and hashes; the link works once', async () => {
    const email = uniqueEmail('once');
    await callAction(signUp, form(email));
    const token = await confirmLinkFor(email);
    const { SignupRequest, AuditEvent } = models();
    const row = await SignupRequest.findOne({ where: { email } });
    expect(row?.tokenHash).toBe(hashToken(token));
    expect(row?.passwordHash).toMatch(/^\$argon2/);
    expect(row!.expiresAt.getTime() - Date.now()).toBeGreaterThan((SIGN_UP_LINK_HOURS - 1) * 3600_000);
    expect(await inspectSignUpLink(token)).toEqual({ state: 'valid', email, name: 'Odile Farrant', companyName: 'Thornwick Aerial Co' });
    expect(await AuditEvent.count({ where: { action: 'sign_up.requested', targetLabel: email } })).toBe(1);

    expect((await callAction(confirmSignUp, { token })).redirect).toBe('/dashboard?welcome=1');
    expect(await AuditEvent.count({ where: { action: 'sign_up.confirmed', targetLabel: email } })).toBe(1);
    asSignedOut();
    const again = await callAction(confirmSignUp, { token });
    expect(again.state).toMatchObject({ ok: false, error: SIGN_UP_LINK_DEAD });
    expect(currentSessionToken()).toBeNull();
    expect(await inspectSignUpLink(token)).toEqual({ state: 'dead', message: SIGN_UP_LINK_DEAD });
    expect(await companiesOf(email)).toBe(1);
  });

  it('refuses an expired link and creates nothing', async () => {
    const email = uniqueEmail('late');
    await callAction(signUp, form(email));
    const token = await confirmLinkFor(email);
    await models().SignupRequest.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { tokenHash: hashToken(token) } });
    expect(await inspectSignUpLink(token)).toEqual({ state: 'dead', message: SIGN_UP_LINK_DEAD });
    const out = await callAction(confirmSignUp, { token });
    expect(out.state).toMatchObject({ ok: false, error: SIGN_UP_LINK_DEAD });
    expect(await models().User.count({ where: { email } })).toBe(0);
  });

  it('only the newest link of an address works', async () => {
    const email = uniqueEmail('twice');
    const [firstName, secondName] = [`First Name Co ${Date.now()}`, `Second Name Co ${Date.now()}`];
    await callAction(signUp, form(email, firstName));
    const first = await confirmLinkFor(email, 1);
    await callAction(signUp, form(email, secondName));
    const second = await confirmLinkFor(email, 2);
    expect((await callAction(confirmSignUp, { token: first })).state).toMatchObject({ ok: false, error: SIGN_UP_LINK_DEAD });
    expect((await callAction(confirmSignUp, { token: second })).redirect).toBe('/dashboard?welcome=1');
    expect(await models().Company.count({ where: { name: secondName } })).toBe(1);
    expect(await models().Company.count({ where: { name: firstName } })).toBe(0);
    expect(await companiesOf(email)).toBe(1);
  });

  it('says the link is no longer valid when the address got an account meanwhile', async () => {
    const email = uniqueEmail('meanwhile');
    await callAction(signUp, form(email));
    const token = await confirmLinkFor(email);
    // An invitation (or another route) created the account after the link was mailed.
    const company = await createCompany();
    const user = await createUserWithRole(company.id, 'installer');
    await models().User.update({ email }, { where: { id: user.id } });
    expect(await inspectSignUpLink(token)).toEqual({ state: 'dead', message: SIGN_UP_LINK_SUPERSEDED });
    const out = await callAction(confirmSignUp, { token });
    expect(out.state).toMatchObject({ ok: false, error: SIGN_UP_LINK_SUPERSEDED });
    expect(await companiesOf(email)).toBe(1);
    // Spent: it stays dead.
    expect(await models().SignupRequest.count({ where: { tokenHash: hashToken(token), usedAt: null } })).toBe(0);
  });

  it('creates exactly one company when the link is opened twice at once', async () => {
    const email = uniqueEmail('race');
    const companyName = `Racing Dish Co ${Date.now()}`;
    await callAction(signUp, form(email, companyName));
    const token = await confirmLinkFor(email);
    const outcomes = await Promise.allSettled([spendSignUpLink(token, meta), spendSignUpLink(token, meta), spendSignUpLink(token, meta)]);
    expect(outcomes.filter((o) => o.status === 'fulfilled')).toHaveLength(1);
    for (const o of outcomes) if (o.status === 'rejected') expect((o.reason as Error).message).toBe(SIGN_UP_LINK_DEAD);
    expect(await models().Company.count({ where: { name: companyName } })).toBe(1);
    expect(await models().User.count({ where: { email } })).toBe(1);
    expect(await companiesOf(email)).toBe(1);
  });

  it('sends nothing and stores nothing for bad input', async () => {
    const email = uniqueEmail('bad');
    const out = await callAction(signUp, { name: 'X', companyName: 'Y', email, password: 'short' });
    expect(out.state).toMatchObject({ ok: false });
    expect(await models().SignupRequest.count({ where: { email } })).toBe(0);
    expect(await mailsTo(email)).toHaveLength(0);
  });
});
