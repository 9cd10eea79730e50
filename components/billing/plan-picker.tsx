'use client';

import { useActionState } from 'react';
import type { ActionState } from '@/server/actions/safe-action';
import { SubmitButton } from '@/components/ui/submit-button';
import { FormStatus } from '@/components/ui/form-status';
import { changePlanAction, startCheckoutAction } from '@/server/actions/billing';

export type PickablePlan = {
  id: number;
  name: string;
  description: string | null;
  priceLabel: string;
  kind: 'free' | 'paid';
  seats: number;
  studiesPerMonth: number;
  activeLinks: number;
  uploadsPerMonth: number;
  apiAccess: boolean;
  quoteBranding: boolean;
  /** What choosing it does now. */
  choice: 'current' | 'checkout' | 'change' | 'pending' | 'via-portal' | 'scheduled' | 'none';
};

function PlanChoice({ plan }: { plan: PickablePlan }) {
  const action = plan.choice === 'change' ? changePlanAction : startCheckoutAction;
  const [state, formAction] = useActionState<ActionState | null, FormData>(action, null);
  let control: React.ReactNode;
  switch (plan.choice) {
    case 'current':
      control = <p className="rounded border border-ledger-300 bg-ledger-50 px-3 py-2 text-center text-sm font-medium text-ledger-800">Your plan</p>;
      break;
    case 'pending':
      control = <p className="rounded border border-stone-300 px-3 py-2 text-center text-sm text-stone-700">Change requested…</p>;
      break;
    case 'via-portal':
      control = <p className="text-center text-xs text-stone-600">Cancel your subscription in the billing portal; at the end of the paid period you move to {plan.name}.</p>;
      break;
    case 'scheduled':
      control = <p className="text-center text-xs text-stone-600">Your company moves to {plan.name} when the paid period ends.</p>;
      break;
    case 'none':
      control = null;
      break;
    default:
      control = (
        <form action={formAction}>
          <input type="hidden" name="planId" value={plan.id} />
          <SubmitButton className="w-full" pendingLabel={plan.choice === 'change' ? 'Sending…' : 'Opening checkout…'}>
            {plan.choice === 'change' ? `Switch to ${plan.name}` : `Choose ${plan.name}`}
          </SubmitButton>
        </form>
      );
  }
  return (
    <li className={`flex flex-col rounded-md border bg-white p-4 ${plan.choice === 'current' ? 'border-ledger-500 ring-1 ring-ledger-500' : 'border-stone-200'}`} aria-label={`${plan.name} plan`}>
      <h3 className="text-base font-semibold text-stone-900">{plan.name}</h3>
      <p className="mt-1 font-mono text-lg text-stone-900">{plan.priceLabel}</p>
      {plan.description && <p className="mt-1 text-sm text-stone-600">{plan.description}</p>}
      <dl className="mt-3 grid grid-cols-[1fr_auto] gap-x-3 gap-y-1 text-sm">
        <dt className="text-stone-600">Seats</dt><dd className="num">{plan.seats.toLocaleString('en-US')}</dd>
        <dt className="text-stone-600">Studies / month</dt><dd className="num">{plan.studiesPerMonth.toLocaleString('en-US')}</dd>
        <dt className="text-stone-600">Active links</dt><dd className="num">{plan.activeLinks.toLocaleString('en-US')}</dd>
        <dt className="text-stone-600">Uploads / month</dt><dd className="num">{plan.uploadsPerMonth.toLocaleString('en-US')}</dd>
        <dt className="text-stone-600">Trade-off API</dt><dd className="text-right">{plan.apiAccess ? 'Yes' : '—'}</dd>
        <dt className="text-stone-600">Quote branding</dt><dd className="text-right">{plan.quoteBranding ? 'Yes' : '—'}</dd>
      </dl>
      <div className="mt-auto pt-4">{control}</div>
      <FormStatus state={state} className="mt-2" />
    </li>
  );
}

/** The public plans as cards; the button checks out, or changes the running subscription. */
export function PlanPicker({ plans }: { plans: PickablePlan[] }) {
  return (
    <ul className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
      {plans.map((p) => <PlanChoice key={p.id} plan={p} />)}
    </ul>
  );
}
