import { Table, THead, TBody, Th, Td, EmptyRow } from '@/components/ui/table';
import { AUDIT_LABELS, describeDetail, describeDevice, formatWhen } from '@/components/account/describe';
import type { AuditEntry } from '@/db/queries/audit';

/** Audit rows, newest first: when, who, what, from where (on a phone, one column with all four). */
export function AuditTable({ events, caption, empty }: { events: AuditEntry[]; caption: string; empty: string }) {
  return (
    <Table caption={caption}>
      <THead>
        <tr>
          <Th className="hidden whitespace-nowrap sm:table-cell">When</Th>
          <Th className="hidden sm:table-cell">Who</Th>
          <Th>What</Th>
          <Th className="hidden lg:table-cell">From</Th>
        </tr>
      </THead>
      <TBody>
        {events.length === 0 && <EmptyRow colSpan={4}>{empty}</EmptyRow>}
        {events.map((e) => {
          const extra = describeDetail(e.action, e.detail);
          return (
            <tr key={e.id}>
              <Td className="hidden whitespace-nowrap font-mono text-xs text-stone-600 sm:table-cell">{formatWhen(e.createdAt)}</Td>
              <Td className="hidden max-w-[16rem] break-words text-stone-800 sm:table-cell">
                {e.actorLabel ? <Actor label={e.actorLabel} /> : <span className="text-stone-600">Not signed in</span>}
              </Td>
              <Td className="break-words text-stone-800">
                {/* On a phone the row is one column: when and who above what was done. */}
                <span className="mb-1 block text-xs text-stone-600 sm:hidden">
                  <span className="font-mono">{formatWhen(e.createdAt)}</span> · {e.actorLabel ?? 'Not signed in'}
                </span>
                {AUDIT_LABELS[e.action] ?? e.action}
                {e.targetLabel && <span className="font-medium"> {e.targetLabel}</span>}
                {extra && <span className="text-stone-600"> ({extra})</span>}
                <span className="mt-1 block text-xs text-stone-600 lg:hidden">{e.ip ? <>from <span className="font-mono">{e.ip}</span></> : 'address not recorded'}</span>
              </Td>
              <Td className="hidden lg:table-cell text-xs text-stone-600">
                {describeDevice(e.userAgent)}
                <span className="block font-mono">{e.ip ?? 'address not recorded'}</span>
              </Td>
            </tr>
          );
        })}
      </TBody>
    </Table>
  );
}

/** "Name <address>" as the name with the address beneath it. */
function Actor({ label }: { label: string }) {
  const m = /^(.*) <([^>]*)>$/.exec(label);
  if (!m) return <>{label}</>;
  return (
    <>
      {m[1]}
      <span className="block text-xs text-stone-600">{m[2]}</span>
    </>
  );
}
