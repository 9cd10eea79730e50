import { useId } from 'react';
import type { StudyInputsSnapshot, StudyResultSnapshot } from '@/server/studies/snapshot';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { PointingSummary } from './pointing-summary';
import { ClimateSummary } from './climate-summary';
import { OptionsTable } from './options-table';
import { Recommendation } from './recommendation';
import { StudyWarnings } from './study-warnings';
import { ClimatePlaceWarning } from './climate-place-warning';
import { AttenuationAtOutage } from './attenuation-at-outage';
import { StudyCharts } from './study-charts';

/**
 * Everything the study page shows for one service: its recommendation, warnings, pointing, the
 * per-dish table, charts and climate. `studyId` is this service's own study row, so its Quote
 * links quote this service's figures.
 */
export function ServiceSection({ studyId, inputs, result, canQuote }: { studyId: number; inputs: StudyInputsSnapshot; result: StudyResultSnapshot; canQuote: boolean }) {
  const uid = useId();
  return (
    <div className="space-y-6">
      <Recommendation studyId={studyId} inputs={inputs} result={result} canQuote={canQuote} />
      <StudyWarnings warnings={result.tradeoff.warnings} elevationDeg={result.tradeoff.elevationDeg} />
      <ClimatePlaceWarning inputs={inputs} />
      <PointingSummary inputs={inputs} result={result} />
      <Card aria-labelledby={`options-title-${uid}`}>
        <CardHeader
          id={`options-title-${uid}`}
          title="Dish by dish"
          description={`Link budget and ${result.tradeoff.attenuationModel === 'total' ? 'outage (total attenuation: gases, clouds, rain and scintillation)' : 'rain outage'} for each dish, small to large. Outage figures are ${result.tradeoff.recommendation.basis === 'two-way' ? 'two-way (uplink + downlink, an upper bound)' : 'for the downlink'}; the same outage in hours or days in small type.`}
        />
        <CardBody className="px-0 sm:px-0">
          <OptionsTable studyId={studyId} inputs={inputs} result={result} canQuote={canQuote} />
          <AttenuationAtOutage inputs={inputs} result={result} />
        </CardBody>
      </Card>
      <StudyCharts inputs={inputs} result={result} />
      <ClimateSummary inputs={inputs} result={result} />
    </div>
  );
}
