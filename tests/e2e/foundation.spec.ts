import { expect, test } from '@playwright/test';

test('the landing page says what FadeLedger does and for whom', async ({ page }) => {
  await page.goto('/');
  await expect(page.getByRole('heading', { level: 1 })).toContainText('minutes a year');
  await expect(page.getByText('For satellite installers and the sales desks of service resellers')).toBeVisible();
  await expect(page.getByRole('link', { name: 'Sign in' }).first()).toBeVisible();
  await expect(page.getByText('ITU-R P.618-14')).toBeVisible();
});

test('the health route reports the database', async ({ request }) => {
  const res = await request.get('/api/health');
  expect(res.status()).toBe(200);
  expect(await res.json()).toEqual({ db: 'ok' });
});

test('an unknown page answers with our 404', async ({ page }) => {
  const res = await page.goto('/no-such-page');
  expect(res?.status()).toBe(404);
  await expect(page.getByRole('heading', { name: 'We could not find that page' })).toBeVisible();
});

test('pages opened from a mailed token link never leak the token in a Referer, nor get indexed', async ({ request }) => {
  for (const path of [`/reset-password/${'B'.repeat(43)}`, `/invite/${'C'.repeat(43)}`]) {
    const res = await request.get(path);
    expect(res.headers()['referrer-policy'], path).toBe('no-referrer');
    expect(res.headers()['x-robots-tag'], path).toBe('noindex, nofollow');
  }
});
