'use client';

import { useActionState } from 'react';
import { archiveStudy, unarchiveStudy } from '@/server/actions/studies';
import { SubmitButton } from '@/components/ui/submit-button';
import { FormStatus } from '@/components/ui/form-status';

/**
 * Archive a study (it leaves the default studies list) or put it back. The action revalidates
 * this page, so the banner and the button flip once it answers; the snapshots never change.
 */
export function ArchiveButton({ studyId, archived }: { studyId: number; archived: boolean }) {
  const [state, action] = useActionState(archived ? unarchiveStudy : archiveStudy, null);
  return (
    <form action={action} className="flex items-center gap-2">
      <input type="hidden" name="id" value={studyId} />
      <SubmitButton variant={archived ? 'secondary' : 'quiet'} pendingLabel={archived ? 'Restoring…' : 'Archiving…'}>
        {archived ? 'Restore to list' : 'Archive'}
      </SubmitButton>
      {state && !state.ok && <FormStatus state={state} />}
    </form>
  );
}
