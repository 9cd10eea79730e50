/** FadeLedger's mark: a ledger line that dips and recovers, like a carrier through a storm. */
export function Wordmark({ className = '' }: { className?: string }) {
  return (
    <span className={`inline-flex items-center gap-2 font-semibold tracking-tight text-stone-900 ${className}`}>
      <svg viewBox="0 0 24 24" width="22" height="22" aria-hidden="true">
        <rect x="1" y="1" width="22" height="22" rx="5" className="fill-ledger-700" />
        <path d="M4 9 H9 L12 16 L15 9 H20" fill="none" stroke="white" strokeWidth="2" strokeLinecap="round" strokeLinejoin="round" />
      </svg>
      FadeLedger
    </span>
  );
}
