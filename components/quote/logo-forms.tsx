'use client';

import { ActionForm } from '@/components/ui/action-form';
import { Field } from '@/components/ui/field';
import { SubmitButton } from '@/components/ui/submit-button';
import { removeLogo, uploadLogo } from '@/server/actions/branding';

export function UploadLogoForm({ disabled }: { disabled: boolean }) {
  return (
    <ActionForm action={uploadLogo} aria-label="Upload a logo" className="space-y-3" resetOnSuccess>
      <Field label="Logo file" name="logo" type="file" accept="image/png,image/jpeg" disabled={disabled} hint="PNG or JPEG, at most 200 KiB and 2000 px a side. A wide logo about 600 × 200 px prints well." />
      <SubmitButton pendingLabel="Uploading…">{disabled ? 'Not in your plan' : 'Upload logo'}</SubmitButton>
    </ActionForm>
  );
}

export function RemoveLogoForm() {
  return (
    <ActionForm action={removeLogo} aria-label="Remove the logo">
      <SubmitButton variant="danger" size="sm" pendingLabel="Removing…">Remove logo</SubmitButton>
    </ActionForm>
  );
}
