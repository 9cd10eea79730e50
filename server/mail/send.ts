import 'server-only';
import { getEnv } from '@/server/env';
import { AppError } from '@/server/errors';
import { getTransport } from './transport';

export type OutgoingMail = {
  to: string;
  subject: string;
  text: string;
  html: string;
  replyTo?: string;
  /** Display name for the From line (a company's own name); the address stays MAIL_FROM's. */
  fromName?: string;
  attachments?: { filename: string; content: Buffer; contentType: string }[];
};

/** The address inside MAIL_FROM ("Name <a@b>" or a bare address). */
export function mailFromAddress(mailFrom: string): string {
  return (/<([^>]+)>/.exec(mailFrom)?.[1] ?? mailFrom).trim();
}

/** The mail server did not take the message; the action says so and nothing is half-done. */
export class MailDeliveryError extends AppError {
  constructor() {
    super('We could not send the e-mail just now. Please try again in a minute.', 503, 'mail_unavailable');
  }
}

/**
 * Sends one message with a plain-text and an HTML body, from MAIL_FROM's address (under the given
 * display name when there is one: the address must stay ours so SPF/DKIM of the sending domain hold).
 */
export async function sendMail(mail: OutgoingMail): Promise<{ messageId: string }> {
  try {
    const info = await getTransport().sendMail({
      from: mail.fromName ? { name: mail.fromName, address: mailFromAddress(getEnv().MAIL_FROM) } : getEnv().MAIL_FROM,
      to: mail.to,
      subject: mail.subject,
      text: mail.text,
      html: mail.html,
      replyTo: mail.replyTo,
      attachments: mail.attachments,
    });
    return { messageId: String(info.messageId) };
  } catch (error) {
    console.error('mail: delivery failed:', (error as Error).message);
    throw new MailDeliveryError();
  }
}
