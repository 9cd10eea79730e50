/** "3 Jan 2027" in UTC: billing dates are the provider's, not the viewer's clock. */
export function billingDate(d: Date | null | undefined): string {
  if (!d) return '—';
  return d.toLocaleDateString('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });
}

export function count(n: number): string {
  return n.toLocaleString('en-US');
}

export const STATUS_LABELS: Record<string, string> = {
  trialing: 'Trial',
  active: 'Active',
  past_due: 'Payment overdue',
  unpaid: 'Unpaid',
  paused: 'Paused',
  incomplete: 'Awaiting first payment',
  incomplete_expired: 'Checkout expired',
  canceled: 'Ended',
};
