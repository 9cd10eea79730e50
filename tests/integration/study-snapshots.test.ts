import { asUser, callAction } from './support/next-request';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeSequelize } from '@/db/sequelize';
import { models } from '@/db/models';
import { createStudy, rerunStudy } from '@/server/actions/studies';
import { updateDish, deleteDish } from '@/server/actions/catalogue';
import { updateServiceProfile } from '@/server/actions/services';
import { confirmCatalogueUpload as confirmUpload } from '@/server/actions/uploads';
import { getStudy } from '@/db/queries/studies';
import { createCompany, createUserWithRole, signInAs, type TestCompany } from './support/factories';
import { createStudyWorld, TEST_SERVICE_FORM, type StudyWorld } from './studies-fixtures';

/**
 * An old study never changes: after its catalogue entries, its service and its site are edited
 * (or deleted), the stored inputs and result are byte-identical; a re-run is a new revision with
 * the new figures, and the old one stays as it was.
 */
afterAll(closeSequelize);

let company: TestCompany;
let world: StudyWorld;
let admin: string;

beforeAll(async () => {
  company = await createCompany({ planCode: 'crew' });
  world = await createStudyWorld(company.id);
  admin = await signInAs(await createUserWithRole(company.id, 'admin'));
});

async function rawSnapshots(id: number): Promise<string> {
  const { sequelize } = models();
  const [rows] = (await sequelize.query('SELECT inputs, result, engine_version, updated_at FROM studies WHERE id = ?', { replacements: [id] })) as [Record<string, unknown>[], unknown];
  return JSON.stringify(rows[0]);
}

describe('study snapshots', () => {
  it('an old study’s result does not change after its catalogue entry, service and site change', async () => {
    asUser(admin);
    const made = await callAction(createStudy, { customerId: String(world.customerId), siteId: String(world.siteId), serviceProfileId: String(world.serviceId), climateProfileId: String(world.climateId), dishIds: world.dishIds.join(','), targetAvailabilityPercent: '99.9' });
    const id = (made.state as { data: { id: number } }).data.id;
    const before = await rawSnapshots(id);
    const study = await getStudy(company.id, id);
    const firstDish = study!.inputs.dishes[0];
    expect(firstDish).toMatchObject({ dishId: world.dishIds[0], diameterM: 0.6, hardwarePrice: '89.00', labourPrice: '95.00' });
    const gain60 = study!.result.tradeoff.options[0].gainDbi;

    // Catalogue: new price and a (much) bigger reflector under the same id; then a CSV price list over it.
    expect((await callAction(updateDish, { id: String(world.dishIds[0]), name: 'Renamed 60', diameterM: '0.85', efficiency: '0.70', hardwarePrice: '999.99', labourPrice: '1.00', active: 'on' })).state).toMatchObject({ ok: true });
    expect((await callAction(confirmUpload, { kind: 'dish-catalogue', file: new File(['name,diameter_m,efficiency,hardware_price,labour_price\nRenamed 60,0.95,0.72,1500,2\n'], 'prices.csv') })).state).toMatchObject({ ok: true });
    // Service: 3 dB less EIRP. Then the 120 cm dish is deleted outright.
    expect((await callAction(updateServiceProfile, { ...TEST_SERVICE_FORM, id: String(world.serviceId), eirpDbw: '47' })).state).toMatchObject({ ok: true });
    expect((await callAction(deleteDish, { id: String(world.dishIds[2]) })).state).toMatchObject({ ok: true });

    expect(await rawSnapshots(id)).toBe(before);
    const after = await getStudy(company.id, id);
    expect(after!.inputs.dishes[0]).toEqual(firstDish);
    expect(after!.result.tradeoff.options[0].gainDbi).toBe(gain60);
    expect(after!.result.tradeoff.options).toHaveLength(3);

    // Re-run: a new revision with today's rows (0.95 m dish, 47 dBW, the deleted dish gone), the old study untouched.
    const rerun = await callAction(rerunStudy, { id: String(id) });
    expect(rerun.state).toMatchObject({ ok: true, data: { revision: 2 } });
    const newId = (rerun.state as { data: { id: number } }).data.id;
    const fresh = await getStudy(company.id, newId);
    expect(fresh!.revisionOfStudyId).toBe(id);
    expect(fresh!.inputs.dishes.map((d) => d.diameterM)).toEqual([0.9, 0.95]);
    expect(fresh!.inputs.dishes[1]).toMatchObject({ name: 'Renamed 60', hardwarePrice: '1500.00' });
    expect(fresh!.inputs.service.eirpDbw).toBe(47);
    expect(await rawSnapshots(id)).toBe(before);

    // A second re-run (from the new revision) continues the same chain.
    const third = await callAction(rerunStudy, { id: String(newId) });
    expect(third.state).toMatchObject({ ok: true, data: { revision: 3 } });
    expect((await getStudy(company.id, (third.state as { data: { id: number } }).data.id))!.revisionOfStudyId).toBe(id);
  });

  it('parallel re-runs of one study get distinct revision numbers', async () => {
    asUser(admin);
    const made = await callAction(createStudy, { customerId: String(world.customerId), siteId: String(world.siteId), serviceProfileId: String(world.serviceId), climateProfileId: String(world.climateId), dishIds: String(world.dishIds[1]) });
    const id = (made.state as { data: { id: number } }).data.id;
    const outs = await Promise.all(Array.from({ length: 4 }, () => callAction(rerunStudy, { id: String(id) })));
    const revisions = outs.map((o) => (o.state as { data: { revision: number } }).data.revision).sort();
    expect(revisions).toEqual([2, 3, 4, 5]);
  });
});
