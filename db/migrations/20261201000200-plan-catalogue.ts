import type { QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

// Reference data every install needs (sign-up puts new companies on the trial plan; an
// expired trial or unpaid subscription falls back to the free tier). Staff edit the rest
// on the staff pages. Names and prices are our own.
const now = new Date();
const PLANS = [
  { code: 'trial', name: 'Field trial', description: '14 days of the Crew plan to try FadeLedger with your team.', monthly_price_usd: '0.00', seat_limit: 5, studies_per_month: 100, active_links_limit: 25, uploads_per_month: 20, api_access: false, quote_branding: true, kind: 'trial', trial_days: 14, is_public: false, sort_order: 0 },
  { code: 'bench', name: 'Bench', description: 'One seat and a handful of studies, free for good.', monthly_price_usd: '0.00', seat_limit: 1, studies_per_month: 10, active_links_limit: 3, uploads_per_month: 2, api_access: false, quote_branding: false, kind: 'free', trial_days: null, is_public: true, sort_order: 1 },
  { code: 'crew', name: 'Crew', description: 'For an installer crew with a sales desk.', monthly_price_usd: '49.00', seat_limit: 5, studies_per_month: 300, active_links_limit: 50, uploads_per_month: 30, api_access: false, quote_branding: true, kind: 'paid', trial_days: null, is_public: true, sort_order: 2 },
  { code: 'fleet', name: 'Fleet', description: 'For resellers running upgrade campaigns and integrations.', monthly_price_usd: '149.00', seat_limit: 25, studies_per_month: 5000, active_links_limit: 1000, uploads_per_month: 500, api_access: true, quote_branding: true, kind: 'paid', trial_days: null, is_public: true, sort_order: 3 },
].map((p) => ({ ...p, created_at: now, updated_at: now }));

export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.bulkInsert('plans', PLANS);
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.bulkDelete('plans', { code: PLANS.map((p) => p.code) });
}
