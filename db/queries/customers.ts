import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { models } from '../models';
import type { ListQuery, Paged } from '@/server/validation/paging';
import type { CustomerInput } from '@/server/validation/customer';
import { containsPattern, paged } from './paging';

export interface CustomerListItem {
  id: number;
  name: string;
  email: string | null;
  phone: string | null;
  notes: string | null;
  siteCount: number;
  createdAt: string;
}

/** The company's customers, in name order, with how many sites each has; `q` matches name, e-mail or phone. */
export async function listCustomers(companyId: number, query: ListQuery): Promise<Paged<CustomerListItem>> {
  const { sequelize } = models();
  const where = ['c.company_id = :companyId'];
  const replacements: Record<string, unknown> = { companyId, limit: query.pageSize, offset: (query.page - 1) * query.pageSize };
  if (query.q) {
    where.push('(c.name LIKE :q OR c.email LIKE :q OR c.phone LIKE :q)');
    replacements.q = containsPattern(query.q);
  }
  const [{ total }] = await sequelize.query<{ total: number }>(`SELECT COUNT(*) AS total FROM customers c WHERE ${where.join(' AND ')}`, {
    replacements,
    type: QueryTypes.SELECT,
  });
  const rows = await sequelize.query<{ id: number; name: string; email: string | null; phone: string | null; notes: string | null; site_count: number; created_at: Date }>(
    `SELECT c.id, c.name, c.email, c.phone, c.notes, c.created_at,
            (SELECT COUNT(*) FROM sites s WHERE s.company_id = c.company_id AND s.customer_id = c.id) AS site_count
       FROM customers c WHERE ${where.join(' AND ')}
      ORDER BY c.name, c.id LIMIT :limit OFFSET :offset`,
    { replacements, type: QueryTypes.SELECT },
  );
  return paged(
    rows.map((r) => ({ id: r.id, name: r.name, email: r.email, phone: r.phone, notes: r.notes, siteCount: Number(r.site_count), createdAt: new Date(r.created_at).toISOString() })),
    Number(total),
    query.page,
    query.pageSize,
  );
}

export async function getCustomer(companyId: number, id: number, t?: Transaction) {
  const { Customer } = models();
  return Customer.findOne({ where: { id, companyId }, transaction: t });
}

/** Names and ids for select boxes (the new-study form). */
export async function listCustomerOptions(companyId: number): Promise<{ id: number; name: string }[]> {
  const { Customer } = models();
  const rows = await Customer.findAll({ where: { companyId }, attributes: ['id', 'name'], order: [['name', 'ASC'], ['id', 'ASC']], limit: 1000 });
  return rows.map((r) => ({ id: r.id, name: r.name }));
}

export async function createCustomer(companyId: number, input: CustomerInput, t?: Transaction) {
  const { Customer } = models();
  return Customer.create({ companyId, name: input.name, email: input.email, phone: input.phone, notes: input.notes }, { transaction: t });
}

/** Updates a customer of this company; false when there is none with that id here. */
export async function updateCustomer(companyId: number, id: number, input: CustomerInput): Promise<boolean> {
  const { Customer } = models();
  const [n] = await Customer.update({ name: input.name, email: input.email, phone: input.phone, notes: input.notes }, { where: { id, companyId } });
  return n > 0 || (await Customer.count({ where: { id, companyId } })) > 0;
}

/** Deletes a customer without sites; 'has-sites' when sites still belong to it, 'missing' when none here. */
export async function deleteCustomer(companyId: number, id: number): Promise<'deleted' | 'has-sites' | 'missing'> {
  const { Customer, Site, sequelize } = models();
  return sequelize.transaction(async (t) => {
    const row = await Customer.findOne({ where: { id, companyId }, transaction: t, lock: t.LOCK.UPDATE });
    if (!row) return 'missing';
    if ((await Site.count({ where: { companyId, customerId: id }, transaction: t })) > 0) return 'has-sites';
    await row.destroy({ transaction: t });
    return 'deleted';
  });
}

/** How names are compared for duplicates: case, accents aside, and runs of spaces do not count. */
export function customerNameKey(name: string): string {
  return name.normalize('NFKC').trim().replace(/\s+/g, ' ').toLocaleLowerCase('en');
}

/**
 * The company's customer whose name is the same as `name` once case and spacing are set aside
 * (customerNameKey), or null. Compared in code over this company's rows with a name of the same
 * first letter, so the rule is the one above whatever the column's collation.
 *
 * Inside a transaction it is a locking read: it sees customers committed after the transaction's
 * first plain read (the study form reads its choices before it takes the company lock), where a
 * plain read would see the transaction's older snapshot and let a second same-named customer in.
 */
export async function findCustomerByName(companyId: number, name: string, t?: Transaction): Promise<{ id: number; name: string; email: string | null; siteCount: number; createdAt: string } | null> {
  const key = customerNameKey(name);
  if (!key) return null;
  const { sequelize } = models();
  const rows = await sequelize.query<{ id: number; name: string; email: string | null; created_at: Date; site_count: number }>(
    `SELECT c.id, c.name, c.email, c.created_at,
            (SELECT COUNT(*) FROM sites s WHERE s.company_id = c.company_id AND s.customer_id = c.id) AS site_count
       FROM customers c WHERE c.company_id = :companyId AND LOWER(TRIM(c.name)) LIKE :prefix
      ORDER BY c.id${t ? ' LOCK IN SHARE MODE' : ''}`,
    { replacements: { companyId, prefix: `${key.charAt(0).replace(/[\\%_]/g, '\\$&')}%` }, type: QueryTypes.SELECT, transaction: t },
  );
  const hit = rows.find((r) => customerNameKey(r.name) === key);
  return hit ? { id: hit.id, name: hit.name, email: hit.email, siteCount: Number(hit.site_count), createdAt: new Date(hit.created_at).toISOString() } : null;
}
