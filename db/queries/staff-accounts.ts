import 'server-only';
import { QueryTypes } from 'sequelize';
import { models } from '@/db/models';

export type AccountSummary = { id: number; name: string; planName: string; planCode: string; trialEndsAt: Date | null; members: number; pendingInvitations: number; createdAt: Date };

/** Every company account with its plan and head-count, for the platform operator (staff only). */
export async function listCompanyAccounts(limit = 200): Promise<AccountSummary[]> {
  const { sequelize } = models();
  const rows = await sequelize.query<Record<string, unknown>>(
    `SELECT c.id, c.name, c.trial_ends_at, c.created_at, p.name AS plan_name, p.code AS plan_code,
            (SELECT COUNT(*) FROM memberships m WHERE m.company_id = c.id) AS members,
            (SELECT COUNT(*) FROM invitations i WHERE i.company_id = c.id AND i.accepted_at IS NULL AND i.revoked_at IS NULL AND i.expires_at > :now) AS pending
       FROM companies c JOIN plans p ON p.id = c.plan_id
      ORDER BY c.created_at DESC, c.id DESC
      LIMIT ${Math.min(Math.max(limit, 1), 1000)}`,
    { replacements: { now: new Date() }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({
    id: Number(r.id),
    name: String(r.name),
    planName: String(r.plan_name),
    planCode: String(r.plan_code),
    trialEndsAt: r.trial_ends_at ? new Date(r.trial_ends_at as string) : null,
    members: Number(r.members),
    pendingInvitations: Number(r.pending),
    createdAt: new Date(r.created_at as string),
  }));
}
