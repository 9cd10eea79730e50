'use client';

import { createCustomer } from '@/server/actions/customers';
import { customerSchema } from '@/server/validation/customer';
import { Button } from '@/components/ui/button';
import { FormStatus } from '@/components/ui/form-status';
import { TextInput } from '@/components/study/form-fields';
import { useValidatedAction } from '@/components/study/use-validated-action';

export function CustomerForm() {
  const { state, formAction, pending, onSubmit, onInput, errors, message, failed } = useValidatedAction(createCustomer, customerSchema, { resetOnSuccess: true });
  return (
    <form action={formAction} onSubmit={onSubmit} onInput={onInput} noValidate className="space-y-4" aria-label="Add a customer">
      <div className="grid gap-4 sm:grid-cols-3">
        <TextInput label="Name" name="name" errors={errors.name} />
        <TextInput label="E-mail (optional)" name="email" type="email" errors={errors.email} />
        <TextInput label="Phone (optional)" name="phone" errors={errors.phone} />
      </div>
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" disabled={pending}>
          {pending ? 'Saving…' : 'Add customer'}
        </Button>
        <FormStatus state={failed ? { ok: false, error: message } : state} />
      </div>
    </form>
  );
}
