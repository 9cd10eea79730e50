import { test, expect, type Page } from '@playwright/test';
import { seriousViolations } from './support/axe';
import { signIn } from './support/sign-in';
import { fillNewCustomerStudy } from './support/new-study-form';
import { DEMO_USERS } from '../../db/demo/accounts';
import { DEMO_SERVICES } from '../../db/demo/studies';

/**
 * The installer's study workflow in chromium at a desktop (1280 px) and a phone (390 px) width,
 * against the seeded demo scenario: edit a study's inputs and save revision 2 with a changed
 * target (after seeing the list of changes); the re-run asks first; a study comparing a TV and a
 * two-way Ka service shows both tables and the dish that meets every target. Screenshots go to
 * .local/screens/ for a person to look at.
 */
const installer = DEMO_USERS.find((u) => u.role === 'installer' && u.company === 'quillfeather')!;
const stamp = () => `${Date.now().toString(36)}${Math.floor(Math.random() * 1e4)}`;
const [tv, ka] = DEMO_SERVICES;
const WIDTHS = [
  { name: 'desktop', width: 1280, height: 900 },
  { name: 'phone', width: 390, height: 844 },
] as const;

/** A new customer and site typed in, three dishes, the given services; returns on the study page. */
async function newStudy(page: Page, customer: string, compareWithKa: boolean) {
  await fillNewCustomerStudy(page, { customer, site: 'Mill loft gable', latitude: '50.8712', longitude: '-1.2405', service: tv.name });
  if (compareWithKa) await page.getByRole('checkbox', { name: new RegExp(ka.name) }).check();
  for (const name of ['Quill 75', 'Quill 100', 'Quill 150', 'Quill 180']) await page.getByRole('checkbox', { name: new RegExp(`^${name}\\b`) }).uncheck();
  await page.getByLabel('Target availability (%)').fill('99.9');
  await page.getByRole('button', { name: 'Compute study' }).click();
  await page.waitForURL(/\/studies\/\d+$/);
}

for (const size of WIDTHS) {
  test.describe(`at ${size.width} px`, () => {
    test.use({ viewport: { width: size.width, height: size.height } });

    test('edit a study’s inputs and save revision 2 with a changed target', async ({ page }) => {
      test.setTimeout(180_000);
      const customer = `Harrowgate Mill ${stamp()}`;
      await signIn(page, installer.email);
      await newStudy(page, customer, false);
      const firstUrl = page.url();
      await expect(page.getByText(/target 99\.9 %/).first()).toBeVisible();

      // The plain re-run asks first and names what it refreshes; cancelling makes nothing.
      await page.getByRole('button', { name: 'Re-run with today’s data' }).click();
      const dialog = page.getByRole('dialog', { name: /Re-run this study as revision 2\?/ });
      await expect(dialog).toBeVisible();
      await expect(dialog).toContainText('service profile as it is now');
      await expect(dialog).toContainText('dish sizes and prices');
      await expect(dialog).toContainText('climate data');
      await expect(dialog).toContainText('engine version');
      await page.screenshot({ path: `.local/screens/rerun-dialog-${size.width}.png` });
      await dialog.getByRole('button', { name: 'Cancel' }).click();
      await expect(dialog).toBeHidden();
      expect(page.url()).toBe(firstUrl);

      await page.getByRole('link', { name: 'Edit inputs' }).click();
      await page.waitForURL(/\/studies\/\d+\/edit$/);
      await expect(page.getByRole('heading', { level: 1, name: 'Edit inputs' })).toBeVisible();
      // Prefilled from the stored study.
      await expect(page.getByLabel('Target availability (%)')).toHaveValue('99.9');
      await expect(page.getByRole('checkbox', { name: /^Quill 60\b/ })).toBeChecked();
      await expect(page.getByRole('checkbox', { name: /^Quill 75\b/ })).not.toBeChecked();
      await expect(page.getByText('No input changed.')).toBeVisible();

      await page.getByLabel('Target availability (%)').fill('99.95');
      const changes = page.getByRole('list', { name: 'Changed inputs' });
      await expect(changes).toContainText('Target availability: 99.9 %');
      await expect(changes).toContainText('99.95 %');
      expect(await seriousViolations(page)).toEqual([]);
      await page.screenshot({ path: `.local/screens/edit-inputs-${size.width}.png`, fullPage: true });

      await page.getByRole('button', { name: 'Save as revision 2' }).click();
      await page.waitForURL((url) => /\/studies\/\d+$/.test(url.pathname) && url.href !== firstUrl);
      await expect(page.getByText(/revision 2/).first()).toBeVisible();
      await expect(page.getByText(/target 99\.95 %/).first()).toBeVisible();
      await expect(page.getByRole('heading', { name: 'Recommendation' })).toBeVisible();
      await expect(page.getByText(/Revisions: 1, 2/)).toBeVisible();
      expect(await seriousViolations(page)).toEqual([]);
      await page.screenshot({ path: `.local/screens/revision-2-${size.width}.png` });

      // Revision 1 is still there as it was.
      await page.goto(firstUrl);
      await expect(page.getByText(/target 99\.9 %/).first()).toBeVisible();
    });

    test('a study comparing a TV and a two-way Ka service', async ({ page }) => {
      test.setTimeout(180_000);
      const customer = `Pellory Farm ${stamp()}`;
      await signIn(page, installer.email);
      await newStudy(page, customer, true);

      await expect(page.getByRole('heading', { name: 'One dish for every service' })).toBeVisible();
      await expect(page.getByRole('list', { name: 'Smallest dish per service' }).getByRole('listitem')).toHaveCount(2);
      await expect(page.getByRole('heading', { name: new RegExp(`Service 1 of 2: ${tv.name}`) })).toBeVisible();
      await expect(page.getByRole('heading', { name: new RegExp(`Service 2 of 2: ${ka.name}`) })).toBeVisible();
      // A table per service from 1 024 px; below that a list of dish cards per service.
      if (size.width >= 1024) {
        const tables = page.getByRole('table', { name: 'Trade-off per dish' });
        await expect(tables).toHaveCount(2);
        await expect(tables.nth(0).getByRole('rowheader')).toHaveCount(3);
        await expect(tables.nth(1).getByRole('rowheader')).toHaveCount(3);
      } else {
        const cards = page.getByRole('list', { name: 'Trade-off per dish' });
        await expect(cards).toHaveCount(2);
        await expect(cards.nth(0).getByRole('listitem')).toHaveCount(3);
        await expect(cards.nth(1).getByRole('listitem')).toHaveCount(3);
      }
      await expect(page.getByRole('img', { name: /Outage minutes per year against dish diameter, by service/ })).toBeVisible();
      await expect(page.getByRole('img', { name: /by service/ }).nth(1)).toBeVisible();
      // Each table quotes its own service's study row.
      const quoteLinks = await page.locator('a[href^="/quotes/new?study="]').evaluateAll((as) => [...new Set(as.map((a) => new URL((a as HTMLAnchorElement).href).searchParams.get('study')))]);
      expect(quoteLinks.length).toBe(2);
      expect(await seriousViolations(page)).toEqual([]);
      await page.screenshot({ path: `.local/screens/two-services-${size.width}.png`, fullPage: true });

      // The edit form opens with both services.
      await page.getByRole('link', { name: 'Edit inputs' }).click();
      await expect(page.getByRole('checkbox', { name: new RegExp(ka.name) })).toBeChecked();
      await expect(page.getByText('No input changed.')).toBeVisible();
    });
  });
}
