import { apiRequest, asUser, callAction, callPage, inRequest, setRequestHeaders } from './support/next-request';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { models } from '@/db/models';
import { closeSequelize } from '@/db/sequelize';
import { createDish, updateDish, deleteDish } from '@/server/actions/catalogue';
import { createServiceProfile, updateServiceProfile, deleteServiceProfile } from '@/server/actions/services';
import { confirmCatalogueUpload } from '@/server/actions/uploads';
import { archiveStudy, unarchiveStudy } from '@/server/actions/studies';
import { createShareLink, revokeShareLink } from '@/server/actions/share-links';
import { decideQuote } from '@/server/actions/customer-decision';
import { recordAudit } from '@/server/audit/record';
import { requirePermission } from '@/server/auth/guards';
import { GET as exportCsv } from '@/app/(app)/settings/audit/export/route';
import QuotePage from '@/app/(app)/quotes/[id]/page';
import { createCompany, createUserWithRole, signInAs, type TestCompany, type TestUser } from './support/factories';
import { TEST_SERVICE_FORM, countRows } from './studies-fixtures';
import { draftQuote, sentQuote, testStudy } from './quotes-fixtures';

/**
 * The audit log for company changes: each kind writes its row with the actor and the address of
 * the request (TRUST_PROXY is off here, as on a single server: the connection's address that Next
 * puts in X-Forwarded-For), inside the change's transaction; a refused or rolled-back change
 * leaves no row. The CSV export is for admins and holds only their company's rows.
 */
afterAll(closeSequelize);

let company: TestCompany;
let other: TestCompany;
let admin: TestUser;
let installer: TestUser;
let sales: TestUser;
let otherAdmin: TestUser;
const tok = { admin: '', installer: '', sales: '', otherAdmin: '' };
const ADDRESS = '203.0.113.21';

beforeAll(async () => {
  company = await createCompany({ planCode: 'fleet' });
  other = await createCompany({ planCode: 'fleet' });
  admin = await createUserWithRole(company.id, 'admin', { name: 'Audit Admin' });
  installer = await createUserWithRole(company.id, 'installer', { name: 'Audit Installer' });
  sales = await createUserWithRole(company.id, 'sales', { name: 'Audit Sales' });
  otherAdmin = await createUserWithRole(other.id, 'admin', { name: 'Other Admin' });
  tok.admin = await signInAs(admin);
  tok.installer = await signInAs(installer);
  tok.sales = await signInAs(sales);
  tok.otherAdmin = await signInAs(otherAdmin);
});

beforeEach(() => setRequestHeaders({ 'x-forwarded-for': ADDRESS }));

type Row = { id: number; company_id: number | null; actor_user_id: string | null; actor_label: string | null; action: string; target_label: string | null; detail: string | null; ip: string | null };

async function rows(companyId: number, action: string): Promise<Row[]> {
  return models().sequelize.query<Row>('SELECT id, company_id, actor_user_id, actor_label, action, target_label, detail, ip FROM audit_events WHERE company_id = :companyId AND action = :action ORDER BY id', {
    replacements: { companyId, action },
    type: QueryTypes.SELECT,
  });
}
const last = async (companyId: number, action: string) => (await rows(companyId, action)).at(-1);
const detailOf = (r: Row | undefined) => (r?.detail ? (JSON.parse(r.detail) as Record<string, unknown>) : {});

describe('address', () => {
  it('is the connection address Next puts in X-Forwarded-For, and not a client-sent chain', async () => {
    asUser(tok.admin);
    await callAction(createServiceProfile, { ...TEST_SERVICE_FORM, name: 'Address check service' });
    expect((await last(company.id, 'service.created'))?.ip).toBe(ADDRESS);
    // Two entries can only come from the client (Next adds the socket's only when none was sent).
    setRequestHeaders({ 'x-forwarded-for': '198.51.100.1, 203.0.113.99' });
    await callAction(createServiceProfile, { ...TEST_SERVICE_FORM, name: 'Chain check service' });
    const chain = await last(company.id, 'service.created');
    expect(chain?.target_label).toBe('Chain check service');
    expect(chain?.ip).toBeNull();
  });
});

describe('catalogue and prices', () => {
  it('adding, repricing and removing a dish each write a row with actor, address and the price change', async () => {
    asUser(tok.admin);
    const made = await callAction(createDish, { name: 'Audit 80 cm', diameterM: '0.8', efficiency: '0.68', hardwarePrice: '210', labourPrice: '90', active: 'on' });
    expect(made.state?.ok, JSON.stringify(made.state)).toBe(true);
    const id = (made.state as { data: { id: number } }).data.id;
    const created = await last(company.id, 'catalogue.dish_created');
    expect(created).toMatchObject({ actor_user_id: admin.id, actor_label: `Audit Admin <${admin.email}>`, target_label: 'Audit 80 cm', ip: ADDRESS });

    expect((await callAction(updateDish, { id, name: 'Audit 80 cm', diameterM: '0.8', efficiency: '0.68', hardwarePrice: '235.50', labourPrice: '90', active: 'on' })).state?.ok).toBe(true);
    const updated = await last(company.id, 'catalogue.dish_updated');
    expect(detailOf(updated)).toMatchObject({ dishId: id, hardwarePrice: { from: '210.00', to: '235.50' } });
    expect(detailOf(updated)).not.toHaveProperty('labourPrice');
    expect(updated?.ip).toBe(ADDRESS);

    expect((await callAction(deleteDish, { id })).state?.ok).toBe(true);
    expect(await last(company.id, 'catalogue.dish_deleted')).toMatchObject({ target_label: 'Audit 80 cm', ip: ADDRESS });
  });

  it('a refused edit (name taken) changes nothing and writes no row', async () => {
    asUser(tok.admin);
    const a = await callAction(createDish, { name: 'Audit A', diameterM: '0.6', efficiency: '0.65', hardwarePrice: '100', labourPrice: '50', active: 'on' });
    await callAction(createDish, { name: 'Audit B', diameterM: '0.6', efficiency: '0.65', hardwarePrice: '100', labourPrice: '50', active: 'on' });
    const before = (await rows(company.id, 'catalogue.dish_updated')).length;
    const id = (a.state as { data: { id: number } }).data.id;
    const refused = await callAction(updateDish, { id, name: 'Audit B', diameterM: '0.6', efficiency: '0.65', hardwarePrice: '999', labourPrice: '50', active: 'on' });
    expect(refused.state).toMatchObject({ ok: false, code: 'invalid_input' });
    expect((await rows(company.id, 'catalogue.dish_updated')).length).toBe(before);
    expect((await models().Dish.findByPk(id))?.hardwarePrice).toBe('100.00');
  });

  it('service profiles: edit and delete are logged; another company’s id is not found and logs nothing', async () => {
    asUser(tok.installer);
    const made = await callAction(createServiceProfile, { ...TEST_SERVICE_FORM, name: 'Audit bouquet' });
    const id = (made.state as { data: { id: number } }).data.id;
    expect((await callAction(updateServiceProfile, { ...TEST_SERVICE_FORM, id, name: 'Audit bouquet HD' })).state?.ok).toBe(true);
    expect(await last(company.id, 'service.updated')).toMatchObject({ target_label: 'Audit bouquet HD', actor_user_id: installer.id, ip: ADDRESS });
    const total = async () => (await rows(company.id, 'service.deleted')).length + (await rows(other.id, 'service.deleted')).length;
    const before = await total();
    asUser(tok.otherAdmin);
    expect((await callAction(deleteServiceProfile, { id })).state).toMatchObject({ ok: false, code: 'not_found' });
    expect(await total()).toBe(before);
    asUser(tok.installer);
    expect((await callAction(deleteServiceProfile, { id })).state?.ok).toBe(true);
    expect(await total()).toBe(before + 1);
  });
});

describe('uploads', () => {
  it('a saved price list is logged with its counts; a refused file writes neither file nor row', async () => {
    asUser(tok.admin);
    const before = (await rows(company.id, 'upload.confirmed')).length;
    const bad = await callAction(confirmCatalogueUpload, { kind: 'dish-catalogue', file: new File(['name,diameter_m\nNope,abc\n'], 'bad.csv') });
    expect(bad.state?.ok).toBe(false);
    expect((await rows(company.id, 'upload.confirmed')).length).toBe(before);
    const good = await callAction(confirmCatalogueUpload, {
      kind: 'dish-catalogue',
      file: new File(['name,diameter_m,efficiency,hardware_price,labour_price\nAudit upload 1.2,1.2,0.7,640,240\n'], 'prices-autumn.csv'),
    });
    expect(good.state?.ok, JSON.stringify(good.state)).toBe(true);
    const row = await last(company.id, 'upload.confirmed');
    expect(row).toMatchObject({ target_label: 'prices-autumn.csv', actor_user_id: admin.id, ip: ADDRESS });
    expect(detailOf(row)).toMatchObject({ kind: 'dish-catalogue', added: 1, updated: 0 });
  });
});

describe('archive and restore', () => {
  it('archiving and restoring write one row each; archiving an archived study writes none', async () => {
    asUser(tok.installer);
    const id = await testStudy(installer);
    expect((await callAction(archiveStudy, { id })).state?.ok).toBe(true);
    expect((await callAction(archiveStudy, { id })).state?.ok).toBe(true);
    const archived = (await rows(company.id, 'study.archived')).filter((r) => detailOf(r).studyId === id);
    expect(archived).toHaveLength(1);
    expect(archived[0]).toMatchObject({ actor_user_id: installer.id, ip: ADDRESS });
    expect((await callAction(unarchiveStudy, { id })).state?.ok).toBe(true);
    expect((await rows(company.id, 'study.restored')).filter((r) => detailOf(r).studyId === id)).toHaveLength(1);
  });
});

describe('links and decisions', () => {
  it('link creation and revocation by a salesperson, and the customer’s acceptance through the link, are logged', async () => {
    const { quoteId } = await draftQuote(installer);
    asUser(tok.sales);
    const made = await callAction(createShareLink, { quoteId });
    expect(made.state?.ok, JSON.stringify(made.state)).toBe(true);
    const linkId = (made.state as { data: { linkId: number } }).data.linkId;
    const created = await last(company.id, 'share_link.created');
    expect(created).toMatchObject({ actor_user_id: sales.id, ip: ADDRESS });
    expect(created?.target_label).toMatch(/^Q-\d{4,}$/);
    expect(detailOf(created)).toMatchObject({ quoteId, linkId });
    expect((await callAction(revokeShareLink, { quoteId, linkId })).state?.ok).toBe(true);
    expect(detailOf(await last(company.id, 'share_link.revoked'))).toMatchObject({ quoteId, linkId });

    const sent = await sentQuote(installer);
    const decided = await inRequest(null, () => callAction(decideQuote, { token: sent.token, decision: 'accept', name: 'Ottoline Marsh', confirm: 'on' }), { 'x-forwarded-for': '192.0.2.44', 'user-agent': 'customer phone' });
    expect(decided.state).toMatchObject({ ok: true });
    const accepted = await last(company.id, 'quote.accepted');
    expect(accepted).toMatchObject({ actor_user_id: null, actor_label: 'Ottoline Marsh (customer)', ip: '192.0.2.44' });
    expect(detailOf(accepted)).toMatchObject({ quoteId: sent.quoteId });
  });

  it('a refused decision (already decided) writes no second row', async () => {
    const sent = await sentQuote(installer);
    const headers = { 'x-forwarded-for': '192.0.2.45' };
    await inRequest(null, () => callAction(decideQuote, { token: sent.token, decision: 'decline', name: 'Bram Tollis' }), headers);
    const again = await inRequest(null, () => callAction(decideQuote, { token: sent.token, decision: 'accept', name: 'Bram Tollis', confirm: 'on' }), headers);
    expect(again.state).toMatchObject({ ok: false, code: 'conflict' });
    const mine = async (action: string) => (await rows(company.id, action)).filter((r) => detailOf(r).quoteId === sent.quoteId);
    expect(await mine('quote.declined')).toHaveLength(1);
    expect(await mine('quote.accepted')).toHaveLength(0);
  });
});

describe('transactions', () => {
  it('a row written inside a transaction that rolls back is gone with it', async () => {
    const marker = `rollback-${Date.now()}`;
    await expect(
      models().sequelize.transaction(async (t) => {
        await recordAudit({ companyId: company.id, actor: null, actorLabel: 'test' }, { action: 'catalogue.dish_created', target: marker }, t);
        throw new Error('the change failed after its audit row');
      }),
    ).rejects.toThrow('the change failed');
    const [{ n }] = await models().sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM audit_events WHERE target_label = :marker', { replacements: { marker }, type: QueryTypes.SELECT });
    expect(Number(n)).toBe(0);
  });
});

describe('CSV export', () => {
  const noParams = { params: Promise.resolve({}) };

  it('gives admins their company’s rows only, filtered, with formulas defused', async () => {
    asUser(tok.admin);
    await callAction(createServiceProfile, { ...TEST_SERVICE_FORM, name: '=HYPERLINK("x")' });
    asUser(tok.otherAdmin);
    await callAction(createServiceProfile, { ...TEST_SERVICE_FORM, name: 'Other company secret service' });

    asUser(tok.admin);
    const res = await exportCsv(apiRequest('/settings/audit/export?kind=catalogue'), noParams);
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toContain('text/csv');
    expect(res.headers.get('content-disposition')).toMatch(/attachment; filename="audit-log-\d{4}-\d{2}-\d{2}\.csv"/);
    const text = await res.text();
    const lines = text.replace(/^\uFEFF/, '').trim().split('\r\n');
    expect(lines[0]).toBe('time_utc,who,action,what,target,detail,address,device');
    expect(lines.length).toBeGreaterThan(3);
    expect(lines.slice(1).every((l) => /,(catalogue|service)\./.test(l))).toBe(true);
    expect(text).toContain(`"'=HYPERLINK(""x"")"`);
    expect(text).not.toContain('Other company secret service');
    expect(text).toContain(ADDRESS);

    const ranged = await (await exportCsv(apiRequest('/settings/audit/export?from=2001-01-01&to=2001-12-31'), noParams)).text();
    expect(ranged.replace(/^\uFEFF/, '').trim().split('\r\n')).toHaveLength(1);
    const byActor = await (await exportCsv(apiRequest(`/settings/audit/export?actor=${encodeURIComponent('Audit Installer')}`), noParams)).text();
    expect(byActor.replace(/^\uFEFF/, '').trim().split('\r\n').slice(1).every((l) => l.includes('Audit Installer'))).toBe(true);
  });

  it('refuses other roles (403) and a bad filter (422)', async () => {
    for (const t of [tok.installer, tok.sales]) {
      asUser(t);
      expect((await exportCsv(apiRequest('/settings/audit/export'), noParams)).status).toBe(403);
    }
    asUser(tok.admin);
    expect((await exportCsv(apiRequest('/settings/audit/export?from=2026-05-01&to=2026-04-01'), noParams)).status).toBe(422);
    expect((await exportCsv(apiRequest('/settings/audit/export?kind=everything'), noParams)).status).toBe(422);
  });

  it('walks a long log page by page (more rows than one read)', async () => {
    const big = await createCompany({ planCode: 'fleet' });
    const bigAdmin = await createUserWithRole(big.id, 'admin');
    const values = Array.from({ length: 1203 }, (_, i) => `(${big.id}, 'study.archived', 'Bulk ${i}', NOW())`).join(',');
    await models().sequelize.query(`INSERT INTO audit_events (company_id, action, target_label, created_at) VALUES ${values}`);
    asUser(await signInAs(bigAdmin));
    const text = await (await exportCsv(apiRequest('/settings/audit/export?kind=studies'), noParams)).text();
    const lines = text.replace(/^\uFEFF/, '').trim().split('\r\n');
    expect(lines).toHaveLength(1204);
    expect(new Set(lines).size).toBe(1204);
    expect(await countRows('audit_events', big.id)).toBe(1203);
  });
});

describe('a page the role lacks', () => {
  it('answers 403 (the role message), while another company’s quote still answers 404', async () => {
    asUser(tok.sales);
    expect(await callPage(() => requirePermission('quote.write'))).toEqual({ notFound: 403 });
    expect(await callPage(() => requirePermission('quote.read'))).toMatchObject({ value: { role: 'sales' } });
    const { quoteId } = await draftQuote(otherAdmin);
    expect(await callPage(() => QuotePage({ params: Promise.resolve({ id: String(quoteId) }) }))).toEqual({ notFound: 404 });
  });
});
