'use client';

import { ActionForm } from '@/components/ui/action-form';
import { FormErrors } from '@/components/ui/field';
import { SubmitButton } from '@/components/ui/submit-button';
import { unlockSignIn } from '@/server/actions/auth';

export function UnlockForm({ token }: { token: string }) {
  return (
    <ActionForm action={unlockSignIn} className="grid gap-4" aria-label="Let this browser sign in">
      <input type="hidden" name="token" value={token} />
      <FormErrors names={['token']} />
      <div>
        <SubmitButton pendingLabel="Letting this browser in…">Let this browser sign in</SubmitButton>
      </div>
    </ActionForm>
  );
}
