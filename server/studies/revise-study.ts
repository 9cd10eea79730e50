import 'server-only';
import { models } from '@/db/models';
import { getStudy } from '@/db/queries/studies';
import { NotFoundError } from '@/server/errors';
import type { NewStudyInput } from '@/server/validation/study';
import { saveStudyIn, type StudyActor } from './save-study';

/**
 * Save edited inputs as the next revision of a study's chain (any service of a comparison names
 * the whole study). The old revision, its services and its quotes are left exactly as they were.
 */
export async function reviseStudy(actor: StudyActor, studyId: number, input: NewStudyInput): Promise<{ id: number; revision: number }> {
  return models().sequelize.transaction(async (t) => {
    const named = await getStudy(actor.companyId, studyId, t);
    const lead = named?.comparisonOfStudyId ? await getStudy(actor.companyId, named.comparisonOfStudyId, t) : named;
    if (!lead) throw new NotFoundError('That study');
    const { id, revision } = await saveStudyIn(t, actor, input, { revisionOf: lead });
    return { id, revision };
  });
}
