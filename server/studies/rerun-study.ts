import 'server-only';
import { models } from '@/db/models';
import { getCustomer } from '@/db/queries/customers';
import { getSite } from '@/db/queries/sites';
import { getServiceProfile } from '@/db/queries/service-profiles';
import { getClimateProfile } from '@/db/queries/climate-profiles';
import { getDishesByIds } from '@/db/queries/dishes';
import { getStudy, insertStudy, nextRevision } from '@/db/queries/studies';
import { ConflictError, NotFoundError } from '@/server/errors';
import { recommendedDiameterOf, type StudyActor } from './create-study';
import { toStudyInputError } from './engine-errors';
import { lockCompanyRow } from '@/db/queries/company-lock';
import { assertWithinPlan } from '@/server/plan-limit';
import { computeStudyFromRows } from './snapshot-of';
import { enqueueWebhookEvent } from '@/server/webhooks/outbox';
import { studyEventData } from '@/server/webhooks/payloads';

/**
 * Re-run a study with today's site, service, climate and catalogue rows, today's ITU-R maps at the
 * site and today's engine, as a new revision of the same chain. A study on the maps stays on the
 * maps; one with an override profile needs that profile still. The old study is left exactly as it
 * was: quotes made from it keep their figures.
 */
export async function rerunStudy(actor: StudyActor, studyId: number): Promise<{ id: number; revision: number }> {
  const { sequelize } = models();
  const { companyId } = actor;
  return sequelize.transaction(async (t) => {
    const old = await getStudy(companyId, studyId, t);
    if (!old) throw new NotFoundError('That study');

    const gone = (what: string) => new ConflictError(`The ${what} of this study has been deleted; start a new study instead.`);
    const site = old.siteId ? await getSite(companyId, old.siteId, t) : null;
    if (!site) throw gone('site');
    const customer = await getCustomer(companyId, site.customerId, t);
    if (!customer) throw gone('customer');
    const service = old.serviceProfileId ? await getServiceProfile(companyId, old.serviceProfileId, t) : null;
    if (!service) throw gone('service profile');
    // No profile id: the maps (kind 'itu-r-maps'), or a profile deleted since (its id was unlinked).
    const onMaps = old.climateProfileId === null && old.inputs.climate.kind === 'itu-r-maps';
    const climate = old.climateProfileId ? await getClimateProfile(companyId, old.climateProfileId, t) : null;
    if (!climate && !onMaps) throw gone('climate profile');
    const ids = old.inputs.dishes.map((d) => d.dishId).filter((id): id is number => id !== null);
    const dishes = await getDishesByIds(companyId, ids, t);
    if (dishes.length === 0) throw gone('dish selection');

    await assertWithinPlan(await lockCompanyRow(companyId, t), 'studiesPerMonth');
    let computed;
    try {
      computed = computeStudyFromRows({ site, customerName: customer.name, service, climate, dishes, targetAvailabilityPercent: old.targetAvailabilityPercent });
    } catch (e) {
      toStudyInputError(e);
    }
    const rootId = old.revisionOfStudyId ?? old.id;
    const revision = await nextRevision(companyId, rootId, t);
    const id = await insertStudy(
      companyId,
      {
        customerId: customer.id,
        siteId: site.id,
        serviceProfileId: service.id,
        climateProfileId: climate?.id ?? null,
        revisionOfStudyId: rootId,
        revision,
        title: old.title,
        customerName: customer.name,
        siteName: site.name,
        serviceName: service.name,
        recommendedDiameterM: recommendedDiameterOf(computed.result),
        inputs: computed.inputs,
        result: computed.result,
        createdByUserId: actor.userId,
      },
      t,
    );
    // A re-run is a new study row (a revision): receivers get it as study.created with its revision.
    const study = { id, title: old.title, customerName: customer.name, siteName: site.name, serviceName: service.name, recommendedDiameterM: recommendedDiameterOf(computed.result), revision, createdByUserId: actor.userId };
    await enqueueWebhookEvent(companyId, 'study.created', studyEventData(study), t);
    return { id, revision };
  });
}
