import 'server-only';
import type { Transaction } from 'sequelize';
import { models } from '@/db/models';
import type { CompanyRole } from '@/db/models';
import { pendingInvitationWhere } from './team';

export type InvitationRow = InstanceType<ReturnType<typeof models>['Invitation']>;

export type PendingInvitation = { id: number; email: string; role: CompanyRole; expiresAt: Date; lastSentAt: Date; sendCount: number; invitedByName: string | null };

/** Invitations that are not accepted or revoked, expired ones included (they can be resent). */
export async function listOpenInvitations(companyId: number): Promise<(PendingInvitation & { expired: boolean })[]> {
  const { Invitation, User } = models();
  const now = new Date();
  const rows = await Invitation.findAll({
    where: { companyId, acceptedAt: null, revokedAt: null },
    include: [{ model: User, as: 'invitedBy', required: false }],
    order: [['createdAt', 'ASC'], ['id', 'ASC']],
  });
  return rows.map((r) => ({
    id: r.id,
    email: r.email,
    role: r.role,
    expiresAt: r.expiresAt,
    lastSentAt: r.lastSentAt,
    sendCount: r.sendCount,
    invitedByName: (r as unknown as { invitedBy: { name: string } | null }).invitedBy?.name ?? null,
    expired: r.expiresAt.getTime() <= now.getTime(),
  }));
}

/** An invitation of this company by id (null for another company's id), optionally locked. */
export async function findInvitationInCompany(companyId: number, id: number, t?: Transaction, lock = false): Promise<InvitationRow | null> {
  const { Invitation } = models();
  return Invitation.findOne({ where: { id, companyId }, transaction: t, lock: lock && t ? t.LOCK.UPDATE : undefined });
}

export async function findPendingInvitationByEmail(companyId: number, email: string, t?: Transaction): Promise<InvitationRow | null> {
  const { Invitation } = models();
  return Invitation.findOne({ where: { companyId, email, ...pendingInvitationWhere() }, transaction: t });
}

/** Looks an invitation up by its link's digest, with its company's name. */
export async function findInvitationByTokenHash(tokenHash: string, t?: Transaction, lock = false) {
  const { Invitation, Company } = models();
  const row = await Invitation.findOne({
    where: { tokenHash },
    include: [{ model: Company, as: 'company' }],
    transaction: t,
    lock: lock && t ? { level: t.LOCK.UPDATE, of: Invitation } : undefined,
  });
  if (!row) return null;
  const company = (row as unknown as { company: { id: number; name: string } }).company;
  return { invitation: row, companyName: company.name };
}

export async function createInvitation(
  data: { companyId: number; email: string; role: CompanyRole; tokenHash: string; invitedByUserId: string; expiresAt: Date },
  t: Transaction,
): Promise<InvitationRow> {
  const { Invitation } = models();
  return Invitation.create({ ...data, lastSentAt: new Date(), sendCount: 1 }, { transaction: t });
}
