import { asUser } from './support/next-request';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import net from 'node:net';
import { QueryTypes } from 'sequelize';
import { createCompany, createUserWithRole, signInAs, type TestCompany } from './support/factories';
import { createStudyWorld, type StudyWorld } from './studies-fixtures';

/**
 * Redis out of reach when a campaign is submitted: 503 with words, and nothing kept in MariaDB or
 * queued. The app's modules are loaded afresh with REDIS_URL pointing at a port where nothing
 * listens (the environment is read once per process, so this file imports them after changing it;
 * the Sequelize instance is shared through globalThis and stays open).
 */
let company: TestCompany;
let world: StudyWorld;
let token: string;
let deadPort: number;

beforeAll(async () => {
  company = await createCompany({ planCode: 'fleet' });
  world = await createStudyWorld(company.id);
  token = await signInAs(await createUserWithRole(company.id, 'admin'));
  // A port that was free a moment ago: nothing answers there.
  deadPort = await new Promise<number>((resolve) => {
    const s = net.createServer().listen(0, '127.0.0.1', () => {
      const port = (s.address() as net.AddressInfo).port;
      s.close(() => resolve(port));
    });
  });
});

afterAll(async () => {
  const { closeSequelize } = await import('@/db/sequelize');
  await closeSequelize();
});

describe('Redis down when a campaign is submitted', () => {
  it('answers 503 queue_unavailable with a clear sentence; no campaign row, no staged site', async () => {
    vi.resetModules();
    process.env.REDIS_URL = `redis://127.0.0.1:${deadPort}/0`;
    const { uploadCampaign, sitesCsv } = await import('./support/campaign-jobs');
    const { models } = await import('@/db/models');
    const { asUser: asUserFresh } = await import('./support/next-request');
    asUser(token);
    asUserFresh(token);
    const t0 = Date.now();
    const res = await uploadCampaign(sitesCsv(50), { serviceProfileId: world.serviceId });
    expect(Date.now() - t0).toBeLessThan(10_000);
    expect(res.status).toBe(503);
    const body = await res.json();
    expect(body.error.code).toBe('queue_unavailable');
    expect(body.error.message).toMatch(/^Campaigns cannot be started right now: the job queue \(Redis\) is out of reach\. Nothing was queued/);
    const [{ n }] = await models().sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM campaigns WHERE company_id = :id', { replacements: { id: company.id }, type: QueryTypes.SELECT });
    expect(Number(n)).toBe(0);
  }, 30_000);
});
