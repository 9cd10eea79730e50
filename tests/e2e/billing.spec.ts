import { test, expect, type Page } from '@playwright/test';
import { randomBytes } from 'node:crypto';
import { loadTestEnv } from '../support/test-env';
import { models } from '../../db/models';
import { hashPassword } from '../../server/auth/password';

/**
 * Billing in chromium against the running app and the local Stripe-compatible service: an admin
 * on the free tier (1 seat) is refused an invitation, upgrades on the provider's hosted checkout
 * page, sees the plan active once the webhook has been applied, invites a colleague into the new
 * seat, then cancels on the provider's portal page and sees the cancellation back in the app.
 */
const PASSWORD = 'e2e-billing-pass-2026';
const id = randomBytes(4).toString('hex');
const adminEmail = `billing-admin-${id}@e2e.example`;
const companyName = `Thistledown Aerials ${id}`;

test.beforeAll(async () => {
  // A company of our own on the free tier, made straight in the test database, so that the run
  // does not depend on (or change) the demo companies.
  loadTestEnv();
  const { Plan, Company, User, Membership } = models();
  const bench = await Plan.findOne({ where: { code: 'bench' }, rejectOnEmpty: true });
  const company = await Company.create({ name: companyName, planId: bench.id, trialEndsAt: null });
  const user = await User.create({ id: `usr_${randomBytes(12).toString('base64url')}`, email: adminEmail, name: 'Wren Halloway', passwordHash: await hashPassword(PASSWORD) });
  await Membership.create({ companyId: company.id, userId: user.id, role: 'admin' });
});

// No closeSequelize here: every spec file runs in the same Playwright worker, and a spec that closed the
// shared pool left the next spec's models on a closed connection. The worker's exit closes it.

async function signIn(page: Page) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail address').fill(adminEmail);
  await page.getByLabel('Password').fill(PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).not.toHaveURL(/\/sign-in/);
}

async function invite(page: Page, email: string) {
  await page.goto('/settings/team');
  await page.getByLabel('E-mail address').fill(email);
  await page.getByLabel('Role', { exact: true }).selectOption('installer');
  await page.getByRole('button', { name: 'Send invitation' }).click();
}

test('upgrade through the hosted checkout, use the new seat, cancel in the portal', async ({ page }) => {
  test.setTimeout(120_000);
  await signIn(page);

  // The free tier's one seat is the admin's: an invitation is refused, naming the limit.
  await invite(page, `first-hire-${id}@e2e.example`);
  await expect(page.getByRole('alert').filter({ hasText: /All 1 seat of the Bench plan are taken/ })).toBeVisible();

  await page.goto('/settings/billing');
  await expect(page.getByRole('heading', { name: 'Billing', level: 1 })).toBeVisible();
  await expect(page.getByRole('heading', { name: 'Bench', level: 2 })).toBeVisible();
  const crew = page.getByRole('listitem', { name: 'Crew plan' });
  await crew.getByRole('button', { name: 'Choose Crew' }).click();

  // The provider's hosted test checkout page (another origin).
  await expect(page).toHaveURL(/\/checkout\/cs_test_/, { timeout: 30_000 });
  await expect(page.getByRole('heading', { name: 'Test checkout' })).toBeVisible();
  await expect(page.getByRole('row', { name: /Due today/ })).toContainText('49.00');
  await page.getByRole('button', { name: 'Pay with test card 4242 4242 4242 4242' }).click();

  // Back in the app: the return page waits for the webhook, then shows the active plan.
  await expect(page).toHaveURL(/\/settings\/billing\/return\?session_id=cs_test_/);
  await expect(page.getByRole('heading', { name: 'Crew is active' })).toBeVisible({ timeout: 30_000 });
  await expect(page.getByRole('row', { name: /Seats/ })).toContainText('5');

  // The new seat limit lets the admin invite the colleague.
  const hire = `first-hire-${id}@e2e.example`;
  await invite(page, hire);
  await expect(page.getByRole('status').filter({ hasText: `Invitation sent to ${hire}` })).toBeVisible();

  // Cancel on the provider's portal page, then return to the app.
  await page.goto('/settings/billing');
  await expect(page.getByRole('heading', { name: 'Crew', level: 2 })).toBeVisible();
  await page.getByRole('button', { name: 'Manage payment, invoices or cancel' }).click();
  await expect(page).toHaveURL(/\/portal\/bps_/, { timeout: 30_000 });
  await page.getByRole('button', { name: 'Cancel at period end' }).click();
  await expect(page.getByText('Your subscription will end at the close of the current period.')).toBeVisible();
  await page.getByRole('link', { name: 'Return to the app' }).click();
  await expect(page).toHaveURL(/\/settings\/billing$/);
  // The cancellation arrives by webhook; reload until it has been applied.
  await expect(async () => {
    await page.reload();
    await expect(page.getByText('Active · cancels at period end')).toBeVisible({ timeout: 1_000 });
  }).toPass({ timeout: 30_000 });
  await expect(page.getByText(/Ends on/)).toBeVisible();
});
