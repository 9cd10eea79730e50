import 'server-only';
import type { Transaction } from 'sequelize';
import { models } from '../models';
import type { ServiceProfileInput } from '@/server/validation/service-profile';

export async function listServiceProfiles(companyId: number) {
  const { ServiceProfile } = models();
  return ServiceProfile.findAll({ where: { companyId }, order: [['name', 'ASC'], ['id', 'ASC']], limit: 500 });
}

export async function getServiceProfile(companyId: number, id: number, t?: Transaction) {
  const { ServiceProfile } = models();
  return ServiceProfile.findOne({ where: { id, companyId }, transaction: t });
}

function columnsOf(input: ServiceProfileInput) {
  return {
    name: input.name,
    satelliteName: input.satelliteName,
    satelliteLongitudeDeg: input.satelliteLongitudeDeg.toFixed(2),
    downlinkFrequencyGhz: input.downlinkFrequencyGHz.toFixed(4),
    polarization: input.polarization,
    polarizationTiltDeg: input.polarizationTiltDeg.toFixed(2),
    eirpDbw: input.eirpDbw.toFixed(2),
    symbolRateMsps: input.symbolRateMsps.toFixed(4),
    modcod: input.modcod,
    requiredEsN0Db: input.requiredEsN0Db.toFixed(2),
    implementationMarginDb: input.implementationMarginDb.toFixed(2),
    otherLossesDb: input.otherLossesDb.toFixed(2),
    lnbNoiseTempK: input.lnbNoiseTempK.toFixed(1),
    antennaNoiseTempK: input.antennaNoiseTempK.toFixed(1),
    uplink: input.uplink,
    acmModcods: input.acmModcods,
    notes: input.notes,
  };
}

export async function createServiceProfile(companyId: number, input: ServiceProfileInput, t?: Transaction) {
  const { ServiceProfile } = models();
  return ServiceProfile.create({ companyId, ...columnsOf(input) }, { transaction: t });
}

export async function updateServiceProfile(companyId: number, id: number, input: ServiceProfileInput, t?: Transaction): Promise<boolean> {
  const { ServiceProfile } = models();
  const row = await ServiceProfile.findOne({ where: { id, companyId }, transaction: t });
  if (!row) return false;
  await row.update(columnsOf(input), { transaction: t });
  return true;
}

/** Studies keep their own copy of the profile, so deleting one only unlinks them. */
export async function deleteServiceProfile(companyId: number, id: number, t?: Transaction): Promise<boolean> {
  const { ServiceProfile } = models();
  return (await ServiceProfile.destroy({ where: { id, companyId }, transaction: t })) > 0;
}
