import { asSignedOut, asUser, callAction, inRequest } from './support/next-request';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { createHash } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { models } from '@/db/models';
import { closeSequelize } from '@/db/sequelize';
import { findLinkByTokenHash } from '@/db/queries/share-links';
import { setCompanyContact } from '@/db/queries/branding';
import { copyShareLink, createShareLink, emailQuote } from '@/server/actions/share-links';
import { saveCompanyContact } from '@/server/actions/branding';
import { decideQuote } from '@/server/actions/customer-decision';
import { closedLinkSeller, openSharedPage } from '@/server/quotes/shared-quote';
import { revokeLink } from '@/server/quotes/share';
import { createCompany, createUserWithRole, signInAs, type TestCompany, type TestUser } from './support/factories';
import { mailsTo, replyToOf, tokenFromLink, waitForMails, type CaughtMail } from './support/mailbox';
import { draftQuote, quoteRow, sentQuote } from './quotes-fixtures';

/**
 * Issue 14 (part A): links the team can share again (sealed at rest, looked up by digest), team
 * members' views not counted, who hears of a decision, the customer's receipt, and quote e-mails
 * from the company's name with a Reply-To and the PDF attached. Real MariaDB and mail catcher.
 */
let company: TestCompany;
let installer: TestUser;
let sales: TestUser;
let outsider: TestUser;
const meta = { ip: '203.0.113.14', userAgent: 'vitest customer' };
const person = new Headers({ 'user-agent': 'Mozilla/5.0 (X11; Linux x86_64) vitest' });
const sha256 = (s: string) => createHash('sha256').update(s, 'utf8').digest('hex');
const stamp = () => `${Date.now().toString(36)}${Math.floor(Math.random() * 1e4)}`;
const urlOf = (out: { state?: unknown }) => (out.state as { data: { url: string } }).data.url;

type MaildevMail = CaughtMail & { attachments?: { contentType: string; filename?: string }[] };

beforeAll(async () => {
  company = await createCompany({ name: `Gullwing Reef Research Buoy ${stamp()} Co.` });
  installer = await createUserWithRole(company.id, 'installer');
  sales = await createUserWithRole(company.id, 'sales');
  outsider = await createUserWithRole((await createCompany()).id, 'admin');
});
afterAll(closeSequelize);
beforeEach(() => asSignedOut());

describe('links kept sealed, copied by the team', () => {
  it('stores no plaintext token, finds the link by digest only, and lets a colleague copy it', async () => {
    const { quoteId } = await draftQuote(installer);
    asUser(await signInAs(installer));
    const made = await callAction(createShareLink, { quoteId, expiresInDays: '14' });
    expect(made.state?.ok, JSON.stringify(made.state)).toBe(true);
    const url = urlOf(made);
    const token = tokenFromLink(url);
    const linkId = (made.state as { data: { linkId: number } }).data.linkId;

    const [row] = await models().sequelize.query<Record<string, unknown>>('SELECT * FROM share_links WHERE id = :linkId', { replacements: { linkId }, type: QueryTypes.SELECT });
    expect(row.token_hash).toBe(sha256(token));
    expect(String(row.token_sealed)).toMatch(/^v1\.[A-Za-z0-9_-]+\.[A-Za-z0-9_-]+\.[A-Za-z0-9_-]+$/);
    // Neither the token nor its base64url body appears anywhere in the row.
    expect(JSON.stringify(row)).not.toContain(token);
    expect(JSON.stringify(row)).not.toContain(Buffer.from(token).toString('base64url'));
    expect((await findLinkByTokenHash(sha256(token)))?.linkId).toBe(linkId);

    // Sales, who did not make it, gets the very same URL back.
    asUser(await signInAs(sales));
    const copied = await callAction(copyShareLink, { quoteId, linkId });
    expect(copied.state?.ok, JSON.stringify(copied.state)).toBe(true);
    expect(urlOf(copied)).toBe(url);

    // Another company's admin: not found, and no URL in the answer.
    asUser(await signInAs(outsider));
    const theirs = await callAction(copyShareLink, { quoteId, linkId });
    expect(theirs.state).toMatchObject({ ok: false, code: 'not_found' });
    expect(JSON.stringify(theirs.state)).not.toContain(token);
  });

  it('will not open a sealed token moved onto another row, nor copy a revoked link', async () => {
    const a = await sentQuote(installer);
    const b = await sentQuote(installer);
    const { ShareLink } = models();
    const sealedA = (await ShareLink.findByPk(a.linkId))!.tokenSealed;
    await ShareLink.update({ tokenSealed: sealedA }, { where: { id: b.linkId } });
    asUser(await signInAs(sales));
    // The digest is the sealed value's authenticated data: A's ciphertext does not open on B's row.
    expect((await callAction(copyShareLink, { quoteId: b.quoteId, linkId: b.linkId })).state).toMatchObject({ ok: false, code: 'conflict' });
    await revokeLink({ companyId: company.id, user: { id: sales.id, name: sales.name, email: sales.email } }, a.quoteId, a.linkId);
    expect((await callAction(copyShareLink, { quoteId: a.quoteId, linkId: a.linkId })).state).toMatchObject({ ok: false, code: 'not_found' });
  });
});

describe('views by the team', () => {
  it('a signed-in member of the company leaves the status and the count alone; a stranger’s view counts', async () => {
    const { quoteId, token, linkId } = await sentQuote(installer);
    const seen = await openSharedPage(token, person, meta, { userId: sales.id, isStaff: false });
    expect(seen?.teamView).toBe(true);
    expect((await quoteRow(quoteId)).status).toBe('sent');
    expect((await models().ShareLink.findByPk(linkId))?.viewCount).toBe(0);

    // Someone signed in to another company is not this team: that is a customer's view.
    const other = await openSharedPage(token, person, meta, { userId: outsider.id, isStaff: false });
    expect(other?.teamView).toBe(false);
    expect((await quoteRow(quoteId)).status).toBe('viewed');
    expect((await models().ShareLink.findByPk(linkId))?.viewCount).toBe(1);
  });
});

describe('a link that no longer opens', () => {
  it('names the company for a revoked link, and nothing for a token that never existed', async () => {
    const { quoteId, token, linkId } = await sentQuote(installer);
    await setCompanyContact(company.id, { email: 'desk@gullwing.example', phone: '+44 1632 960 014' });
    expect(await closedLinkSeller(token)).toBeNull(); // still open: the page itself answers
    await revokeLink({ companyId: company.id, user: { id: sales.id, name: sales.name, email: sales.email } }, quoteId, linkId);
    expect(await closedLinkSeller(token)).toMatchObject({ companyName: company.name, email: 'desk@gullwing.example', phone: '+44 1632 960 014' });
    expect(await closedLinkSeller('A'.repeat(43))).toBeNull();
    expect(await closedLinkSeller('not a token')).toBeNull();
    await setCompanyContact(company.id, { email: null, phone: null });
  });
});

describe('who hears of a decision, and the customer’s receipt', () => {
  it('tells the author, the link’s maker and the sales contact once each, and sends the customer a receipt with the PDF', async () => {
    const contact = `sales-desk-${stamp()}@gullwing.example`;
    asUser(await signInAs((await createUserWithRole(company.id, 'admin'))));
    expect((await callAction(saveCompanyContact, { contactEmail: contact, contactPhone: '+44 1632 960 200' })).state?.ok).toBe(true);
    const { quoteId } = await draftQuote(installer);
    asUser(await signInAs(sales));
    const token = tokenFromLink(urlOf(await callAction(createShareLink, { quoteId })));
    const before = { installer: (await mailsTo(installer.email)).length, sales: (await mailsTo(sales.email)).length };
    const receipt = `customer-${stamp()}@fenwold.example`;
    const out = await inRequest(null, () => callAction(decideQuote, { token, decision: 'accept', name: 'Ottoline Marsh', confirm: 'on', receiptEmail: receipt }));
    expect(out.state).toMatchObject({ ok: true, message: expect.stringContaining(`receipt is on its way to ${receipt}`) });

    const toInstaller = (await waitForMails(installer.email, before.installer + 1)).slice(before.installer);
    const toSales = (await waitForMails(sales.email, before.sales + 1)).slice(before.sales);
    const toDesk = await waitForMails(contact, 1);
    for (const list of [toInstaller, toSales, toDesk]) {
      expect(list.filter((m) => m.subject.includes('accepted by Ottoline Marsh'))).toHaveLength(1);
    }

    const [mail] = (await waitForMails(receipt, 1)) as MaildevMail[];
    expect(mail.subject).toBe(`Accepted: quote ${mail.subject.split(' ')[2]} from ${company.name}`);
    expect(mail.from[0]).toMatchObject({ name: company.name });
    expect(await replyToOf(mail)).toEqual([contact, sales.email].map((a) => a.toLowerCase()).sort());
    expect(mail.text).toContain(`this is your receipt from ${company.name}`);
    // The company name ends in "Co.": no second full stop after it.
    expect(mail.text).not.toContain('Co..');
    expect(mail.attachments?.map((a) => a.contentType)).toEqual(['application/pdf']);
    expect(mail.attachments?.[0].filename).toMatch(/^Q-\d{4}-.+\.pdf$/);
    await setCompanyContact(company.id, { email: null, phone: null });
  });

  it('tells the salesperson who e-mailed the quote even when the customer used the installer’s link', async () => {
    const to = `buyer-${stamp()}@fenwold.example`;
    const { quoteId, token } = await sentQuote(installer, { customerEmail: to });
    asUser(await signInAs(sales));
    expect((await callAction(emailQuote, { quoteId })).state?.ok).toBe(true);
    const before = (await mailsTo(sales.email)).length;
    expect((await inRequest(null, () => callAction(decideQuote, { token, decision: 'accept', name: 'Ottoline Marsh', confirm: 'on' }))).state?.ok).toBe(true);
    const told = (await waitForMails(sales.email, before + 1)).slice(before);
    expect(told.filter((m) => m.subject.includes('accepted by Ottoline Marsh'))).toHaveLength(1);
  });

  it('one message per address when the sales contact is the author', async () => {
    await setCompanyContact(company.id, { email: installer.email.toUpperCase(), phone: null });
    const { token } = await sentQuote(installer);
    const before = (await mailsTo(installer.email)).length;
    const out = await inRequest(null, () => callAction(decideQuote, { token, decision: 'decline', name: 'Ottoline Marsh' }));
    expect(out.state?.ok).toBe(true);
    await waitForMails(installer.email, before + 1);
    await new Promise((r) => setTimeout(r, 500));
    expect((await mailsTo(installer.email)).slice(before).filter((m) => m.subject.includes('declined by Ottoline Marsh'))).toHaveLength(1);
    await setCompanyContact(company.id, { email: null, phone: null });
  });
});

describe('the quote e-mail', () => {
  it('comes from the company’s name, replies reach the sender, and the PDF is attached', async () => {
    const to = `buyer-${stamp()}@fenwold.example`;
    const { quoteId } = await draftQuote(installer, { customerEmail: to });
    asUser(await signInAs(sales));
    const out = await callAction(emailQuote, { quoteId });
    expect(out.state?.ok, JSON.stringify(out.state)).toBe(true);
    const [mail] = (await waitForMails(to, 1)) as MaildevMail[];
    expect(mail.from[0].name).toBe(company.name);
    expect(mail.from[0].address).toBe(/<([^>]+)>/.exec(process.env.MAIL_FROM ?? '')?.[1] ?? process.env.MAIL_FROM);
    expect(await replyToOf(mail)).toEqual([sales.email.toLowerCase()]);
    expect(mail.text).toContain(`Questions? E-mail ${sales.email}`);
    expect(mail.attachments).toHaveLength(1);
    expect(mail.attachments![0].contentType).toBe('application/pdf');
  });
});
