import 'server-only';
import nodemailer, { type Transporter } from 'nodemailer';
import { getEnv } from '@/server/env';

const holder = globalThis as unknown as { __fadeledgerMailer?: Transporter };

/** One SMTP transport from the environment (the local mail catcher for `npm start` and tests). */
export function getTransport(): Transporter {
  if (!holder.__fadeledgerMailer) {
    const env = getEnv();
    holder.__fadeledgerMailer = nodemailer.createTransport({
      host: env.SMTP_HOST,
      port: env.SMTP_PORT,
      secure: env.SMTP_SECURE,
      auth: env.SMTP_USER ? { user: env.SMTP_USER, pass: env.SMTP_PASSWORD ?? '' } : undefined,
      connectionTimeout: 5_000,
      greetingTimeout: 5_000,
      socketTimeout: 10_000,
    });
  }
  return holder.__fadeledgerMailer;
}
