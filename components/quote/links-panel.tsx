'use client';

import { useState } from 'react';
import { ActionForm, useFormState } from '@/components/ui/action-form';
import { SelectField } from '@/components/ui/field';
import { SubmitButton } from '@/components/ui/submit-button';
import { Button } from '@/components/ui/button';
import { copyShareLink, createShareLink, revokeShareLink } from '@/server/actions/share-links';
import type { ShareLinkItem } from '@/db/queries/share-links';
import { dayTime } from './format';

export const LINK_DAYS_OPTIONS = [
  { value: '7', label: '7 days' },
  { value: '14', label: '14 days' },
  { value: '30', label: '30 days' },
  { value: '60', label: '60 days' },
  { value: '90', label: '90 days' },
];

/** A link's URL in a read-only box with a copy button (after making it, or on "Copy link"). */
function LinkUrl({ id, label, url }: { id: string; label: string; url: string }) {
  const [copied, setCopied] = useState(false);
  return (
    <div className="mt-2 rounded border border-ledger-200 bg-ledger-50 p-3">
      <label htmlFor={id} className="block text-sm font-medium text-ledger-900">{label}</label>
      <div className="mt-1 flex gap-2">
        <input id={id} readOnly value={url} onFocus={(e) => e.currentTarget.select()} className="block w-full min-w-0 rounded border border-stone-300 bg-white px-2 py-1.5 font-mono text-xs text-stone-900" />
        <Button
          variant="secondary"
          size="sm"
          onClick={async () => {
            try {
              await navigator.clipboard.writeText(url);
              setCopied(true);
            } catch {
              // No clipboard permission (or plain http): the box is selected for Ctrl-C instead.
              (document.getElementById(id) as HTMLInputElement | null)?.select();
              setCopied(false);
            }
          }}
        >
          {copied ? 'Copied' : 'Copy'}
        </Button>
      </div>
    </div>
  );
}

const urlOf = (state: ReturnType<typeof useFormState>) => (state?.ok ? (state.data as { url?: string } | undefined)?.url : undefined);

/** After a link is made: its URL with a copy button. */
function NewLinkShown() {
  const url = urlOf(useFormState());
  return url ? <LinkUrl id="new-link-url" label="New comparison link" url={url} /> : null;
}

/** After "Copy link" on an existing link: its URL, opened for this person. */
function CopiedLinkShown({ linkId }: { linkId: number }) {
  const url = urlOf(useFormState());
  return url ? <LinkUrl id={`link-${linkId}-url`} label={`Link ${linkId}`} url={url} /> : null;
}

function linkState(l: ShareLinkItem): string {
  if (l.revokedAt) return `Revoked ${dayTime(l.revokedAt)}`;
  if (!l.active) return `Expired ${dayTime(l.expiresAt)}`;
  return `Open until ${dayTime(l.expiresAt)}`;
}

/** Comparison links of a quote: make one, copy an active one again (anyone who may share), see views, revoke. */
export function LinksPanel({ quoteId, links, canShare, shareable }: { quoteId: number; links: ShareLinkItem[]; canShare: boolean; shareable: boolean }) {
  return (
    <div className="space-y-4">
      {canShare && shareable && (
        <ActionForm action={createShareLink} aria-label="Make a comparison link" statusClassName="mt-2" showSuccess={false}>
          <input type="hidden" name="quoteId" value={quoteId} />
          <div className="flex flex-wrap items-end gap-3">
            <SelectField label="Link works for" name="expiresInDays" defaultValue="30" options={LINK_DAYS_OPTIONS} className="w-40" />
            <SubmitButton variant="secondary" pendingLabel="Making…">Make a link</SubmitButton>
          </div>
          <NewLinkShown />
        </ActionForm>
      )}
      {links.length === 0 ? (
        <p className="text-sm text-stone-600">No links yet.</p>
      ) : (
        // A list, not a table: the panel is a narrow side column, and a table would scroll sideways there.
        <ul className="divide-y divide-stone-200 rounded border border-stone-200" aria-label="Comparison links">
          {links.map((l) => (
            <li key={l.id} className="px-3 py-2.5 text-sm">
              <div className="flex items-start justify-between gap-3">
                <div className="min-w-0">
                  <p className="font-medium text-stone-900">
                    Link {l.id} <span className={`ml-1 font-normal ${l.active ? 'text-ledger-800' : 'text-stone-600'}`}>· {linkState(l)}</span>
                  </p>
                  <p className="text-xs text-stone-600">
                    <span className="num">{l.viewCount}</span> {l.viewCount === 1 ? 'customer view' : 'customer views'} · last opened {l.lastViewedAt ? dayTime(l.lastViewedAt) : 'never'}
                  </p>
                  <p className="text-xs text-stone-600">Made {l.createdByName ? `by ${l.createdByName}, ` : ''}{dayTime(l.createdAt)}</p>
                </div>
                {canShare && l.active && (
                  <ActionForm
                    action={revokeShareLink}
                    aria-label={`Revoke link ${l.id}`}
                    showSuccess={false}
                    className="shrink-0"
                    confirm={`Revoke link ${l.id}? The customer will no longer be able to open the quote with it. This cannot be undone.`}
                  >
                    <input type="hidden" name="quoteId" value={quoteId} />
                    <input type="hidden" name="linkId" value={l.id} />
                    <SubmitButton variant="danger" size="sm" pendingLabel="Revoking…" aria-label={`Revoke link ${l.id}`}>Revoke</SubmitButton>
                  </ActionForm>
                )}
              </div>
              {canShare && l.active && l.copyable && (
                <ActionForm action={copyShareLink} aria-label={`Copy link ${l.id}`} showSuccess={false} className="mt-1.5">
                  <input type="hidden" name="quoteId" value={quoteId} />
                  <input type="hidden" name="linkId" value={l.id} />
                  <SubmitButton variant="secondary" size="sm" pendingLabel="Opening…" aria-label={`Copy link ${l.id}`}>Copy link</SubmitButton>
                  <CopiedLinkShown linkId={l.id} />
                </ActionForm>
              )}
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
