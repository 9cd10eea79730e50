import { test, expect } from '@playwright/test';
import fs from 'node:fs';
import { signIn } from './support/sign-in';
import { seriousViolations } from './support/axe';

/**
 * An upgrade campaign as an installer runs it: upload a sites file on /campaigns, land on the
 * campaign's page, watch the progress (polled, no reload) reach 100 %, read the summary and
 * download the result file. Needs a worker: docker-local/test.sh starts one. Sites are invented.
 */
const SITES = 600;
function sitesFile(): string {
  const lines = ['site_ref,latitude,longitude,altitude_m,current_dish_cm'];
  for (let i = 0; i < SITES; i++) lines.push(`E2E-${i},${(44 + (i % 60) / 10).toFixed(2)},${(-2 + (i % 45) / 10).toFixed(2)},${i % 3 === 0 ? '' : 120},${[45, 60, 80][i % 3]}`);
  lines.push('E2E-BAD,not-a-latitude,2.1,100,60');
  return lines.join('\n') + '\n';
}

test('upload a campaign, watch it reach 100 % and download the result file', async ({ page }, info) => {
  test.setTimeout(240_000);
  await page.setViewportSize({ width: 1280, height: 900 });
  await signIn(page, 'installer@quillfeather.example');
  await page.goto('/campaigns');
  await expect(page.getByRole('heading', { name: 'Upgrade campaigns' })).toBeVisible();
  await page.getByLabel('Sites file (CSV)').setInputFiles({ name: 'spring-upgrades.csv', mimeType: 'text/csv', buffer: Buffer.from(sitesFile()) });
  await page.getByLabel('Service').selectOption({ index: 1 });
  await page.getByRole('button', { name: 'Start the campaign' }).click();
  await page.waitForURL(/\/campaigns\/\d+$/, { timeout: 60_000 });
  await expect(page.getByRole('heading', { name: 'spring-upgrades.csv' })).toBeVisible();
  const url = page.url();

  // The percent moves without a reload (SWR polling) until every site is computed.
  await expect(page.getByTestId('campaign-percent')).toHaveText('100 %', { timeout: 180_000 });
  expect(page.url()).toBe(url);
  await expect(page.getByTestId('campaign-status')).toHaveText('done');
  await expect(page.getByTestId('campaign-sites-done')).toHaveText(SITES.toLocaleString('en-US'));
  await expect(page.getByText(/Line 602, latitude:/)).toBeVisible();
  await expect(page.getByRole('heading', { name: 'Recommended dish mix' })).toBeVisible();
  await expect(page.getByRole('heading', { name: 'Outage minutes per year, now and after the upgrades' })).toBeVisible();
  await expect(page.getByTestId('campaign-total-total')).toHaveText(/^\$[\d,]+\.\d\d$/);
  await page.screenshot({ path: info.outputPath('campaign-1280.png'), fullPage: true });

  const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Download all results (CSV)' }).click()]);
  expect(download.suggestedFilename()).toBe('spring-upgrades-upgrades.csv');
  const text = fs.readFileSync((await download.path())!, 'utf8');
  const lines = text.trim().split('\r\n');
  expect(lines[0]).toMatch(/^line,site_ref,current_dish,current_dish_cm,/);
  expect(lines).toHaveLength(1 + SITES + 1);
  expect(lines.filter((l) => l.includes('current 80 cm dish (not in the catalogue; 65 % efficiency assumed)')).length).toBeGreaterThan(0);
  expect(lines[lines.length - 1]).toMatch(/^602,E2E-BAD,.*not computed: Line 602, latitude:/);

  expect(await seriousViolations(page)).toEqual([]);
  await page.setViewportSize({ width: 390, height: 844 });
  await page.reload();
  await expect(page.getByTestId('campaign-percent')).toHaveText('100 %');
  await page.screenshot({ path: info.outputPath('campaign-390.png'), fullPage: true });
  await page.goto('/campaigns');
  await expect(page.getByRole('link', { name: 'spring-upgrades.csv' }).first()).toBeVisible();
  await page.screenshot({ path: info.outputPath('campaigns-390.png'), fullPage: true });
});

test('cancelling asks first, and the summary of a cancelled campaign speaks only of the sites computed', async ({ page }) => {
  test.setTimeout(240_000);
  // Big enough that the worker is still busy when the cancel is confirmed, with one bad line.
  const lines = ['site_ref,latitude,longitude,current_dish_cm', 'E2E-C-BAD,ninety,2.1,60'];
  for (let i = 0; i < 60_000; i++) lines.push(`E2E-C-${i},${(44 + (i % 60) / 10).toFixed(2)},${(-2 + (i % 45) / 10).toFixed(2)},${[45, 60, 80][i % 3]}`);
  await page.setViewportSize({ width: 390, height: 844 });
  await signIn(page, 'installer@quillfeather.example');
  await page.goto('/campaigns');
  // Starting without a file or a service marks the box and moves the focus there; the target typed stays.
  await page.getByLabel('Target availability (%)').fill('99.95');
  await page.getByRole('button', { name: 'Start the campaign' }).click();
  await expect(page.getByLabel('Sites file (CSV)')).toBeFocused();
  await expect(page.getByLabel('Sites file (CSV)')).toHaveAttribute('aria-invalid', 'true');
  await expect(page.getByLabel('Sites file (CSV)')).toHaveAccessibleDescription('Choose a CSV file of customer sites.');
  await page.getByLabel('Sites file (CSV)').setInputFiles({ name: 'to-cancel.csv', mimeType: 'text/csv', buffer: Buffer.from('site_ref,latitude,longitude,current_dish_cm\n') });
  await page.getByRole('button', { name: 'Start the campaign' }).click();
  await expect(page.getByLabel('Service')).toBeFocused();
  await expect(page.getByLabel('Service')).toHaveAttribute('aria-invalid', 'true');
  await expect(page.getByLabel('Target availability (%)')).toHaveValue('99.95');
  await page.getByLabel('Sites file (CSV)').setInputFiles({ name: 'to-cancel.csv', mimeType: 'text/csv', buffer: Buffer.from(lines.join('\n') + '\n') });
  await page.getByLabel('Service').selectOption({ index: 1 });
  await page.getByRole('button', { name: 'Start the campaign' }).click();
  await page.waitForURL(/\/campaigns\/\d+$/, { timeout: 60_000 });

  // The bad line is named once by its axis, quoted as typed.
  await expect(page.getByRole('heading', { name: /^Lines left out: problems in the file/ })).toBeVisible();
  await expect(page.getByText('Line 2, latitude: "ninety" is not a number.')).toBeVisible();

  // A first press only asks; "Keep" leaves it running.
  await page.getByRole('button', { name: 'Cancel the campaign' }).click();
  await expect(page.getByText('Stop computing the remaining sites? This cannot be undone.')).toBeVisible();
  await expect(page.getByRole('button', { name: 'Stop the campaign' })).toBeFocused();
  await page.getByRole('button', { name: 'Keep' }).click();
  await expect(page.getByRole('button', { name: 'Cancel the campaign' })).toBeFocused();
  await expect(page.getByTestId('campaign-status')).not.toHaveText('cancelled');
  await page.getByRole('button', { name: 'Cancel the campaign' }).click();
  await page.getByRole('button', { name: 'Stop the campaign' }).click();
  await expect(page.getByTestId('campaign-status')).toHaveText('cancelled', { timeout: 30_000 });
  await page.reload();

  // Either nothing was computed yet (and nothing is summarised), or the summary says "before the cancel".
  const nothing = page.getByText('Nothing to summarise');
  const partial = page.getByRole('heading', { name: 'Summary of the sites computed before the campaign was cancelled' });
  await expect(nothing.or(partial)).toBeVisible();
  await expect(page.getByText('None: every site meets the target today or with a catalogue dish.')).toHaveCount(0);
  await expect(page.getByText('No site needs an upgrade.')).toHaveCount(0);
  await expect(page.getByText(/work at height/i).first()).toBeVisible();
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
  expect(await seriousViolations(page)).toEqual([]);
});
