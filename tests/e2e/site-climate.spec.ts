import { mkdirSync } from 'node:fs';
import { test, expect, type Page } from '@playwright/test';
import { seriousViolations } from './support/axe';
import { signIn } from './support/sign-in';
import { DEMO_USERS } from '../../db/demo/accounts';
import { DEMO_SERVICES } from '../../db/demo/studies';

/**
 * Issue 9 in chromium: an installer types only a new customer, a new site's coordinates (altitude
 * blank, climate left on its default) and gets a study whose rain rate, rain height and altitude
 * name the ITU-R maps as their source, with gases, clouds, rain and scintillation at each dish's
 * outage and their total. An admin's profile made for a place far away then draws the warning
 * with the distance. Screenshots of the new study at 1280 and 390 px go to .local/screenshots/.
 */
const installer = DEMO_USERS.find((u) => u.role === 'installer' && u.company === 'quillfeather')!;
const admin = DEMO_USERS.find((u) => u.role === 'admin' && u.company === 'quillfeather')!;
const SHOTS = '.local/screenshots';
const stamp = () => `${Date.now().toString(36)}${Math.floor(Math.random() * 1e4)}`;

async function shoot(page: Page, name: string) {
  mkdirSync(SHOTS, { recursive: true });
  await page.setViewportSize({ width: 1280, height: 900 });
  await page.screenshot({ path: `${SHOTS}/site-climate-${name}-1280.png`, fullPage: true });
  await page.setViewportSize({ width: 390, height: 844 });
  // Charts redraw on a resize observer: wait until nothing is wider than the phone any more.
  await page.waitForFunction(() => Array.from(document.querySelectorAll('canvas')).every((c) => c.getBoundingClientRect().right <= window.innerWidth));
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
  await page.screenshot({ path: `${SHOTS}/site-climate-${name}-390.png`, fullPage: true });
  await page.setViewportSize({ width: 1280, height: 900 });
}

/** New customer and new site typed in, altitude blank; the climate select is left alone unless a profile is named. */
async function studyFromCoordinates(page: Page, id: string, o: { profile?: string } = {}) {
  await page.goto('/studies/new');
  await page.getByRole('radio', { name: 'New customer' }).check();
  await page.getByLabel('Customer name').fill(`Thornbury Orchard ${id}`);
  await page.getByLabel('Site name').fill('Cider barn');
  await page.getByLabel('Latitude').fill(`46°30'00"N`);
  await page.getByLabel('Longitude').fill('3 15 00 E');
  await expect(page.getByLabel('Altitude (m above sea level)')).toHaveValue('');
  const service = page.locator('select[name=serviceProfileId] option', { hasText: DEMO_SERVICES[0].name }).first();
  await page.getByLabel('Satellite service').selectOption((await service.getAttribute('value'))!);
  const climate = page.getByLabel('Rain climate');
  if (o.profile) {
    const option = page.locator('select[name=climateProfileId] option', { hasText: o.profile }).first();
    await climate.selectOption((await option.getAttribute('value'))!);
    // The form already says how far from the typed site the profile was made.
    await expect(page.getByText(/Made for a place 1,9\d\d km from this site: its rain figures may not describe it/)).toBeVisible();
  } else {
    await expect(climate.locator('option:checked')).toHaveText("From the site's coordinates (ITU-R maps)");
  }
  for (const name of ['Quill 120', 'Quill 150', 'Quill 180']) await page.getByRole('checkbox', { name: new RegExp(`^${name}\\b`) }).uncheck();
  await page.getByRole('button', { name: 'Compute study' }).click();
  await page.waitForURL(/\/studies\/\d+$/);
}

test('an installer gets a study from the site’s coordinates alone, every figure with its map source', async ({ page }) => {
  const id = stamp();
  await signIn(page, installer.email);
  await studyFromCoordinates(page, id);

  await expect(page.getByRole('heading', { level: 1 })).toContainText(`Thornbury Orchard ${id}`);
  const climate = page.getByRole('region', { name: 'Climate at the site' });
  await expect(climate).toContainText("Rain climate: From the site's coordinates (ITU-R maps).");
  await expect(climate.locator('div', { hasText: /^Rain rate exceeded 0\.01 % of the year/ })).toContainText(/[\d.]+ mm\/h\s*ITU-R P\.837-7 Annex 1 · from the ITU-R maps at the site/);
  await expect(climate.locator('div', { hasText: /^Rain height hR/ })).toContainText('ITU-R P.839-4: h0 + 0.36 km · from the ITU-R maps at the site');
  await expect(climate.locator('div', { hasText: /^Station altitude/ })).toContainText(/\d+ m\s*ITU-R P\.1511-1 · from the ITU-R maps at the site/);
  await expect(climate).toContainText(/Map data version [0-9a-f]{12}/);
  await expect(page.getByRole('region', { name: 'Site', exact: true })).toContainText('ITU-R P.1511-1 map at the site');

  // Gas, cloud, rain and scintillation at each dish's outage, and their total (the fade threshold).
  const causes = page.getByRole('table', { name: 'Attenuation at outage, by cause' });
  for (const head of ['Gases dB', 'Clouds dB', 'Rain dB', 'Scint. dB', 'Total dB']) await expect(causes.getByRole('columnheader', { name: head })).toBeVisible();
  const first = causes.getByRole('row').nth(1);
  await expect(first.getByRole('rowheader')).toContainText(/Quill \d+\s*at [\d.]+ % of the year/);
  const cells = first.getByRole('cell');
  await expect(cells).toHaveCount(5);
  for (let i = 0; i < 5; i++) await expect(cells.nth(i)).toHaveText(/^\d+\.\d\d/);
  await expect(causes).toContainText('= fade threshold');
  await expect(page.getByRole('img', { name: /Downlink total attenuation exceeded .* drawn with its parts: rain [\d.]+ dB, clouds [\d.]+ dB, gases [\d.]+ dB and scintillation [\d.]+ dB/ })).toBeVisible();
  await expect(page.getByText('Statistics, not guarantees')).toBeVisible();
  await expect(page.getByText(/Rain climate made for/)).toHaveCount(0);
  expect(await seriousViolations(page)).toEqual([]);
  await shoot(page, 'study');
});

test('a profile made for a place far from the site draws the warning with the distance', async ({ browser }) => {
  const id = stamp();
  const profile = `Far coast gauge ${id}`;
  const adminContext = await browser.newContext();
  const adminPage = await adminContext.newPage();
  await signIn(adminPage, admin.email);
  await adminPage.goto('/climate');
  const form = adminPage.getByRole('form', { name: 'Add a climate profile' });
  await form.getByLabel('Name').fill(profile);
  await form.getByLabel('R0.01 (mm/h)').fill('44');
  await form.getByLabel('Source of the figure').fill('Invented tipping-bucket gauge, demo');
  await form.getByLabel('Latitude of the place').fill(`49°06'N`);
  await expect(form.getByText('= 49.1° (49° 06′ 00.0″ N)')).toBeVisible();
  await form.getByLabel('Longitude of the place').fill('22.4 W');
  await form.getByRole('button', { name: 'Add climate profile' }).click();
  await expect(adminPage.getByRole('table', { name: 'Climate profiles' }).getByRole('row', { name: new RegExp(profile) })).toContainText('49° 06′ 00.0″ N');
  await adminContext.close();

  const context = await browser.newContext();
  const page = await context.newPage();
  await signIn(page, installer.email);
  await studyFromCoordinates(page, id, { profile });
  const warning = page.getByText(/was made for a place [\d,]+ km from this site/);
  await expect(page.getByText('Rain climate made for somewhere else')).toBeVisible();
  // 46.5° N 3.25° E to 49.1° N 22.4° W on a sphere of 6371 km: about 1 900 km.
  await expect(warning).toContainText(/“Far coast gauge [^”]+” was made for a place 1,9\d\d km from this site/);
  const climate = page.getByRole('region', { name: 'Climate at the site' });
  await expect(climate.locator('div', { hasText: /^Rain rate exceeded 0\.01 % of the year/ })).toContainText(new RegExp(`44\\.0 mm/h\\s*given in the profile · from profile “${profile}”`));
  await expect(climate.locator('div', { hasText: /^Rain height hR/ })).toContainText('from the ITU-R maps at the site');
  expect(await seriousViolations(page)).toEqual([]);
  await shoot(page, 'far-profile');
  await context.close();
});
