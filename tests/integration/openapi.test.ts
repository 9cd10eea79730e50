import { apiRequest, asSignedOut } from './support/next-request';
import { afterAll, describe, expect, it } from 'vitest';
import { validate, compileErrors } from '@readme/openapi-parser';
import { closeSequelize } from '@/db/sequelize';
import { GET as openApiRoute } from '@/app/api/v1/openapi.json/route';
import { API_OPERATIONS } from '@/server/api/openapi/operations';
import type { ApiRouteHandler } from '@/server/api/route';

/**
 * The OpenAPI document: served publicly, valid OpenAPI 3.1 by @readme/openapi-parser, and in step
 * with the route files — every method of every app/api/v1/**\/route.ts is described (and nothing
 * else), with the very zod schema object and permission the route gives apiRoute.
 */
afterAll(closeSequelize);

type Doc = { openapi: string; paths: Record<string, Record<string, { security?: Record<string, string[]>[]; responses: Record<string, unknown>; parameters?: { name: string; in: string }[]; requestBody?: unknown }>>; components: Record<string, unknown> };

async function served(): Promise<Doc> {
  asSignedOut();
  const res = await openApiRoute(apiRequest('/api/v1/openapi.json'), { params: Promise.resolve({}) });
  expect(res.status).toBe(200);
  expect(res.headers.get('content-type')).toContain('application/json');
  return (await res.json()) as Doc;
}

const routeFiles = import.meta.glob<Record<string, unknown>>('/app/api/v1/**/route.ts');
async function routeMethods(): Promise<{ name: string; handler: ApiRouteHandler }[]> {
  const out: { name: string; handler: ApiRouteHandler }[] = [];
  for (const [path, load] of Object.entries(routeFiles)) {
    const pattern = path.replace(/^\/app/, '').replace(/\/route\.ts$/, '');
    const mod = await load();
    for (const method of ['GET', 'POST', 'PUT', 'PATCH', 'DELETE']) if (typeof mod[method] === 'function') out.push({ name: `${method} ${pattern}`, handler: mod[method] as ApiRouteHandler });
  }
  return out;
}

describe('GET /api/v1/openapi.json', () => {
  it('is served without a session or key and validates as OpenAPI 3.1', async () => {
    const doc = await served();
    expect(doc.openapi).toBe('3.1.0');
    const result = await validate(structuredClone(doc) as never);
    expect(result.valid, result.valid ? '' : compileErrors(result)).toBe(true);
  });

  it('the validator is not a rubber stamp: a broken copy fails', async () => {
    const doc = await served();
    const broken = structuredClone(doc);
    // Swagger 2's body parameter does not exist in OpenAPI 3.x.
    broken.paths['/api/v1/studies/{id}'].get.parameters![0].in = 'body';
    expect((await validate(broken as never)).valid).toBe(false);
    const duplicated = structuredClone(doc) as unknown as { paths: Record<string, Record<string, { operationId: string }>> };
    duplicated.paths['/api/v1/quotes'].get.operationId = duplicated.paths['/api/v1/studies'].get.operationId;
    expect((await validate(duplicated as never)).valid).toBe(false);
  });

  it('describes every method of every route file under app/api/v1, and nothing more', async () => {
    const doc = await served();
    const files = (await routeMethods()).map((r) => r.name).sort();
    expect(files.length).toBeGreaterThanOrEqual(14);
    const described = Object.entries(doc.paths).flatMap(([path, ops]) => Object.keys(ops).map((m) => `${m.toUpperCase()} ${path.replace(/\{(\w+)\}/g, '[$1]')}`)).sort();
    expect(described).toEqual(files);
  });

  it('uses the same schema object and permission as each route', async () => {
    for (const { name, handler } of await routeMethods()) {
      const op = API_OPERATIONS.find((o) => `${o.method.toUpperCase()} ${o.route}` === name);
      expect(op, name).toBeDefined();
      expect(handler.apiRoute, `${name} is not built with apiRoute`).toBeDefined();
      expect(handler.apiRoute.permission, name).toBe(op!.permission);
      expect(handler.apiRoute.keyScope, name).toBe(op!.keyScope);
      expect(handler.apiRoute.schema, name).toBe(op!.query ?? op!.body);
    }
  });

  it('names the bearer scheme, the scope per route and the error answers', async () => {
    const doc = await served();
    expect(doc.components).toMatchObject({ securitySchemes: { apiKey: { type: 'http', scheme: 'bearer' } } });
    const studies = doc.paths['/api/v1/studies'].get;
    expect(studies.security).toEqual([{ apiKey: ['studies'] }, { session: [] }]);
    expect(Object.keys(studies.responses).sort()).toEqual(['200', '401', '403', '422', '429', '500']);
    expect(studies.parameters!.map((p) => p.name)).toEqual(['q', 'page', 'pageSize', 'archived']);
    expect(Object.keys(doc.paths['/api/v1/quotes/{id}'].get.responses)).toContain('404');
    expect(doc.paths['/api/v1/tradeoff'].post.requestBody).toBeDefined();
    expect(doc.paths['/api/v1/openapi.json'].get.security).toEqual([]);
    expect(doc.paths['/api/v1/uploads/{id}'].get.security).toEqual([{ apiKey: ['read'] }, { session: [] }]);
  });
});
