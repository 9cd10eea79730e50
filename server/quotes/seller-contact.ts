import { endSentence } from './sentence';

/** Who the customer should talk to about a quote (customer page, PDF, e-mails). Pure. */
export interface SellerContact {
  companyName: string;
  /** The salesperson who sent the quote (else its author), when known and still in the company. */
  personName: string | null;
  /** The company's contact address from branding, else that person's address. */
  email: string | null;
  /** The company's contact phone from branding. */
  phone: string | null;
}

export function sellerContact(company: { name: string; email: string | null; phone: string | null }, person: { name: string; email: string } | null): SellerContact {
  return { companyName: company.name, personName: person?.name ?? null, email: company.email ?? person?.email ?? null, phone: company.phone };
}

/** "Questions? E-mail … or call … to reach …", or null when there is no way to give. */
export function contactSentence(c: SellerContact): string | null {
  const ways = [c.email ? `e-mail ${c.email}` : null, c.phone ? `call ${c.phone}` : null].filter((w): w is string => w !== null);
  if (!ways.length) return null;
  const who = c.personName ? `${c.personName} at ${c.companyName}` : c.companyName;
  const how = ways.join(' or ');
  return endSentence(`Questions? ${how[0].toUpperCase()}${how.slice(1)} to reach ${who}`);
}

/** Reply-To of a message to a customer: the person who sent it and the company's contact address, once each. */
export function replyToFor(contact: SellerContact, senderEmail: string | null): string | undefined {
  const list = [senderEmail, contact.email].filter((a): a is string => Boolean(a));
  const unique = list.filter((a, i) => list.findIndex((b) => b.toLowerCase() === a.toLowerCase()) === i);
  return unique.length ? unique.join(', ') : undefined;
}
