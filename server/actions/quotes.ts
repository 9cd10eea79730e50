'use server';

import { revalidatePath } from 'next/cache';
import { safeAction } from './safe-action';
import { newQuoteSchema, quoteIdSchema, updateQuoteSchema } from '@/server/validation/quote';
import * as quotes from '@/server/quotes/create-quote';
import { quoteReference } from '@/server/quotes/status';

/** Returns the new quote's id; the form navigates to it (no redirect, so tests and scripts can call it too). */
export const createQuote = safeAction({ schema: newQuoteSchema, permission: 'quote.write' }, async (input, ctx) => {
  const { id, number } = await quotes.createQuote({ companyId: ctx.companyId, user: ctx.user }, input);
  revalidatePath('/quotes');
  return { data: { id, number }, message: `${quoteReference(number)} saved as a draft.` };
});

export const updateQuote = safeAction({ schema: updateQuoteSchema, permission: 'quote.write' }, async (input, ctx) => {
  await quotes.updateDraftQuote({ companyId: ctx.companyId, user: ctx.user }, input);
  revalidatePath(`/quotes/${input.quoteId}`);
  return { data: { id: input.quoteId }, message: 'Draft saved.' };
});

export const deleteQuote = safeAction({ schema: quoteIdSchema, permission: 'quote.write' }, async (input, ctx) => {
  const { number } = await quotes.deleteQuote({ companyId: ctx.companyId, user: ctx.user }, input.quoteId);
  revalidatePath('/quotes');
  return { message: `Draft ${quoteReference(number)} deleted.` };
});
