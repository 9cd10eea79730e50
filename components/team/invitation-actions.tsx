'use client';

import { ActionForm } from '@/components/ui/action-form';
import { SubmitButton } from '@/components/ui/submit-button';
import { resendInvitation, revokeInvitation } from '@/server/actions/team';
import { ConfirmSubmit } from './confirm-submit';

export function InvitationActions({ invitationId, email }: { invitationId: number; email: string }) {
  return (
    <div className="flex flex-wrap items-start gap-1 sm:justify-end">
      <ActionForm action={resendInvitation} className="flex flex-col sm:items-end" statusClassName="max-w-xs text-xs sm:text-right">
        <input type="hidden" name="invitationId" value={invitationId} />
        <SubmitButton variant="quiet" size="sm" pendingLabel="Sending…" aria-label={`Resend the invitation to ${email}`}>
          Resend
        </SubmitButton>
      </ActionForm>
      <ActionForm action={revokeInvitation} className="flex flex-col sm:items-end" statusClassName="max-w-xs text-xs sm:text-right">
        <input type="hidden" name="invitationId" value={invitationId} />
        <ConfirmSubmit label="Revoke" ariaLabel={`Revoke the invitation to ${email}`} question="Withdraw it?" confirmLabel="Revoke" />
      </ActionForm>
    </div>
  );
}
