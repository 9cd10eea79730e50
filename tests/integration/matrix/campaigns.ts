import * as campaigns from '@/server/actions/campaigns';
import { actionCase, type MatrixCase } from '../support/action-matrix';
import { createStudyWorld, type StudyWorld } from '../studies-fixtures';

/** Upgrade campaigns in the permission matrix: admins and installers (study.write); sales and staff cannot. */
const MAKERS = ['admin', 'installer'] as const;

const shared = new Map<number, Promise<StudyWorld>>();
const worldOf = (companyId: number) => {
  if (!shared.has(companyId)) shared.set(companyId, createStudyWorld(companyId));
  return shared.get(companyId)!;
};
// Invented site references (demo data); 60 cm is one of the study world's dishes.
const CAMPAIGN_CSV = 'site_ref,latitude,longitude,altitude_m,current_dish_cm\nMX-1,47.2,2.6,140,60\n';

export const cases: MatrixCase[] = [
  actionCase({
    file: 'campaigns', exportName: 'computeUpgradeCampaign', action: campaigns.computeUpgradeCampaign, access: 'study.write', allow: MAKERS,
    prepare: (w) => worldOf(w.company.id),
    input: (_w, s: StudyWorld) => ({ file: new File([CAMPAIGN_CSV], 'matrix.csv', { type: 'text/csv' }), serviceProfileId: String(s.serviceId), climateProfileId: String(s.climateId), targetAvailabilityPercent: '99.9' }),
  }),
];
