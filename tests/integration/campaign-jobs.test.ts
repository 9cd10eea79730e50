import { asUser, callAction } from './support/next-request';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { QueryTypes } from 'sequelize';
import { closeSequelize } from '@/db/sequelize';
import { models } from '@/db/models';
import { cancelUpgradeCampaign } from '@/server/actions/campaigns';
import { computeCampaign } from '@/server/campaigns/campaign-compute';
import { parseCampaignCsv } from '@/server/campaigns/campaign-csv';
import { campaignResultCsv, CAMPAIGN_RESULT_HEADER } from '@/server/campaigns/campaign-result-csv';
import type { CampaignInputs } from '@/server/campaigns/campaign-inputs';
import { createCompany, createUserWithRole, signInAs, type TestCompany } from './support/factories';
import { createStudyWorld, type StudyWorld } from './studies-fixtures';
import { campaignRow, count, progressJson, progressOf, resultsOf, sitesCsv, startWorker, uploadCampaign, waitFor, type WorkerProcess } from './support/campaign-jobs';

/**
 * Campaigns as background jobs against the real MariaDB and Redis, with workers as child
 * processes (server/campaigns/worker-main.ts, what `npm run worker` runs): exactly one result row
 * per valid site, a worker killed mid-campaign, cancel, another company, bad files, 45 cm dishes
 * outside the catalogue, and a reopened campaign reading exactly as computed.
 */
// Small chunks so a 5 000-site campaign is 20 jobs and a kill lands mid-campaign (read on first getEnv()).
process.env.CAMPAIGN_CHUNK_SITES = '250';

let company: TestCompany;
let world: StudyWorld;
let adminToken: string;
const workers: WorkerProcess[] = [];

beforeAll(async () => {
  company = await createCompany({ planCode: 'fleet' });
  world = await createStudyWorld(company.id);
  adminToken = await signInAs(await createUserWithRole(company.id, 'admin'));
});

afterAll(async () => {
  await Promise.all(workers.map((w) => w.stop()));
  await closeSequelize();
});

const worker = () => {
  const w = startWorker();
  workers.push(w);
  return w;
};

async function submit(text: string, over: { targetAvailabilityPercent?: string } = {}) {
  asUser(adminToken);
  const res = await uploadCampaign(text, { serviceProfileId: world.serviceId, ...over });
  const body = await res.json();
  expect(res.status, JSON.stringify(body)).toBe(202);
  return body as { id: number; rowsTotal: number; sitesTotal: number; problemsCount: number; chunks: number };
}

const duplicates = async (campaignId: number) =>
  (await models().sequelize.query<{ n: number }>('SELECT COUNT(*) - COUNT(DISTINCT line_no) AS n FROM campaign_results WHERE campaign_id = :campaignId', { replacements: { campaignId }, type: QueryTypes.SELECT }))[0].n;

describe('campaign jobs (BullMQ + Redis, MariaDB)', () => {
  let done: { id: number; text: string };

  it('5 000 sites: exactly one result row per valid site, problems by line, progress to 100 %', async () => {
    // Three broken rows among 5 000 (invented references): a bad latitude, a missing dish, an unknown column count.
    const lines = sitesCsv(5000).trimEnd().split('\n');
    lines[101] = 'SUB-BAD-1,north,2.1,100,60';
    lines[2002] = 'SUB-BAD-2,47.1,2.1,100,';
    lines[4999] = 'SUB-BAD-3,47.1,2.1,100,60,7,8';
    const text = lines.join('\n') + '\n';
    const w = worker();
    const up = await submit(text);
    expect(up).toMatchObject({ rowsTotal: 5000, sitesTotal: 4997, problemsCount: 3, chunks: 20 });
    const final = await waitFor('the campaign to finish', async () => {
      const p = await progressJson(up.id);
      return p.status === 'done' || p.status === 'failed' ? p : null;
    });
    expect(final.status, w.output()).toBe('done');
    expect(final).toMatchObject({ sitesTotal: 4997, sitesDone: 4997, percent: 100, problemsCount: 3 });
    expect(await count('campaign_results', up.id)).toBe(4997);
    expect(await duplicates(up.id)).toBe(0);
    expect(final.problems.map((p) => p.line)).toEqual([102, 2003, 5000]);
    expect(final.problems[0].message).toMatch(/^Line 102, latitude:/);
    expect(final.counts.upgrade + final.counts.alreadyMeetsTarget + final.counts.noneMeetsTarget).toBe(4997);
    done = { id: up.id, text };
  }, 240_000);

  it('a reopened campaign reads exactly as one computation of the whole file, whatever changed in the catalogue since', async () => {
    asUser(adminToken);
    const first = await (await resultsOf(done.id)).text();
    // Change today's catalogue and service: the kept campaign must not move.
    await models().Dish.update({ hardwarePrice: '999.00' }, { where: { companyId: company.id } });
    const again = await (await resultsOf(done.id)).text();
    expect(again).toBe(first);
    const parsed = Papa.parse<string[]>(first.trim()).data;
    expect(parsed[0]).toEqual([...CAMPAIGN_RESULT_HEADER]);
    expect(parsed).toHaveLength(1 + 5000);
    // The same file computed in one go with the kept inputs writes the same bytes.
    const [{ inputs }] = await models().sequelize.query<{ inputs: string }>('SELECT inputs FROM campaigns WHERE id = :id', { replacements: { id: done.id }, type: QueryTypes.SELECT });
    const kept = (typeof inputs === 'string' ? JSON.parse(inputs) : inputs) as CampaignInputs;
    const file = parseCampaignCsv(done.text.split('\n').slice(0, 1).join('\n') + '\n' + done.text.split('\n').slice(1, 2).join('\n') + '\n');
    expect(file.rows).toHaveLength(1);
    const whole = (() => {
      // parseCampaignCsv caps at 5 000 rows: read the file in two halves with the same header.
      const all = done.text.trimEnd().split('\n');
      const a = parseCampaignCsv(all.slice(0, 2501).join('\n') + '\n');
      const b = parseCampaignCsv([all[0], ...all.slice(2501)].join('\n') + '\n');
      const shift = <T extends { line: number | null }>(x: T): T => ({ ...x, line: x.line === null ? null : x.line + 2500 });
      const fixMsg = <T extends { line: number | null; message: string }>(x: T): T => ({ ...shift(x), message: x.message.replace(/^Line (\d+)/, (_, n) => `Line ${Number(n) + 2500}`) });
      return { rows: [...a.rows, ...b.rows.map(shift)], problems: [...a.problems, ...b.problems.map(fixMsg)] };
    })();
    const out = computeCampaign({ rows: whole.rows, service: kept.service, climate: kept.climate, dishes: kept.dishes, targetAvailabilityPercent: kept.targetAvailabilityPercent, fileProblems: whole.problems });
    expect(first).toBe(campaignResultCsv(out.results, out.problems) + '\r\n');
  }, 120_000);

  it('a worker killed mid-campaign: another completes it with no lost and no duplicate rows', async () => {
    // Only the worker that is killed, then only its replacement, take chunks.
    await Promise.all(workers.splice(0).map((w) => w.stop()));
    const a = worker();
    const up = await submit(sitesCsv(5000, { dishCm: (i) => [60, 90][i % 2] }));
    await waitFor('the first chunks to be written', async () => {
      const c = await campaignRow(up.id);
      return c && c.chunks_done >= 2 && c.chunks_done < c.chunks_total - 3;
    }, 180_000, 100);
    await a.kill();
    const atKill = (await campaignRow(up.id))!;
    expect(atKill.status).toBe('running');
    // The killed worker's chunk is still locked in Redis: it comes back when the lock expires (stalled-job check).
    const b = worker();
    const final = await waitFor('the campaign to finish on the second worker', async () => {
      const c = await campaignRow(up.id);
      return c && (c.status === 'done' || c.status === 'failed') ? c : null;
    }, 240_000);
    expect(final.status, b.output()).toBe('done');
    expect(final).toMatchObject({ sites_total: 5000, sites_done: 5000, chunks_done: 20 });
    expect(await count('campaign_results', up.id)).toBe(5000);
    expect(await duplicates(up.id)).toBe(0);
    expect(b.output()).toMatch(/written/);
  }, 300_000);

  it('cancel stops further chunks; what was written stays downloadable', async () => {
    const up = await submit(sitesCsv(5000));
    await waitFor('a chunk to be written', async () => ((await campaignRow(up.id))?.chunks_done ?? 0) >= 1, 120_000, 100);
    asUser(adminToken);
    const out = await callAction(cancelUpgradeCampaign, { campaignId: String(up.id) });
    expect(out.state).toMatchObject({ ok: true });
    const atCancel = await count('campaign_results', up.id);
    // Longer than a few chunks take: nothing more may be written.
    await new Promise((r) => setTimeout(r, 6000));
    const after = await count('campaign_results', up.id);
    expect(after).toBeLessThanOrEqual(atCancel + 250); // at most the one chunk that was already committing
    expect(after).toBeLessThan(5000);
    const row = (await campaignRow(up.id))!;
    expect(row.status).toBe('cancelled');
    expect(row.chunks_done).toBeLessThan(row.chunks_total);
    await new Promise((r) => setTimeout(r, 3000));
    expect(await count('campaign_results', up.id)).toBe(after);
    const csv = await (await resultsOf(up.id)).text();
    expect(csv.trim().split('\r\n')).toHaveLength(1 + after);
    // A second cancel says there is nothing left to cancel.
    expect((await callAction(cancelUpgradeCampaign, { campaignId: String(up.id) })).state).toMatchObject({ ok: false, code: 'conflict' });
  }, 240_000);

  it('another company cannot see, download or cancel the campaign (404)', async () => {
    const other = await createCompany({ planCode: 'fleet' });
    asUser(await signInAs(await createUserWithRole(other.id, 'admin')));
    expect((await progressOf(done.id)).status).toBe(404);
    expect((await resultsOf(done.id)).status).toBe(404);
    expect((await callAction(cancelUpgradeCampaign, { campaignId: String(done.id) })).state).toMatchObject({ ok: false, code: 'not_found' });
    expect((await progressOf(999_999_999)).status).toBe(404);
  });

  it('45 cm current dishes (not in the catalogue) all get an upgrade recommendation, the assumption stated', async () => {
    // Rainy coastal West Africa (invented sites): the 60–120 cm catalogue has no 45 cm dish.
    const up = await submit(sitesCsv(300, { dishCm: () => 45, lat: (i) => 5.5 + (i % 10) * 0.05, lon: (i) => -1 + (i % 30) * 0.05 }), { targetAvailabilityPercent: '99.7' });
    const final = await waitFor('the 45 cm campaign', async () => {
      const p = await progressJson(up.id);
      return p.status === 'done' ? p : null;
    });
    expect(final.counts).toEqual({ upgrade: 300, alreadyMeetsTarget: 0, noneMeetsTarget: 0 });
    const csv = Papa.parse<string[]>((await (await resultsOf(up.id)).text()).trim()).data.slice(1);
    const col = (n: (typeof CAMPAIGN_RESULT_HEADER)[number]) => CAMPAIGN_RESULT_HEADER.indexOf(n);
    for (const r of csv) {
      expect(r[col('current_dish')]).toBe('current 45 cm dish (not in the catalogue; 65 % efficiency assumed)');
      expect(Number(r[col('recommended_dish_cm')])).toBeGreaterThan(45);
    }
  }, 180_000);
});

describe('bad campaign files: a clear refusal and nothing kept or queued', () => {
  const campaignsOf = async (companyId: number) =>
    Number((await models().sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM campaigns WHERE company_id = :companyId', { replacements: { companyId }, type: QueryTypes.SELECT }))[0].n);

  it('a broken line 70 001 is a problem on that line; the other 79 999 rows are kept', async () => {
    const lines = sitesCsv(80_000).trimEnd().split('\n');
    // An opening quote never closed: without the record cap it would swallow the rest of the file.
    lines[70_000] = 'SUB-BROKEN,"47.5,2.25,120,60';
    asUser(adminToken);
    const res = await uploadCampaign(lines.join('\n') + '\n', { serviceProfileId: world.serviceId });
    const body = await res.json();
    expect(res.status, JSON.stringify(body)).toBe(202);
    expect(body).toMatchObject({ rowsTotal: 80_000, sitesTotal: 79_999, problemsCount: 1 });
    expect(await count('campaign_sites', body.id)).toBe(79_999);
    const [p] = await models().sequelize.query<{ line_no: number; message: string }>('SELECT line_no, message FROM campaign_problems WHERE campaign_id = :id', { replacements: { id: body.id }, type: QueryTypes.SELECT });
    expect(p).toMatchObject({ line_no: 70_001, message: 'Line 70001: a quoted cell is opened with " but never closed.' });
    // Not computed here: the next tests need the workers.
    expect((await callAction(cancelUpgradeCampaign, { campaignId: String(body.id) })).state).toMatchObject({ ok: true });
  }, 120_000);

  it('a file that is not a CSV (a PNG) is refused with words; no campaign is kept', async () => {
    const before = await campaignsOf(company.id);
    asUser(adminToken);
    const png = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 0x0d, 0x49, 0x48, 0x44, 0x52]);
    const res = await uploadCampaign(png, { serviceProfileId: world.serviceId, filename: 'dish-photo.png' });
    expect(res.status).toBe(422);
    expect((await res.json()).error.message).toBe('"dish-photo.png" is not a text CSV file (it contains binary data). Save it from your spreadsheet as CSV.');
    const json = await uploadCampaign('{"sites": []}\n', { serviceProfileId: world.serviceId, filename: 'sites.json' });
    expect(json.status).toBe(422);
    expect((await json.json()).error.message).toMatch(/^"sites.json" cannot be read as a campaign: Missing columns: site_ref, latitude, longitude, current_dish_cm/);
    expect(await campaignsOf(company.id)).toBe(before);
  });

  it('another company’s service or climate profile is not found (404); a file without the columns is refused by name', async () => {
    const other = await createStudyWorld((await createCompany({ planCode: 'fleet' })).id);
    const before = await campaignsOf(company.id);
    asUser(adminToken);
    const svc = await uploadCampaign(sitesCsv(5), { serviceProfileId: other.serviceId });
    expect(svc.status).toBe(404);
    const clim = await uploadCampaign(sitesCsv(5), { serviceProfileId: world.serviceId, climateProfileId: other.climateId });
    expect(clim.status).toBe(404);
    const cols = await uploadCampaign('site_ref,latitude,longitude,altitude_m\nA,47,2,100\n', { serviceProfileId: world.serviceId, filename: 'no-dish.csv' });
    expect(cols.status).toBe(422);
    expect((await cols.json()).error.message).toMatch(/^"no-dish.csv" cannot be read as a campaign: Missing column: current_dish_cm\./);
    expect(await campaignsOf(company.id)).toBe(before);
  });

  it('a climate profile overrides the rain climate of every site and is named on the campaign', async () => {
    asUser(adminToken);
    const res = await uploadCampaign(sitesCsv(5), { serviceProfileId: world.serviceId, climateProfileId: world.climateId });
    expect(res.status).toBe(202);
    const { id } = await res.json();
    const [row] = await models().sequelize.query<{ climate_name: string; climate_override: number; inputs: string }>('SELECT climate_name, climate_override, inputs FROM campaigns WHERE id = :id', { replacements: { id }, type: QueryTypes.SELECT });
    expect(row.climate_name).toBe('Known R0.01 (test)');
    expect(Boolean(row.climate_override)).toBe(true);
    const inputs = (typeof row.inputs === 'string' ? JSON.parse(row.inputs) : row.inputs) as CampaignInputs;
    expect(inputs.climate?.name).toBe('Known R0.01 (test)');
    expect((await callAction(cancelUpgradeCampaign, { campaignId: String(id) })).state).toMatchObject({ ok: true });
  });

  it("a file over the plan's sites per campaign is refused naming the limit; nothing is kept", async () => {
    const small = await createCompany({ planCode: 'bench' });
    const w = await createStudyWorld(small.id);
    asUser(await signInAs(await createUserWithRole(small.id, 'admin')));
    const res = await uploadCampaign(sitesCsv(1001), { serviceProfileId: w.serviceId });
    expect(res.status).toBe(403);
    const body = await res.json();
    expect(body.error.code).toBe('plan_limit');
    expect(body.error.message).toMatch(/^The Bench plan allows 1,000 sites in one campaign and "subscriber-base.csv" has more\. Nothing was queued\./);
    expect(await campaignsOf(small.id)).toBe(0);
    expect(Number((await models().sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM campaign_sites s LEFT JOIN campaigns c ON c.id = s.campaign_id WHERE c.id IS NULL', { type: QueryTypes.SELECT }))[0].n)).toBe(0);
    // At the limit it is accepted.
    const ok = await uploadCampaign(sitesCsv(1000), { serviceProfileId: w.serviceId });
    expect(ok.status).toBe(202);
  }, 60_000);
});
