import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { QueryTypes } from 'sequelize';
import { models } from '@/db/models';
import { POST as uploadRoute } from '@/app/api/campaign-uploads/route';
import { GET as progressRoute } from '@/app/api/campaigns/[id]/route';
import { GET as resultsRoute } from '@/app/api/campaigns/[id]/results/route';
import type { CampaignProgress } from '@/server/campaigns/campaign-progress';
import { apiRequest } from './next-request';

const ROOT = path.resolve(__dirname, '../../..');

/** A campaign worker as its own process (what `npm run worker` starts), so a test can kill it. */
export interface WorkerProcess {
  child: ChildProcess;
  output: () => string;
  /** SIGKILL: the worker dies mid-chunk without releasing anything. */
  kill: () => Promise<void>;
  /** SIGTERM: finishes its chunk and exits. */
  stop: () => Promise<void>;
}

export function startWorker(env: Record<string, string> = {}): WorkerProcess {
  const child = spawn(process.execPath, ['--conditions=react-server', 'scripts/run-bundled.mjs', 'server/campaigns/worker-main.ts'], {
    cwd: ROOT,
    env: { ...process.env, CAMPAIGN_JOB_LOCK_SECONDS: '4', CAMPAIGN_WORKER_VERBOSE: '1', ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let out = '';
  child.stdout!.on('data', (d) => (out += d));
  child.stderr!.on('data', (d) => (out += d));
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  const end = async (signal: NodeJS.Signals) => {
    if (child.exitCode === null && child.signalCode === null) child.kill(signal);
    await Promise.race([exited, new Promise((r) => setTimeout(r, 20_000))]);
  };
  return { child, output: () => out, kill: () => end('SIGKILL'), stop: () => end('SIGTERM') };
}

export type UploadQuery = { serviceProfileId: number; climateProfileId?: number | 'maps'; targetAvailabilityPercent?: string; filename?: string };

/** POST /api/campaign-uploads with the file as the body, as the page sends it. */
export async function uploadCampaign(body: string | Uint8Array, q: UploadQuery): Promise<Response> {
  const params = new URLSearchParams({
    serviceProfileId: String(q.serviceProfileId),
    climateProfileId: String(q.climateProfileId ?? 'maps'),
    targetAvailabilityPercent: q.targetAvailabilityPercent ?? '99.9',
    filename: q.filename ?? 'subscriber-base.csv',
  });
  const base = apiRequest(`/api/campaign-uploads?${params}`, { method: 'POST', headers: { 'content-type': 'text/csv' } });
  const req = new Request(base.url, { method: 'POST', headers: base.headers, body: typeof body === 'string' ? body : new Blob([body as BlobPart]) });
  return uploadRoute(req, { params: Promise.resolve({}) });
}

export async function progressOf(id: number): Promise<Response> {
  return progressRoute(apiRequest(`/api/campaigns/${id}`), { params: Promise.resolve({ id: String(id) }) });
}

export async function resultsOf(id: number): Promise<Response> {
  return resultsRoute(apiRequest(`/api/campaigns/${id}/results`), { params: Promise.resolve({ id: String(id) }) });
}

/** The campaign row as kept, read directly (no session). */
export async function campaignRow(id: number): Promise<{ status: string; sites_total: number; sites_done: number; chunks_total: number; chunks_done: number; problems_count: number } | undefined> {
  const rows = await models().sequelize.query<{ status: string; sites_total: number; sites_done: number; chunks_total: number; chunks_done: number; problems_count: number }>(
    'SELECT status, sites_total, sites_done, chunks_total, chunks_done, problems_count FROM campaigns WHERE id = :id',
    { replacements: { id }, type: QueryTypes.SELECT },
  );
  return rows[0];
}

export async function count(table: string, campaignId: number): Promise<number> {
  const [r] = await models().sequelize.query<{ n: number }>(`SELECT COUNT(*) AS n FROM ${table} WHERE campaign_id = :campaignId`, { replacements: { campaignId }, type: QueryTypes.SELECT });
  return Number(r.n);
}

export async function waitFor<T>(what: string, probe: () => Promise<T | null | undefined | false>, timeoutMs = 180_000, everyMs = 250): Promise<T> {
  const end = Date.now() + timeoutMs;
  for (;;) {
    const v = await probe();
    if (v) return v;
    if (Date.now() > end) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, everyMs));
  }
}

export const progressJson = async (id: number) => (await (await progressOf(id)).json()) as CampaignProgress;

/** n invented sites over a mid-latitude box (demo data), `dishCm` each. */
export function sitesCsv(n: number, o: { dishCm?: (i: number) => number; lat?: (i: number) => number; lon?: (i: number) => number } = {}): string {
  const lines = ['site_ref,latitude,longitude,altitude_m,current_dish_cm'];
  for (let i = 0; i < n; i++) {
    const lat = o.lat ? o.lat(i) : 40 + (i % 150) / 10;
    const lon = o.lon ? o.lon(i) : -5 + (i % 97) / 10;
    lines.push(`SUB-${i},${lat.toFixed(3)},${lon.toFixed(3)},${i % 5 === 4 ? '' : (i * 7) % 900},${o.dishCm ? o.dishCm(i) : [60, 90, 45, 120][i % 4]}`);
  }
  return lines.join('\n') + '\n';
}
