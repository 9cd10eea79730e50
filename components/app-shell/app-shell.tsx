import Link from 'next/link';
import type { ReactNode } from 'react';
import { Wordmark } from '@/components/ui/wordmark';
import { ROLE_LABELS, type Role } from '@/server/auth/permissions';
import { navFor } from './nav';
import { NavLinks } from './nav-links';
import { MobileNav } from './mobile-nav';
import { UserMenu } from './user-menu';

export type ShellUser = { name: string; email: string; role: Role; companyName: string | null; companyId: number | null; companies: { companyId: number; companyName: string; role: string }[] };

/**
 * The signed-in frame: wordmark and company on the left, the role's navigation, the person's
 * menu on the right; on phones the navigation folds into a menu button.
 */
export function AppShell({ user, children, homeHref = '/dashboard', navItems }: { user: ShellUser; children: ReactNode; homeHref?: string; navItems?: { label: string; href: string }[] }) {
  const items = navItems ?? navFor(user.role).map(({ label, href }) => ({ label, href }));
  return (
    <div className="flex min-h-screen flex-col">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:rounded focus:bg-white focus:px-3 focus:py-2">
        Skip to content
      </a>
      <header className="sticky top-0 z-20 border-b border-stone-200 bg-white print:hidden">
        <div className="mx-auto flex max-w-7xl items-center gap-3 px-4 py-2 sm:px-6">
          <MobileNav items={items} />
          <Link href={homeHref} aria-label="FadeLedger home" className="shrink-0">
            <Wordmark />
          </Link>
          {user.companyName && (
            <span className="hidden min-w-0 truncate border-l border-stone-200 pl-3 text-sm text-stone-600 md:inline" title={user.companyName}>
              {user.companyName}
            </span>
          )}
          <nav aria-label="Main" className="ml-2 hidden lg:block">
            <NavLinks items={items} />
          </nav>
          <div className="ml-auto">
            <UserMenu name={user.name} email={user.email} roleLabel={`${ROLE_LABELS[user.role]}${user.companyName ? ` · ${user.companyName}` : ''}`} companies={user.companies} currentCompanyId={user.companyId} securityHref={user.role === 'staff' ? '/staff/security' : '/settings/security'} />
          </div>
        </div>
      </header>
      <main id="main" className="mx-auto w-full max-w-7xl flex-1 px-4 py-6 sm:px-6 sm:py-8 print:max-w-none print:p-0">
        {children}
      </main>
      <footer className="border-t border-stone-200 bg-white print:hidden">
        <p className="mx-auto max-w-7xl px-4 py-4 text-xs text-stone-500 sm:px-6">
          Outage figures are long-term statistical averages from ITU-R methods, not a guarantee for any one year. Installation work at height, grounding and
          mounting follow the manufacturer&apos;s instructions and local codes.
        </p>
      </footer>
    </div>
  );
}
