import { GET as studyPdfRoute } from '@/app/(app)/studies/[id]/pdf/route';
import { apiRequest } from '../support/next-request';
import { routeCase, type CrossCompanyCase, type MatrixCase } from '../support/action-matrix';
import { createStudyWorld, insertTestStudy } from '../studies-fixtures';

/** The study's engineering record (PDF) in the permission matrix: everyone of the company reads it. */
const COMPANY = ['admin', 'installer', 'sales'] as const;
type S = { id: number };
const studyOf = async (companyId: number, userId: string): Promise<S> => ({ id: await insertTestStudy(companyId, userId, await createStudyWorld(companyId)) });

export const cases = [
  routeCase({
    method: 'GET', path: '/studies/[id]/pdf', handler: studyPdfRoute as never, access: 'study.read', allow: COMPANY,
    prepare: (w) => studyOf(w.company.id, w.users.admin.id),
    request: (_w, s: S) => ({ url: `/studies/${s.id}/pdf`, params: { id: String(s.id) } }),
  }),
] as MatrixCase<never>[];

export const crossCompany: CrossCompanyCase<never>[] = [
  {
    name: 'GET /studies/[id]/pdf of their study',
    prepare: (w) => studyOf(w.otherCompany.id, w.otherAdmin.id),
    run: (_w, s: S) => studyPdfRoute(apiRequest(`/studies/${s.id}/pdf`), { params: Promise.resolve({ id: String(s.id) }) }),
  },
] as CrossCompanyCase<never>[];
