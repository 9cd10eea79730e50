import { htmlFrame, textFrame } from '@/server/mail/templates/layout';
import { formatMoney } from '@/server/money-format';
import type { OptionReading } from '@/server/study-option';
import type { DecidedStatus } from './status';

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
};

/** The quote, sent to the customer with their comparison link. */
export function quoteToCustomerMail(m: QuoteToCustomerMail): { subject: string; text: string; html: string } {
  const paragraphs = [
    `Hello ${m.customerName},`,
    ...(m.message ? [m.message] : []),
    `${m.companyName} has prepared quote ${m.reference} for ${m.siteName}: a ${m.option.diameter.words} dish, ${formatMoney(m.total, m.currency)} in total, valid until ${dateWords(m.validUntil)}.`,
    `With it: ${m.option.outage.yearWords} Signal available ${m.option.availability.words}.`,
    'The page compares the dish sizes we looked at, in plain words: how many hours a year each would lose the signal to rain, and what each costs. You can accept or decline the quote there with your name.',
    `The link is personal to you and works until ${dateWords(m.linkExpiresAt.toISOString().slice(0, 10))}.`,
  ];
  const content = {
    heading: `Your quote from ${m.companyName}`,
    paragraphs,
    action: { label: 'Open your quote', url: m.linkUrl },
    footnote: `Sent by ${m.senderName} of ${m.companyName} through FadeLedger. Outage figures are long-term statistical averages, not guarantees for any one year.`,
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
