'use client';

import { useActionState, useEffect, useRef } from 'react';
import { useRouter } from 'next/navigation';
import { rerunStudy } from '@/server/actions/studies';
import { Button } from '@/components/ui/button';
import { SubmitButton } from '@/components/ui/submit-button';
import { FormStatus } from '@/components/ui/form-status';

/** What a re-run takes from today (server/studies/rerun-study.ts does exactly this): said before it runs. */
const REFRESHED = [
  'the service profile as it is now (EIRP, frequency, MODCOD, noise figures)',
  'dish sizes and prices from today’s catalogue (dishes deleted since are left out)',
  'the climate data: the ITU-R maps at the site, or the override profile as it is now',
  'the current FadeLedger engine version',
] as const;

/**
 * Asks first, naming what will be refreshed, then computes the next revision with today's
 * catalogue, profiles and engine and opens it. The study shown stays as it is.
 */
export function RerunButton({ studyId, nextRevision }: { studyId: number; nextRevision?: number }) {
  const router = useRouter();
  const dialog = useRef<HTMLDialogElement>(null);
  const [state, action] = useActionState(rerunStudy, null);
  useEffect(() => {
    const id = state?.ok ? (state.data as { id?: number } | undefined)?.id : undefined;
    if (id) router.push(`/studies/${id}`);
  }, [state, router]);
  const revision = nextRevision ? `revision ${nextRevision}` : 'a new revision';
  return (
    <>
      <Button variant="secondary" onClick={() => dialog.current?.showModal()} aria-haspopup="dialog">
        Re-run with today’s data
      </Button>
      <dialog
        ref={dialog}
        aria-labelledby={`rerun-title-${studyId}`}
        className="m-auto w-[min(32rem,calc(100vw-2rem))] rounded-md border border-stone-300 bg-white p-0 text-stone-800 shadow-lg backdrop:bg-stone-900/40"
      >
        <form action={action} className="space-y-3 px-5 py-4">
          <h2 id={`rerun-title-${studyId}`} className="text-base font-semibold text-stone-900">
            Re-run this study as {revision}?
          </h2>
          <p className="text-sm">The same site, services, dishes and target are computed again with today&rsquo;s data:</p>
          <ul className="list-disc space-y-1 pl-5 text-sm">
            {REFRESHED.map((r) => (
              <li key={r}>{r}</li>
            ))}
          </ul>
          <p className="text-sm text-stone-600">The figures may change. This revision and any quote made from it stay exactly as they are. To change an input as well, use Edit inputs.</p>
          <input type="hidden" name="id" value={studyId} />
          <div className="flex flex-wrap items-center justify-end gap-2 pt-1">
            <Button variant="quiet" onClick={() => dialog.current?.close()}>
              Cancel
            </Button>
            <SubmitButton pendingLabel="Computing…">Make {revision}</SubmitButton>
          </div>
          {state && !state.ok && <FormStatus state={state} />}
        </form>
      </dialog>
    </>
  );
}
