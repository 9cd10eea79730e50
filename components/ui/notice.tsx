import type { ReactNode } from 'react';

/** A calm boxed message: information, a success, a caution (work at height, RF…), or a problem. */
export function Notice({ tone = 'info', title, children, className = '' }: { tone?: 'info' | 'success' | 'caution' | 'problem'; title?: ReactNode; children: ReactNode; className?: string }) {
  const tones = {
    info: 'border-stone-200 bg-stone-50 text-stone-700',
    success: 'border-ledger-200 bg-ledger-50 text-ledger-900',
    caution: 'border-amber-300 bg-amber-50 text-amber-900',
    problem: 'border-red-200 bg-red-50 text-red-800',
  } as const;
  return (
    <div role={tone === 'problem' ? 'alert' : undefined} className={`rounded-md border px-4 py-3 text-sm ${tones[tone]} ${className}`}>
      {title && <p className="font-semibold">{title}</p>}
      <div className={title ? 'mt-1' : ''}>{children}</div>
    </div>
  );
}
