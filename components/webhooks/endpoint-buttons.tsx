'use client';

import { ActionForm } from '@/components/ui/action-form';
import { SubmitButton } from '@/components/ui/submit-button';
import { ConfirmSubmit } from '@/components/team/confirm-submit';
import { removeWebhookEndpoint, sendTestWebhook } from '@/server/actions/webhooks';

/** "Send test event": queued and attempted at once; the outcome shows in the status line and the log. */
export function SendTestForm({ endpointId, description }: { endpointId: number; description: string }) {
  return (
    <ActionForm action={sendTestWebhook} className="flex flex-col items-start gap-1" statusClassName="max-w-md text-xs">
      <input type="hidden" name="id" value={endpointId} />
      <SubmitButton size="sm" variant="quiet" pendingLabel="Sending…" aria-label={`Send a test event to ${description}`}>
        Send test event
      </SubmitButton>
    </ActionForm>
  );
}

export function RemoveEndpointForm({ endpointId, description }: { endpointId: number; description: string }) {
  return (
    <ActionForm action={removeWebhookEndpoint} className="flex flex-col sm:items-end" statusClassName="max-w-xs text-xs sm:text-right">
      <input type="hidden" name="id" value={endpointId} />
      <ConfirmSubmit label="Remove" ariaLabel={`Remove the webhook endpoint ${description}`} question="Remove it and its log?" confirmLabel="Remove" />
    </ActionForm>
  );
}
