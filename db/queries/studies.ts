import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { models } from '../models';
import type { ListQuery, Paged } from '@/server/validation/paging';
import type { StudyInputsSnapshot, StudyResultSnapshot } from '@/server/studies/snapshot';
import { containsPattern, paged } from './paging';

/** A row of the studies list: the denormalised summary columns only, never the JSON snapshots. */
export interface StudyListItem {
  id: number;
  title: string;
  status: 'ready' | 'archived';
  customerName: string;
  siteName: string;
  serviceName: string;
  siteId: number | null;
  customerId: number | null;
  dishCount: number;
  recommendedDiameterM: number | null;
  targetAvailabilityPercent: number;
  revision: number;
  revisionOfStudyId: number | null;
  engineVersion: string;
  createdByName: string | null;
  createdAt: string;
}

type StudyListRow = {
  id: number;
  title: string;
  status: 'ready' | 'archived';
  customer_name: string;
  site_name: string;
  service_name: string;
  site_id: number | null;
  customer_id: number | null;
  dish_count: number;
  recommended_diameter_m: string | null;
  target_availability_percent: string;
  revision: number;
  revision_of_study_id: number | null;
  engine_version: string;
  created_by_name: string | null;
  created_at: Date;
};

const LIST_COLUMNS = `st.id, st.title, st.status, st.customer_name, st.site_name, st.service_name, st.site_id, st.customer_id,
  st.dish_count, st.recommended_diameter_m, st.target_availability_percent, st.revision, st.revision_of_study_id,
  st.engine_version, u.name AS created_by_name, st.created_at`;

function toListItem(r: StudyListRow): StudyListItem {
  return {
    id: r.id,
    title: r.title,
    status: r.status,
    customerName: r.customer_name,
    siteName: r.site_name,
    serviceName: r.service_name,
    siteId: r.site_id,
    customerId: r.customer_id,
    dishCount: r.dish_count,
    recommendedDiameterM: r.recommended_diameter_m === null ? null : Number(r.recommended_diameter_m),
    targetAvailabilityPercent: Number(r.target_availability_percent),
    revision: r.revision,
    revisionOfStudyId: r.revision_of_study_id,
    engineVersion: r.engine_version,
    createdByName: r.created_by_name,
    createdAt: new Date(r.created_at).toISOString(),
  };
}

/** Which studies a list shows: archived ones are left out unless asked for. */
export type ArchivedFilter = 'hide' | 'include' | 'only';

/**
 * The company's studies, newest first; `q` matches the title, customer, site or service name;
 * archived studies are left out unless `archived` is 'include' or 'only'. Reads only the summary
 * columns (indexes studies_company_created / studies_company_status_created), so it stays fast
 * with many thousands of studies per company.
 */
export async function listStudies(companyId: number, query: ListQuery & { siteId?: number; archived?: ArchivedFilter }): Promise<Paged<StudyListItem>> {
  const { sequelize } = models();
  // The further services of a comparison show on their leading study's page, not as studies of their own.
  const where = ['st.company_id = :companyId', 'st.comparison_of_study_id IS NULL'];
  const replacements: Record<string, unknown> = { companyId, limit: query.pageSize, offset: (query.page - 1) * query.pageSize };
  const archived = query.archived ?? 'hide';
  if (archived !== 'include') {
    where.push('st.status = :status');
    replacements.status = archived === 'only' ? 'archived' : 'ready';
  }
  if (query.q) {
    where.push('(st.title LIKE :q OR st.customer_name LIKE :q OR st.site_name LIKE :q OR st.service_name LIKE :q)');
    replacements.q = containsPattern(query.q);
  }
  if (query.siteId) {
    where.push('st.site_id = :siteId');
    replacements.siteId = query.siteId;
  }
  const whereSql = where.join(' AND ');
  const [{ total }] = await sequelize.query<{ total: number }>(`SELECT COUNT(*) AS total FROM studies st WHERE ${whereSql}`, { replacements, type: QueryTypes.SELECT });
  // Page through ids on the narrow index first, then fetch those rows: a deep OFFSET never reads the JSON columns.
  const rows = await sequelize.query<StudyListRow>(
    `SELECT ${LIST_COLUMNS}
       FROM (SELECT st.id FROM studies st WHERE ${whereSql} ORDER BY st.created_at DESC, st.id DESC LIMIT :limit OFFSET :offset) page
       JOIN studies st ON st.id = page.id
       LEFT JOIN users u ON u.id = st.created_by_user_id
      ORDER BY st.created_at DESC, st.id DESC`,
    { replacements, type: QueryTypes.SELECT },
  );
  return paged(rows.map(toListItem), Number(total), query.page, query.pageSize);
}

export interface StudyDetail extends StudyListItem {
  /** The leading study of the comparison this row is one service of; null for a leading or single-service study. */
  comparisonOfStudyId: number | null;
  serviceProfileId: number | null;
  climateProfileId: number | null;
  inputs: StudyInputsSnapshot;
  result: StudyResultSnapshot;
}

function parseJson<T>(v: unknown): T {
  return (typeof v === 'string' ? JSON.parse(v) : v) as T;
}

/** One study with its snapshots, or null when this company has none with that id. */
export async function getStudy(companyId: number, id: number, t?: Transaction): Promise<StudyDetail | null> {
  const { sequelize } = models();
  const [row] = await sequelize.query<DetailRow>(`SELECT ${DETAIL_COLUMNS} FROM studies st LEFT JOIN users u ON u.id = st.created_by_user_id WHERE st.company_id = :companyId AND st.id = :id`, {
    replacements: { companyId, id },
    type: QueryTypes.SELECT,
    transaction: t,
  });
  return row ? toDetail(row) : null;
}

type DetailRow = StudyListRow & { comparison_of_study_id: number | null; service_profile_id: number | null; climate_profile_id: number | null; inputs: unknown; result: unknown };
const DETAIL_COLUMNS = `${LIST_COLUMNS}, st.comparison_of_study_id, st.service_profile_id, st.climate_profile_id, st.inputs, st.result`;

function toDetail(row: DetailRow): StudyDetail {
  return {
    ...toListItem(row),
    comparisonOfStudyId: row.comparison_of_study_id,
    serviceProfileId: row.service_profile_id,
    climateProfileId: row.climate_profile_id,
    inputs: parseJson<StudyInputsSnapshot>(row.inputs),
    result: parseJson<StudyResultSnapshot>(row.result),
  };
}

/**
 * Every service of the study `id` belongs to, the leading study first, then the others in the
 * order they were chosen (their ids). A single-service study answers itself alone; [] when this
 * company has no study with that id.
 */
export async function getStudyServices(companyId: number, id: number, t?: Transaction): Promise<StudyDetail[]> {
  const { sequelize } = models();
  const rows = await sequelize.query<DetailRow>(
    `SELECT ${DETAIL_COLUMNS} FROM studies st LEFT JOIN users u ON u.id = st.created_by_user_id
      WHERE st.company_id = :companyId
        AND (st.id = (SELECT COALESCE(s0.comparison_of_study_id, s0.id) FROM studies s0 WHERE s0.company_id = :companyId AND s0.id = :id)
          OR st.comparison_of_study_id = (SELECT COALESCE(s0.comparison_of_study_id, s0.id) FROM studies s0 WHERE s0.company_id = :companyId AND s0.id = :id))
      ORDER BY st.comparison_of_study_id IS NOT NULL, st.id`,
    { replacements: { companyId, id }, type: QueryTypes.SELECT, transaction: t },
  );
  return rows.map(toDetail);
}

/**
 * Archives or restores a study: only its status changes; the input and result snapshots are
 * never written here. False when this company has no study with that id.
 */
export async function setStudyArchived(companyId: number, id: number, archived: boolean, t?: Transaction): Promise<boolean> {
  const { Study } = models();
  const [n] = await Study.update({ status: archived ? 'archived' : 'ready' }, { where: { id, companyId }, fields: ['status'], transaction: t });
  return n > 0 || (await Study.count({ where: { id, companyId }, transaction: t })) > 0;
}

export interface NewStudyRow {
  customerId: number | null;
  siteId: number | null;
  serviceProfileId: number | null;
  climateProfileId: number | null;
  revisionOfStudyId: number | null;
  revision: number;
  /** The leading study when this row is a further service of a comparison. */
  comparisonOfStudyId?: number | null;
  title: string;
  customerName: string;
  siteName: string;
  serviceName: string;
  recommendedDiameterM: number | null;
  inputs: StudyInputsSnapshot;
  result: StudyResultSnapshot;
  createdByUserId: string | null;
}

/** Inserts a study inside the caller's transaction; snapshots are written once, here, and never updated. */
export async function insertStudy(companyId: number, row: NewStudyRow, t: Transaction): Promise<number> {
  const { Study } = models();
  const created = await Study.create(
    {
      companyId,
      customerId: row.customerId,
      siteId: row.siteId,
      serviceProfileId: row.serviceProfileId,
      climateProfileId: row.climateProfileId,
      revisionOfStudyId: row.revisionOfStudyId,
      revision: row.revision,
      comparisonOfStudyId: row.comparisonOfStudyId ?? null,
      title: row.title,
      customerName: row.customerName,
      siteName: row.siteName,
      serviceName: row.serviceName,
      recommendedDiameterM: row.recommendedDiameterM === null ? null : row.recommendedDiameterM.toFixed(3),
      dishCount: row.inputs.dishes.length,
      targetAvailabilityPercent: row.inputs.targetAvailabilityPercent.toFixed(4),
      inputs: row.inputs,
      result: row.result,
      engineVersion: row.result.engineVersion,
      createdByUserId: row.createdByUserId,
    },
    { transaction: t },
  );
  return created.id;
}

/**
 * The next revision number of a study chain, with the chain's first study locked so two re-runs
 * at once cannot both take the same number.
 */
export async function nextRevision(companyId: number, rootStudyId: number, t: Transaction): Promise<number> {
  const { sequelize } = models();
  await sequelize.query('SELECT id FROM studies WHERE company_id = :companyId AND id = :rootStudyId FOR UPDATE', {
    replacements: { companyId, rootStudyId },
    type: QueryTypes.SELECT,
    transaction: t,
  });
  const [{ max }] = await sequelize.query<{ max: number | null }>(
    // A locking read sees the latest committed revisions, not this transaction's earlier snapshot (REPEATABLE READ).
    'SELECT MAX(revision) AS max FROM studies WHERE company_id = :companyId AND (id = :rootStudyId OR revision_of_study_id = :rootStudyId) FOR UPDATE',
    { replacements: { companyId, rootStudyId }, type: QueryTypes.SELECT, transaction: t },
  );
  return Number(max ?? 1) + 1;
}

/** Other revisions of the same chain, oldest first (for the "revisions" line on the study page). */
export async function listStudyRevisions(companyId: number, rootStudyId: number): Promise<{ id: number; revision: number; createdAt: string; engineVersion: string }[]> {
  const { sequelize } = models();
  const rows = await sequelize.query<{ id: number; revision: number; created_at: Date; engine_version: string }>(
    `SELECT id, revision, created_at, engine_version FROM studies
      WHERE company_id = :companyId AND (id = :rootStudyId OR revision_of_study_id = :rootStudyId) ORDER BY revision, id`,
    { replacements: { companyId, rootStudyId }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({ id: r.id, revision: r.revision, createdAt: new Date(r.created_at).toISOString(), engineVersion: r.engine_version }));
}

/** Studies made since the start of the current calendar month (UTC), e.g. for a plan limit. */
export async function countStudiesThisMonth(companyId: number, t?: Transaction): Promise<number> {
  const { sequelize } = models();
  const now = new Date();
  const start = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), 1));
  const [{ n }] = await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM studies WHERE company_id = :companyId AND comparison_of_study_id IS NULL AND created_at >= :start', {
    replacements: { companyId, start },
    type: QueryTypes.SELECT,
    transaction: t,
  });
  return Number(n);
}

export interface StudyDashboard {
  counts: { studies: number; studiesThisMonth: number; customers: number; sites: number; dishes: number; serviceProfiles: number; climateProfiles: number };
  recent: StudyListItem[];
}

/** Counts and the latest studies for the dashboard, in one round of small indexed queries. */
export async function getStudyDashboard(companyId: number, recentCount = 8): Promise<StudyDashboard> {
  const { sequelize } = models();
  const now = new Date();
  const start = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), 1));
  const [counts] = await sequelize.query<Record<string, number>>(
    `SELECT
       (SELECT COUNT(*) FROM studies WHERE company_id = :companyId AND comparison_of_study_id IS NULL) AS studies,
       (SELECT COUNT(*) FROM studies WHERE company_id = :companyId AND comparison_of_study_id IS NULL AND created_at >= :start) AS studies_this_month,
       (SELECT COUNT(*) FROM customers WHERE company_id = :companyId) AS customers,
       (SELECT COUNT(*) FROM sites WHERE company_id = :companyId) AS sites,
       (SELECT COUNT(*) FROM dishes WHERE company_id = :companyId AND active = 1) AS dishes,
       (SELECT COUNT(*) FROM service_profiles WHERE company_id = :companyId) AS service_profiles,
       (SELECT COUNT(*) FROM climate_profiles WHERE company_id = :companyId) AS climate_profiles`,
    { replacements: { companyId, start }, type: QueryTypes.SELECT },
  );
  const recent = await listStudies(companyId, { q: '', page: 1, pageSize: recentCount });
  return {
    counts: {
      studies: Number(counts.studies),
      studiesThisMonth: Number(counts.studies_this_month),
      customers: Number(counts.customers),
      sites: Number(counts.sites),
      dishes: Number(counts.dishes),
      serviceProfiles: Number(counts.service_profiles),
      climateProfiles: Number(counts.climate_profiles),
    },
    recent: recent.items,
  };
}
