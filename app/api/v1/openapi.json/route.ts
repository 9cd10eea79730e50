import { apiRoute } from '@/server/api/route';
import { buildOpenApiDocument } from '@/server/api/openapi/document';
import { getEnv } from '@/server/env';

/**
 * GET /api/v1/openapi.json — the OpenAPI 3.1 description of every /api/v1 route, built from the
 * same zod schemas the routes validate with. Public: it describes, it holds no company data.
 */
export const GET = apiRoute({ permission: 'public' }, async () =>
  Response.json(buildOpenApiDocument(getEnv().APP_URL), { headers: { 'Cache-Control': 'public, max-age=300' } }),
);
