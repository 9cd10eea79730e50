'use client';

import { ActionForm } from '@/components/ui/action-form';
import { Field, SelectField } from '@/components/ui/field';
import { SubmitButton } from '@/components/ui/submit-button';
import { inviteMember } from '@/server/actions/team';

const ROLE_OPTIONS = [
  { value: 'installer', label: 'Installer — sites, studies, quotes' },
  { value: 'sales', label: 'Sales — reads, shares and e-mails quotes' },
  { value: 'admin', label: 'Admin — everything, including team and billing' },
] as const;

/** Invite by e-mail with a role; the seat check happens on the server. */
export function InviteForm({ disabled }: { disabled?: boolean }) {
  return (
    <ActionForm action={inviteMember} resetOnSuccess className="grid gap-3 sm:grid-cols-[minmax(0,1fr)_minmax(0,16rem)_auto] sm:items-start" statusClassName="sm:col-span-3" aria-label="Invite a colleague">
      <Field label="E-mail address" name="email" type="email" autoComplete="off" placeholder="colleague@yourcompany.com" required disabled={disabled} />
      <SelectField label="Role" name="role" options={ROLE_OPTIONS} defaultValue="installer" disabled={disabled} />
      <div className="sm:pt-6">
        <SubmitButton pendingLabel="Sending…" className="w-full sm:w-auto">
          Send invitation
        </SubmitButton>
      </div>
    </ActionForm>
  );
}
