import { apiRoute } from '@/server/api/route';
import { getStudy } from '@/db/queries/studies';
import { NotFoundError } from '@/server/errors';
import { studyServiceSections } from '@/server/studies/study-sections';
import { renderStudyPdf, studyPdfFileName } from '@/server/studies/pdf/render';

/** GET /studies/:id/pdf — the study's engineering record (inputs, sources, pointing, per-dish table, chart, cautions). */
export const GET = apiRoute<'study.read', undefined, { id: string }>({ permission: 'study.read' }, async ({ ctx, params }) => {
  const id = /^\d{1,10}$/.test(params.id) ? Number(params.id) : NaN;
  // Any service's id names the whole study; the leading service's row carries the header.
  const sections = Number.isSafeInteger(id) ? await studyServiceSections(ctx.companyId, id) : [];
  const study = sections.length ? await getStudy(ctx.companyId, sections[0].studyId) : null;
  if (!study) throw new NotFoundError('That study');
  const pdf = await renderStudyPdf({
    header: { companyName: ctx.company.name, studyId: study.id, revision: study.revision, title: study.title, createdByName: study.createdByName },
    sections: sections.map(({ inputs, result }) => ({ inputs, result })),
    generatedAt: new Date(),
  });
  return new Response(new Uint8Array(pdf), {
    status: 200,
    headers: {
      'Content-Type': 'application/pdf',
      'Content-Disposition': `attachment; filename="${studyPdfFileName(study.id, study.revision, study.title)}"`,
      'Cache-Control': 'private, no-store',
    },
  });
});
