import 'server-only';
import { models } from '@/db/models';
import { createUpload } from '@/db/queries/uploads';
import { upsertDishesByName } from '@/db/queries/dishes';
import { createClimateProfile } from '@/db/queries/climate-profiles';
import { InvalidInputError } from '@/server/errors';
import { lockCompanyRow } from '@/db/queries/company-lock';
import { assertWithinPlan } from '@/server/plan-limit';
import type { UploadConfirmInput } from '@/server/validation/upload';
import { parseUpload } from './parse-upload';
import { recordAudit } from '@/server/audit/record';
import type { Actor } from '@/server/auth/audit';
import type { ParseReport } from './parse-report';

export type UploadOutcome =
  | { kind: 'dish-catalogue'; uploadId: number; added: number; updated: number; report: ParseReport }
  | { kind: 'rain-curve' | 'climate-normals'; uploadId: number; climateProfileId: number; report: ParseReport };

/** The refusal of a file with problems: the first few problems in the message, all of them in the field errors. */
function refuse(report: ParseReport): never {
  const first = report.problems.slice(0, 3).map((p) => p.message).join(' ');
  const more = report.problemCount > 3 ? ` (${report.problemCount - 3} more problem${report.problemCount - 3 > 1 ? 's' : ''}; preview the file to see them all.)` : '';
  throw new InvalidInputError(`Nothing was saved. ${first}${more}`, { file: report.problems.map((p) => p.message) });
}

/**
 * Save an upload: parse the bytes again, refuse unless every row is valid, then in ONE
 * transaction keep the original file with its report and apply it (catalogue upsert, or a new
 * climate profile linked to the file). Any failure rolls everything back.
 */
export async function confirmUpload(actor: { companyId: number; userId: string; person?: Actor }, input: UploadConfirmInput): Promise<UploadOutcome> {
  const bytes = new Uint8Array(await input.file.arrayBuffer());
  const filename = input.file.name || 'upload.csv';
  const parsed = parseUpload(input.kind, bytes, filename);
  if (!parsed.report.ok) refuse(parsed.report);
  const { sequelize } = models();
  return sequelize.transaction(async (t) => {
    await assertWithinPlan(await lockCompanyRow(actor.companyId, t), 'uploadsPerMonth');
    const upload = await createUpload(actor.companyId, { kind: input.kind, filename, bytes, report: parsed.report, userId: actor.userId }, t);
    // The audit row commits with the file and its rows: a refused or failed upload leaves none.
    const audited = (detail: Record<string, unknown>) =>
      recordAudit({ companyId: actor.companyId, actor: actor.person ?? null }, { action: 'upload.confirmed', target: filename, detail: { uploadId: upload.id, kind: input.kind, ...detail } }, t);
    if (parsed.kind === 'dish-catalogue') {
      const { added, updated } = await upsertDishesByName(actor.companyId, parsed.dishes, t);
      await audited({ added, updated });
      return { kind: 'dish-catalogue', uploadId: upload.id, added, updated, report: parsed.report };
    }
    const base = { name: input.name as string, sourceNote: input.sourceNote as string, zeroIsothermKm: input.zeroIsothermKm, latDeg: input.latDeg, lonDeg: input.lonDeg };
    const profile =
      parsed.kind === 'rain-curve'
        ? await createClimateProfile(actor.companyId, { ...base, kind: 'measured-curve', data: { points: parsed.points } }, { uploadId: upload.id, transaction: t })
        : await createClimateProfile(actor.companyId, { ...base, kind: 'monthly-normals', data: parsed.normals! }, { uploadId: upload.id, transaction: t });
    await audited({ climateProfileId: profile.id, name: input.name });
    return { kind: parsed.kind, uploadId: upload.id, climateProfileId: profile.id, report: parsed.report };
  });
}

/** Preview: the report only; nothing is written. */
export async function previewUpload(kind: UploadConfirmInput['kind'], file: File): Promise<ParseReport> {
  const bytes = new Uint8Array(await file.arrayBuffer());
  return parseUpload(kind, bytes, file.name || 'upload.csv').report;
}
