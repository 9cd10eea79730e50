import 'server-only';
import { models } from '@/db/models';
import type { CompanyRole } from '@/db/models';
import { ConflictError, NotFoundError } from '@/server/errors';
import { countAdmins, deleteMember, findMemberInCompany, setMemberRole } from '@/db/queries/team';
import { deleteUserSessionsInCompany } from '@/db/queries/sessions';
import { lockCompanyRow } from '@/db/queries/company-lock';
import { ROLE_LABELS } from './permissions';
import { audit } from './audit';
import type { CompanyAuthContext } from './guards';
import type { RequestMeta } from './request-meta';


const lastAdmin = (name: string) => `${name} is the only admin of this company. Make someone else an admin first.`;

export async function changeMemberRole(ctx: CompanyAuthContext, membershipId: number, role: CompanyRole, meta: RequestMeta): Promise<{ name: string; changed: boolean }> {
  const { sequelize } = models();
  return sequelize.transaction(async (t) => {
    // Team changes serialise on the company row, so two admins demoting each other cannot both win.
    await lockCompanyRow(ctx.companyId, t);
    const member = await findMemberInCompany(ctx.companyId, membershipId, t, true);
    if (!member) throw new NotFoundError('That member');
    if (member.role === role) return { name: member.name, changed: false };
    if (member.role === 'admin' && (await countAdmins(ctx.companyId, t)) <= 1) throw new ConflictError(lastAdmin(member.name));
    await setMemberRole(ctx.companyId, membershipId, role, t);
    await audit(
      { companyId: ctx.companyId, actor: { id: ctx.user.id, name: ctx.user.name, email: ctx.user.email }, action: 'member.role_changed', subjectUserId: member.userId, target: `${member.name} <${member.email}>`, detail: { from: member.role, to: role, fromLabel: ROLE_LABELS[member.role], toLabel: ROLE_LABELS[role] } },
      meta,
      t,
    );
    return { name: member.name, changed: true };
  });
}

/**
 * Removes a member from this company (their account and other companies stay). Their sessions
 * working in this company end at once. Removing oneself is allowed while another admin remains.
 */
export async function removeMember(ctx: CompanyAuthContext, membershipId: number, meta: RequestMeta): Promise<{ name: string; self: boolean }> {
  const { sequelize } = models();
  return sequelize.transaction(async (t) => {
    // Team changes serialise on the company row, so two admins demoting each other cannot both win.
    await lockCompanyRow(ctx.companyId, t);
    const member = await findMemberInCompany(ctx.companyId, membershipId, t, true);
    if (!member) throw new NotFoundError('That member');
    if (member.role === 'admin' && (await countAdmins(ctx.companyId, t)) <= 1) throw new ConflictError(lastAdmin(member.name));
    await deleteMember(ctx.companyId, membershipId, t);
    await deleteUserSessionsInCompany(member.userId, ctx.companyId, t);
    const self = member.userId === ctx.user.id;
    await audit(
      { companyId: ctx.companyId, actor: { id: ctx.user.id, name: ctx.user.name, email: ctx.user.email }, action: self ? 'member.left' : 'member.removed', subjectUserId: member.userId, target: `${member.name} <${member.email}>`, detail: { role: member.role } },
      meta,
      t,
    );
    return { name: member.name, self };
  });
}
