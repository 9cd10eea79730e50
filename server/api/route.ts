import 'server-only';
import { z } from 'zod';
import { NextResponse } from 'next/server';
import { unstable_rethrow } from 'next/navigation';
import { AppError, ForbiddenError, InvalidInputError, RateLimitedError } from '@/server/errors';
import { getEnv } from '@/server/env';
import { DB_RETRY_AFTER_SECONDS, isDatabaseUnavailable } from '@/db/unavailable';
import { resolveAccess, type Access, type ContextForAccess } from '@/server/auth/access';
import { fieldErrorsFrom } from '@/server/validation/fields';
import { bearerTokenOf } from '@/server/auth/api-key-token';
import type { ApiScope } from '@/server/auth/api-scopes';
import { resolveKeyAccess } from './key-access';

export type ApiErrorBody = { error: { code: string; message: string; fieldErrors?: Record<string, string[]> } };

type Params = Record<string, string | string[] | undefined>;

export type ApiHandlerArgs<A extends Access, S extends z.ZodType | undefined, P extends Params> = {
  req: Request;
  ctx: ContextForAccess<A>;
  params: P;
  input: S extends z.ZodType ? z.output<S> : undefined;
};

const READS = new Set(['GET', 'HEAD']);

export type ApiRouteOptions<A extends Access, S extends z.ZodType | undefined> = {
  permission: A;
  schema?: S;
  /** The API-key scope this route needs when it is not the one holding `permission` (server/auth/api-scopes.ts). */
  keyScope?: ApiScope;
};

export type ApiRouteHandler<A extends Access = Access, S extends z.ZodType | undefined = z.ZodType | undefined, P extends Params = Params> = ((req: Request, context: { params: Promise<P> }) => Promise<Response>) & {
  apiRoute: { permission: A; schema: S | undefined; keyScope: ApiScope | undefined };
};

/**
 * The one wrapper for route handlers: authorise — an API key (`Authorization: Bearer`, scoped,
 * rate-limited: server/api/key-access.ts) or a session (role, company, same-origin check on
 * writes) — then validate the query (GET/HEAD/DELETE) or JSON body with the shared zod schema, run.
 * Returns JSON; AppError → its status with `{ error: { code, message, fieldErrors? } }`;
 * ZodError → 422; anything else → 500 without detail. A handler may return its own Response.
 *
 * @example
 *   export const GET = apiRoute({ permission: 'team.read' }, async ({ ctx }) => listMembers(ctx.companyId));
 */
export function apiRoute<A extends Access, S extends z.ZodType | undefined = undefined, P extends Params = Params>(
  opts: ApiRouteOptions<A, S>,
  handler: (args: ApiHandlerArgs<A, S, P>) => Promise<unknown>,
): ApiRouteHandler<A, S, P> {
  const route = async (req: Request, context: { params: Promise<P> }): Promise<Response> => {
    try {
      // An Authorization header means an API key (never a cookie fallback); public routes ignore it.
      const bearer = opts.permission === 'public' ? null : bearerTokenOf(req.headers);
      // A browser cannot attach a bearer key cross-site without our consent (CORS), so only
      // cookie-authenticated writes need the same-origin check.
      if (!READS.has(req.method) && bearer === null) assertSameOrigin(req);
      const ctx = bearer === null ? await resolveAccess(opts.permission) : await resolveKeyAccess(bearer, opts.permission, req, opts.keyScope);
      const params = ((await context?.params) ?? {}) as P;
      let input: unknown = undefined;
      if (opts.schema) {
        const raw = await readInput(req);
        const parsed = opts.schema.safeParse(raw);
        if (!parsed.success) throw parsed.error;
        input = parsed.data;
      }
      const result = await handler({ req, ctx, params, input } as ApiHandlerArgs<A, S, P>);
      if (result instanceof Response) return result;
      return NextResponse.json(result ?? null, { status: 200, headers: { 'Cache-Control': 'no-store' } });
    } catch (error) {
      unstable_rethrow(error);
      return errorResponse(error);
    }
  };
  // What the OpenAPI document and its tests read back from each route (server/api/openapi).
  return Object.assign(route, { apiRoute: { permission: opts.permission, schema: opts.schema, keyScope: opts.keyScope } });
}

export function errorResponse(error: unknown): Response {
  const headers: Record<string, string> = { 'Cache-Control': 'no-store' };
  if (error instanceof z.ZodError) {
    return NextResponse.json<ApiErrorBody>(
      { error: { code: 'invalid_input', message: 'Some fields are not valid.', fieldErrors: fieldErrorsFrom(error) } },
      { status: 422, headers },
    );
  }
  if (error instanceof AppError) {
    if (error instanceof RateLimitedError) headers['Retry-After'] = String(error.retryAfterSeconds);
    const body: ApiErrorBody = { error: { code: error.code, message: error.message } };
    if (error instanceof InvalidInputError && Object.keys(error.fieldErrors).length) body.error.fieldErrors = error.fieldErrors;
    return NextResponse.json(body, { status: error.status, headers });
  }
  // MariaDB out of reach is not our bug: 503 with a time to come back, and nothing else said.
  if (isDatabaseUnavailable(error)) {
    headers['Retry-After'] = String(DB_RETRY_AFTER_SECONDS);
    return NextResponse.json<ApiErrorBody>({ error: { code: 'unavailable', message: 'The service is briefly unavailable. Try again shortly.' } }, { status: 503, headers });
  }
  console.error('route handler failed:', error);
  return NextResponse.json<ApiErrorBody>({ error: { code: 'internal', message: 'Something went wrong on our side.' } }, { status: 500, headers });
}

async function readInput(req: Request): Promise<unknown> {
  const method = req.method.toUpperCase();
  if (READS.has(method) || method === 'DELETE') {
    const url = new URL(req.url);
    const out: Record<string, string | string[]> = {};
    for (const key of new Set(url.searchParams.keys())) {
      const all = url.searchParams.getAll(key);
      out[key] = all.length === 1 ? all[0] : all;
    }
    return out;
  }
  const type = req.headers.get('content-type') ?? '';
  if (type.includes('application/json')) {
    try {
      return await req.json();
    } catch {
      throw new InvalidInputError('The request body is not valid JSON.');
    }
  }
  if (type.includes('multipart/form-data') || type.includes('application/x-www-form-urlencoded')) {
    const form = await req.formData();
    return Object.fromEntries(form.entries());
  }
  const text = await req.text();
  if (!text) return {};
  throw new InvalidInputError('Send the request body as JSON (Content-Type: application/json).');
}

/**
 * Cookie-authenticated writes must come from our own pages: a browser always sends Origin on a
 * cross-site POST, so a foreign Origin is refused. Requests without Origin are not from a
 * browser form on another site (scripts and integrators), so they pass.
 */
function assertSameOrigin(req: Request): void {
  const origin = req.headers.get('origin');
  if (!origin) return;
  let originHost: string;
  try {
    originHost = new URL(origin).host;
  } catch {
    throw new ForbiddenError('This request came from another site.');
  }
  const allowed = new Set<string>([new URL(getEnv().APP_URL).host]);
  const host = req.headers.get('host');
  if (host) allowed.add(host);
  if (!allowed.has(originHost)) throw new ForbiddenError('This request came from another site.');
}
