import { asSignedOut, asUser, callAction, setRequestHeaders } from './support/next-request';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { models } from '@/db/models';
import { closeSequelize } from '@/db/sequelize';
import { requestPasswordReset, resetPassword, signIn } from '@/server/actions/auth';
import { inspectResetLink, RESET_REQUESTED_MESSAGE, RESET_LINK_DEAD } from '@/server/auth/password-reset';
import { getLucia } from '@/server/auth/lucia';
import { hashToken } from '@/server/auth/tokens';
import { createCompany, createUserWithRole, signInAs, uniqueEmail, TEST_PASSWORD } from './support/factories';
import { linkIn, mailsTo, tokenFromLink, waitForMails } from './support/mailbox';

afterAll(closeSequelize);
beforeEach(() => {
  asSignedOut();
  setRequestHeaders({});
});

async function resetLinkFor(email: string, count = 1): Promise<string> {
  const mails = await waitForMails(email, count);
  const mail = mails[count - 1];
  expect(mail.subject).toBe('Reset your FadeLedger password');
  expect(mail.html).toContain('Choose a new password');
  return linkIn(mail, '/reset-password/');
}

describe('password reset through the mail catcher', () => {
  it('mails a link; following it sets the new password, ends every session, and works only once', async () => {
    const user = await createUserWithRole((await createCompany()).id, 'installer');
    const otherDevice = await signInAs(user);

    const asked = await callAction(requestPasswordReset, { email: user.email });
    expect(asked.state).toEqual({ ok: true, message: RESET_REQUESTED_MESSAGE });
    const link = await resetLinkFor(user.email);
    const token = tokenFromLink(link);
    // Only the digest is stored.
    const { PasswordResetToken } = models();
    expect(await PasswordResetToken.findOne({ where: { tokenHash: token } })).toBeNull();
    expect(await PasswordResetToken.findOne({ where: { tokenHash: hashToken(token) } })).not.toBeNull();
    expect(await inspectResetLink(token)).toEqual({ state: 'valid', email: user.email });

    const done = await callAction(resetPassword, { token, password: 'brand-new-password-1', confirm: 'brand-new-password-1' });
    expect(done.redirect).toBe('/sign-in?reset=1');
    expect(await getLucia().validateSession(otherDevice)).toMatchObject({ session: null });

    expect((await callAction(signIn, { email: user.email, password: TEST_PASSWORD })).state).toMatchObject({ ok: false });
    expect((await callAction(signIn, { email: user.email, password: 'brand-new-password-1' })).redirect).toBe('/dashboard');

    // Reuse of the same link.
    asSignedOut();
    const again = await callAction(resetPassword, { token, password: 'third-password-xx', confirm: 'third-password-xx' });
    expect(again.state).toMatchObject({ ok: false, error: RESET_LINK_DEAD });
    expect(await inspectResetLink(token)).toEqual({ state: 'dead' });
  });

  it('refuses an expired link and keeps the old password', async () => {
    const user = await createUserWithRole((await createCompany()).id, 'sales');
    await callAction(requestPasswordReset, { email: user.email });
    const token = tokenFromLink(await resetLinkFor(user.email));
    await models().PasswordResetToken.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { tokenHash: hashToken(token) } });
    const out = await callAction(resetPassword, { token, password: 'brand-new-password-2', confirm: 'brand-new-password-2' });
    expect(out.state).toMatchObject({ ok: false, error: RESET_LINK_DEAD });
    expect((await callAction(signIn, { email: user.email, password: TEST_PASSWORD })).redirect).toBe('/dashboard');
  });

  it('a newer request retires the earlier link', async () => {
    const user = await createUserWithRole((await createCompany()).id, 'admin');
    await callAction(requestPasswordReset, { email: user.email });
    const first = tokenFromLink(await resetLinkFor(user.email, 1));
    await callAction(requestPasswordReset, { email: user.email });
    const second = tokenFromLink(await resetLinkFor(user.email, 2));
    expect(second).not.toBe(first);
    expect((await callAction(resetPassword, { token: first, password: 'brand-new-password-3', confirm: 'brand-new-password-3' })).state).toMatchObject({ ok: false });
    expect((await callAction(resetPassword, { token: second, password: 'brand-new-password-3', confirm: 'brand-new-password-3' })).redirect).toBe('/sign-in?reset=1');
  });

  it('says the same for an address without an account, and sends nothing', async () => {
    const nobody = uniqueEmail('nobody');
    const out = await callAction(requestPasswordReset, { email: nobody });
    expect(out.state).toEqual({ ok: true, message: RESET_REQUESTED_MESSAGE });
    // A real signal instead of a sleep: the action awaits its SMTP hand-off, so a reset mailed to
    // a real account afterwards reaches the catcher after anything the first request sent.
    const marker = await createUserWithRole((await createCompany()).id, 'installer');
    await callAction(requestPasswordReset, { email: marker.email });
    await waitForMails(marker.email, 1);
    expect(await mailsTo(nobody)).toHaveLength(0);
  });

  it('rejects mismatched confirmation and a malformed token before touching anything', async () => {
    expect((await callAction(resetPassword, { token: 'x'.repeat(43), password: 'brand-new-password', confirm: 'different-password' })).state).toMatchObject({ ok: false, fieldErrors: { confirm: ['The two passwords differ.'] } });
    expect((await callAction(resetPassword, { token: '../../etc', password: 'brand-new-password', confirm: 'brand-new-password' })).state).toMatchObject({ ok: false, fieldErrors: { token: expect.any(Array) } });
  });

  it('is used while signed in too: the current session ends with the others', async () => {
    const user = await createUserWithRole((await createCompany()).id, 'installer');
    const mine = await signInAs(user);
    asUser(mine);
    await callAction(requestPasswordReset, { email: user.email });
    const token = tokenFromLink(await resetLinkFor(user.email));
    await callAction(resetPassword, { token, password: 'brand-new-password-4', confirm: 'brand-new-password-4' });
    expect(await getLucia().validateSession(mine)).toMatchObject({ session: null });
  });
});
