import { apiRoute } from '@/server/api/route';
import { getUpload } from '@/db/queries/uploads';
import { ForbiddenError, NotFoundError } from '@/server/errors';
import { can } from '@/server/auth/permissions';
import { uploadPermission } from '@/server/uploads/upload-permission';
import { attachmentDisposition } from '@/server/uploads/download-name';

/**
 * GET /api/v1/uploads/:id — a kept upload's original file, byte for byte, as an attachment.
 * The wrapper demands catalogue.write (admin); the handler then checks the permission of the
 * file's own kind (climate files: climate.write), so neither kind is handed to a role that could
 * not have uploaded it. Another company's id answers 404. An API key needs the "read" scope
 * (named here: catalogue.write itself is opened to no key, so no key could ever edit the catalogue).
 */
export const GET = apiRoute<'catalogue.write', undefined, { id: string }>({ permission: 'catalogue.write', keyScope: 'read' }, async ({ ctx, params }) => {
  const id = /^\d{1,10}$/.test(params.id) ? Number(params.id) : NaN;
  const upload = Number.isSafeInteger(id) ? await getUpload(ctx.companyId, id) : null;
  if (!upload) throw new NotFoundError('That upload');
  if (!can(ctx.role, uploadPermission(upload.kind))) throw new ForbiddenError();
  return new Response(new Uint8Array(upload.originalBytes), {
    status: 200,
    headers: {
      'Content-Type': 'text/csv',
      'Content-Disposition': attachmentDisposition(upload.originalFilename, upload.id),
      'Content-Length': String(upload.originalBytes.byteLength),
      'Cache-Control': 'private, no-store',
      'X-Content-Type-Options': 'nosniff',
    },
  });
});
