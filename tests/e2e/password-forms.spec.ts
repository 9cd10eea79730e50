import { test, expect } from '@playwright/test';
import { signIn } from './support/sign-in';
import { DEMO_PASSWORD, DEMO_USERS } from '../../db/demo/accounts';

/**
 * A failed password change sends none of the typed passwords back over the wire (the action's
 * answer is read from the network, not from the page) and leaves the three fields empty.
 */
const sales = DEMO_USERS.find((u) => u.role === 'sales' && u.company === 'quillfeather')!;

test('a refused password change neither returns nor refills the passwords', async ({ page }) => {
  await signIn(page, sales.email);
  await page.goto('/settings/security');
  const form = page.getByRole('form', { name: 'Change password' });
  const typed = { current: DEMO_PASSWORD, next: 'typed-new-secret-71', again: 'typed-other-secret-72' };
  await form.getByLabel('Current password').fill(typed.current);
  await form.getByLabel('New password', { exact: true }).fill(typed.next);
  await form.getByLabel('New password again').fill(typed.again);

  // The action's answer, read as it passes (a streamed answer is not kept by the browser's devtools).
  const answers: string[] = [];
  await page.route('**/settings/security', async (route) => {
    if (route.request().method() !== 'POST') return route.continue();
    const response = await route.fetch();
    const text = await response.text();
    answers.push(text);
    await route.fulfill({ response, body: text });
  });
  await form.getByRole('button', { name: 'Change password' }).click();
  await expect.poll(() => answers.length).toBe(1);
  const body = answers[0];
  expect(body).toContain('The two passwords differ.');
  for (const secret of Object.values(typed)) expect(body).not.toContain(secret);

  await expect(form.getByText('The two passwords differ.')).toBeVisible();
  for (const label of ['Current password', 'New password again']) await expect(form.getByLabel(label)).toHaveValue('');
  await expect(form.getByLabel('New password', { exact: true })).toHaveValue('');
});
