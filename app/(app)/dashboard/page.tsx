import Link from 'next/link';
import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/page-header';
import { Notice } from '@/components/ui/notice';
import { navFor } from '@/components/app-shell/nav';
import { requireCompanyUser } from '@/server/auth/guards';
import { ROLE_LABELS } from '@/server/auth/permissions';

export const metadata: Metadata = { title: 'Home' };

const BLURBS: Record<string, string> = {
  '/studies': 'Trade-off studies: every dish size for one site and one service, with outage minutes.',
  '/quotes': 'Quotes built from a chosen dish, and the comparison links sent to customers.',
  '/sites': 'Customers and their sites, with coordinates and altitude.',
  '/dishes': 'Your dish catalogue: diameter, efficiency, price, labour and mount.',
  '/climate': 'Rain climate profiles: monthly normals, measured curves or known R0.01.',
  '/services': 'Satellite services: orbital slot, downlink frequency, EIRP, symbol rate, MODCOD.',
  '/settings/team': 'Members, roles, invitations and seats.',
  '/settings/billing': 'Your plan, its limits, and invoices.',
};

/** A small home that points to each section the role can use (the studies work fills it later). */
export default async function DashboardPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  const ctx = await requireCompanyUser();
  const params = await searchParams;
  const items = navFor(ctx.role);
  return (
    <>
      <PageHeader eyebrow={ctx.company.name} title={`Hello, ${ctx.user.name.split(' ')[0]}`} description={`You are signed in as ${ROLE_LABELS[ctx.role]}.`} />
      {params.welcome && (
        <Notice tone="success" title="Your company account is ready" className="mb-6">
          You are its admin, on a free trial. Invite your installers and sales desk from Team, and add your dishes before the first study.
        </Notice>
      )}
      {params.joined && (
        <Notice tone="success" title={`Welcome to ${ctx.company.name}`} className="mb-6">
          You have joined as {ROLE_LABELS[ctx.role]}.
        </Notice>
      )}
      <ul className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
        {items.map((item) => (
          <li key={item.href}>
            <Link href={item.href} className="block h-full rounded-md border border-stone-200 bg-white px-4 py-3 hover:border-ledger-400">
              <span className="font-medium text-stone-900">{item.label}</span>
              <span className="mt-1 block text-sm text-stone-600">{BLURBS[item.href] ?? ''}</span>
            </Link>
          </li>
        ))}
      </ul>
    </>
  );
}
