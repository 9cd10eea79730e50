import 'server-only';
import { Op, type Transaction } from 'sequelize';
import { models } from '../models';

export interface DishColumnsInput {
  name: string;
  diameterM: number;
  efficiency: number;
  hardwarePrice: string;
  labourPrice: string;
  mountNotes: string | null;
  active: boolean;
}

function columnsOf(input: DishColumnsInput) {
  return {
    name: input.name,
    diameterM: input.diameterM.toFixed(3),
    efficiency: input.efficiency.toFixed(3),
    hardwarePrice: input.hardwarePrice,
    labourPrice: input.labourPrice,
    mountNotes: input.mountNotes,
    active: input.active,
  };
}

/** The catalogue, small to large. */
export async function listDishes(companyId: number, o: { activeOnly?: boolean } = {}) {
  const { Dish } = models();
  return Dish.findAll({
    where: { companyId, ...(o.activeOnly ? { active: true } : {}) },
    order: [['diameterM', 'ASC'], ['name', 'ASC']],
    limit: 500,
  });
}

/** The named dishes of this company (others' ids are simply not found). */
export async function getDishesByIds(companyId: number, ids: number[], t?: Transaction) {
  const { Dish } = models();
  if (ids.length === 0) return [];
  return Dish.findAll({ where: { companyId, id: { [Op.in]: ids } }, transaction: t });
}

export async function createDish(companyId: number, input: DishColumnsInput, t?: Transaction) {
  const { Dish } = models();
  return Dish.create({ companyId, ...columnsOf(input) }, { transaction: t });
}

export async function updateDish(companyId: number, id: number, input: DishColumnsInput, t?: Transaction): Promise<boolean> {
  const { Dish } = models();
  const row = await Dish.findOne({ where: { id, companyId }, transaction: t });
  if (!row) return false;
  await row.update(columnsOf(input), { transaction: t });
  return true;
}

/**
 * Add or update catalogue rows by name (case-insensitive, as the unique index compares), inside
 * the caller's transaction: an uploaded price list replaces the prices of dishes it names and
 * leaves the others alone.
 */
export async function upsertDishesByName(companyId: number, rows: DishColumnsInput[], t: Transaction): Promise<{ added: number; updated: number }> {
  const { Dish } = models();
  const existing = await Dish.findAll({ where: { companyId }, transaction: t, lock: t.LOCK.UPDATE });
  const byName = new Map(existing.map((d) => [d.name.toLowerCase(), d]));
  let added = 0;
  let updated = 0;
  for (const row of rows) {
    const current = byName.get(row.name.toLowerCase());
    if (current) {
      await current.update(columnsOf(row), { transaction: t });
      updated++;
    } else {
      await Dish.create({ companyId, ...columnsOf(row) }, { transaction: t });
      added++;
    }
  }
  return { added, updated };
}

export async function deleteDish(companyId: number, id: number, t?: Transaction): Promise<boolean> {
  const { Dish } = models();
  return (await Dish.destroy({ where: { id, companyId }, transaction: t })) > 0;
}
