import 'server-only';
import { models } from '@/db/models';
import { countWebhookEndpoints, deleteWebhookEndpoint, findWebhookEndpoint, insertWebhookEndpoint } from '@/db/queries/webhooks';
import { lockCompanyRow } from '@/db/queries/company-lock';
import { assertWithinPlan } from '@/server/plan-limit';
import { audit } from '@/server/auth/audit';
import type { CompanyAuthContext } from '@/server/auth/guards';
import type { RequestMeta } from '@/server/auth/request-meta';
import { getEnv } from '@/server/env';
import { ConflictError, InvalidInputError, NotFoundError } from '@/server/errors';
import type { CreateWebhookInput } from '@/server/validation/webhook';
import { deliverDueWebhooks, type DeliveryRun } from './deliverer';
import { enqueueWebhookEvent } from './outbox';
import { urlRefusal } from './safe-post';
import { encryptSecret, newWebhookSecret, secretHint } from './secret';

/** Endpoints a company may register: one per receiving system, few enough to review. */
export const MAX_WEBHOOK_ENDPOINTS = 10;

const actorOf = (ctx: CompanyAuthContext) => ({ id: ctx.user.id, name: ctx.user.name, email: ctx.user.email });

/**
 * Registers an endpoint and returns its signing secret — the only time it leaves the server
 * unencrypted. Like API keys, webhooks are part of a plan's API access (checked under the company
 * row lock together with the endpoint count).
 */
export async function createWebhookEndpoint(ctx: CompanyAuthContext, input: CreateWebhookInput, meta: RequestMeta): Promise<{ id: number; secret: string }> {
  const env = getEnv();
  const refusal = urlRefusal(input.url, env.WEBHOOKS_ALLOW_PRIVATE_TARGETS);
  if (refusal) throw new InvalidInputError(refusal, { url: [refusal] });
  if (!env.WEBHOOK_SECRET_KEY) throw new ConflictError('Webhooks are not set up on this server (WEBHOOK_SECRET_KEY is missing). Ask whoever runs FadeLedger for you.');
  const secret = newWebhookSecret();
  const url = new URL(input.url).toString();
  const { sequelize } = models();
  const id = await sequelize.transaction(async (t) => {
    await assertWithinPlan(await lockCompanyRow(ctx.companyId, t), 'apiAccess');
    if ((await countWebhookEndpoints(ctx.companyId, t)) >= MAX_WEBHOOK_ENDPOINTS) {
      throw new ConflictError(`A company can register ${MAX_WEBHOOK_ENDPOINTS} webhook endpoints; remove one you no longer use first.`);
    }
    const created = await insertWebhookEndpoint(
      { companyId: ctx.companyId, url, description: input.description, events: input.events.join(','), secretCiphertext: encryptSecret(secret, env.WEBHOOK_SECRET_KEY!), secretHint: secretHint(secret), createdByUserId: ctx.user.id },
      t,
    );
    await audit({ companyId: ctx.companyId, actor: actorOf(ctx), action: 'webhook.created', target: `${input.description} (${new URL(url).host})`, detail: { events: input.events } }, meta, t);
    return created;
  });
  return { id, secret };
}

/** Removes the company's endpoint and its delivery log; queued deliveries are dropped with it. Another company's id is a 404. */
export async function removeWebhookEndpoint(ctx: CompanyAuthContext, id: number, meta: RequestMeta): Promise<{ description: string }> {
  const { sequelize } = models();
  return sequelize.transaction(async (t) => {
    const endpoint = await findWebhookEndpoint(ctx.companyId, id, t);
    if (!endpoint) throw new NotFoundError('That webhook endpoint');
    await deleteWebhookEndpoint(ctx.companyId, id, t);
    await audit({ companyId: ctx.companyId, actor: actorOf(ctx), action: 'webhook.removed', target: `${endpoint.description} (${new URL(endpoint.url).host})` }, meta, t);
    return { description: endpoint.description };
  });
}

/**
 * "Send test event": queues a `webhook.test` event for this endpoint only and makes one delivery
 * pass for it at once, so the admin sees the outcome in the log without waiting for the timer.
 * A failure is retried like any delivery.
 */
export async function sendTestWebhook(ctx: CompanyAuthContext, id: number): Promise<{ description: string; run: DeliveryRun }> {
  const { sequelize } = models();
  const endpoint = await sequelize.transaction(async (t) => {
    const found = await findWebhookEndpoint(ctx.companyId, id, t);
    if (!found) throw new NotFoundError('That webhook endpoint');
    await enqueueWebhookEvent(ctx.companyId, 'webhook.test', { message: 'A test event from FadeLedger settings.', endpoint: { id: found.id, description: found.description } }, t, { onlyEndpointId: found.id });
    return found;
  });
  const run = await deliverDueWebhooks({ endpointId: endpoint.id, limit: 5 });
  return { description: endpoint.description, run };
}
