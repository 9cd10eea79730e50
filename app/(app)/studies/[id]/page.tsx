import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { PageHeader } from '@/components/ui/page-header';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { buttonClasses, LinkButton } from '@/components/ui/button';
import { PointingSummary } from '@/components/study/pointing-summary';
import { ClimateSummary } from '@/components/study/climate-summary';
import { OptionsTable } from '@/components/study/options-table';
import { Recommendation } from '@/components/study/recommendation';
import { StudyWarnings } from '@/components/study/study-warnings';
import { ClimatePlaceWarning } from '@/components/study/climate-place-warning';
import { AttenuationAtOutage } from '@/components/study/attenuation-at-outage';
import { StudyCautions } from '@/components/study/cautions';
import { StudyCharts } from '@/components/study/study-charts';
import { RerunButton } from '@/components/study/rerun-button';
import { ArchiveButton } from '@/components/study/archive-button';
import { Notice } from '@/components/ui/notice';
import { dateTimeFmt } from '@/components/study/format';
import { requirePermission } from '@/server/auth/guards';
import { can } from '@/server/auth/permissions';
import { getStudy, listStudyRevisions } from '@/db/queries/studies';

export const metadata: Metadata = { title: 'Study' };

export default async function StudyPage({ params }: { params: Promise<{ id: string }> }) {
  const ctx = await requirePermission('study.read');
  const { id: raw } = await params;
  const id = /^\d{1,10}$/.test(raw) ? Number(raw) : NaN;
  const study = Number.isSafeInteger(id) ? await getStudy(ctx.companyId, id) : null;
  if (!study) notFound();
  const revisions = await listStudyRevisions(ctx.companyId, study.revisionOfStudyId ?? study.id);
  const { inputs, result } = study;
  const canQuote = can(ctx.role, 'quote.write');
  const canWrite = can(ctx.role, 'study.write');
  const largest = Math.max(...result.tradeoff.options.map((o) => o.diameterM));
  return (
    <>
      <PageHeader
        eyebrow={`Study ${study.id}${study.revision > 1 ? ` · revision ${study.revision}` : ''}`}
        title={study.title}
        description={`${inputs.site.customerName} · ${inputs.site.name} · ${inputs.service.name} (${inputs.service.satelliteName}) · target ${inputs.targetAvailabilityPercent} %`}
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
              {canWrite && <RerunButton studyId={study.id} />}
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
        <Recommendation studyId={study.id} inputs={inputs} result={result} canQuote={canQuote} />
        <StudyWarnings warnings={result.tradeoff.warnings} elevationDeg={result.tradeoff.elevationDeg} />
        <ClimatePlaceWarning inputs={inputs} />
        <PointingSummary inputs={inputs} result={result} />
        <Card aria-labelledby="options-title">
          <CardHeader
            id="options-title"
            title="Dish by dish"
            description={`Link budget and ${result.tradeoff.attenuationModel === 'total' ? 'outage (total attenuation: gases, clouds, rain and scintillation)' : 'rain outage'} for each dish, small to large. Outage figures are ${result.tradeoff.recommendation.basis === 'two-way' ? 'two-way (uplink + downlink, an upper bound)' : 'for the downlink'}; the same outage in hours or days in small type.`}
          />
          <CardBody className="px-0 sm:px-0">
            <OptionsTable studyId={study.id} inputs={inputs} result={result} canQuote={canQuote} />
            <AttenuationAtOutage inputs={inputs} result={result} />
          </CardBody>
        </Card>
        <StudyCharts inputs={inputs} result={result} />
        <ClimateSummary inputs={inputs} result={result} />
        <StudyCautions hasUplink={inputs.service.uplink !== null} largestDiameterM={largest} totalAttenuation={result.tradeoff.attenuationModel === 'total'} />
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
