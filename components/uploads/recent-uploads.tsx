import type { ParseReport, UploadKindName } from '@/server/uploads/parse-report';
import { dateTimeFmt } from '@/components/study/format';

export type RecentUpload = { id: number; kind: UploadKindName; originalFilename: string; sizeBytes: number; parseReport: unknown; createdAt: Date };

const KIND_LABELS: Record<UploadKindName, string> = {
  'dish-catalogue': 'Dish catalogue',
  'rain-curve': 'Measured exceedance curve',
  'climate-normals': 'Monthly normals',
};

/** The stored report's one-line summary and row count; older or odd rows fall back to plain words. */
function reportOf(raw: unknown): { summary: string; rowCount: number | null } {
  const r = (typeof raw === 'string' ? safeJson(raw) : raw) as Partial<ParseReport> | null;
  return { summary: typeof r?.summary === 'string' ? r.summary : 'No report stored.', rowCount: typeof r?.rowCount === 'number' ? r.rowCount : null };
}

function safeJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return null;
  }
}

/** Accepted uploads, newest first: what each file held (its parse report) and a link to the original file. */
export function RecentUploads({ uploads, showKind = false }: { uploads: RecentUpload[]; showKind?: boolean }) {
  if (uploads.length === 0) return <p className="text-sm text-stone-600">No files uploaded yet.</p>;
  return (
    <ul className="divide-y divide-stone-200 text-sm">
      {uploads.map((u) => {
        const report = reportOf(u.parseReport);
        return (
          <li key={u.id} className="flex flex-col gap-1 py-2 sm:flex-row sm:items-start sm:justify-between sm:gap-4">
            <div className="min-w-0">
              <p className="truncate font-medium text-stone-900" title={u.originalFilename}>
                {u.originalFilename}
              </p>
              <p className="text-xs text-stone-600">
                {showKind && `${KIND_LABELS[u.kind]} · `}
                {dateTimeFmt.format(u.createdAt)} UTC · <span className="num">{Math.ceil(u.sizeBytes / 1024)} KiB</span>
                {report.rowCount !== null && <> · {report.rowCount} row{report.rowCount === 1 ? '' : 's'}</>}
              </p>
              <p className="text-xs text-stone-700">{report.summary}</p>
            </div>
            <a href={`/api/v1/uploads/${u.id}`} download className="shrink-0 text-sm font-medium text-ledger-700 hover:underline">
              Download original<span className="sr-only"> {u.originalFilename}</span>
            </a>
          </li>
        );
      })}
    </ul>
  );
}
