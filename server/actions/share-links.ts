'use server';

import { revalidatePath } from 'next/cache';
import { safeAction } from './safe-action';
import { createShareLinkSchema, emailQuoteSchema, revokeShareLinkSchema } from '@/server/validation/quote';
import * as share from '@/server/quotes/share';

/** The URL carries the raw token and is returned this once; only its digest is stored. */
export const createShareLink = safeAction({ schema: createShareLinkSchema, permission: 'quote.share' }, async (input, ctx) => {
  const link = await share.createShareLink({ companyId: ctx.companyId, user: ctx.user }, input.quoteId, input.expiresInDays);
  revalidatePath(`/quotes/${input.quoteId}`);
  return { data: { linkId: link.linkId, url: link.url, expiresAt: link.expiresAt.toISOString() }, message: 'Link created. Copy it now: for safety it is shown only once.' };
});

export const revokeShareLink = safeAction({ schema: revokeShareLinkSchema, permission: 'quote.share' }, async (input, ctx) => {
  await share.revokeLink({ companyId: ctx.companyId, user: ctx.user }, input.quoteId, input.linkId);
  revalidatePath(`/quotes/${input.quoteId}`);
  return { message: 'Link revoked: it no longer opens the quote.' };
});

export const emailQuote = safeAction({ schema: emailQuoteSchema, permission: 'quote.share' }, async (input, ctx) => {
  const sent = await share.emailQuote({ companyId: ctx.companyId, companyName: ctx.company.name, user: ctx.user }, input);
  revalidatePath(`/quotes/${input.quoteId}`);
  return { data: { to: sent.to, expiresAt: sent.expiresAt.toISOString() }, message: `Quote e-mailed to ${sent.to} with a new link.` };
});
