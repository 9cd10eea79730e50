import type { Metadata } from 'next';
import Link from 'next/link';
import { PageHeader } from '@/components/ui/page-header';
import { Card } from '@/components/ui/card';
import { Table, THead, TBody, Th, Td, EmptyRow } from '@/components/ui/table';
import { requireStaffPermission } from '@/server/auth/guards';
import { listCompanyAccounts } from '@/db/queries/staff-accounts';

export const metadata: Metadata = { title: 'Staff' };

const dateFmt = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });

/** Staff home: where to go, and the newest company accounts with their head-count. Read-only. */
export default async function StaffHomePage() {
  await requireStaffPermission('accounts.read');
  const accounts = await listCompanyAccounts(10);
  return (
    <>
      <PageHeader
        eyebrow="FadeLedger staff"
        title="Platform operator"
        description="Manage the plan catalogue and look over company accounts. Company data (sites, studies, quotes) is not shown to staff."
      />
      <ul className="mb-6 grid gap-3 sm:grid-cols-2">
        <li>
          <Link href="/accounts" className="block rounded-md border border-stone-200 bg-white px-4 py-3 hover:border-ledger-400">
            <span className="font-medium text-stone-900">Accounts</span>
            <span className="mt-1 block text-sm text-stone-600">Every company, its plan and subscription state.</span>
          </Link>
        </li>
        <li>
          <Link href="/plans" className="block rounded-md border border-stone-200 bg-white px-4 py-3 hover:border-ledger-400">
            <span className="font-medium text-stone-900">Plans</span>
            <span className="mt-1 block text-sm text-stone-600">The plan catalogue and its limits: seats, studies, links, uploads, API access.</span>
          </Link>
        </li>
      </ul>
      <h2 className="mb-2 text-base font-semibold text-stone-900">Newest company accounts</h2>
      <Card>
        <Table caption="Company accounts">
          <THead>
            <tr>
              <Th>Company</Th>
              <Th>Plan</Th>
              <Th numeric>Members</Th>
              <Th numeric className="hidden sm:table-cell">Pending</Th>
              <Th className="hidden md:table-cell">Trial ends</Th>
              <Th className="hidden md:table-cell">Created</Th>
            </tr>
          </THead>
          <TBody>
            {accounts.length === 0 && <EmptyRow colSpan={6}>No company accounts yet.</EmptyRow>}
            {accounts.map((a) => (
              <tr key={a.id}>
                <Td className="font-medium text-stone-900">{a.name}</Td>
                <Td className="text-stone-700">{a.planName}</Td>
                <Td numeric>{a.members}</Td>
                <Td numeric className="hidden sm:table-cell">
                  {a.pendingInvitations}
                </Td>
                <Td className="hidden md:table-cell whitespace-nowrap text-stone-600">{a.trialEndsAt ? dateFmt.format(a.trialEndsAt) : '—'}</Td>
                <Td className="hidden md:table-cell whitespace-nowrap text-stone-600">{dateFmt.format(a.createdAt)}</Td>
              </tr>
            ))}
          </TBody>
        </Table>
      </Card>
    </>
  );
}
