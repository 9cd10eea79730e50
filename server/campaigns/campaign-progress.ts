import type { CampaignRow, CampaignStatus } from '@/db/queries/campaigns';
import { receivingWords } from './campaign-status-words';

/** Problems listed on the campaign page while it runs and after (the result file has them all). */
export const CAMPAIGN_LISTED_PROBLEMS = 100;

export interface CampaignProgress {
  id: number;
  status: CampaignStatus;
  filename: string;
  rowsTotal: number;
  sitesTotal: number;
  sitesDone: number;
  /** 0–100, whole sites only: 100 only when every site is computed. */
  percent: number;
  /** Sites per second since the first chunk started; null before. */
  sitesPerSecond: number | null;
  /** Seconds left at that rate; null when not running or not yet known. */
  secondsLeft: number | null;
  problemsCount: number;
  counts: { upgrade: number; alreadyMeetsTarget: number; noneMeetsTarget: number };
  failureMessage: string | null;
  /** While the file is still arriving: rows so far, or that it stalled and when it will be given up. */
  receivingNote: string | null;
  problems: { line: number; message: string }[];
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
}

export const isFinished = (s: CampaignStatus) => s === 'done' || s === 'cancelled' || s === 'failed';

/** What the progress route answers and the page shows: counts, rate and time left from the kept row. */
export function campaignProgress(c: CampaignRow, problems: { line: number; message: string }[], staleAfterSeconds: number, now = new Date()): CampaignProgress {
  const end = c.finishedAt ?? now;
  const seconds = c.startedAt ? (end.getTime() - c.startedAt.getTime()) / 1000 : 0;
  const rate = c.startedAt && seconds > 0 && c.sitesDone > 0 ? c.sitesDone / seconds : null;
  const left = c.sitesTotal - c.sitesDone;
  return {
    id: c.id,
    status: c.status,
    filename: c.filename,
    rowsTotal: c.rowsTotal,
    sitesTotal: c.sitesTotal,
    sitesDone: c.sitesDone,
    percent: c.sitesTotal === 0 ? 0 : Math.floor((100 * c.sitesDone) / c.sitesTotal),
    sitesPerSecond: rate,
    secondsLeft: !isFinished(c.status) && rate ? Math.ceil(left / rate) : null,
    problemsCount: c.problemsCount,
    counts: { upgrade: c.upgradeCount, alreadyMeetsTarget: c.alreadyMeetsCount, noneMeetsTarget: c.noneMeetsCount },
    failureMessage: c.failureMessage,
    receivingNote: c.status === 'receiving' ? receivingWords(c, staleAfterSeconds, now) : null,
    problems,
    createdAt: c.createdAt.toISOString(),
    startedAt: c.startedAt?.toISOString() ?? null,
    finishedAt: c.finishedAt?.toISOString() ?? null,
  };
}
