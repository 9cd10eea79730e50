import 'server-only';
import type { Transaction } from 'sequelize';
import { getCustomer } from '@/db/queries/customers';
import { addCustomer } from '@/server/customers/add-customer';
import { createSite, getSite } from '@/db/queries/sites';
import { getServiceProfile } from '@/db/queries/service-profiles';
import { getClimateProfile } from '@/db/queries/climate-profiles';
import { getDishesByIds } from '@/db/queries/dishes';
import { insertStudy, nextRevision, type StudyDetail } from '@/db/queries/studies';
import { enqueueWebhookEvent } from '@/server/webhooks/outbox';
import { studyEventData } from '@/server/webhooks/payloads';
import { lockCompanyRow } from '@/db/queries/company-lock';
import { assertWithinPlan } from '@/server/plan-limit';
import { AppError, InvalidInputError, NotFoundError } from '@/server/errors';
import type { NewStudyInput } from '@/server/validation/study';
import type { ServiceProfile } from '@/db/models/service-profile';
import { toStudyInputError } from './engine-errors';
import { computeStudyFromRows } from './snapshot-of';
import { resolveSiteAltitude } from './site-altitude';
import type { StudyInputsSnapshot, StudyResultSnapshot } from './snapshot';

export interface StudyActor {
  companyId: number;
  userId: string;
}

/** What a study is computed from: the form's choices (a re-run builds the same from the stored ids). */
export type StudyChoices = Omit<NewStudyInput, 'revisionOfStudyId' | 'serviceProfileId' | 'compareServiceProfileIds'>;

export function recommendedDiameterOf(result: StudyResultSnapshot): number | null {
  const i = result.tradeoff.recommendation.smallestMeetingTargetIndex;
  return i === null ? null : result.tradeoff.options[i].diameterM;
}

function defaultStudyTitle(inputs: Pick<StudyInputsSnapshot, 'site'>, serviceNames: string[]): string {
  return `${inputs.site.customerName} · ${inputs.site.name} · ${serviceNames.join(' vs ')}`.slice(0, 200);
}

/** The list's service column of a comparison names every service (it is a summary column, searched by the list). */
function serviceSummary(names: string[]): string {
  const joined = names.join(' + ');
  return joined.length <= 120 ? joined : `${joined.slice(0, 119)}…`;
}

/**
 * The one way a study is saved — new (revision 1), edited (the next revision of `revisionOf`'s
 * chain) or re-run with today's rows — inside the caller's transaction. The customer and site
 * are picked or new (a blank altitude comes from the ITU-R P.1511-1 map), the rain climate is
 * the maps at the site or an override profile, and every chosen service is computed with the
 * same site, climate, dishes and target.
 *
 * Several services: one studies row per service. The first service's row leads (title, revision
 * chain, place in the list); the others name it in `comparison_of_study_id`. This keeps a study
 * row = one service + one per-dish table, which is what quotes (a study id and an option index),
 * the share page, the API and the option read model already read, so none of them change; a
 * quote from a comparison is made from the chosen service's own row. Storing all services in
 * one snapshot instead would have changed every reader of `inputs.service`.
 *
 * `missing` words the error for a row that no longer exists (a re-run says "deleted since").
 * The old revision and its quotes are never written.
 */
export async function saveStudyIn(
  t: Transaction,
  actor: StudyActor,
  input: StudyChoices,
  opts: { revisionOf: StudyDetail | null; missing?: (what: string) => AppError },
): Promise<{ id: number; revision: number; serviceStudyIds: number[] }> {
  const { companyId } = actor;
  const missing = opts.missing ?? ((what: string) => new NotFoundError(`That ${what}`));
  const services: ServiceProfile[] = [];
  for (const id of input.serviceProfileIds) {
    const service = await getServiceProfile(companyId, id, t);
    if (!service) throw missing('service profile');
    services.push(service);
  }
  const climate = input.climateProfileId === null ? null : await getClimateProfile(companyId, input.climateProfileId, t);
  if (input.climateProfileId !== null && !climate) throw missing('climate profile');
  const dishes = await getDishesByIds(companyId, input.dishIds, t);
  if (dishes.length !== input.dishIds.length) throw missing(input.dishIds.length > 1 ? 'dish selection' : 'dish');

  // Read-only look-ups first (404 before anything else), then the plan limit, which locks the
  // company row FOR UPDATE: an insert before it would take a shared lock on that row and two
  // parallel requests would deadlock instead of one getting a clear limit error.
  let customer = 'id' in input.customer ? await getCustomer(companyId, input.customer.id, t) : null;
  if ('id' in input.customer && !customer) throw missing('customer');
  let site = 'id' in input.site ? await getSite(companyId, input.site.id, t) : null;
  if ('id' in input.site && !site) throw missing('site');
  if (site && !customer) {
    const message = 'A new customer has no sites yet: enter the new site, or pick the customer this site belongs to.';
    throw new InvalidInputError(message, { siteId: [message] });
  }
  if (site && site.customerId !== customer?.id) {
    throw new InvalidInputError('That site belongs to another customer.', { siteId: ['That site belongs to another customer.'] });
  }

  // The map altitude is read before anything is written, so a site it cannot fill is refused cleanly.
  const altitude = 'id' in input.site ? null : resolveSiteAltitude(input.site.latDeg, input.site.lonDeg, input.site.altitudeM);
  const lock = await lockCompanyRow(companyId, t);
  await assertWithinPlan(lock, 'studiesPerMonth');
  if (!('id' in input.customer)) {
    // The Customers form's rule: a name the company already has is refused unless ticked as another customer.
    customer = await addCustomer(lock, { name: input.customer.name, email: null, phone: null, notes: null, sameNameOk: input.customer.sameNameOk }, 'newCustomerName');
  }
  if (!('id' in input.site) && altitude) {
    const { name, latDeg, lonDeg } = input.site;
    site = await createSite(companyId, customer!.id, { name, latDeg, lonDeg, ...altitude }, t);
  }
  if (!customer || !site) throw new Error('saveStudyIn: customer and site are resolved above');

  const computed = services.map((service, i) => {
    try {
      return computeStudyFromRows({ site: site!, customerName: customer!.name, service, climate, dishes, targetAvailabilityPercent: input.targetAvailabilityPercent });
    } catch (e) {
      try {
        toStudyInputError(e, { siteTypedIn: !('id' in input.site) });
      } catch (plain) {
        // A further service's refusal names that service and points at the comparison boxes.
        if (i === 0 || !(plain instanceof InvalidInputError)) throw plain;
        const message = `${service.name}: ${plain.message}`;
        const fields = Object.fromEntries(Object.entries(plain.fieldErrors).map(([k]) => [k === 'serviceProfileId' ? 'compareServiceProfileIds' : k, [message]]));
        throw new InvalidInputError(message, fields);
      }
      throw e;
    }
  });

  const rootId = opts.revisionOf ? (opts.revisionOf.revisionOfStudyId ?? opts.revisionOf.id) : null;
  const revision = rootId === null ? 1 : await nextRevision(companyId, rootId, t);
  const title = input.title ?? defaultStudyTitle(computed[0].inputs, services.map((s) => s.name));
  const serviceStudyIds: number[] = [];
  for (const [i, { inputs, result }] of computed.entries()) {
    const id = await insertStudy(
      companyId,
      {
        customerId: customer.id,
        siteId: site.id,
        serviceProfileId: services[i].id,
        climateProfileId: climate?.id ?? null,
        // Only the leading row is in the revision chain; the others hang off their lead.
        revisionOfStudyId: i === 0 ? rootId : null,
        revision,
        comparisonOfStudyId: i === 0 ? null : serviceStudyIds[0],
        title,
        customerName: customer.name,
        siteName: site.name,
        serviceName: i === 0 ? serviceSummary(services.map((s) => s.name)) : services[i].name,
        recommendedDiameterM: recommendedDiameterOf(result),
        inputs,
        result,
        createdByUserId: actor.userId,
      },
      t,
    );
    serviceStudyIds.push(id);
  }
  // One study.created per saved study (an edit or re-run is a new revision, so it is announced too);
  // the lead row stands for every service of a comparison, its serviceName naming them all.
  const lead = {
    id: serviceStudyIds[0],
    title,
    customerName: customer.name,
    siteName: site.name,
    serviceName: serviceSummary(services.map((s) => s.name)),
    recommendedDiameterM: recommendedDiameterOf(computed[0].result),
    revision,
    createdByUserId: actor.userId,
  };
  await enqueueWebhookEvent(companyId, 'study.created', studyEventData(lead), t);
  return { id: serviceStudyIds[0], revision, serviceStudyIds };
}
