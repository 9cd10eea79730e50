'use server';

import { safeAction } from './safe-action';
import { customerDecisionSchema } from '@/server/validation/quote';
import { decideSharedQuote } from '@/server/quotes/shared-quote';
import { getRequestMeta } from '@/server/auth/request-meta';

/**
 * The customer's accept/decline on the comparison page: no account, so access is 'public'; the
 * unguessable link token is the credential, checked (and locked) inside decideSharedQuote.
 */
export const decideQuote = safeAction({ schema: customerDecisionSchema, permission: 'public' }, async (input) => {
  const { status } = await decideSharedQuote({ token: input.token, decision: input.decision, name: input.name, comment: input.comment }, await getRequestMeta());
  return {
    data: { status },
    message: status === 'accepted' ? `Thank you, ${input.name}. Your acceptance is recorded and the team has been told.` : `Thank you, ${input.name}. We have recorded that you declined.`,
  };
});
