import type { QuoteListItem } from '@/db/queries/quotes';
import { quoteReference } from '@/server/quotes/status';

/**
 * What an event's `data` says, kept small and stable: ids to fetch more through /api/v1 (with an
 * API key), the words a receiver shows, money as decimal strings. No customer e-mail or IP address.
 */
export function quoteEventData(quote: QuoteListItem, change: { status: string; at: Date; decidedByName?: string; comment?: string | null }): Record<string, unknown> {
  return {
    quote: {
      id: quote.id,
      reference: quoteReference(quote.number),
      title: quote.title,
      status: change.status,
      customerName: quote.customerName,
      siteName: quote.siteName,
      dish: quote.chosenDishName,
      total: quote.total,
      currency: quote.currency,
      validUntil: quote.validUntil,
      studyId: quote.studyId,
    },
    ...(change.decidedByName !== undefined ? { decision: { by: change.decidedByName, comment: change.comment ?? null } } : {}),
    at: change.at.toISOString(),
  };
}

export function studyEventData(study: { id: number; title: string; customerName: string; siteName: string; serviceName: string; recommendedDiameterM: number | null; revision: number; createdByUserId: string }): Record<string, unknown> {
  const { createdByUserId: _internal, ...shown } = study;
  return { study: shown };
}
