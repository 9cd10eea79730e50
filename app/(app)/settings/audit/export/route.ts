import { apiRoute } from '@/server/api/route';
import { auditFilterSchema, auditQueryOf } from '@/server/validation/audit';
import { auditCsvStream } from '@/server/audit/csv';

/** The audit log as CSV for the company's admins, with the page's filter; streamed page by page. */
export const GET = apiRoute({ permission: 'audit.read', schema: auditFilterSchema }, async ({ ctx, input }) => {
  const stamp = new Date().toISOString().slice(0, 10);
  return new Response(auditCsvStream(ctx.companyId, auditQueryOf(input)), {
    headers: {
      'Content-Type': 'text/csv; charset=utf-8',
      'Content-Disposition': `attachment; filename="audit-log-${stamp}.csv"`,
      'Cache-Control': 'no-store',
    },
  });
});
