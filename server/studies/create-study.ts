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
import { toStudyInputError } from './engine-errors';
import { lockCompanyRow } from '@/db/queries/company-lock';
import { assertWithinPlan } from '@/server/plan-limit';
import { computeStudyFromRows } from './snapshot-of';
import { resolveSiteAltitude } from './site-altitude';
import type { StudyInputsSnapshot, StudyResultSnapshot } from './snapshot';
import { enqueueWebhookEvent } from '@/server/webhooks/outbox';
import { studyEventData } from '@/server/webhooks/payloads';

export interface StudyActor {
  companyId: number;
  userId: string;
}

export function recommendedDiameterOf(result: StudyResultSnapshot): number | null {
  const i = result.tradeoff.recommendation.smallestMeetingTargetIndex;
  return i === null ? null : result.tradeoff.options[i].diameterM;
}

function defaultStudyTitle(inputs: Pick<StudyInputsSnapshot, 'site' | 'service'>): string {
  return `${inputs.site.customerName} · ${inputs.site.name} · ${inputs.service.name}`.slice(0, 200);
}

/**
 * Create a study: the customer and site (picked or new; a blank altitude comes from the ITU-R
 * P.1511-1 map), the service, the rain climate (the ITU-R maps at the site, or a company profile
 * as an override) and dishes of this company, computed by the engine and stored with its
 * snapshots — all in one transaction, so a refused study leaves no half-made customer or site behind.
 */
export async function createStudy(actor: StudyActor, input: NewStudyInput): Promise<{ id: number }> {
  const { sequelize } = models();
  const { companyId } = actor;
  return sequelize.transaction(async (t) => {
    const service = await getServiceProfile(companyId, input.serviceProfileId, t);
    if (!service) throw new NotFoundError('That service profile');
    const climate = input.climateProfileId === null ? null : await getClimateProfile(companyId, input.climateProfileId, t);
    if (input.climateProfileId !== null && !climate) throw new NotFoundError('That climate profile');
    const dishes = await getDishesByIds(companyId, input.dishIds, t);
    if (dishes.length !== input.dishIds.length) throw new NotFoundError('One of the chosen dishes');

    // Read-only look-ups first (404 before anything else), then the plan limit, which locks the
    // company row FOR UPDATE: an insert before it would take a shared lock on that row and two
    // parallel requests would deadlock instead of one getting a clear limit error.
    let customer = 'id' in input.customer ? await getCustomer(companyId, input.customer.id, t) : null;
    if ('id' in input.customer && !customer) throw new NotFoundError('That customer');
    let site = 'id' in input.site ? await getSite(companyId, input.site.id, t) : null;
    if ('id' in input.site && !site) throw new NotFoundError('That site');
    if (site && !customer) {
      const message = 'A new customer has no sites yet: enter the new site, or pick the customer this site belongs to.';
      throw new InvalidInputError(message, { siteId: [message] });
    }
    if (site && site.customerId !== customer?.id) {
      throw new InvalidInputError('That site belongs to another customer.', { siteId: ['That site belongs to another customer.'] });
    }

    // The map altitude is read before anything is written, so a site it cannot fill is refused cleanly.
    const altitude = 'id' in input.site ? null : resolveSiteAltitude(input.site.latDeg, input.site.lonDeg, input.site.altitudeM);
    await assertWithinPlan(await lockCompanyRow(companyId, t), 'studiesPerMonth');
    if (!('id' in input.customer)) {
      customer = await createCustomer(companyId, { name: input.customer.name, email: null, phone: null, notes: null }, t);
    }
    if (!('id' in input.site) && altitude) {
      const { name, latDeg, lonDeg } = input.site;
      site = await createSite(companyId, customer!.id, { name, latDeg, lonDeg, ...altitude }, t);
    }
    if (!customer || !site) throw new Error('createStudy: customer and site are resolved above');
    let computed;
    try {
      computed = computeStudyFromRows({ site, customerName: customer.name, service, climate, dishes, targetAvailabilityPercent: input.targetAvailabilityPercent });
    } catch (e) {
      toStudyInputError(e, { siteTypedIn: !('id' in input.site) });
    }
    const title = input.title ?? defaultStudyTitle(computed.inputs);
    const recommendedDiameterM = recommendedDiameterOf(computed.result);
    const id = await insertStudy(
      companyId,
      {
        customerId: customer.id,
        siteId: site.id,
        serviceProfileId: service.id,
        climateProfileId: climate?.id ?? null,
        revisionOfStudyId: null,
        revision: 1,
        title,
        customerName: customer.name,
        siteName: site.name,
        serviceName: service.name,
        recommendedDiameterM,
        inputs: computed.inputs,
        result: computed.result,
        createdByUserId: actor.userId,
      },
      t,
    );
    const study = { id, title, customerName: customer.name, siteName: site.name, serviceName: service.name, recommendedDiameterM, revision: 1, createdByUserId: actor.userId };
    await enqueueWebhookEvent(companyId, 'study.created', studyEventData(study), t);
    return { id };
  });
}
