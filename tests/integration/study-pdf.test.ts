import { asSignedOut, asUser, apiRequest } from './support/next-request';
import { execFileSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeSequelize } from '@/db/sequelize';
import { getStudy } from '@/db/queries/studies';
import { GET as studyPdfRoute } from '@/app/(app)/studies/[id]/pdf/route';
import { readStudyOption } from '@/server/study-option';
import { studyPointing } from '@/server/pointing/magnetic-declination';
import { createCompany, createUserWithRole, signInAs, type TestCompany, type TestUser } from './support/factories';
import { createStudyWorld, insertTestStudy } from './studies-fixtures';

/**
 * The study's engineering record: a PDF for the study's own company, its words (read back with
 * poppler's pdftotext, as a person copying from the file would), and "not found" for anyone else.
 */
afterAll(closeSequelize);

let home: TestCompany;
let other: TestCompany;
let installer: TestUser;
let outsider: TestUser;
let studyId: number;

beforeAll(async () => {
  home = await createCompany({ planCode: 'fleet' });
  other = await createCompany({ planCode: 'fleet' });
  installer = await createUserWithRole(home.id, 'installer');
  outsider = await createUserWithRole(other.id, 'admin');
  studyId = await insertTestStudy(home.id, installer.id, await createStudyWorld(home.id), 'Record of the long barn');
});

const call = (id: string) => studyPdfRoute(apiRequest(`/studies/${id}/pdf`), { params: Promise.resolve({ id }) });

function pdfToText(pdf: Buffer): string {
  const dir = mkdtempSync(path.join(tmpdir(), 'study-pdf-'));
  const file = path.join(dir, 'record.pdf');
  writeFileSync(file, pdf);
  return execFileSync('pdftotext', [file, '-'], { encoding: 'utf8' });
}

function pdfInfo(pdf: Buffer): string {
  const dir = mkdtempSync(path.join(tmpdir(), 'study-pdf-'));
  const file = path.join(dir, 'record.pdf');
  writeFileSync(file, pdf);
  return execFileSync('pdfinfo', [file], { encoding: 'utf8' });
}

describe('GET /studies/[id]/pdf', () => {
  it('gives the company its study as a PDF with inputs, sources, pointing, every dish and the cautions', async () => {
    asUser(await signInAs(installer));
    const res = await call(String(studyId));
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('application/pdf');
    expect(res.headers.get('content-disposition')).toMatch(/attachment; filename="study-\d+-record-of-the-long-barn\.pdf"/);
    const pdf = Buffer.from(await res.arrayBuffer());
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    if (process.env.STUDY_PDF_OUT) writeFileSync(process.env.STUDY_PDF_OUT, pdf);

    const text = pdfToText(pdf).replace(/\s+/g, ' ');
    const study = (await getStudy(home.id, studyId))!;
    const t = study.result.tradeoff;
    expect(text).toContain('Record of the long barn');
    expect(text).toContain(home.name);
    for (const heading of ['Inputs', 'Pointing', 'Climate and its sources', 'Dish by dish', 'Outage against dish size', 'Cautions']) expect(text).toContain(heading);
    expect(text).toContain('Predictions are statistics, not guarantees');
    // The running footer on every page: page numbers and the statistics caution (react-pdf dropped it
    // while it was anchored with `bottom`; server/pdf-footer.ts).
    const pages = Number(/Pages:\s+(\d+)/.exec(pdfInfo(pdf))![1]);
    expect(pages).toBeGreaterThan(0);
    for (let n = 1; n <= pages; n++) expect(text).toContain(`Page ${n} of ${pages}`);
    expect(text.split('predictions are statistics, not guarantees').length - 1).toBe(pages);
    expect(text).toContain('ITU-R P.839-4');
    // Coordinates with hemisphere letters, and the largest dish (120 cm) gets its wind-load caution.
    expect(text).toContain('Coordinates 47.12346° N, 2.65432° E');
    expect(text).toContain('Wind load. A 120 cm reflector catches a lot of wind');
    expect(text).toContain('Work at height');
    // Pointing: true and magnetic azimuth, and the model named.
    const p = studyPointing(study.inputs.site, t, new Date(study.result.computedAt));
    expect(text).toContain(`Azimuth (true) ${t.azimuthDeg.toFixed(1)}°`);
    expect(text).toContain(`Azimuth (magnetic) ${p.magneticAzimuthDeg.toFixed(1)}°`);
    expect(text).toContain('World Magnetic Model 2025 (WMM2025), epoch 2025.0');
    // Every dish with its availability, as the study page reads it.
    for (const [i, dish] of study.inputs.dishes.entries()) {
      expect(text).toContain(dish.name);
      const r = readStudyOption(t, i);
      if (r.closes) expect(text).toContain(r.availability.text);
    }
  });

  it('answers 404 to another company, and for an id that is not a study', async () => {
    asUser(await signInAs(outsider));
    expect((await call(String(studyId))).status).toBe(404);
    asUser(await signInAs(installer));
    expect((await call('99999999')).status).toBe(404);
    expect((await call('12abc')).status).toBe(404);
  });

  it('asks a signed-out visitor to sign in', async () => {
    asSignedOut();
    expect((await call(String(studyId))).status).toBe(401);
  });
});
