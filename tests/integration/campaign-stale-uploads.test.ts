import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Queue } from 'bullmq';
import { QueryTypes } from 'sequelize';
import { closeSequelize } from '@/db/sequelize';
import { models } from '@/db/models';
import { getCampaign, insertCampaign, markCampaignQueued } from '@/db/queries/campaigns';
import { CampaignUploadStoppedError, stageCampaignBatch } from '@/db/queries/campaign-staging';
import { sweepStaleUploads } from '@/server/campaigns/stale-uploads';
import { CAMPAIGN_UPKEEP_QUEUE, redisConnection, STALE_UPLOAD_SCHEDULER } from '@/server/campaigns/campaign-queue';
import { getEnv } from '@/server/env';
import { createCompany, type TestCompany } from './support/factories';
import { count, startWorker, waitFor, type WorkerProcess } from './support/campaign-jobs';

/**
 * An upload whose web process died mid-file (simulated: a campaign left "receiving" with staged
 * rows and an old updated_at) is given up by the stale-upload sweep — marked failed with a message,
 * its staged rows deleted — while live uploads and queued campaigns are left alone; two sweeps at
 * once give a campaign up once; an upload resuming afterwards is refused; the workers run the sweep
 * on their BullMQ job scheduler. Real MariaDB and Redis.
 */
let company: TestCompany;
const workers: WorkerProcess[] = [];

beforeAll(async () => {
  company = await createCompany({ planCode: 'fleet' });
});

afterAll(async () => {
  await Promise.all(workers.map((w) => w.stop()));
  // The test worker scheduled the sweep every second: leave no such schedule behind (the next worker re-creates its own).
  const queue = new Queue(CAMPAIGN_UPKEEP_QUEUE, { connection: redisConnection('worker') });
  await queue.removeJobScheduler(STALE_UPLOAD_SCHEDULER).catch(() => {});
  await queue.close();
  await closeSequelize();
});

const site = (line: number) => ({ line, siteRef: `STALE-${line}`, latDeg: 47 + line / 1e4, lonDeg: 2.5, altitudeM: line % 2 ? null : 120, currentDishCm: 60 });

/** A campaign receiving its file with `sites` rows (and one problem) staged through the upload's own batch writer. */
async function receiving(sites: number): Promise<number> {
  const id = await models().sequelize.transaction((t) =>
    insertCampaign({ companyId: company.id, userId: null, filename: 'interrupted.csv', serviceName: 'Test service', climateName: 'each site', climateOverride: false, targetAvailabilityPercent: 99.9, inputs: { schemaVersion: 1 } }, t),
  );
  for (let first = 2; first < sites + 2; first += 1000) {
    const lines = Array.from({ length: Math.min(1000, sites + 2 - first) }, (_, k) => first + k);
    await stageCampaignBatch(id, { rowsRead: first + lines.length - 2, sites: lines.map(site), problems: first === 2 ? [{ line: sites + 2, seq: 0, message: `Line ${sites + 2}, latitude: "north" is not a number.`, csvLine: 'x' }] : [] });
  }
  return id;
}

/** The moment the web process died: no batch since `seconds` ago. */
const quietFor = (id: number, seconds: number) =>
  models().sequelize.query('UPDATE campaigns SET updated_at = :at WHERE id = :id', { replacements: { id, at: new Date(Date.now() - seconds * 1000) } });

const staged = async (id: number) => ({ sites: await count('campaign_sites', id), problems: await count('campaign_problems', id) });

describe('stale uploads (a web process died mid-upload)', () => {
  it('the upload writes its rows in batches and keeps its campaign fresh', async () => {
    const id = await receiving(2500);
    expect(await staged(id)).toEqual({ sites: 2500, problems: 1 });
    const c = (await getCampaign(company.id, id))!;
    expect(c).toMatchObject({ status: 'receiving', rowsTotal: 2500 });
    expect(Date.now() - c.updatedAt.getTime()).toBeLessThan(30_000);
    const [row] = await models().sequelize.query<{ altitude_m: number | null; lat_deg: number }>('SELECT altitude_m, lat_deg FROM campaign_sites WHERE campaign_id = :id AND line_no = 3', { replacements: { id }, type: QueryTypes.SELECT });
    expect(row).toEqual({ altitude_m: null, lat_deg: 47.0003 });
  });

  it('gives up only a campaign quiet for longer than CAMPAIGN_UPLOAD_STALE_SECONDS, once, with its staged rows deleted', async () => {
    const stale = getEnv().CAMPAIGN_UPLOAD_STALE_SECONDS;
    const dead = await receiving(12_345);
    const live = await receiving(300);
    const queued = await receiving(10);
    await markCampaignQueued(queued, { rowsTotal: 10, sitesTotal: 10, problemsCount: 0, chunks: [{ firstLine: 2, lastLine: 11, siteCount: 10 }] });
    await quietFor(dead, stale + 5);
    await quietFor(live, stale - 30);
    await quietFor(queued, stale + 3600);

    // Two sweeps at once (two workers, or a worker and a retry): the campaign is given up once.
    const [a, b] = await Promise.all([sweepStaleUploads(), sweepStaleUploads()]);
    expect([...a.givenUp, ...b.givenUp].filter((id) => id === dead)).toEqual([dead]);
    expect([...a.givenUp, ...b.givenUp]).not.toContain(live);

    const c = (await getCampaign(company.id, dead))!;
    expect(c.status).toBe('failed');
    expect(c.failureMessage).toMatch(/^The file stopped arriving: nothing more was received for 10 min 00 s .*upload the file again\.$/);
    expect(c.finishedAt).not.toBeNull();
    expect(await staged(dead)).toEqual({ sites: 0, problems: 0 });

    expect((await getCampaign(company.id, live))!.status).toBe('receiving');
    expect(await staged(live)).toEqual({ sites: 300, problems: 1 });
    expect((await getCampaign(company.id, queued))!.status).toBe('queued');
    expect(await count('campaign_sites', queued)).toBe(10);
  });

  it('an upload that resumes after it was given up is refused, and nothing of it is queued', async () => {
    const id = await receiving(50);
    await quietFor(id, getEnv().CAMPAIGN_UPLOAD_STALE_SECONDS + 1);
    expect((await sweepStaleUploads()).givenUp).toContain(id);
    await expect(stageCampaignBatch(id, { rowsRead: 51, sites: [site(52)], problems: [] })).rejects.toBeInstanceOf(CampaignUploadStoppedError);
    await expect(markCampaignQueued(id, { rowsTotal: 51, sitesTotal: 51, problemsCount: 0, chunks: [{ firstLine: 2, lastLine: 52, siteCount: 51 }] })).rejects.toBeInstanceOf(CampaignUploadStoppedError);
    expect(await count('campaign_chunks', id)).toBe(0);
    expect(await count('campaign_sites', id)).toBe(0);
    expect((await getCampaign(company.id, id))!.status).toBe('failed');
  });

  it('a sweep that stopped half-way through deleting is finished by the next one', async () => {
    const id = await receiving(40);
    // As a sweep leaves it when it dies between giving up and deleting.
    await models().sequelize.query(`UPDATE campaigns SET status = 'failed', failure_message = 'given up', finished_at = NOW(3) WHERE id = :id`, { replacements: { id } });
    const out = await sweepStaleUploads();
    expect(out.givenUp).not.toContain(id);
    expect(out.rowsDeleted).toBeGreaterThanOrEqual(41);
    expect(await staged(id)).toEqual({ sites: 0, problems: 0 });
  });

  it('the campaign workers run the sweep on their own schedule', { timeout: 120_000 }, async () => {
    const id = await receiving(20);
    const w = startWorker({ CAMPAIGN_UPLOAD_STALE_SECONDS: '5', CAMPAIGN_UPKEEP_EVERY_SECONDS: '1' });
    workers.push(w);
    await quietFor(id, 6);
    const failed = await waitFor('the worker to give the upload up', async () => {
      const c = await getCampaign(company.id, id);
      return c?.status === 'failed' && (await count('campaign_sites', id)) === 0 ? c : null;
    });
    expect(failed.failureMessage, w.output()).toMatch(/nothing more was received for 5 s/);
  });
});
