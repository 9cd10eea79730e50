import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { models } from '@/db/models';

export type WebhookEndpointRow = {
  id: number;
  url: string;
  description: string;
  events: string;
  secretHint: string;
  createdAt: Date;
  createdByName: string | null;
};

export type WebhookDeliveryRow = {
  id: number;
  endpointId: number;
  eventId: string;
  eventType: string;
  status: 'pending' | 'delivered' | 'failed';
  attemptCount: number;
  nextAttemptAt: Date | null;
  lastAttemptAt: Date | null;
  lastResponseCode: number | null;
  lastError: string | null;
  deliveredAt: Date | null;
  createdAt: Date;
};

const q = () => models().sequelize;

export async function listWebhookEndpoints(companyId: number): Promise<WebhookEndpointRow[]> {
  const rows = await q().query<{ id: number; url: string; description: string; events: string; secret_hint: string; created_at: Date; created_by_name: string | null }>(
    `SELECT e.id, e.url, e.description, e.events, e.secret_hint, e.created_at, u.name AS created_by_name
       FROM webhook_endpoints e LEFT JOIN users u ON u.id = e.created_by_user_id
      WHERE e.company_id = :companyId ORDER BY e.id DESC`,
    { replacements: { companyId }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({ id: r.id, url: r.url, description: r.description, events: r.events, secretHint: r.secret_hint, createdAt: r.created_at, createdByName: r.created_by_name }));
}

export async function countWebhookEndpoints(companyId: number, t: Transaction): Promise<number> {
  const [row] = await q().query<{ n: number }>('SELECT COUNT(*) AS n FROM webhook_endpoints WHERE company_id = :companyId LOCK IN SHARE MODE', {
    replacements: { companyId }, type: QueryTypes.SELECT, transaction: t,
  });
  return Number(row.n);
}

export async function insertWebhookEndpoint(
  row: { companyId: number; url: string; description: string; events: string; secretCiphertext: string; secretHint: string; createdByUserId: string },
  t: Transaction,
): Promise<number> {
  const [id] = await q().query(
    `INSERT INTO webhook_endpoints (company_id, url, description, events, secret_ciphertext, secret_hint, created_by_user_id, created_at, updated_at)
     VALUES (:companyId, :url, :description, :events, :secretCiphertext, :secretHint, :createdByUserId, NOW(3), NOW(3))`,
    { replacements: row, type: QueryTypes.INSERT, transaction: t },
  );
  return Number(id);
}

/** The company's endpoint (locked inside a transaction), or null — also for another company's id. */
export async function findWebhookEndpoint(companyId: number, id: number, t?: Transaction): Promise<(WebhookEndpointRow & { secretCiphertext: string }) | null> {
  const [r] = await q().query<{ id: number; url: string; description: string; events: string; secret_hint: string; secret_ciphertext: string; created_at: Date }>(
    `SELECT id, url, description, events, secret_hint, secret_ciphertext, created_at FROM webhook_endpoints
      WHERE id = :id AND company_id = :companyId${t ? ' FOR UPDATE' : ''}`,
    { replacements: { id, companyId }, type: QueryTypes.SELECT, transaction: t },
  );
  return r ? { id: r.id, url: r.url, description: r.description, events: r.events, secretHint: r.secret_hint, secretCiphertext: r.secret_ciphertext, createdAt: r.created_at, createdByName: null } : null;
}

export async function deleteWebhookEndpoint(companyId: number, id: number, t: Transaction): Promise<void> {
  await q().query('DELETE FROM webhook_endpoints WHERE id = :id AND company_id = :companyId', { replacements: { id, companyId }, type: QueryTypes.DELETE, transaction: t });
}

/**
 * The outbox write: one pending delivery of the event for every endpoint of the company that wants
 * it (or for one endpoint: test events), in the caller's transaction. Returns how many were queued.
 */
export async function insertOutboxRows(
  event: { companyId: number; eventId: string; eventType: string; body: string; onlyEndpointId?: number },
  t: Transaction,
): Promise<number> {
  const only = event.onlyEndpointId !== undefined;
  const [, affected] = await q().query(
    `INSERT INTO webhook_deliveries (company_id, endpoint_id, event_id, event_type, body, status, attempt_count, next_attempt_at, created_at, updated_at)
     SELECT e.company_id, e.id, :eventId, :eventType, :body, 'pending', 0, NOW(3), NOW(3), NOW(3)
       FROM webhook_endpoints e
      WHERE e.company_id = :companyId AND ${only ? 'e.id = :onlyEndpointId' : 'FIND_IN_SET(:eventType, e.events) > 0'}`,
    { replacements: { ...event, onlyEndpointId: event.onlyEndpointId ?? null }, type: QueryTypes.INSERT, transaction: t },
  );
  return Number(affected ?? 0);
}

export type ClaimedDelivery = { id: number; companyId: number; endpointId: number; eventId: string; eventType: string; body: string; attemptCount: number; url: string; secretCiphertext: string };

/**
 * Claims up to `limit` due deliveries for this process: locks them with FOR UPDATE SKIP LOCKED (a
 * row another deliverer holds is skipped, not waited for), then counts the attempt and moves
 * next_attempt_at to the end of the lease, all before commit. A process that dies mid-delivery
 * leaves the row due again when the lease ends; nothing about the claim lives in the process.
 */
export async function claimDueDeliveries(opts: { now: Date; leaseMs: number; limit: number; endpointId?: number }): Promise<ClaimedDelivery[]> {
  const sequelize = q();
  return sequelize.transaction(async (t) => {
    // Only the delivery rows are locked (MariaDB locks every joined table's rows, so no join here).
    const rows = await sequelize.query<{ id: number; company_id: number; endpoint_id: number; event_id: string; event_type: string; body: string; attempt_count: number }>(
      `SELECT id, company_id, endpoint_id, event_id, event_type, body, attempt_count
         FROM webhook_deliveries
        WHERE status = 'pending' AND next_attempt_at <= :now ${opts.endpointId !== undefined ? 'AND endpoint_id = :endpointId' : ''}
        ORDER BY next_attempt_at, id
        LIMIT :limit
        FOR UPDATE SKIP LOCKED`,
      { replacements: { now: opts.now, limit: opts.limit, endpointId: opts.endpointId ?? null }, type: QueryTypes.SELECT, transaction: t },
    );
    if (rows.length === 0) return [];
    await sequelize.query(
      `UPDATE webhook_deliveries SET attempt_count = attempt_count + 1, next_attempt_at = :leaseUntil, last_attempt_at = :now, updated_at = NOW(3)
        WHERE id IN (:ids)`,
      { replacements: { ids: rows.map((r) => r.id), leaseUntil: new Date(opts.now.getTime() + opts.leaseMs), now: opts.now }, type: QueryTypes.UPDATE, transaction: t },
    );
    // A delivery row cannot outlive its endpoint (ON DELETE CASCADE), so every claimed row has one.
    const endpoints = await sequelize.query<{ id: number; url: string; secret_ciphertext: string }>('SELECT id, url, secret_ciphertext FROM webhook_endpoints WHERE id IN (:ids)', {
      replacements: { ids: [...new Set(rows.map((r) => r.endpoint_id))] }, type: QueryTypes.SELECT, transaction: t,
    });
    const byId = new Map(endpoints.map((e) => [e.id, e]));
    return rows.flatMap((r) => {
      const e = byId.get(r.endpoint_id);
      if (!e) return [];
      return [{ id: Number(r.id), companyId: r.company_id, endpointId: r.endpoint_id, eventId: r.event_id, eventType: r.event_type, body: r.body, attemptCount: r.attempt_count + 1, url: e.url, secretCiphertext: e.secret_ciphertext }];
    });
  });
}

/**
 * The attempt's outcome. Guarded by the attempt number, so a deliverer whose lease ran out (and
 * whose row another process has claimed again since) cannot overwrite the newer attempt.
 */
export async function recordAttempt(
  id: number,
  attempt: number,
  outcome: { status: 'pending' | 'delivered' | 'failed'; responseCode: number | null; error: string | null; nextAttemptAt: Date | null; at: Date },
): Promise<void> {
  await q().query(
    `UPDATE webhook_deliveries
        SET status = :status, last_response_code = :responseCode, last_error = :error, next_attempt_at = :nextAttemptAt,
            delivered_at = IF(:status = 'delivered', :at, delivered_at), updated_at = NOW(3)
      WHERE id = :id AND attempt_count = :attempt`,
    { replacements: { id, attempt, ...outcome, error: outcome.error?.slice(0, 500) ?? null }, type: QueryTypes.UPDATE },
  );
}

/** The delivery log of the company's endpoints, newest first, `perEndpoint` rows each. */
export async function listRecentDeliveries(companyId: number, perEndpoint = 20): Promise<WebhookDeliveryRow[]> {
  const rows = await q().query<{
    id: number; endpoint_id: number; event_id: string; event_type: string; status: WebhookDeliveryRow['status']; attempt_count: number; next_attempt_at: Date | null;
    last_attempt_at: Date | null; last_response_code: number | null; last_error: string | null; delivered_at: Date | null; created_at: Date;
  }>(
    `SELECT id, endpoint_id, event_id, event_type, status, attempt_count, next_attempt_at, last_attempt_at, last_response_code, last_error, delivered_at, created_at
       FROM (SELECT d.*, ROW_NUMBER() OVER (PARTITION BY d.endpoint_id ORDER BY d.id DESC) AS n
               FROM webhook_deliveries d WHERE d.company_id = :companyId) ranked
      WHERE n <= :perEndpoint ORDER BY id DESC`,
    { replacements: { companyId, perEndpoint }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({
    id: Number(r.id), endpointId: r.endpoint_id, eventId: r.event_id, eventType: r.event_type, status: r.status, attemptCount: r.attempt_count, nextAttemptAt: r.next_attempt_at,
    lastAttemptAt: r.last_attempt_at, lastResponseCode: r.last_response_code, lastError: r.last_error, deliveredAt: r.delivered_at, createdAt: r.created_at,
  }));
}
