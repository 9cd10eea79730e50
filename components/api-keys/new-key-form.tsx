'use client';

import { useState } from 'react';
import { ActionForm, useFormState } from '@/components/ui/action-form';
import { Field, FormErrors } from '@/components/ui/field';
import { SubmitButton } from '@/components/ui/submit-button';
import { Button } from '@/components/ui/button';
import { createApiKey } from '@/server/actions/api-keys';
import { API_SCOPES, SCOPE_LABELS } from '@/server/auth/api-scopes';
import { DEFAULT_API_KEY_RATE_PER_MINUTE, MAX_API_KEY_RATE_PER_MINUTE } from '@/server/validation/api-key';

/** Name, scopes and rate of a new key; the key itself appears below the form once, after creating. */
export function NewKeyForm({ disabled }: { disabled?: boolean }) {
  return (
    <ActionForm action={createApiKey} resetOnSuccess className="space-y-4" aria-label="Create an API key">
      <div className="grid gap-3 sm:grid-cols-[minmax(0,1fr)_12rem]">
        <Field label="Name" name="name" autoComplete="off" placeholder="e.g. Order system" hint="Says who uses the key; shown in the list and the audit log." required disabled={disabled} />
        <Field label="Requests a minute" name="rateLimitPerMinute" type="number" inputMode="numeric" min={1} max={MAX_API_KEY_RATE_PER_MINUTE} defaultValue={DEFAULT_API_KEY_RATE_PER_MINUTE} disabled={disabled} />
      </div>
      <fieldset disabled={disabled}>
        <legend className="text-sm font-medium text-stone-800">Scopes</legend>
        <div className="mt-2 grid gap-2 sm:grid-cols-2">
          {API_SCOPES.map((scope) => (
            <label key={scope} className="flex items-start gap-2 text-sm text-stone-700">
              <input type="checkbox" name="scopes" value={scope} defaultChecked={scope === 'trade-off'} className="mt-0.5" />
              <span>{SCOPE_LABELS[scope]}</span>
            </label>
          ))}
        </div>
        <FormErrors names={['scopes']} />
      </fieldset>
      <SubmitButton pendingLabel="Creating…">Create key</SubmitButton>
      <KeyShownOnce />
    </ActionForm>
  );
}

/** The new key from the action's answer, with a copy button; gone on the next answer or reload. */
function KeyShownOnce() {
  const state = useFormState();
  const [copied, setCopied] = useState(false);
  const data = state?.ok ? (state.data as { token?: string; name?: string } | undefined) : undefined;
  if (!data?.token) return null;
  const token = data.token;
  return (
    <div className="rounded-md border border-ledger-200 bg-ledger-50 px-4 py-3 text-sm text-ledger-900">
      <p className="font-semibold">Your new key{data.name ? ` “${data.name}”` : ''}</p>
      <p className="mt-1">Copy it now and keep it in your system’s secret store: FadeLedger keeps only a fingerprint and cannot show it again.</p>
      <div className="mt-2 flex flex-wrap items-center gap-2">
        <code className="num break-all rounded border border-stone-200 bg-white px-2 py-1 text-xs" aria-label="New API key">
          {token}
        </code>
        <Button
          size="sm"
          variant="quiet"
          onClick={async () => {
            await navigator.clipboard.writeText(token);
            setCopied(true);
          }}
        >
          {copied ? 'Copied' : 'Copy'}
        </Button>
      </div>
    </div>
  );
}
