import { test, expect, type Browser } from '@playwright/test';
import { seriousViolations } from './support/axe';
import { signIn } from './support/sign-in';
import { DEMO_USERS } from '../../db/demo/accounts';

/**
 * Records in chromium against the running app and the seeded demo scenario: another company's
 * study and quote answer a real HTTP 404 (not a streamed 200); an installer adds, edits and
 * deletes customers and sites in place and sales sees no edit controls; a study is archived and
 * found again with the toggle; the admin downloads an uploaded file as it was sent.
 */
const user = (role: string, company = 'quillfeather') => DEMO_USERS.find((u) => u.role === role && u.company === company)!;
const stamp = () => `${Date.now().toString(36)}${Math.floor(Math.random() * 1e4)}`;

async function newSignedInPage(browser: Browser, email: string) {
  const page = await (await browser.newContext()).newPage();
  await signIn(page, email);
  return page;
}


test('another company’s study and quote answer HTTP 404, not a streamed 200', async ({ page, browser }) => {
  await signIn(page, user('installer').email);
  const study = ((await (await page.request.get('/api/v1/studies?pageSize=1')).json()) as { items: { id: number }[] }).items[0];
  const quote = ((await (await page.request.get('/api/v1/quotes?pageSize=1')).json()) as { items: { id: number }[] }).items[0];
  expect((await page.goto(`/studies/${study.id}`))!.status()).toBe(200);

  const outsider = await newSignedInPage(browser, user('admin', 'bramblecote').email);
  for (const path of [`/studies/${study.id}`, `/quotes/${quote.id}`, '/studies/999999999', '/quotes/not-a-number']) {
    const res = await outsider.goto(path);
    expect(res!.status(), path).toBe(404);
    await expect(outsider.getByRole('heading', { name: 'We could not find that page' })).toBeVisible();
  }
  // The lists still stream with their loading shell.
  expect((await outsider.goto('/studies'))!.status()).toBe(200);
  await outsider.context().close();
});

test('an installer adds, edits and deletes a customer and edits a site in place; sales sees no edit controls', async ({ page, browser }) => {
  const id = stamp();
  await signIn(page, user('installer').email);
  await page.goto('/customers');
  const add = page.getByRole('form', { name: 'Add a customer' });
  await add.getByLabel('Name').fill(`Kestrel Mill ${id}`);
  await add.getByRole('button', { name: 'Add customer' }).click();
  await expect(add.getByRole('status')).toContainText(`Customer Kestrel Mill ${id} added.`);
  await page.getByRole('searchbox').fill(`Kestrel Mill ${id}`);
  const customers = page.getByRole('table', { name: 'Customers' });
  await expect(customers.getByRole('rowheader', { name: new RegExp(`Kestrel Mill ${id}`) })).toBeVisible();

  await customers.getByRole('button', { name: `Edit Kestrel Mill ${id}` }).click();
  const edit = page.getByRole('form', { name: `Edit Kestrel Mill ${id}` });
  await edit.getByLabel('Phone (optional)').fill('+00 555 0199');
  await edit.getByLabel('E-mail (optional)').fill('not-an-address');
  await edit.getByRole('button', { name: 'Save customer' }).click();
  // The action's own schema refuses in the browser first.
  await expect(edit.getByRole('alert')).toContainText('Please check the highlighted fields.');
  await edit.getByLabel('E-mail (optional)').fill(`mill-${id}@example.test`);
  await edit.getByRole('button', { name: 'Save customer' }).click();
  await expect(edit).toHaveCount(0);
  await expect(customers).toContainText('+00 555 0199');
  await expect(customers).toContainText(`mill-${id}@example.test`);
  expect(await seriousViolations(page)).toEqual([]);

  // A site for it, then edited in place on the sites page.
  await page.goto('/sites');
  const addSite = page.getByRole('form', { name: 'Add a site' });
  await addSite.getByLabel('Customer').selectOption({ label: `Kestrel Mill ${id}` });
  await addSite.getByLabel('Site name').fill(`Mill roof ${id}`);
  await addSite.getByLabel('Latitude').fill(`52°10'12"N`);
  await addSite.getByLabel('Longitude').fill('1 02 30 W');
  await addSite.getByRole('button', { name: 'Add site' }).click();
  // The form has two live regions: the save message and the "Use my location" one.
  await expect(addSite.getByRole('status').filter({ hasText: 'Site Mill roof' })).toContainText(`Site Mill roof ${id} added`);
  await page.getByRole('searchbox').fill(`Mill roof ${id}`);
  const sites = page.getByRole('table', { name: 'Sites' });
  await sites.getByRole('button', { name: `Edit Mill roof ${id}` }).click();
  const editSite = page.getByRole('form', { name: `Edit Mill roof ${id}` });
  await expect(editSite.getByLabel('Latitude')).toHaveValue('52.17');
  await editSite.getByLabel('Altitude (m above sea level)').fill('96');
  await editSite.getByLabel('Address (optional)').fill('North loading bay');
  await editSite.getByRole('button', { name: 'Save site' }).click();
  await expect(editSite).toHaveCount(0);
  await expect(sites).toContainText('96 m');
  await expect(sites).toContainText('North loading bay');
  expect(await seriousViolations(page)).toEqual([]);

  // With a site, the customer cannot be deleted: the reason shows and nothing goes.
  await page.goto('/customers');
  await page.getByRole('searchbox').fill(`Kestrel Mill ${id}`);
  await customers.getByRole('button', { name: `Edit Kestrel Mill ${id}` }).click();
  page.once('dialog', (d) => d.accept());
  await page.getByRole('button', { name: `Delete Kestrel Mill ${id}` }).click();
  await expect(customers.getByRole('alert')).toContainText('still has sites');

  const sales = await newSignedInPage(browser, user('sales').email);
  for (const path of ['/customers', '/sites']) {
    await sales.goto(path);
    await expect(sales.getByRole('table').getByRole('row').nth(1)).toBeVisible();
    await expect(sales.getByRole('button', { name: /^Edit / })).toHaveCount(0);
    await expect(sales.getByRole('form', { name: /^Add a/ })).toHaveCount(0);
  }
  await sales.context().close();
});

test('an installer archives a study, finds it again with the toggle, and restores it', async ({ page }) => {
  await signIn(page, user('installer').email);
  const study = ((await (await page.request.get('/api/v1/studies?pageSize=1')).json()) as { items: { id: number; title: string }[] }).items[0];
  await page.goto(`/studies/${study.id}`);
  await page.getByRole('button', { name: 'Archive' }).click();
  await expect(page.getByText('This study is left out of the studies list')).toBeVisible();
  await expect(page.getByRole('button', { name: 'Restore to list' })).toBeVisible();

  await page.goto('/studies');
  const list = page.getByRole('table', { name: 'Studies' });
  await expect(list.getByRole('link').first()).toBeVisible();
  await expect(list.locator(`a[href="/studies/${study.id}"]`)).toHaveCount(0);
  await page.getByLabel('Show archived studies').check();
  await expect(list.locator(`a[href="/studies/${study.id}"]`)).toBeVisible();
  expect(await seriousViolations(page)).toEqual([]);

  await page.goto(`/studies/${study.id}`);
  await page.getByRole('button', { name: 'Restore to list' }).click();
  await expect(page.getByRole('button', { name: 'Archive' })).toBeVisible();
  await page.goto('/studies');
  await expect(list.locator(`a[href="/studies/${study.id}"]`)).toBeVisible();
});

test('the admin downloads an uploaded price list exactly as it was sent', async ({ page }) => {
  const id = stamp();
  // Invented catalogue row (demo data), not offered in new studies so other browser tests' dish lists stay as seeded.
  const text = `name,diameter_m,efficiency,hardware_price,labour_price,mount_notes,active\nDownload check ${id},0.85,0.66,161.00,140.00,,no\n`;
  await signIn(page, user('admin').email);
  await page.goto('/dishes');
  await page.getByLabel('CSV file', { exact: true }).setInputFiles({ name: `price list ${id}.csv`, mimeType: 'text/csv', buffer: Buffer.from(text) });
  await page.getByRole('button', { name: 'Preview' }).click();
  await expect(page.getByText('Rows as they will be saved')).toBeAttached();
  await page.getByRole('button', { name: 'Save', exact: true }).click();
  await expect(page.getByText('Catalogue saved: 1 added')).toBeVisible();
  await page.reload();
  const link = page.getByRole('link', { name: `Download original price list ${id}.csv` });
  const [download] = await Promise.all([page.waitForEvent('download'), link.click()]);
  expect(download.suggestedFilename()).toBe(`price list ${id}.csv`);
  const body = await (await download.createReadStream()).toArray();
  expect(Buffer.concat(body).toString('utf8')).toBe(text);
  expect(await seriousViolations(page)).toEqual([]);
});
