import 'server-only';
import { getQuote, listQuoteEvents, type QuoteDetail, type QuoteEventItem } from '@/db/queries/quotes';
import { listShareLinks, type ShareLinkItem } from '@/db/queries/share-links';
import { NotFoundError } from '@/server/errors';
import { expireOverdueQuotes } from './expire';

/** A route segment id ("42") as a number; anything else is "not found", never a 500. */
export function parseId(raw: string | undefined): number | null {
  if (!raw || !/^\d{1,10}$/.test(raw)) return null;
  const n = Number(raw);
  return Number.isSafeInteger(n) && n > 0 ? n : null;
}

export interface QuoteWithHistory {
  quote: QuoteDetail;
  links: ShareLinkItem[];
  events: QuoteEventItem[];
}

/** One quote of the company with its links and timeline; NotFoundError for ids of other companies. */
export async function readQuote(companyId: number, rawId: string | number): Promise<QuoteWithHistory> {
  const id = typeof rawId === 'number' ? rawId : parseId(rawId);
  if (!id) throw new NotFoundError('That quote');
  await expireOverdueQuotes(companyId);
  const quote = await getQuote(companyId, id);
  if (!quote) throw new NotFoundError('That quote');
  const [links, events] = await Promise.all([listShareLinks(companyId, id), listQuoteEvents(companyId, id)]);
  return { quote, links, events };
}
