import 'server-only';
import type { Transaction } from 'sequelize';
import { models } from '@/db/models';

export async function findPlanByCode(code: string, t?: Transaction) {
  const { Plan } = models();
  return Plan.findOne({ where: { code }, transaction: t });
}

export async function createCompany(data: { name: string; planId: number; trialEndsAt: Date | null }, t: Transaction) {
  const { Company } = models();
  return Company.create(data, { transaction: t });
}
