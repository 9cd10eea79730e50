/** One person or mailbox told of a customer's decision, and why (shown in the mail's greeting). */
export interface DecisionRecipient {
  email: string;
  name: string;
}

type Person = { name: string; email: string } | null;

/**
 * Who hears about a decision: the quote's author, everyone who shared it (the maker of the link the
 * customer used first, then whoever e-mailed it or made another link), the quote's sender, and the
 * company's sales contact from branding. One message per address: addresses compare
 * case-insensitively, and the first role named keeps its greeting.
 */
export function decisionRecipients(people: { author: Person; sharers: Person[]; sender: Person; salesContact: { companyName: string; email: string | null } | null }): DecisionRecipient[] {
  const seen = new Map<string, DecisionRecipient>();
  const add = (email: string | null | undefined, name: string) => {
    const key = email?.trim().toLowerCase();
    if (key && !seen.has(key)) seen.set(key, { email: email!.trim(), name });
  };
  for (const p of [people.author, ...people.sharers, people.sender]) if (p) add(p.email, p.name);
  if (people.salesContact) add(people.salesContact.email, `${people.salesContact.companyName} sales`);
  return [...seen.values()];
}
