import { asSignedOut, callAction, inRequest, setRequestHeaders } from './support/next-request';
import { afterAll, beforeEach, describe, expect, it, vi } from 'vitest';

// Lets a test make the audit write fail once, to see what else the request left behind.
const auditFault = vi.hoisted(() => ({ failAction: null as string | null }));
vi.mock('@/server/auth/audit', async (importOriginal) => {
  const real = await importOriginal<typeof import('@/server/auth/audit')>();
  return {
    ...real,
    audit: async (...args: Parameters<typeof real.audit>) => {
      if (auditFault.failAction && args[0].action === auditFault.failAction) {
        auditFault.failAction = null;
        throw new Error('audit log unavailable (test fault)');
      }
      return real.audit(...args);
    },
  };
});

import { Op } from 'sequelize';
import { models } from '@/db/models';
import { closeSequelize } from '@/db/sequelize';
import { requestPasswordReset, resetPassword } from '@/server/actions/auth';
import { inspectResetLink, RESET_LINK_DEAD } from '@/server/auth/password-reset';
import { createCompany, createUserWithRole } from './support/factories';
import { linkIn, mailsTo, tokenFromLink, waitForMails } from './support/mailbox';

afterAll(closeSequelize);
beforeEach(() => {
  asSignedOut();
  setRequestHeaders({});
  auditFault.failAction = null;
});

const liveTokens = (userId: string) => models().PasswordResetToken.count({ where: { userId, usedAt: null, expiresAt: { [Op.gt]: new Date() } } });
const tokensOf = async (email: string) => (await mailsTo(email)).map((m) => tokenFromLink(linkIn(m, '/reset-password/')));

describe('a reset request is one transaction: retire earlier links, store the new one, audit it', () => {
  it('two requests: the first link no longer works, the second does', async () => {
    const user = await createUserWithRole((await createCompany()).id, 'installer');
    await callAction(requestPasswordReset, { email: user.email });
    await callAction(requestPasswordReset, { email: user.email });
    await waitForMails(user.email, 2);
    const [first, second] = await tokensOf(user.email);
    expect(await liveTokens(user.id)).toBe(1);
    expect(await inspectResetLink(first)).toEqual({ state: 'dead' });
    expect((await callAction(resetPassword, { token: first, password: 'brand-new-password-5', confirm: 'brand-new-password-5' })).state).toMatchObject({ ok: false, error: RESET_LINK_DEAD });
    expect((await callAction(resetPassword, { token: second, password: 'brand-new-password-5', confirm: 'brand-new-password-5' })).redirect).toBe('/sign-in?reset=1');
  });

  it('two requests at the same moment leave exactly one live link, and both callers get the same answer', async () => {
    const user = await createUserWithRole((await createCompany()).id, 'sales');
    const outcomes = await Promise.all([0, 1].map(() => inRequest(null, () => callAction(requestPasswordReset, { email: user.email }))));
    expect(outcomes.map((o) => o.state?.ok)).toEqual([true, true]);
    await waitForMails(user.email, 2);
    expect(await liveTokens(user.id)).toBe(1);
    const states = await Promise.all((await tokensOf(user.email)).map((t) => inspectResetLink(t)));
    expect(states.filter((s) => s.state === 'valid')).toHaveLength(1);
  });

  it('when the audit row cannot be written, nothing is kept: no new link, and the earlier link still works', async () => {
    const user = await createUserWithRole((await createCompany()).id, 'admin');
    await callAction(requestPasswordReset, { email: user.email });
    await waitForMails(user.email, 1);
    const [earlier] = await tokensOf(user.email);
    const rowsBefore = await models().PasswordResetToken.count({ where: { userId: user.id } });

    auditFault.failAction = 'password.reset_requested';
    const failed = await callAction(requestPasswordReset, { email: user.email });
    expect(failed.state).toMatchObject({ ok: false, code: 'internal' });
    expect(await models().PasswordResetToken.count({ where: { userId: user.id } })).toBe(rowsBefore);
    expect(await inspectResetLink(earlier)).toEqual({ state: 'valid', email: user.email });
  });
});
