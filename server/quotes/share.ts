import 'server-only';
import type { Transaction } from 'sequelize';
import { models } from '@/db/models';
import { getQuote, insertQuoteEvent, moveQuoteStatus, type QuoteDetail } from '@/db/queries/quotes';
import { findSealedLink, insertShareLink, revokeShareLink } from '@/db/queries/share-links';
import { lockCompanyRow } from '@/db/queries/company-lock';
import { assertWithinPlan } from '@/server/plan-limit';
import { hashToken, newToken } from '@/server/auth/tokens';
import { getEnv } from '@/server/env';
import { ConflictError, InvalidInputError, NotFoundError } from '@/server/errors';
import { sendMail } from '@/server/mail/send';
import { getCompanyContact } from '@/db/queries/branding';
import { pdfFileName, renderQuotePdf } from './pdf/render';
import { replyToFor, sellerContact } from './seller-contact';
import { actorLabel, type QuoteActor } from './actor';
import { expireOverdueQuotes } from './expire';
import { quoteToCustomerMail } from './mail';
import { linkKeyFrom, openLinkToken, sealLinkToken } from './link-token-seal';
import { readQuotedOption } from '@/server/study-option';
import { isPastValidity, isShareable, quoteReference } from './status';

function shareUrl(token: string): string {
  return `${getEnv().APP_URL.replace(/\/$/, '')}/share/${token}`;
}

const linkKey = () => linkKeyFrom(getEnv().SHARE_LINK_KEY);

export interface NewShareLink {
  linkId: number;
  /** The raw token, in this URL; stored only as its digest and sealed under SHARE_LINK_KEY. */
  url: string;
  expiresAt: Date;
}

function assertCanShare(quote: QuoteDetail, now: Date): void {
  if (!isShareable(quote.status)) throw new ConflictError(`${quoteReference(quote.number)} is ${quote.status}; it cannot be shared any more.`);
  if (isPastValidity(quote.validUntil, now)) {
    throw new ConflictError(
      quote.status === 'draft'
        ? `${quoteReference(quote.number)} was valid until ${quote.validUntil}. Set a new valid-until date before sharing it.`
        : `${quoteReference(quote.number)} expired on ${quote.validUntil}; make a new quote from the study.`,
    );
  }
}

/**
 * Inside the caller's transaction: a new link (counted against the plan's active links under
 * the company lock), and the quote moves draft → sent with the sharer as its sender.
 */
async function addLink(actor: QuoteActor, quoteId: number, days: number, now: Date, t: Transaction, via: 'link' | 'email'): Promise<NewShareLink & { quote: QuoteDetail }> {
  await assertWithinPlan(await lockCompanyRow(actor.companyId, t), 'activeLinks');
  const quote = await getQuote(actor.companyId, quoteId, { t, lock: true });
  if (!quote) throw new NotFoundError('That quote');
  assertCanShare(quote, now);
  const token = newToken();
  const expiresAt = new Date(now.getTime() + days * 86_400_000);
  const tokenHash = hashToken(token);
  const linkId = await insertShareLink({ companyId: actor.companyId, quoteId: quote.id, tokenHash, tokenSealed: sealLinkToken(token, tokenHash, linkKey()), expiresAt, createdByUserId: actor.user.id }, t);
  const label = actorLabel(actor);
  await insertQuoteEvent({ companyId: actor.companyId, quoteId: quote.id, kind: 'link_created', actorUserId: actor.user.id, actorLabel: label, detail: { linkId, expiresAt: expiresAt.toISOString(), via } }, t);
  if (quote.status === 'draft') {
    await moveQuoteStatus(actor.companyId, quote.id, ['draft'], 'sent', { sentAt: now, sentByUserId: actor.user.id }, t);
    await insertQuoteEvent({ companyId: actor.companyId, quoteId: quote.id, kind: 'sent', fromStatus: 'draft', toStatus: 'sent', actorUserId: actor.user.id, actorLabel: label, detail: { via } }, t);
  }
  return { linkId, url: shareUrl(token), expiresAt, quote };
}

/** A comparison link for the customer, with its URL (the raw token). */
export async function createShareLink(actor: QuoteActor, quoteId: number, days: number, now: Date = new Date()): Promise<NewShareLink> {
  await expireOverdueQuotes(actor.companyId, now);
  const { sequelize } = models();
  const { linkId, url, expiresAt } = await sequelize.transaction((t) => addLink(actor, quoteId, days, now, t, 'link'));
  return { linkId, url, expiresAt };
}

/**
 * An active link's URL for anyone in the team who may share, so a colleague can send it again
 * instead of making a new one. Another company's link, or one that is revoked or expired, is
 * "not found"; a link made before tokens were kept sealed (or under another key) cannot be copied.
 */
export async function linkUrlForTeam(actor: QuoteActor, quoteId: number, linkId: number, now: Date = new Date()): Promise<{ url: string; expiresAt: Date }> {
  const link = await findSealedLink(actor.companyId, quoteId, linkId);
  if (!link || link.revokedAt || link.expiresAt.getTime() <= now.getTime()) throw new NotFoundError('That link');
  const token = link.tokenSealed ? openLinkToken(link.tokenSealed, link.tokenHash, linkKey()) : null;
  // The digest check makes sure the opened token is this row's own.
  if (!token || hashToken(token) !== link.tokenHash) throw new ConflictError('This link was made before links could be copied again. Make a new link instead.');
  return { url: shareUrl(token), expiresAt: link.expiresAt };
}

export async function revokeLink(actor: QuoteActor, quoteId: number, linkId: number): Promise<void> {
  const { sequelize } = models();
  await sequelize.transaction(async (t) => {
    if (!(await revokeShareLink(actor.companyId, quoteId, linkId, actor.user.id, t))) throw new NotFoundError('That link');
    await insertQuoteEvent({ companyId: actor.companyId, quoteId, kind: 'link_revoked', actorUserId: actor.user.id, actorLabel: actorLabel(actor), detail: { linkId } }, t);
  });
}

/**
 * E-mails the quote to the customer with a fresh link and the PDF attached, from the company's
 * name (our sending address) with Reply-To the sender and the company's contact address. The
 * message goes out inside the transaction: if the mail server refuses it, the link, the status
 * change and the event are rolled back together, so the team never sees "sent" for a message
 * nobody got.
 */
export async function emailQuote(
  actor: QuoteActor & { companyName: string },
  input: { quoteId: number; to: string | null; message: string | null; expiresInDays: number },
  now: Date = new Date(),
): Promise<{ to: string; expiresAt: Date }> {
  await expireOverdueQuotes(actor.companyId, now);
  const { sequelize } = models();
  return sequelize.transaction(async (t) => {
    const link = await addLink(actor, input.quoteId, input.expiresInDays, now, t, 'email');
    const to = input.to ?? link.quote.customerEmail;
    if (!to) throw new InvalidInputError('This quote has no customer e-mail address.', { to: ['Type the address to send the quote to.'] });
    const q = link.quote;
    const company = await getCompanyContact(actor.companyId, t);
    // The person sending is the seller the customer replies to (the quote's sender from now on).
    const contact = sellerContact(company ?? { name: actor.companyName, email: null, phone: null }, { name: actor.user.name, email: actor.user.email });
    const ref = quoteReference(q.number);
    const pdf = await renderQuotePdf(actor.companyId, actor.companyName, { ...q, status: q.status === 'draft' ? 'sent' : q.status, sentAt: q.sentAt ?? now.toISOString() }, now, contact);
    const mail = quoteToCustomerMail({
      companyName: actor.companyName,
      senderName: actor.user.name,
      customerName: q.customerName,
      reference: ref,
      siteName: q.siteName,
      option: readQuotedOption(q.chosenOption),
      total: q.total,
      currency: q.currency,
      validUntil: q.validUntil,
      linkUrl: link.url,
      linkExpiresAt: link.expiresAt,
      message: input.message,
      contact,
    });
    await insertQuoteEvent({ companyId: actor.companyId, quoteId: q.id, kind: 'emailed', actorUserId: actor.user.id, actorLabel: actorLabel(actor), detail: { to, linkId: link.linkId } }, t);
    await sendMail({
      to,
      subject: mail.subject,
      text: mail.text,
      html: mail.html,
      fromName: actor.companyName,
      replyTo: replyToFor(contact, actor.user.email),
      attachments: [{ filename: pdfFileName(ref, q.siteName), content: pdf, contentType: 'application/pdf' }],
    });
    return { to, expiresAt: link.expiresAt };
  });
}
