import type { QuoteStatus } from '@/server/quotes/status';
import { QUOTE_STATUS_LABELS } from '@/server/quotes/status';

// One accent colour: open states in teal, the outcome states in calm neutrals with a clear word.
const TONES: Record<QuoteStatus, string> = {
  draft: 'border-stone-300 bg-white text-stone-700',
  sent: 'border-ledger-200 bg-ledger-50 text-ledger-800',
  viewed: 'border-ledger-300 bg-ledger-100 text-ledger-900',
  accepted: 'border-ledger-700 bg-ledger-700 text-white',
  declined: 'border-stone-400 bg-stone-200 text-stone-800',
  expired: 'border-stone-300 bg-stone-100 text-stone-600',
};

export function QuoteStatusBadge({ status }: { status: QuoteStatus }) {
  return (
    <span data-status={status} className={`inline-block whitespace-nowrap rounded border px-1.5 py-0.5 text-xs font-medium ${TONES[status]}`}>
      {QUOTE_STATUS_LABELS[status]}
    </span>
  );
}
