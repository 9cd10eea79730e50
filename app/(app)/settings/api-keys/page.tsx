import type { Metadata } from 'next';
import Link from 'next/link';
import { PageHeader } from '@/components/ui/page-header';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { Table, THead, TBody, Th, Td, EmptyRow } from '@/components/ui/table';
import { Notice } from '@/components/ui/notice';
import { NewKeyForm } from '@/components/api-keys/new-key-form';
import { RevokeKeyForm } from '@/components/api-keys/revoke-key-form';
import { formatWhen } from '@/components/account/describe';
import { requirePermission } from '@/server/auth/guards';
import { parseScopes } from '@/server/auth/api-scopes';
import { getPlanLimits, howToRaise } from '@/server/billing/limits';
import { getEnv } from '@/server/env';
import { listApiKeys } from '@/db/queries/api-keys';

export const metadata: Metadata = { title: 'API keys' };

export default async function ApiKeysPage() {
  const ctx = await requirePermission('apikey.manage');
  const [keys, limits] = await Promise.all([listApiKeys(ctx.companyId), getPlanLimits(ctx.companyId)]);
  const base = getEnv().APP_URL.replace(/\/$/, '');
  return (
    <>
      <PageHeader
        title="API keys"
        description={`Keys let ${ctx.company.name}’s own systems (an order or CRM system) call the FadeLedger API without a person signing in.`}
      />
      <div className="max-w-5xl space-y-6">
        {!limits.apiAccess && (
          <Notice tone="caution" title={`The ${limits.planName} plan does not include API access`}>
            New keys cannot be made, and existing keys are refused with 403 until the plan includes it. {howToRaise(limits)}{' '}
            <Link href="/settings/billing" className="font-medium underline">
              Billing
            </Link>
          </Notice>
        )}
        <Card aria-labelledby="new-key-title">
          <CardHeader id="new-key-title" title="Create a key" description="Give each system its own key with only the scopes it needs, so you can revoke one without stopping the others." />
          <CardBody>
            <NewKeyForm disabled={!limits.apiAccess} />
          </CardBody>
        </Card>

        <Card aria-labelledby="keys-title">
          <CardHeader id="keys-title" title="Keys" description="A revoked key is refused (401) from its next request on; it stays listed for the record." />
          <Table caption="API keys">
            <THead>
              <tr>
                <Th>Name</Th>
                <Th>Key</Th>
                <Th>Scopes</Th>
                <Th numeric>Per minute</Th>
                <Th>Last used</Th>
                <Th>Created</Th>
                <Th>
                  <span className="sr-only">Actions</span>
                </Th>
              </tr>
            </THead>
            <TBody>
              {keys.length === 0 && <EmptyRow colSpan={7}>No API keys yet.</EmptyRow>}
              {keys.map((k) => (
                <tr key={k.id} className={k.revokedAt ? 'text-stone-500' : undefined}>
                  <Td className="font-medium">{k.name}</Td>
                  <Td>
                    <code className="num text-xs">{k.prefix}…</code>
                  </Td>
                  <Td>{parseScopes(k.scopes).join(', ')}</Td>
                  <Td numeric>{k.rateLimitPerMinute}</Td>
                  <Td>{k.lastUsedAt ? `${formatWhen(k.lastUsedAt)}${k.lastUsedIp ? ` from ${k.lastUsedIp}` : ''}` : 'Never'}</Td>
                  <Td>
                    {formatWhen(k.createdAt)}
                    {k.createdByName ? ` by ${k.createdByName}` : ''}
                  </Td>
                  <Td className="text-right">{k.revokedAt ? `Revoked ${formatWhen(k.revokedAt)}` : <RevokeKeyForm keyId={k.id} name={k.name} />}</Td>
                </tr>
              ))}
            </TBody>
          </Table>
        </Card>

        <Card aria-labelledby="use-title">
          <CardHeader id="use-title" title="Calling the API" />
          <CardBody className="space-y-3 text-sm text-stone-700">
            <p>Send the key in the Authorization header of every request. Check a key first with <code>/api/v1/me</code>:</p>
            <pre className="overflow-x-auto rounded border border-stone-200 bg-stone-50 p-3 text-xs">{`curl -H "Authorization: Bearer $FADELEDGER_KEY" ${base}/api/v1/me`}</pre>
            <p>
              Each key allows its number of requests a minute (429 with Retry-After above it). The{' '}
              <Link href="/api-reference" className="font-medium underline">
                API reference
              </Link>{' '}
              lists every route with its scope, and the machine-readable description is at <code>{base}/api/v1/openapi.json</code> (OpenAPI 3.1).
            </p>
          </CardBody>
        </Card>
      </div>
    </>
  );
}
