'use server';

import { z } from 'zod';
import { revalidatePath } from 'next/cache';
import { safeAction } from './safe-action';
import { removeLogo as remove, uploadLogo as upload } from '@/server/quotes/branding';
import { LOGO_MAX_BYTES } from '@/server/quotes/logo-image';
import { companyContactSchema } from '@/server/validation/branding';
import { setCompanyContact } from '@/db/queries/branding';

const BRANDING_PAGE = '/settings/branding';

const logoSchema = z.object({
  logo: z
    .custom<Blob>((v) => typeof Blob !== 'undefined' && v instanceof Blob, 'Choose a PNG or JPEG file.')
    .refine((f) => f.size > 0, 'Choose a PNG or JPEG file.')
    // Checked again on the bytes; this stops a huge upload before it is read into memory.
    .refine((f) => f.size <= LOGO_MAX_BYTES, `The logo must be at most ${LOGO_MAX_BYTES / 1024} KiB.`),
});

// Branding is an admin matter (product.md); the plan decides separately whether quotes show it.
export const uploadLogo = safeAction({ schema: logoSchema, permission: 'branding.manage' }, async (input, ctx) => {
  const image = await upload(ctx.companyId, Buffer.from(await input.logo.arrayBuffer()));
  revalidatePath(BRANDING_PAGE);
  return { message: `Logo saved (${image.width} × ${image.height} px). It appears on quote PDFs and customer pages.` };
});

export const removeLogo = safeAction({ schema: z.object({}), permission: 'branding.manage' }, async (_input, ctx) => {
  await remove(ctx.companyId);
  revalidatePath(BRANDING_PAGE);
  return { message: 'Logo removed.' };
});

/** How customers reach the company: on the customer's page and PDF, Reply-To of quote e-mails, told of decisions. */
export const saveCompanyContact = safeAction({ schema: companyContactSchema, permission: 'branding.manage' }, async (input, ctx) => {
  await setCompanyContact(ctx.companyId, { email: input.contactEmail, phone: input.contactPhone });
  revalidatePath(BRANDING_PAGE);
  return { message: input.contactEmail || input.contactPhone ? 'Contact saved. Customers see it on their quote.' : 'Contact cleared: customers see the sender of each quote instead.' };
});
