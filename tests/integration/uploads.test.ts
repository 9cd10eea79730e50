import { asUser, callAction } from './support/next-request';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeSequelize } from '@/db/sequelize';
import type { ActionState } from '@/server/actions/safe-action';
import { models } from '@/db/models';
import { confirmCatalogueUpload, confirmClimateUpload, previewCatalogueUpload, previewClimateUpload } from '@/server/actions/uploads';

type Input = FormData | Record<string, unknown>;
const isCatalogue = (input: Input) => !(input instanceof FormData) && (input.kind === 'dish-catalogue' || input.kind === undefined);
// The catalogue and the climate files have their own actions (own permissions); these pick by kind.
const previewUpload = (_prev: unknown, input: Input) => (isCatalogue(input) ? previewCatalogueUpload(null, input) : previewClimateUpload(null, input)) as Promise<ActionState<unknown>>;
const confirmUpload = (_prev: unknown, input: Input) => (isCatalogue(input) ? confirmCatalogueUpload(null, input) : confirmClimateUpload(null, input)) as Promise<ActionState<unknown>>;
import { MAX_UPLOAD_BYTES } from '@/server/uploads/upload-limits';
import { createCompany, createUserWithRole, signInAs, type TestCompany } from './support/factories';
import { countRows } from './studies-fixtures';

/**
 * Uploads against the real MariaDB: a bad file (wrong columns, a bad number on line 7, empty,
 * huge) gets a clear error and saves nothing — no upload row, no dish, no climate profile; a good
 * file is kept byte for byte with its report, and its rows are applied in the same transaction.
 */
afterAll(closeSequelize);

let company: TestCompany;
let adminToken: string;

beforeAll(async () => {
  company = await createCompany({ planCode: 'fleet' });
  adminToken = await signInAs(await createUserWithRole(company.id, 'admin'));
});

const file = (text: string | Uint8Array, name = 'upload.csv') => new File([text as BlobPart], name, { type: 'text/csv' });
const HEADER = 'name,diameter_m,efficiency,hardware_price,labour_price,mount_notes,active';
// Invented catalogue (demo data).
const GOOD = [HEADER, 'Heath 60,0.60,0.64,79.00,110.00,Wall bracket,yes', 'Heath 80,0.80,0.66,139.00,130.00,,yes', 'Heath 100,1.00,0.67,219.00,180.00,"Pole, 76 mm",no'].join('\n') + '\n';
function withBadLine7(): string {
  const lines = [HEADER];
  for (let i = 0; i < 5; i++) lines.push(`Row ${i},0.${6 + i},0.65,100.00,50.00,,yes`);
  lines.push('Row bad,0.9,0.65,1O0.00,50.00,,yes'); // line 7: letter O in the price
  return lines.join('\n');
}

async function snapshotCounts() {
  return { uploads: await countRows('uploads', company.id), dishes: await countRows('dishes', company.id), climate: await countRows('climate_profiles', company.id) };
}

describe('bad files: a clear error, nothing saved', () => {
  const cases: [string, () => Record<string, unknown>, RegExp][] = [
    ['wrong columns', () => ({ kind: 'dish-catalogue', file: file('diameter,price\n0.6,100\n') }), /Missing columns: name, diameter_m, efficiency, hardware_price, labour_price/],
    ['a bad number on line 7', () => ({ kind: 'dish-catalogue', file: file(withBadLine7()) }), /Line 7, hardware_price: Hardware price must be an amount like 1249\.00/],
    ['an empty file', () => ({ kind: 'dish-catalogue', file: file('\n\n') }), /The file is empty\./],
    ['a header and no rows', () => ({ kind: 'dish-catalogue', file: file(HEADER + '\n') }), /header line but no data rows/],
    ['a huge file', () => ({ kind: 'dish-catalogue', file: file(HEADER + '\n' + `Big,0.6,0.65,1,1,${'x'.repeat(MAX_UPLOAD_BYTES)},yes\n`, 'big.csv') }), /"big\.csv" is 257 KiB; uploads are limited to 256 KiB/],
    ['a spreadsheet, not CSV', () => ({ kind: 'dish-catalogue', file: file(new Uint8Array([0x50, 0x4b, 3, 4, 0, 0, 0]), 'book.xlsx') }), /not a text CSV file/],
    ['a rain curve with a rising tail', () => ({ kind: 'rain-curve', name: 'Station', sourceNote: 'gauge', file: file('p_percent,rain_rate_mm_h\n1,3\n0.1,15\n0.01,12\n') }), /Line 4: The rain rate must not fall/],
    ['normals with a month missing', () => ({ kind: 'climate-normals', name: 'Normals', sourceNote: 'met office', file: file('month,mean_total_rainfall_mm,mean_surface_temperature_c\n' + Array.from({ length: 11 }, (_, i) => `${i + 1},60,10`).join('\n')) }), /Missing month: december/],
  ];

  for (const [label, input, message] of cases) {
    it(`${label}: preview reports it, confirm refuses it, nothing is saved`, async () => {
      asUser(adminToken);
      const before = await snapshotCounts();
      const preview = await callAction(previewUpload, input());
      expect(preview.state).toMatchObject({ ok: true, data: { ok: false } });
      const report = (preview.state as { data: { problems: { message: string }[]; summary: string } }).data;
      expect(report.problems.map((p) => p.message).join(' ')).toMatch(message);

      const confirm = await callAction(confirmUpload, input());
      expect(confirm.state).toMatchObject({ ok: false, code: 'invalid_input' });
      expect((confirm.state as { error: string }).error).toMatch(/^Nothing was saved\./);
      expect((confirm.state as { error: string }).error).toMatch(message);
      expect(await snapshotCounts()).toEqual(before);
    });
  }

  it('a missing file or missing climate name is a field error', async () => {
    asUser(adminToken);
    const none = await callAction(confirmUpload, { kind: 'dish-catalogue' });
    expect(none.state).toMatchObject({ ok: false, fieldErrors: { file: ['Choose a CSV file.'] } });
    const unnamed = await callAction(confirmUpload, { kind: 'rain-curve', file: file('p_percent,rain_rate_mm_h\n1,2\n0.001,90\n') });
    expect(unnamed.state).toMatchObject({ ok: false, fieldErrors: { name: [expect.any(String)], sourceNote: [expect.any(String)] } });
  });
});

describe('good files', () => {
  it('preview saves nothing; confirm keeps the original bytes with the report and applies the rows in one go', async () => {
    asUser(adminToken);
    const before = await snapshotCounts();
    const preview = await callAction(previewUpload, { kind: 'dish-catalogue', file: file(GOOD, 'heath.csv') });
    expect(preview.state).toMatchObject({ ok: true, data: { ok: true, rowCount: 3 } });
    expect(await snapshotCounts()).toEqual(before);

    const confirm = await callAction(confirmUpload, { kind: 'dish-catalogue', file: file(GOOD, 'heath.csv') });
    expect(confirm.state).toMatchObject({ ok: true, data: { kind: 'dish-catalogue', added: 3, updated: 0 } });
    const { Upload, Dish } = models();
    const upload = await Upload.findByPk((confirm.state as { data: { uploadId: number } }).data.uploadId);
    expect(upload?.companyId).toBe(company.id);
    expect(Buffer.from(upload!.originalBytes).toString('utf8')).toBe(GOOD);
    expect(upload?.sizeBytes).toBe(Buffer.byteLength(GOOD));
    const report = typeof upload!.parseReport === 'string' ? JSON.parse(upload!.parseReport) : upload!.parseReport;
    expect(report).toMatchObject({ ok: true, filename: 'heath.csv', rowCount: 3 });
    const heath100 = await Dish.findOne({ where: { companyId: company.id, name: 'Heath 100' } });
    expect([heath100?.diameterM, heath100?.hardwarePrice, heath100?.active, heath100?.mountNotes]).toEqual(['1.000', '219.00', false, 'Pole, 76 mm']);

    // The same list again with one price changed: updates by name, adds nothing.
    const changed = GOOD.replace('139.00', '149.50');
    const again = await callAction(confirmUpload, { kind: 'dish-catalogue', file: file(changed) });
    expect(again.state).toMatchObject({ ok: true, data: { added: 0, updated: 3 } });
    expect((await Dish.findOne({ where: { companyId: company.id, name: 'Heath 80' } }))?.hardwarePrice).toBe('149.50');
    expect(await countRows('uploads', company.id)).toBe(before.uploads + 2);
  });

  it('a measured curve and monthly normals each become a climate profile linked to their file', async () => {
    asUser(adminToken);
    const curve = await callAction(confirmUpload, {
      kind: 'rain-curve', name: 'Copperfold gauge', sourceNote: 'Invented gauge, 1998–2017', zeroIsothermKm: '3.1',
      file: file('p_percent,rain_rate_mm_h\n1,2.4\n0.1,11\n0.01,38\n0.001,85\n', 'gauge.csv'),
    });
    expect(curve.state).toMatchObject({ ok: true, data: { kind: 'rain-curve' } });
    const { ClimateProfile } = models();
    const profile = await ClimateProfile.findByPk((curve.state as { data: { climateProfileId: number } }).data.climateProfileId);
    expect(profile).toMatchObject({ kind: 'measured-curve', zeroIsothermKm: '3.100', uploadId: (curve.state as { data: { uploadId: number } }).data.uploadId });
    const data = typeof profile!.data === 'string' ? JSON.parse(profile!.data) : profile!.data;
    expect(data.points[2]).toEqual({ pPercent: 0.01, rainRateMmH: 38 });

    const months = Array.from({ length: 12 }, (_, i) => `${i + 1},${40 + 10 * Math.sin(i)},${8 + i}`).join('\n');
    const normals = await callAction(confirmUpload, { kind: 'climate-normals', name: 'Copperfold normals', sourceNote: 'Invented normals', file: file(`month,mean_total_rainfall_mm,mean_surface_temperature_c\n${months}\n`) });
    expect(normals.state).toMatchObject({ ok: true, data: { kind: 'climate-normals' } });
  });
});

describe('the plan’s upload limit', () => {
  it('refuses the upload over the limit (bench: 2 a month) and saves nothing of it', async () => {
    const small = await createCompany({ planCode: 'bench' });
    asUser(await signInAs(await createUserWithRole(small.id, 'admin')));
    for (const n of [1, 2]) {
      const ok = await callAction(confirmUpload, { kind: 'dish-catalogue', file: file(`name,diameter_m,efficiency,hardware_price,labour_price\nSmall ${n},0.6,0.65,80,60\n`) });
      expect(ok.state).toMatchObject({ ok: true });
    }
    const third = await callAction(confirmUpload, { kind: 'dish-catalogue', file: file('name,diameter_m,efficiency,hardware_price,labour_price\nSmall 3,0.6,0.65,80,60\n') });
    expect(third.state).toMatchObject({ ok: false, code: 'plan_limit' });
    expect(await countRows('uploads', small.id)).toBe(2);
    expect(await countRows('dishes', small.id)).toBe(2);
  });
});
