import { htmlFrame, textFrame } from './layout';

export type InvitationMail = { companyName: string; inviterName: string; roleLabel: string; acceptUrl: string; expiresAt: Date };

export function invitationMail(m: InvitationMail): { subject: string; text: string; html: string } {
  const content = {
    heading: `Join ${m.companyName} on FadeLedger`,
    paragraphs: [
      `${m.inviterName} has invited you to work in ${m.companyName}'s FadeLedger account as ${m.roleLabel}.`,
      'FadeLedger compares dish sizes for a customer site by link budget and rain-fade outage, and turns the chosen dish into a quote.',
      `The link works once and expires on ${formatUtc(m.expiresAt)}.`,
    ],
    action: { label: 'Accept the invitation', url: m.acceptUrl },
    footnote: 'If you did not expect this invitation, you can ignore this message; nothing happens unless the link is opened and accepted.',
  };
  return { subject: `${m.inviterName} invited you to ${m.companyName} on FadeLedger`, text: textFrame(content), html: htmlFrame(content) };
}

export function formatUtc(d: Date): string {
  return d.toISOString().replace('T', ' ').slice(0, 16) + ' UTC';
}
