'use server';

import { revalidatePath } from 'next/cache';
import { safeAction } from './safe-action';
import { newStudySchema, studyIdSchema } from '@/server/validation/study';
import * as studies from '@/server/studies/create-study';
import { rerunStudy as rerun } from '@/server/studies/rerun-study';

/** Returns the new study's id; the form navigates to it (no redirect, so tests and scripts can call it too). */
export const createStudy = safeAction({ schema: newStudySchema, permission: 'study.write' }, async (input, ctx) => {
  const { id } = await studies.createStudy({ companyId: ctx.companyId, userId: ctx.user.id }, input);
  revalidatePath('/studies');
  return { data: { id }, message: 'Study computed.' };
});

/** A new revision with today's catalogue, profiles and engine; the old study is not touched. */
export const rerunStudy = safeAction({ schema: studyIdSchema, permission: 'study.write' }, async (input, ctx) => {
  const { id, revision } = await rerun({ companyId: ctx.companyId, userId: ctx.user.id }, input.id);
  revalidatePath('/studies');
  return { data: { id, revision }, message: `Revision ${revision} computed.` };
});
