'use client';

import { useRouter } from 'next/navigation';
import { useEffect } from 'react';

/**
 * While the customer may be deciding, re-reads the quote page now and then (and when the tab
 * comes back into view), so the team sees "viewed" or "accepted" without reloading.
 */
export function RefreshWhileOpen({ everySeconds = 20 }: { everySeconds?: number }) {
  const router = useRouter();
  useEffect(() => {
    const timer = setInterval(() => {
      if (document.visibilityState === 'visible') router.refresh();
    }, everySeconds * 1000);
    const onVisible = () => document.visibilityState === 'visible' && router.refresh();
    document.addEventListener('visibilitychange', onVisible);
    return () => {
      clearInterval(timer);
      document.removeEventListener('visibilitychange', onVisible);
    };
  }, [router, everySeconds]);
  return null;
}
