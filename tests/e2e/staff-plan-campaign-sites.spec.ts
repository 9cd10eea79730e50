import { test, expect, type Page } from '@playwright/test';
import { randomBytes } from 'node:crypto';
import { loadTestEnv } from '../support/test-env';
import { models } from '../../db/models';
import { signIn } from './support/sign-in';
import { seriousViolations } from './support/axe';

/**
 * Staff set a plan's sites per upgrade campaign on the plan form: the field shows the stored cap,
 * a value over 1 000 000 is refused on the field, a valid one is saved and listed in the catalogue.
 * The installer's campaigns list shows an upload that stopped arriving as stalled, with when it will
 * be marked failed. Screenshots at 1280 and 390 px in .local/screens.
 */
const id = randomBytes(4).toString('hex');
const SHOTS = '.local/screens';
let planId = 0;

test.beforeAll(async () => {
  // A hidden plan of our own (invented), so the demo plans stay as they are.
  loadTestEnv();
  const plan = await models().Plan.create({
    code: `e2e-sites-${id}`, name: `Relay ${id}`, kind: 'paid', monthlyPriceUsd: '39.00', seatLimit: 3, studiesPerMonth: 50, activeLinksLimit: 10, uploadsPerMonth: 5,
    campaignSitesLimit: 20_000, apiAccess: false, quoteBranding: false, isPublic: false, sortOrder: 99, trialDays: null, description: null, stripeProductId: null, stripePriceId: null,
  } as never);
  planId = plan.id;
});

async function shoot(page: Page, name: string) {
  for (const width of [1280, 390]) {
    await page.setViewportSize({ width, height: width === 390 ? 844 : 900 });
    await page.screenshot({ path: `${SHOTS}/${name}-${width}.png`, fullPage: true });
  }
  await page.setViewportSize({ width: 1280, height: 900 });
}

test('staff edit a plan’s sites per campaign', async ({ page }) => {
  await signIn(page, 'staff@fadeledger.example');
  await page.goto(`/plans/${planId}`);
  const field = page.getByLabel('Sites / campaign');
  await expect(field).toHaveValue('20000');
  await field.fill('1000001');
  await page.getByRole('button', { name: 'Save and sync' }).click();
  await expect(page.getByText('Sites per campaign must be at most 1,000,000.')).toBeVisible();
  await shoot(page, 'staff-plan-form-refused');
  await page.getByLabel('Sites / campaign').fill('250000');
  await page.getByRole('button', { name: 'Save and sync' }).click();
  await expect(page.getByText(`Plan Relay ${id} saved.`)).toBeVisible();
  expect((await models().Plan.findByPk(planId, { rejectOnEmpty: true })).campaignSitesLimit).toBe(250_000);
  expect(await seriousViolations(page)).toEqual([]);
  await shoot(page, 'staff-plan-form');
  await page.goto('/plans');
  const row = page.getByRole('row', { name: new RegExp(`Relay ${id}`) });
  await expect(row.getByRole('cell', { name: '250,000' })).toBeVisible();
});

test('an upload that stopped arriving reads as stalled on the campaigns list', async ({ page }) => {
  const { sequelize } = models();
  const [company] = await sequelize.query<{ id: number }>("SELECT c.id FROM companies c JOIN memberships m ON m.company_id = c.id JOIN users u ON u.id = m.user_id WHERE u.email = 'installer@quillfeather.example' LIMIT 1", { type: 'SELECT' as never });
  const quiet = new Date(Date.now() - 3 * 60_000);
  await sequelize.query(
    `INSERT INTO campaigns (company_id, status, filename, service_name, climate_name, climate_override, target_availability_percent, inputs, rows_total, created_at, updated_at)
     VALUES (:companyId, 'receiving', :filename, 'Invented service', 'each site', 0, 99.9, '{}', 48000, :quiet, :quiet)`,
    { replacements: { companyId: company.id, filename: `subscribers-${id}.csv`, quiet } },
  );
  await signIn(page, 'installer@quillfeather.example');
  await page.goto('/campaigns');
  const row = page.getByRole('row', { name: new RegExp(`subscribers-${id}`) });
  await expect(row.getByText(/stalled: nothing received since \d\d:\d\d UTC \(48,000 rows so far\); it will be marked failed at about \d\d:\d\d UTC unless it resumes/)).toBeVisible();
  await shoot(page, 'campaigns-stalled-upload');
  // Leave no stalled campaign behind in the demo company.
  await sequelize.query('DELETE FROM campaigns WHERE filename = :filename', { replacements: { filename: `subscribers-${id}.csv` } });
});
