import { AUDIT_KINDS } from '@/server/audit/kinds';
import { buttonClasses } from '@/components/ui/button';

// The look of components/ui/field's boxes; that module is a client one, so its constant cannot be read here.
const INPUT_CLASSES = 'block w-full rounded border border-stone-300 bg-white px-3 py-2 text-sm text-stone-900 shadow-xs focus:border-ledger-600 focus:outline-none focus:ring-2 focus:ring-ledger-200';

type Values = { kind?: string; actor?: string; from?: string; to?: string };

/** A plain GET form (works without scripts): the filter lives in the address, so it can be shared and the CSV link follows it. */
export function AuditFilterForm({ values, csvHref }: { values: Values; csvHref: string }) {
  return (
    <form method="get" action="/settings/audit" role="search" aria-label="Filter the audit log" className="mb-4 grid grid-cols-1 gap-3 rounded-md border border-stone-200 bg-white p-4 sm:grid-cols-2 lg:grid-cols-5 lg:items-end">
      <div>
        <label htmlFor="audit-kind" className="block text-sm font-medium text-stone-800">Kind</label>
        <select id="audit-kind" name="kind" defaultValue={values.kind ?? ''} className={`mt-1 ${INPUT_CLASSES}`}>
          <option value="">Every kind</option>
          {Object.entries(AUDIT_KINDS).map(([key, k]) => (
            <option key={key} value={key}>{k.label}</option>
          ))}
        </select>
      </div>
      <div>
        <label htmlFor="audit-actor" className="block text-sm font-medium text-stone-800">Who (name or e-mail)</label>
        <input id="audit-actor" name="actor" defaultValue={values.actor ?? ''} maxLength={120} className={`mt-1 ${INPUT_CLASSES}`} />
      </div>
      <div>
        <label htmlFor="audit-from" className="block text-sm font-medium text-stone-800">From (UTC)</label>
        <input id="audit-from" name="from" type="date" defaultValue={values.from ?? ''} className={`mt-1 ${INPUT_CLASSES}`} />
      </div>
      <div>
        <label htmlFor="audit-to" className="block text-sm font-medium text-stone-800">To (UTC, included)</label>
        <input id="audit-to" name="to" type="date" defaultValue={values.to ?? ''} className={`mt-1 ${INPUT_CLASSES}`} />
      </div>
      <div className="flex flex-wrap gap-2">
        <button type="submit" className={buttonClasses('primary')}>Filter</button>
        <a href={csvHref} className={buttonClasses('secondary')} download>
          Download CSV
        </a>
      </div>
    </form>
  );
}
