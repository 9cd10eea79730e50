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
