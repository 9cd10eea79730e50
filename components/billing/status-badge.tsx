import { STATUS_LABELS } from './format';

const TONE: Record<string, string> = {
  active: 'border-ledger-200 bg-ledger-50 text-ledger-800',
  trialing: 'border-ledger-200 bg-ledger-50 text-ledger-800',
  past_due: 'border-amber-300 bg-amber-50 text-amber-900',
  unpaid: 'border-amber-300 bg-amber-50 text-amber-900',
  paused: 'border-stone-300 bg-stone-100 text-stone-700',
  canceled: 'border-stone-300 bg-stone-100 text-stone-700',
};

/** A subscription status in words, e.g. "Payment overdue". */
export function StatusBadge({ status, label }: { status: string; label?: string }) {
  return (
    <span className={`inline-flex items-center rounded border px-2 py-0.5 text-xs font-medium ${TONE[status] ?? 'border-stone-300 bg-white text-stone-700'}`}>
      {label ?? STATUS_LABELS[status] ?? status}
    </span>
  );
}
