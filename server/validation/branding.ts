import { z } from 'zod';
import { optionalEmail, optionalText } from './fields';

/** The company's contact for customers (branding page): both optional, a phone in ordinary notation. */
export const companyContactSchema = z.object({
  contactEmail: optionalEmail('Contact e-mail'),
  contactPhone: optionalText('Contact phone', 40).refine((v) => v === null || /^\+?[\d\s().\/-]{5,40}$/.test(v), 'Contact phone may hold digits, spaces, + ( ) . / - only.'),
});
