import 'server-only';
import { Op, QueryTypes } from 'sequelize';
import type { Adapter, DatabaseSession, DatabaseUser } from 'lucia';
import { models } from '@/db/models';
import type { CompanyRole } from '@/db/models';
import { PLAN_LIMIT_COLUMNS, PLAN_LIMITS_JOIN, type PlanLimitRow } from '@/server/billing/limits';
import { hashToken } from './tokens';

/**
 * The person's membership in the session's active company, with that company's plan row, read in
 * the same query as the session: what guards.ts needs for every request, in one round trip.
 * Null when the session names no company or the person is no longer a member of it.
 */
export type ActiveMembership = { membershipId: number; role: CompanyRole; company: { id: number; name: string; planId: number }; plan: PlanLimitRow };

type SessionUserRow = {
  id: string; user_id: string; expires_at: Date; active_company_id: number | null; ip: string | null; user_agent: string | null; created_at: Date;
  u_id: string | null; u_email: string; u_name: string; u_is_staff: number | boolean;
  m_id: number | null; m_role: CompanyRole; c_id: number; c_name: string; c_plan_id: number;
} & PlanLimitRow;

/**
 * lucia v3's Adapter over our Sequelize models (lucia ships none for Sequelize). Kept in one
 * file so it can be swapped.
 *
 * The cookie carries the session token; the sessions table keys rows by its sha256 digest, so a
 * copy of the table holds no usable session. Every method that lucia calls with a session id
 * receives the token and hashes it here. getUserSessions returns the digests as ids (they are
 * only used for listing; our own queries revoke by digest).
 */
export class SequelizeSessionAdapter implements Adapter {
  async getSessionAndUser(sessionId: string): Promise<[DatabaseSession | null, DatabaseUser | null]> {
    const { sequelize } = models();
    const [r] = await sequelize.query<SessionUserRow>(
      `SELECT s.id, s.user_id, s.expires_at, s.active_company_id, s.ip, s.user_agent, s.created_at,
              u.id AS u_id, u.email AS u_email, u.name AS u_name, u.is_staff AS u_is_staff,
              m.id AS m_id, m.role AS m_role, c.id AS c_id, c.name AS c_name, c.plan_id AS c_plan_id, ${PLAN_LIMIT_COLUMNS}
         FROM sessions s
         LEFT JOIN users u ON u.id = s.user_id
         LEFT JOIN memberships m ON m.user_id = s.user_id AND m.company_id = s.active_company_id
         LEFT JOIN companies c ON c.id = m.company_id
         ${PLAN_LIMITS_JOIN}
        WHERE s.id = :digest`,
      { replacements: { digest: hashToken(sessionId) }, type: QueryTypes.SELECT },
    );
    if (!r) return [null, null];
    const activeMembership: ActiveMembership | null =
      r.m_id !== null && r.pl_id !== null ? { membershipId: r.m_id, role: r.m_role, company: { id: r.c_id, name: r.c_name, planId: r.c_plan_id }, plan: r } : null;
    const session: DatabaseSession = {
      id: sessionId,
      userId: r.user_id,
      expiresAt: new Date(r.expires_at),
      attributes: { activeCompanyId: r.active_company_id, ip: r.ip, userAgent: r.user_agent, createdAt: r.created_at, digest: r.id, activeMembership },
    };
    const user: DatabaseUser | null = r.u_id ? { id: r.u_id, attributes: { email: r.u_email, name: r.u_name, isStaff: Boolean(r.u_is_staff) } } : null;
    return [session, user];
  }

  async getUserSessions(userId: string): Promise<DatabaseSession[]> {
    const { Session } = models();
    const rows = await Session.findAll({ where: { userId }, order: [['createdAt', 'DESC']] });
    return rows.map((row) => toDatabaseSession(row, row.id));
  }

  async setSession(session: DatabaseSession): Promise<void> {
    const { Session } = models();
    await Session.create({
      id: hashToken(session.id),
      userId: session.userId,
      expiresAt: session.expiresAt,
      activeCompanyId: session.attributes.activeCompanyId,
      ip: session.attributes.ip,
      userAgent: session.attributes.userAgent,
    });
  }

  async updateSessionExpiration(sessionId: string, expiresAt: Date): Promise<void> {
    const { Session } = models();
    await Session.update({ expiresAt }, { where: { id: hashToken(sessionId) } });
  }

  async deleteSession(sessionId: string): Promise<void> {
    const { Session } = models();
    await Session.destroy({ where: { id: hashToken(sessionId) } });
  }

  async deleteUserSessions(userId: string): Promise<void> {
    const { Session } = models();
    await Session.destroy({ where: { userId } });
  }

  async deleteExpiredSessions(): Promise<void> {
    const { Session } = models();
    await Session.destroy({ where: { expiresAt: { [Op.lte]: new Date() } } });
  }
}

type SessionRow = InstanceType<ReturnType<typeof models>['Session']>;

function toDatabaseSession(row: SessionRow, id: string): DatabaseSession {
  return {
    id,
    userId: row.userId,
    expiresAt: new Date(row.expiresAt),
    attributes: { activeCompanyId: row.activeCompanyId, ip: row.ip, userAgent: row.userAgent, createdAt: row.createdAt, digest: row.id },
  };
}


