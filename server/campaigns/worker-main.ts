import { Worker } from 'bullmq';
import { getEnv } from '@/server/env';
import { closeSequelize } from '@/db/sequelize';
import { markCampaignFailed } from '@/db/queries/campaigns';
import { CAMPAIGN_QUEUE, redisConnection, type ChunkJobData } from './campaign-queue';
import { runCampaignChunk } from './campaign-chunk';

/**
 * A campaign worker process (`npm run worker`; `npm start` starts one). Any number may run, on any
 * machine pointed at the same Redis and MariaDB. A worker killed mid-chunk loses its lock after
 * CAMPAIGN_JOB_LOCK_SECONDS and BullMQ's stalled-job check hands the chunk to another worker;
 * commitChunk writes every chunk once, so a chunk computed twice still leaves one row per line.
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

let stopping = false;
async function stop(signal: string) {
  if (stopping) return;
  stopping = true;
  console.log(`[campaign-worker ${process.pid}] ${signal}: finishing the current chunk, then stopping`);
  await worker.close();
  await connection.quit().catch(() => {});
  await closeSequelize();
  process.exit(0);
}
process.on('SIGTERM', () => void stop('SIGTERM'));
process.on('SIGINT', () => void stop('SIGINT'));
