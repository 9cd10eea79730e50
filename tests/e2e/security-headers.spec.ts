import { test, expect, type APIResponse, type Page } from '@playwright/test';
import { signIn } from './support/sign-in';
import { DEMO_USERS } from '../../db/demo/accounts';

/**
 * Security headers on a page of every group (marketing, auth, app, staff, share) and on the API,
 * and the page CSP in force: the app's own scripts run under it (no violation reported while the
 * pages hydrate, draw charts and post forms), and no page can be framed.
 */
const installer = DEMO_USERS.find((u) => u.role === 'installer' && u.company === 'quillfeather')!;
const staff = DEMO_USERS.find((u) => u.role === 'staff')!;
// A well-formed link token that opens nothing: the share group answers it (404) with the same headers.
const shareToken = 'h'.repeat(43);

function expectCommonHeaders(h: Record<string, string>, where: string) {
  expect(h['x-frame-options'], where).toBe('DENY');
  expect(h['x-content-type-options'], where).toBe('nosniff');
  expect(h['referrer-policy'], where).toBe('no-referrer');
  expect(h['permissions-policy'], where).toContain('geolocation=(self)');
  expect(h['permissions-policy'], where).toContain('camera=()');
  expect(h['content-security-policy'], where).toContain("frame-ancestors 'none'");
  // The test profile is plain http on localhost: HSTS would be wrong there.
  expect(h['strict-transport-security'], where).toBeUndefined();
}

/** A page's CSP: scripts only with a nonce that is fresh for every response. */
function pageNonce(res: APIResponse, where: string): string {
  const csp = res.headers()['content-security-policy'] ?? '';
  expect(csp, where).toMatch(/script-src 'self' 'nonce-[A-Za-z0-9+/=]{20,}' 'strict-dynamic'/);
  expect(csp, where).not.toContain("'unsafe-inline' 'unsafe-eval'");
  expect(csp, where).toContain("object-src 'none'");
  expect(csp, where).toContain("base-uri 'none'");
  return /'nonce-([^']+)'/.exec(csp)![1];
}

/** Every <script> in the HTML carries the response's nonce. */
async function scriptsCarry(res: APIResponse, nonce: string, where: string) {
  const html = await res.text();
  const scripts = html.match(/<script\b[^>]*>/g) ?? [];
  expect(scripts.length, where).toBeGreaterThan(0);
  for (const tag of scripts) expect(tag, where).toContain(`nonce="${nonce}"`);
}

test('every page group and the API answer with the security headers', async ({ browser, request }) => {
  const anonymous = [
    ['marketing', '/'],
    ['marketing', '/pricing'],
    ['auth', '/sign-in'],
    ['auth', '/forgot-password'],
    ['share', `/share/${shareToken}`],
  ] as const;
  const nonces = new Set<string>();
  for (const [group, path] of anonymous) {
    const res = await request.get(path);
    expect(res.status(), path).toBeLessThan(500);
    expectCommonHeaders(res.headers(), `${group} ${path}`);
    const nonce = pageNonce(res, path);
    nonces.add(nonce);
    await scriptsCarry(res, nonce, path);
  }
  expect(nonces.size, 'a fresh nonce for every response').toBe(anonymous.length);

  for (const [group, user, path] of [
    ['app', installer, '/dashboard'],
    ['staff', staff, '/staff'],
  ] as const) {
    const ctx = await browser.newContext();
    const page = await ctx.newPage();
    await signIn(page, user.email);
    const res = await ctx.request.get(path, { maxRedirects: 0 });
    expect(res.status(), path).toBe(200);
    expectCommonHeaders(res.headers(), `${group} ${path}`);
    await scriptsCarry(res, pageNonce(res, path), path);
    // The API, with the same session: JSON needs no script at all.
    const api = await ctx.request.get('/api/v1/me');
    expect(api.status()).toBe(200);
    expectCommonHeaders(api.headers(), 'api /api/v1/me');
    expect(api.headers()['content-security-policy']).toBe("default-src 'none'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'");
    await ctx.close();
  }

  for (const path of ['/api/health', '/api/v1/me']) {
    const res = await request.get(path);
    expectCommonHeaders(res.headers(), `api ${path}`);
  }
  // HSTS only when served over https: a client claiming https itself is not believed without a
  // trusted proxy (TRUST_PROXY is off on the test profile), so neither the page nor the API sends it.
  for (const path of ['/sign-in', '/api/health']) {
    const res = await request.get(path, { headers: { 'x-forwarded-proto': 'https' } });
    expect(res.headers()['strict-transport-security'], path).toBeUndefined();
    expect(res.headers()['content-security-policy'], path).not.toContain('upgrade-insecure-requests');
  }
  const hook = await request.post('/api/webhooks/stripe', { data: '{}', headers: { 'content-type': 'application/json' } });
  expect(hook.status()).toBe(400); // unsigned
  expect(hook.headers()['x-frame-options']).toBe('DENY');
  expect(hook.headers()['x-content-type-options']).toBe('nosniff');
});

/** Collects CSP violations the browser reports while the page runs. */
function cspViolations(page: Page): string[] {
  const seen: string[] = [];
  page.on('console', (m) => {
    if (/Content Security Policy|Refused to (execute|load|apply|connect|frame)/i.test(m.text())) seen.push(m.text());
  });
  return seen;
}

test('the app runs under its CSP: hydration, charts and forms report no violation', async ({ browser }) => {
  test.setTimeout(120_000);
  const page = await (await browser.newContext()).newPage();
  const violations = cspViolations(page);
  await page.goto('/');
  await page.getByRole('link', { name: 'Plans' }).click(); // client-side navigation needs the runtime
  await expect(page).toHaveURL(/\/pricing$/);
  await signIn(page, installer.email); // a server action through useActionState
  await page.goto('/studies');
  const firstStudy = page.locator('a[href^="/studies/"]').filter({ hasNotText: /new/i }).first();
  await firstStudy.click();
  await expect(page).toHaveURL(/\/studies\/\d+/);
  // Chart.js draws into canvases only once the client code has run.
  await expect(page.locator('canvas').first()).toBeVisible({ timeout: 20_000 });
  expect(violations).toEqual([]);
});

test('no page can be framed, the customer page included', async ({ page, baseURL }) => {
  const violations = cspViolations(page);
  for (const path of ['/sign-in', `/share/${shareToken}`]) {
    await page.setContent(`<iframe id="f" src="${baseURL}${path}" width="600" height="400"></iframe>`);
    const frame = page.frames().find((f) => f !== page.mainFrame())!;
    await page.waitForTimeout(1500);
    // A refused frame stays on Chrome's error page: none of our content is in it.
    const text = await frame.locator('body').innerText().catch(() => '');
    expect(text, path).not.toMatch(/Sign in|FadeLedger/);
  }
  expect(violations.some((v) => /frame-ancestors|X-Frame-Options/i.test(v))).toBe(true);
});
