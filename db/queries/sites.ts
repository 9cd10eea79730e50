import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { models } from '../models';
import type { ListQuery, Paged } from '@/server/validation/paging';
import type { AltitudeSource } from '../models/site';
import { containsPattern, paged } from './paging';

export interface SiteListItem {
  id: number;
  name: string;
  address: string | null;
  customerId: number;
  customerName: string;
  latDeg: number;
  lonDeg: number;
  altitudeM: number;
  altitudeSource: AltitudeSource;
  notes: string | null;
  studyCount: number;
}

export interface SiteFieldsInput {
  name: string;
  address?: string | null;
  latDeg: number;
  lonDeg: number;
  altitudeM: number;
  /** Typed in ('user', the default) or taken from the ITU-R P.1511-1 map. */
  altitudeSource?: AltitudeSource;
  notes?: string | null;
}

/** The company's sites with their customer; `q` matches the site name, address or customer name. */
export async function listSites(companyId: number, query: ListQuery & { customerId?: number }): Promise<Paged<SiteListItem>> {
  const { sequelize } = models();
  const where = ['s.company_id = :companyId'];
  const replacements: Record<string, unknown> = { companyId, limit: query.pageSize, offset: (query.page - 1) * query.pageSize };
  if (query.q) {
    where.push('(s.name LIKE :q OR s.address LIKE :q OR c.name LIKE :q)');
    replacements.q = containsPattern(query.q);
  }
  if (query.customerId) {
    where.push('s.customer_id = :customerId');
    replacements.customerId = query.customerId;
  }
  const from = `FROM sites s JOIN customers c ON c.id = s.customer_id AND c.company_id = s.company_id WHERE ${where.join(' AND ')}`;
  const [{ total }] = await sequelize.query<{ total: number }>(`SELECT COUNT(*) AS total ${from}`, { replacements, type: QueryTypes.SELECT });
  const rows = await sequelize.query<{ id: number; name: string; address: string | null; customer_id: number; customer_name: string; lat_deg: string; lon_deg: string; altitude_m: string; altitude_source: AltitudeSource; notes: string | null; study_count: number }>(
    `SELECT s.id, s.name, s.address, s.customer_id, c.name AS customer_name, s.lat_deg, s.lon_deg, s.altitude_m, s.altitude_source, s.notes,
            (SELECT COUNT(*) FROM studies st WHERE st.company_id = s.company_id AND st.site_id = s.id) AS study_count
       ${from} ORDER BY s.name, s.id LIMIT :limit OFFSET :offset`,
    { replacements, type: QueryTypes.SELECT },
  );
  return paged(
    rows.map((r) => ({
      id: r.id,
      name: r.name,
      address: r.address,
      customerId: r.customer_id,
      customerName: r.customer_name,
      latDeg: Number(r.lat_deg),
      lonDeg: Number(r.lon_deg),
      altitudeM: Number(r.altitude_m),
      altitudeSource: r.altitude_source,
      notes: r.notes,
      studyCount: Number(r.study_count),
    })),
    Number(total),
    query.page,
    query.pageSize,
  );
}

export async function getSite(companyId: number, id: number, t?: Transaction) {
  const { Site } = models();
  return Site.findOne({ where: { id, companyId }, transaction: t });
}

/** Sites for select boxes, with the customer they belong to. */
export async function listSiteOptions(companyId: number): Promise<{ id: number; name: string; customerId: number; latDeg: number; lonDeg: number; altitudeM: number }[]> {
  const { Site } = models();
  const rows = await Site.findAll({ where: { companyId }, attributes: ['id', 'name', 'customerId', 'latDeg', 'lonDeg', 'altitudeM'], order: [['name', 'ASC'], ['id', 'ASC']], limit: 2000 });
  return rows.map((r) => ({ id: r.id, name: r.name, customerId: r.customerId, latDeg: Number(r.latDeg), lonDeg: Number(r.lonDeg), altitudeM: Number(r.altitudeM) }));
}

/** Creates a site for a customer of this company (the caller has checked the customer belongs here). */
export async function createSite(companyId: number, customerId: number, input: SiteFieldsInput, t?: Transaction) {
  const { Site } = models();
  return Site.create(
    {
      companyId,
      customerId,
      name: input.name,
      address: input.address ?? null,
      latDeg: input.latDeg.toFixed(6),
      lonDeg: input.lonDeg.toFixed(6),
      altitudeM: input.altitudeM.toFixed(1),
      altitudeSource: input.altitudeSource ?? 'user',
      notes: input.notes ?? null,
    },
    { transaction: t },
  );
}

export async function updateSite(companyId: number, id: number, customerId: number, input: SiteFieldsInput): Promise<boolean> {
  const { Site } = models();
  const [n] = await Site.update(
    {
      customerId,
      name: input.name,
      address: input.address ?? null,
      latDeg: input.latDeg.toFixed(6),
      lonDeg: input.lonDeg.toFixed(6),
      altitudeM: input.altitudeM.toFixed(1),
      altitudeSource: input.altitudeSource ?? 'user',
      notes: input.notes ?? null,
    },
    { where: { id, companyId } },
  );
  return n > 0 || (await Site.count({ where: { id, companyId } })) > 0;
}
