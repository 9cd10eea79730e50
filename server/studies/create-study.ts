import 'server-only';
import { models } from '@/db/models';
import { createCustomer, getCustomer } from '@/db/queries/customers';
import { createSite, getSite } from '@/db/queries/sites';
import { getServiceProfile } from '@/db/queries/service-profiles';
import { getClimateProfile } from '@/db/queries/climate-profiles';
import { getDishesByIds } from '@/db/queries/dishes';
import { insertStudy } from '@/db/queries/studies';
import { InvalidInputError, NotFoundError } from '@/server/errors';
import type { NewStudyInput } from '@/server/validation/study';
import { computeStudy } from './compute-study';
import { toStudyInputError } from './engine-errors';
import { assertStudyWithinPlan } from './plan-limit';
import { climateSnapshotOf, dishSnapshotOf, serviceSnapshotOf, siteSnapshotOf } from './snapshot-of';
import type { StudyInputsSnapshot, StudyResultSnapshot } from './snapshot';

export interface StudyActor {
  companyId: number;
  userId: string;
}

export function recommendedDiameterOf(result: StudyResultSnapshot): number | null {
  const i = result.tradeoff.recommendation.smallestMeetingTargetIndex;
  return i === null ? null : result.tradeoff.options[i].diameterM;
}

export function defaultStudyTitle(inputs: Pick<StudyInputsSnapshot, 'site' | 'service'>): string {
  return `${inputs.site.customerName} · ${inputs.site.name} · ${inputs.service.name}`.slice(0, 200);
}

/**
 * Create a study: the customer and site (picked or new), the service, climate and dishes of this
 * company, computed by the engine and stored with its snapshots — all in one transaction, so a
 * refused study leaves no half-made customer or site behind.
 */
export async function createStudy(actor: StudyActor, input: NewStudyInput): Promise<{ id: number }> {
  const { sequelize } = models();
  const { companyId } = actor;
  return sequelize.transaction(async (t) => {
    const service = await getServiceProfile(companyId, input.serviceProfileId, t);
    if (!service) throw new NotFoundError('That service profile');
    const climate = await getClimateProfile(companyId, input.climateProfileId, t);
    if (!climate) throw new NotFoundError('That climate profile');
    const dishes = await getDishesByIds(companyId, input.dishIds, t);
    if (dishes.length !== input.dishIds.length) throw new NotFoundError('One of the chosen dishes');

    let customer;
    if ('id' in input.customer) {
      customer = await getCustomer(companyId, input.customer.id, t);
      if (!customer) throw new NotFoundError('That customer');
    } else {
      customer = await createCustomer(companyId, { name: input.customer.name, email: null, phone: null, notes: null }, t);
    }

    let site;
    if ('id' in input.site) {
      site = await getSite(companyId, input.site.id, t);
      if (!site) throw new NotFoundError('That site');
      if (site.customerId !== customer.id) {
        throw new InvalidInputError('That site belongs to another customer.', { siteId: ['That site belongs to another customer.'] });
      }
    } else {
      site = await createSite(companyId, customer.id, { name: input.site.name, latDeg: input.site.latDeg, lonDeg: input.site.lonDeg, altitudeM: input.site.altitudeM }, t);
    }

    // After the references are known to be ours (404 first), before anything is written.
    await assertStudyWithinPlan(companyId, t);
    let computed;
    try {
      computed = computeStudy({
        site: siteSnapshotOf(site, customer.name),
        service: serviceSnapshotOf(service),
        climate: climateSnapshotOf(climate),
        dishes: dishes.map(dishSnapshotOf),
        targetAvailabilityPercent: input.targetAvailabilityPercent,
      });
    } catch (e) {
      toStudyInputError(e);
    }
    const id = await insertStudy(
      companyId,
      {
        customerId: customer.id,
        siteId: site.id,
        serviceProfileId: service.id,
        climateProfileId: climate.id,
        revisionOfStudyId: null,
        revision: 1,
        title: input.title ?? defaultStudyTitle(computed.inputs),
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
    return { id };
  });
}
