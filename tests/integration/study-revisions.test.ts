import { asUser, callAction } from './support/next-request';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeSequelize } from '@/db/sequelize';
import { models } from '@/db/models';
import { createStudy, reviseStudy, rerunStudy } from '@/server/actions/studies';
import { createQuote } from '@/server/quotes/create-quote';
import { createServiceProfile } from '@/db/queries/service-profiles';
import { getStudy, getStudyServices, listStudies } from '@/db/queries/studies';
import { serviceProfileSchema } from '@/server/validation/service-profile';
import { smallestDishMeetingEveryTarget } from '@/server/studies/comparison';
import { studyServiceSections } from '@/server/studies/study-sections';
import { createCompany, createUserWithRole, signInAs, suffix, type TestCompany, type TestUser } from './support/factories';
import { createStudyWorld, TEST_SERVICE_FORM, type StudyWorld } from './studies-fixtures';
import { quoteTerms } from './quotes-fixtures';

/**
 * Edit → next revision and several services in one study, through the real actions: the old
 * revision and its quote stay byte-identical, another company's study answers 404, and each
 * service of a comparison has exactly the figures of a single-service study of that service.
 */
afterAll(closeSequelize);

let company: TestCompany;
let world: StudyWorld;
let admin: TestUser;
let adminSession: string;
let kaServiceId: number;

// An invented two-way Ka service (demo figures, like db/demo/studies.ts).
const KA_FORM = {
  ...TEST_SERVICE_FORM,
  name: 'Test two-way Ka',
  satelliteName: 'Testbird-4',
  satelliteLongitudeDeg: '6.3 E',
  downlinkFrequencyGHz: '19.95',
  polarization: 'circular',
  eirpDbw: '55',
  symbolRateMsps: '45',
  modcod: 'QPSK 3/4',
  lnbNoiseTempK: '110',
  antennaNoiseTempK: '60',
  uplinkEnabled: 'on',
  uplinkFrequencyGHz: '29.75',
  uplinkHpaPowerW: '3',
  uplinkSatelliteGOverTDbK: '14',
  uplinkSymbolRateMsps: '2',
  uplinkModcod: 'QPSK 1/2',
  uplinkImplementationMarginDb: '1.5',
};

beforeAll(async () => {
  company = await createCompany({ planCode: 'crew' });
  world = await createStudyWorld(company.id);
  kaServiceId = (await createServiceProfile(company.id, serviceProfileSchema.parse(KA_FORM))).id;
  admin = await createUserWithRole(company.id, 'admin');
  adminSession = await signInAs(admin);
});

const form = (over: Record<string, unknown> = {}) => ({
  customerId: String(world.customerId),
  siteId: String(world.siteId),
  serviceProfileId: String(world.serviceId),
  climateProfileId: String(world.climateId),
  dishIds: world.dishIds.join(','),
  targetAvailabilityPercent: '99.9',
  ...over,
});

async function made(state: unknown): Promise<number> {
  expect(state).toMatchObject({ ok: true });
  return (state as { data: { id: number } }).data.id;
}

async function rawRow(table: 'studies' | 'quotes', id: number): Promise<string> {
  const [rows] = (await models().sequelize.query(`SELECT * FROM ${table} WHERE id = ?`, { replacements: [id] })) as [Record<string, unknown>[], unknown];
  return JSON.stringify(rows[0]);
}

describe('edit inputs → next revision', () => {
  it('saves a changed target as revision 2; revision 1 and its quote are unchanged', async () => {
    asUser(adminSession);
    const id = await made((await callAction(createStudy, form())).state);
    const quote = await createQuote({ companyId: company.id, user: { id: admin.id, name: admin.name, email: admin.email } }, { studyId: id, optionIndex: 1, shownOptions: undefined, ...quoteTerms() } as never);
    const [studyBefore, quoteBefore] = [await rawRow('studies', id), await rawRow('quotes', quote.id)];

    const out = await callAction(reviseStudy, form({ revisionOfStudyId: String(id), targetAvailabilityPercent: '99.95', title: 'Edited title' }));
    expect(out.state).toMatchObject({ ok: true, data: { revision: 2 } });
    const revised = (await getStudy(company.id, (out.state as { data: { id: number } }).data.id))!;
    expect(revised).toMatchObject({ revision: 2, revisionOfStudyId: id, title: 'Edited title', targetAvailabilityPercent: 99.95 });
    expect(revised.inputs.targetAvailabilityPercent).toBe(99.95);
    expect(revised.result.tradeoff.recommendation.targetAvailabilityPercent).toBe(99.95);

    expect(await rawRow('studies', id)).toBe(studyBefore);
    expect(await rawRow('quotes', quote.id)).toBe(quoteBefore);
    expect((await getStudy(company.id, id))!.targetAvailabilityPercent).toBe(99.9);

    // Editing revision 2 (or 1 again) continues the same chain.
    const third = await callAction(reviseStudy, form({ revisionOfStudyId: String(id), dishIds: String(world.dishIds[2]) }));
    expect(third.state).toMatchObject({ ok: true, data: { revision: 3 } });
  });

  it('refuses an edit without the study, and a bad target, writing nothing', async () => {
    asUser(adminSession);
    const before = await models().Study.count({ where: { companyId: company.id } });
    expect((await callAction(reviseStudy, form())).state).toMatchObject({ ok: false, fieldErrors: { revisionOfStudyId: [expect.any(String)] } });
    const id = await made((await callAction(createStudy, form())).state);
    expect((await callAction(reviseStudy, form({ revisionOfStudyId: String(id), targetAvailabilityPercent: '120' }))).state).toMatchObject({ ok: false, fieldErrors: { targetAvailabilityPercent: [expect.any(String)] } });
    expect(await models().Study.count({ where: { companyId: company.id } })).toBe(before + 1);
  });

  it('another company’s study, or their dishes in an edit of ours, answer not found and change nothing', async () => {
    const other = await createCompany({ planCode: 'crew' });
    const otherWorld = await createStudyWorld(other.id);
    asUser(await signInAs(await createUserWithRole(other.id, 'admin')));
    const theirs = await made((await callAction(createStudy, { ...form(), customerId: String(otherWorld.customerId), siteId: String(otherWorld.siteId), serviceProfileId: String(otherWorld.serviceId), climateProfileId: String(otherWorld.climateId), dishIds: otherWorld.dishIds.join(',') })).state);
    const theirRow = await rawRow('studies', theirs);

    asUser(adminSession);
    const count = await models().Study.count({ where: { companyId: other.id } });
    expect((await callAction(reviseStudy, form({ revisionOfStudyId: String(theirs) }))).state).toMatchObject({ ok: false, code: 'not_found' });
    const ours = await made((await callAction(createStudy, form())).state);
    expect((await callAction(reviseStudy, form({ revisionOfStudyId: String(ours), dishIds: otherWorld.dishIds.join(',') }))).state).toMatchObject({ ok: false, code: 'not_found' });
    expect((await callAction(reviseStudy, form({ revisionOfStudyId: String(ours), compareServiceProfileIds: String(otherWorld.serviceId) }))).state).toMatchObject({ ok: false, code: 'not_found' });
    expect(await models().Study.count({ where: { companyId: other.id } })).toBe(count);
    expect(await rawRow('studies', theirs)).toBe(theirRow);
  });
});

describe('several services for one site', () => {
  it('computes each service exactly as a single-service study of it, and lists the study once', async () => {
    asUser(adminSession);
    const title = `Compare ${suffix()}`;
    const id = await made((await callAction(createStudy, form({ compareServiceProfileIds: String(kaServiceId), title }))).state);
    const services = await getStudyServices(company.id, id);
    expect(services.map((s) => s.serviceProfileId)).toEqual([world.serviceId, kaServiceId]);
    expect(services[1].comparisonOfStudyId).toBe(id);
    expect(services.map((s) => s.revision)).toEqual([1, 1]);
    // A further service's id names the same study.
    expect((await getStudyServices(company.id, services[1].id)).map((s) => s.id)).toEqual(services.map((s) => s.id));

    const tvAlone = (await getStudy(company.id, await made((await callAction(createStudy, form())).state)))!;
    const kaAlone = (await getStudy(company.id, await made((await callAction(createStudy, form({ serviceProfileId: String(kaServiceId) }))).state)))!;
    expect(services[0].result.tradeoff).toEqual(tvAlone.result.tradeoff);
    expect(services[1].result.tradeoff).toEqual(kaAlone.result.tradeoff);
    expect(services[1].result.exceedanceCurve).toEqual(kaAlone.result.exceedanceCurve);
    // The two services really differ (Ka two-way fades far more than Ku TV): the check above could fail.
    expect(services[1].result.tradeoff.recommendation.basis).toBe('two-way');
    expect(services[1].result.tradeoff.options[0].outageMinutesPerYear).not.toBe(services[0].result.tradeoff.options[0].outageMinutesPerYear);

    const listed = await listStudies(company.id, { q: title, page: 1, pageSize: 10 });
    expect(listed.items.map((s) => s.id)).toEqual([id]);
    expect(listed.items[0].serviceName).toBe(`${TEST_SERVICE_FORM.name} + ${KA_FORM.name}`);

    // The PDF's sections: one { inputs, result } per service, the leading one first.
    const sections = await studyServiceSections(company.id, services[1].id);
    expect(sections.map((s) => s.inputs.service.name)).toEqual([TEST_SERVICE_FORM.name, KA_FORM.name]);
    expect(await studyServiceSections((await createCompany()).id, id)).toEqual([]);
  });

  it('names the smallest dish meeting every service’s target, or none', async () => {
    asUser(adminSession);
    for (const target of ['99.5', '99.99']) {
      const id = await made((await callAction(createStudy, form({ compareServiceProfileIds: String(kaServiceId), targetAvailabilityPercent: target }))).state);
      const services = await getStudyServices(company.id, id);
      const verdict = smallestDishMeetingEveryTarget(services);
      // Worked out here from the engine's own flags, dish by dish from the smallest.
      const sizes = services[0].result.tradeoff.options.map((o, i) => ({ i, d: o.diameterM })).sort((a, b) => a.d - b.d);
      const expected = sizes.find(({ i }) => services.every((s) => s.result.tradeoff.options[i].meetsTarget === true));
      expect(verdict.dish?.diameterM ?? null).toBe(expected?.d ?? null);
      expect(verdict.smallestPerService).toEqual(services.map((s) => s.result.tradeoff.recommendation.smallestMeetingTargetIndex));
      if (target === '99.5') expect(verdict.dish).not.toBeNull();
    }
  });

  it('edits and re-runs a comparison as a whole; a quote takes the chosen service’s figures', async () => {
    asUser(adminSession);
    const id = await made((await callAction(createStudy, form({ compareServiceProfileIds: String(kaServiceId) }))).state);
    const [tv, ka] = await getStudyServices(company.id, id);
    const before = [await rawRow('studies', tv.id), await rawRow('studies', ka.id)];

    const quote = await createQuote({ companyId: company.id, user: { id: admin.id, name: admin.name, email: admin.email } }, { studyId: ka.id, optionIndex: 2, shownOptions: undefined, ...quoteTerms() } as never);
    const q = await models().Quote.findByPk(quote.id);
    const raw = q!.studySnapshot as unknown;
    const snapshot = (typeof raw === 'string' ? JSON.parse(raw) : raw) as { service: { name: string }; basis: string };
    expect(snapshot).toMatchObject({ service: { name: KA_FORM.name }, basis: 'two-way' });

    // Edit with a member's id: the whole study gets revision 2, the target changes for both services.
    const edited = await callAction(reviseStudy, form({ revisionOfStudyId: String(ka.id), compareServiceProfileIds: String(kaServiceId), targetAvailabilityPercent: '99.7' }));
    expect(edited.state).toMatchObject({ ok: true, data: { revision: 2 } });
    const v2 = await getStudyServices(company.id, (edited.state as { data: { id: number } }).data.id);
    expect(v2.map((s) => [s.serviceProfileId, s.revision, s.inputs.targetAvailabilityPercent])).toEqual([[world.serviceId, 2, 99.7], [kaServiceId, 2, 99.7]]);
    expect(v2[0].revisionOfStudyId).toBe(id);

    // Dropping the comparison in an edit makes a single-service revision.
    const single = await callAction(reviseStudy, form({ revisionOfStudyId: String(id) }));
    expect(single.state).toMatchObject({ ok: true, data: { revision: 3 } });
    expect(await getStudyServices(company.id, (single.state as { data: { id: number } }).data.id)).toHaveLength(1);

    // Re-run of the comparison: both services again, as revision 4.
    const rerun = await callAction(rerunStudy, { id: String(ka.id) });
    expect(rerun.state).toMatchObject({ ok: true, data: { revision: 4 } });
    expect((await getStudyServices(company.id, (rerun.state as { data: { id: number } }).data.id)).map((s) => s.serviceProfileId)).toEqual([world.serviceId, kaServiceId]);

    expect([await rawRow('studies', tv.id), await rawRow('studies', ka.id)]).toEqual(before);
  });

  it('refuses the main service again among those compared', async () => {
    asUser(adminSession);
    expect((await callAction(createStudy, form({ compareServiceProfileIds: String(world.serviceId) }))).state).toMatchObject({ ok: false, fieldErrors: { compareServiceProfileIds: [expect.any(String)] } });
  });
});
