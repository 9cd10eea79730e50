import 'server-only';
import { getStudyServices } from '@/db/queries/studies';
import type { ServiceSection } from './comparison';

/**
 * The service sections of a study — one `{ inputs, result }` per service, the leading service
 * first — for the study page and the study PDF. Any service's id names the whole study; [] when
 * this company has no such study (the caller answers 404).
 */
export async function studyServiceSections(companyId: number, studyId: number): Promise<(ServiceSection & { studyId: number })[]> {
  const rows = await getStudyServices(companyId, studyId);
  return rows.map((r) => ({ studyId: r.id, inputs: r.inputs, result: r.result }));
}
