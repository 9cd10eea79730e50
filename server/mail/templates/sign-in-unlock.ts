import { htmlFrame, textFrame } from './layout';
import { formatUtc } from './invitation';

/** The owner's way past sign-in limits a stranger has filled: trust the browser that opens the link. */
export function signInUnlockMail(m: { name: string; unlockUrl: string; expiresAt: Date }): { subject: string; text: string; html: string } {
  const content = {
    heading: 'Sign in from your browser',
    paragraphs: [
      `Hello ${m.name}, sign-ins to the FadeLedger account that uses this address are being held back: there were too many wrong passwords for it, from you or from someone else.`,
      `Open the link below in the browser you want to sign in from, then sign in with your password as usual. That browser is then let through whatever anyone else tries. The link works once and expires on ${formatUtc(m.expiresAt)}.`,
    ],
    action: { label: 'Let this browser sign in', url: m.unlockUrl },
    footnote: 'If you did not try to sign in, someone may be guessing your password: you can ignore this message, or choose a new password from the sign-in page. Your password stays as it is.',
  };
  return { subject: 'Sign in to FadeLedger from your browser', text: textFrame(content), html: htmlFrame(content) };
}
