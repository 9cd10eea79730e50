import 'server-only';
import type { Transaction } from 'sequelize';
import { models } from '../models';
import type { ClimateProfileInput } from '@/server/validation/climate';

export async function listClimateProfiles(companyId: number) {
  const { ClimateProfile } = models();
  return ClimateProfile.findAll({ where: { companyId }, order: [['name', 'ASC'], ['id', 'ASC']], limit: 500 });
}

export async function getClimateProfile(companyId: number, id: number, t?: Transaction) {
  const { ClimateProfile } = models();
  return ClimateProfile.findOne({ where: { id, companyId }, transaction: t });
}

export async function createClimateProfile(companyId: number, input: ClimateProfileInput, o: { uploadId?: number | null; transaction?: Transaction } = {}) {
  const { ClimateProfile } = models();
  return ClimateProfile.create(
    {
      companyId,
      name: input.name,
      kind: input.kind,
      data: input.data,
      zeroIsothermKm: input.zeroIsothermKm === undefined ? null : input.zeroIsothermKm.toFixed(3),
      sourceNote: input.sourceNote,
      latDeg: input.latDeg === undefined ? null : input.latDeg.toFixed(5),
      lonDeg: input.lonDeg === undefined ? null : input.lonDeg.toFixed(5),
      uploadId: o.uploadId ?? null,
    },
    { transaction: o.transaction },
  );
}

/** Studies keep their own copy of the climate, so deleting a profile only unlinks them. */
export async function deleteClimateProfile(companyId: number, id: number): Promise<boolean> {
  const { ClimateProfile } = models();
  return (await ClimateProfile.destroy({ where: { id, companyId } })) > 0;
}
