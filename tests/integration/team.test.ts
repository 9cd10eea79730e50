import { asSignedOut, asUser, callAction, currentSessionToken, inRequest, revalidatedPaths, setRequestHeaders } from './support/next-request';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { models } from '@/db/models';
import { closeSequelize } from '@/db/sequelize';
import { acceptInvitation, acceptInvitationWithAccount, signIn } from '@/server/actions/auth';
import { changeMemberRole, inviteMember, removeMember, resendInvitation, revokeInvitation } from '@/server/actions/team';
import { inspectInvitation, INVITATION_DEAD } from '@/server/auth/invitations';
import { getAuthContext } from '@/server/auth/guards';
import { getLucia } from '@/server/auth/lucia';
import { hashToken } from '@/server/auth/tokens';
import { listAuditEventsForCompany } from '@/db/queries/audit';
import { createCompany, createCompanyWithSeats, createUserWithRole, signInAs, uniqueEmail, TEST_PASSWORD, type TestCompany, type TestUser } from './support/factories';
import { linkIn, tokenFromLink, waitForMails } from './support/mailbox';

afterAll(closeSequelize);
beforeEach(() => setRequestHeaders({}));

async function adminOf(company?: TestCompany): Promise<{ company: TestCompany; admin: TestUser; token: string }> {
  const c = company ?? (await createCompany());
  const admin = await createUserWithRole(c.id, 'admin');
  const token = await signInAs(admin);
  asUser(token);
  return { company: c, admin, token };
}

async function invitationLink(email: string, count = 1): Promise<string> {
  const mails = await waitForMails(email, count);
  return linkIn(mails[count - 1], '/invite/');
}

describe('inviting', () => {
  it('mails the invitee a link with company, inviter and role, in text and HTML; the link creates the account', async () => {
    const { company, admin } = await adminOf();
    const email = uniqueEmail('newhire');
    const out = await callAction(inviteMember, { email, role: 'installer' });
    expect(out.state).toMatchObject({ ok: true, message: `Invitation sent to ${email} as Installer.` });
    expect(revalidatedPaths()).toContain('/settings/team');

    const [mail] = await waitForMails(email);
    expect(mail.subject).toBe(`${admin.name} invited you to ${company.name} on FadeLedger`);
    expect(mail.text).toContain('as Installer');
    expect(mail.html).toContain('Accept the invitation');
    const token = tokenFromLink(linkIn(mail, '/invite/'));
    expect(await models().Invitation.findOne({ where: { tokenHash: token } })).toBeNull();

    expect(await inspectInvitation(token)).toMatchObject({ state: 'valid', email, role: 'installer', companyName: company.name, accountExists: false });

    asSignedOut();
    const accepted = await callAction(acceptInvitation, { token, name: 'Ness Harrowgate', password: 'invitee-password-1' });
    expect(accepted.redirect).toBe('/dashboard?joined=1');
    const ctx = await getAuthContext();
    expect(ctx).toMatchObject({ role: 'installer', companyId: company.id, user: { email, name: 'Ness Harrowgate' } });

    // Works once.
    asSignedOut();
    const reused = await callAction(acceptInvitation, { token, name: 'Someone Else', password: 'another-password-1' });
    expect(reused.state).toMatchObject({ ok: false, error: INVITATION_DEAD.accepted });
    expect(await models().User.count({ where: { email } })).toBe(1);

    // And the new account signs in with its own password.
    expect((await callAction(signIn, { email, password: 'invitee-password-1' })).redirect).toBe('/dashboard');
  });

  it('an expired link is refused and creates nothing; resending makes a new link that works', async () => {
    const { company } = await adminOf();
    const email = uniqueEmail('late');
    await callAction(inviteMember, { email, role: 'sales' });
    const first = tokenFromLink(await invitationLink(email));
    const { Invitation, User } = models();
    await Invitation.update({ expiresAt: new Date(Date.now() - 1000), lastSentAt: new Date(Date.now() - 3600_000) }, { where: { tokenHash: hashToken(first) } });
    const token = currentSessionToken()!;

    asSignedOut();
    expect(await inspectInvitation(first)).toMatchObject({ state: 'expired' });
    expect((await callAction(acceptInvitation, { token: first, name: 'Late Person', password: 'late-password-1' })).state).toMatchObject({ ok: false, error: INVITATION_DEAD.expired });
    expect(await User.count({ where: { email } })).toBe(0);

    asUser(token);
    const inv = await Invitation.findOne({ where: { companyId: company.id, email } });
    expect((await callAction(resendInvitation, { invitationId: inv!.id })).state).toMatchObject({ ok: true });
    const second = tokenFromLink(await invitationLink(email, 2));
    expect(second).not.toBe(first);
    expect(await inspectInvitation(first)).toMatchObject({ state: 'unknown' });
    asSignedOut();
    expect((await callAction(acceptInvitation, { token: second, name: 'Late Person', password: 'late-password-1' })).redirect).toBe('/dashboard?joined=1');
  });

  it('refuses resending within a minute, and a revoked link no longer works', async () => {
    await adminOf();
    const email = uniqueEmail('revoked');
    const sent = await callAction(inviteMember, { email, role: 'sales' });
    const invitationId = (sent.state as { data: { invitationId: number } }).data.invitationId;
    expect((await callAction(resendInvitation, { invitationId })).state).toMatchObject({ ok: false, code: 'conflict' });
    const token = tokenFromLink(await invitationLink(email));
    expect((await callAction(revokeInvitation, { invitationId })).state).toMatchObject({ ok: true });
    expect(await inspectInvitation(token)).toMatchObject({ state: 'revoked', message: INVITATION_DEAD.revoked });
    asSignedOut();
    expect((await callAction(acceptInvitation, { token, name: 'X', password: 'revoked-password-1' })).state).toMatchObject({ ok: false, error: INVITATION_DEAD.revoked });
  });

  it('refuses a second invitation to the same address and an invitation to a member', async () => {
    const { admin } = await adminOf();
    const email = uniqueEmail('twice');
    await callAction(inviteMember, { email, role: 'sales' });
    expect((await callAction(inviteMember, { email: email.toUpperCase(), role: 'installer' })).state).toMatchObject({ ok: false, fieldErrors: { email: ['Already invited.'] } });
    expect((await callAction(inviteMember, { email: admin.email, role: 'installer' })).state).toMatchObject({ ok: false, fieldErrors: { email: ['Already a member.'] } });
  });

  it('an existing account accepts with its password and keeps its other company', async () => {
    const other = await createCompany();
    const person = await createUserWithRole(other.id, 'installer');
    const { company } = await adminOf();
    await callAction(inviteMember, { email: person.email, role: 'sales' });
    const token = tokenFromLink(await invitationLink(person.email));
    asSignedOut();
    expect(await inspectInvitation(token)).toMatchObject({ accountExists: true });
    // Without a session, the link alone is not enough.
    expect((await callAction(acceptInvitationWithAccount, { token })).state).toMatchObject({ ok: false, fieldErrors: { password: expect.any(Array) } });
    expect((await callAction(acceptInvitationWithAccount, { token, password: 'wrong-password' })).state).toMatchObject({ ok: false, code: 'invalid_input' });
    expect((await callAction(acceptInvitationWithAccount, { token, password: TEST_PASSWORD })).redirect).toBe('/dashboard?joined=1');
    expect(await getAuthContext()).toMatchObject({ companyId: company.id, role: 'sales' });
    const { Membership } = models();
    expect(await Membership.count({ where: { userId: person.id } })).toBe(2);
    expect((await callAction(acceptInvitationWithAccount, { token, password: TEST_PASSWORD })).state).toMatchObject({ ok: false, error: INVITATION_DEAD.accepted });
  });

  it('signed in as the invited account, one click joins; signed in as someone else, the password of the invited account is needed', async () => {
    const person = await createUserWithRole((await createCompany()).id, 'installer');
    await adminOf();
    await callAction(inviteMember, { email: person.email, role: 'installer' });
    const token = tokenFromLink(await invitationLink(person.email));

    const stranger = await createUserWithRole((await createCompany()).id, 'admin');
    asUser(await signInAs(stranger));
    expect((await callAction(acceptInvitationWithAccount, { token })).state).toMatchObject({ ok: false });

    asUser(await signInAs(person));
    expect((await callAction(acceptInvitationWithAccount, { token })).redirect).toBe('/dashboard?joined=1');
  });

  it('a new-account form cannot take over an address that already has an account', async () => {
    const person = await createUserWithRole((await createCompany()).id, 'installer');
    await adminOf();
    await callAction(inviteMember, { email: person.email, role: 'installer' });
    const token = tokenFromLink(await invitationLink(person.email));
    asSignedOut();
    expect((await callAction(acceptInvitation, { token, name: 'Imposter', password: 'imposter-password' })).state).toMatchObject({ ok: false, code: 'conflict' });
    expect((await models().User.findByPk(person.id))?.name).toBe(person.name);
  });
});

describe('roles and removal', () => {
  it('changes a role and writes who, what, when and from where to the audit log', async () => {
    setRequestHeaders({ 'user-agent': 'audit-test-agent' });
    const { company, admin } = await adminOf();
    const installer = await createUserWithRole(company.id, 'installer');
    const out = await callAction(changeMemberRole, { membershipId: installer.membershipId!, role: 'sales' });
    expect(out.state).toMatchObject({ ok: true, message: `${installer.name} is now Sales.` });
    expect((await models().Membership.findByPk(installer.membershipId!))?.role).toBe('sales');
    const [event] = await listAuditEventsForCompany(company.id, { limit: 1 });
    expect(event).toMatchObject({ action: 'member.role_changed', actorLabel: `${admin.name} <${admin.email}>`, targetLabel: `${installer.name} <${installer.email}>`, detail: { from: 'installer', to: 'sales' }, userAgent: 'audit-test-agent' });
    expect(Date.now() - event.createdAt.getTime()).toBeLessThan(10_000);
  });

  it('the last admin can be neither demoted nor removed; with a second admin both work', async () => {
    const { company, admin } = await adminOf();
    expect((await callAction(changeMemberRole, { membershipId: admin.membershipId!, role: 'installer' })).state).toMatchObject({ ok: false, code: 'conflict', error: expect.stringContaining('only admin') });
    expect((await callAction(removeMember, { membershipId: admin.membershipId! })).state).toMatchObject({ ok: false, code: 'conflict' });
    const second = await createUserWithRole(company.id, 'admin');
    expect((await callAction(changeMemberRole, { membershipId: second.membershipId!, role: 'sales' })).state).toMatchObject({ ok: true });
    expect((await callAction(changeMemberRole, { membershipId: second.membershipId!, role: 'admin' })).state).toMatchObject({ ok: true });
    expect((await callAction(changeMemberRole, { membershipId: admin.membershipId!, role: 'installer' })).state).toMatchObject({ ok: true });
  });

  it('two admins demoting each other at the same moment leave one admin', async () => {
    const company = await createCompany();
    const a = await createUserWithRole(company.id, 'admin');
    const b = await createUserWithRole(company.id, 'admin');
    const ta = await signInAs(a);
    const tb = await signInAs(b);
    const [ra, rb] = await Promise.all([
      inRequest(ta, () => callAction(changeMemberRole, { membershipId: b.membershipId!, role: 'sales' })),
      inRequest(tb, () => callAction(changeMemberRole, { membershipId: a.membershipId!, role: 'sales' })),
    ]);
    const codes = [ra.state, rb.state].map((s) => (s?.ok ? 'ok' : s?.code)).sort();
    expect(codes).toEqual(['conflict', 'ok']);
    expect(await models().Membership.count({ where: { companyId: company.id, role: 'admin' } })).toBe(1);
  });

  it('removing a member ends their sessions in this company and frees the seat', async () => {
    const { company } = await adminOf();
    const sales = await createUserWithRole(company.id, 'sales');
    const theirs = await signInAs(sales);
    expect((await callAction(removeMember, { membershipId: sales.membershipId! })).state).toMatchObject({ ok: true });
    expect(await models().Membership.findByPk(sales.membershipId!)).toBeNull();
    expect(await getLucia().validateSession(theirs)).toMatchObject({ session: null });
    expect(await models().User.findByPk(sales.id)).not.toBeNull();
  });

  it('a member removed while their page is open loses access on the next request', async () => {
    const company = await createCompany();
    const admin = await createUserWithRole(company.id, 'admin');
    const installer = await createUserWithRole(company.id, 'installer');
    const theirs = await signInAs(installer);
    await models().Membership.destroy({ where: { id: installer.membershipId! } });
    asUser(theirs);
    expect(await getAuthContext()).toBeNull();
    asUser(await signInAs(admin));
    expect(await getAuthContext()).toMatchObject({ role: 'admin' });
  });
});

describe('seats', () => {
  it('members plus pending invitations never exceed the plan seat limit; revoking frees a seat', async () => {
    const company = await createCompanyWithSeats(3);
    await adminOf(company);
    const a = await callAction(inviteMember, { email: uniqueEmail('s1'), role: 'sales' });
    await callAction(inviteMember, { email: uniqueEmail('s2'), role: 'sales' });
    const third = await callAction(inviteMember, { email: uniqueEmail('s3'), role: 'sales' });
    expect(third.state).toMatchObject({ ok: false, code: 'plan_limit', error: expect.stringContaining('All 3 seats') });
    await callAction(revokeInvitation, { invitationId: (a.state as { data: { invitationId: number } }).data.invitationId });
    expect((await callAction(inviteMember, { email: uniqueEmail('s4'), role: 'sales' })).state).toMatchObject({ ok: true });
  });

  it('an expired invitation frees its seat; renewing it must find a seat again', async () => {
    const company = await createCompanyWithSeats(2);
    await adminOf(company);
    const sent = await callAction(inviteMember, { email: uniqueEmail('e1'), role: 'sales' });
    const invitationId = (sent.state as { data: { invitationId: number } }).data.invitationId;
    await models().Invitation.update({ expiresAt: new Date(Date.now() - 1000), lastSentAt: new Date(Date.now() - 3600_000) }, { where: { id: invitationId } });
    expect((await callAction(inviteMember, { email: uniqueEmail('e2'), role: 'sales' })).state).toMatchObject({ ok: true });
    expect((await callAction(resendInvitation, { invitationId })).state).toMatchObject({ ok: false, code: 'plan_limit' });
  });
});
