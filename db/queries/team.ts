import 'server-only';
import { Op, QueryTypes, type Transaction } from 'sequelize';
import { models } from '@/db/models';
import type { CompanyRole } from '@/db/models';

/** Pending = not accepted, not revoked, not expired. Pending invitations hold a seat. */
export function pendingInvitationWhere(now = new Date()) {
  return { acceptedAt: null, revokedAt: null, expiresAt: { [Op.gt]: now } };
}

export type MembershipWithCompany = { membershipId: number; role: CompanyRole; company: { id: number; name: string; planId: number } };

/** The person's role in one company, or null when they are not a member. */
export async function findMembership(userId: string, companyId: number, t?: Transaction): Promise<MembershipWithCompany | null> {
  const { Membership, Company } = models();
  const row = await Membership.findOne({ where: { userId, companyId }, include: [{ model: Company, as: 'company' }], transaction: t });
  return row ? toMembershipWithCompany(row) : null;
}

/** The company a person lands in when their session names none (their oldest membership). */
export async function firstMembership(userId: string): Promise<MembershipWithCompany | null> {
  const { Membership, Company } = models();
  const row = await Membership.findOne({ where: { userId }, include: [{ model: Company, as: 'company' }], order: [['createdAt', 'ASC'], ['id', 'ASC']] });
  return row ? toMembershipWithCompany(row) : null;
}

export async function listMembershipsOfUser(userId: string): Promise<{ companyId: number; companyName: string; role: CompanyRole }[]> {
  const { Membership, Company } = models();
  const rows = await Membership.findAll({ where: { userId }, include: [{ model: Company, as: 'company' }], order: [['createdAt', 'ASC'], ['id', 'ASC']] });
  return rows.map((r) => {
    const m = toMembershipWithCompany(r);
    return { companyId: m.company.id, companyName: m.company.name, role: m.role };
  });
}

export type TeamMember = { membershipId: number; userId: string; name: string; email: string; role: CompanyRole; joinedAt: Date };

export async function listMembers(companyId: number): Promise<TeamMember[]> {
  const { Membership, User } = models();
  const rows = await Membership.findAll({ where: { companyId }, include: [{ model: User, as: 'user' }], order: [['createdAt', 'ASC'], ['id', 'ASC']] });
  return rows.map((r) => {
    const user = (r as unknown as { user: InstanceType<typeof User> }).user;
    return { membershipId: r.id, userId: r.userId, name: user.name, email: user.email, role: r.role, joinedAt: r.createdAt };
  });
}

/** One member of this company by membership id, or null (also for another company's id). */
export async function findMemberInCompany(companyId: number, membershipId: number, t?: Transaction, lock = false): Promise<TeamMember | null> {
  const { Membership, User } = models();
  const row = await Membership.findOne({
    where: { id: membershipId, companyId },
    include: [{ model: User, as: 'user' }],
    transaction: t,
    lock: lock && t ? t.LOCK.UPDATE : undefined,
  });
  if (!row) return null;
  const user = (row as unknown as { user: InstanceType<typeof User> }).user;
  return { membershipId: row.id, userId: row.userId, name: user.name, email: user.email, role: row.role, joinedAt: row.createdAt };
}

export async function isMemberByEmail(companyId: number, email: string, t?: Transaction): Promise<boolean> {
  const { Membership, User } = models();
  const n = await Membership.count({ where: { companyId }, include: [{ model: User, as: 'user', where: { email } }], transaction: t });
  return n > 0;
}

/** Inside a transaction a locking read, so it sees what a concurrent change just committed. */
export async function countAdmins(companyId: number, t?: Transaction): Promise<number> {
  const { Membership, sequelize } = models();
  if (!t) return Membership.count({ where: { companyId, role: 'admin' } });
  const [row] = await sequelize.query<{ n: number }>("SELECT COUNT(*) AS n FROM memberships WHERE company_id = :companyId AND role = 'admin' LOCK IN SHARE MODE", {
    replacements: { companyId },
    type: QueryTypes.SELECT,
    transaction: t,
  });
  return Number(row.n);
}

export async function countMembers(companyId: number, t?: Transaction): Promise<number> {
  const { Membership } = models();
  return Membership.count({ where: { companyId }, transaction: t });
}

export async function countPendingInvitations(companyId: number, t?: Transaction): Promise<number> {
  const { Invitation } = models();
  return Invitation.count({ where: { companyId, ...pendingInvitationWhere() }, transaction: t });
}

export async function setMemberRole(companyId: number, membershipId: number, role: CompanyRole, t: Transaction): Promise<void> {
  const { Membership } = models();
  await Membership.update({ role }, { where: { id: membershipId, companyId }, transaction: t });
}

export async function deleteMember(companyId: number, membershipId: number, t: Transaction): Promise<void> {
  const { Membership } = models();
  await Membership.destroy({ where: { id: membershipId, companyId }, transaction: t });
}

export async function addMembership(companyId: number, userId: string, role: CompanyRole, t: Transaction): Promise<number> {
  const { Membership } = models();
  const row = await Membership.create({ companyId, userId, role }, { transaction: t });
  return row.id;
}

function toMembershipWithCompany(row: InstanceType<ReturnType<typeof models>['Membership']>): MembershipWithCompany {
  const company = (row as unknown as { company: InstanceType<ReturnType<typeof models>['Company']> }).company;
  return { membershipId: row.id, role: row.role, company: { id: company.id, name: company.name, planId: company.planId } };
}
