import * as webhooks from '@/server/actions/webhooks';
import { models } from '@/db/models';
import { QueryTypes } from 'sequelize';
import { actionCase, type CrossCompanyCase, type MatrixCase } from '../support/action-matrix';
import { suffix } from '../support/factories';

/** Outbound webhook endpoints (settings/webhooks) in the permission matrix. */
const ADMIN = ['admin'] as const;

/**
 * An endpoint row of the company, written directly (the actions are the rows under test). Its
 * address is on the documentation range (RFC 5737), refused before any connection, so a test
 * event sent here never leaves the machine.
 */
async function endpointIn(companyId: number): Promise<{ id: number }> {
  const [id] = await models().sequelize.query(
    `INSERT INTO webhook_endpoints (company_id, url, description, events, secret_ciphertext, secret_hint, created_at, updated_at)
     VALUES (:companyId, 'https://192.0.2.10/hook', :description, 'study.created', 'v1.x.y.z', 'flwh_xxxx', NOW(3), NOW(3))`,
    { replacements: { companyId, description: `Matrix hook ${suffix()}` }, type: QueryTypes.INSERT },
  );
  return { id: Number(id) };
}

async function endpointExists(id: number): Promise<boolean> {
  const rows = await models().sequelize.query('SELECT id FROM webhook_endpoints WHERE id = :id', { replacements: { id }, type: QueryTypes.SELECT });
  return rows.length === 1;
}

async function deliveriesOf(id: number): Promise<number> {
  const [row] = await models().sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM webhook_deliveries WHERE endpoint_id = :id', { replacements: { id }, type: QueryTypes.SELECT });
  return Number(row.n);
}

export const cases: MatrixCase<never>[] = [
  // The matrix company's plan has no API access: an admin passes the guard and meets plan_limit.
  actionCase({ file: 'webhooks', exportName: 'createWebhookEndpoint', action: webhooks.createWebhookEndpoint, access: 'webhook.manage', allow: ADMIN, input: () => ({ url: 'https://hooks.example.com/fadeledger', description: `Matrix ${suffix()}`, events: ['study.created'] }) }),
  actionCase({ file: 'webhooks', exportName: 'removeWebhookEndpoint', action: webhooks.removeWebhookEndpoint, access: 'webhook.manage', allow: ADMIN, prepare: (w) => endpointIn(w.company.id), input: (_w, e: { id: number }) => ({ id: String(e.id) }) }),
  actionCase({ file: 'webhooks', exportName: 'sendTestWebhook', action: webhooks.sendTestWebhook, access: 'webhook.manage', allow: ADMIN, prepare: (w) => endpointIn(w.company.id), input: (_w, e: { id: number }) => ({ id: String(e.id) }) }),
] as MatrixCase<never>[];

export const crossCompany: CrossCompanyCase<never>[] = [
  {
    name: 'action webhooks#removeWebhookEndpoint',
    prepare: (w) => endpointIn(w.otherCompany.id),
    run: async (_w, e: { id: number }) => (await import('../support/next-request')).callAction(webhooks.removeWebhookEndpoint as never, { id: String(e.id) }),
    unchanged: async (_w, e: { id: number }) => {
      if (!(await endpointExists(e.id))) throw new Error(`webhook endpoint ${e.id} of the other company was removed`);
    },
  },
  {
    name: 'action webhooks#sendTestWebhook',
    prepare: (w) => endpointIn(w.otherCompany.id),
    run: async (_w, e: { id: number }) => (await import('../support/next-request')).callAction(webhooks.sendTestWebhook as never, { id: String(e.id) }),
    unchanged: async (_w, e: { id: number }) => {
      if ((await deliveriesOf(e.id)) !== 0) throw new Error(`a test event was queued for endpoint ${e.id} of the other company`);
    },
  },
] as CrossCompanyCase<never>[];
