import 'server-only';
import { models } from '@/db/models';
import { getCustomer } from '@/db/queries/customers';
import { getSite } from '@/db/queries/sites';
import { getDishesByIds } from '@/db/queries/dishes';
import { getStudyServices } from '@/db/queries/studies';
import { ConflictError, NotFoundError } from '@/server/errors';
import { saveStudyIn, type StudyActor } from './save-study';

/**
 * Re-run a study with today's site, service, climate and catalogue rows, today's ITU-R maps at the
 * site and today's engine, as a new revision of the same chain — the edit path with the stored
 * choices unchanged. A study on the maps stays on the maps; one with an override profile needs
 * that profile still (components/study/rerun-button.tsx names all this before it runs). The old study is left exactly as it was: quotes made from it keep their figures.
 */
export async function rerunStudy(actor: StudyActor, studyId: number): Promise<{ id: number; revision: number }> {
  const { sequelize } = models();
  const { companyId } = actor;
  return sequelize.transaction(async (t) => {
    const services = await getStudyServices(companyId, studyId, t);
    const lead = services[0];
    if (!lead) throw new NotFoundError('That study');

    const gone = (what: string) => new ConflictError(`The ${what} of this study has been deleted; start a new study instead.`);
    const site = lead.siteId ? await getSite(companyId, lead.siteId, t) : null;
    if (!site) throw gone('site');
    const customer = await getCustomer(companyId, site.customerId, t);
    if (!customer) throw gone('customer');
    const serviceIds = services.map((s) => s.serviceProfileId);
    if (serviceIds.some((id) => id === null)) throw gone('service profile');
    // No profile id: the maps (kind 'itu-r-maps'), or a profile deleted since (its id was unlinked).
    const onMaps = lead.climateProfileId === null && lead.inputs.climate.kind === 'itu-r-maps';
    if (lead.climateProfileId === null && !onMaps) throw gone('climate profile');
    // Dishes deleted since are left out; the study needs one at least.
    const stored = lead.inputs.dishes.map((d) => d.dishId).filter((id): id is number => id !== null);
    const dishIds = (await getDishesByIds(companyId, stored, t)).map((d) => d.id);
    if (dishIds.length === 0) throw gone('dish selection');

    return saveStudyIn(
      t,
      actor,
      {
        title: lead.title,
        customer: { id: customer.id },
        site: { id: site.id },
        serviceProfileIds: serviceIds as number[],
        climateProfileId: lead.climateProfileId,
        dishIds,
        targetAvailabilityPercent: lead.targetAvailabilityPercent,
      },
      { revisionOf: lead, missing: gone },
    ).then(({ id, revision }) => ({ id, revision }));
  });
}
