import 'server-only';
import { Op } from 'sequelize';
import type { Adapter, DatabaseSession, DatabaseUser } from 'lucia';
import { models } from '@/db/models';
import { hashToken } from './tokens';

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
    const { Session, User } = models();
    const row = await Session.findByPk(hashToken(sessionId), { include: [{ model: User, as: 'user' }] });
    if (!row) return [null, null];
    const user = (row as unknown as { user: InstanceType<typeof User> | null }).user;
    return [toDatabaseSession(row, sessionId), user ? toDatabaseUser(user) : null];
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
type UserRow = InstanceType<ReturnType<typeof models>['User']>;

function toDatabaseSession(row: SessionRow, id: string): DatabaseSession {
  return {
    id,
    userId: row.userId,
    expiresAt: new Date(row.expiresAt),
    attributes: { activeCompanyId: row.activeCompanyId, ip: row.ip, userAgent: row.userAgent, createdAt: row.createdAt, digest: row.id },
  };
}

function toDatabaseUser(user: UserRow): DatabaseUser {
  return { id: user.id, attributes: { email: user.email, name: user.name, isStaff: Boolean(user.isStaff) } };
}
