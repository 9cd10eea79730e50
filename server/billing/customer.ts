import 'server-only';
import { getCompanyBilling, replaceCompanyStripeCustomer, setCompanyStripeCustomer } from '@/db/queries/billing';
import { NotFoundError } from '@/server/errors';
import { getStripe, isMissingResource } from './stripe';

/**
 * The company's customer at the payment provider, created on first need. The company id rides in
 * the customer's metadata, and the customer id is stored on the company, so webhooks can find
 * the company either way. Two parallel first calls may each create a customer; only the first
 * stored id is kept and used (the other stays an unused customer with no subscription).
 */
export async function ensureProviderCustomer(companyId: number, billingEmail: string | null): Promise<string> {
  const company = await getCompanyBilling(companyId);
  if (!company) throw new NotFoundError('That company');
  const stripe = getStripe();
  if (company.stripeCustomerId) {
    try {
      const existing = await stripe.customers.retrieve(company.stripeCustomerId);
      if (!('deleted' in existing && existing.deleted)) return existing.id;
    } catch (error) {
      if (!isMissingResource(error)) throw error;
    }
  }
  const created = await stripe.customers.create({
    name: company.name,
    email: billingEmail ?? undefined,
    metadata: { fadeledger_company_id: String(companyId) },
  });
  if (company.stripeCustomerId) {
    await replaceCompanyStripeCustomer(companyId, company.stripeCustomerId, created.id);
    return (await getCompanyBilling(companyId))?.stripeCustomerId ?? created.id;
  }
  return (await setCompanyStripeCustomer(companyId, created.id)) ?? created.id;
}
