'use server';

import { revalidatePath } from 'next/cache';
import { safeAction } from './safe-action';
import { catalogueConfirmSchema, cataloguePreviewSchema, climateConfirmSchema, climatePreviewSchema } from '@/server/validation/upload';
import { confirmUpload, previewUpload } from '@/server/uploads/confirm-upload';
import { can, type Role } from '@/server/auth/permissions';
import { ForbiddenError } from '@/server/errors';
import { actorOf } from '@/server/audit/record';

/**
 * CSV uploads: the dish catalogue belongs to 'catalogue.write', climate files to 'climate.write';
 * either also needs 'upload.create'. Preview parses and reports (the report comes back even when
 * it lists problems) and saves nothing; confirm parses the same file again and saves file + rows
 * in one transaction, only when every row is valid.
 */
function requireUploads(role: Role): void {
  if (!can(role, 'upload.create')) throw new ForbiddenError();
}

export const previewCatalogueUpload = safeAction({ schema: cataloguePreviewSchema, permission: 'catalogue.write' }, async (input, ctx) => {
  requireUploads(ctx.role);
  const report = await previewUpload('dish-catalogue', input.file);
  return { data: report, message: report.summary };
});

export const confirmCatalogueUpload = safeAction({ schema: catalogueConfirmSchema, permission: 'catalogue.write' }, async (input, ctx) => {
  requireUploads(ctx.role);
  const outcome = await confirmUpload({ companyId: ctx.companyId, userId: ctx.user.id, person: actorOf(ctx) }, { ...input, name: null, sourceNote: null, zeroIsothermKm: undefined });
  revalidatePath('/dishes');
  const added = outcome.kind === 'dish-catalogue' ? outcome.added : 0;
  const updated = outcome.kind === 'dish-catalogue' ? outcome.updated : 0;
  return { data: outcome, message: `Catalogue saved: ${added} added, ${updated} updated. The file is kept with its report.` };
});

export const previewClimateUpload = safeAction({ schema: climatePreviewSchema, permission: 'climate.write' }, async (input, ctx) => {
  requireUploads(ctx.role);
  const report = await previewUpload(input.kind, input.file);
  return { data: report, message: report.summary };
});

export const confirmClimateUpload = safeAction({ schema: climateConfirmSchema, permission: 'climate.write' }, async (input, ctx) => {
  requireUploads(ctx.role);
  const outcome = await confirmUpload({ companyId: ctx.companyId, userId: ctx.user.id, person: actorOf(ctx) }, input);
  revalidatePath('/climate');
  return { data: outcome, message: `Climate profile ${input.name} saved from ${input.file.name}. The file is kept with its report.` };
});
