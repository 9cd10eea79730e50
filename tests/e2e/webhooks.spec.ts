import { expect, test } from '@playwright/test';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { createHmac } from 'node:crypto';
import { signIn } from './support/sign-in';
import { seriousViolations } from './support/axe';

/**
 * The demo admin registers a webhook endpoint (a receiver started by this spec on 127.0.0.1: the
 * test profile sets WEBHOOKS_ALLOW_PRIVATE_TARGETS), copies the signing secret shown once, sends a
 * test event and sees it delivered in the endpoint's log; the receiver checks the signature as the
 * settings page documents it. The page passes axe before and after.
 */
test('an admin registers an endpoint, sends a test event and sees it in the delivery log', async ({ page }) => {
  // Two axe passes and three server round trips: on a busy machine this takes more than the default minute.
  test.setTimeout(240_000);
  const got: { headers: http.IncomingHttpHeaders; body: string }[] = [];
  const server = http.createServer((req, res) => {
    let body = '';
    req.on('data', (c) => (body += c));
    req.on('end', () => {
      got.push({ headers: req.headers, body });
      res.writeHead(204).end();
    });
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', () => resolve()));
  const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}/fadeledger-events`;
  try {
    await signIn(page, 'admin@quillfeather.example');
    await page.goto('/settings/webhooks');
    await expect(page.getByRole('heading', { name: 'Webhooks', level: 1 })).toBeVisible();
    expect(await seriousViolations(page)).toEqual([]);

    const description = `E2E order system ${Date.now()}`;
    await page.getByLabel('Address (https)').fill(url);
    await page.getByLabel('Description').fill(description);
    await page.getByRole('button', { name: 'Register endpoint' }).click();
    const secret = (await page.getByLabel('Signing secret').textContent())!.trim();
    expect(secret).toMatch(/^flwh_[A-Za-z0-9_-]{43}$/);

    await page.reload();
    await expect(page.getByLabel('Signing secret')).toHaveCount(0);
    await page.getByRole('button', { name: `Send a test event to ${description}` }).click();
    await expect(page.getByText(`Test event delivered to “${description}”.`)).toBeVisible();
    const log = page.getByRole('table', { name: `Recent deliveries to ${description}` });
    await expect(log.getByRole('row').filter({ hasText: 'webhook.test' })).toContainText('Delivered');
    await expect(log.getByRole('row').filter({ hasText: 'webhook.test' })).toContainText('204');

    expect(got).toHaveLength(1);
    const m = /^t=(\d+),v1=([0-9a-f]{64})$/.exec(got[0].headers['fadeledger-signature'] as string);
    expect(m).not.toBeNull();
    expect(createHmac('sha256', secret).update(`${m![1]}.${got[0].body}`).digest('hex')).toBe(m![2]);
    expect(JSON.parse(got[0].body)).toMatchObject({ type: 'webhook.test' });
    expect(await seriousViolations(page)).toEqual([]);

    // On a phone the log fits the screen (no sideways scroll hiding the last error): attempts and
    // the HTTP status ride under the status.
    await page.setViewportSize({ width: 390, height: 844 });
    await page.reload();
    const phoneRow = log.getByRole('row').filter({ hasText: 'webhook.test' });
    await expect(phoneRow.getByText('1 attempt, HTTP 204', { exact: false })).toBeVisible();
    expect(await log.evaluate((t) => t.parentElement!.scrollWidth - t.parentElement!.clientWidth)).toBeLessThanOrEqual(1);
    await page.setViewportSize({ width: 1280, height: 900 });

    // Leave the demo as it was.
    await page.getByRole('button', { name: `Remove the webhook endpoint ${description}` }).click();
    await page.getByRole('button', { name: 'Remove', exact: true }).click();
    await expect(page.getByRole('heading', { name: description })).toHaveCount(0);
  } finally {
    await new Promise<void>((resolve) => server.close(() => resolve()));
  }
});
