import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

/** Sites one campaign may hold, per plan (a reseller's whole subscriber base fits the largest). */
const CAMPAIGN_SITES = { trial: 10_000, bench: 1_000, crew: 50_000, fleet: 1_000_000 } as const;

/**
 * Kept upgrade campaigns, computed by background workers (BullMQ on Redis):
 *  - campaigns: the inputs (service, climate, dishes and target, as snapshots) and the progress;
 *  - campaign_sites: every valid row of the uploaded file, streamed in by the upload route, which
 *    the workers read by line range;
 *  - campaign_chunks: the chunk jobs, so a chunk's results are counted once even when a job is retried;
 *  - campaign_results / campaign_problems: one row per computed site / per problem, keyed by
 *    (campaign, line) so a retried chunk can never write a line twice.
 */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.addColumn('plans', 'campaign_sites_limit', { type: DataTypes.INTEGER, allowNull: false, defaultValue: 5000 });
  for (const [code, n] of Object.entries(CAMPAIGN_SITES)) {
    await qi.bulkUpdate('plans', { campaign_sites_limit: n }, { code });
  }

  await qi.createTable('campaigns', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    company_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'companies', key: 'id' }, onDelete: 'CASCADE' },
    created_by_user_id: { type: DataTypes.STRING(40), allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    status: { type: DataTypes.ENUM('receiving', 'queued', 'running', 'done', 'cancelled', 'failed'), allowNull: false, defaultValue: 'receiving' },
    filename: { type: DataTypes.STRING(255), allowNull: false },
    service_name: { type: DataTypes.STRING(160), allowNull: false },
    climate_name: { type: DataTypes.STRING(160), allowNull: false },
    climate_override: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    target_availability_percent: { type: DataTypes.DECIMAL(8, 5), allowNull: false },
    // Service, climate override and dish catalogue as they were: a reopened campaign reads these, not today's rows.
    inputs: { type: DataTypes.JSON, allowNull: false },
    rows_total: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    sites_total: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    sites_done: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    problems_count: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    upgrade_count: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    already_meets_count: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    none_meets_count: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    hardware_total_usd: { type: DataTypes.DECIMAL(16, 2), allowNull: false, defaultValue: '0.00' },
    labour_total_usd: { type: DataTypes.DECIMAL(16, 2), allowNull: false, defaultValue: '0.00' },
    chunks_total: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    chunks_done: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    failure_message: { type: DataTypes.TEXT, allowNull: true },
    started_at: { type: DataTypes.DATE(3), allowNull: true },
    finished_at: { type: DataTypes.DATE(3), allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('campaigns', ['company_id', 'created_at'], { name: 'campaigns_company_created' });

  const lineOf = {
    campaign_id: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true, references: { model: 'campaigns', key: 'id' }, onDelete: 'CASCADE' },
    line_no: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true },
  };
  await qi.createTable('campaign_sites', {
    ...lineOf,
    site_ref: { type: DataTypes.STRING(120), allowNull: false },
    lat_deg: { type: DataTypes.DOUBLE, allowNull: false },
    lon_deg: { type: DataTypes.DOUBLE, allowNull: false },
    altitude_m: { type: DataTypes.DOUBLE, allowNull: true },
    current_dish_cm: { type: DataTypes.DOUBLE, allowNull: false },
  });
  await qi.createTable('campaign_chunks', {
    campaign_id: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true, references: { model: 'campaigns', key: 'id' }, onDelete: 'CASCADE' },
    chunk_no: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true },
    first_line: { type: DataTypes.INTEGER, allowNull: false },
    last_line: { type: DataTypes.INTEGER, allowNull: false },
    site_count: { type: DataTypes.INTEGER, allowNull: false },
    done_at: { type: DataTypes.DATE(3), allowNull: true },
  });
  await qi.createTable('campaign_results', {
    ...lineOf,
    verdict: { type: DataTypes.ENUM('upgrade', 'already-meets-target', 'none-meets-target'), allowNull: false },
    current_dish_cm: { type: DataTypes.INTEGER, allowNull: false },
    current_outage_min: { type: DataTypes.DOUBLE, allowNull: false },
    recommended_dish_cm: { type: DataTypes.INTEGER, allowNull: true },
    recommended_dish_name: { type: DataTypes.STRING(120), allowNull: true },
    recommended_outage_min: { type: DataTypes.DOUBLE, allowNull: true },
    hardware_usd: { type: DataTypes.DECIMAL(12, 2), allowNull: true },
    labour_usd: { type: DataTypes.DECIMAL(12, 2), allowNull: true },
    // The row of the result file, as written when computed: the download streams these unchanged.
    csv_line: { type: DataTypes.TEXT, allowNull: false },
  });
  await qi.createTable('campaign_problems', {
    ...lineOf,
    seq: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true },
    message: { type: DataTypes.TEXT, allowNull: false },
    csv_line: { type: DataTypes.TEXT, allowNull: false },
  });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.dropTable('campaign_problems');
  await qi.dropTable('campaign_results');
  await qi.dropTable('campaign_chunks');
  await qi.dropTable('campaign_sites');
  await qi.dropTable('campaigns');
  await qi.removeColumn('plans', 'campaign_sites_limit');
}
