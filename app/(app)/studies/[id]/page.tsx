import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound, redirect } from 'next/navigation';
import { PageHeader } from '@/components/ui/page-header';
import { buttonClasses, LinkButton } from '@/components/ui/button';
import { StudyCautions } from '@/components/study/cautions';
import { RerunButton } from '@/components/study/rerun-button';
import { ArchiveButton } from '@/components/study/archive-button';
import { ServiceSection } from '@/components/study/service-section';
import { EveryTargetSummary } from '@/components/study/every-target-summary';
import { ServiceOverlay } from '@/components/study/service-overlay';
import { Notice } from '@/components/ui/notice';
import { dateTimeFmt } from '@/components/study/format';
import { requirePermission } from '@/server/auth/guards';
import { can } from '@/server/auth/permissions';
import { getStudyServices, listStudyRevisions } from '@/db/queries/studies';

export const metadata: Metadata = { title: 'Study' };

export default async function StudyPage({ params }: { params: Promise<{ id: string }> }) {
  const ctx = await requirePermission('study.read');
  const { id: raw } = await params;
  const id = /^\d{1,10}$/.test(raw) ? Number(raw) : NaN;
  // Every service of the study, the leading one first (a single-service study is one row).
  const services = Number.isSafeInteger(id) ? await getStudyServices(ctx.companyId, id) : [];
  const study = services[0];
  if (!study) notFound();
  // A further service's id (from a quote made of it) opens the whole study at that service.
  if (study.id !== id) redirect(`/studies/${study.id}#service-${id}`);
  const revisions = await listStudyRevisions(ctx.companyId, study.revisionOfStudyId ?? study.id);
  const { inputs, result } = study;
  const canQuote = can(ctx.role, 'quote.write');
  const canWrite = can(ctx.role, 'study.write');
  const comparing = services.length > 1;
  const largest = Math.max(...services.flatMap((s) => s.result.tradeoff.options.map((o) => o.diameterM)));
  const serviceWords = comparing ? services.map((s) => s.inputs.service.name).join(' vs ') : `${inputs.service.name} (${inputs.service.satelliteName})`;
  const nextRevision = Math.max(...revisions.map((r) => r.revision), study.revision) + 1;
  return (
    <>
      <PageHeader
        eyebrow={`Study ${study.id}${study.revision > 1 ? ` · revision ${study.revision}` : ''}`}
        title={study.title}
        description={`${inputs.site.customerName} · ${inputs.site.name} · ${serviceWords} · target ${inputs.targetAvailabilityPercent} %`}
        actions={
          <>
            <div className="flex flex-wrap items-center gap-2 print:hidden">
              <LinkButton href="/studies" variant="quiet">
                All studies
              </LinkButton>
              {/* A file, not a page: a plain link so the browser downloads it instead of routing. */}
              <a href={`/studies/${study.id}/pdf`} download className={buttonClasses('secondary')}>
                Download PDF
              </a>
              {canWrite && (
                <LinkButton href={`/studies/${study.id}/edit`} variant="secondary">
                  Edit inputs
                </LinkButton>
              )}
              {canWrite && <RerunButton studyId={study.id} nextRevision={nextRevision} />}
              {canWrite && <ArchiveButton key={study.status} studyId={study.id} archived={study.status === 'archived'} />}
            </div>
          </>
        }
      />
      <div className="space-y-6">
        {study.status === 'archived' && (
          <Notice title="Archived">
            This study is left out of the studies list unless archived studies are shown. Its figures and any quote made from it are unchanged.
          </Notice>
        )}
        {comparing ? (
          <>
            <EveryTargetSummary sections={services} />
            <ServiceOverlay sections={services} />
            {services.map((s, i) => (
              <section key={s.id} id={`service-${s.id}`} aria-labelledby={`service-title-${s.id}`} className="scroll-mt-4 space-y-4 border-t-2 border-ledger-200 pt-6">
                <h2 id={`service-title-${s.id}`} className="text-lg font-semibold text-stone-900">
                  Service {i + 1} of {services.length}: {s.inputs.service.name}{' '}
                  <span className="text-sm font-normal text-stone-600">
                    ({s.inputs.service.satelliteName}, {s.inputs.service.downlinkFrequencyGHz} GHz{s.inputs.service.uplink ? ', two-way' : ''})
                  </span>
                </h2>
                <ServiceSection studyId={s.id} inputs={s.inputs} result={s.result} canQuote={canQuote} />
              </section>
            ))}
          </>
        ) : (
          <ServiceSection studyId={study.id} inputs={inputs} result={result} canQuote={canQuote} />
        )}
        <StudyCautions
          hasUplink={services.some((s) => s.inputs.service.uplink !== null)}
          largestDiameterM={largest}
          totalAttenuation={services.some((s) => s.result.tradeoff.attenuationModel === 'total')}
        />
        <p className="text-xs text-stone-600">
          Computed {dateTimeFmt.format(new Date(result.computedAt))} UTC by FadeLedger engine {result.engineVersion}
          {study.createdByName ? ` for ${study.createdByName}` : ''}. The inputs (site, service, climate and dish prices) were copied into the study then; later changes to them do not alter it.
          {revisions.length > 1 && (
            <>
              {' '}
              Revisions:{' '}
              {revisions.map((r, i) => (
                <span key={r.id}>
                  {i > 0 && ', '}
                  {r.id === study.id ? <strong>{r.revision}</strong> : <Link className="text-ledger-700 underline" href={`/studies/${r.id}`}>{r.revision}</Link>}
                </span>
              ))}
              .
            </>
          )}
        </p>
      </div>
    </>
  );
}
