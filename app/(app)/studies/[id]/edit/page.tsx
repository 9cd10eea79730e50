import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { PageHeader } from '@/components/ui/page-header';
import { Card, CardBody } from '@/components/ui/card';
import { LinkButton } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { NewStudyForm, type StudyEdit } from '@/components/study/new-study-form';
import { requirePermission } from '@/server/auth/guards';
import { getStudyServices, listStudyRevisions } from '@/db/queries/studies';
import { studyFormOptions } from '@/server/studies/study-form-options';

export const metadata: Metadata = { title: 'Edit study inputs' };

/**
 * The study form opened on a stored study: every box holds what the study was computed from
 * (ids of its customer, site, services, climate profile and dishes; the target and title from
 * its snapshot). Saving makes the next revision; this one stays as it is.
 */
export default async function EditStudyPage({ params }: { params: Promise<{ id: string }> }) {
  const ctx = await requirePermission('study.write');
  const { id: raw } = await params;
  const id = /^\d{1,10}$/.test(raw) ? Number(raw) : NaN;
  const services = Number.isSafeInteger(id) ? await getStudyServices(ctx.companyId, id) : [];
  const lead = services[0];
  if (!lead) notFound();
  const storedDishIds = lead.inputs.dishes.map((d) => d.dishId).filter((d): d is number => d !== null);
  const [options, revisions] = await Promise.all([studyFormOptions(ctx.companyId, storedDishIds), listStudyRevisions(ctx.companyId, lead.revisionOfStudyId ?? lead.id)]);

  // Rows deleted since cannot be picked again: the boxes start empty for them and the notice says so.
  const has = <T extends { id: number }>(list: T[], v: number | null) => v !== null && list.some((x) => x.id === v);
  const serviceIds = services.map((s) => s.serviceProfileId).filter((s): s is number => has(options.services, s));
  const siteOk = has(options.sites, lead.siteId) && has(options.customers, lead.customerId);
  const climateOk = lead.climateProfileId === null ? lead.inputs.climate.kind === 'itu-r-maps' : has(options.climates, lead.climateProfileId);
  const dishIds = storedDishIds.filter((d) => has(options.dishes, d));
  const gone = [
    !siteOk && 'the site or customer',
    serviceIds.length < services.length && 'a service profile',
    !climateOk && 'the climate profile',
    dishIds.length < lead.inputs.dishes.length && 'a dish',
  ].filter(Boolean);

  // The stored choices in the words the form uses (names of today's rows, the snapshot's where a row is gone).
  const nameOf = <T extends { id: number; name: string }>(list: T[], v: number | null, fallback: string) => list.find((x) => x.id === v)?.name ?? fallback;
  const edit: StudyEdit = {
    studyId: lead.id,
    fromRevision: lead.revision,
    nextRevision: Math.max(...revisions.map((r) => r.revision), lead.revision) + 1,
    initial: {
      customerId: siteOk ? (lead.customerId as number) : 0,
      siteId: siteOk ? (lead.siteId as number) : 0,
      serviceProfileId: serviceIds[0] ?? 0,
      compareServiceProfileIds: serviceIds.slice(1),
      climateProfileId: climateOk ? lead.climateProfileId : null,
      dishIds,
      targetAvailabilityPercent: lead.inputs.targetAvailabilityPercent,
      title: lead.title,
    },
    before: {
      customer: nameOf(options.customers, lead.customerId, lead.inputs.site.customerName),
      site: nameOf(options.sites, lead.siteId, lead.inputs.site.name),
      services: services.map((s) => nameOf(options.services, s.serviceProfileId, s.inputs.service.name)),
      climate: lead.inputs.climate.kind === 'itu-r-maps' ? options.mapsName : nameOf(options.climates, lead.climateProfileId, lead.inputs.climate.name),
      dishes: lead.inputs.dishes.map((d) => nameOf(options.dishes, d.dishId, d.name)),
      targetAvailabilityPercent: lead.inputs.targetAvailabilityPercent,
      title: lead.title,
    },
  };
  return (
    <>
      <PageHeader
        eyebrow={`Study ${lead.id} · revision ${lead.revision}`}
        title="Edit inputs"
        description={`${lead.title}. Change the target, the dishes, the rain climate, the services or the site; saving computes revision ${edit.nextRevision} with today’s data. Revision ${lead.revision} and any quote made from it stay as they are.`}
        actions={
          <LinkButton href={`/studies/${lead.id}`} variant="quiet">
            Back to the study
          </LinkButton>
        }
      />
      {gone.length > 0 && (
        <Notice tone="caution" className="mb-6" title="Deleted since">
          {`${gone.join(', ')} of this study has been deleted since it was computed: choose again below.`}
        </Notice>
      )}
      <Card>
        <CardBody>
          <NewStudyForm options={options} edit={edit} />
        </CardBody>
      </Card>
    </>
  );
}
