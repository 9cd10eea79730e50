import 'server-only';
import type { Transaction } from 'sequelize';
import { insertAuditEvent, type AuditAction } from '@/db/queries/audit';
import { currentRequestMeta, type RequestMeta } from './request-meta';

export type Actor = { id: string; name: string; email: string } | null;

/** Writes one audit event: who (a snapshot label), what, to whom, when (now), from where. */
export async function audit(
  event: {
    companyId: number | null;
    actor: Actor;
    /** For actors without an account (a customer through a link, the payment provider). */
    actorLabel?: string | null;
    actorUserId?: string | null;
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
      actorUserId: event.actor?.id ?? event.actorUserId ?? null,
      actorLabel: event.actor ? `${event.actor.name} <${event.actor.email}>` : (event.actorLabel ?? null),
      action: event.action,
      subjectUserId: event.subjectUserId ?? null,
      targetLabel: event.target ?? null,
      detail: event.detail ?? null,
      // Callers pass the throttling meta, whose address is null without TRUST_PROXY; the log
      // then takes the connection's address (auditAddressFrom), which is fine for a record.
      ip: meta.ip ?? (await currentRequestMeta()).ip,
      userAgent: meta.userAgent,
    },
    t,
  );
}
