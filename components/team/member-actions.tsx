'use client';

import { useId } from 'react';
import { ActionForm } from '@/components/ui/action-form';
import { SubmitButton } from '@/components/ui/submit-button';
import { changeMemberRole, removeMember } from '@/server/actions/team';
import { ConfirmSubmit } from './confirm-submit';

const ROLES = [
  { value: 'admin', label: 'Admin' },
  { value: 'installer', label: 'Installer' },
  { value: 'sales', label: 'Sales' },
] as const;

/** Role picker for one member; saving is explicit so a mis-click changes nothing. */
export function RoleForm({ membershipId, role, name }: { membershipId: number; role: string; name: string }) {
  const id = useId();
  return (
    <ActionForm action={changeMemberRole} className="flex flex-col gap-1" statusClassName="text-xs">
      <input type="hidden" name="membershipId" value={membershipId} />
      <div className="flex items-center gap-1.5 whitespace-nowrap">
        <label htmlFor={id} className="sr-only">
          Role of {name}
        </label>
        <select id={id} name="role" defaultValue={role} className="rounded border border-stone-300 bg-white px-2 py-1 text-sm focus:border-ledger-600 focus:outline-none">
          {ROLES.map((r) => (
            <option key={r.value} value={r.value}>
              {r.label}
            </option>
          ))}
        </select>
        <SubmitButton variant="secondary" size="sm" aria-label={`Save role of ${name}`}>
          Save
        </SubmitButton>
      </div>
    </ActionForm>
  );
}

export function RemoveMemberForm({ membershipId, name, self }: { membershipId: number; name: string; self: boolean }) {
  return (
    <ActionForm action={removeMember} className="flex flex-wrap items-center justify-end gap-1" statusClassName="basis-full text-right text-xs">
      <input type="hidden" name="membershipId" value={membershipId} />
      <ConfirmSubmit
        label={self ? 'Leave' : 'Remove'}
        ariaLabel={self ? 'Leave this company' : `Remove ${name}`}
        question={self ? 'Leave this company?' : `Remove ${name}?`}
        confirmLabel={self ? 'Leave' : 'Remove'}
      />
    </ActionForm>
  );
}
