'use client';

import { useState } from 'react';
import { ActionForm, useFormState } from '@/components/ui/action-form';
import { Field, FormErrors } from '@/components/ui/field';
import { SubmitButton } from '@/components/ui/submit-button';
import { Button } from '@/components/ui/button';
import { createWebhookEndpoint } from '@/server/actions/webhooks';
import { WEBHOOK_EVENT_LABELS, WEBHOOK_EVENTS } from '@/server/webhooks/events';
import { createWebhookSchema } from '@/server/validation/webhook';

/** Address, description and events of a new endpoint; its signing secret appears below once, after registering. */
export function NewEndpointForm({ disabled }: { disabled?: boolean }) {
  return (
    <ActionForm action={createWebhookEndpoint} schema={createWebhookSchema} resetOnSuccess className="space-y-4" aria-label="Register a webhook endpoint">
      <div className="grid gap-3 sm:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
        <Field label="Address (https)" name="url" type="url" inputMode="url" autoComplete="off" placeholder="https://orders.example.com/fadeledger-events" required disabled={disabled} />
        <Field label="Description" name="description" autoComplete="off" placeholder="e.g. Order system" hint="Shown in the list and the audit log." required disabled={disabled} />
      </div>
      <fieldset disabled={disabled}>
        <legend className="text-sm font-medium text-stone-800">Events</legend>
        <div className="mt-2 grid gap-2 sm:grid-cols-2">
          {WEBHOOK_EVENTS.map((event) => (
            <label key={event} className="flex items-start gap-2 text-sm text-stone-700">
              <input type="checkbox" name="events" value={event} defaultChecked className="mt-0.5" />
              <span>
                <code className="text-xs">{event}</code> — {WEBHOOK_EVENT_LABELS[event]}
              </span>
            </label>
          ))}
        </div>
        <FormErrors names={['events']} />
      </fieldset>
      <SubmitButton pendingLabel="Registering…">Register endpoint</SubmitButton>
      <SecretShownOnce />
    </ActionForm>
  );
}

/** The signing secret from the action's answer, with a copy button; gone on the next answer or reload. */
function SecretShownOnce() {
  const state = useFormState();
  const [copied, setCopied] = useState(false);
  const data = state?.ok ? (state.data as { signingSecret?: string; description?: string } | undefined) : undefined;
  if (!data?.signingSecret) return null;
  const secret = data.signingSecret;
  return (
    <div className="rounded-md border border-ledger-200 bg-ledger-50 px-4 py-3 text-sm text-ledger-900">
      <p className="font-semibold">Signing secret{data.description ? ` of “${data.description}”` : ''}</p>
      <p className="mt-1">Copy it now into the receiving system: it checks every delivery’s signature with it. FadeLedger will not show it again.</p>
      <div className="mt-2 flex flex-wrap items-center gap-2">
        <code className="num break-all rounded border border-stone-200 bg-white px-2 py-1 text-xs" aria-label="Signing secret">
          {secret}
        </code>
        <Button
          size="sm"
          variant="quiet"
          onClick={async () => {
            await navigator.clipboard.writeText(secret);
            setCopied(true);
          }}
        >
          {copied ? 'Copied' : 'Copy'}
        </Button>
      </div>
    </div>
  );
}
