'use client';

import { useEffect, useRef, useState } from 'react';
import Link from 'next/link';
import { signOut } from '@/server/actions/auth';
import { switchCompany } from '@/server/actions/security';

type Company = { companyId: number; companyName: string; role: string };

/**
 * The person's menu: who is signed in, where, switching company (for people in several),
 * their security page, and signing out. A disclosure button, closed by Escape or a click outside.
 */
export function UserMenu({ name, email, roleLabel, companies, currentCompanyId, securityHref = '/settings/security' }: { name: string; email: string; roleLabel: string; companies: Company[]; currentCompanyId: number | null; securityHref?: string }) {
  const [open, setOpen] = useState(false);
  const ref = useRef<HTMLDivElement>(null);
  useEffect(() => {
    if (!open) return;
    const onKey = (e: KeyboardEvent) => e.key === 'Escape' && setOpen(false);
    const onClick = (e: MouseEvent) => ref.current && !ref.current.contains(e.target as Node) && setOpen(false);
    document.addEventListener('keydown', onKey);
    document.addEventListener('mousedown', onClick);
    return () => {
      document.removeEventListener('keydown', onKey);
      document.removeEventListener('mousedown', onClick);
    };
  }, [open]);
  const initials = name
    .split(/\s+/)
    .filter(Boolean)
    .slice(0, 2)
    .map((w) => w[0]?.toUpperCase())
    .join('');
  const others = companies.filter((c) => c.companyId !== currentCompanyId);
  return (
    <div className="relative" ref={ref}>
      <button
        type="button"
        aria-expanded={open}
        aria-haspopup="true"
        onClick={() => setOpen((v) => !v)}
        className="flex items-center gap-2 rounded px-1.5 py-1 text-sm text-stone-700 hover:bg-stone-100"
      >
        <span aria-hidden="true" className="flex h-7 w-7 items-center justify-center rounded-full bg-ledger-100 text-xs font-semibold text-ledger-800">
          {initials || '?'}
        </span>
        <span className="hidden max-w-[12rem] truncate sm:inline">{name}</span>
        <span className="sr-only">Account menu</span>
        <svg aria-hidden="true" viewBox="0 0 20 20" className="h-4 w-4 text-stone-500">
          <path d="M5 8l5 5 5-5" fill="none" stroke="currentColor" strokeWidth="1.6" />
        </svg>
      </button>
      {open && (
        <div className="absolute right-0 z-30 mt-1 w-72 rounded-md border border-stone-200 bg-white py-1 text-sm shadow-lg">
          <div className="border-b border-stone-100 px-3 py-2">
            <p className="truncate font-medium text-stone-900">{name}</p>
            <p className="truncate text-stone-600">{email}</p>
            <p className="mt-0.5 text-xs text-stone-500">{roleLabel}</p>
          </div>
          {others.length > 0 && (
            <div className="border-b border-stone-100 py-1">
              <p className="px-3 py-1 text-xs uppercase tracking-wide text-stone-500">Switch company</p>
              {others.map((c) => (
                <form key={c.companyId} action={async (fd) => void (await switchCompany(null, fd))}>
                  <input type="hidden" name="companyId" value={c.companyId} />
                  <button type="submit" className="block w-full truncate px-3 py-1.5 text-left text-stone-700 hover:bg-stone-100">
                    {c.companyName}
                  </button>
                </form>
              ))}
            </div>
          )}
          <Link href={securityHref} onClick={() => setOpen(false)} className="block px-3 py-1.5 text-stone-700 hover:bg-stone-100">
            Your security and sessions
          </Link>
          <form action={async (fd) => void (await signOut(null, fd))}>
            <button type="submit" className="block w-full px-3 py-1.5 text-left text-stone-700 hover:bg-stone-100">
              Sign out
            </button>
          </form>
        </div>
      )}
    </div>
  );
}
