'use client';

import { ActionForm } from '@/components/ui/action-form';
import { Field } from '@/components/ui/field';
import { SubmitButton } from '@/components/ui/submit-button';
import { removeLogo, saveCompanyContact, uploadLogo } from '@/server/actions/branding';
import { companyContactSchema } from '@/server/validation/branding';

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

/** The company's contact for customers: e-mail and phone, both optional. */
export function CompanyContactForm({ email, phone }: { email: string; phone: string }) {
  return (
    <ActionForm action={saveCompanyContact} schema={companyContactSchema} aria-label="Contact for customers" className="space-y-3">
      <Field label="Contact e-mail" name="contactEmail" type="email" autoComplete="email" defaultValue={email} className="max-w-md" hint="Replies to quote e-mails reach this address as well as the sender, and it hears of every accepted or declined quote." />
      <Field label="Contact phone" name="contactPhone" type="tel" autoComplete="tel" defaultValue={phone} className="max-w-xs" />
      <SubmitButton pendingLabel="Saving…">Save contact</SubmitButton>
    </ActionForm>
  );
}
