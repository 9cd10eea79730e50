'use client';

import type { CustomerListItem } from '@/db/queries/customers';
import { EmptyRow, Table, TBody, THead, Td, Th } from '@/components/ui/table';
import { PagedList } from '@/components/study/paged-list';
import { dateFmt } from '@/components/study/format';

export function CustomersList() {
  return (
    <PagedList<CustomerListItem>
      endpoint="/api/v1/customers"
      searchLabel="Search"
      searchPlaceholder="Name, e-mail or phone"
      render={(items, { loading }) => (
        <Table caption="Customers">
          <THead>
            <tr>
              <Th>Customer</Th>
              <Th>E-mail</Th>
              <Th>Phone</Th>
              <Th numeric>Sites</Th>
              <Th>Added</Th>
            </tr>
          </THead>
          <TBody>
            {items.length === 0 && <EmptyRow colSpan={5}>{loading ? 'Loading customers…' : 'No customers match.'}</EmptyRow>}
            {items.map((c) => (
              <tr key={c.id}>
                <Th scope="row" className="align-top font-medium text-stone-900">
                  {c.name}
                </Th>
                <Td>{c.email ?? '—'}</Td>
                <Td>{c.phone ?? '—'}</Td>
                <Td numeric>{c.siteCount}</Td>
                <Td className="whitespace-nowrap">{dateFmt.format(new Date(c.createdAt))}</Td>
              </tr>
            ))}
          </TBody>
        </Table>
      )}
    />
  );
}
