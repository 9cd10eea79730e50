import { htmlFrame, textFrame } from './layout';
import { formatUtc } from './invitation';

type Mail = { subject: string; text: string; html: string };

/** The link that finishes a sign-up for an address without an account. */
export function signUpConfirmMail(m: { name: string; companyName: string; confirmUrl: string; expiresAt: Date }): Mail {
  const content = {
    heading: 'Finish creating your FadeLedger account',
    paragraphs: [
      `Hello ${m.name}, someone (we hope you) asked to create a FadeLedger account for ${m.companyName} with this address.`,
      `Open the link below to confirm the address; the company account starts its free trial then. The link works once and expires on ${formatUtc(m.expiresAt)}.`,
    ],
    action: { label: 'Finish creating the account', url: m.confirmUrl },
    footnote: 'If you did not ask for this, ignore this message: nothing is created unless the link is opened.',
  };
  return { subject: 'Confirm your address to finish creating your FadeLedger account', text: textFrame(content), html: htmlFrame(content) };
}

/**
 * Sent instead when the address already has an account: the form said the same thing either
 * way, so only the owner of the inbox learns that the account exists.
 */
export function signUpExistingAccountMail(m: { name: string; signInUrl: string; resetUrl: string }): Mail {
  const content = {
    heading: 'You already have a FadeLedger account',
    paragraphs: [
      `Hello ${m.name},`,
      'Someone (maybe you) tried to create a FadeLedger account with this address. You already have one, so nothing new was created.',
      `To get in, sign in at ${m.signInUrl}. If you have forgotten the password, choose a new one at ${m.resetUrl}.`,
      'To start a separate company account, use a different e-mail address; an admin can also invite this address into another company.',
    ],
    action: { label: 'Sign in', url: m.signInUrl },
    footnote: 'If this was not you, you need do nothing: your account and password are unchanged.',
  };
  return { subject: 'You already have a FadeLedger account', text: textFrame(content), html: htmlFrame(content) };
}
