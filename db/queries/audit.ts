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
  | 'webhook.removed'
  | 'billing.checkout_started'
  | 'billing.plan_change_requested'
  | 'billing.plan_changed'
  | 'billing.subscription_status'
  | 'billing.payment_failed'
  | 'catalogue.dish_created'
  | 'catalogue.dish_updated'
  | 'catalogue.dish_deleted'
  | 'service.created'
  | 'service.updated'
  | 'service.deleted'
  | 'upload.confirmed'
  | 'study.archived'
  | 'study.restored'
  | 'share_link.created'
  | 'share_link.revoked'
  | 'quote.accepted'
  | 'quote.declined'
  | 'staff.trial_extended'
  | 'staff.plan_changed'
  | 'staff.plan_change_requested';

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

export type AuditFilter = {
  /** Action name prefixes ('billing.', 'session.'…); empty or absent: every action. */
  prefixes?: readonly string[];
  /** Part of the actor's name or address (case-insensitive). */
  actor?: string;
  /** Inclusive UTC bounds. */
  from?: Date;
  to?: Date;
};

/**
 * A company's log, newest first: its own events, plus the personal security events (sign-in
 * failures, password resets) of people who are members now. Paged by id (`beforeId`), so an
 * export can walk the whole log without OFFSET scans.
 */
export async function listAuditEventsForCompany(companyId: number, opts: { limit?: number; beforeId?: number } & AuditFilter = {}): Promise<AuditEntry[]> {
  const { sequelize } = models();
  const limit = Math.min(Math.max(opts.limit ?? 100, 1), 1000);
  const replacements: Record<string, unknown> = { companyId, beforeId: opts.beforeId ?? null };
  const where: string[] = [];
  const prefixes = (opts.prefixes ?? []).filter((p) => /^[a-z_]+\.$/.test(p));
  if (prefixes.length > 0) {
    where.push(`(${prefixes.map((_, i) => `action LIKE :prefix${i}`).join(' OR ')})`);
    prefixes.forEach((p, i) => (replacements[`prefix${i}`] = `${p}%`));
  }
  if (opts.actor) {
    where.push("actor_label LIKE :actor ESCAPE '!'");
    replacements.actor = `%${opts.actor.replace(/[!%_]/g, (c) => `!${c}`)}%`;
  }
  if (opts.from) {
    where.push('created_at >= :from');
    replacements.from = opts.from;
  }
  if (opts.to) {
    where.push('created_at <= :to');
    replacements.to = opts.to;
  }
  const rows = await sequelize.query<Record<string, unknown>>(
    `SELECT id, created_at, action, actor_label, target_label, detail, ip, user_agent
       FROM audit_events
      WHERE (company_id = :companyId
             OR (company_id IS NULL AND subject_user_id IN (SELECT user_id FROM memberships WHERE company_id = :companyId)))
        AND (:beforeId IS NULL OR id < :beforeId)
        ${where.map((w) => `AND ${w}`).join('\n        ')}
      ORDER BY id DESC
      LIMIT ${limit}`,
    { replacements, type: QueryTypes.SELECT },
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
