'use client';

import { useRouter } from 'next/navigation';
import { useEffect, useState } from 'react';

/**
 * Re-renders the server page every few seconds while it waits for the payment provider's webhook,
 * and stops after `giveUpAfterSeconds` with a note (the webhook may be delayed or retried).
 */
export function RefreshWhilePending({ everySeconds = 2, giveUpAfterSeconds = 120 }: { everySeconds?: number; giveUpAfterSeconds?: number }) {
  const router = useRouter();
  const [elapsed, setElapsed] = useState(0);
  useEffect(() => {
    const started = Date.now();
    const timer = setInterval(() => {
      const seconds = Math.round((Date.now() - started) / 1000);
      setElapsed(seconds);
      if (seconds >= giveUpAfterSeconds) clearInterval(timer);
      else router.refresh();
    }, everySeconds * 1000);
    return () => clearInterval(timer);
  }, [router, everySeconds, giveUpAfterSeconds]);
  if (elapsed >= giveUpAfterSeconds) {
    return (
      <p className="text-sm text-stone-600" aria-live="polite">
        Still no confirmation after {Math.round(giveUpAfterSeconds / 60)} minutes. The provider retries its notifications, so this can
        take a while; <button type="button" className="font-medium text-ledger-700 underline" onClick={() => router.refresh()}>check again</button> or come back later.
      </p>
    );
  }
  return (
    <p className="flex items-center gap-2 text-sm text-stone-600" aria-live="polite">
      <span className="inline-block h-2 w-2 animate-pulse rounded-full bg-ledger-500" aria-hidden="true" />
      Checking every {everySeconds} seconds{elapsed > 0 ? ` (${elapsed} s so far)` : ''}…
    </p>
  );
}
