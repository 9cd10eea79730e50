import Link from 'next/link';
import type { ReactNode } from 'react';
import { Wordmark } from '@/components/ui/wordmark';

export const dynamic = 'force-dynamic';

/** Sign-in, sign-up, reset and invitation pages: one calm column on a quiet background. */
export default function AuthLayout({ children }: { children: ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col">
      <header className="px-4 py-4 sm:px-6">
        <Link href="/" aria-label="FadeLedger home" className="inline-block">
          <Wordmark />
        </Link>
      </header>
      <main className="flex flex-1 items-start justify-center px-4 pb-16 pt-4 sm:pt-10">
        <div className="w-full max-w-md">{children}</div>
      </main>
    </div>
  );
}
