import type { ActionState } from '@/server/actions/safe-action';

/**
 * The status line under a form. Always rendered (empty when there is nothing to say) so that
 * screen readers announce changes: role=status for news, role=alert for problems.
 */
export function FormStatus({ state, showSuccess = true, className = '' }: { state: ActionState<unknown> | null; showSuccess?: boolean; className?: string }) {
  const failed = state && !state.ok;
  const warning = state?.ok && state.tone === 'warning';
  const text = !state ? '' : state.ok ? (showSuccess ? (state.message ?? '') : '') : state.error;
  return (
    <p
      role={failed ? 'alert' : 'status'}
      aria-live={failed ? 'assertive' : 'polite'}
      className={`text-sm empty:hidden ${failed ? 'text-red-700' : warning ? 'text-amber-800' : 'text-ledger-800'} ${className}`}
    >
      {text}
    </p>
  );
}
