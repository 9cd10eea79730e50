import type { Metadata } from 'next';
import Link from 'next/link';
import { requireStaffPermission } from '@/server/auth/guards';
import { PlanForm } from '@/components/billing/plan-form';

export const metadata: Metadata = { title: 'New plan' };

export default async function NewPlanPage() {
  await requireStaffPermission('plans.manage');
  return (
    <div className="max-w-4xl space-y-5">
      <p className="text-sm"><Link href="/plans" className="text-ledger-700 hover:underline">← Plan catalogue</Link></p>
      <h1 className="text-2xl font-semibold tracking-tight text-stone-900">New plan</h1>
      <div className="rounded border border-stone-200 bg-white p-5">
        <PlanForm
          initial={{ code: '', kind: 'paid', name: '', description: '', monthlyPriceUsd: '', seatLimit: 5, studiesPerMonth: 100, activeLinksLimit: 20, uploadsPerMonth: 10, campaignSitesLimit: 5000, apiAccess: false, quoteBranding: true, isPublic: true, sortOrder: 10, trialDays: null }}
        />
      </div>
    </div>
  );
}
