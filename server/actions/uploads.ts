'use server';

import { revalidatePath } from 'next/cache';
import { safeAction } from './safe-action';
import { uploadConfirmSchema, uploadPreviewSchema } from '@/server/validation/upload';
import { confirmUpload as confirm, previewUpload as preview } from '@/server/uploads/confirm-upload';
import { can, type Permission } from '@/server/auth/permissions';
import { ForbiddenError } from '@/server/errors';

/** The catalogue belongs to 'catalogue.write', climate files to 'climate.write', on top of 'upload.create'. */
const KIND_PERMISSION: Record<string, Permission> = {
  'dish-catalogue': 'catalogue.write',
  'rain-curve': 'climate.write',
  'climate-normals': 'climate.write',
};

/** Parse and report; nothing is saved. The report comes back even when it lists problems. */
export const previewUpload = safeAction({ schema: uploadPreviewSchema, permission: 'upload.create' }, async (input, ctx) => {
  if (!can(ctx.role, KIND_PERMISSION[input.kind])) throw new ForbiddenError();
  const report = await preview(input.kind, input.file);
  return { data: report, message: report.summary };
});

/** Parse again and save file + rows in one transaction, only when every row is valid. */
export const confirmUpload = safeAction({ schema: uploadConfirmSchema, permission: 'upload.create' }, async (input, ctx) => {
  if (!can(ctx.role, KIND_PERMISSION[input.kind])) throw new ForbiddenError();
  const outcome = await confirm({ companyId: ctx.companyId, userId: ctx.user.id }, input);
  if (outcome.kind === 'dish-catalogue') {
    revalidatePath('/dishes');
    return { data: outcome, message: `Catalogue saved: ${outcome.added} added, ${outcome.updated} updated. The file is kept with its report.` };
  }
  revalidatePath('/climate');
  return { data: outcome, message: `Climate profile ${input.name} saved from ${input.file.name}. The file is kept with its report.` };
});
