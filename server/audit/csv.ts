import 'server-only';
import { listAuditEventsForCompany, type AuditEntry, type AuditFilter } from '@/db/queries/audit';
import { AUDIT_LABELS, describeDetail, describeDevice } from '@/components/account/describe';

export const AUDIT_CSV_HEADER = ['time_utc', 'who', 'action', 'what', 'target', 'detail', 'address', 'device'] as const;

// Rows per database read while streaming: a bounded page, never the whole log in memory.
const PAGE = 500;

/**
 * One CSV field: quoted when needed, and a leading = + - @ (or tab/CR) defused with an apostrophe
 * so a spreadsheet opening the export never runs a typed-in name as a formula (common practice,
 * OWASP "CSV injection", no formal standard).
 */
export function csvField(value: string | number | null | undefined): string {
  let text = value == null ? '' : String(value);
  if (/^[=+\-@\t\r]/.test(text)) text = `'${text}`;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

export function auditCsvLine(e: AuditEntry): string {
  return [
    e.createdAt.toISOString(),
    e.actorLabel ?? 'Not signed in',
    e.action,
    AUDIT_LABELS[e.action] ?? e.action,
    e.targetLabel,
    describeDetail(e.action, e.detail),
    e.ip ?? '',
    e.userAgent ? describeDevice(e.userAgent) : '',
  ]
    .map(csvField)
    .join(',');
}

/**
 * The company's filtered log as a CSV stream, newest first, read page by page by id (each pull
 * reads the next page), so a long log neither sits in memory nor holds one long query open.
 */
export function auditCsvStream(companyId: number, filter: AuditFilter): ReadableStream<Uint8Array> {
  const encoder = new TextEncoder();
  let beforeId: number | undefined;
  let started = false;
  let done = false;
  return new ReadableStream<Uint8Array>({
    async pull(controller) {
      if (!started) {
        started = true;
        controller.enqueue(encoder.encode(`\uFEFF${AUDIT_CSV_HEADER.join(',')}\r\n`));
      }
      if (done) {
        controller.close();
        return;
      }
      const rows = await listAuditEventsForCompany(companyId, { ...filter, limit: PAGE, beforeId });
      if (rows.length > 0) controller.enqueue(encoder.encode(rows.map((r) => `${auditCsvLine(r)}\r\n`).join('')));
      beforeId = rows.at(-1)?.id;
      if (rows.length < PAGE) done = true;
    },
  });
}
