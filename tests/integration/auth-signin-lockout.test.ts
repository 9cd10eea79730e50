import { callAction, inRequest, setRequestHeaders } from './support/next-request';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { cookies } from 'next/headers';
import { Op } from 'sequelize';
import { models } from '@/db/models';
import { closeSequelize } from '@/db/sequelize';
import { signIn, unlockSignIn } from '@/server/actions/auth';
import { claimAttempt, THROTTLE_RULES, ThrottledError, UNLOCK_HINT } from '@/server/auth/throttle';
import { CLIENT_COOKIE } from '@/server/auth/sign-in-client';
import { inspectUnlockLink, UNLOCK_LINK_DEAD } from '@/server/auth/sign-in-unlock';
import { createCompany, createUserWithRole, suffix, uniqueEmail, TEST_PASSWORD } from './support/factories';
import { linkIn, mailsTo, tokenFromLink, waitForMails } from './support/mailbox';
import { attemptsTracker } from './support/throttle-cleanup';

/**
 * Default configuration (TRUST_PROXY unset, so no request has a known IP): strangers can slow
 * down guessing at an address but cannot lock its owner out. The owner's browsers stay usable;
 * a new browser held back by the shared budgets gets in through a mailed link.
 */
const attempts = attemptsTracker();
afterAll(async () => {
  await attempts.forget();
  await closeSequelize();
});
beforeEach(() => setRequestHeaders({}));

const PER_EMAIL = THROTTLE_RULES.sign_in.perEmail!;
const GLOBAL = THROTTLE_RULES.sign_in.global!;

/** One request from a browser that holds this client cookie (null: a script that keeps none). */
function fromBrowser<T>(clientCookie: string | null, fn: () => Promise<T>): Promise<T> {
  return inRequest(null, async () => {
    if (clientCookie) (await cookies()).set(CLIENT_COOKIE, clientCookie);
    return fn();
  });
}
const newBrowser = () => `br-${suffix()}${suffix()}${suffix()}${suffix()}`.padEnd(43, 'z');
const tryPassword = (browser: string | null, email: string, password: string) => fromBrowser(browser, () => callAction(signIn, { email: attempts.track(email), password }));
const codeOf = (o: Awaited<ReturnType<typeof callAction>>) => (o.state && !o.state.ok ? o.state.code : o.redirect ? 'signed_in' : 'ok');

/** A stranger (a new client each try, as a script dropping cookies is) fills the address's budget. */
async function strangerFills(email: string): Promise<void> {
  for (let i = 0; i < PER_EMAIL.max; i++) expect(codeOf(await tryPassword(null, email, `guess-${i}`))).toBe('invalid_input');
  expect(codeOf(await tryPassword(null, email, 'guess-again'))).toBe('rate_limited');
}

describe('wrong passwords by strangers cannot lock the owner out', () => {
  it('an admin keeps signing in from a browser they used before, however many wrong passwords others sent', async () => {
    const admin = await createUserWithRole((await createCompany()).id, 'admin');
    const laptop = newBrowser();
    expect((await tryPassword(laptop, admin.email, TEST_PASSWORD)).redirect).toBe('/dashboard');
    await strangerFills(admin.email);
    // Even a stranger who keeps one cookie is held back…
    expect(codeOf(await tryPassword(newBrowser(), admin.email, 'another-guess'))).toBe('rate_limited');
    // …the owner is not: five, ten, twenty wrong passwords elsewhere change nothing here.
    expect((await tryPassword(laptop, admin.email, TEST_PASSWORD)).redirect).toBe('/dashboard');
  });

  it('the owner on a new browser is held back, is mailed a link once, and the link lets that browser in', async () => {
    const owner = await createUserWithRole((await createCompany()).id, 'installer');
    await strangerFills(owner.email);
    const phone = newBrowser();
    const held = await tryPassword(phone, owner.email, TEST_PASSWORD);
    expect(held.state).toMatchObject({ ok: false, code: 'rate_limited', error: expect.stringContaining(UNLOCK_HINT.trim()) });
    // The stranger's refusal mailed the link already; the owner's refusal and more hammering send no more.
    for (let i = 0; i < 3; i++) await tryPassword(null, owner.email, 'hammer');
    const [mail, ...more] = await waitForMails(owner.email, 1);
    expect(mail.subject).toBe('Sign in to FadeLedger from your browser');
    await new Promise((r) => setTimeout(r, 500));
    expect(more.length + (await mailsTo(owner.email)).length - 1).toBe(0);

    const token = tokenFromLink(linkIn(mail, '/unlock/'));
    expect(await inspectUnlockLink(token)).toEqual({ state: 'valid', email: owner.email });
    expect((await fromBrowser(phone, () => callAction(unlockSignIn, { token }))).redirect).toBe('/sign-in?unlocked=1');
    expect((await tryPassword(phone, owner.email, TEST_PASSWORD)).redirect).toBe('/dashboard');

    // The link works once, and opens the door for that browser only.
    expect(await inspectUnlockLink(token)).toEqual({ state: 'dead' });
    expect((await fromBrowser(newBrowser(), () => callAction(unlockSignIn, { token }))).state).toMatchObject({ ok: false, error: UNLOCK_LINK_DEAD });
    expect(codeOf(await tryPassword(newBrowser(), owner.email, TEST_PASSWORD))).toBe('rate_limited');
  });

  it('no mail goes out for an address without an account, and the answer reads the same', async () => {
    const nobody = uniqueEmail('nobody');
    const known = await createUserWithRole((await createCompany()).id, 'sales');
    await strangerFills(nobody);
    await strangerFills(known.email);
    const a = await tryPassword(newBrowser(), nobody, 'x-password');
    const b = await tryPassword(newBrowser(), known.email, 'x-password');
    expect(a.state && !a.state.ok ? a.state.error : null).toBe(b.state && !b.state.ok ? b.state.error : 'different');
    await waitForMails(known.email, 1);
    expect(await mailsTo(nobody)).toEqual([]);
  });
});

describe('the global budget', () => {
  // Judged at a moment a day ahead, with rows planted there: nobody else's sign-ins (which count
  // only attempts up to their own now) see them, and they are taken out again afterwards.
  const at = new Date(Date.now() + 24 * 3600_000);
  const tag = `global-${suffix()}`;
  afterAll(async () => {
    await models().SignInAttempt.destroy({ where: { email: { [Op.like]: `${tag}-%` } } });
  });

  it(`refuses untrusted sign-ins at any address once ${GLOBAL.max} untrusted failures fill the window; trusted browsers pass`, async () => {
    const { SignInAttempt } = models();
    const already = await SignInAttempt.count({ where: { kind: 'sign_in', trusted: false, succeeded: false, createdAt: { [Op.gte]: new Date(at.getTime() - GLOBAL.windowMinutes * 60_000), [Op.lte]: at } } });
    const fill = Math.max(0, GLOBAL.max - already - 1);
    await SignInAttempt.bulkCreate(Array.from({ length: fill }, (_, i) => ({ kind: 'sign_in' as const, email: `${tag}-${i}@test.example`, ip: null, client: null, succeeded: false, createdAt: at })));

    // The last slot goes to a fresh address from a fresh client…
    await claimAttempt('sign_in', { email: `${tag}-last@test.example`, ip: null, client: 'c'.repeat(64), trusted: false }, at);
    // …then any other untrusted attempt, at any address, waits.
    const refused = await claimAttempt('sign_in', { email: `${tag}-next@test.example`, ip: null, client: 'd'.repeat(64), trusted: false }, at).catch((e: unknown) => e);
    expect(refused).toBeInstanceOf(ThrottledError);
    expect((refused as ThrottledError).bucket).toBe('global');
    expect((refused as ThrottledError).message).toMatch(/^Too many sign-in attempts right now\. Try again in \d+ minutes?\./);
    // A browser trusted for its address is not counted against, nor held back by, the global budget.
    await expect(claimAttempt('sign_in', { email: `${tag}-owner@test.example`, ip: null, client: 'e'.repeat(64), trusted: true }, at)).resolves.toMatchObject({ kind: 'sign_in' });
  });
});
