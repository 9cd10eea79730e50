import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { requireStaffPermission } from '@/server/auth/guards';
import { countCompaniesOnPlan, getPlanById } from '@/db/queries/billing';
import Decimal from 'decimal.js';
import { PlanForm } from '@/components/billing/plan-form';

export const metadata: Metadata = { title: 'Edit plan' };
export const dynamic = 'force-dynamic';

export default async function EditPlanPage({ params }: { params: Promise<{ planId: string }> }) {
  await requireStaffPermission('plans.manage');
  const { planId } = await params;
  if (!/^\d{1,10}$/.test(planId)) notFound();
  const plan = await getPlanById(Number(planId));
  if (!plan) notFound();
  const companies = await countCompaniesOnPlan(plan.id);
  return (
    <div className="max-w-4xl space-y-5">
      <p className="text-sm"><Link href="/plans" className="text-ledger-700 hover:underline">← Plan catalogue</Link></p>
      <div>
        <h1 className="text-2xl font-semibold tracking-tight text-stone-900">{plan.name}</h1>
        <p className="mt-1 text-sm text-stone-600">
          {companies === 1 ? '1 company is' : `${companies} companies are`} on this plan. Lower limits apply to them at once; nothing of theirs is deleted.
        </p>
      </div>
      <div className="rounded border border-stone-200 bg-white p-5">
        <PlanForm
          initial={{
            id: plan.id, code: plan.code, kind: plan.kind, name: plan.name, description: plan.description ?? '', monthlyPriceUsd: new Decimal(plan.monthlyPriceUsd).toFixed(2),
            seatLimit: plan.seatLimit, studiesPerMonth: plan.studiesPerMonth, activeLinksLimit: plan.activeLinksLimit, uploadsPerMonth: plan.uploadsPerMonth, campaignSitesLimit: plan.campaignSitesLimit,
            apiAccess: plan.apiAccess, quoteBranding: plan.quoteBranding, isPublic: plan.isPublic, sortOrder: plan.sortOrder, trialDays: plan.trialDays,
          }}
        />
      </div>
    </div>
  );
}
