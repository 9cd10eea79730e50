import { test, expect, type Browser, type Page } from '@playwright/test';
import { mkdirSync } from 'node:fs';
import { signIn } from './support/sign-in';
import { seriousViolations } from './support/axe';
import { DEMO_COMPANIES, DEMO_USERS } from '../../db/demo/accounts';

/**
 * Issue 14 (part A) in chromium against the running app, as the people involved would use it:
 * an installer makes a link, a salesperson copies that same link and checks the customer's view
 * while signed in (not counted), e-mails the quote (From the company, Reply-To, PDF attached); the
 * customer accepts on a 390 px phone and sees the confirmation where they tapped; the receipt and
 * the sales notices arrive in the mail catcher; a revoked link names the company (404) and an
 * unknown one names nobody (404). Screenshots at 390 and 1280 px go to .local/screenshots/.
 */
const company = DEMO_COMPANIES.find((c) => c.key === 'quillfeather')!;
const installer = DEMO_USERS.find((u) => u.role === 'installer' && u.company === 'quillfeather')!;
const sales = DEMO_USERS.find((u) => u.role === 'sales' && u.company === 'quillfeather')!;
const admin = DEMO_USERS.find((u) => u.role === 'admin' && u.company === 'quillfeather')!;
const MAIL_API = `http://127.0.0.1:${process.env.MAIL_WEB_PORT ?? '1081'}/api`;
const SHOTS = '.local/screenshots';
const id = `${Date.now().toString(36)}${Math.floor(Math.random() * 1e4)}`;
const customerEmail = `harbour-${id}@saltmarrow.example`;
const receiptEmail = `receipt-${id}@saltmarrow.example`;
const deskEmail = `desk-${id}@quillfeather.example`;
const customerName = `Saltmarrow Harbour Office ${id}`;

type Mail = { id: string; subject: string; text: string; from: { address: string; name?: string }[]; attachments?: { contentType: string; filename?: string }[] };

async function mailsTo(address: string, match: (m: Mail) => boolean, timeoutMs = 20_000): Promise<Mail[]> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const all = (await (await fetch(`${MAIL_API}/email?to.address=${encodeURIComponent(address.toLowerCase())}&sort=asc`)).json()) as Mail[];
    const hits = all.filter(match);
    if (hits.length) return hits;
    if (Date.now() > until) throw new Error(`no matching message reached ${address} (${all.map((m) => m.subject).join(' | ')})`);
    await new Promise((r) => setTimeout(r, 250));
  }
}

/** Reply-To addresses from the raw message (maildev's parsed headers leave it out). */
async function replyTo(mail: Mail): Promise<string[]> {
  const raw = await (await fetch(`${MAIL_API}/email/${mail.id}/source`)).text();
  const head = raw.split(/\r?\n\r?\n/)[0].replace(/\r?\n[ \t]+/g, ' ');
  return [...(/^reply-to:\s*(.*)$/im.exec(head)?.[1] ?? '').matchAll(/[^\s<>,"]+@[^\s<>,"]+/g)].map((m) => m[0].toLowerCase()).sort();
}

async function shoot(page: Page, name: string) {
  mkdirSync(SHOTS, { recursive: true });
  const size = page.viewportSize() ?? { width: 1280, height: 900 };
  await page.setViewportSize({ width: 1280, height: 900 });
  await page.screenshot({ path: `${SHOTS}/customer-${name}-desktop.png`, fullPage: true });
  await page.setViewportSize({ width: 390, height: 844 });
  await page.screenshot({ path: `${SHOTS}/customer-${name}-phone.png`, fullPage: true });
  await page.setViewportSize(size);
}

async function signedIn(browser: Browser, email: string): Promise<Page> {
  const page = await (await browser.newContext({ viewport: { width: 1280, height: 900 } })).newPage();
  await signIn(page, email);
  return page;
}

test.describe.configure({ mode: 'serial' });
// Sign-ins, axe passes and two-width screenshots add up on a shared two-core machine.
test.beforeEach(() => test.setTimeout(180_000));

let quotePath = '';
let linkUrl = '';

test.afterAll(async ({ browser }) => {
  // Leave the demo company as it was: no contact for customers.
  const a = await signedIn(browser, admin.email);
  await a.goto('/settings/branding');
  await a.getByLabel('Contact e-mail').fill('');
  await a.getByLabel('Contact phone').fill('');
  await a.getByRole('button', { name: 'Save contact' }).click();
  await expect(a.getByText('Contact cleared')).toBeVisible();
});

test('the admin sets the contact for customers; the installer quotes a study and makes a link', async ({ browser }) => {
  const a = await signedIn(browser, admin.email);
  await a.goto('/settings/branding');
  await a.getByLabel('Contact e-mail').fill(deskEmail);
  await a.getByLabel('Contact phone').fill('+44 1632 960 321');
  await a.getByRole('button', { name: 'Save contact' }).click();
  await expect(a.getByText('Contact saved')).toBeVisible();

  const inst = await signedIn(browser, installer.email);
  await inst.goto('/studies');
  // The newest demo study with a recommendation (the list loads through SWR).
  await expect(inst.locator('a[href^="/studies/"]').filter({ hasText: /\S/ }).nth(1)).toBeVisible();
  const studies = await inst.locator('a[href^="/studies/"]').evaluateAll((as) => as.map((a) => a.getAttribute('href') ?? '').filter((h) => /^\/studies\/\d+$/.test(h)));
  expect(studies.length).toBeGreaterThan(0);
  await inst.goto(studies[0]);
  await inst.getByRole('link', { name: 'Create quote' }).first().click();
  await inst.waitForURL(/\/quotes\/new\?/);
  await inst.getByLabel('Customer name').fill(customerName);
  await inst.getByLabel('Customer e-mail').fill(customerEmail);
  await inst.getByRole('button', { name: 'Save draft quote' }).click();
  await inst.waitForURL(/\/quotes\/\d+$/);
  quotePath = new URL(inst.url()).pathname;
  await inst.getByRole('button', { name: 'Make a link' }).click();
  linkUrl = await inst.getByLabel('New comparison link').inputValue();
  expect(linkUrl).toMatch(/\/share\/[A-Za-z0-9_-]{43}$/);
});

test('a salesperson copies the link the installer made, and checks the customer view without counting it', async ({ browser }) => {
  const sell = await signedIn(browser, sales.email);
  await sell.context().grantPermissions(['clipboard-read', 'clipboard-write']);
  await sell.goto(quotePath);
  await expect(sell.getByRole('heading', { name: /Status/ })).toContainText('Sent');
  const item = sell.getByRole('listitem').filter({ hasText: `Made by ${installer.name}` }).first();
  await item.getByRole('button', { name: /^Copy link \d+$/ }).click();
  const box = item.getByRole('textbox');
  await expect(box).toHaveValue(linkUrl);
  await item.getByRole('button', { name: 'Copy', exact: true }).click();
  await expect(item.getByRole('button', { name: 'Copied' })).toBeVisible();
  expect(await sell.evaluate(() => navigator.clipboard.readText())).toBe(linkUrl);
  expect(await seriousViolations(sell)).toEqual([]);
  await shoot(sell, 'links-panel');

  // Signed in, the customer's page says so and counts nothing.
  const res = await sell.goto(new URL(linkUrl).pathname);
  expect(res?.status()).toBe(200);
  await expect(sell.getByText('You are viewing as your team')).toBeVisible();
  await shoot(sell, 'team-view');
  await sell.goto(quotePath);
  await expect(sell.getByRole('heading', { name: /Status/ })).toContainText('Sent');
  await expect(sell.getByText(/0 customer views/).first()).toBeVisible();
});

test('the quote e-mail comes from the company, replies reach the seller, the PDF is attached', async ({ browser }) => {
  const sell = await signedIn(browser, sales.email);
  await sell.goto(quotePath);
  await sell.getByRole('button', { name: 'E-mail the quote' }).click();
  await expect(sell.getByRole('status').filter({ hasText: `Quote e-mailed to ${customerEmail}` })).toBeVisible();
  const [mail] = await mailsTo(customerEmail, (m) => m.subject.startsWith('Quote '));
  expect(mail.from[0]).toMatchObject({ name: company.name });
  expect(await replyTo(mail)).toEqual([deskEmail, sales.email].sort());
  expect(mail.attachments?.map((a) => a.contentType)).toEqual(['application/pdf']);
  expect(mail.text).toContain(deskEmail);
});

test('the customer accepts on a 390 px phone and sees the confirmation without scrolling; receipt and notices arrive', async ({ browser }) => {
  const phone = await (await browser.newContext({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true, deviceScaleFactor: 2 })).newPage();
  const res = await phone.goto(new URL(linkUrl).pathname);
  expect(res?.status()).toBe(200);
  await expect(phone.getByText('You are viewing as your team')).toHaveCount(0);
  await expect(phone.getByRole('heading', { name: 'Questions about this quote?' })).toBeVisible();
  await expect(phone.getByRole('link', { name: deskEmail })).toBeVisible();
  await phone.getByLabel('Your full name').fill('Morwenna Saltmarrow');
  await phone.getByLabel('E-mail for a receipt (optional)').fill(receiptEmail);
  await phone.getByRole('checkbox').check();
  await shoot(phone, 'share-before');
  await phone.getByRole('button', { name: 'Accept the quote' }).tap();

  const confirmation = phone.locator('#decision-confirmation');
  await expect(confirmation).toContainText('You accepted this quote, Morwenna Saltmarrow');
  await expect(confirmation).toBeFocused();
  await expect(confirmation).toHaveAttribute('role', 'status');
  await expect(confirmation).toBeInViewport();
  // Wholly on screen, not just a sliver of it.
  const box = (await confirmation.boundingBox())!;
  expect(box.y).toBeGreaterThanOrEqual(0);
  expect(box.y + box.height).toBeLessThanOrEqual(844);
  await phone.screenshot({ path: `${SHOTS}/customer-accepted-viewport-phone.png` });
  expect(await seriousViolations(phone)).toEqual([]);
  await shoot(phone, 'share-accepted');

  const [receipt] = await mailsTo(receiptEmail, (m) => m.subject.startsWith('Accepted: quote'));
  expect(receipt.from[0]).toMatchObject({ name: company.name });
  expect(await replyTo(receipt)).toContain(deskEmail);
  expect(receipt.attachments?.map((a) => a.contentType)).toEqual(['application/pdf']);
  for (const to of [sales.email, installer.email, deskEmail]) {
    expect(await mailsTo(to, (m) => m.subject.includes('accepted by Morwenna Saltmarrow') && m.text.includes(customerName))).toHaveLength(1);
  }
});

test('a revoked link names the company and its contact and answers 404; an unknown one names nobody', async ({ browser }) => {
  const inst = await signedIn(browser, installer.email);
  await inst.goto(quotePath);
  inst.once('dialog', (d) => {
    expect(d.message()).toMatch(/^Revoke link \d+\?/);
    void d.accept();
  });
  // The link the installer made (the e-mail made another one, by sales).
  const item = inst.getByRole('listitem').filter({ hasText: `Made by ${installer.name}` }).first();
  await item.getByRole('button', { name: /^Revoke link \d+$/ }).click();
  await expect(item.getByText(/Revoked /)).toBeVisible();

  const customer = await (await browser.newContext({ viewport: { width: 390, height: 844 } })).newPage();
  const res = await customer.goto(new URL(linkUrl).pathname);
  expect(res?.status()).toBe(404);
  await expect(customer.getByRole('heading', { name: 'This quote link no longer opens' })).toBeVisible();
  await expect(customer.getByText(company.name).first()).toBeVisible();
  await expect(customer.getByRole('link', { name: deskEmail })).toBeVisible();
  await expect(customer.getByRole('link', { name: '+44 1632 960 321' })).toBeVisible();
  expect(await seriousViolations(customer)).toEqual([]);
  await shoot(customer, 'link-closed');

  const guess = await customer.goto(`/share/${'Q'.repeat(43)}`);
  expect(guess?.status()).toBe(404);
  await expect(customer.getByRole('heading', { name: 'We could not find that page' })).toBeVisible();
  const words = await customer.locator('body').innerText();
  expect(words).not.toContain(company.name);
  expect(words).not.toMatch(/FadeLedger/i);
  await shoot(customer, 'link-unknown');
});

test('the favicon and app icons are served', async ({ request }) => {
  const ico = await request.get('/favicon.ico');
  expect(ico.status()).toBe(200);
  expect((await ico.body()).subarray(0, 4).toString('hex')).toBe('00000100');
  expect((await request.get('/icon.svg')).status()).toBe(200);
  expect((await request.get('/apple-icon.png')).status()).toBe(200);
});
