// Pure (no server-only): the audit page's filter, the CSV route and the validation schema read it.

/** Kinds an admin filters the log by: each is a set of action prefixes. */
export const AUDIT_KINDS = {
  team: { label: 'Team and invitations', prefixes: ['company.', 'sign_up.', 'member.', 'invitation.'] },
  security: { label: 'Sign-ins and passwords', prefixes: ['session.', 'password.'] },
  api_keys: { label: 'API keys', prefixes: ['api_key.'] },
  billing: { label: 'Plan and billing', prefixes: ['billing.', 'staff.'] },
  catalogue: { label: 'Catalogue, prices and services', prefixes: ['catalogue.', 'service.'] },
  uploads: { label: 'Uploads', prefixes: ['upload.'] },
  studies: { label: 'Studies archived or restored', prefixes: ['study.'] },
  quotes: { label: 'Customer links and decisions', prefixes: ['share_link.', 'quote.'] },
  staff: { label: 'FadeLedger staff actions', prefixes: ['staff.'] },
} as const;
export type AuditKind = keyof typeof AUDIT_KINDS;
