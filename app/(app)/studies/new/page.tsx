import type { Metadata } from 'next';
import Link from 'next/link';
import { PageHeader } from '@/components/ui/page-header';
import { Card, CardBody } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { NewStudyForm } from '@/components/study/new-study-form';
import { studyFormOptions } from '@/server/studies/study-form-options';
import { requirePermission } from '@/server/auth/guards';

export const metadata: Metadata = { title: 'New study' };

export default async function NewStudyPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  const ctx = await requirePermission('study.write');
  const params = await searchParams;
  const options = await studyFormOptions(ctx.companyId);
  const { sites, services, dishes } = options;
  const siteId = Number(params.site);
  const presetSite = sites.find((s) => s.id === siteId);
  // No climate profile is needed: the ITU-R maps at the site are the default.
  const missing = [!services.length && 'a service profile', !dishes.length && 'an active dish'].filter(Boolean);
  return (
    <>
      <PageHeader
        title="New study"
        description="Pick the site and the service; FadeLedger reads the site's climate from its coordinates (ITU-R maps) and computes the link budget and outage of every dish you tick."
      />
      {missing.length > 0 && (
        <Notice tone="caution" className="mb-6" title="Set-up first">
          A study needs {missing.join(', ')}. See <Link className="underline" href="/services">Services</Link> and <Link className="underline" href="/dishes">Dishes</Link>.
        </Notice>
      )}
      <Card>
        <CardBody>
          <NewStudyForm options={options} preset={presetSite ? { customerId: presetSite.customerId, siteId: presetSite.id } : undefined} />
        </CardBody>
      </Card>
    </>
  );
}
