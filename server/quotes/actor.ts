/** Who the team acts as in a quote service: the company and the person. */
export interface QuoteActor {
  companyId: number;
  user: { id: string; name: string; email: string };
}

/** The label kept with an event: it outlives the person's account and name changes. */
export function actorLabel(actor: { user: { name: string; email: string } }): string {
  return `${actor.user.name} <${actor.user.email}>`;
}
