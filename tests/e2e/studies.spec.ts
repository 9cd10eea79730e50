import { test, expect } from '@playwright/test';
import { seriousViolations } from './support/axe';
import { signIn } from './support/sign-in';
import { fillNewCustomerStudy } from './support/new-study-form';
import { DEMO_USERS } from '../../db/demo/accounts';
import { DEMO_SERVICES, DEMO_CLIMATES } from '../../db/demo/studies';

/**
 * Studies in chromium against the running app and the seeded demo scenario (db/demo/studies.ts):
 * the installer builds a study from the form — a new customer and a site typed in DMS — and sees
 * the per-dish table, the charts and the cautions; the same zod schema refuses a bad form in the
 * browser before anything is sent; the study pages have no serious accessibility violations.
 */
const installer = DEMO_USERS.find((u) => u.role === 'installer' && u.company === 'quillfeather')!;
const sales = DEMO_USERS.find((u) => u.role === 'sales' && u.company === 'quillfeather')!;
const stamp = () => `${Date.now().toString(36)}${Math.floor(Math.random() * 1e4)}`;


test('an installer builds a study from the form and reads the trade-off', async ({ page }) => {
  // Two axe passes over the study page (table and phone cards both in the DOM) and the list: 60 s ran out under load.
  test.setTimeout(150_000);
  const id = stamp();
  await signIn(page, installer.email);
  await page.goto('/studies/new');

  // The browser runs the action's zod schema first: an empty form is refused without a round trip.
  await page.getByRole('radio', { name: 'New customer' }).check();
  await page.getByLabel('Latitude').fill('12 75 0 N');
  await expect(page.getByText('Minutes must be below 60.')).toBeVisible();
  const requests: string[] = [];
  page.on('request', (r) => r.method() === 'POST' && requests.push(r.url()));
  await page.getByRole('button', { name: 'Compute study' }).click();
  await expect(page.getByText('Customer name is required.')).toBeVisible();
  await expect(page.getByText('Choose a service profile.')).toBeVisible();
  await expect(page.getByRole('alert').filter({ hasText: 'Please check the highlighted fields.' })).toBeVisible();
  expect(requests).toEqual([]);

  await page.getByLabel('Customer name').fill(`Wrenfold Tearoom ${id}`);
  await page.getByLabel('Site name').fill('Tearoom back wall');
  await page.getByLabel('Latitude').fill(`51°30'36"N`);
  await expect(page.getByText('= 51.51° (51° 30′ 36.0″ N)')).toBeVisible();
  await page.getByLabel('Longitude').fill('2 07 12 W');
  await page.getByLabel('Altitude (m above sea level)').fill('85');
  const optionValue = (select: string, text: string) => page.locator(`select[name=${select}] option`, { hasText: text }).first().getAttribute('value');
  await page.getByLabel('Satellite service').selectOption((await optionValue('serviceProfileId', DEMO_SERVICES[0].name))!);
  await page.getByLabel('Rain climate').selectOption((await optionValue('climateProfileId', DEMO_CLIMATES[0].name))!);
  // Compare three dishes only.
  for (const name of ['Quill 100', 'Quill 120', 'Quill 150', 'Quill 180']) await page.getByRole('checkbox', { name: new RegExp(`^${name}\\b`) }).uncheck();
  await page.getByLabel('Target availability (%)').fill('99.95');
  await page.getByRole('button', { name: 'Compute study' }).click();

  await page.waitForURL(/\/studies\/\d+$/);
  await expect(page.getByRole('heading', { level: 1 })).toContainText(`Wrenfold Tearoom ${id}`);
  const table = page.getByRole('table', { name: 'Trade-off per dish' });
  await expect(table.getByRole('rowheader')).toHaveCount(3);
  await expect(table.getByRole('rowheader').first()).toContainText('60 cm (23.6 in)');
  await expect(table).toContainText('%');
  await expect(page.getByRole('heading', { name: 'Recommendation' })).toBeVisible();
  await expect(page.getByRole('heading', { name: 'Pointing' })).toBeVisible();
  await expect(page.getByText('ITU-R P.837-7 Annex 1 from monthly rainfall and temperature normals')).toBeVisible();
  await expect(page.getByRole('img', { name: /Outage minutes per year against dish diameter/ })).toBeVisible();
  // Since the site's own climate the curve is the total attenuation (gases, clouds, rain, scintillation).
  await expect(page.getByRole('img', { name: /Downlink total attenuation exceeded/ })).toBeVisible();
  await expect(page.getByText('Statistics, not guarantees')).toBeVisible();
  const quote = page.getByRole('link', { name: 'Create quote' });
  await expect(quote).toHaveAttribute('href', /^\/quotes\/new\?study=\d+&option=\d$/);
  expect(await seriousViolations(page)).toEqual([]);

  // The new study is first in the list (fetched with SWR), and searchable.
  await page.goto('/studies');
  await page.getByRole('searchbox').fill(`Wrenfold Tearoom ${id}`);
  await expect(page.getByRole('table', { name: 'Studies' }).getByRole('link', { name: new RegExp(`Wrenfold Tearoom ${id}`) })).toBeVisible();
  expect(await seriousViolations(page)).toEqual([]);
});

test('the form’s new customer is refused when the company has one of that name, and the tick box adds a different one', async ({ page }, info) => {
  test.setTimeout(150_000);
  const name = `Quarry Lane Kennels ${stamp()}`;
  await signIn(page, installer.email);
  const fillStudy = async (customer: string) => {
    await fillNewCustomerStudy(page, { customer, site: 'Kennel roof', latitude: '51.2', longitude: '-1.9', altitudeM: '120', service: DEMO_SERVICES[0].name });
    await page.getByRole('button', { name: 'Compute study' }).click();
  };
  await fillStudy(name);
  await page.waitForURL(/\/studies\/\d+$/);

  // The same name again, typed in another case and spacing: refused, the existing customer named.
  await fillStudy(`  ${name.toUpperCase()} `);
  const notice = page.getByText('This customer may already exist');
  await expect(notice).toBeVisible();
  await expect(page.getByText(`${name} is already one of your customers`).first()).toBeVisible();
  expect(page.url()).toMatch(/\/studies\/new$/);
  expect(await seriousViolations(page)).toEqual([]);
  await page.setViewportSize({ width: 1280, height: 900 });
  await page.screenshot({ path: info.outputPath('study-form-duplicate-customer-1280.png'), fullPage: true });

  await page.getByRole('checkbox', { name: 'A different customer with the same name' }).check();
  await page.getByRole('button', { name: 'Compute study' }).click();
  await page.waitForURL(/\/studies\/\d+$/);
  await expect(page.getByRole('heading', { level: 1 })).toContainText(name.toUpperCase().trim());
});

test('sales reads studies but has no form, and the pages pass axe', async ({ page }) => {
  await signIn(page, sales.email);
  await page.goto('/studies');
  await expect(page.getByRole('table', { name: 'Studies' }).getByRole('link').first()).toBeVisible();
  await expect(page.getByRole('link', { name: 'New study' })).toHaveCount(0);
  expect(await seriousViolations(page)).toEqual([]);
  await page.getByRole('table', { name: 'Studies' }).getByRole('link').first().click();
  await page.waitForURL(/\/studies\/\d+$/);
  await expect(page.getByRole('table', { name: 'Trade-off per dish' })).toBeVisible();
  await expect(page.getByRole('button', { name: /Re-run/ })).toHaveCount(0);
  expect(await seriousViolations(page)).toEqual([]);
  // The page itself refuses (the server check, not only the hidden button).
  expect((await page.goto('/studies/new'))?.status()).toBe(403);
  await expect(page.getByRole('heading', { name: 'Not available to your role' })).toBeVisible();
  await expect(page.getByRole('form', { name: 'New study' })).toHaveCount(0);
});

test('the setup pages pass axe for an admin', async ({ page }) => {
  // Seven pages, each a full axe pass (5–9 s apiece on a loaded 2-core machine): the default
  // 60 s per test measured the machine's load, not the pages.
  test.setTimeout(240_000);
  const admin = DEMO_USERS.find((u) => u.role === 'admin' && u.company === 'quillfeather')!;
  await signIn(page, admin.email);
  for (const path of ['/dashboard', '/sites', '/customers', '/dishes', '/climate', '/services', '/studies/new']) {
    await page.goto(path);
    await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
    expect(await seriousViolations(page), path).toEqual([]);
  }
});
