import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/page-header';
import { Card } from '@/components/ui/card';
import { Table, THead, TBody, Th, Td, EmptyRow } from '@/components/ui/table';
import { requirePermission } from '@/server/auth/guards';
import { listCompanyAccounts } from '@/db/queries/staff-accounts';

export const metadata: Metadata = { title: 'Accounts' };

const dateFmt = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });

/** Staff home: the company accounts, their plans and seats in use. Read-only. */
export default async function StaffHomePage() {
  await requirePermission('accounts.read');
  const accounts = await listCompanyAccounts();
  return (
    <>
      <PageHeader eyebrow="Staff" title="Company accounts" description="Every customer company, its plan and head-count. Company data (sites, studies, quotes) is not shown here." />
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
