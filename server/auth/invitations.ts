import 'server-only';
import type { Transaction } from 'sequelize';
import { models } from '@/db/models';
import type { CompanyRole } from '@/db/models';
import { getEnv } from '@/server/env';
import { ConflictError, InvalidInputError, NotFoundError } from '@/server/errors';
import { lockCompanyRow } from '@/db/queries/company-lock';
import { assertWithinPlan } from '@/server/plan-limit';
import { sendMail } from '@/server/mail/send';
import { invitationMail } from '@/server/mail/templates/invitation';
import { createInvitation, findInvitationByTokenHash, findInvitationInCompany, findPendingInvitationByEmail, type InvitationRow } from '@/db/queries/invitations';
import { addMembership, findMembership, isMemberByEmail } from '@/db/queries/team';
import { createUser, findUserByEmail, normaliseEmail, type UserRow } from '@/db/queries/users';
import { hashToken, newToken } from './tokens';
import { hashPassword } from './password';
import { ROLE_LABELS } from './permissions';
import { audit, type Actor } from './audit';
import type { CompanyAuthContext } from './guards';
import type { RequestMeta } from './request-meta';

export const INVITATION_DAYS = 7;
/** Resending faster than this is refused: one click should not become a mail flood. */
export const RESEND_COOLDOWN_SECONDS = 60;

export const INVITATION_DEAD = {
  unknown: 'This invitation link is not valid. Ask the person who invited you to send a new one.',
  expired: 'This invitation has expired. Ask the person who invited you to send it again.',
  accepted: 'This invitation has already been used. Sign in to continue.',
  revoked: 'This invitation was withdrawn. Ask the person who invited you if you should still join.',
} as const;

const actorOf = (ctx: CompanyAuthContext): Actor => ({ id: ctx.user.id, name: ctx.user.name, email: ctx.user.email });
const acceptUrl = (token: string) => `${getEnv().APP_URL.replace(/\/$/, '')}/invite/${token}`;

async function mailInvitation(ctx: CompanyAuthContext, invitation: { email: string; role: CompanyRole; expiresAt: Date }, token: string): Promise<void> {
  await sendMail({
    to: invitation.email,
    replyTo: ctx.user.email,
    ...invitationMail({ companyName: ctx.company.name, inviterName: ctx.user.name, roleLabel: ROLE_LABELS[invitation.role], acceptUrl: acceptUrl(token), expiresAt: invitation.expiresAt }),
  });
}

/**
 * Invites an address with a role. The seat check and the insert share one transaction that
 * holds the company row lock (lockCompanyRow), so parallel invitations can never take more
 * seats than the plan has. If the mail cannot be sent, the invitation is withdrawn again and
 * the seat is free: nothing is left half-done.
 */
export async function inviteMember(ctx: CompanyAuthContext, input: { email: string; role: CompanyRole }, meta: RequestMeta): Promise<{ invitationId: number }> {
  const { sequelize } = models();
  const email = normaliseEmail(input.email);
  const token = newToken();
  const invitation = await sequelize.transaction(async (t) => {
    await assertWithinPlan(await lockCompanyRow(ctx.companyId, t), 'seats');
    if (await isMemberByEmail(ctx.companyId, email, t)) throw new InvalidInputError(`${email} is already a member of ${ctx.company.name}.`, { email: ['Already a member.'] });
    if (await findPendingInvitationByEmail(ctx.companyId, email, t)) {
      throw new InvalidInputError(`${email} already has a pending invitation. Resend it from the list instead.`, { email: ['Already invited.'] });
    }
    const row = await createInvitation(
      { companyId: ctx.companyId, email, role: input.role, tokenHash: hashToken(token), invitedByUserId: ctx.user.id, expiresAt: new Date(Date.now() + INVITATION_DAYS * 86_400_000) },
      t,
    );
    await audit({ companyId: ctx.companyId, actor: actorOf(ctx), action: 'member.invited', target: email, detail: { role: input.role, invitationId: row.id } }, meta, t);
    return row;
  });
  try {
    await mailInvitation(ctx, invitation, token);
  } catch (error) {
    await invitation.update({ revokedAt: new Date() });
    throw error;
  }
  return { invitationId: invitation.id };
}

/**
 * Sends a fresh link (the old one stops working) and a fresh expiry. An expired invitation no
 * longer holds a seat, so renewing it must pass the seat check again.
 */
export async function resendInvitation(ctx: CompanyAuthContext, invitationId: number, meta: RequestMeta): Promise<void> {
  const { sequelize } = models();
  const token = newToken();
  const invitation = await sequelize.transaction(async (t) => {
    const row = await findInvitationInCompany(ctx.companyId, invitationId, t, true);
    if (!row) throw new NotFoundError('That invitation');
    if (row.acceptedAt) throw new ConflictError(`${row.email} has already accepted this invitation.`);
    if (row.revokedAt) throw new ConflictError('This invitation was revoked. Invite the address again instead.');
    const sinceLast = (Date.now() - row.lastSentAt.getTime()) / 1000;
    if (sinceLast < RESEND_COOLDOWN_SECONDS) throw new ConflictError(`The invitation to ${row.email} was sent less than a minute ago. Give it a moment to arrive.`);
    if (row.expiresAt.getTime() <= Date.now()) await assertWithinPlan(await lockCompanyRow(ctx.companyId, t), 'seats');
    await row.update(
      { tokenHash: hashToken(token), expiresAt: new Date(Date.now() + INVITATION_DAYS * 86_400_000), lastSentAt: new Date(), sendCount: row.sendCount + 1 },
      { transaction: t },
    );
    await audit({ companyId: ctx.companyId, actor: actorOf(ctx), action: 'invitation.resent', target: row.email, detail: { invitationId: row.id, sendCount: row.sendCount } }, meta, t);
    return row;
  });
  await mailInvitation(ctx, invitation, token);
}

export async function revokeInvitation(ctx: CompanyAuthContext, invitationId: number, meta: RequestMeta): Promise<{ email: string }> {
  const { sequelize } = models();
  return sequelize.transaction(async (t) => {
    const row = await findInvitationInCompany(ctx.companyId, invitationId, t, true);
    if (!row) throw new NotFoundError('That invitation');
    if (row.acceptedAt) throw new ConflictError(`${row.email} has already accepted; remove the member instead.`);
    if (!row.revokedAt) {
      await row.update({ revokedAt: new Date() }, { transaction: t });
      await audit({ companyId: ctx.companyId, actor: actorOf(ctx), action: 'invitation.revoked', target: row.email, detail: { invitationId: row.id } }, meta, t);
    }
    return { email: row.email };
  });
}

// ---- the invitee's side -------------------------------------------------------------------

export type InvitationView =
  | { state: 'valid'; companyId: number; companyName: string; email: string; role: CompanyRole; expiresAt: Date; accountExists: boolean }
  | { state: keyof typeof INVITATION_DEAD; message: string };

function deadState(row: InvitationRow | null): keyof typeof INVITATION_DEAD | null {
  if (!row) return 'unknown';
  if (row.acceptedAt) return 'accepted';
  if (row.revokedAt) return 'revoked';
  if (row.expiresAt.getTime() <= Date.now()) return 'expired';
  return null;
}

/** What the invitation page shows for a link. */
export async function inspectInvitation(token: string): Promise<InvitationView> {
  const found = await findInvitationByTokenHash(hashToken(token));
  const dead = deadState(found?.invitation ?? null);
  if (dead || !found) return { state: dead ?? 'unknown', message: INVITATION_DEAD[dead ?? 'unknown'] };
  const inv = found.invitation;
  return { state: 'valid', companyId: inv.companyId, companyName: found.companyName, email: inv.email, role: inv.role, expiresAt: inv.expiresAt, accountExists: Boolean(await findUserByEmail(inv.email)) };
}

/**
 * Spends the link inside a transaction: the company row is locked first (the same order as
 * inviting, so the two never deadlock), then the invitation row, which is re-checked there —
 * of two tabs accepting at once, one wins and the other hears the link was used.
 */
async function spendInvitation<T>(token: string, work: (inv: InvitationRow, t: Transaction) => Promise<T>): Promise<T> {
  const { sequelize } = models();
  const peek = await findInvitationByTokenHash(hashToken(token));
  const early = deadState(peek?.invitation ?? null);
  if (early || !peek) throw new InvalidInputError(INVITATION_DEAD[early ?? 'unknown']);
  return sequelize.transaction(async (t) => {
    await lockCompanyRow(peek.invitation.companyId, t);
    const locked = await findInvitationByTokenHash(hashToken(token), t, true);
    const dead = deadState(locked?.invitation ?? null);
    if (dead || !locked) throw new InvalidInputError(INVITATION_DEAD[dead ?? 'unknown']);
    return work(locked.invitation, t);
  });
}

/** The link creates the account (for an address without one) and its membership. */
export async function acceptAsNewAccount(token: string, input: { name: string; password: string }, meta: RequestMeta): Promise<{ userId: string; companyId: number }> {
  const passwordHash = await hashPassword(input.password);
  return spendInvitation(token, async (inv, t) => {
    if (await findUserByEmail(inv.email, t)) throw new ConflictError('An account already uses this address. Sign in below to accept the invitation.');
    const user = await createUser({ email: inv.email, name: input.name, passwordHash }, t);
    await addMembership(inv.companyId, user.id, inv.role, t);
    await inv.update({ acceptedAt: new Date(), acceptedUserId: user.id }, { transaction: t });
    await audit({ companyId: inv.companyId, actor: { id: user.id, name: user.name, email: user.email }, action: 'invitation.accepted', subjectUserId: user.id, target: user.email, detail: { role: inv.role, newAccount: true } }, meta, t);
    return { userId: user.id, companyId: inv.companyId };
  });
}

/**
 * An existing account joins the company. The caller has proved it is that account (signed in
 * as it, or gave its password under the sign-in throttle).
 */
export async function acceptAsExistingUser(token: string, user: UserRow | { id: string; name: string; email: string }, meta: RequestMeta): Promise<{ userId: string; companyId: number }> {
  return spendInvitation(token, async (inv, t) => {
    if (normaliseEmail(user.email) !== inv.email) throw new InvalidInputError(`This invitation is for ${inv.email}.`);
    if (!(await findMembership(user.id, inv.companyId, t))) await addMembership(inv.companyId, user.id, inv.role, t);
    await inv.update({ acceptedAt: new Date(), acceptedUserId: user.id }, { transaction: t });
    await audit({ companyId: inv.companyId, actor: { id: user.id, name: user.name, email: user.email }, action: 'invitation.accepted', subjectUserId: user.id, target: user.email, detail: { role: inv.role, newAccount: false } }, meta, t);
    return { userId: user.id, companyId: inv.companyId };
  });
}
