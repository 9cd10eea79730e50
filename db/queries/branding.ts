import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { models } from '../models';

/** The company's logo as stored (companies.logo_* columns, migration 20261201002510). */
export interface CompanyLogo {
  mime: 'image/png' | 'image/jpeg';
  data: Buffer;
  width: number;
  height: number;
  updatedAt: Date;
}

export interface CompanyLogoInfo {
  mime: 'image/png' | 'image/jpeg';
  width: number;
  height: number;
  bytes: number;
  updatedAt: Date;
}

/** The logo bytes, or null when the company has none. */
export async function getCompanyLogo(companyId: number): Promise<CompanyLogo | null> {
  const { sequelize } = models();
  const [row] = await sequelize.query<{ logo_mime: string | null; logo_data: Buffer | null; logo_width: number | null; logo_height: number | null; logo_updated_at: Date | null }>(
    'SELECT logo_mime, logo_data, logo_width, logo_height, logo_updated_at FROM companies WHERE id = :companyId',
    { replacements: { companyId }, type: QueryTypes.SELECT },
  );
  if (!row || !row.logo_data || !row.logo_mime) return null;
  return { mime: row.logo_mime as CompanyLogo['mime'], data: Buffer.from(row.logo_data), width: row.logo_width ?? 0, height: row.logo_height ?? 0, updatedAt: new Date(row.logo_updated_at ?? 0) };
}

/** What the branding page shows about the logo, without reading the bytes. */
export async function getCompanyLogoInfo(companyId: number): Promise<CompanyLogoInfo | null> {
  const { sequelize } = models();
  const [row] = await sequelize.query<{ logo_mime: string | null; bytes: number | null; logo_width: number | null; logo_height: number | null; logo_updated_at: Date | null }>(
    'SELECT logo_mime, LENGTH(logo_data) AS bytes, logo_width, logo_height, logo_updated_at FROM companies WHERE id = :companyId',
    { replacements: { companyId }, type: QueryTypes.SELECT },
  );
  if (!row || !row.logo_mime || !row.bytes) return null;
  return { mime: row.logo_mime as CompanyLogoInfo['mime'], width: row.logo_width ?? 0, height: row.logo_height ?? 0, bytes: Number(row.bytes), updatedAt: new Date(row.logo_updated_at ?? 0) };
}

export async function setCompanyLogo(companyId: number, logo: { mime: string; data: Buffer; width: number; height: number }, t?: Transaction): Promise<void> {
  const { sequelize } = models();
  await sequelize.query(
    'UPDATE companies SET logo_mime = :mime, logo_data = :data, logo_width = :width, logo_height = :height, logo_updated_at = :now, updated_at = :now WHERE id = :companyId',
    { replacements: { companyId, ...logo, now: new Date() }, type: QueryTypes.UPDATE, transaction: t },
  );
}

export async function clearCompanyLogo(companyId: number, t?: Transaction): Promise<void> {
  const { sequelize } = models();
  await sequelize.query(
    'UPDATE companies SET logo_mime = NULL, logo_data = NULL, logo_width = NULL, logo_height = NULL, logo_updated_at = :now, updated_at = :now WHERE id = :companyId',
    { replacements: { companyId, now: new Date() }, type: QueryTypes.UPDATE, transaction: t },
  );
}

export async function getCompanyName(companyId: number): Promise<string | null> {
  const { Company } = models();
  const c = await Company.findByPk(companyId, { attributes: ['id', 'name'] });
  return c?.name ?? null;
}

/** How customers reach the company (set on the branding page; migration 20261202005010). */
export interface CompanyContact {
  name: string;
  email: string | null;
  phone: string | null;
}

export async function getCompanyContact(companyId: number, t?: Transaction): Promise<CompanyContact | null> {
  const { sequelize } = models();
  const [row] = await sequelize.query<{ name: string; contact_email: string | null; contact_phone: string | null }>(
    'SELECT name, contact_email, contact_phone FROM companies WHERE id = :companyId',
    { replacements: { companyId }, type: QueryTypes.SELECT, transaction: t },
  );
  return row ? { name: row.name, email: row.contact_email, phone: row.contact_phone } : null;
}

export async function setCompanyContact(companyId: number, contact: { email: string | null; phone: string | null }, t?: Transaction): Promise<void> {
  const { sequelize } = models();
  await sequelize.query('UPDATE companies SET contact_email = :email, contact_phone = :phone, updated_at = :now WHERE id = :companyId', {
    replacements: { companyId, ...contact, now: new Date() },
    type: QueryTypes.UPDATE,
    transaction: t,
  });
}
