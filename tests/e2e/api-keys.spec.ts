import { expect, test, type Page } from '@playwright/test';
import { signIn } from './support/sign-in';
import { seriousViolations } from './support/axe';

/**
 * The integrator's way in, in a real browser: the demo admin makes a key (shown once), the key
 * answers GET /api/v1/me, revoking it makes the next call 401; the API reference renders every
 * operation with Swagger UI under the page's CSP without a single violation.
 */
function collectCspViolations(page: Page): string[] {
  const seen: string[] = [];
  page.on('console', (m) => {
    if (m.text().startsWith('CSP ')) seen.push(m.text());
  });
  return seen;
}

test('an admin makes a key, uses it once with curl-like calls, and revokes it', async ({ page, request }) => {
  await signIn(page, 'admin@quillfeather.example');
  await page.goto('/settings/api-keys');
  await expect(page.getByRole('heading', { name: 'API keys', level: 1 })).toBeVisible();
  const name = `E2E CRM ${Date.now()}`;
  await page.getByLabel('Name').fill(name);
  await page.getByLabel(/^Studies — /).check();
  await page.getByRole('button', { name: 'Create key' }).click();
  const key = (await page.getByLabel('New API key').textContent())!.trim();
  expect(key).toMatch(/^fl_[A-Za-z0-9_-]{43}$/);
  expect(await seriousViolations(page)).toEqual([]);

  const me = await request.get('/api/v1/me', { headers: { authorization: `Bearer ${key}` } });
  expect(me.status()).toBe(200);
  expect((await me.json()).apiKey).toMatchObject({ name, scopes: ['trade-off', 'studies'] });

  // After a reload the key is gone from the page for good; only its prefix is listed.
  await page.reload();
  await expect(page.getByLabel('New API key')).toHaveCount(0);
  const row = page.getByRole('row', { name: new RegExp(name) });
  await expect(row).toContainText(key.slice(0, 11));
  await row.getByRole('button', { name: `Revoke the API key ${name}` }).click();
  await row.getByRole('button', { name: 'Revoke' }).click();
  // The row re-renders as revoked (its form, and so its status line, goes with it).
  await expect(row).toContainText('Revoked');

  const after = await request.get('/api/v1/me', { headers: { authorization: `Bearer ${key}` } });
  expect(after.status()).toBe(401);
});

test('the API reference shows every operation under the page CSP', async ({ page }) => {
  await page.addInitScript(() => document.addEventListener('securitypolicyviolation', (e) => console.error(`CSP ${e.violatedDirective} ${e.blockedURI}`)));
  const violations = collectCspViolations(page);
  await page.goto('/api-reference');
  await expect(page.getByRole('heading', { name: 'FadeLedger API reference' })).toBeVisible();
  const doc = (await (await page.request.get('/api/v1/openapi.json')).json()) as { paths: Record<string, Record<string, unknown>> };
  const count = Object.values(doc.paths).reduce((n, ops) => n + Object.keys(ops).length, 0);
  await expect(page.locator('.opblock')).toHaveCount(count, { timeout: 20_000 });
  // An operation opens with its request body schema and example (the 3.1 resolver runs).
  const tradeoff = page.locator('.opblock').filter({ hasText: '/api/v1/tradeoff' });
  await tradeoff.locator('.opblock-summary').click();
  await expect(tradeoff.getByText('Request body')).toBeVisible();
  await expect(tradeoff.getByText('"latDeg": 47.1')).toBeVisible();
  expect(violations).toEqual([]);
});
