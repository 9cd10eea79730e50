import type { StudyInputsSnapshot, StudyResultSnapshot } from '@/server/studies/snapshot';
import { basisFiguresOf, dishName } from '@/server/study-option';
import type { QuoteOptionSnapshot, QuoteStudySnapshot } from './snapshot';
import { sumAmounts } from './totals';

/** The parts of a stored study a quote copies. */
export interface StudyForQuote {
  id: number;
  title: string;
  revision: number;
  inputs: StudyInputsSnapshot;
  result: StudyResultSnapshot;
}

/** Every option of the study as a customer-facing snapshot, in the study's order. */
export function quoteOptionsOf(study: StudyForQuote): QuoteOptionSnapshot[] {
  const { tradeoff } = study.result;
  const rec = tradeoff.recommendation;
  return tradeoff.options.map((o, i) => {
    const dish = study.inputs.dishes[i];
    // The study's recommendation basis decides which outage the customer is told about: a
    // two-way terminal is only useful when both directions work (server/engine/README.md §4).
    const { closes, ...outage } = basisFiguresOf(o, rec.basis);
    return {
      index: o.index ?? i,
      dishName: dishName(dish?.name, o.diameterM),
      diameterM: o.diameterM,
      gainDbi: o.gainDbi,
      gOverTDbK: o.gOverTDbK,
      marginDb: o.marginDb,
      closes,
      fadeThresholdDb: o.fadeThresholdDb,
      outage,
      meetsTarget: o.meetsTarget,
      minutesSavedPerYear: o.minutesSavedPerYear,
      hardwarePrice: dish ? sumAmounts(dish.hardwarePrice) : '0.00',
      labourPrice: dish ? sumAmounts(dish.labourPrice) : '0.00',
      cataloguePrice: dish ? sumAmounts(dish.hardwarePrice, dish.labourPrice) : '0.00',
      mountNotes: dish?.mountNotes ?? null,
      smallestMeetingTarget: rec.smallestMeetingTargetIndex === i,
      bestValue: rec.bestValueIndex === i,
    };
  });
}

/** Site, service, climate, pointing and warnings of the study, for the quote's own record. */
export function quoteStudySnapshotOf(study: StudyForQuote): QuoteStudySnapshot {
  const { inputs, result } = study;
  const t = result.tradeoff;
  return {
    schemaVersion: 1,
    studyId: study.id,
    studyTitle: study.title,
    studyRevision: study.revision,
    engineVersion: result.engineVersion,
    computedAt: result.computedAt,
    site: {
      name: inputs.site.name,
      customerName: inputs.site.customerName,
      latDeg: inputs.site.latDeg,
      lonDeg: inputs.site.lonDeg,
      altitudeM: inputs.site.altitudeM,
    },
    service: {
      name: inputs.service.name,
      satelliteName: inputs.service.satelliteName,
      satelliteLongitudeDeg: inputs.service.satelliteLongitudeDeg,
      downlinkFrequencyGHz: inputs.service.downlinkFrequencyGHz,
      polarization: inputs.service.polarization,
      modcod: inputs.service.modcod,
      transmits: inputs.service.uplink !== null,
    },
    climate: { name: inputs.climate.name, sourceNote: inputs.climate.sourceNote, kind: inputs.climate.kind },
    // Studies computed by engine 1.0 have no attenuationModel: they were rain only.
    attenuationModel: t.attenuationModel ?? 'rain',
    pointing: { azimuthDeg: t.azimuthDeg, elevationDeg: t.elevationDeg, polarizationSkewDeg: t.polarizationSkewDeg },
    targetAvailabilityPercent: t.recommendation.targetAvailabilityPercent,
    basis: t.recommendation.basis,
    warnings: t.warnings.map((w) => ({ code: w.code, message: w.message, ...(w.optionIndex !== undefined ? { optionIndex: w.optionIndex } : {}) })),
  };
}
