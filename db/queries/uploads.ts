import 'server-only';
import type { Transaction } from 'sequelize';
import { models } from '../models';
import type { UploadKind } from '../models/upload';
import type { ParseReport } from '@/server/uploads/parse-report';

export async function createUpload(
  companyId: number,
  o: { kind: UploadKind; filename: string; bytes: Uint8Array; report: ParseReport; userId: string },
  t: Transaction,
) {
  const { Upload } = models();
  return Upload.create(
    {
      companyId,
      kind: o.kind,
      originalFilename: o.filename.slice(0, 255),
      originalBytes: Buffer.from(o.bytes),
      sizeBytes: o.bytes.byteLength,
      parseReport: o.report,
      createdByUserId: o.userId,
    },
    { transaction: t },
  );
}

/** Recent uploads (of one kind or several) without their bytes. */
export async function listUploads(companyId: number, o: { kind?: UploadKind | UploadKind[]; limit?: number } = {}) {
  const { Upload } = models();
  return Upload.findAll({
    where: { companyId, ...(o.kind ? { kind: o.kind } : {}) },
    attributes: ['id', 'kind', 'originalFilename', 'sizeBytes', 'status', 'parseReport', 'createdByUserId', 'createdAt'],
    order: [['createdAt', 'DESC'], ['id', 'DESC']],
    limit: o.limit ?? 20,
  });
}

/** One upload with its original bytes, for download. */
export async function getUpload(companyId: number, id: number) {
  const { Upload } = models();
  return Upload.findOne({ where: { id, companyId } });
}
