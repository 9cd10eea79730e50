'use server';

import { revalidatePath } from 'next/cache';
import { safeAction } from './safe-action';
import { newStudySchema, reviseStudySchema, studyIdSchema } from '@/server/validation/study';
import * as studies from '@/server/studies/create-study';
import { rerunStudy as rerun } from '@/server/studies/rerun-study';
import { reviseStudy as revise } from '@/server/studies/revise-study';
import { setStudyArchived } from '@/db/queries/studies';
import { NotFoundError } from '@/server/errors';
import { models } from '@/db/models';
import { actorOf, recordAudit } from '@/server/audit/record';
import type { CompanyAuthContext } from '@/server/auth/guards';

/** Archive or restore with its audit row in one transaction; a study already in that state writes no row. */
async function archiveAudited(ctx: CompanyAuthContext, id: number, archived: boolean): Promise<boolean> {
  const { sequelize, Study } = models();
  return sequelize.transaction(async (t) => {
    const before = await Study.findOne({ where: { id, companyId: ctx.companyId }, attributes: ['id', 'title', 'status', 'revision'], transaction: t, lock: t.LOCK.UPDATE });
    if (!before) return false;
    const changed = (before.status === 'archived') !== archived;
    await setStudyArchived(ctx.companyId, id, archived, t);
    if (changed) {
      await recordAudit({ companyId: ctx.companyId, actor: actorOf(ctx) }, { action: archived ? 'study.archived' : 'study.restored', target: before.title, detail: { studyId: id, revision: before.revision } }, t);
    }
    return true;
  });
}

/** Returns the new study's id; the form navigates to it (no redirect, so tests and scripts can call it too). */
export const createStudy = safeAction({ schema: newStudySchema, permission: 'study.write' }, async (input, ctx) => {
  const { id } = await studies.createStudy({ companyId: ctx.companyId, userId: ctx.user.id }, input);
  revalidatePath('/studies');
  return { data: { id }, message: 'Study computed.' };
});

/** Edited inputs saved as the next revision of the study (the form in edit mode); the old revision is not touched. */
export const reviseStudy = safeAction({ schema: reviseStudySchema, permission: 'study.write' }, async (input, ctx) => {
  const { id, revision } = await revise({ companyId: ctx.companyId, userId: ctx.user.id }, input.revisionOfStudyId as number, input);
  revalidatePath('/studies');
  return { data: { id, revision }, message: `Revision ${revision} computed.` };
});

/** A new revision with today's catalogue, profiles and engine; the old study is not touched. */
export const rerunStudy = safeAction({ schema: studyIdSchema, permission: 'study.write' }, async (input, ctx) => {
  const { id, revision } = await rerun({ companyId: ctx.companyId, userId: ctx.user.id }, input.id);
  revalidatePath('/studies');
  return { data: { id, revision }, message: `Revision ${revision} computed.` };
});

/** Takes a study out of the default list; its snapshots (and any quote made from it) stay as they were. */
export const archiveStudy = safeAction({ schema: studyIdSchema, permission: 'study.write' }, async (input, ctx) => {
  if (!(await archiveAudited(ctx, input.id, true))) throw new NotFoundError('That study');
  revalidatePath('/studies');
  revalidatePath(`/studies/${input.id}`);
  return { data: { id: input.id }, message: 'Study archived. It no longer shows in the studies list unless archived studies are shown.' };
});

/** Puts an archived study back in the list. */
export const unarchiveStudy = safeAction({ schema: studyIdSchema, permission: 'study.write' }, async (input, ctx) => {
  if (!(await archiveAudited(ctx, input.id, false))) throw new NotFoundError('That study');
  revalidatePath('/studies');
  revalidatePath(`/studies/${input.id}`);
  return { data: { id: input.id }, message: 'Study restored to the list.' };
});
