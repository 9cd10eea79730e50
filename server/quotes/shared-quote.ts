import 'server-only';
import { models } from '@/db/models';
import { getQuote, insertQuoteEvent, moveQuoteStatus, quotePeople, type QuoteDetail } from '@/db/queries/quotes';
import { findLinkByTokenHash, quoteSharers, recordLinkView, type LinkByToken } from '@/db/queries/share-links';
import { getCompanyContact, getCompanyLogoInfo } from '@/db/queries/branding';
import { findMembership } from '@/db/queries/team';
import { getPlanLimits } from '@/server/billing/limits';
import { hashToken, looksLikeToken } from '@/server/auth/tokens';
import type { RequestMeta } from '@/server/auth/request-meta';
import { getEnv } from '@/server/env';
import { ConflictError, NotFoundError } from '@/server/errors';
import { sendMail } from '@/server/mail/send';
import { expireOverdueQuotes } from './expire';
import { decisionReceiptMail, decisionToTeamMail } from './mail';
import { decisionRecipients } from './decision-recipients';
import { pdfFileName, renderQuotePdf } from './pdf/render';
import { replyToFor, sellerContact, type SellerContact } from './seller-contact';
import { readQuotedOption } from '@/server/study-option';
import { isDecided, isPastValidity, OPEN_STATUSES, quoteReference, type DecidedStatus } from './status';
import { enqueueWebhookEvent } from '@/server/webhooks/outbox';
import { quoteEventData } from '@/server/webhooks/payloads';

const CUSTOMER_LABEL = 'Customer (comparison link)';

/** The link if it can be opened now; null for unknown, revoked and expired alike (all answer 404). */
async function openLink(token: string, now: Date): Promise<LinkByToken | null> {
  if (!looksLikeToken(token)) return null;
  const link = await findLinkByTokenHash(hashToken(token));
  if (!link || link.revokedAt || link.expiresAt.getTime() <= now.getTime()) return null;
  return link;
}

export interface SharedQuote {
  linkId: number;
  companyId: number;
  companyName: string;
  /** How the customer reaches the seller: the company's contact from branding, else the sender. */
  contact: SellerContact;
  /** Opened by a signed-in member of the company (or staff): shown as such, not counted as a customer view. */
  teamView: boolean;
  /** True when the plan includes quote branding and a logo is on file. */
  showLogo: boolean;
  quote: QuoteDetail;
}

/**
 * What the customer's page shows for a token, or null (→ 404). Records nothing: the page calls
 * recordShareView separately, so a refresh after a decision is not counted twice.
 */
export async function loadSharedQuote(token: string, now: Date = new Date()): Promise<SharedQuote | null> {
  const link = await openLink(token, now);
  if (!link) return null;
  await expireOverdueQuotes(link.companyId, now);
  const [quote, company, limits, logo] = await Promise.all([
    getQuote(link.companyId, link.quoteId),
    getCompanyContact(link.companyId),
    getPlanLimits(link.companyId),
    getCompanyLogoInfo(link.companyId),
  ]);
  if (!quote || !company) return null;
  const people = await quotePeople(link.companyId, quote.id);
  return {
    linkId: link.linkId,
    companyId: link.companyId,
    companyName: company.name,
    contact: sellerContact(company, people.sender ?? people.creator),
    teamView: false,
    showLogo: limits.quoteBranding && logo !== null,
    quote,
  };
}

/**
 * A link that exists but can no longer be opened (revoked, or past its expiry): the company
 * behind it and how to reach it, so the customer can ask for a new one. A token that never
 * existed is null: a guesser learns nothing about any company.
 */
export async function closedLinkSeller(token: string, now: Date = new Date()): Promise<SellerContact | null> {
  if (!looksLikeToken(token)) return null;
  const link = await findLinkByTokenHash(hashToken(token));
  if (!link || (!link.revokedAt && link.expiresAt.getTime() > now.getTime())) return null;
  const [company, people] = await Promise.all([getCompanyContact(link.companyId), quotePeople(link.companyId, link.quoteId)]);
  return company ? sellerContact(company, people.sender ?? people.creator) : null;
}

/** The logo for a customer's link (only when the plan includes branding), or null. */
export async function sharedLogoCompany(token: string, now: Date = new Date()): Promise<number | null> {
  const link = await openLink(token, now);
  if (!link) return null;
  const limits = await getPlanLimits(link.companyId);
  return limits.quoteBranding ? link.companyId : null;
}

/**
 * One view of the customer's page: the link's count goes up (atomically), and the first view of
 * a sent quote moves it to viewed with an event for the team's timeline.
 */
async function recordShareView(linkId: number, companyId: number, quote: QuoteDetail, meta: RequestMeta, now: Date = new Date()): Promise<void> {
  const { sequelize } = models();
  await sequelize.transaction(async (t) => {
    await recordLinkView(linkId, t);
    if (await moveQuoteStatus(companyId, quote.id, ['sent'], 'viewed', { firstViewedAt: now }, t)) {
      await insertQuoteEvent({ companyId, quoteId: quote.id, kind: 'viewed', fromStatus: 'sent', toStatus: 'viewed', actorLabel: CUSTOMER_LABEL, detail: { linkId }, ip: meta.ip }, t);
      await enqueueWebhookEvent(companyId, 'quote.viewed', quoteEventData(quote, { status: 'viewed', at: now }), t, { now });
    }
  });
}

export interface CustomerDecision {
  token: string;
  decision: 'accept' | 'decline';
  name: string;
  comment: string | null;
  /** Where the customer asked for a receipt; null sends none. */
  receiptEmail?: string | null;
}

/**
 * The customer accepts or declines, once. Under the link and quote row locks: the link must
 * still open, the quote must be sent or viewed and within its validity. A quote found past its
 * validity is recorded as expired (that write is kept) and the decision refused.
 * After commit the team is told by e-mail (decisionRecipients) and the customer gets a receipt
 * when they left an address; a mail failure does not undo the decision (the team sees it in the
 * app either way, and the customer on the page).
 */
export async function decideSharedQuote(input: CustomerDecision, meta: RequestMeta, now: Date = new Date()): Promise<{ status: DecidedStatus; quoteId: number }> {
  const link = await openLink(input.token, now);
  if (!link) throw new NotFoundError('This link');
  await expireOverdueQuotes(link.companyId, now);
  const { sequelize } = models();
  const to: DecidedStatus = input.decision === 'accept' ? 'accepted' : 'declined';
  const outcome = await sequelize.transaction(async (t) => {
    const locked = await findLinkByTokenHash(hashToken(input.token), { t, lock: true });
    if (!locked || locked.revokedAt || locked.expiresAt.getTime() <= now.getTime()) throw new NotFoundError('This link');
    const quote = await getQuote(link.companyId, link.quoteId, { t, lock: true });
    if (!quote) throw new NotFoundError('This link');
    if (isDecided(quote.status)) {
      throw new ConflictError(`This quote was already ${quote.status}${quote.decidedByName ? ` by ${quote.decidedByName}` : ''}${quote.decidedAt ? ` on ${quote.decidedAt.slice(0, 10)}` : ''}.`);
    }
    if (quote.status === 'expired' || isPastValidity(quote.validUntil, now)) {
      throw new ConflictError(`This quote was valid until ${quote.validUntil} and can no longer be accepted. Please ask for a new one.`);
    }
    const moved = await moveQuoteStatus(
      link.companyId,
      quote.id,
      OPEN_STATUSES,
      to,
      { decidedAt: now, decidedByName: input.name, decisionComment: input.comment, decisionIp: meta.ip, decisionUserAgent: meta.userAgent, decisionLinkId: link.linkId },
      t,
    );
    if (!moved) throw new ConflictError('This quote cannot be decided on any more.');
    await insertQuoteEvent({ companyId: link.companyId, quoteId: quote.id, kind: to, fromStatus: quote.status, toStatus: to, actorLabel: `${input.name} (customer)`, detail: { linkId: link.linkId, comment: input.comment, receipt: input.receiptEmail ? true : false }, ip: meta.ip }, t);
    await enqueueWebhookEvent(link.companyId, to === 'accepted' ? 'quote.accepted' : 'quote.declined', quoteEventData(quote, { status: to, at: now, decidedByName: input.name, comment: input.comment }), t, { now });
    return quote;
  });
  await tellTheTeam(link.companyId, link.linkId, outcome, to, input).catch((error) => console.error('quote decision: team e-mail failed:', (error as Error).message));
  if (input.receiptEmail) {
    await sendReceipt(link.companyId, outcome.id, input.receiptEmail, now).catch((error) => console.error('quote decision: receipt e-mail failed:', (error as Error).message));
  }
  return { status: to, quoteId: outcome.id };
}

/** The customer's receipt: what they decided, the quote's PDF as it now stands, and who to talk to. */
async function sendReceipt(companyId: number, quoteId: number, to: string, now: Date): Promise<void> {
  const [quote, company, people] = await Promise.all([getQuote(companyId, quoteId), getCompanyContact(companyId), quotePeople(companyId, quoteId)]);
  if (!quote || !company || !isDecided(quote.status)) return;
  const contact = sellerContact(company, people.sender ?? people.creator);
  const ref = quoteReference(quote.number);
  const mail = decisionReceiptMail({
    companyName: company.name,
    contact,
    decision: quote.status,
    decidedByName: quote.decidedByName ?? '',
    decidedAt: quote.decidedAt ?? now.toISOString(),
    reference: ref,
    siteName: quote.siteName,
    option: readQuotedOption(quote.chosenOption),
    total: quote.total,
    currency: quote.currency,
    comment: quote.decisionComment,
  });
  const pdf = await renderQuotePdf(companyId, company.name, quote, now, contact);
  await sendMail({
    to,
    ...mail,
    fromName: company.name,
    replyTo: replyToFor(contact, people.sender?.email ?? null),
    attachments: [{ filename: pdfFileName(ref, quote.siteName), content: pdf, contentType: 'application/pdf' }],
  });
}

async function tellTheTeam(companyId: number, linkId: number, quote: QuoteDetail, decision: DecidedStatus, input: CustomerDecision): Promise<void> {
  const [people, sharers, company] = await Promise.all([quotePeople(companyId, quote.id), quoteSharers(companyId, quote.id, linkId), getCompanyContact(companyId)]);
  const recipients = decisionRecipients({
    author: people.creator,
    sharers,
    sender: people.sender,
    salesContact: company ? { companyName: company.name, email: company.email } : null,
  });
  const quoteUrl = `${getEnv().APP_URL.replace(/\/$/, '')}/quotes/${quote.id}`;
  for (const { email, name } of recipients) {
    const mail = decisionToTeamMail({
      recipientName: name,
      decision,
      reference: quoteReference(quote.number),
      customerName: quote.customerName,
      decidedByName: input.name,
      siteName: quote.siteName,
      option: readQuotedOption(quote.chosenOption),
      total: quote.total,
      currency: quote.currency,
      comment: input.comment,
      quoteUrl,
    });
    await sendMail({ to: email, ...mail });
  }
}

/** Link unfurlers and mail scanners that fetch a URL without a person behind it (common practice, no source). */
const PREVIEW_AGENTS = /bot\b|crawler|spider|slurp|facebookexternalhit|embedly|preview|unfurl|whatsapp|skypeuripreview|outlook-ios-linkpreview|googleimageproxy/i;

/**
 * Whether this request is a person opening the page: not a server action re-render (the accept
 * form), not a router prefetch or refresh, not a link-preview robot.
 */
function countsAsView(h: Headers): boolean {
  if (h.get('next-action') || h.get('next-router-prefetch') || h.get('rsc') === '1') return false;
  const purpose = h.get('purpose') ?? h.get('sec-purpose') ?? '';
  if (/prefetch|prerender/i.test(purpose)) return false;
  return !PREVIEW_AGENTS.test(h.get('user-agent') ?? '');
}

/** Someone signed in, as the page's caller found them (server/auth/session.ts). */
export type SignedInViewer = { userId: string; isStaff: boolean } | null;

/** A member of the quote's company, or FadeLedger staff: looking at the customer's view, not a customer. */
async function isTeamViewer(viewer: SignedInViewer, companyId: number): Promise<boolean> {
  if (!viewer) return false;
  if (viewer.isStaff) return true;
  return (await findMembership(viewer.userId, companyId)) !== null;
}

/**
 * The customer's page: the quote for the token (null → 404), counting the view when a person
 * opened it who is not one of the company's own team (their checks would turn Sent into Viewed).
 */
export async function openSharedPage(token: string, h: Headers, meta: RequestMeta, viewer: SignedInViewer = null, now: Date = new Date()): Promise<SharedQuote | null> {
  const loaded = await loadSharedQuote(token, now);
  if (!loaded) return null;
  const shared = { ...loaded, teamView: await isTeamViewer(viewer, loaded.companyId) };
  if (shared.teamView || !countsAsView(h)) return shared;
  await recordShareView(shared.linkId, shared.companyId, shared.quote, meta, now);
  const status = shared.quote.status === 'sent' ? 'viewed' : shared.quote.status;
  return { ...shared, quote: { ...shared.quote, status } };
}
