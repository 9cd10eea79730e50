import { test, expect, type Page } from '@playwright/test';
import { randomBytes } from 'node:crypto';
import { readFile } from 'node:fs/promises';
import { loadTestEnv } from '../support/test-env';
import { models } from '../../db/models';
import { hashPassword } from '../../server/auth/password';
import { signIn } from './support/sign-in';
import { seriousViolations } from './support/axe';

/**
 * The operator and the audit log in chromium: staff open a company's account page and extend its
 * trial with a reason; the company's admin finds that row in their audit log, filters the log and
 * downloads it as CSV; a salesperson opening a page of another role gets the role message (403),
 * not "page not found". Axe on each new page; screenshots at 1280 and 390 px in .local/screens.
 */
const PASSWORD = 'e2e-audit-pass-2026';
const id = randomBytes(4).toString('hex');
const adminEmail = `audit-admin-${id}@e2e.example`;
const companyName = `Marrowgate Dish Fitters ${id}`;
const REASON = `Site survey delayed by weather (${id})`;
const SHOTS = '.local/screens';

test.beforeAll(async () => {
  // A company of our own on the trial plan, made straight in the test database, so the run
  // neither depends on nor changes the demo companies' plans.
  loadTestEnv();
  const { Plan, Company, User, Membership } = models();
  const trial = await Plan.findOne({ where: { code: 'trial' }, rejectOnEmpty: true });
  const company = await Company.create({ name: companyName, planId: trial.id, trialEndsAt: new Date(Date.now() + 2 * 86_400_000) });
  const user = await User.create({ id: `usr_${randomBytes(12).toString('base64url')}`, email: adminEmail, name: 'Idony Flaxley', passwordHash: await hashPassword(PASSWORD) });
  await Membership.create({ companyId: company.id, userId: user.id, role: 'admin' });
});

// No closeSequelize here: every spec file runs in the same Playwright worker, and a spec that closed the
// shared pool left the next spec's models on a closed connection. The worker's exit closes it.

async function shoot(page: Page, name: string) {
  for (const width of [1280, 390]) {
    await page.setViewportSize({ width, height: width === 390 ? 844 : 900 });
    await page.screenshot({ path: `${SHOTS}/${name}-${width}.png`, fullPage: true });
  }
  await page.setViewportSize({ width: 1280, height: 900 });
}

test('staff extend a trial with a reason and the audit logs show it', async ({ page, browser }) => {
  test.setTimeout(180_000);
  await signIn(page, 'staff@fadeledger.example');
  await page.goto(`/accounts?q=${encodeURIComponent(companyName)}`);
  await page.getByRole('link', { name: companyName }).click();
  await expect(page.getByRole('heading', { level: 1, name: companyName })).toBeVisible();
  await expect(page.getByRole('heading', { name: 'Usage against limits' })).toBeVisible();
  await expect(page.getByText('Idony Flaxley')).toBeVisible();
  expect(await seriousViolations(page)).toEqual([]);

  const form = page.getByRole('form', { name: 'Extend the trial' });
  await form.getByLabel('Days to add').fill('10');
  await form.getByLabel('Reason').fill(REASON);
  await form.getByRole('button', { name: 'Extend the trial' }).click();
  await expect(page.getByText(`Trial of ${companyName} extended to`)).toBeVisible();
  await page.reload();
  const events = page.getByRole('table', { name: 'Plan and billing events of this company' });
  await expect(events.getByText('FadeLedger staff extended the trial')).toBeVisible();
  await expect(events.getByText(REASON, { exact: false })).toBeVisible();
  await shoot(page, 'staff-account');

  // The company's admin reads the same row in their own log.
  const context = await browser.newContext();
  const admin = await context.newPage();
  await signIn(admin, adminEmail, PASSWORD);
  await admin.goto('/settings/audit');
  const log = admin.getByRole('table', { name: 'Audit log' });
  await expect(log.getByText('FadeLedger staff extended the trial').first()).toBeVisible();
  await expect(log.getByText(REASON, { exact: false })).toBeVisible();
  await context.close();
});

test('admin filters the audit log and downloads it as CSV', async ({ page }) => {
  await signIn(page, adminEmail, PASSWORD);
  await page.goto('/settings/audit');
  await page.getByLabel('Kind').selectOption({ label: 'Plan and billing' });
  await page.getByRole('button', { name: 'Filter' }).click();
  await expect(page).toHaveURL(/kind=billing/);
  const table = page.getByRole('table', { name: 'Audit log, filtered' });
  await expect(table.getByText('FadeLedger staff extended the trial')).toBeVisible();
  await expect(table.getByText('Signed in')).toHaveCount(0);
  expect(await seriousViolations(page)).toEqual([]);
  await shoot(page, 'audit-log');

  const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Download CSV' }).click()]);
  expect(download.suggestedFilename()).toMatch(/^audit-log-\d{4}-\d{2}-\d{2}\.csv$/);
  const csv = (await readFile((await download.path())!, 'utf8')).replace(/^\uFEFF/, '');
  const lines = csv.trim().split('\r\n');
  expect(lines[0]).toBe('time_utc,who,action,what,target,detail,address,device');
  expect(lines.some((l) => l.includes('staff.trial_extended') && l.includes(REASON))).toBe(true);
  expect(lines.slice(1).every((l) => /,(billing|staff)\./.test(l))).toBe(true);

  // An empty range says so rather than "no events yet".
  await page.goto('/settings/audit?from=2001-01-01&to=2001-01-31');
  await expect(page.getByText('No events match this filter.')).toBeVisible();
});

test('on a phone the audit log keeps every settings tab in view and says which filter field is wrong', async ({ page }) => {
  await page.setViewportSize({ width: 390, height: 844 });
  await signIn(page, adminEmail, PASSWORD);
  await page.goto('/settings/audit');
  // The settings tabs wrap: every one, the current "Audit log" among them, lies inside the 390 px page.
  const tabs = page.getByRole('navigation', { name: 'Settings' }).getByRole('link');
  expect(await tabs.count()).toBeGreaterThanOrEqual(6);
  for (const tab of await tabs.all()) {
    const box = (await tab.boundingBox())!;
    expect(box.x, await tab.innerText()).toBeGreaterThanOrEqual(0);
    expect(box.x + box.width, await tab.innerText()).toBeLessThanOrEqual(390);
  }
  await expect(page.getByRole('link', { name: 'Audit log' })).toHaveAttribute('aria-current', 'page');
  // On a phone the address reads "from …", not a bare number under the event.
  await expect(page.getByRole('table', { name: 'Audit log' }).getByText(/^from /).first()).toBeVisible();
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);

  // A date the filter cannot read names its field, and the empty table does not claim "no events yet".
  await page.goto('/settings/audit?from=2026-13-45');
  await expect(page.getByText('From: That is not a date.')).toBeVisible();
  await expect(page.getByText('Correct the filter above to see events.')).toBeVisible();
  await expect(page.getByText('No events yet.')).toHaveCount(0);
  expect(await seriousViolations(page)).toEqual([]);
});

test('a salesperson opening /quotes/new or /campaigns sees the role message with status 403', async ({ page }) => {
  await signIn(page, 'sales@quillfeather.example');
  for (const path of ['/quotes/new', '/campaigns']) {
    const res = await page.goto(path);
    expect(res?.status(), path).toBe(403);
    await expect(page.getByRole('heading', { level: 1, name: 'Not available to your role' })).toBeVisible();
    await expect(page.getByText('You are signed in as')).toContainText('Sales');
    await expect(page.getByText('Your company’s admins choose each member’s role')).toBeVisible();
    await expect(page.getByRole('list', { name: 'Your company’s admins' })).toContainText('admin@quillfeather.example');
    await expect(page.getByText('We could not find that page')).toHaveCount(0);
  }
  expect(await seriousViolations(page)).toEqual([]);
  await shoot(page, 'role-message');
  // A row of another company still answers 404, never 403.
  const res = await page.goto('/quotes/999999999');
  expect(res?.status()).toBe(404);
});
