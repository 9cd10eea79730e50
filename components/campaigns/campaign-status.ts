import type { CampaignStatus } from '@/db/queries/campaigns';

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
