import 'server-only';
import type { Transaction } from 'sequelize';
import { insertAuditEvent, type AuditAction } from '@/db/queries/audit';
import type { RequestMeta } from './request-meta';

export type Actor = { id: string; name: string; email: string } | null;

/** Writes one audit event: who (a snapshot label), what, to whom, when (now), from where. */
export async function audit(
  event: {
    companyId: number | null;
    actor: Actor;
    action: AuditAction;
    subjectUserId?: string | null;
    target?: string | null;
    detail?: Record<string, unknown>;
  },
  meta: RequestMeta,
  t?: Transaction,
): Promise<void> {
  await insertAuditEvent(
    {
      companyId: event.companyId,
      actorUserId: event.actor?.id ?? null,
      actorLabel: event.actor ? `${event.actor.name} <${event.actor.email}>` : null,
      action: event.action,
      subjectUserId: event.subjectUserId ?? null,
      targetLabel: event.target ?? null,
      detail: event.detail ?? null,
      ip: meta.ip,
      userAgent: meta.userAgent,
    },
    t,
  );
}
