'use client';

import { useEffect, useRef } from 'react';
import { useActionState } from 'react';
import useSWR from 'swr';
import { useRouter } from 'next/navigation';
import { fetchJson } from '@/components/study/fetch-json';
import { ConfirmSubmit } from '@/components/team/confirm-submit';
import { FormStatus } from '@/components/ui/form-status';
import { cancelUpgradeCampaign } from '@/server/actions/campaigns';
import type { CampaignProgress } from '@/server/campaigns/campaign-progress';
import { CAMPAIGN_STATUS_WORDS, durationWords } from '@/server/campaigns/campaign-status-words';

const n = (x: number) => x.toLocaleString('en-US');
const finished = (s: CampaignProgress['status']) => s === 'done' || s === 'cancelled' || s === 'failed';

/**
 * A campaign's progress, polled from GET /api/campaigns/:id every two seconds while it runs
 * (SWR; no reload): sites done of total, rate and time left, problems so far, cancel, and the
 * result file (finished rows while running). When it finishes the page refreshes once so the
 * summary, computed on the server, appears.
 */
export function CampaignProgressPanel({ initial }: { initial: CampaignProgress }) {
  const router = useRouter();
  const { data, error } = useSWR<CampaignProgress>(`/api/campaigns/${initial.id}`, fetchJson, {
    fallbackData: initial,
    refreshInterval: (d) => (d && finished(d.status) ? 0 : 2000),
  });
  const p = data ?? initial;
  const wasFinished = useRef(finished(initial.status));
  useEffect(() => {
    if (finished(p.status) && !wasFinished.current) {
      wasFinished.current = true;
      router.refresh();
    }
  }, [p.status, router]);
  const [cancelState, cancel] = useActionState(cancelUpgradeCampaign, null);
  const running = !finished(p.status);

  return (
    <section aria-labelledby="campaign-progress-title" className="space-y-4">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h2 id="campaign-progress-title" className="text-base font-semibold text-stone-900">
          Progress: <span data-testid="campaign-status">{CAMPAIGN_STATUS_WORDS[p.status]}</span>
        </h2>
        <div className="flex flex-wrap items-center gap-2">
          <a className="rounded border border-stone-300 bg-white px-3 py-1.5 text-sm font-medium text-stone-800 hover:bg-stone-50" href={`/api/campaigns/${p.id}/results`} download>
            {running ? 'Download finished rows (CSV)' : 'Download all results (CSV)'}
          </a>
          {running && (
            // Asks once more: a cancel cannot be undone, and on a phone the button sits under a thumb.
            <form action={cancel}>
              <input type="hidden" name="campaignId" value={p.id} />
              <ConfirmSubmit label="Cancel the campaign" question="Stop computing the remaining sites? This cannot be undone." confirmLabel="Stop the campaign" />
            </form>
          )}
        </div>
      </div>
      {cancelState && <FormStatus state={cancelState} />}
      <div>
        <div className="flex justify-between text-sm text-stone-700">
          <span>
            <span className="num font-semibold" data-testid="campaign-sites-done">{n(p.sitesDone)}</span> of <span className="num">{n(p.sitesTotal)}</span> sites computed
          </span>
          <span className="num font-semibold" data-testid="campaign-percent">{p.percent} %</span>
        </div>
        <div className="mt-1 h-3 w-full overflow-hidden rounded bg-stone-200" role="progressbar" aria-label="Sites computed" aria-valuemin={0} aria-valuemax={100} aria-valuenow={p.percent}>
          <div className="h-full bg-ledger-700 transition-[width]" style={{ width: `${p.percent}%` }} />
        </div>
        <p className="mt-1 text-xs text-stone-600" aria-live="polite">
          {p.sitesPerSecond !== null && <>{n(Math.round(p.sitesPerSecond))} sites a second</>}
          {p.secondsLeft !== null && <> · about {durationWords(p.secondsLeft)} left</>}
          {p.status === 'queued' && <>Waiting for a worker to take the first chunk.</>}
          {p.receivingNote && <>Receiving the file: {p.receivingNote}.</>}
          {p.status === 'done' && p.startedAt && p.finishedAt && <> · took {durationWords((Date.parse(p.finishedAt) - Date.parse(p.startedAt)) / 1000)}</>}
          {error && <span className="text-red-700"> · progress could not be read just now ({error.message}); retrying.</span>}
        </p>
      </div>
      {p.status === 'failed' && p.failureMessage && (
        <p role="alert" className="rounded border border-red-200 bg-red-50 px-3 py-2 text-sm text-red-800">
          {p.failureMessage}
        </p>
      )}
      <dl className="grid grid-cols-2 gap-3 sm:grid-cols-4">
        {(
          [
            ['to upgrade', p.counts.upgrade],
            ['already meet the target', p.counts.alreadyMeetsTarget],
            ['no dish meets the target', p.counts.noneMeetsTarget],
            ['lines with problems', p.problemsCount],
          ] as const
        ).map(([label, value]) => (
          <div key={label} className="rounded border border-stone-200 px-3 py-2">
            <dt className="text-xs text-stone-600">{label}</dt>
            <dd className="num text-lg font-semibold text-stone-900">{n(value)}</dd>
          </div>
        ))}
      </dl>
      {p.problems.length > 0 && (
        <div>
          <h3 className="text-sm font-semibold text-stone-900">Lines left out: problems in the file{running ? ' so far' : ''}</h3>
          <ul className="mt-1 max-h-48 list-disc space-y-0.5 overflow-auto rounded border border-red-200 bg-red-50 py-2 pl-8 pr-3 text-sm text-red-800">
            {p.problems.map((x, i) => (
              <li key={i}>{x.message}</li>
            ))}
            {p.problemsCount > p.problems.length && <li>…and {n(p.problemsCount - p.problems.length)} more, all listed in the result file.</li>}
          </ul>
        </div>
      )}
    </section>
  );
}
