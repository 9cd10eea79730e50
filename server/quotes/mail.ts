import { htmlFrame, textFrame } from '@/server/mail/templates/layout';
import { formatMoney } from '@/server/money-format';
import type { OptionReading } from '@/server/study-option';
import type { DecidedStatus } from './status';
import { contactSentence, type SellerContact } from './seller-contact';
import { endSentence } from './sentence';

const dateWords = (day: string) => new Date(`${day}T00:00:00Z`).toLocaleDateString('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });

export type QuoteToCustomerMail = {
  companyName: string;
  senderName: string;
  customerName: string;
  reference: string;
  siteName: string;
  /** The quoted option, read as the customer's page reads it. */
  option: OptionReading;
  total: string;
  currency: string;
  validUntil: string;
  linkUrl: string;
  linkExpiresAt: Date;
  message: string | null;
  contact: SellerContact;
};

/** The quote, sent to the customer with their comparison link. */
export function quoteToCustomerMail(m: QuoteToCustomerMail): { subject: string; text: string; html: string } {
  const paragraphs = [
    `Hello ${m.customerName},`,
    ...(m.message ? [m.message] : []),
    `${m.companyName} has prepared quote ${m.reference} for ${m.siteName}: a ${m.option.diameter.words} dish, ${formatMoney(m.total, m.currency)} in total, valid until ${dateWords(m.validUntil)}.`,
    `With it: ${m.option.outage.yearWords} Signal available ${m.option.availability.words}.`,
    'The page compares the dish sizes we looked at, in plain words: how many hours a year each would lose the signal to rain, and what each costs. You can accept or decline the quote there with your name.',
    `The link is personal to you and works until ${dateWords(m.linkExpiresAt.toISOString().slice(0, 10))}. The quote is attached as a PDF too.`,
    ...(contactSentence(m.contact) ? [contactSentence(m.contact) as string] : []),
  ];
  const content = {
    brand: m.companyName,
    heading: `Your quote from ${m.companyName}`,
    paragraphs,
    action: { label: 'Open your quote', url: m.linkUrl },
    footnote: `Sent by ${m.senderName} of ${m.companyName}; reply to this e-mail to reach them. Outage figures are long-term statistical averages, not guarantees for any one year.`,
  };
  return { subject: `Quote ${m.reference} from ${m.companyName}: ${m.siteName}`, text: textFrame(content), html: htmlFrame(content) };
}

export type DecisionToTeamMail = {
  recipientName: string;
  decision: DecidedStatus;
  reference: string;
  customerName: string;
  decidedByName: string;
  siteName: string;
  option: OptionReading;
  total: string;
  currency: string;
  comment: string | null;
  quoteUrl: string;
};

/** Tells the sales person (and the quote's maker) what the customer decided. */
export function decisionToTeamMail(m: DecisionToTeamMail): { subject: string; text: string; html: string } {
  const verb = m.decision === 'accepted' ? 'accepted' : 'declined';
  const content = {
    heading: `${m.reference} was ${verb}`,
    paragraphs: [
      `Hello ${m.recipientName},`,
      `${m.decidedByName} ${verb} quote ${m.reference} for ${m.customerName} (${m.siteName}): ${m.option.diameter.words}, ${formatMoney(m.total, m.currency)}.`,
      ...(m.comment ? [`Their comment: “${m.comment}”`] : []),
      m.decision === 'accepted' ? 'Time to book the installation.' : 'The quote is closed; you can make a new one from the study if they want to talk again.',
    ],
    action: { label: 'Open the quote', url: m.quoteUrl },
  };
  return { subject: `${m.reference} ${verb} by ${m.decidedByName}`, text: textFrame(content), html: htmlFrame(content) };
}

export type DecisionReceiptMail = {
  companyName: string;
  contact: SellerContact;
  decision: DecidedStatus;
  decidedByName: string;
  decidedAt: string;
  reference: string;
  siteName: string;
  option: OptionReading;
  total: string;
  currency: string;
  comment: string | null;
};

/** The customer's receipt for their decision (sent only to an address they typed themselves). */
export function decisionReceiptMail(m: DecisionReceiptMail): { subject: string; text: string; html: string } {
  const accepted = m.decision === 'accepted';
  const when = new Date(m.decidedAt).toLocaleString('en-GB', { day: 'numeric', month: 'long', year: 'numeric', hour: '2-digit', minute: '2-digit', timeZone: 'UTC', timeZoneName: 'short' });
  const content = {
    brand: m.companyName,
    heading: accepted ? `You accepted quote ${m.reference}` : `You declined quote ${m.reference}`,
    paragraphs: [
      endSentence(`Hello ${m.decidedByName}, this is your receipt from ${m.companyName}`),
      endSentence(`${accepted ? 'Accepted' : 'Declined'} on ${when}: quote ${m.reference} for ${m.siteName}, a ${m.option.diameter.words} dish for ${formatMoney(m.total, m.currency)} in total`),
      ...(m.comment ? [`Your comment: “${m.comment}”`] : []),
      accepted ? endSentence(`${m.companyName} has been told and will be in touch to book the installation`) : endSentence(`${m.companyName} has been told. If you change your mind, ask them for a new quote`),
      'The quote as you answered it is attached as a PDF.',
      ...(contactSentence(m.contact) ? [contactSentence(m.contact) as string] : []),
    ],
    footnote: 'Outage figures are long-term statistical averages, not guarantees for any one year.',
  };
  return { subject: `${accepted ? 'Accepted' : 'Declined'}: quote ${m.reference} from ${m.companyName}`, text: textFrame(content), html: htmlFrame(content) };
}
