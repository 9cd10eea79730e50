'use client';

import Link from 'next/link';
import { usePathname } from 'next/navigation';
import { isActive } from './nav';

type Item = { label: string; href: string };

/** The main navigation links, marking the current section (aria-current). */
export function NavLinks({ items, orientation = 'horizontal' }: { items: Item[]; orientation?: 'horizontal' | 'vertical' }) {
  const pathname = usePathname() ?? '';
  return (
    <ul className={orientation === 'horizontal' ? 'flex items-center gap-1' : 'flex flex-col gap-0.5'}>
      {items.map((item) => {
        const active = isActive(pathname, item.href);
        return (
          <li key={item.href}>
            <Link
              href={item.href}
              aria-current={active ? 'page' : undefined}
              className={`block rounded px-2.5 py-1.5 text-sm ${active ? 'bg-ledger-50 font-medium text-ledger-800' : 'text-stone-700 hover:bg-stone-100 hover:text-stone-900'}`}
            >
              {item.label}
            </Link>
          </li>
        );
      })}
    </ul>
  );
}

/** Tabs for the settings pages. */
export function SettingsTabs({ items }: { items: Item[] }) {
  const pathname = usePathname() ?? '';
  return (
    // The tabs wrap rather than scroll: on a phone a scrolled row hid "Audit log" and "Your security",
    // the current tab among them, with nothing to say more were there.
    <nav aria-label="Settings" className="mb-6 border-b border-stone-200">
      <ul className="-mb-px flex flex-wrap gap-x-4 gap-y-1">
        {items.map((item) => {
          const active = isActive(pathname, item.href);
          return (
            <li key={item.href}>
              <Link
                href={item.href}
                aria-current={active ? 'page' : undefined}
                className={`block whitespace-nowrap border-b-2 px-1 pb-2 text-sm ${active ? 'border-ledger-700 font-medium text-ledger-800' : 'border-transparent text-stone-600 hover:text-stone-900'}`}
              >
                {item.label}
              </Link>
            </li>
          );
        })}
      </ul>
    </nav>
  );
}
