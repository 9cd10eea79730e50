'use client';

import { useEffect, useRef, type ReactNode } from 'react';

/**
 * Set by the decision form when the customer's answer was recorded, read once by the confirmation
 * that replaces the form after the page re-reads. Browser memory of this one page, nothing more:
 * a later visit to a decided quote is not scrolled or focused.
 */
let arrivingFromDecision = false;

export function markDecisionRecorded(): void {
  arrivingFromDecision = true;
}

/**
 * The decision's confirmation, in the place the form was: after an answer it takes the focus
 * (a screen reader reads it) and is scrolled to the middle of the screen, so on a phone the
 * customer sees it without looking for it.
 */
export function DecisionConfirmation({ labelledBy, children }: { labelledBy: string; children: ReactNode }) {
  const ref = useRef<HTMLDivElement>(null);
  useEffect(() => {
    if (!arrivingFromDecision || !ref.current) return;
    arrivingFromDecision = false;
    ref.current.focus({ preventScroll: true });
    ref.current.scrollIntoView({ block: 'center', behavior: 'instant' });
  }, []);
  return (
    <div ref={ref} id="decision-confirmation" role="status" aria-live="polite" aria-labelledby={labelledBy} tabIndex={-1} className="scroll-mt-4 rounded-md outline-none focus-visible:ring-2 focus-visible:ring-ledger-600">
      {children}
    </div>
  );
}
