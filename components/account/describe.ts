import type { AuditAction } from '@/db/queries/audit';

/** Plain-English names for audit events, shown in the audit log and the security page. */
export const AUDIT_LABELS: Record<AuditAction, string> = {
  'company.created': 'Created the company account',
  'sign_up.requested': 'Sign-up requested for',
  'sign_up.confirmed': 'Confirmed their address and finished signing up',
  'member.invited': 'Invited',
  'invitation.resent': 'Resent the invitation to',
  'invitation.revoked': 'Withdrew the invitation to',
  'invitation.accepted': 'Accepted an invitation',
  'member.role_changed': 'Changed the role of',
  'member.removed': 'Removed from the team',
  'member.left': 'Left the company',
  'session.signed_in': 'Signed in',
  'session.sign_in_failed': 'Failed sign-in (wrong password) for',
  'session.sign_in_throttled': 'Sign-in refused (too many attempts) for',
  'session.unlock_link_sent': 'Link to sign in past the limits e-mailed to',
  'session.unlocked': 'Let a browser sign in with the e-mailed link for',
  'session.signed_out': 'Signed out',
  'session.revoked': 'Signed out another device',
  'session.signed_out_everywhere': 'Signed out everywhere',
  'password.reset_requested': 'Password reset link requested for',
  'password.reset': 'Chose a new password through a reset link',
  'password.changed': 'Changed their password',
  'api_key.created': 'Created the API key',
  'api_key.revoked': 'Revoked the API key',
  'webhook.created': 'Registered the webhook endpoint',
  'webhook.removed': 'Removed the webhook endpoint',
  'billing.checkout_started': 'Opened a checkout for the plan',
  'billing.plan_change_requested': 'Asked the payment provider to move the subscription to',
  'billing.plan_changed': 'Plan changed to',
  'billing.subscription_status': 'Subscription status changed',
  'billing.payment_failed': 'A payment attempt failed',
  'catalogue.dish_created': 'Added the dish',
  'catalogue.dish_updated': 'Edited the dish',
  'catalogue.dish_deleted': 'Removed the dish',
  'service.created': 'Added the service profile',
  'service.updated': 'Edited the service profile',
  'service.deleted': 'Deleted the service profile',
  'upload.confirmed': 'Saved the uploaded file',
  'study.archived': 'Archived the study',
  'study.restored': 'Restored the study',
  'share_link.created': 'Created a customer link for',
  'share_link.revoked': 'Revoked a customer link for',
  'quote.accepted': 'Accepted',
  'quote.declined': 'Declined',
  'staff.trial_extended': 'FadeLedger staff extended the trial',
  'staff.plan_changed': 'FadeLedger staff changed the plan to',
  'staff.plan_change_requested': 'FadeLedger staff asked the payment provider to move the subscription to',
};

/** A short, human description of a browser from its User-Agent (no library: only the big names). */
export function describeDevice(userAgent: string | null): string {
  if (!userAgent) return 'Unknown device';
  const ua = userAgent;
  const browser = /Edg\//.test(ua) ? 'Edge' : /Firefox\//.test(ua) ? 'Firefox' : /Chrome\//.test(ua) ? 'Chrome' : /Safari\//.test(ua) ? 'Safari' : /curl|node|undici/i.test(ua) ? 'Script' : 'Browser';
  const os = /iPhone|iPad/.test(ua) ? 'iOS' : /Android/.test(ua) ? 'Android' : /Windows/.test(ua) ? 'Windows' : /Mac OS X|Macintosh/.test(ua) ? 'macOS' : /Linux/.test(ua) ? 'Linux' : '';
  return os ? `${browser} on ${os}` : browser;
}

const fmt = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit', timeZone: 'UTC', hour12: false });
export const formatWhen = (d: Date) => `${fmt.format(d)} UTC`;

/** Extra words for some events (role changes name both roles). */
export function describeDetail(action: AuditAction, detail: Record<string, unknown> | null): string {
  if (!detail) return '';
  if (action === 'member.role_changed' && detail.fromLabel && detail.toLabel) return `${detail.fromLabel} → ${detail.toLabel}`;
  if ((action === 'member.invited' || action === 'invitation.accepted') && typeof detail.role === 'string') return `as ${detail.role}`;
  if (action === 'company.created' && typeof detail.plan === 'string') return `plan ${detail.plan}`;
  if (typeof detail.reason === 'string' && action.startsWith('staff.')) {
    const until = typeof detail.trialEndsAt === 'string' ? `until ${detail.trialEndsAt.slice(0, 10)}, ` : '';
    return `${until}reason: ${detail.reason}`;
  }
  if (action === 'catalogue.dish_updated' && detail.hardwarePrice && typeof detail.hardwarePrice === 'object') {
    const p = detail.hardwarePrice as { from?: string; to?: string };
    return `hardware price ${p.from} → ${p.to}`;
  }
  if (action === 'billing.subscription_status' && typeof detail.to === 'string') return `${detail.from ?? 'new'} → ${detail.to}`;
  if (action === 'upload.confirmed' && typeof detail.kind === 'string') return detail.kind;
  if ((action === 'quote.accepted' || action === 'quote.declined') && typeof detail.via === 'string') return `through ${detail.via}`;
  if (action === 'session.signed_out_everywhere' && typeof detail.sessions === 'number') return `${detail.sessions} ${detail.sessions === 1 ? 'session' : 'sessions'}`;
  return '';
}
