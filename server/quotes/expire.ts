import 'server-only';
import { models } from '@/db/models';
import { hasOverdueQuotes, insertQuoteEvent, lockOverdueQuotes, moveQuoteStatus } from '@/db/queries/quotes';
import { OPEN_STATUSES, utcDay } from './status';

/**
 * Writes down what time already decided: sent or viewed quotes past their validity day become
 * expired, each with a timeline event. Called on reads (list, detail, customer page, decision)
 * rather than by a timer, so no process has to stay alive for it; idempotent under the row locks.
 */
export async function expireOverdueQuotes(companyId: number, now: Date = new Date()): Promise<number> {
  const today = utcDay(now);
  if (!(await hasOverdueQuotes(companyId, today))) return 0;
  const { sequelize } = models();
  return sequelize.transaction(async (t) => {
    const overdue = await lockOverdueQuotes(companyId, today, t);
    for (const q of overdue) {
      if (await moveQuoteStatus(companyId, q.id, OPEN_STATUSES, 'expired', {}, t)) {
        await insertQuoteEvent({ companyId, quoteId: q.id, kind: 'expired', fromStatus: q.status, toStatus: 'expired', actorLabel: 'FadeLedger (validity ended)' }, t);
      }
    }
    return overdue.length;
  });
}
