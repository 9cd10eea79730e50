import { asSignedOut, asUser, callAction, currentSessionToken, setRequestHeaders, writtenCookie } from './support/next-request';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { models } from '@/db/models';
import { closeSequelize } from '@/db/sequelize';
import { changePassword, revokeSession, signOutEverywhere, switchCompany } from '@/server/actions/security';
import { signIn } from '@/server/actions/auth';
import { getAuthContext } from '@/server/auth/guards';
import { getLucia, SESSION_LIFETIME } from '@/server/auth/lucia';
import { SequelizeSessionAdapter } from '@/server/auth/sequelize-adapter';
import { hashToken } from '@/server/auth/tokens';
import { listUserSessions } from '@/db/queries/sessions';
import { listAuditEventsForCompany, listSecurityEventsForUser } from '@/db/queries/audit';
import { addMembership, createCompany, createUserWithRole, signInAs, TEST_PASSWORD } from './support/factories';

afterAll(closeSequelize);
beforeEach(() => {
  asSignedOut();
  setRequestHeaders({});
});

describe('own sessions', () => {
  it('lists only one’s own live sessions, and revokes another device by its digest', async () => {
    const company = await createCompany();
    const me = await createUserWithRole(company.id, 'installer');
    const here = await signInAs(me);
    const phone = await signInAs(me);
    const someoneElse = await signInAs(await createUserWithRole(company.id, 'installer'));
    const expired = await signInAs(me);
    await models().Session.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { id: hashToken(expired) } });

    const listed = await listUserSessions(me.id);
    expect(listed.map((s) => s.digest).sort()).toEqual([hashToken(here), hashToken(phone)].sort());

    asUser(here);
    expect((await callAction(revokeSession, { session: hashToken(phone) })).state).toMatchObject({ ok: true });
    expect(await getLucia().validateSession(phone)).toMatchObject({ session: null });
    // Someone else's session is "not found", and stays.
    expect((await callAction(revokeSession, { session: hashToken(someoneElse) })).state).toMatchObject({ ok: false, code: 'not_found' });
    expect((await getLucia().validateSession(someoneElse)).session).not.toBeNull();
    // Revoking the current one is signing out.
    expect((await callAction(revokeSession, { session: hashToken(here) })).redirect).toBe('/sign-in?signed-out=1');
    expect(await getLucia().validateSession(here)).toMatchObject({ session: null });
  });

  it('"sign out everywhere" ends every session of the person, this one included', async () => {
    const company = await createCompany();
    const me = await createUserWithRole(company.id, 'sales');
    const a = await signInAs(me);
    const b = await signInAs(me);
    asUser(a);
    expect((await callAction(signOutEverywhere, {})).redirect).toBe('/sign-in?signed-out=everywhere');
    expect(await models().Session.count({ where: { userId: me.id } })).toBe(0);
    expect(writtenCookie()?.value).toBe('');
    expect(await getLucia().validateSession(b)).toMatchObject({ session: null });
    const [event] = await listAuditEventsForCompany(company.id, { limit: 1 });
    expect(event).toMatchObject({ action: 'session.signed_out_everywhere', detail: { sessions: 2 } });
  });

  it('changing the password needs the current one and signs out the other devices only', async () => {
    const me = await createUserWithRole((await createCompany()).id, 'admin');
    const here = await signInAs(me);
    const other = await signInAs(me);
    asUser(here);
    expect((await callAction(changePassword, { current: 'wrong-password', password: 'a-new-password-1', confirm: 'a-new-password-1' })).state).toMatchObject({ ok: false, fieldErrors: { current: ['Not right.'] } });
    expect((await callAction(changePassword, { current: TEST_PASSWORD, password: 'a-new-password-1', confirm: 'a-new-password-1' })).state).toMatchObject({ ok: true });
    expect((await getLucia().validateSession(here)).session).not.toBeNull();
    expect(await getLucia().validateSession(other)).toMatchObject({ session: null });
    asSignedOut();
    expect((await callAction(signIn, { email: me.email, password: 'a-new-password-1' })).redirect).toBe('/dashboard');
    expect((await listSecurityEventsForUser(me.id)).map((e) => e.action)).toEqual(expect.arrayContaining(['password.changed', 'session.signed_in']));
  });
});

describe('active company', () => {
  it('is stored on the session; a person in two companies switches between them', async () => {
    const first = await createCompany({ name: 'First Light Aerials' });
    const second = await createCompany({ name: 'Second Meridian Sat' });
    const me = await createUserWithRole(first.id, 'installer');
    await addMembership(me.id, second.id, 'admin');
    expect((await callAction(signIn, { email: me.email, password: TEST_PASSWORD })).redirect).toBe('/dashboard');
    const token = currentSessionToken()!;
    expect(await getAuthContext()).toMatchObject({ companyId: first.id, role: 'installer' });
    asUser(token);
    expect((await callAction(switchCompany, { companyId: second.id })).redirect).toBe('/dashboard');
    expect((await models().Session.findByPk(hashToken(token)))?.activeCompanyId).toBe(second.id);
    asUser(token);
    expect(await getAuthContext()).toMatchObject({ companyId: second.id, role: 'admin' });
  });

  it('falls back to another membership when the active company drops the person', async () => {
    const a = await createCompany();
    const b = await createCompany();
    const me = await createUserWithRole(a.id, 'sales');
    await addMembership(me.id, b.id, 'installer');
    const token = await signInAs(me, a.id);
    await models().Membership.destroy({ where: { userId: me.id, companyId: a.id } });
    asUser(token);
    expect(await getAuthContext()).toMatchObject({ companyId: b.id, role: 'installer' });
    expect((await models().Session.findByPk(hashToken(token)))?.activeCompanyId).toBe(b.id);
  });
});

describe('the Sequelize adapter', () => {
  it('extends a session in the second half of its life and writes the refreshed cookie', async () => {
    const me = await createUserWithRole((await createCompany()).id, 'installer');
    const token = await signInAs(me);
    const soon = new Date(Date.now() + SESSION_LIFETIME.milliseconds() / 4);
    await models().Session.update({ expiresAt: soon }, { where: { id: hashToken(token) } });
    asUser(token);
    await getAuthContext();
    const row = await models().Session.findByPk(hashToken(token));
    expect(row!.expiresAt.getTime()).toBeGreaterThan(Date.now() + SESSION_LIFETIME.milliseconds() * 0.9);
    expect(writtenCookie()).toMatchObject({ value: token, httpOnly: true, sameSite: 'lax' });
  });

  it('deleteExpiredSessions removes expired rows of everyone and keeps live ones', async () => {
    const me = await createUserWithRole((await createCompany()).id, 'installer');
    const live = await signInAs(me);
    const dead = await signInAs(me);
    await models().Session.update({ expiresAt: new Date(Date.now() - 5000) }, { where: { id: hashToken(dead) } });
    await new SequelizeSessionAdapter().deleteExpiredSessions();
    expect(await models().Session.findByPk(hashToken(dead))).toBeNull();
    expect(await models().Session.findByPk(hashToken(live))).not.toBeNull();
  });

  it('a session whose user was deleted is rejected and removed', async () => {
    const me = await createUserWithRole((await createCompany()).id, 'installer');
    const token = await signInAs(me);
    const [session, user] = await new SequelizeSessionAdapter().getSessionAndUser(token);
    expect(session).toMatchObject({ userId: me.id, attributes: { digest: hashToken(token) } });
    expect(user).toMatchObject({ id: me.id, attributes: { email: me.email, isStaff: false } });
    await models().User.destroy({ where: { id: me.id } });
    expect(await getLucia().validateSession(token)).toMatchObject({ session: null });
  });
});

describe('audit log scoping', () => {
  it('a company sees its own events and its members’ security events, never another company’s', async () => {
    const a = await createCompany();
    const b = await createCompany();
    const memberA = await createUserWithRole(a.id, 'installer');
    const memberB = await createUserWithRole(b.id, 'installer');
    await callAction(signIn, { email: memberA.email, password: 'wrong-password' });
    await callAction(signIn, { email: memberB.email, password: 'wrong-password' });
    const seenByA = await listAuditEventsForCompany(a.id);
    expect(seenByA.some((e) => e.targetLabel === memberA.email && e.action === 'session.sign_in_failed')).toBe(true);
    expect(seenByA.some((e) => e.targetLabel === memberB.email)).toBe(false);
  });
});
