import { asSignedOut, asUser, callAction, inRequest } from './support/next-request';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { createHash } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { models } from '@/db/models';
import { closeSequelize } from '@/db/sequelize';
import { createShareLink, emailQuote, revokeShareLink } from '@/server/actions/share-links';
import { decideQuote } from '@/server/actions/customer-decision';
import { loadSharedQuote, openSharedPage } from '@/server/quotes/shared-quote';
import { addDays, utcDay } from '@/server/quotes/status';
import { createCompany, createCompanyWithSeats, createUserWithRole, signInAs, type TestCompany, type TestUser } from './support/factories';
import { linkIn, tokenFromLink, waitForMails, mailsTo } from './support/mailbox';
import { draftQuote, quoteRow, sentQuote } from './quotes-fixtures';

let company: TestCompany;
let installer: TestUser;
let sales: TestUser;
let otherSales: TestUser;
const meta = { ip: '203.0.113.9', userAgent: 'vitest customer' };
const person = new Headers({ 'user-agent': 'Mozilla/5.0 (X11; Linux x86_64) vitest' });

beforeAll(async () => {
  company = await createCompany();
  installer = await createUserWithRole(company.id, 'installer');
  sales = await createUserWithRole(company.id, 'sales');
  otherSales = await createUserWithRole((await createCompany()).id, 'sales');
});
afterAll(closeSequelize);
beforeEach(() => asSignedOut());

const sha256 = (s: string) => createHash('sha256').update(s, 'utf8').digest('hex');

describe('making and revoking links', () => {
  it('gives an unguessable URL once, stores only its sha256, and sends the draft', async () => {
    const { quoteId } = await draftQuote(installer);
    asUser(await signInAs(sales));
    const a = await callAction(createShareLink, { quoteId, expiresInDays: '14' });
    const b = await callAction(createShareLink, { quoteId });
    expect(a.state?.ok, JSON.stringify(a.state)).toBe(true);
    const urlA = (a.state as { data: { url: string } }).data.url;
    const urlB = (b.state as { data: { url: string } }).data.url;
    const token = tokenFromLink(urlA);
    // 32 random bytes in base64url = 43 characters (RFC 4648 §5, no padding).
    expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/);
    expect(urlA).toBe(`${process.env.APP_URL}/share/${token}`);
    expect(tokenFromLink(urlB)).not.toBe(token);

    const { sequelize } = models();
    const rows = await sequelize.query<Record<string, unknown>>('SELECT * FROM share_links WHERE quote_id = :quoteId ORDER BY id', { replacements: { quoteId }, type: QueryTypes.SELECT });
    expect(rows).toHaveLength(2);
    expect(rows[0].token_hash).toBe(sha256(token));
    // The raw token appears in no column of the table.
    expect(JSON.stringify(rows)).not.toContain(token);
    const days = (new Date(rows[0].expires_at as string).getTime() - Date.now()) / 86_400_000;
    expect(days).toBeGreaterThan(13.9);
    expect(days).toBeLessThanOrEqual(14);

    const q = await quoteRow(quoteId);
    expect(q.status).toBe('sent');
    expect(q.sentByUserId).toBe(sales.id);
    const kinds = (await models().QuoteEvent.findAll({ where: { quoteId }, order: [['id', 'ASC']] })).map((e) => e.kind);
    expect(kinds).toEqual(['created', 'link_created', 'sent', 'link_created']);
  });

  it('revokes a link: it stops opening the quote, and counts no more', async () => {
    const { quoteId, token, linkId } = await sentQuote(installer);
    expect(await loadSharedQuote(token)).not.toBeNull();
    asUser(await signInAs(sales));
    expect((await callAction(revokeShareLink, { quoteId, linkId })).state?.ok).toBe(true);
    expect(await loadSharedQuote(token)).toBeNull();
    // Twice is "not found": there is no active link with that id any more.
    expect((await callAction(revokeShareLink, { quoteId, linkId })).state).toMatchObject({ ok: false, code: 'not_found' });
  });

  it('is "not found" for another company’s quote; installers may share too (quote.share is company-wide)', async () => {
    const { quoteId } = await draftQuote(installer);
    asUser(await signInAs(otherSales));
    expect((await callAction(createShareLink, { quoteId })).state).toMatchObject({ ok: false, code: 'not_found' });
    expect((await quoteRow(quoteId)).status).toBe('draft');
    asUser(await signInAs(installer));
    expect((await callAction(createShareLink, { quoteId })).state?.ok).toBe(true);
  });

  it('counts active links against the plan, under the company lock, and frees a slot on revoke', async () => {
    // createCompanyWithSeats makes a plan with activeLinksLimit 5 (tests/integration/support/factories.ts).
    const small = await createCompanyWithSeats(5);
    const maker = await createUserWithRole(small.id, 'installer');
    const seller = await createUserWithRole(small.id, 'sales');
    const { quoteId } = await draftQuote(maker);
    const token = await signInAs(seller);
    const outs = await Promise.all(Array.from({ length: 8 }, () => inRequest(token, () => callAction(createShareLink, { quoteId }))));
    const ok = outs.filter((o) => o.state?.ok);
    const refused = outs.filter((o) => o.state?.ok === false);
    expect(ok).toHaveLength(5);
    expect(refused).toHaveLength(3);
    for (const r of refused) expect(r.state).toMatchObject({ ok: false, code: 'plan_limit', error: expect.stringContaining('5 active comparison links') });
    expect(await models().ShareLink.count({ where: { companyId: small.id } })).toBe(5);

    const first = (ok[0].state as { data: { linkId: number } }).data.linkId;
    asUser(token);
    expect((await callAction(revokeShareLink, { quoteId, linkId: first })).state?.ok).toBe(true);
    expect((await callAction(createShareLink, { quoteId })).state?.ok).toBe(true);
  });
});

describe('the customer’s link', () => {
  it('answers null (a 404) for unknown, malformed, expired and revoked tokens alike', async () => {
    const { token, linkId } = await sentQuote(installer);
    expect(await loadSharedQuote('x'.repeat(43))).toBeNull();
    expect(await loadSharedQuote('not a token')).toBeNull();
    expect(await loadSharedQuote(token.slice(0, -1) + (token.endsWith('A') ? 'B' : 'A'))).toBeNull();
    expect(await loadSharedQuote(token)).not.toBeNull();
    await models().ShareLink.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { id: linkId } });
    expect(await loadSharedQuote(token)).toBeNull();
    const other = await sentQuote(installer);
    await models().ShareLink.update({ revokedAt: new Date() }, { where: { id: other.linkId } });
    expect(await loadSharedQuote(other.token)).toBeNull();
  });

  it('shows only its own quote, and counts each view; the first moves sent → viewed', async () => {
    const mine = await sentQuote(installer, { customerName: 'Perpetua Wold' });
    const theirs = await sentQuote(installer, { customerName: 'Someone Else Entirely' });
    const page = await openSharedPage(mine.token, person, meta);
    expect(page?.quote.id).toBe(mine.quoteId);
    expect(page?.quote.customerName).toBe('Perpetua Wold');
    expect(JSON.stringify(page)).not.toContain('Someone Else Entirely');
    expect(page?.quote.status).toBe('viewed');
    await openSharedPage(mine.token, person, meta);
    await Promise.all([openSharedPage(mine.token, person, meta), openSharedPage(mine.token, person, meta)]);
    const link = await models().ShareLink.findByPk(mine.linkId);
    expect(link?.viewCount).toBe(4);
    expect(link?.lastViewedAt).toBeInstanceOf(Date);
    expect((await quoteRow(mine.quoteId)).status).toBe('viewed');
    expect((await quoteRow(theirs.quoteId)).status).toBe('sent');
    const viewed = await models().QuoteEvent.findAll({ where: { quoteId: mine.quoteId, kind: 'viewed' } });
    expect(viewed).toHaveLength(1);
    expect(viewed[0].ip).toBe(meta.ip);
  });

  it('does not count server-action re-renders, prefetches or link-preview robots', async () => {
    const { token, linkId } = await sentQuote(installer);
    await openSharedPage(token, new Headers({ 'next-action': 'abc', 'user-agent': 'Mozilla/5.0' }), meta);
    await openSharedPage(token, new Headers({ 'next-router-prefetch': '1', 'user-agent': 'Mozilla/5.0' }), meta);
    await openSharedPage(token, new Headers({ 'user-agent': 'Slackbot-LinkExpanding 1.0 (+https://api.slack.com/robots)' }), meta);
    expect((await models().ShareLink.findByPk(linkId))?.viewCount).toBe(0);
  });
});

describe('accept and decline', () => {
  it('accepts once with the customer’s name; a second answer is refused; the sales person gets an e-mail', async () => {
    const { quoteId, token } = await draftQuote(installer).then(async ({ quoteId }) => {
      asUser(await signInAs(sales));
      const out = await callAction(createShareLink, { quoteId });
      return { quoteId, token: tokenFromLink((out.state as { data: { url: string } }).data.url) };
    });
    asSignedOut();
    const accepted = await inRequest(null, () => callAction(decideQuote, { token, decision: 'accept', name: 'Ottoline Marsh', confirm: 'on' }), { 'user-agent': 'customer browser' });
    expect(accepted.state).toMatchObject({ ok: true, data: { status: 'accepted' } });
    const q = await quoteRow(quoteId);
    expect(q.status).toBe('accepted');
    expect(q.decidedByName).toBe('Ottoline Marsh');
    expect(q.decidedAt).toBeInstanceOf(Date);
    expect(q.decisionUserAgent).toBe('customer browser');

    const again = await inRequest(null, () => callAction(decideQuote, { token, decision: 'decline', name: 'Ottoline Marsh' }));
    expect(again.state).toMatchObject({ ok: false, code: 'conflict', error: expect.stringContaining('already accepted by Ottoline Marsh') });
    expect((await quoteRow(quoteId)).status).toBe('accepted');

    // The one who sent it (sales) hears of it; so does the installer who made it.
    const mails = await waitForMails(sales.email, 1);
    const last = mails.at(-1)!;
    expect(last.subject).toMatch(/accepted by Ottoline Marsh/);
    expect(linkIn(last, '/quotes/')).toBe(`${process.env.APP_URL}/quotes/${quoteId}`);
    expect((await waitForMails(installer.email, 1)).some((m) => m.subject.includes('accepted by Ottoline Marsh'))).toBe(true);

    // After the decision the page still opens and shows it.
    const page = await loadSharedQuote(token);
    expect(page?.quote).toMatchObject({ status: 'accepted', decidedByName: 'Ottoline Marsh' });
  });

  it('takes only one answer when two arrive at once', async () => {
    const { quoteId, token } = await sentQuote(installer);
    const outs = await Promise.all([
      inRequest(null, () => callAction(decideQuote, { token, decision: 'accept', name: 'Twin One', confirm: 'on' })),
      inRequest(null, () => callAction(decideQuote, { token, decision: 'decline', name: 'Twin Two' })),
    ]);
    expect(outs.filter((o) => o.state?.ok)).toHaveLength(1);
    expect(outs.filter((o) => o.state?.ok === false && o.state.code === 'conflict')).toHaveLength(1);
    const events = await models().QuoteEvent.findAll({ where: { quoteId } });
    expect(events.filter((e) => e.kind === 'accepted' || e.kind === 'declined')).toHaveLength(1);
  });

  it('declines with a comment', async () => {
    const { quoteId, token } = await sentQuote(installer);
    const out = await inRequest(null, () => callAction(decideQuote, { token, decision: 'decline', name: 'Ottoline Marsh', comment: 'We will wait until spring.' }));
    expect(out.state).toMatchObject({ ok: true, data: { status: 'declined' } });
    const q = await quoteRow(quoteId);
    expect([q.status, q.decisionComment]).toEqual(['declined', 'We will wait until spring.']);
  });

  it('wants a name and, to accept, the confirmation box', async () => {
    const { quoteId, token } = await sentQuote(installer);
    const noName = await inRequest(null, () => callAction(decideQuote, { token, decision: 'accept', name: ' ', confirm: 'on' }));
    expect(noName.state).toMatchObject({ ok: false, fieldErrors: { name: [expect.any(String)] } });
    const noBox = await inRequest(null, () => callAction(decideQuote, { token, decision: 'accept', name: 'Ottoline Marsh' }));
    expect(noBox.state).toMatchObject({ ok: false, fieldErrors: { confirm: [expect.any(String)] } });
    expect((await quoteRow(quoteId)).status).toBe('sent');
  });

  it('refuses an expired quote and records it as expired; a revoked link cannot decide', async () => {
    const { quoteId, token } = await sentQuote(installer);
    await models().Quote.update({ validUntil: addDays(utcDay(), -1) }, { where: { id: quoteId } });
    const out = await inRequest(null, () => callAction(decideQuote, { token, decision: 'accept', name: 'Late Larkin', confirm: 'on' }));
    expect(out.state).toMatchObject({ ok: false, code: 'conflict', error: expect.stringContaining('can no longer be accepted') });
    const q = await quoteRow(quoteId);
    expect(q.status).toBe('expired');
    expect(q.decidedByName).toBeNull();
    expect((await models().QuoteEvent.findAll({ where: { quoteId, kind: 'expired' } })).length).toBe(1);

    const revoked = await sentQuote(installer);
    await models().ShareLink.update({ revokedAt: new Date() }, { where: { id: revoked.linkId } });
    const denied = await inRequest(null, () => callAction(decideQuote, { token: revoked.token, decision: 'accept', name: 'Ottoline Marsh', confirm: 'on' }));
    expect(denied.state).toMatchObject({ ok: false, code: 'not_found' });
    expect((await quoteRow(revoked.quoteId)).status).toBe('sent');
  });
});

describe('e-mailing the quote', () => {
  it('sends the customer a working link and marks the quote sent', async () => {
    const customer = `customer-${Date.now()}@fenwold.example`;
    const { quoteId } = await draftQuote(installer, { customerEmail: customer });
    asUser(await signInAs(sales));
    const out = await callAction(emailQuote, { quoteId, message: 'As promised on the phone.' });
    expect(out.state, JSON.stringify(out.state)).toMatchObject({ ok: true, data: { to: customer } });
    const [mail] = await waitForMails(customer, 1);
    expect(mail.subject).toMatch(/^Quote Q-\d{4} from /);
    expect(mail.text).toContain('As promised on the phone.');
    expect(mail.text).toContain('$342.61');
    const link = linkIn(mail, '/share/');
    const shared = await loadSharedQuote(tokenFromLink(link));
    expect(shared?.quote.id).toBe(quoteId);
    const q = await quoteRow(quoteId);
    expect(q.status).toBe('sent');
    const kinds = (await models().QuoteEvent.findAll({ where: { quoteId } })).map((e) => e.kind);
    expect(kinds).toEqual(expect.arrayContaining(['link_created', 'sent', 'emailed']));
  });

  it('asks for an address when the quote has none, and leaves nothing behind', async () => {
    const { quoteId } = await draftQuote(installer, { customerEmail: null });
    asUser(await signInAs(sales));
    const out = await callAction(emailQuote, { quoteId });
    expect(out.state).toMatchObject({ ok: false, fieldErrors: { to: [expect.any(String)] } });
    expect(await models().ShareLink.count({ where: { quoteId } })).toBe(0);
    expect((await quoteRow(quoteId)).status).toBe('draft');
    expect(await mailsTo('nobody@fenwold.example')).toEqual([]);
  });
});
