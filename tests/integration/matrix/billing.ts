import { changePlanAction, openPortalAction, startCheckoutAction } from '@/server/actions/billing';
import { createPlanAction, syncPlanAction, updatePlanAction } from '@/server/actions/plans';
import { POST as stripeWebhook } from '@/app/api/webhooks/stripe/route';
import { ensureProviderCustomer } from '@/server/billing/customer';
import { apiRequest } from '../support/next-request';
import { actionCase, type CrossCompanyCase, type MatrixCase, type MatrixWorld } from '../support/action-matrix';
import { createTestPlan, eventOf, planIdByCode, rand, subscriptionObject, webhookEventRow, type TestPlan } from '../billing-fixtures';

/**
 * Billing (the company's subscription, admins only), the plan catalogue (staff only) and the
 * provider's webhook (public: the Stripe signature is the credential) in the permission matrix.
 *
 * The matrix company must stay usable for the other areas' rows, so nothing here gives it a live
 * subscription or changes its plan: a checkout is only opened (the plan changes on the webhook,
 * which never comes), and changing plan without a subscription is refused as a conflict — past
 * the guard, so the admin's cell counts as allowed.
 */
const ADMIN = ['admin'] as const;
const STAFF = ['staff'] as const;
const EVERYONE = ['admin', 'installer', 'sales', 'staff', 'signed-out'] as const;

// 'crew' is a seeded public paid plan: the only kind the plan picker sells.
const sellablePlanId = () => planIdByCode('crew');

// The portal needs a billing account at the provider; made up front so the admin reaches it.
const withProviderCustomer = async (w: MatrixWorld) => {
  await ensureProviderCustomer(w.company.id, w.users.admin.email);
};

// Invented plan, never public, so the shared database's plan picker stays as seeded.
const planFields = () => ({
  name: 'Matrix Relay', description: 'Invented plan for the permission matrix.', monthlyPriceUsd: '39.00', seatLimit: '4',
  studiesPerMonth: '100', activeLinksLimit: '20', uploadsPerMonth: '10', campaignSitesLimit: '5000', apiAccess: '', quoteBranding: 'on', isPublic: '', sortOrder: '97', trialDays: '',
});

const actionCases: MatrixCase<never>[] = [
  actionCase({ file: 'billing', exportName: 'startCheckoutAction', action: startCheckoutAction, access: 'billing.manage', allow: ADMIN, prepare: sellablePlanId, input: (_w, planId: number) => ({ planId }) }),
  actionCase({ file: 'billing', exportName: 'changePlanAction', action: changePlanAction, access: 'billing.manage', allow: ADMIN, prepare: sellablePlanId, input: (_w, planId: number) => ({ planId }) }),
  actionCase({ file: 'billing', exportName: 'openPortalAction', action: openPortalAction, access: 'billing.manage', allow: ADMIN, prepare: withProviderCustomer, input: () => ({}) }),

  actionCase({ file: 'plans', exportName: 'createPlanAction', action: createPlanAction, access: 'plans.manage', allow: STAFF, input: () => ({ code: `mx-${rand()}`, kind: 'paid', ...planFields() }) }),
  actionCase({ file: 'plans', exportName: 'updatePlanAction', action: updatePlanAction, access: 'plans.manage', allow: STAFF, prepare: () => createTestPlan(), input: (_w, plan: TestPlan) => ({ id: String(plan.id), ...planFields() }) }),
  actionCase({ file: 'plans', exportName: 'syncPlanAction', action: syncPlanAction, access: 'plans.manage', allow: STAFF, prepare: () => createTestPlan(), input: (_w, plan: TestPlan) => ({ id: plan.id }) }),
] as MatrixCase<never>[];

type Unsigned = { event: ReturnType<typeof eventOf> };

/**
 * The provider's servers call this, so no session is asked for: every role passes the guard. The
 * cell's session cookie rides along (apiRequest) to show a session is no substitute for the
 * signature: an unsigned, well-formed event of a handled type must get 400 and leave no trace.
 */
const webhookCase: MatrixCase<Unsigned> = {
  name: 'POST /api/webhooks/stripe',
  kind: 'route',
  access: 'public',
  allow: EVERYONE,
  prepare: async () => {
    const plan = await createTestPlan();
    const subscription = subscriptionObject({ id: `sub_matrix_${rand()}`, customer: `cus_matrix_${rand()}`, status: 'active', plan });
    return { event: eventOf('customer.subscription.updated', subscription, Math.floor(Date.now() / 1000)) };
  },
  run: async (_w, p) => {
    const res = await stripeWebhook(apiRequest('/api/webhooks/stripe', { method: 'POST', json: p.event }));
    const code = ((await res.clone().json()) as { error?: { code?: string } }).error?.code;
    // Thrown, not returned: the runner counts any non-401/403 as "allowed", and this row must also be refused for the right reason.
    if (res.status !== 400 || code !== 'invalid_signature') throw new Error(`unsigned webhook answered ${res.status} ${code ?? ''}, expected 400 invalid_signature`);
    if (await webhookEventRow(p.event.id)) throw new Error(`unsigned webhook ${p.event.id} was stored`);
    return res;
  },
};

export const cases: MatrixCase<never>[] = [...actionCases, webhookCase as MatrixCase<never>];

/**
 * No cross-company rows: these actions take no id of a company-owned row. The company always
 * comes from the session (ctx.companyId), plan ids name the shared catalogue (and only public
 * paid plans can be bought), and the plan-catalogue ids are staff-only platform rows. The one
 * company-scoped id in billing, the checkout session on the return page, is a page, covered in
 * billing-actions.test.ts.
 */
export const crossCompany: CrossCompanyCase<never>[] = [];
