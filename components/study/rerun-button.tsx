'use client';

import { useActionState, useEffect } from 'react';
import { useRouter } from 'next/navigation';
import { rerunStudy } from '@/server/actions/studies';
import { SubmitButton } from '@/components/ui/submit-button';
import { FormStatus } from '@/components/ui/form-status';

/** Computes a new revision with today's catalogue, profiles and engine, then opens it. */
export function RerunButton({ studyId }: { studyId: number }) {
  const router = useRouter();
  const [state, action] = useActionState(rerunStudy, null);
  useEffect(() => {
    const id = state?.ok ? (state.data as { id?: number } | undefined)?.id : undefined;
    if (id) router.push(`/studies/${id}`);
  }, [state, router]);
  return (
    <form action={action} className="flex items-center gap-2">
      <input type="hidden" name="id" value={studyId} />
      <SubmitButton variant="secondary" pendingLabel="Computing…">
        Re-run with today’s data
      </SubmitButton>
      {state && !state.ok && <FormStatus state={state} />}
    </form>
  );
}
