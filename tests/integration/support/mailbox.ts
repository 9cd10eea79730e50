/**
 * The local mail catcher's REST API (maildev 3: GET /api/email, filters by dotted field, e.g.
 * `to.address`). Tests read the real message that our SMTP transport delivered.
 */
export type CaughtMail = { id: string; subject: string; text: string; html: string; to: { address: string }[]; from: { address: string; name?: string }[]; time: string };

const base = () => `http://127.0.0.1:${process.env.MAIL_WEB_PORT ?? '1081'}/api`;

export async function mailsTo(address: string): Promise<CaughtMail[]> {
  const res = await fetch(`${base()}/email?to.address=${encodeURIComponent(address.toLowerCase())}&sort=asc`);
  if (!res.ok) throw new Error(`mail catcher answered ${res.status}`);
  return (await res.json()) as CaughtMail[];
}

/** Waits until at least `count` messages reached the address (delivery is asynchronous). */
export async function waitForMails(address: string, count = 1, timeoutMs = 8_000): Promise<CaughtMail[]> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const mails = await mailsTo(address);
    if (mails.length >= count) return mails;
    if (Date.now() > until) throw new Error(`expected ${count} message(s) to ${address}, found ${mails.length}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

/** The first link into our app found in a message's text body. */
export function linkIn(mail: CaughtMail, pathPrefix: string): string {
  const appUrl = (process.env.APP_URL ?? 'http://localhost:3100').replace(/\/$/, '');
  const re = new RegExp(`${appUrl.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}${pathPrefix}[A-Za-z0-9_-]+`);
  const m = re.exec(mail.text);
  if (!m) throw new Error(`no ${pathPrefix} link in: ${mail.text}`);
  return m[0];
}

export const tokenFromLink = (link: string) => link.split('/').pop() as string;

/** The message as it arrived (maildev's parsed headers leave out Reply-To). */
export async function rawMessage(mail: { id: string }): Promise<string> {
  const res = await fetch(`${base()}/email/${encodeURIComponent(mail.id)}/source`);
  if (!res.ok) throw new Error(`mail catcher answered ${res.status}`);
  return res.text();
}

/** The addresses in a message's Reply-To header, lower-case and sorted ([] when there is none). */
export async function replyToOf(mail: { id: string }): Promise<string[]> {
  const raw = await rawMessage(mail);
  const head = raw.split(/\r?\n\r?\n/)[0].replace(/\r?\n[ \t]+/g, ' ');
  const line = /^reply-to:\s*(.*)$/im.exec(head)?.[1] ?? '';
  return [...line.matchAll(/[^\s<>,"]+@[^\s<>,"]+/g)].map((m) => m[0].toLowerCase()).sort();
}
