'use server';

import { revalidatePath } from 'next/cache';
import { safeAction } from './safe-action';
import { copyShareLinkSchema, createShareLinkSchema, emailQuoteSchema, revokeShareLinkSchema } from '@/server/validation/quote';
import * as share from '@/server/quotes/share';

/** The URL carries the raw token; the database keeps its digest (look-up) and a sealed copy (copy again). */
export const createShareLink = safeAction({ schema: createShareLinkSchema, permission: 'quote.share' }, async (input, ctx) => {
  const link = await share.createShareLink({ companyId: ctx.companyId, user: ctx.user }, input.quoteId, input.expiresInDays);
  revalidatePath(`/quotes/${input.quoteId}`);
  return { data: { linkId: link.linkId, url: link.url, expiresAt: link.expiresAt.toISOString() }, message: 'Link created.' };
});

/** An active link's URL again, for whoever in the team may share (not only the person who made it). */
export const copyShareLink = safeAction({ schema: copyShareLinkSchema, permission: 'quote.share' }, async (input, ctx) => {
  const link = await share.linkUrlForTeam({ companyId: ctx.companyId, user: ctx.user }, input.quoteId, input.linkId);
  return { data: { linkId: input.linkId, url: link.url, expiresAt: link.expiresAt.toISOString() }, message: `Link ${input.linkId} is ready to copy.` };
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
