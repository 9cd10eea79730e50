import type { Metadata } from 'next';
import Link from 'next/link';
import { PageHeader } from '@/components/ui/page-header';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { Table, THead, TBody, Th, Td, EmptyRow } from '@/components/ui/table';
import { Notice } from '@/components/ui/notice';
import { NewEndpointForm } from '@/components/webhooks/new-endpoint-form';
import { RemoveEndpointForm, SendTestForm } from '@/components/webhooks/endpoint-buttons';
import { formatWhen } from '@/components/account/describe';
import { requirePermission } from '@/server/auth/guards';
import { getPlanLimits, howToRaise } from '@/server/billing/limits';
import { getEnv } from '@/server/env';
import { listRecentDeliveries, listWebhookEndpoints, type WebhookDeliveryRow } from '@/db/queries/webhooks';
import { parseWebhookEvents } from '@/server/webhooks/events';
import { MAX_ATTEMPTS } from '@/server/webhooks/deliverer';
import { SIGNATURE_HEADER } from '@/server/webhooks/signature';

export const metadata: Metadata = { title: 'Webhooks' };

const VERIFY_EXAMPLE = `// Node.js: check a delivery before trusting it (raw body, exactly as received)
const { createHmac, timingSafeEqual } = require('node:crypto');
function verify(secret, header, rawBody) {
  const parts = Object.fromEntries(header.split(',').map((p) => p.split('=')));
  const t = Number(parts.t);
  if (Math.abs(Date.now() / 1000 - t) > 300) return false; // older than 5 min: a replay
  const expected = createHmac('sha256', secret).update(\`\${t}.\${rawBody}\`).digest();
  const given = Buffer.from(parts.v1 ?? '', 'hex');
  return given.length === expected.length && timingSafeEqual(given, expected);
}`;

export default async function WebhooksPage() {
  const ctx = await requirePermission('webhook.manage');
  const [endpoints, deliveries, limits] = await Promise.all([listWebhookEndpoints(ctx.companyId), listRecentDeliveries(ctx.companyId), getPlanLimits(ctx.companyId)]);
  const configured = Boolean(getEnv().WEBHOOK_SECRET_KEY);
  const logOf = (endpointId: number) => deliveries.filter((d) => d.endpointId === endpointId);
  return (
    <>
      <PageHeader
        title="Webhooks"
        description={`FadeLedger tells ${ctx.company.name}’s own systems when a customer views, accepts or declines a quote and when a study is made, by posting signed JSON to an address you register.`}
      />
      <div className="max-w-5xl space-y-6">
        {!limits.apiAccess && (
          <Notice tone="caution" title={`The ${limits.planName} plan does not include API access`}>
            Webhooks are part of API access: new endpoints cannot be registered. {howToRaise(limits)}{' '}
            <Link href="/settings/billing" className="font-medium underline">
              Billing
            </Link>
          </Notice>
        )}
        {!configured && (
          <Notice tone="caution" title="Webhooks are not set up on this server">
            WEBHOOK_SECRET_KEY is missing from the server’s environment, so signing secrets cannot be stored. Ask whoever runs FadeLedger for you.
          </Notice>
        )}
        <Card aria-labelledby="new-endpoint-title">
          <CardHeader id="new-endpoint-title" title="Register an endpoint" description="Deliveries go only to this exact address over https; redirects are not followed and private network addresses are refused." />
          <CardBody>
            <NewEndpointForm disabled={!limits.apiAccess || !configured} />
          </CardBody>
        </Card>

        {endpoints.length === 0 && <p className="text-sm text-stone-600">No endpoints registered yet.</p>}
        {endpoints.map((e) => (
          <Card key={e.id} aria-labelledby={`endpoint-${e.id}`}>
            <CardHeader id={`endpoint-${e.id}`} title={e.description} description={<span className="break-all">{e.url}</span>} />
            <CardBody className="space-y-4">
              <div className="flex flex-wrap items-start justify-between gap-3 text-sm text-stone-700">
                <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1">
                  <dt className="text-stone-600">Events</dt>
                  <dd>{parseWebhookEvents(e.events).join(', ')}</dd>
                  <dt className="text-stone-600">Secret</dt>
                  <dd>
                    <code className="num text-xs">{e.secretHint}…</code>
                  </dd>
                  <dt className="text-stone-600">Registered</dt>
                  <dd>
                    {formatWhen(e.createdAt)}
                    {e.createdByName ? ` by ${e.createdByName}` : ''}
                  </dd>
                </dl>
                <div className="flex flex-wrap items-start gap-2">
                  <SendTestForm endpointId={e.id} description={e.description} />
                  <RemoveEndpointForm endpointId={e.id} description={e.description} />
                </div>
              </div>
              <DeliveryLog description={e.description} rows={logOf(e.id)} />
            </CardBody>
          </Card>
        ))}

        <Card aria-labelledby="verify-title">
          <CardHeader id="verify-title" title="Checking a delivery" />
          <CardBody className="space-y-3 text-sm text-stone-700">
            <p>
              Each delivery is a POST with a JSON body <code>{'{ id, type, createdAt, company, data }'}</code> and the headers <code>{SIGNATURE_HEADER}</code>, <code>FadeLedger-Event</code>,{' '}
              <code>FadeLedger-Event-Id</code> and <code>FadeLedger-Attempt</code>. The signature header reads <code>t=&lt;unix seconds&gt;,v1=&lt;hex&gt;</code>, where the hex is the HMAC-SHA256 of{' '}
              <code>{'`${t}.${body}`'}</code> under the endpoint’s signing secret. Refuse a timestamp older than five minutes, and use the event id to ignore a delivery you already handled.
            </p>
            <pre className="overflow-x-auto rounded border border-stone-200 bg-stone-50 p-3 text-xs">{VERIFY_EXAMPLE}</pre>
            <p>
              Answer with any 2xx within 5 seconds. Anything else (a redirect included) is tried again after 30 s, 1 min, 2 min and so on, doubling up to 2 hours, {MAX_ATTEMPTS} attempts in all.
            </p>
          </CardBody>
        </Card>
      </div>
    </>
  );
}

const STATUS_WORDS: Record<WebhookDeliveryRow['status'], string> = { pending: 'Waiting to retry', delivered: 'Delivered', failed: 'Gave up' };

/** Below md the log is three columns (event, status with its attempts and times, last error): the error is what an admin came for. */
function DeliveryLog({ description, rows }: { description: string; rows: WebhookDeliveryRow[] }) {
  return (
    <Table caption={`Recent deliveries to ${description}`}>
      <THead>
        <tr>
          <Th>Event</Th>
          <Th>Status</Th>
          <Th numeric className="hidden md:table-cell">Attempts</Th>
          <Th numeric className="hidden md:table-cell">HTTP status</Th>
          <Th className="hidden md:table-cell">Last attempt</Th>
          <Th className="hidden md:table-cell">Next attempt</Th>
          <Th>Last error</Th>
        </tr>
      </THead>
      <TBody>
        {rows.length === 0 && <EmptyRow colSpan={7}>Nothing sent yet.</EmptyRow>}
        {rows.map((d) => {
          const next = d.status === 'pending' && d.nextAttemptAt ? formatWhen(d.nextAttemptAt) : null;
          return (
            <tr key={d.id}>
              <Td>
                <code className="whitespace-nowrap text-xs">{d.eventType}</code>
              </Td>
              <Td>
                {d.status === 'pending' && d.attemptCount === 0 ? 'Queued' : STATUS_WORDS[d.status]}
                <span className="block text-xs text-stone-600 md:hidden">
                  {d.attemptCount} {d.attemptCount === 1 ? 'attempt' : 'attempts'}
                  {d.lastResponseCode ? `, HTTP ${d.lastResponseCode}` : ''}
                  {d.lastAttemptAt ? `, last ${formatWhen(d.lastAttemptAt)}` : ''}
                  {next ? `, next ${next}` : ''}
                </span>
              </Td>
              <Td numeric className="hidden md:table-cell">{d.attemptCount}</Td>
              <Td numeric className="hidden md:table-cell">{d.lastResponseCode ?? '—'}</Td>
              <Td className="hidden md:table-cell">{d.lastAttemptAt ? formatWhen(d.lastAttemptAt) : '—'}</Td>
              <Td className="hidden md:table-cell">{next ?? '—'}</Td>
              <Td className="max-w-xs break-words text-xs">{d.lastError ?? ''}</Td>
            </tr>
          );
        })}
      </TBody>
    </Table>
  );
}
