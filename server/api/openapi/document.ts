import { z } from 'zod';
import { WEBHOOK_EVENTS } from '@/server/webhooks/events';
import { API_SCOPES, SCOPE_LABELS, SCOPE_PERMISSIONS, type ApiScope } from '@/server/auth/api-scopes';
import { PERMISSIONS, type Permission } from '@/server/auth/permissions';
import { API_OPERATIONS, type ApiOperation } from './operations';
import { errorBodySchema } from './responses';

type Json = Record<string, unknown>;

/** JSON Schema 2020-12 (OpenAPI 3.1's own dialect) of a zod schema, as requests send it or answers return it. */
function jsonSchema(schema: z.ZodType, io: 'input' | 'output'): Json {
  const { $schema: _dialect, ...rest } = z.toJSONSchema(schema, { target: 'draft-2020-12', io, unrepresentable: 'any' }) as Json;
  return rest;
}

/** The scope a key needs for the operation, or null when no key may call it. */
export function scopeFor(op: Pick<ApiOperation, 'permission' | 'keyScope'>): ApiScope | 'any' | null {
  if (op.permission === 'public' || op.permission === 'signed-in') return 'any';
  if (op.keyScope) return op.keyScope;
  return API_SCOPES.find((s) => SCOPE_PERMISSIONS[s].includes(op.permission as Permission)) ?? null;
}

function sessionRoles(op: ApiOperation): string {
  if (op.permission === 'public') return 'anyone';
  if (op.permission === 'signed-in') return 'any signed-in person';
  return (PERMISSIONS[op.permission] as readonly string[]).join(', ');
}

/** `?a=&b=` of a zod object schema as OpenAPI parameters; required only when an absent value fails. */
function queryParameters(schema: z.ZodType): Json[] {
  if (!(schema instanceof z.ZodObject)) throw new Error('a query schema must be a zod object');
  return Object.entries(schema.shape as Record<string, z.ZodType>).map(([name, field]) => ({
    name,
    in: 'query',
    required: !field.safeParse(undefined).success,
    schema: jsonSchema(field, 'input'),
  }));
}

const ERROR = (description: string) => ({ description, content: { 'application/json': { schema: { $ref: '#/components/schemas/ErrorBody' } } } });

function operation(op: ApiOperation): Json {
  const scope = scopeFor(op);
  const access =
    op.permission === 'public'
      ? 'Public.'
      : `API key scope: ${scope === 'any' ? 'any key' : (scope ?? 'none (sessions only)')}. Session roles: ${sessionRoles(op)}.`;
  const description = [op.description, `**Access.** ${access}`, op.example ? `**Example** (demo):\n\n\`\`\`sh\n${op.example}\n\`\`\`` : undefined].filter(Boolean).join('\n\n');
  const parameters: Json[] = [];
  for (const m of op.route.matchAll(/\[(\w+)\]/g)) parameters.push({ name: m[1], in: 'path', required: true, schema: { type: 'string', pattern: '^[0-9]{1,10}$' }, description: 'Numeric id.' });
  if (op.query) parameters.push(...queryParameters(op.query));

  const responses: Json = {
    '200':
      'json' in op.response
        ? { description: 'OK', content: { 'application/json': { schema: jsonSchema(op.response.json, 'output') } } }
        : { description: op.response.description, content: { [op.response.file]: { schema: { type: 'string', contentMediaType: op.response.file } } } },
  };
  if (op.permission !== 'public') {
    responses['401'] = { $ref: '#/components/responses/Unauthenticated' };
    responses['403'] = { $ref: '#/components/responses/Forbidden' };
    responses['429'] = { $ref: '#/components/responses/RateLimited' };
  }
  if (op.byId || op.route === '/api/v1/branding/logo') responses['404'] = { $ref: '#/components/responses/NotFound' };
  if (op.query || op.body) responses['422'] = { $ref: '#/components/responses/InvalidInput' };
  responses['500'] = { $ref: '#/components/responses/Internal' };

  return {
    operationId: `${op.method}${op.route.replace(/^\/api\/v1/, '').replace(/\[(\w+)\]/g, 'By-$1').replace(/[^A-Za-z0-9]+(.)?/g, (_m, c: string | undefined) => (c ? c.toUpperCase() : ''))}`,
    tags: [op.tag],
    summary: op.summary,
    description,
    ...(parameters.length ? { parameters } : {}),
    ...(op.body ? { requestBody: { required: true, content: { 'application/json': { schema: jsonSchema(op.body, 'input'), ...(op.bodyExample ? { example: op.bodyExample } : {}) } } } } : {}),
    responses,
    security:
      op.permission === 'public'
        ? []
        : [...(scope ? [{ apiKey: scope === 'any' ? [] : [scope] }] : []), { session: [] }],
  };
}

const INTRO = `The FadeLedger API: dish-size trade-offs, studies, quotes and customers of your company, as JSON.

**Authentication.** Send an API key as \`Authorization: Bearer <key>\`. An admin makes keys in *Settings → API keys*, each with scopes (${API_SCOPES.map((s) => `\`${s}\``).join(', ')}); the key is shown once. Signed-in pages of the app call the same routes with their session cookie.

**Scopes.** ${API_SCOPES.map((s) => `\`${s}\`: ${SCOPE_LABELS[s].replace(/^[^—]*— /, '')}`).join('; ')}.

**Errors.** Every error answers \`{ "error": { "code", "message", "fieldErrors"? } }\`: 401 no or bad key (also a revoked key), 403 \`forbidden\` (outside the key's scopes or the role) or \`plan_limit\` (the plan has no API access), 404 missing or another company's, 422 invalid input with field messages, 429 over the key's requests a minute (see Retry-After).

**Webhooks.** An admin registers https endpoints in *Settings → Webhooks* for ${WEBHOOK_EVENTS.map((e) => `\`${e}\``).join(', ')}; each delivery is a POST of \`{ id, type, createdAt, company, data }\` with the headers \`FadeLedger-Event\`, \`FadeLedger-Event-Id\` (de-duplicate on it), \`FadeLedger-Attempt\` and \`FadeLedger-Signature: t=<unix seconds>,v1=<hex>\`, where the hex is HMAC-SHA256 of \`\${t}.\${rawBody}\` under the endpoint's signing secret (shown once). Check it before trusting the body:

\`\`\`js
const { createHmac, timingSafeEqual } = require('node:crypto');
function verify(secret, header, rawBody) {
  const p = Object.fromEntries(header.split(',').map((kv) => kv.split('=')));
  if (Math.abs(Date.now() / 1000 - Number(p.t)) > 300) return false; // a replay
  const expected = createHmac('sha256', secret).update(\`\${p.t}.\${rawBody}\`).digest();
  const given = Buffer.from(p.v1 ?? '', 'hex');
  return given.length === expected.length && timingSafeEqual(given, expected);
}
\`\`\`

Answer 2xx within 5 s; anything else, a redirect included, is retried with doubling waits (30 s up to 2 h, 10 attempts).

**Examples** use \`FADELEDGER_URL\` (this server) and \`FADELEDGER_KEY\`: in the demo, sign in as the Quillfeather admin, make a key in Settings → API keys, then \`export FADELEDGER_KEY=fl_…\`.`;

/** The OpenAPI 3.1 document of every /api/v1 route, with `serverUrl` as its server. */
export function buildOpenApiDocument(serverUrl: string): Json {
  const paths: Record<string, Json> = {};
  for (const op of API_OPERATIONS) {
    const path = op.route.replace(/\[(\w+)\]/g, '{$1}');
    (paths[path] ??= {})[op.method] = operation(op);
  }
  return {
    openapi: '3.1.0',
    info: { title: 'FadeLedger API', version: '1.0.0', description: INTRO },
    servers: [{ url: serverUrl.replace(/\/$/, ''), description: 'This FadeLedger server' }],
    tags: [...new Set(API_OPERATIONS.map((o) => o.tag))].map((name) => ({ name })),
    paths,
    components: {
      securitySchemes: {
        apiKey: { type: 'http', scheme: 'bearer', bearerFormat: 'FadeLedger API key (fl_…)', description: 'A company API key; the requirement lists the scope the route needs.' },
        session: { type: 'apiKey', in: 'cookie', name: 'fl_session', description: 'The app’s own pages (a signed-in person); writes must come from the app’s origin.' },
      },
      schemas: { ErrorBody: jsonSchema(errorBodySchema, 'output') },
      responses: {
        Unauthenticated: ERROR('No valid session or API key (a revoked key included).'),
        Forbidden: ERROR('Outside the key’s scopes or the person’s role (`forbidden`), or the plan has no API access (`plan_limit`).'),
        NotFound: ERROR('No such item in this company (another company’s ids answer the same).'),
        InvalidInput: ERROR('The query or body is not valid; `fieldErrors` names the fields.'),
        RateLimited: {
          ...ERROR('The key went over its requests a minute.'),
          headers: { 'Retry-After': { description: 'Seconds until the next window opens.', schema: { type: 'integer', minimum: 1 } } },
        },
        Internal: ERROR('Something went wrong on our side; nothing is said about what.'),
      },
    },
    security: [{ apiKey: [] }, { session: [] }],
  };
}
