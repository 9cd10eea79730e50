'use client';

import { ActionForm } from '@/components/ui/action-form';
import { Field, SelectField, TextAreaField } from '@/components/ui/field';
import { SubmitButton } from '@/components/ui/submit-button';
import { changeAccountPlanAction, extendTrialAction } from '@/server/actions/staff-accounts';
import { changeAccountPlanSchema, extendTrialSchema } from '@/server/validation/operator';

/** Staff: extend this company's trial by some days, with the reason support was given. */
export function ExtendTrialForm({ companyId }: { companyId: number }) {
  return (
    <ActionForm action={extendTrialAction} schema={extendTrialSchema} aria-label="Extend the trial" className="space-y-3" resetOnSuccess>
      <input type="hidden" name="companyId" value={companyId} />
      <Field label="Days to add" name="days" type="number" inputMode="numeric" min={1} max={90} defaultValue="14" hint="1 to 90, added to the current end (or to today, if the trial has ended)." />
      <TextAreaField label="Reason" name="reason" hint="Goes into the audit log that staff and the company’s admins read." maxLength={500} />
      <SubmitButton pendingLabel="Extending…">Extend the trial</SubmitButton>
    </ActionForm>
  );
}

/** Staff: move this company to another plan, with a reason. */
export function ChangePlanForm({ companyId, plans, paysThroughProvider }: { companyId: number; plans: { value: string; label: string }[]; paysThroughProvider: boolean }) {
  return (
    <ActionForm action={changeAccountPlanAction} schema={changeAccountPlanSchema} aria-label="Change the plan" className="space-y-3" resetOnSuccess>
      <input type="hidden" name="companyId" value={companyId} />
      <SelectField
        label="New plan"
        name="planId"
        options={plans}
        placeholder="Choose a plan"
        hint={
          paysThroughProvider
            ? 'This company pays through the payment provider: the change goes there (prorated) and applies when the provider confirms. Only paid plans.'
            : 'No subscription at the provider: the plan applies at once. A trial plan starts a fresh trial of its length.'
        }
      />
      <TextAreaField label="Reason" name="reason" hint="Goes into the audit log that staff and the company’s admins read." maxLength={500} />
      <SubmitButton pendingLabel="Changing…">Change the plan</SubmitButton>
    </ActionForm>
  );
}
