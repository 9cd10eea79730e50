import type { ReactNode } from 'react';
import { Card, CardBody, CardHeader } from './card';

export type EditListRow = { id: number; name: string; editor: ReactNode };

/**
 * A card listing rows by name, each opening in place (a native <details>, so it works before
 * JavaScript arrives) to show its edit form and delete button.
 */
export function EditListCard({ id, title, description, rows }: { id: string; title: string; description: string; rows: EditListRow[] }) {
  return (
    <Card aria-labelledby={id}>
      <CardHeader id={id} title={title} description={description} />
      <CardBody>
        <ul className="divide-y divide-stone-200">
          {rows.map((row) => (
            <li key={row.id}>
              <details className="group py-2">
                <summary className="flex cursor-pointer items-center justify-between gap-3 text-sm">
                  <span className="font-medium text-stone-900">{row.name}</span>
                  <span className="text-ledger-700 group-open:hidden">Edit</span>
                  <span className="hidden text-stone-600 group-open:inline">Close</span>
                </summary>
                <div className="mt-3 space-y-3">{row.editor}</div>
              </details>
            </li>
          ))}
        </ul>
      </CardBody>
    </Card>
  );
}
