import 'server-only';
import { models } from '@/db/models';
import type { NewStudyInput } from '@/server/validation/study';
import { saveStudyIn, type StudyActor } from './save-study';

export { recommendedDiameterOf, type StudyActor } from './save-study';

/**
 * Create a study (revision 1) of one or several services for one site, all in one transaction,
 * so a refused study leaves no half-made customer or site behind (server/studies/save-study.ts).
 */
export async function createStudy(
  actor: StudyActor,
  input: Omit<NewStudyInput, 'serviceProfileIds' | 'revisionOfStudyId'> & { serviceProfileIds?: number[] },
): Promise<{ id: number }> {
  const choices = { ...input, serviceProfileIds: input.serviceProfileIds ?? [input.serviceProfileId] };
  const { id } = await models().sequelize.transaction((t) => saveStudyIn(t, actor, choices, { revisionOf: null }));
  return { id };
}
