import 'server-only';
import type { Transaction } from 'sequelize';
import { audit, type Actor } from '@/server/auth/audit';
import { currentRequestMeta, type RequestMeta } from '@/server/auth/request-meta';
import type { AuditAction } from '@/db/queries/audit';

/** Who a company change is written down for: the company and the person (null: the system or a customer). */
export type AuditWho = { companyId: number | null; actor: Actor; actorLabel?: string | null; actorUserId?: string | null };

/** The person of an action's context, as the audit log labels them. */
export function actorOf(ctx: { user: { id: string; name: string; email: string } }): NonNullable<Actor> {
  return { id: ctx.user.id, name: ctx.user.name, email: ctx.user.email };
}

/**
 * Writes one audit row for a company change, inside the change's own transaction (`t`): a change
 * that rolls back leaves no row, and a row never exists without its change. The address and
 * browser come from the current request when there is one (webhooks and jobs have none).
 */
export async function recordAudit(
  who: AuditWho,
  what: { action: AuditAction; target?: string | null; detail?: Record<string, unknown>; subjectUserId?: string | null },
  t?: Transaction,
  meta?: RequestMeta,
): Promise<void> {
  await audit(
    { companyId: who.companyId, actor: who.actor, actorLabel: who.actorLabel, actorUserId: who.actorUserId, action: what.action, target: what.target ?? null, detail: what.detail, subjectUserId: what.subjectUserId ?? null },
    meta ?? (await currentRequestMeta()),
    t,
  );
}
