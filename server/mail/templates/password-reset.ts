import { htmlFrame, textFrame } from './layout';
import { formatUtc } from './invitation';

export function passwordResetMail(m: { name: string; resetUrl: string; expiresAt: Date }): { subject: string; text: string; html: string } {
  const content = {
    heading: 'Choose a new password',
    paragraphs: [
      `Hello ${m.name}, someone asked to reset the password of the FadeLedger account that uses this address.`,
      `The link below works once and expires on ${formatUtc(m.expiresAt)}. Choosing a new password signs out every device that is signed in.`,
    ],
    action: { label: 'Choose a new password', url: m.resetUrl },
    footnote: 'If you did not ask for this, ignore this message: your password stays as it is.',
  };
  return { subject: 'Reset your FadeLedger password', text: textFrame(content), html: htmlFrame(content) };
}
