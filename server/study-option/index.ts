/**
 * The read model of a computed study option: which outage figure counts, whether it meets the
 * target, and how its diameter, availability and outage read in numbers and words, with the one
 * rounding rule that never claims more than a figure supports. Pure and browser-safe: it imports
 * types and constants of the engine only, never server-only, database or framework code.
 */
export { allowedMinutesPerYear, basisFiguresOf, closesOnBasis, meetsTarget, type BasisFigures, type OptionBasis } from './basis';
export { availabilityNumber, availabilityText, availabilityWords } from './availability';
export { diameterLabel, dishName, wholeCentimetres, type DiameterLabel } from './diameter';
export { durationLong, durationShort, minutesCell, minutesNumber, minutesText, outageDurationWords, outageMinutesNumber, outageMinutesText, roundedDuration, savedMinutesCell, savedMinutesNumber, type RoundedDuration } from './durations';
export { outagePercentText } from './outage-share';
export { outageYearWords, savingWords, worstMonthWords } from './outage-words';
export { availabilityRounding, outageQualifier, outageRounding, type OutageQualifier } from './qualifier';
export { readOption, readQuotedOption, readStudyOption, readStudyOptions, type OptionReading } from './reading';
export { amountCell, amountText, roundedAmount, roundToPlaces, type RoundingDirection } from './rounding';
