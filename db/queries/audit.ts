import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { models } from '@/db/models';

export type AuditAction =
  | 'company.created'
  | 'sign_up.requested'
  | 'sign_up.confirmed'
  | 'member.invited'
  | 'invitation.resent'
  | 'invitation.revoked'
  | 'invitation.accepted'
  | 'member.role_changed'
  | 'member.removed'
  | 'member.left'
  | 'session.signed_in'
  | 'session.sign_in_failed'
  | 'session.sign_in_throttled'
  | 'session.unlock_link_sent'
  | 'session.unlocked'
  | 'session.signed_out'
  | 'session.revoked'
  | 'session.signed_out_everywhere'
  | 'password.reset_requested'
  | 'password.reset'
  | 'password.changed'
  | 'api_key.created'
  | 'api_key.revoked'
  | 'webhook.created'
  | 'webhook.removed';

export type AuditEventInput = {
  companyId: number | null;
  actorUserId: string | null;
  actorLabel: string | null;
  action: AuditAction;
  subjectUserId?: string | null;
  targetLabel?: string | null;
  detail?: Record<string, unknown> | null;
  ip: string | null;
  userAgent: string | null;
};

export async function insertAuditEvent(event: AuditEventInput, t?: Transaction): Promise<void> {
  const { AuditEvent } = models();
  await AuditEvent.create(
    {
      companyId: event.companyId,
      actorUserId: event.actorUserId,
      actorLabel: event.actorLabel?.slice(0, 300) ?? null,
      action: event.action,
      subjectUserId: event.subjectUserId ?? null,
      targetLabel: event.targetLabel?.slice(0, 300) ?? null,
      detail: event.detail ? JSON.stringify(event.detail) : null,
      ip: event.ip,
      userAgent: event.userAgent,
    },
    { transaction: t },
  );
}

export type AuditEntry = {
  id: number;
  createdAt: Date;
  action: AuditAction;
  actorLabel: string | null;
  targetLabel: string | null;
  detail: Record<string, unknown> | null;
  ip: string | null;
  userAgent: string | null;
};

/**
 * A company's log, newest first: its own events, plus the personal security events (sign-in
 * failures, password resets) of people who are members now.
 */
export async function listAuditEventsForCompany(companyId: number, opts: { limit?: number; beforeId?: number } = {}): Promise<AuditEntry[]> {
  const { sequelize } = models();
  const limit = Math.min(Math.max(opts.limit ?? 100, 1), 500);
  const rows = await sequelize.query<Record<string, unknown>>(
    `SELECT id, created_at, action, actor_label, target_label, detail, ip, user_agent
       FROM audit_events
      WHERE (company_id = :companyId
             OR (company_id IS NULL AND subject_user_id IN (SELECT user_id FROM memberships WHERE company_id = :companyId)))
        AND (:beforeId IS NULL OR id < :beforeId)
      ORDER BY id DESC
      LIMIT ${limit}`,
    { replacements: { companyId, beforeId: opts.beforeId ?? null }, type: QueryTypes.SELECT },
  );
  return rows.map(toEntry);
}

/** A person's own security events, for their security page. */
export async function listSecurityEventsForUser(userId: string, limit = 20): Promise<AuditEntry[]> {
  const { sequelize } = models();
  const rows = await sequelize.query<Record<string, unknown>>(
    `SELECT id, created_at, action, actor_label, target_label, detail, ip, user_agent
       FROM audit_events
      WHERE subject_user_id = :userId AND (action LIKE 'session.%' OR action LIKE 'password.%')
      ORDER BY id DESC
      LIMIT ${Math.min(Math.max(limit, 1), 200)}`,
    { replacements: { userId }, type: QueryTypes.SELECT },
  );
  return rows.map(toEntry);
}

function toEntry(r: Record<string, unknown>): AuditEntry {
  let detail: Record<string, unknown> | null = null;
  if (typeof r.detail === 'string') {
    try {
      detail = JSON.parse(r.detail) as Record<string, unknown>;
    } catch {
      detail = null;
    }
  }
  return {
    id: Number(r.id),
    createdAt: new Date(r.created_at as string),
    action: r.action as AuditAction,
    actorLabel: (r.actor_label as string | null) ?? null,
    targetLabel: (r.target_label as string | null) ?? null,
    detail,
    ip: (r.ip as string | null) ?? null,
    userAgent: (r.user_agent as string | null) ?? null,
  };
}
