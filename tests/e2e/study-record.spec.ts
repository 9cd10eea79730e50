import { test, expect, type Page } from '@playwright/test';
import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { seriousViolations } from './support/axe';
import { signIn } from './support/sign-in';
import { DEMO_USERS } from '../../db/demo/accounts';

/**
 * The study as the installer's record (issue 11): at a 1 280 px desktop every column the
 * installer decides by fits without a sideways scroll; on a 390 px phone each dish is a card with
 * outage, price and the quote link first; magnetic azimuth beside true azimuth; the study PDF
 * downloads and says what the page says (read back with poppler's pdftotext); print hides the
 * navigation and buttons; "Use my location" fills the site form or says why it cannot.
 * Screenshots go to .local/playwright-results for people to look at.
 */
const installer = DEMO_USERS.find((u) => u.role === 'installer' && u.company === 'quillfeather')!;
const TWO_WAY = 'Brindlewick barn — two-way broadband';
const SHOTS = '.local/playwright-results';

async function openStudy(page: Page, title: string) {
  await page.goto('/studies');
  await page.getByRole('searchbox').fill(title);
  await page.getByRole('table', { name: 'Studies' }).getByRole('link', { name: title }).first().click();
  await page.waitForURL(/\/studies\/\d+$/);
  await expect(page.getByRole('heading', { level: 1 })).toContainText(title);
}

test.describe('at 1 280 px', () => {
  test.use({ viewport: { width: 1280, height: 900 } });

  test('the two-way table fits, pointing shows magnetic azimuth, and the PDF downloads with the same words', async ({ page }) => {
    test.setTimeout(180_000);
    await signIn(page, installer.email);
    await openStudy(page, TWO_WAY);

    const table = page.getByRole('table', { name: 'Trade-off per dish' });
    await expect(table).toBeVisible();
    // No sideways scroll inside the table's box, and the deciding columns are all on screen.
    const box = page.getByTestId('options-table').locator('> div');
    const { scrollWidth, clientWidth } = await box.evaluate((el) => ({ scrollWidth: el.scrollWidth, clientWidth: el.clientWidth }));
    expect(scrollWidth).toBeLessThanOrEqual(clientWidth);
    for (const name of ['Dish', 'Margin dB', 'Availability (two-way)', 'Outage / year', 'Worst month', 'Price', /Outage saved/]) {
      const header = table.getByRole('columnheader', { name, exact: typeof name === 'string' });
      await expect(header).toBeVisible();
      const b = (await header.boundingBox())!;
      expect(b.x + b.width).toBeLessThanOrEqual(1280);
    }
    const quotes = table.getByRole('link', { name: /^Quote the/ });
    expect(await quotes.count()).toBeGreaterThan(0);
    const lastQuote = (await quotes.last().boundingBox())!;
    expect(lastQuote.x + lastQuote.width).toBeLessThanOrEqual(1280);
    // The link budget sits on its own line; the phone cards are not shown at this width.
    await expect(table.getByText('Uplink margin').first()).toBeVisible();
    await expect(page.getByTestId('options-cards')).toBeHidden();

    // Pointing: true and magnetic azimuth, the declination and the model named, the figure described.
    await expect(page.getByText('Azimuth (true)')).toBeVisible();
    const magnetic = page.locator('dt', { hasText: 'Azimuth (magnetic, for a compass)' });
    await expect(magnetic).toBeVisible();
    await expect(magnetic.locator('xpath=following-sibling::dd')).toHaveText(/^\d{1,3}\.\d°$/);
    await expect(page.getByText(/Magnetic declination \d+\.\d° [EW] at the site on .* from the World Magnetic Model 2025 \(WMM2025\), epoch 2025\.0/)).toBeVisible();
    await expect(page.getByRole('img', { name: /Look direction: .*° from true north .*° on a compass/ })).toBeVisible();
    await expect(page.getByRole('img', { name: /Elevation: the dish looks .*° above the horizon/ })).toBeVisible();
    // Plain words instead of the unit price per yearly minute and the house convention.
    await expect(page.getByText(/of extra price for each minute a year it cuts/)).toHaveCount(await page.getByText('Best value:').count());
    await expect(page.getByText(/our rule of thumb: the first dish reaching 90 % of the largest saving/)).toBeVisible();
    await expect(page.getByText('FadeLedger convention')).toHaveCount(0);
    await page.screenshot({ path: `${SHOTS}/study-record-1280.png`, fullPage: true });
    expect(await seriousViolations(page)).toEqual([]);

    // The PDF: a real file, and its words.
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Download PDF' }).click()]);
    expect(download.suggestedFilename()).toMatch(/^study-\d+.*\.pdf$/);
    const file = await download.path();
    const bytes = readFileSync(file);
    expect(bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const words = execFileSync('pdftotext', [file, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ');
    expect(words).toContain(TWO_WAY.replace('—', '-').slice(0, 15));
    for (const w of ['Inputs', 'Pointing', 'Azimuth (magnetic)', 'World Magnetic Model 2025', 'Climate and its sources', 'Dish by dish', 'Outage against dish size', 'Predictions are statistics, not guarantees', 'Quill 60', 'Quill 180', 'This terminal transmits']) {
      expect(words).toContain(w);
    }

    // Print: no navigation, no buttons, the whole table.
    await page.emulateMedia({ media: 'print' });
    await expect(page.getByRole('navigation', { name: 'Main' })).toBeHidden();
    await expect(page.getByRole('link', { name: 'Download PDF' })).toBeHidden();
    await expect(page.getByRole('link', { name: 'Create quote' })).toBeHidden();
    await expect(table).toBeVisible();
    await page.pdf({ path: `${SHOTS}/study-record-print.pdf`, format: 'A4', printBackground: true });
    await page.emulateMedia({ media: 'screen' });
  });
});

test.describe('at 390 px', () => {
  test.use({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });

  test('each dish is a card with outage, price and the quote link first', async ({ page }) => {
    test.setTimeout(120_000);
    await signIn(page, installer.email);
    await openStudy(page, TWO_WAY);
    const cards = page.getByTestId('options-cards').getByRole('listitem');
    expect(await cards.count()).toBe(7);
    await expect(page.getByRole('table', { name: 'Trade-off per dish' })).toBeHidden();
    // The recommended card (it has a quote link) reads outage, price and quote before the rest.
    const card = cards.filter({ has: page.getByTestId('card-quote') }).first();
    const top = async (loc: ReturnType<Page['locator']>) => (await loc.boundingBox())!;
    const quote = await top(card.getByTestId('card-quote'));
    const outage = await top(card.getByTestId('card-outage'));
    const price = await top(card.getByTestId('card-price'));
    const availability = await top(card.getByText(/^Availability/));
    expect(quote.y).toBeLessThan(outage.y);
    expect(outage.y).toBeLessThan(availability.y);
    expect(price.y).toBeLessThan(availability.y);
    expect(quote.x + quote.width).toBeLessThanOrEqual(390);
    await expect(card.getByTestId('card-outage')).toContainText(/min|h|d/);
    await expect(card.getByTestId('card-price')).toContainText('$');
    // The page itself does not scroll sideways.
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await expect(page.locator('dt', { hasText: 'Azimuth (magnetic, for a compass)' })).toBeVisible();
    await page.screenshot({ path: `${SHOTS}/study-record-390.png`, fullPage: true });
    expect(await seriousViolations(page)).toEqual([]);
  });

  test('"Use my location" fills the site coordinates, and says so when the browser refuses', async ({ browser }) => {
    const allowed = await browser.newContext({ viewport: { width: 390, height: 844 }, permissions: ['geolocation'], geolocation: { latitude: 47.123456, longitude: 2.654321, accuracy: 12 } });
    const page = await allowed.newPage();
    await signIn(page, installer.email);
    await page.goto('/sites');
    const form = page.getByRole('form', { name: 'Add a site' });
    await form.getByRole('button', { name: 'Use my location' }).click();
    await expect(form.getByLabel('Latitude')).toHaveValue('47.123456');
    await expect(form.getByLabel('Longitude')).toHaveValue('2.654321');
    await expect(form.getByText('accurate to about 12 m')).toBeVisible();
    await page.screenshot({ path: `${SHOTS}/site-form-location-390.png`, fullPage: false });
    expect(await seriousViolations(page)).toEqual([]);
    await allowed.close();

    const refused = await browser.newContext({ viewport: { width: 390, height: 844 }, permissions: [] });
    const page2 = await refused.newPage();
    await signIn(page2, installer.email);
    await page2.goto('/sites');
    const form2 = page2.getByRole('form', { name: 'Add a site' });
    await form2.getByRole('button', { name: 'Use my location' }).click();
    await expect(form2.getByText(/Location was refused|could not find its position|took too long/)).toBeVisible({ timeout: 25_000 });
    await expect(form2.getByLabel('Latitude')).toHaveValue('');
    await refused.close();
  });
});
