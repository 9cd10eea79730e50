'use client';

import { ActionForm } from '@/components/ui/action-form';
import { ConfirmSubmit } from '@/components/team/confirm-submit';
import { revokeApiKey } from '@/server/actions/api-keys';

export function RevokeKeyForm({ keyId, name }: { keyId: number; name: string }) {
  return (
    <ActionForm action={revokeApiKey} className="flex flex-col sm:items-end" statusClassName="max-w-xs text-xs sm:text-right">
      <input type="hidden" name="id" value={keyId} />
      <ConfirmSubmit label="Revoke" ariaLabel={`Revoke the API key ${name}`} question="Refuse it from now on?" confirmLabel="Revoke" />
    </ActionForm>
  );
}
