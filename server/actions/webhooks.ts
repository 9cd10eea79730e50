'use server';

import { revalidatePath } from 'next/cache';
import { safeAction } from './safe-action';
import { createWebhookEndpoint as create, removeWebhookEndpoint as remove, sendTestWebhook as sendTest } from '@/server/webhooks/endpoint-admin';
import { getRequestMeta } from '@/server/auth/request-meta';
import { createWebhookSchema, webhookIdSchema } from '@/server/validation/webhook';

const WEBHOOKS_PAGE = '/settings/webhooks';

/** The signing secret comes back in `data.signingSecret` this once, for the page to show; it is stored encrypted. */
export const createWebhookEndpoint = safeAction({ schema: createWebhookSchema, permission: 'webhook.manage' }, async (input, ctx) => {
  const { secret } = await create(ctx, input, await getRequestMeta());
  revalidatePath(WEBHOOKS_PAGE);
  return { data: { signingSecret: secret, description: input.description }, message: `Endpoint “${input.description}” registered. Copy its signing secret now: it is shown only this once.` };
});

export const removeWebhookEndpoint = safeAction({ schema: webhookIdSchema, permission: 'webhook.manage' }, async (input, ctx) => {
  const { description } = await remove(ctx, input.id, await getRequestMeta());
  revalidatePath(WEBHOOKS_PAGE);
  return { message: `Endpoint “${description}” removed with its delivery log.` };
});

export const sendTestWebhook = safeAction({ schema: webhookIdSchema, permission: 'webhook.manage' }, async (input, ctx) => {
  const { description, run } = await sendTest(ctx, input.id);
  revalidatePath(WEBHOOKS_PAGE);
  if (run.delivered > 0) return { message: `Test event delivered to “${description}”.` };
  return { message: `Test event queued for “${description}”; the first attempt did not succeed — see the delivery log. It will be retried.`, tone: 'warning' };
});
