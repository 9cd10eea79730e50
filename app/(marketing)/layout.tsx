import Link from 'next/link';
import type { ReactNode } from 'react';
import { Wordmark } from '@/components/ui/wordmark';

export default function MarketingLayout({ children }: { children: ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col">
      <header className="border-b border-stone-200 bg-white">
        <nav className="mx-auto flex max-w-6xl items-center justify-between px-6 py-3" aria-label="Main">
          <Link href="/" aria-label="FadeLedger home"><Wordmark /></Link>
          <div className="flex items-center gap-5 text-sm">
            <Link href="/pricing" className="text-stone-700 hover:text-ledger-700">Plans</Link>
            <Link href="/sign-in" className="text-stone-700 hover:text-ledger-700">Sign in</Link>
            <Link href="/sign-up" className="rounded bg-ledger-700 px-3 py-1.5 font-medium text-white hover:bg-ledger-800">Start a free trial</Link>
          </div>
        </nav>
      </header>
      <main className="flex-1">{children}</main>
      <footer className="border-t border-stone-200 bg-white text-xs text-stone-500">
        <div className="mx-auto max-w-6xl px-6 py-5">
          Predictions are long-term statistics from ITU-R methods, not a guarantee for any one year. Installation
          work follows the manufacturer&apos;s instructions and local codes, and belongs to qualified, licensed installers.
        </div>
      </footer>
    </div>
  );
}
