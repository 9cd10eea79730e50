import type { CampaignStatus } from '@/db/queries/campaigns';

// Pure words (no server-only imports): the campaign list and page show them, and the stale-upload
// sweep writes its message with them.

/** How a campaign's status reads on the list and its page. */
export const CAMPAIGN_STATUS_WORDS: Record<CampaignStatus, string> = {
  receiving: 'receiving the file',
  queued: 'waiting for a worker',
  running: 'computing',
  done: 'done',
  cancelled: 'cancelled',
  failed: 'failed',
};

/** "3 min 20 s", "1 h 05 min": a duration a person reads at a glance. */
export function durationWords(seconds: number): string {
  const s = Math.max(0, Math.round(seconds));
  if (s < 60) return `${s} s`;
  if (s < 3600) return `${Math.floor(s / 60)} min ${String(s % 60).padStart(2, '0')} s`;
  return `${Math.floor(s / 3600)} h ${String(Math.floor((s % 3600) / 60)).padStart(2, '0')} min`;
}

/** Quiet time after which a receiving campaign reads as stalled (a live upload writes a batch every second or so). */
export const RECEIVING_STALLED_AFTER_SECONDS = 60;

const clock = (d: Date) => d.toISOString().slice(11, 16) + ' UTC';

/**
 * What a campaign still receiving its file is doing, from its row: rows read so far, or — when
 * nothing has arrived for a while (the upload was interrupted) — since when, and when the
 * stale-upload sweep will give it up (server/campaigns/stale-uploads.ts) unless it resumes.
 */
export function receivingWords(c: { rowsTotal: number; updatedAt: Date }, staleAfterSeconds: number, now = new Date()): string {
  const rows = `${c.rowsTotal.toLocaleString('en-US')} rows so far`;
  const quietSeconds = (now.getTime() - c.updatedAt.getTime()) / 1000;
  if (quietSeconds < RECEIVING_STALLED_AFTER_SECONDS) return `${rows}`;
  const givenUp = new Date(c.updatedAt.getTime() + staleAfterSeconds * 1000);
  return `stalled: nothing received since ${clock(c.updatedAt)} (${rows}); it will be marked failed at about ${clock(givenUp)} unless it resumes`;
}
