/**
 * The read model of a computed study option: which outage figure counts, whether it meets the
 * target, and how its diameter, availability and outage read in numbers and words, with the one
 * rounding rule that never claims more than a figure supports. Pure and browser-safe: it imports
 * types and constants of the engine only, never server-only, database or framework code.
 */
export { allowedMinutesPerYear, basisFiguresOf, closesOnBasis, meetsTarget, type BasisFigures } from './basis';
export { availabilityNumber, availabilityText, availabilityWords } from './availability';
export { diameterLabel, dishName, wholeCentimetres } from './diameter';
export { minutesCell, minutesNumber, minutesText, outageDurationWords, outageMinutesNumber, outageMinutesText, roundedDuration, savedMinutesCell, savedMinutesNumber } from './durations';
export { outagePercentText } from './outage-share';
export { outageYearWords, savingWords, worstMonthWords } from './outage-words';
export { outageQualifier, outageRounding, type OutageQualifier } from './qualifier';
export { readQuotedOption, readStudyOption, readStudyOptions, type OptionReading } from './reading';
export { roundToPlaces } from './rounding';
