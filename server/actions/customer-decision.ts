'use server';

import { safeAction } from './safe-action';
import { customerDecisionSchema } from '@/server/validation/quote';
import { decideSharedQuote } from '@/server/quotes/shared-quote';
import { getRequestMeta } from '@/server/auth/request-meta';
import { endSentence } from '@/server/quotes/sentence';

/**
 * The customer's accept/decline on the comparison page: no account, so access is 'public'; the
 * unguessable link token is the credential, checked (and locked) inside decideSharedQuote.
 */
export const decideQuote = safeAction({ schema: customerDecisionSchema, permission: 'public' }, async (input) => {
  const { status } = await decideSharedQuote({ token: input.token, decision: input.decision, name: input.name, comment: input.comment, receiptEmail: input.receiptEmail }, await getRequestMeta());
  const receipt = input.receiptEmail ? ` A receipt is on its way to ${input.receiptEmail}.` : '';
  return {
    data: { status },
    message: `${endSentence(`Thank you, ${input.name}`)} ${status === 'accepted' ? 'Your acceptance is recorded and the team has been told.' : 'We have recorded that you declined.'}${receipt}`,
  };
});
