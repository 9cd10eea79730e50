import { apiRequest, asSignedOut, asUser, callAction, callPage } from './support/next-request';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { closeSequelize } from '@/db/sequelize';
import { models } from '@/db/models';
import { archiveStudy, unarchiveStudy } from '@/server/actions/studies';
import { GET as listStudiesRoute } from '@/app/api/v1/studies/route';
import StudyPage from '@/app/(app)/studies/[id]/page';
import { createCompany, createUserWithRole, signInAs, type TestCompany } from './support/factories';
import { createStudyWorld, insertTestStudy, type StudyWorld } from './studies-fixtures';

/**
 * Archiving a study: makers only, company-scoped (another company's id is "not found" and stays
 * as it was), the studies list leaves archived ones out unless asked, and the stored snapshots
 * are byte for byte what they were.
 */
afterAll(closeSequelize);

let home: TestCompany;
let other: TestCompany;
let world: StudyWorld;
const tok: Record<'admin' | 'installer' | 'sales' | 'outsider', string> = { admin: '', installer: '', sales: '', outsider: '' };
let installerId: string;
let outsiderId: string;

const noParams = { params: Promise.resolve({}) };

beforeAll(async () => {
  home = await createCompany({ planCode: 'fleet' });
  other = await createCompany({ planCode: 'fleet' });
  world = await createStudyWorld(home.id);
  for (const role of ['admin', 'installer', 'sales'] as const) {
    const u = await createUserWithRole(home.id, role);
    tok[role] = await signInAs(u);
    if (role === 'installer') installerId = u.id;
  }
  const outsider = await createUserWithRole(other.id, 'admin');
  outsiderId = outsider.id;
  tok.outsider = await signInAs(outsider);
});

/** The stored row as MariaDB holds it: JSON columns as text, so "unchanged" means byte for byte. */
async function rawRow(id: number) {
  const [row] = await models().sequelize.query<{ status: string; inputs: string; result: string; engine_version: string; created_at: Date }>(
    'SELECT status, CAST(inputs AS CHAR) AS inputs, CAST(result AS CHAR) AS result, engine_version, created_at FROM studies WHERE id = :id',
    { replacements: { id }, type: QueryTypes.SELECT },
  );
  return row;
}

async function listIds(query = '') {
  const res = await listStudiesRoute(apiRequest(`/api/v1/studies?pageSize=100${query}`), noParams);
  expect(res.status).toBe(200);
  return ((await res.json()) as { items: { id: number; status: string }[] }).items;
}

describe('archiveStudy / unarchiveStudy', () => {
  it('an installer archives a study: it leaves the default list, shows with archived=include/only, and its snapshots do not change', async () => {
    const kept = await insertTestStudy(home.id, installerId, world, 'Kept in the list');
    const id = await insertTestStudy(home.id, installerId, world, 'Old gatehouse study');
    const before = await rawRow(id);
    asUser(tok.installer);

    const out = await callAction(archiveStudy, { id: String(id) });
    expect(out.state).toMatchObject({ ok: true, data: { id } });
    const after = await rawRow(id);
    expect(after.status).toBe('archived');
    expect(after.inputs).toBe(before.inputs);
    expect(after.result).toBe(before.result);
    expect(after.engine_version).toBe(before.engine_version);
    expect(after.created_at.getTime()).toBe(before.created_at.getTime());

    const shown = (await listIds()).map((s) => s.id);
    expect(shown).toContain(kept);
    expect(shown).not.toContain(id);
    const all = await listIds('&archived=include');
    expect(all.map((s) => s.id)).toEqual(expect.arrayContaining([id, kept]));
    expect(all.find((s) => s.id === id)?.status).toBe('archived');
    expect((await listIds('&archived=only')).map((s) => s.id)).toEqual([id]);

    // Restoring puts it back; still the same snapshots.
    expect((await callAction(unarchiveStudy, { id: String(id) })).state).toMatchObject({ ok: true });
    const restored = await rawRow(id);
    expect(restored.status).toBe('ready');
    expect(restored.inputs).toBe(before.inputs);
    expect(restored.result).toBe(before.result);
    expect((await listIds()).map((s) => s.id)).toContain(id);
  });

  it('an archived study still opens on its own page (a quote made from it can still be read)', async () => {
    const id = await insertTestStudy(home.id, installerId, world);
    asUser(tok.admin);
    expect((await callAction(archiveStudy, { id })).state).toMatchObject({ ok: true });
    const page = await callPage(() => StudyPage({ params: Promise.resolve({ id: String(id) }) }));
    expect('value' in page).toBe(true);
  });

  it('sales may not archive or restore; the study stays as it was', async () => {
    const id = await insertTestStudy(home.id, installerId, world);
    asUser(tok.sales);
    expect((await callAction(archiveStudy, { id })).state).toMatchObject({ ok: false, code: 'forbidden' });
    expect((await rawRow(id)).status).toBe('ready');
    await models().Study.update({ status: 'archived' }, { where: { id } });
    expect((await callAction(unarchiveStudy, { id })).state).toMatchObject({ ok: false, code: 'forbidden' });
    expect((await rawRow(id)).status).toBe('archived');
  });

  it('signed out: unauthenticated', async () => {
    const id = await insertTestStudy(home.id, installerId, world);
    asSignedOut();
    expect((await callAction(archiveStudy, { id })).state).toMatchObject({ ok: false, code: 'unauthenticated' });
  });

  it('another company’s study id is "not found" for the action and the page, and is left alone', async () => {
    const otherWorld = await createStudyWorld(other.id);
    const theirs = await insertTestStudy(other.id, outsiderId, otherWorld, 'Theirs');
    asUser(tok.admin);
    expect((await callAction(archiveStudy, { id: theirs })).state).toMatchObject({ ok: false, code: 'not_found' });
    expect((await callAction(unarchiveStudy, { id: theirs })).state).toMatchObject({ ok: false, code: 'not_found' });
    expect((await rawRow(theirs)).status).toBe('ready');
    expect(await callPage(() => StudyPage({ params: Promise.resolve({ id: String(theirs) }) }))).toEqual({ notFound: 404 });
  });

  it('a missing or malformed id is refused without touching anything', async () => {
    asUser(tok.installer);
    expect((await callAction(archiveStudy, { id: 2_000_000_000 })).state).toMatchObject({ ok: false, code: 'not_found' });
    expect((await callAction(archiveStudy, { id: 'abc' })).state).toMatchObject({ ok: false, code: 'invalid_input' });
  });

  it('the list refuses an unknown archived filter with 422', async () => {
    asUser(tok.sales);
    const res = await listStudiesRoute(apiRequest('/api/v1/studies?archived=everything'), noParams);
    expect(res.status).toBe(422);
    expect(((await res.json()) as { error: { fieldErrors: Record<string, string[]> } }).error.fieldErrors.archived).toBeDefined();
  });
});
