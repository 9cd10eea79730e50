import type { QuoteEventItem } from '@/db/queries/quotes';
import { dayTime } from './format';

function describe(e: QuoteEventItem): string {
  const who = e.actorLabel?.replace(/ <[^>]+>$/, '') ?? 'Someone';
  const d = e.detail ?? {};
  switch (e.kind) {
    case 'created':
      return `${who} made the draft`;
    case 'updated':
      return `${who} changed the draft`;
    case 'link_created':
      return `${who} made a comparison link${d.via === 'email' ? ' for an e-mail' : ''}`;
    case 'link_revoked':
      return `${who} revoked a link`;
    case 'emailed':
      return `${who} e-mailed the quote to ${String(d.to ?? 'the customer')}`;
    case 'sent':
      return 'Sent to the customer';
    case 'viewed':
      return 'The customer opened it for the first time';
    case 'accepted':
      return `Accepted by ${who.replace(/ \(customer\)$/, '')}`;
    case 'declined':
      return `Declined by ${who.replace(/ \(customer\)$/, '')}${d.comment ? `: “${String(d.comment)}”` : ''}`;
    case 'expired':
      return 'Expired: its validity ended before a decision';
  }
}

/** What happened to the quote, oldest first. */
export function QuoteTimeline({ events }: { events: QuoteEventItem[] }) {
  return (
    <ol className="relative space-y-3 border-l border-stone-200 pl-4">
      {events.map((e) => (
        <li key={e.id} className="relative">
          <span aria-hidden="true" className={`absolute -left-[21px] top-1.5 h-2.5 w-2.5 rounded-full ${e.kind === 'accepted' ? 'bg-ledger-700' : e.kind === 'declined' || e.kind === 'expired' ? 'bg-stone-500' : 'bg-ledger-300'}`} />
          <p className="text-sm text-stone-900">{describe(e)}</p>
          <p className="text-xs text-stone-600">{dayTime(e.createdAt)}</p>
        </li>
      ))}
    </ol>
  );
}
