import type { ReactNode, TdHTMLAttributes, ThHTMLAttributes } from 'react';

/**
 * Dense engineering tables: a scrolling wrapper for narrow screens, stone rules, and numeric
 * cells (`numeric`) in tabular mono, right-aligned — put the unit in the header or after the value.
 */
export function Table({ children, caption, className = '' }: { children: ReactNode; caption?: ReactNode; className?: string }) {
  return (
    // relative: keeps absolutely placed content (sr-only labels) inside the scroll box on phones.
    <div className={`relative overflow-x-auto ${className}`}>
      <table className="w-full border-collapse text-sm">
        {caption && <caption className="sr-only">{caption}</caption>}
        {children}
      </table>
    </div>
  );
}

export function THead({ children }: { children: ReactNode }) {
  return <thead className="border-b border-stone-200 bg-stone-50 text-left text-xs font-medium uppercase tracking-wide text-stone-600">{children}</thead>;
}

export function TBody({ children }: { children: ReactNode }) {
  return <tbody className="divide-y divide-stone-200">{children}</tbody>;
}

export function Th({ numeric, className = '', ...rest }: ThHTMLAttributes<HTMLTableCellElement> & { numeric?: boolean }) {
  return <th scope={rest.scope ?? 'col'} className={`px-3 py-2 font-medium first:pl-4 last:pr-4 sm:first:pl-5 sm:last:pr-5 ${numeric ? 'text-right' : 'text-left'} ${className}`} {...rest} />;
}

export function Td({ numeric, className = '', ...rest }: TdHTMLAttributes<HTMLTableCellElement> & { numeric?: boolean }) {
  return <td className={`px-3 py-2 align-top first:pl-4 last:pr-4 sm:first:pl-5 sm:last:pr-5 ${numeric ? 'num' : ''} ${className}`} {...rest} />;
}

/** A row saying the table has nothing yet, spanning all columns. */
export function EmptyRow({ colSpan, children }: { colSpan: number; children: ReactNode }) {
  return (
    <tr>
      <td colSpan={colSpan} className="px-3 py-6 text-center text-sm text-stone-500">
        {children}
      </td>
    </tr>
  );
}
