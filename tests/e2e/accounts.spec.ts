import { test, expect, type Page } from '@playwright/test';
import { DEMO_PASSWORD, DEMO_USERS } from '../../db/demo/accounts';

/**
 * The account flows in chromium against the built app, with mail read from the local mail
 * catcher's REST API (maildev 3: /api/email?to.address=…).
 */
const MAIL_API = `http://127.0.0.1:${process.env.MAIL_WEB_PORT ?? '1081'}/api/email`;
const stamp = () => `${Date.now().toString(36)}${Math.floor(Math.random() * 1e4)}`;

async function linkFromMail(to: string, pathPrefix: string, count = 1): Promise<string> {
  const until = Date.now() + 15_000;
  for (;;) {
    const res = await fetch(`${MAIL_API}?to.address=${encodeURIComponent(to)}&sort=asc`);
    const mails = (await res.json()) as { text: string }[];
    if (mails.length >= count) {
      const m = new RegExp(`https?://[^\\s]+${pathPrefix}[A-Za-z0-9_-]+`).exec(mails[count - 1].text);
      if (!m) throw new Error(`no ${pathPrefix} link in the message to ${to}`);
      // The link names APP_URL; the browser follows it under the test's base URL.
      return new URL(m[0]).pathname;
    }
    if (Date.now() > until) throw new Error(`no message reached ${to}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

async function subjectOfMail(to: string, count: number): Promise<string> {
  const until = Date.now() + 15_000;
  for (;;) {
    const res = await fetch(`${MAIL_API}?to.address=${encodeURIComponent(to)}&sort=asc`);
    const mails = (await res.json()) as { subject: string }[];
    if (mails.length >= count) return mails[count - 1].subject;
    if (Date.now() > until) throw new Error(`message ${count} never reached ${to}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

async function signIn(page: Page, email: string, password: string) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail address').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

/**
 * The sign-up form only says "check your inbox"; the mailed link's page has one button that
 * creates the company and signs in. Returns the link's path.
 */
async function signUpAndConfirm(page: Page, f: { name: string; company: string; email: string; password: string }): Promise<string> {
  await page.getByLabel('Your name').fill(f.name);
  await page.getByLabel('Company name').fill(f.company);
  await page.getByLabel('Work e-mail address').fill(f.email);
  await page.getByLabel('Password').fill(f.password);
  await page.getByRole('button', { name: 'Create account' }).click();
  await expect(page.getByRole('status').filter({ hasText: /\S/ })).toHaveText(`Check your inbox at ${f.email} to finish creating your account.`);
  await expect(page.getByLabel('Work e-mail address')).toHaveCount(0);
  const confirmPath = await linkFromMail(f.email, '/sign-up/confirm/');
  await page.goto(confirmPath);
  await expect(page.getByRole('heading', { name: 'Finish creating your account' })).toBeVisible();
  await expect(page.getByText(f.company).first()).toBeVisible();
  await page.getByRole('button', { name: 'Create the company account' }).click();
  await expect(page).toHaveURL(/\/dashboard\?welcome=1$/);
  return confirmPath;
}

test('sign up, invite a colleague, accept as the colleague, sign in', async ({ browser, page }) => {
  const id = stamp();
  const founder = `founder-${id}@e2e.example`;
  const colleague = `colleague-${id}@e2e.example`;

  await page.goto('/');
  await page.getByRole('link', { name: 'Start a free trial' }).first().click();
  await expect(page).toHaveURL(/\/sign-up$/);
  const confirmPath = await signUpAndConfirm(page, { name: 'Imogen Drysdale', company: `Larkspur Dish Co ${id}`, email: founder, password: 'larkspur-founder-pass' });
  await expect(page.getByText('Your company account is ready')).toBeVisible();

  // The confirmation link works once; a second opening offers a fresh start.
  const spare = await browser.newContext();
  const sp = await spare.newPage();
  const answer = await sp.goto(confirmPath);
  expect(answer?.headers()['referrer-policy']).toBe('no-referrer');
  expect(answer?.headers()['x-robots-tag']).toContain('noindex');
  await expect(sp.getByText('This sign-up link has expired or has already been used')).toBeVisible();
  await sp.getByRole('link', { name: 'Start again' }).click();
  await expect(sp).toHaveURL(/\/sign-up$/);
  // The same address again: the same answer, and a "you already have an account" mail instead of a link.
  await sp.getByLabel('Your name').fill('Imogen Drysdale');
  await sp.getByLabel('Company name').fill(`Larkspur Second ${id}`);
  await sp.getByLabel('Work e-mail address').fill(founder);
  await sp.getByLabel('Password').fill('another-founder-pass');
  await sp.getByRole('button', { name: 'Create account' }).click();
  await expect(sp.getByRole('status').filter({ hasText: /\S/ })).toHaveText(`Check your inbox at ${founder} to finish creating your account.`);
  expect(await subjectOfMail(founder, 2)).toBe('You already have a FadeLedger account');
  await spare.close();

  const cookies = await page.context().cookies();
  const session = cookies.find((c) => c.name === 'fl_session');
  expect(session).toMatchObject({ httpOnly: true, sameSite: 'Lax' });

  await page.goto('/settings/team');
  await expect(page.getByRole('heading', { name: 'Team', level: 1 })).toBeVisible();
  await page.getByLabel('E-mail address').fill(colleague);
  await page.getByLabel('Role', { exact: true }).selectOption('installer');
  await page.getByRole('button', { name: 'Send invitation' }).click();
  await expect(page.getByRole('status').filter({ hasText: `Invitation sent to ${colleague}` })).toBeVisible();
  await expect(page.getByRole('cell', { name: colleague, exact: true })).toBeVisible();

  const invitePath = await linkFromMail(colleague, '/invite/');
  const other = await browser.newContext();
  const cp = await other.newPage();
  await cp.goto(invitePath);
  await expect(cp.getByRole('heading', { name: /^Join Larkspur Dish Co/ })).toBeVisible();
  await expect(cp.getByText(colleague).first()).toBeVisible();
  await cp.getByLabel('Your name').fill('Caspian Welby');
  await cp.getByLabel('Choose a password').fill('caspian-colleague-pass');
  await cp.getByRole('button', { name: 'Create account and join' }).click();
  await expect(cp).toHaveURL(/\/dashboard\?joined=1$/);
  await expect(cp.getByText('You have joined as Installer.')).toBeVisible();
  // Installers see no Team link.
  await expect(cp.getByRole('link', { name: 'Team' })).toHaveCount(0);

  // The link works once.
  await cp.goto(invitePath);
  await expect(cp.getByText('This invitation has already been used')).toBeVisible();

  // Sign out, then sign in as the colleague.
  await cp.goto('/dashboard');
  await cp.getByRole('button', { name: /Account menu/ }).click();
  await cp.getByRole('button', { name: 'Sign out' }).click();
  await expect(cp).toHaveURL(/\/sign-in\?signed-out=1$/);
  await signIn(cp, colleague, 'caspian-colleague-pass');
  await expect(cp).toHaveURL(/\/dashboard$/);
  await expect(cp.getByText('You are signed in as Installer.')).toBeVisible();
  await other.close();

  // The founder's team page shows the colleague as a member now.
  await page.goto('/settings/team');
  const members = page.getByRole('table', { name: 'Members' });
  await expect(members.getByText('Caspian Welby', { exact: true })).toBeVisible();
  await expect(members.getByRole('combobox', { name: 'Role of Caspian Welby' })).toHaveValue('installer');
  await expect(page.getByRole('table', { name: 'Open invitations' }).getByText('No open invitations.')).toBeVisible();
});

test('forgotten password: the mailed link sets a new one, once', async ({ page }) => {
  const id = stamp();
  const email = `forgetful-${id}@e2e.example`;
  await page.goto('/sign-up');
  await signUpAndConfirm(page, { name: 'Perrin Ashgrove', company: `Ashgrove Signal ${id}`, email, password: 'first-password-here' });
  await page.context().clearCookies();

  await page.goto('/sign-in');
  await page.getByRole('link', { name: 'Forgot your password?' }).click();
  await expect(page.getByRole('heading', { name: 'Reset your password' })).toBeVisible();
  await page.getByLabel('E-mail address').fill(email);
  await page.getByRole('button', { name: 'Send reset link' }).click();
  await expect(page.getByRole('status').filter({ hasText: /\S/ })).toContainText('If an account uses that address');

  const resetPath = await linkFromMail(email, '/reset-password/', 2);
  await page.goto(resetPath);
  await page.getByLabel('New password', { exact: true }).fill('second-password-here');
  await page.getByLabel('New password again').fill('second-password-here');
  await page.getByRole('button', { name: 'Save new password' }).click();
  await expect(page).toHaveURL(/\/sign-in\?reset=1$/);
  await signIn(page, email, 'second-password-here');
  await expect(page).toHaveURL(/\/dashboard$/);

  await page.goto(resetPath);
  await expect(page.getByText('This reset link has expired or has already been used')).toBeVisible();
});

test('a wrong password is refused with a message that does not say which half was wrong', async ({ page }) => {
  await signIn(page, 'admin@quillfeather.example', 'not-the-demo-password');
  await expect(page.getByRole('alert').filter({ hasText: /\S/ })).toHaveText('That e-mail address and password do not match an account.');
  await expect(page.getByLabel('E-mail address')).toHaveValue('admin@quillfeather.example');
});

for (const person of DEMO_USERS) {
  test(`demo sign-in works for ${person.role} (${person.email})`, async ({ page }) => {
    await signIn(page, person.email, DEMO_PASSWORD);
    if (person.role === 'staff') {
      await expect(page).toHaveURL(/\/staff$/);
      await expect(page.getByRole('heading', { name: 'Platform operator' })).toBeVisible();
      // Staff have no company pages.
      await page.goto('/settings/team');
      await expect(page).toHaveURL(/\/staff$/);
    } else {
      await expect(page).toHaveURL(/\/dashboard$/);
      const label = { admin: 'Admin', installer: 'Installer', sales: 'Sales' }[person.role];
      await expect(page.getByText(`You are signed in as ${label}.`)).toBeVisible();
      await page.goto('/settings/team');
      if (person.role === 'admin') await expect(page.getByRole('heading', { name: 'Team', level: 1 })).toBeVisible();
      // A company page of another role names the role (403); the staff area stays hidden (404).
      else await expect(page.getByRole('heading', { name: 'Not available to your role' })).toBeVisible();
      await page.goto('/staff');
      await expect(page.getByText('We could not find that page')).toBeVisible();
    }
  });
}
