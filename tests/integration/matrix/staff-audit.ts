import { changeAccountPlanAction, extendTrialAction } from '@/server/actions/staff-accounts';
import { GET as exportAudit } from '@/app/(app)/settings/audit/export/route';
import { actionCase, routeCase, type MatrixCase } from '../support/action-matrix';
import { createBillingCompany, planIdByCode } from '../billing-fixtures';

/**
 * The operator's account actions (staff only; each cell works on a fresh company of its own, so
 * the matrix company keeps its plan) and the audit log's CSV export (the company's admins).
 */
const STAFF = ['staff'] as const;
const ADMIN = ['admin'] as const;

const freshTrial = () => createBillingCompany({ planCode: 'trial', trialEndsAt: new Date(Date.now() + 86_400_000), customerId: null });

export const cases: MatrixCase[] = [
  actionCase({
    file: 'staff-accounts',
    exportName: 'extendTrialAction',
    action: extendTrialAction,
    access: 'accounts.manage',
    allow: STAFF,
    prepare: () => freshTrial(),
    input: (_w, c: { id: number }) => ({ companyId: c.id, days: '5', reason: 'Matrix check' }),
  }),
  actionCase({
    file: 'staff-accounts',
    exportName: 'changeAccountPlanAction',
    action: changeAccountPlanAction,
    access: 'accounts.manage',
    allow: STAFF,
    prepare: async () => ({ company: await freshTrial(), planId: await planIdByCode('bench') }),
    input: (_w, p: { company: { id: number }; planId: number }) => ({ companyId: p.company.id, planId: p.planId, reason: 'Matrix check' }),
  }),
  routeCase({ method: 'GET', path: '/settings/audit/export', handler: exportAudit, access: 'audit.read', allow: ADMIN, request: () => ({ url: '/settings/audit/export' }) }),
];
