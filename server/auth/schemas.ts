import { z } from 'zod';
import { COMPANY_ROLES } from '@/db/models/membership';

/**
 * The zod schemas of the account forms, shared by the forms, the actions and any route handler.
 * Messages are plain English and shown beside the field.
 */
export const emailField = z
  .string({ error: 'Enter an e-mail address.' })
  .trim()
  .toLowerCase()
  .max(254, { error: 'That address is too long.' })
  .pipe(z.email({ error: 'Enter an e-mail address such as name@company.com.' }));

// Length is what matters (common practice, no source: NIST SP 800-63B asks 8+, from memory);
// 200 is a ceiling so nobody can make argon2 hash a megabyte.
export const newPasswordField = z
  .string({ error: 'Choose a password.' })
  .min(10, { error: 'Use at least 10 characters.' })
  .max(200, { error: 'Use at most 200 characters.' });

const personName = z.string({ error: 'Enter your name.' }).trim().min(1, { error: 'Enter your name.' }).max(120, { error: 'Use at most 120 characters.' });

export const roleField = z.enum(COMPANY_ROLES, { error: 'Choose a role.' });

export const signUpSchema = z.object({
  name: personName,
  companyName: z.string({ error: 'Enter the company name.' }).trim().min(2, { error: 'Enter the company name.' }).max(120, { error: 'Use at most 120 characters.' }),
  email: emailField,
  password: newPasswordField,
});

export const signInSchema = z.object({
  email: emailField,
  password: z.string({ error: 'Enter your password.' }).min(1, { error: 'Enter your password.' }).max(200, { error: 'That password is too long.' }),
  next: z.string().optional(),
});

export const requestResetSchema = z.object({ email: emailField });

const tokenField = z.string({ error: 'This link is not complete.' }).regex(/^[A-Za-z0-9_-]{20,128}$/, { error: 'This link is not complete.' });

export const resetPasswordSchema = z
  .object({ token: tokenField, password: newPasswordField, confirm: z.string() })
  .refine((v) => v.password === v.confirm, { path: ['confirm'], error: 'The two passwords differ.' });

export const changePasswordSchema = z
  .object({ current: z.string().min(1, { error: 'Enter your current password.' }).max(200), password: newPasswordField, confirm: z.string() })
  .refine((v) => v.password === v.confirm, { path: ['confirm'], error: 'The two passwords differ.' });

export const inviteSchema = z.object({ email: emailField, role: roleField });

const id = z.coerce.number({ error: 'Missing id.' }).int().positive();
export const invitationIdSchema = z.object({ invitationId: id });
export const memberIdSchema = z.object({ membershipId: id });
export const changeRoleSchema = z.object({ membershipId: id, role: roleField });

export const signUpConfirmSchema = z.object({ token: tokenField });
export const acceptNewAccountSchema = z.object({ token: tokenField, name: personName, password: newPasswordField });
export const acceptExistingAccountSchema = z.object({ token: tokenField, password: z.string().max(200).optional() });

export const sessionDigestSchema = z.object({ session: z.string().regex(/^[a-f0-9]{64}$/, { error: 'Unknown session.' }) });
export const switchCompanySchema = z.object({ companyId: id });

/** Kept here so forms and actions import every account-input rule from one place. */
export { safeNextPath } from './next-path';
