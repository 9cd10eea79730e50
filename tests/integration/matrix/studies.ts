import * as customers from '@/server/actions/customers';
import * as sites from '@/server/actions/sites';
import * as services from '@/server/actions/services';
import * as catalogue from '@/server/actions/catalogue';
import * as climate from '@/server/actions/climate';
import * as studies from '@/server/actions/studies';
import * as uploads from '@/server/actions/uploads';
import { GET as listStudiesRoute } from '@/app/api/v1/studies/route';
import { GET as getStudyRoute } from '@/app/api/v1/studies/[id]/route';
import { GET as listSitesRoute } from '@/app/api/v1/sites/route';
import { GET as listCustomersRoute } from '@/app/api/v1/customers/route';
import { GET as dashboardRoute } from '@/app/api/v1/dashboard/route';
import { POST as tradeoffRoute } from '@/app/api/v1/tradeoff/route';
import { GET as uploadFileRoute } from '@/app/api/v1/uploads/[id]/route';
import { models } from '@/db/models';
import { apiRequest as apiRequestOf, callAction } from '../support/next-request';
import { actionCase, routeCase, type CrossCompanyCase, type MatrixCase, type MatrixWorld } from '../support/action-matrix';
import { suffix } from '../support/factories';
import { createStudyWorld, insertTestStudy, TEST_SERVICE_FORM, type StudyWorld } from '../studies-fixtures';

/** Part A (customers, sites, services, catalogue, climate, studies, uploads) in the permission matrix. */
const ADMIN = ['admin'] as const;
const MAKERS = ['admin', 'installer'] as const;
const COMPANY = ['admin', 'installer', 'sales'] as const;

/** A study world per company, made once and shared by the cells that only read it or add to it. */
const shared = new Map<number, Promise<StudyWorld>>();
const worldOf = (companyId: number) => {
  if (!shared.has(companyId)) shared.set(companyId, createStudyWorld(companyId));
  return shared.get(companyId)!;
};
const fresh = (w: MatrixWorld, companyId = w.company.id) => createStudyWorld(companyId);

async function studyIn(companyId: number, userId: string): Promise<{ id: number; world: StudyWorld }> {
  const world = await worldOf(companyId);
  return { id: await insertTestStudy(companyId, userId, world), world };
}

/** A kept upload of the company, written directly (the upload actions have their own rows above). */
async function uploadIn(companyId: number, kind: 'dish-catalogue' | 'rain-curve' = 'dish-catalogue'): Promise<{ id: number }> {
  const text = kind === 'dish-catalogue' ? DISH_CSV() : CURVE_CSV;
  const row = await models().Upload.create({
    companyId,
    kind,
    originalFilename: 'matrix.csv',
    originalBytes: Buffer.from(text),
    sizeBytes: Buffer.byteLength(text),
    parseReport: { kind, summary: 'matrix upload', rowCount: 1 },
    createdByUserId: null,
  });
  return { id: row.id };
}

const csv = (text: string, name = 'matrix.csv') => new File([text], name, { type: 'text/csv' });
const DISH_CSV = () => `name,diameter_m,efficiency,hardware_price,labour_price\nMatrix ${suffix()},0.8,0.66,150,90\n`;
const CURVE_CSV = 'p_percent,rain_rate_mm_h\n1,2.2\n0.1,11\n0.01,36\n0.001,80\n';
const studyInput = (s: StudyWorld) => ({ customerId: s.customerId, siteId: s.siteId, serviceProfileId: s.serviceId, climateProfileId: s.climateId, dishIds: s.dishIds.join(','), targetAvailabilityPercent: '99.9' });
const dishInput = (name: string) => ({ name, diameterM: '1.2', efficiency: '0.68', hardwarePrice: '329.00', labourPrice: '190.00', active: 'on' });
// An invented scenario in the engine's shape (demo figures).
const SCENARIO = {
  site: { latDeg: 47.1, lonDeg: 2.6, altitudeKm: 0.14 },
  satellite: { longitudeDeg: -19.5 },
  downlink: { frequencyGHz: 11.75, tiltDeg: 20, eirpDbw: 50, symbolRateMsps: 27.5, requiredEsN0Db: 7.91, implementationMarginDb: 1 },
  receiver: { lnbNoiseTempK: 60, antennaNoiseTempK: 40 },
  rain: { r001MmH: 32 },
  dishes: [{ diameterM: 0.6, efficiency: 0.65 }, { diameterM: 0.9, efficiency: 0.65 }],
};

export const cases: MatrixCase<never>[] = [
  actionCase({ file: 'customers', exportName: 'createCustomer', action: customers.createCustomer, access: 'customer.write', allow: MAKERS, input: () => ({ name: `Matrix customer ${suffix()}` }) }),
  actionCase({ file: 'customers', exportName: 'updateCustomer', action: customers.updateCustomer, access: 'customer.write', allow: MAKERS, prepare: (w) => worldOf(w.company.id), input: (_w, s: StudyWorld) => ({ id: s.customerId, name: 'Matrix customer, renamed' }) }),
  actionCase({
    file: 'customers', exportName: 'deleteCustomer', action: customers.deleteCustomer, access: 'customer.write', allow: MAKERS,
    prepare: async (w) => (await models().Customer.create({ companyId: w.company.id, name: `Deletable ${suffix()}`, email: null, phone: null, notes: null })).id,
    input: (_w, id: number) => ({ id }),
  }),
  actionCase({ file: 'sites', exportName: 'createSite', action: sites.createSite, access: 'customer.write', allow: MAKERS, prepare: (w) => worldOf(w.company.id), input: (_w, s: StudyWorld) => ({ customerId: s.customerId, name: 'Matrix gable', latDeg: `47°07'N`, lonDeg: '2.6 E', altitudeM: '120' }) }),
  actionCase({ file: 'sites', exportName: 'updateSite', action: sites.updateSite, access: 'customer.write', allow: MAKERS, prepare: (w) => worldOf(w.company.id), input: (_w, s: StudyWorld) => ({ id: s.siteId, customerId: s.customerId, name: 'Long barn roof', latDeg: '47.123456', lonDeg: '2.654321', altitudeM: '140' }) }),
  actionCase({ file: 'services', exportName: 'createServiceProfile', action: services.createServiceProfile, access: 'service.write', allow: MAKERS, input: () => ({ ...TEST_SERVICE_FORM, name: `Matrix service ${suffix()}` }) }),
  actionCase({ file: 'services', exportName: 'updateServiceProfile', action: services.updateServiceProfile, access: 'service.write', allow: MAKERS, prepare: (w) => worldOf(w.company.id), input: (_w, s: StudyWorld) => ({ ...TEST_SERVICE_FORM, id: s.serviceId }) }),
  actionCase({ file: 'services', exportName: 'deleteServiceProfile', action: services.deleteServiceProfile, access: 'service.write', allow: MAKERS, prepare: (w) => fresh(w), input: (_w, s: StudyWorld) => ({ id: s.serviceId }) }),
  actionCase({ file: 'catalogue', exportName: 'createDish', action: catalogue.createDish, access: 'catalogue.write', allow: ADMIN, input: () => dishInput(`Matrix dish ${suffix()}`) }),
  actionCase({ file: 'catalogue', exportName: 'updateDish', action: catalogue.updateDish, access: 'catalogue.write', allow: ADMIN, prepare: (w) => fresh(w), input: (_w, s: StudyWorld) => ({ ...dishInput(`Matrix dish ${suffix()}`), id: s.dishIds[0] }) }),
  actionCase({ file: 'catalogue', exportName: 'deleteDish', action: catalogue.deleteDish, access: 'catalogue.write', allow: ADMIN, prepare: (w) => fresh(w), input: (_w, s: StudyWorld) => ({ id: s.dishIds[0] }) }),
  actionCase({ file: 'climate', exportName: 'createClimateProfile', action: climate.createClimateProfile, access: 'climate.write', allow: ADMIN, input: () => ({ name: 'Matrix zone', kind: 'climate-zone', zone: 'K', sourceNote: 'ITU-R P.837-1 map, read by hand' }) }),
  actionCase({ file: 'climate', exportName: 'deleteClimateProfile', action: climate.deleteClimateProfile, access: 'climate.write', allow: ADMIN, prepare: (w) => fresh(w), input: (_w, s: StudyWorld) => ({ id: s.climateId }) }),
  actionCase({ file: 'studies', exportName: 'createStudy', action: studies.createStudy, access: 'study.write', allow: MAKERS, prepare: (w) => worldOf(w.company.id), input: (_w, s: StudyWorld) => studyInput(s) }),
  actionCase({ file: 'studies', exportName: 'rerunStudy', action: studies.rerunStudy, access: 'study.write', allow: MAKERS, prepare: (w) => studyIn(w.company.id, w.users.admin.id), input: (_w, s: { id: number }) => ({ id: s.id }) }),
  actionCase({
    file: 'studies', exportName: 'reviseStudy', action: studies.reviseStudy, access: 'study.write', allow: MAKERS,
    prepare: (w) => studyIn(w.company.id, w.users.admin.id),
    input: (_w, s: { id: number; world: StudyWorld }) => ({ ...studyInput(s.world), revisionOfStudyId: s.id, targetAvailabilityPercent: '99.95' }),
  }),
  actionCase({ file: 'studies', exportName: 'archiveStudy', action: studies.archiveStudy, access: 'study.write', allow: MAKERS, prepare: (w) => studyIn(w.company.id, w.users.admin.id), input: (_w, s: { id: number }) => ({ id: s.id }) }),
  actionCase({ file: 'studies', exportName: 'unarchiveStudy', action: studies.unarchiveStudy, access: 'study.write', allow: MAKERS, prepare: (w) => studyIn(w.company.id, w.users.admin.id), input: (_w, s: { id: number }) => ({ id: s.id }) }),
  actionCase({ file: 'uploads', exportName: 'previewCatalogueUpload', action: uploads.previewCatalogueUpload, access: 'catalogue.write', allow: ADMIN, input: () => ({ file: csv(DISH_CSV()) }) }),
  actionCase({ file: 'uploads', exportName: 'confirmCatalogueUpload', action: uploads.confirmCatalogueUpload, access: 'catalogue.write', allow: ADMIN, input: () => ({ file: csv(DISH_CSV()) }) }),
  actionCase({ file: 'uploads', exportName: 'previewClimateUpload', action: uploads.previewClimateUpload, access: 'climate.write', allow: ADMIN, input: () => ({ kind: 'rain-curve', file: csv(CURVE_CSV) }) }),
  actionCase({ file: 'uploads', exportName: 'confirmClimateUpload', action: uploads.confirmClimateUpload, access: 'climate.write', allow: ADMIN, input: () => ({ kind: 'rain-curve', name: 'Matrix gauge', sourceNote: 'invented', file: csv(CURVE_CSV) }) }),

  routeCase({ method: 'GET', path: '/api/v1/studies', handler: listStudiesRoute as never, access: 'study.read', allow: COMPANY, request: () => ({ url: '/api/v1/studies?q=&page=1&pageSize=10' }) }),
  routeCase({
    method: 'GET', path: '/api/v1/studies/[id]', handler: getStudyRoute as never, access: 'study.read', allow: COMPANY,
    prepare: (w) => studyIn(w.company.id, w.users.admin.id),
    request: (_w, s: { id: number }) => ({ url: `/api/v1/studies/${s.id}`, params: { id: String(s.id) } }),
  }),
  routeCase({ method: 'GET', path: '/api/v1/sites', handler: listSitesRoute as never, access: 'customer.read', allow: COMPANY, request: () => ({ url: '/api/v1/sites?q=barn' }) }),
  routeCase({ method: 'GET', path: '/api/v1/customers', handler: listCustomersRoute as never, access: 'customer.read', allow: COMPANY, request: () => ({ url: '/api/v1/customers' }) }),
  routeCase({ method: 'GET', path: '/api/v1/dashboard', handler: dashboardRoute as never, access: 'study.read', allow: COMPANY, request: () => ({ url: '/api/v1/dashboard' }) }),
  routeCase({
    method: 'GET', path: '/api/v1/uploads/[id]', handler: uploadFileRoute as never, access: 'catalogue.write', allow: ADMIN,
    prepare: (w) => uploadIn(w.company.id),
    request: (_w, u: { id: number }) => ({ url: `/api/v1/uploads/${u.id}`, params: { id: String(u.id) } }),
  }),
  routeCase({ method: 'POST', path: '/api/v1/tradeoff', handler: tradeoffRoute as never, access: 'tradeoff.api', allow: MAKERS, request: () => ({ url: '/api/v1/tradeoff', json: SCENARIO }) }),
] as MatrixCase<never>[];

/** Company A's admin naming company B's part-A rows by id: always "not found", B's rows unchanged. */
const theirs = (w: MatrixWorld) => worldOf(w.otherCompany.id);
async function unchangedRow(model: 'Customer' | 'Site' | 'ServiceProfile' | 'Dish' | 'ClimateProfile', id: number, field: string, expected: unknown) {
  const row = (await (models()[model] as unknown as { findByPk(id: number): Promise<Record<string, unknown> | null> }).findByPk(id)) as Record<string, unknown> | null;
  if (!row) throw new Error(`${model} ${id} was deleted`);
  if (expected !== undefined && (row as { get(k: string): unknown }).get(field) !== expected) throw new Error(`${model} ${id}.${field} changed`);
}

export const crossCompany: CrossCompanyCase<never>[] = [
  { name: 'customers#updateCustomer', prepare: theirs, run: (_w, s: StudyWorld) => callAction(customers.updateCustomer, { id: s.customerId, name: 'Taken' }), unchanged: (_w, s: StudyWorld) => unchangedRow('Customer', s.customerId, 'name', undefined) },
  { name: 'customers#deleteCustomer', prepare: theirs, run: (_w, s: StudyWorld) => callAction(customers.deleteCustomer, { id: s.customerId }), unchanged: (_w, s: StudyWorld) => unchangedRow('Customer', s.customerId, 'name', undefined) },
  { name: 'sites#createSite for their customer', prepare: theirs, run: (_w, s: StudyWorld) => callAction(sites.createSite, { customerId: s.customerId, name: 'x', latDeg: '1', lonDeg: '1' }) },
  { name: 'sites#updateSite', prepare: theirs, run: (_w, s: StudyWorld) => callAction(sites.updateSite, { id: s.siteId, customerId: s.customerId, name: 'Taken', latDeg: '1', lonDeg: '1' }), unchanged: (_w, s: StudyWorld) => unchangedRow('Site', s.siteId, 'name', 'Long barn roof') },
  { name: 'services#updateServiceProfile', prepare: theirs, run: (_w, s: StudyWorld) => callAction(services.updateServiceProfile, { ...TEST_SERVICE_FORM, id: s.serviceId, eirpDbw: '40' }), unchanged: (_w, s: StudyWorld) => unchangedRow('ServiceProfile', s.serviceId, 'eirpDbw', '50.00') },
  { name: 'services#deleteServiceProfile', prepare: theirs, run: (_w, s: StudyWorld) => callAction(services.deleteServiceProfile, { id: s.serviceId }), unchanged: (_w, s: StudyWorld) => unchangedRow('ServiceProfile', s.serviceId, 'eirpDbw', undefined) },
  { name: 'catalogue#updateDish', prepare: theirs, run: (_w, s: StudyWorld) => callAction(catalogue.updateDish, { ...dishInput('Taken'), id: s.dishIds[1] }), unchanged: (_w, s: StudyWorld) => unchangedRow('Dish', s.dishIds[1], 'hardwarePrice', '189.00') },
  { name: 'catalogue#deleteDish', prepare: theirs, run: (_w, s: StudyWorld) => callAction(catalogue.deleteDish, { id: s.dishIds[1] }), unchanged: (_w, s: StudyWorld) => unchangedRow('Dish', s.dishIds[1], 'hardwarePrice', undefined) },
  { name: 'climate#deleteClimateProfile', prepare: theirs, run: (_w, s: StudyWorld) => callAction(climate.deleteClimateProfile, { id: s.climateId }), unchanged: (_w, s: StudyWorld) => unchangedRow('ClimateProfile', s.climateId, 'kind', 'known-r001') },
  { name: 'studies#createStudy from their site, service, climate and dishes', prepare: theirs, run: (_w, s: StudyWorld) => callAction(studies.createStudy, studyInput(s)) },
  {
    name: 'studies#reviseStudy of their study',
    prepare: async (w) => ({ theirs: await studyIn(w.otherCompany.id, w.otherAdmin.id), ours: await worldOf(w.company.id) }),
    run: (_w, s: { theirs: { id: number }; ours: StudyWorld }) => callAction(studies.reviseStudy, { ...studyInput(s.ours), revisionOfStudyId: s.theirs.id }),
    unchanged: async (_w, s: { theirs: { id: number } }) => {
      if ((await models().Study.count({ where: { revisionOfStudyId: s.theirs.id } })) !== 0) throw new Error(`study ${s.theirs.id} got a revision`);
    },
  },
  { name: 'studies#rerunStudy of their study', prepare: (w) => studyIn(w.otherCompany.id, w.otherAdmin.id), run: (_w, s: { id: number }) => callAction(studies.rerunStudy, { id: s.id }) },
  {
    name: 'studies#archiveStudy of their study',
    prepare: (w) => studyIn(w.otherCompany.id, w.otherAdmin.id),
    run: (_w, s: { id: number }) => callAction(studies.archiveStudy, { id: s.id }),
    unchanged: async (_w, s: { id: number }) => {
      if ((await models().Study.findByPk(s.id))?.status !== 'ready') throw new Error(`study ${s.id} was archived`);
    },
  },
  {
    name: 'studies#unarchiveStudy of their archived study',
    prepare: async (w) => {
      const s = await studyIn(w.otherCompany.id, w.otherAdmin.id);
      await models().Study.update({ status: 'archived' }, { where: { id: s.id } });
      return s;
    },
    run: (_w, s: { id: number }) => callAction(studies.unarchiveStudy, { id: s.id }),
    unchanged: async (_w, s: { id: number }) => {
      if ((await models().Study.findByPk(s.id))?.status !== 'archived') throw new Error(`study ${s.id} was restored`);
    },
  },
  {
    name: 'GET /api/v1/uploads/[id] of their file',
    prepare: (w) => uploadIn(w.otherCompany.id),
    run: (_w, u: { id: number }) => uploadFileRoute(apiRequestOf(`/api/v1/uploads/${u.id}`), { params: Promise.resolve({ id: String(u.id) }) }),
  },
  {
    name: 'GET /api/v1/studies/[id] of their study',
    prepare: (w) => studyIn(w.otherCompany.id, w.otherAdmin.id),
    run: async (_w, s: { id: number }) => {
      const { apiRequest } = await import('../support/next-request');
      return getStudyRoute(apiRequest(`/api/v1/studies/${s.id}`), { params: Promise.resolve({ id: String(s.id) }) });
    },
  },
] as CrossCompanyCase<never>[];
