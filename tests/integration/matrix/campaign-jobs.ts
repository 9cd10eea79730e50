import * as campaigns from '@/server/actions/campaigns';
import { POST as uploadRoute } from '@/app/api/campaign-uploads/route';
import { GET as progressRoute } from '@/app/api/campaigns/[id]/route';
import { GET as resultsRoute } from '@/app/api/campaigns/[id]/results/route';
import { models } from '@/db/models';
import { insertCampaign } from '@/db/queries/campaigns';
import { apiRequest } from '../support/next-request';
import { actionCase, routeCase, type CrossCompanyCase, type MatrixCase, type MatrixWorld } from '../support/action-matrix';
import { createStudyWorld, type StudyWorld } from '../studies-fixtures';

/** Kept campaigns (upload, progress, result file, cancel): admins and installers (study.write); sales and staff cannot. */
const MAKERS = ['admin', 'installer'] as const;

const shared = new Map<number, Promise<StudyWorld>>();
const worldOf = (companyId: number) => {
  if (!shared.has(companyId)) shared.set(companyId, createStudyWorld(companyId));
  return shared.get(companyId)!;
};

/** A queued campaign of the company written directly (no file, no jobs): what the read and cancel rows need. */
async function campaignIn(companyId: number): Promise<number> {
  const { sequelize } = models();
  const id = await sequelize.transaction((t) =>
    insertCampaign({ companyId, userId: null, filename: 'matrix.csv', serviceName: 'Matrix service', climateName: 'maps', climateOverride: false, targetAvailabilityPercent: 99.9, inputs: { schemaVersion: 1 } }, t),
  );
  await sequelize.query("UPDATE campaigns SET status = 'queued' WHERE id = :id", { replacements: { id } });
  return id;
}
const statusOf = async (id: number) => ((await models().sequelize.query('SELECT status FROM campaigns WHERE id = :id', { replacements: { id }, plain: true })) as { status: string } | null)?.status;

// Invented site references; 60 cm is one of the study world's dishes.
const CSV = 'site_ref,latitude,longitude,altitude_m,current_dish_cm\nMX-1,47.2,2.6,140,60\n';

const uploadCase: MatrixCase<StudyWorld> = {
  name: 'POST /api/campaign-uploads',
  kind: 'route',
  access: 'study.write',
  allow: MAKERS,
  prepare: (w: MatrixWorld) => worldOf(w.company.id),
  run: async (_w, s) => {
    const base = apiRequest(`/api/campaign-uploads?serviceProfileId=${s.serviceId}&climateProfileId=maps&targetAvailabilityPercent=99.9&filename=matrix.csv`, { method: 'POST', headers: { 'content-type': 'text/csv' } });
    return uploadRoute(new Request(base.url, { method: 'POST', headers: base.headers, body: CSV }), { params: Promise.resolve({}) });
  },
};

export const cases: MatrixCase[] = [
  uploadCase as MatrixCase,
  routeCase({
    method: 'GET', path: '/api/campaigns/[id]', handler: progressRoute as never, access: 'study.write', allow: MAKERS,
    prepare: (w) => campaignIn(w.company.id),
    request: (_w, id: number) => ({ url: `/api/campaigns/${id}`, params: { id: String(id) } }),
  }),
  routeCase({
    method: 'GET', path: '/api/campaigns/[id]/results', handler: resultsRoute as never, access: 'study.write', allow: MAKERS,
    prepare: (w) => campaignIn(w.company.id),
    request: (_w, id: number) => ({ url: `/api/campaigns/${id}/results`, params: { id: String(id) } }),
  }),
  actionCase({
    file: 'campaigns', exportName: 'cancelUpgradeCampaign', action: campaigns.cancelUpgradeCampaign, access: 'study.write', allow: MAKERS,
    prepare: (w) => campaignIn(w.company.id),
    input: (_w, id: number) => ({ campaignId: String(id) }),
  }),
];

export const crossCompany: CrossCompanyCase<never>[] = [
  {
    name: 'GET /api/campaigns/[id] of their campaign',
    prepare: (w) => campaignIn(w.otherCompany.id),
    run: (_w, id: number) => progressRoute(apiRequest(`/api/campaigns/${id}`), { params: Promise.resolve({ id: String(id) }) }),
  },
  {
    name: 'GET /api/campaigns/[id]/results of their campaign',
    prepare: (w) => campaignIn(w.otherCompany.id),
    run: (_w, id: number) => resultsRoute(apiRequest(`/api/campaigns/${id}/results`), { params: Promise.resolve({ id: String(id) }) }),
  },
  {
    name: 'campaigns#cancelUpgradeCampaign of their campaign',
    prepare: (w) => campaignIn(w.otherCompany.id),
    run: async (_w, id: number) => (await import('../support/next-request')).callAction(campaigns.cancelUpgradeCampaign, { campaignId: String(id) }),
    unchanged: async (_w, id: number) => {
      if ((await statusOf(id)) !== 'queued') throw new Error('their campaign was cancelled');
    },
  },
] as CrossCompanyCase<never>[];
