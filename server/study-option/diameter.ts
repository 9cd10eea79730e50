/**
 * A dish's size as everyone writes it: centimetres to the millimetre that matters (0.1 cm),
 * inches beside at 2.54 cm each (exact by definition), nearest in both; a trailing ".0" dropped.
 */
const CM_PER_INCH = 2.54;

const tenths = (x: number) => (Math.round(x * 10) / 10).toLocaleString('en-US', { maximumFractionDigits: 1 });

export interface DiameterLabel {
  /** "90 cm", "45.5 cm" */
  cm: string;
  /** "35.4 in" */
  inches: string;
  /** "90 cm (35.4 in)" */
  words: string;
}

/**
 * @example diameterLabel(0.75) // => { cm: '75 cm', inches: '29.5 in', words: '75 cm (29.5 in)' }
 */
export function diameterLabel(diameterM: number): DiameterLabel {
  const cm = `${tenths(diameterM * 100)} cm`;
  const inches = `${tenths((diameterM * 100) / CM_PER_INCH)} in`;
  return { cm, inches, words: `${cm} (${inches})` };
}

/** Whole centimetres, the way installers name dishes ("a 90") and campaign files give them. */
export function wholeCentimetres(diameterM: number): number {
  return Math.round(diameterM * 100);
}

/** The dish's catalogue name, or its size when the study kept none ("90 cm dish"). */
export function dishName(name: string | null | undefined, diameterM: number): string {
  return name || `${diameterLabel(diameterM).cm} dish`;
}
