import { Queue, type JobsOptions } from 'bullmq';
import IORedis, { type Redis } from 'ioredis';
import { getEnv } from '@/server/env';
import { QueueUnavailableError } from '@/server/errors';

/** The BullMQ queue every web process adds chunk jobs to and every worker takes them from. */
export const CAMPAIGN_QUEUE = 'campaign-chunks';

export interface ChunkJobData {
  campaignId: number;
  chunkNo: number;
}

/**
 * Housekeeping the workers do on a schedule (now: giving up uploads that stopped half-way,
 * stale-uploads.ts). A queue of its own so a sweep never waits behind a campaign's chunks.
 */
export const CAMPAIGN_UPKEEP_QUEUE = 'campaign-upkeep';
/** The one job scheduler for it: every worker upserts the same id, so Redis holds one schedule. */
export const STALE_UPLOAD_SCHEDULER = 'stale-uploads';

/** How long a submit waits for Redis before telling the user it is out of reach. */
const REACH_TIMEOUT_MS = 2000;

/**
 * A Redis connection for the queue. Web processes give up on a command after one reconnect and
 * every queue call is also bounded by a timeout (withTimeout), so a submit answers 503 instead of
 * hanging; workers keep retrying forever (BullMQ wants maxRetriesPerRequest null for blocking commands).
 */
export function redisConnection(kind: 'web' | 'worker'): Redis {
  const url = getEnv().REDIS_URL;
  return kind === 'worker'
    ? new IORedis(url, { maxRetriesPerRequest: null })
    : new IORedis(url, { maxRetriesPerRequest: 1, connectTimeout: REACH_TIMEOUT_MS, retryStrategy: (n) => Math.min(n * 200, 2000) });
}

// One connection per web process: a cache of a socket, not state that must survive or be shared.
let web: { connection: Redis; queue: Queue<ChunkJobData> } | null = null;

function webQueue() {
  if (!web) {
    const connection = redisConnection('web');
    // Without a listener ioredis prints every failed reconnect as an unhandled error.
    connection.on('error', () => {});
    web = { connection, queue: new Queue<ChunkJobData>(CAMPAIGN_QUEUE, { connection }) };
  }
  return web;
}

async function withTimeout<T>(p: Promise<T>, ms: number): Promise<T> {
  let timer: NodeJS.Timeout | undefined;
  try {
    return await Promise.race([p, new Promise<never>((_, reject) => (timer = setTimeout(() => reject(new Error('timeout')), ms)))]);
  } finally {
    clearTimeout(timer);
  }
}

/** Throws QueueUnavailableError unless Redis answers PING within two seconds. */
export async function assertQueueReachable(): Promise<void> {
  const { connection } = webQueue();
  try {
    await withTimeout(connection.ping(), REACH_TIMEOUT_MS);
  } catch {
    throw new QueueUnavailableError();
  }
}

/** Retries for a chunk whose worker failed (not one that was killed: stalled jobs come back on their own). */
const JOB_OPTIONS: JobsOptions = { attempts: 5, backoff: { type: 'exponential', delay: 2000 }, removeOnComplete: true, removeOnFail: 1000 };

/** The job id of a chunk: adding it twice is a no-op in BullMQ. */
export const chunkJobId = (campaignId: number, chunkNo: number) => `campaign-${campaignId}-chunk-${chunkNo}`;

/**
 * Adds every chunk of a campaign in one MULTI (BullMQ addBulk): either all are queued or none.
 * Throws QueueUnavailableError when Redis refuses.
 */
export async function enqueueChunks(campaignId: number, chunkCount: number): Promise<void> {
  const { queue } = webQueue();
  const jobs = Array.from({ length: chunkCount }, (_, i) => ({ name: 'chunk', data: { campaignId, chunkNo: i }, opts: { ...JOB_OPTIONS, jobId: chunkJobId(campaignId, i) } }));
  try {
    for (let i = 0; i < jobs.length; i += 5000) await withTimeout(queue.addBulk(jobs.slice(i, i + 5000)), 30_000);
  } catch {
    throw new QueueUnavailableError();
  }
}

/** Removes a campaign's chunk jobs that no worker has taken yet (cancel); taken ones see the status and stop. */
export async function dropWaitingChunks(campaignId: number, chunkCount: number): Promise<void> {
  const { queue } = webQueue();
  try {
    for (let i = 0; i < chunkCount; i++) {
      const job = await queue.getJob(chunkJobId(campaignId, i));
      if (job && (await job.isWaiting())) await job.remove().catch(() => {});
    }
  } catch {
    // Redis out of reach: the workers still skip every chunk of a cancelled campaign.
  }
}
