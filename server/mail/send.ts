import 'server-only';
import { getEnv } from '@/server/env';
import { AppError } from '@/server/errors';
import { getTransport } from './transport';

export type OutgoingMail = { to: string; subject: string; text: string; html: string; replyTo?: string };

/** The mail server did not take the message; the action says so and nothing is half-done. */
export class MailDeliveryError extends AppError {
  constructor() {
    super('We could not send the e-mail just now. Please try again in a minute.', 503, 'mail_unavailable');
  }
}

/** Sends one message with a plain-text and an HTML body, from MAIL_FROM. */
export async function sendMail(mail: OutgoingMail): Promise<{ messageId: string }> {
  try {
    const info = await getTransport().sendMail({
      from: getEnv().MAIL_FROM,
      to: mail.to,
      subject: mail.subject,
      text: mail.text,
      html: mail.html,
      replyTo: mail.replyTo,
    });
    return { messageId: String(info.messageId) };
  } catch (error) {
    console.error('mail: delivery failed:', (error as Error).message);
    throw new MailDeliveryError();
  }
}
