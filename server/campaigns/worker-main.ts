import { Queue, Worker } from 'bullmq';
import { getEnv } from '@/server/env';
import { closeSequelize } from '@/db/sequelize';
import { markCampaignFailed } from '@/db/queries/campaigns';
import { CAMPAIGN_QUEUE, CAMPAIGN_UPKEEP_QUEUE, redisConnection, STALE_UPLOAD_SCHEDULER, type ChunkJobData } from './campaign-queue';
import { runCampaignChunk } from './campaign-chunk';
import { sweepStaleUploads } from './stale-uploads';

/**
 * A campaign worker process (`npm run worker`; `npm start` starts one). Any number may run, on any
 * machine pointed at the same Redis and MariaDB. A worker killed mid-chunk loses its lock after
 * CAMPAIGN_JOB_LOCK_SECONDS and BullMQ's stalled-job check hands the chunk to another worker;
 * commitChunk writes every chunk once, so a chunk computed twice still leaves one row per line.
 * Workers also sweep uploads that stopped half-way (stale-uploads.ts) on one shared BullMQ job
 * scheduler: however many workers run, one sweep job is due per CAMPAIGN_UPKEEP_EVERY_SECONDS.
 */
const env = getEnv();
const lockDuration = env.CAMPAIGN_JOB_LOCK_SECONDS * 1000;
const connection = redisConnection('worker');
connection.on('error', (e) => console.error(`[campaign-worker] Redis: ${e.message}`));

const worker = new Worker<ChunkJobData>(
  CAMPAIGN_QUEUE,
  async (job) => {
    const t0 = Date.now();
    const run = await runCampaignChunk(job.data.campaignId, job.data.chunkNo);
    if (process.env.CAMPAIGN_WORKER_VERBOSE) console.log(`[campaign-worker ${process.pid}] campaign ${job.data.campaignId} chunk ${job.data.chunkNo}: ${run} in ${Date.now() - t0} ms`);
    return run;
  },
  { connection, concurrency: env.CAMPAIGN_WORKER_CONCURRENCY, lockDuration, stalledInterval: Math.max(1000, Math.floor(lockDuration / 2)), maxStalledCount: 5 },
);

worker.on('failed', (job, error) => {
  if (!job) return;
  console.error(`[campaign-worker] campaign ${job.data.campaignId} chunk ${job.data.chunkNo} failed (attempt ${job.attemptsMade}): ${error.message}`);
  // Out of retries: the campaign cannot complete; say so rather than leave it running forever.
  if (job.attemptsMade >= (job.opts.attempts ?? 1)) {
    void markCampaignFailed(job.data.campaignId, `Part of the campaign (lines in chunk ${job.data.chunkNo + 1}) could not be computed: ${error.message}`).catch(() => {});
  }
});
worker.on('ready', () => console.log(`[campaign-worker ${process.pid}] waiting for campaign chunks on ${CAMPAIGN_QUEUE}`));

const upkeepQueue = new Queue(CAMPAIGN_UPKEEP_QUEUE, { connection });
const upkeep = new Worker(
  CAMPAIGN_UPKEEP_QUEUE,
  async () => {
    const swept = await sweepStaleUploads();
    if (swept.givenUp.length || swept.rowsDeleted) console.log(`[campaign-worker ${process.pid}] gave up interrupted uploads ${swept.givenUp.join(', ') || '(none new)'}; ${swept.rowsDeleted} staged rows deleted`);
    return swept;
  },
  { connection, concurrency: 1 },
);
upkeep.on('failed', (_job, error) => console.error(`[campaign-worker] stale-upload sweep failed: ${error.message}`));
void upkeepQueue
  .upsertJobScheduler(STALE_UPLOAD_SCHEDULER, { every: env.CAMPAIGN_UPKEEP_EVERY_SECONDS * 1000 }, { name: 'sweep-stale-uploads', opts: { removeOnComplete: true, removeOnFail: 100 } })
  .catch((e: Error) => console.error(`[campaign-worker] could not schedule the stale-upload sweep: ${e.message}`));

let stopping = false;
async function stop(signal: string) {
  if (stopping) return;
  stopping = true;
  console.log(`[campaign-worker ${process.pid}] ${signal}: finishing the current chunk, then stopping`);
  await Promise.all([worker.close(), upkeep.close(), upkeepQueue.close()]);
  await connection.quit().catch(() => {});
  await closeSequelize();
  process.exit(0);
}
process.on('SIGTERM', () => void stop('SIGTERM'));
process.on('SIGINT', () => void stop('SIGINT'));
