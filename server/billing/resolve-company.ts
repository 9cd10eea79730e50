import 'server-only';
import type { Transaction } from 'sequelize';
import { findCompanyByStripeCustomer, getCompanyBilling, setCompanyStripeCustomer, type CompanyBilling } from '@/db/queries/billing';

/**
 * The company a provider object belongs to: by the customer id stored on the company, else by the
 * company id we put in the metadata (or client_reference_id) when creating it. A company that has
 * no customer id yet adopts this one.
 */
export async function resolveCompany(
  customerId: string | null,
  hints: { metadata?: Record<string, string>; clientReferenceId?: string | null; companyId?: number | null },
  t: Transaction,
): Promise<CompanyBilling | null> {
  if (customerId) {
    const byCustomer = await findCompanyByStripeCustomer(customerId, t);
    if (byCustomer) return byCustomer;
  }
  const hinted = hints.companyId ?? parseId(hints.metadata?.fadeledger_company_id) ?? parseId(hints.clientReferenceId);
  if (hinted == null) return null;
  const company = await getCompanyBilling(hinted, t);
  if (!company) return null;
  if (customerId && !company.stripeCustomerId) {
    company.stripeCustomerId = await setCompanyStripeCustomer(company.id, customerId, t);
  }
  return company;
}

function parseId(value: string | null | undefined): number | null {
  if (!value || !/^\d{1,10}$/.test(value)) return null;
  return Number(value);
}
