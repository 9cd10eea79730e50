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
  if (action === 'session.signed_out_everywhere' && typeof detail.sessions === 'number') return `${detail.sessions} ${detail.sessions === 1 ? 'session' : 'sessions'}`;
  return '';
}
