import type { Metadata } from 'next';
import Link from 'next/link';
import { PageHeader } from '@/components/ui/page-header';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { CompanyContactForm, RemoveLogoForm, UploadLogoForm } from '@/components/quote/logo-forms';
import { requirePermission } from '@/server/auth/guards';
import { getPlanLimits } from '@/server/billing/limits';
import { getCompanyContact, getCompanyLogoInfo } from '@/db/queries/branding';

export const metadata: Metadata = { title: 'Quote branding' };

export default async function BrandingPage() {
  const ctx = await requirePermission('branding.manage');
  const [limits, logo, contact] = await Promise.all([getPlanLimits(ctx.companyId), getCompanyLogoInfo(ctx.companyId), getCompanyContact(ctx.companyId)]);
  return (
    <>
      <PageHeader title="Quote branding" description={`Your logo on ${ctx.company.name}’s quote PDFs and on the pages your customers open from a comparison link.`} />
      <div className="max-w-3xl space-y-6">
        {!limits.quoteBranding && (
          <Notice tone="caution" title={`The ${limits.planName} plan does not include quote branding`}>
            Quotes show your company name only. <Link href="/settings/billing" className="font-medium underline">Choose a plan</Link> with branding to add your logo.
            {logo ? ' The logo on file is kept but not shown.' : ''}
          </Notice>
        )}
        <Card aria-labelledby="logo-title">
          <CardHeader id="logo-title" title="Logo" actions={logo ? <RemoveLogoForm /> : undefined} />
          <CardBody className="space-y-5">
            {logo ? (
              <div className="flex flex-wrap items-center gap-4">
                <div className="rounded border border-stone-200 bg-white p-3">
                  <img src={`/api/v1/branding/logo?v=${logo.updatedAt.getTime()}`} alt={`${ctx.company.name} logo`} className="h-14 w-auto max-w-[220px] object-contain" />
                </div>
                <p className="text-sm text-stone-700">
                  {logo.mime === 'image/png' ? 'PNG' : 'JPEG'}, <span className="num">{logo.width} × {logo.height}</span> px, <span className="num">{Math.ceil(logo.bytes / 1024)}</span> KiB
                </p>
              </div>
            ) : (
              <p className="text-sm text-stone-700">No logo yet.</p>
            )}
            <UploadLogoForm disabled={!limits.quoteBranding} />
          </CardBody>
        </Card>
        <Card aria-labelledby="contact-title">
          <CardHeader id="contact-title" title="Contact for customers" description="Shown on quote PDFs and customer pages, including a link that no longer opens, so customers can reach you. Left empty, they see the person who sent the quote." />
          <CardBody>
            <CompanyContactForm email={contact?.email ?? ''} phone={contact?.phone ?? ''} />
          </CardBody>
        </Card>
      </div>
    </>
  );
}
