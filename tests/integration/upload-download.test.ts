import { apiRequest, asSignedOut, asUser, callAction } from './support/next-request';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeSequelize } from '@/db/sequelize';
import { confirmCatalogueUpload, confirmClimateUpload } from '@/server/actions/uploads';
import { listUploads } from '@/db/queries/uploads';
import { GET as uploadFileRoute } from '@/app/api/v1/uploads/[id]/route';
import { createCompany, createUserWithRole, signInAs, type TestCompany } from './support/factories';

/**
 * Downloading a kept upload: the original bytes come back as an attachment with a filename that
 * cannot break the header or name a path; only the admin (catalogue.write / climate.write) gets
 * it; another company's id is 404.
 */
afterAll(closeSequelize);

let home: TestCompany;
let other: TestCompany;
const tok: Record<'admin' | 'installer' | 'sales' | 'outsider', string> = { admin: '', installer: '', sales: '', outsider: '' };

// Invented catalogue and rain figures (demo data); a BOM and CRLF line ends to show the bytes are not re-encoded.
const DISH_BYTES = '\ufeffname,diameter_m,efficiency,hardware_price,labour_price\r\nFernlight 75,0.75,0.66,129.00,120.00\r\n';
const CURVE = 'p_percent,rain_rate_mm_h\n1,2.4\n0.1,12\n0.01,38\n0.001,84\n';

const file = (text: string, name: string) => new File([text], name, { type: 'text/csv' });
const get = (id: number | string) => uploadFileRoute(apiRequest(`/api/v1/uploads/${id}`), { params: Promise.resolve({ id: String(id) }) });

let dishUploadId: number;
let curveUploadId: number;
let theirUploadId: number;

beforeAll(async () => {
  home = await createCompany({ planCode: 'fleet' });
  other = await createCompany({ planCode: 'fleet' });
  for (const role of ['admin', 'installer', 'sales'] as const) tok[role] = await signInAs(await createUserWithRole(home.id, role));
  tok.outsider = await signInAs(await createUserWithRole(other.id, 'admin'));

  asUser(tok.admin);
  expect((await callAction(confirmCatalogueUpload, { file: file(DISH_BYTES, 'Préis "list"\r\n.csv') })).state).toMatchObject({ ok: true });
  expect((await callAction(confirmClimateUpload, { kind: 'rain-curve', name: 'Gauge on the mill', sourceNote: 'invented gauge, 12 years', file: file(CURVE, 'gauge.csv') })).state).toMatchObject({ ok: true });
  const ours = await listUploads(home.id);
  dishUploadId = ours.find((u) => u.kind === 'dish-catalogue')!.id;
  curveUploadId = ours.find((u) => u.kind === 'rain-curve')!.id;

  asUser(tok.outsider);
  expect((await callAction(confirmCatalogueUpload, { file: file(DISH_BYTES, 'theirs.csv') })).state).toMatchObject({ ok: true });
  theirUploadId = (await listUploads(other.id))[0].id;
});

describe('GET /api/v1/uploads/:id', () => {
  it('the admin gets the original bytes as an attachment with a safe filename', async () => {
    asUser(tok.admin);
    const res = await get(dishUploadId);
    expect(res.status).toBe(200);
    expect(Buffer.from(await res.arrayBuffer())).toEqual(Buffer.from(DISH_BYTES));
    expect(res.headers.get('content-type')).toBe('text/csv');
    expect(res.headers.get('x-content-type-options')).toBe('nosniff');
    expect(res.headers.get('cache-control')).toContain('no-store');
    const disposition = res.headers.get('content-disposition')!;
    expect(disposition).toMatch(/^attachment; filename="[A-Za-z0-9._-]+"; filename\*=UTF-8''[A-Za-z0-9%._-]+$/);
    expect(disposition).toContain(`filename*=UTF-8''Pr%C3%A9is%20list.csv`);
    expect(disposition).not.toMatch(/[\r\n]/);
  });

  it('a climate file too, byte for byte', async () => {
    asUser(tok.admin);
    const res = await get(curveUploadId);
    expect(res.status).toBe(200);
    expect(await res.text()).toBe(CURVE);
    expect(res.headers.get('content-disposition')).toBe(`attachment; filename="gauge.csv"; filename*=UTF-8''gauge.csv`);
  });

  it('installer and sales are refused (403), signed out 401', async () => {
    for (const role of ['installer', 'sales'] as const) {
      asUser(tok[role]);
      const res = await get(dishUploadId);
      expect(res.status, role).toBe(403);
      expect(((await res.json()) as { error: { code: string } }).error.code).toBe('forbidden');
    }
    asSignedOut();
    expect((await get(dishUploadId)).status).toBe(401);
  });

  it('another company’s upload, a missing id and a malformed id are all 404 and give no bytes away', async () => {
    asUser(tok.admin);
    for (const id of [theirUploadId, 2_000_000_000, 'abc', '1e3']) {
      const res = await get(id);
      expect(res.status, String(id)).toBe(404);
      expect(((await res.json()) as { error: { code: string } }).error.code).toBe('not_found');
    }
    // Their admin still reaches their own file.
    asUser(tok.outsider);
    expect((await get(theirUploadId)).status).toBe(200);
  });
});
