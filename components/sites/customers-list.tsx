'use client';

import { Fragment, useState } from 'react';
import type { CustomerListItem } from '@/db/queries/customers';
import { EmptyRow, Table, TBody, THead, Td, Th } from '@/components/ui/table';
import { Button } from '@/components/ui/button';
import { PagedList } from '@/components/study/paged-list';
import { dateFmt } from '@/components/study/format';
import { CustomerForm } from './customer-form';
import { DeleteCustomerButton } from './delete-customer-button';

/** Customers with their site count; roles that may write (customer.write) edit or delete a row in place. */
export function CustomersList({ canEdit = false }: { canEdit?: boolean }) {
  const [editing, setEditing] = useState<number | null>(null);
  const columns = canEdit ? 6 : 5;
  const editButton = (c: CustomerListItem, open: boolean, panelId: string) => (
    <Button variant="quiet" size="sm" aria-expanded={open} aria-controls={open ? panelId : undefined} onClick={() => setEditing(open ? null : c.id)}>
      {open ? 'Close' : 'Edit'}
      <span className="sr-only"> {c.name}</span>
    </Button>
  );
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
              <Th className="hidden sm:table-cell">E-mail</Th>
              <Th className="hidden md:table-cell">Phone</Th>
              <Th numeric>Sites</Th>
              <Th className="hidden sm:table-cell">Added</Th>
              {canEdit && (
                <Th className="hidden sm:table-cell">
                  <span className="sr-only">Actions</span>
                </Th>
              )}
            </tr>
          </THead>
          <TBody>
            {items.length === 0 && <EmptyRow colSpan={columns}>{loading ? 'Loading customers…' : 'No customers match.'}</EmptyRow>}
            {items.map((c) => {
              const open = editing === c.id;
              const panelId = `customer-edit-${c.id}`;
              return (
                <Fragment key={c.id}>
                  <tr className={open ? 'bg-ledger-50/40' : undefined}>
                    <Th scope="row" className="align-top font-medium text-stone-900">
                      {c.name}
                      <span className="block text-xs font-normal text-stone-600 sm:hidden">{[c.email, c.phone].filter(Boolean).join(' · ') || 'no e-mail or phone'}</span>
                      {/* Phones: the edit button sits under the name, so the table fits without sideways scrolling. */}
                      {canEdit && <div className="-ml-2.5 mt-1 font-normal sm:hidden">{editButton(c, open, panelId)}</div>}
                    </Th>
                    <Td className="hidden break-all sm:table-cell">{c.email ?? '—'}</Td>
                    <Td className="hidden whitespace-nowrap md:table-cell">{c.phone ?? '—'}</Td>
                    <Td numeric>{c.siteCount}</Td>
                    <Td className="hidden whitespace-nowrap sm:table-cell">{dateFmt.format(new Date(c.createdAt))}</Td>
                    {canEdit && <Td className="hidden whitespace-nowrap text-right sm:table-cell">{editButton(c, open, panelId)}</Td>}
                  </tr>
                  {canEdit && open && (
                    <tr id={panelId}>
                      <td colSpan={columns} className="bg-stone-50 px-4 py-4 sm:px-5">
                        <div className="space-y-4">
                          <CustomerForm key={c.id} customer={c} onSaved={() => setEditing(null)} onCancel={() => setEditing(null)} />
                          <div className="border-t border-stone-200 pt-3">
                            <DeleteCustomerButton customer={c} onDeleted={() => setEditing(null)} />
                          </div>
                        </div>
                      </td>
                    </tr>
                  )}
                </Fragment>
              );
            })}
          </TBody>
        </Table>
      )}
    />
  );
}
