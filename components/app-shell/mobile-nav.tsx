'use client';

import { useState } from 'react';
import { usePathname } from 'next/navigation';
import { NavLinks } from './nav-links';

/** Below the large breakpoint the main navigation lives behind a menu button. */
export function MobileNav({ items }: { items: { label: string; href: string }[] }) {
  const [open, setOpen] = useState(false);
  const pathname = usePathname();
  // A navigation closes the menu (state adjusted while rendering, not in an effect).
  const [shownFor, setShownFor] = useState(pathname);
  if (shownFor !== pathname) {
    setShownFor(pathname);
    setOpen(false);
  }
  if (items.length === 0) return null;
  return (
    <div className="lg:hidden">
      <button
        type="button"
        aria-expanded={open}
        aria-controls="mobile-nav"
        onClick={() => setOpen((v) => !v)}
        className="rounded p-1.5 text-stone-700 hover:bg-stone-100"
      >
        <span className="sr-only">{open ? 'Close menu' : 'Open menu'}</span>
        <svg aria-hidden="true" viewBox="0 0 20 20" className="h-5 w-5">
          {open ? <path d="M5 5l10 10M15 5L5 15" stroke="currentColor" strokeWidth="1.7" /> : <path d="M3 6h14M3 10h14M3 14h14" stroke="currentColor" strokeWidth="1.7" />}
        </svg>
      </button>
      {open && (
        <nav id="mobile-nav" aria-label="Main" className="absolute inset-x-0 top-full z-20 border-b border-stone-200 bg-white px-4 py-3 shadow-sm">
          <NavLinks items={items} orientation="vertical" />
        </nav>
      )}
    </div>
  );
}
