import type { QuoteStudySnapshot } from './snapshot';
import { endSentence } from './sentence';

/**
 * Where a quote's figures come from, in the words the customer page, the PDF and the team's quote
 * page print (one place, so all three say the same): which rain climate, and whether gases,
 * clouds and scintillation are counted. Pure.
 *
 * Truthfulness rules: a climate read from the ITU-R maps is said to be; a company profile is
 * named with who chose it and what kind of data it is; quotes made before the maps (no `kind`,
 * no `attenuationModel`) were all a company profile and rain only, and say exactly that.
 */
export interface FiguresSourceInWords {
  /** One sentence: where the rain climate came from. */
  rainClimate: string;
  /** One sentence: what the fade figures count (total or rain only). */
  attenuation: string;
  /** The statistics caution, short, for footers. */
  caution: string;
}

/** The maps a study reads the rain climate with (server/engine/README.md §1 and §7). */
const MAPS_RAIN_CLIMATE = "Rain climate read from the ITU-R maps at your site's coordinates (ITU-R P.837-7, P.839-4).";

/** What each kind of company profile is, in plain words. */
function profileWords(kind: QuoteStudySnapshot['climate']['kind'], companyName: string): string {
  switch (kind) {
    case 'measured-curve':
      return `a local rain record chosen by ${companyName}`;
    case 'monthly-normals':
      return `local monthly rainfall and temperature averages chosen by ${companyName} (ITU-R P.837-7)`;
    case 'known-r001':
      return `a rain rate for the area entered by ${companyName}`;
    case 'climate-zone':
      return `an ITU-R P.837-1 rain climate zone chosen by ${companyName}`;
    default:
      // Quotes made before the climate kind was recorded: a company profile, kind unknown.
      return `a rain climate chosen by ${companyName}`;
  }
}

/**
 * @example
 * figuresSourceInWords({ climate: { name: 'Maps', sourceNote: '', kind: 'itu-r-maps' }, attenuationModel: 'total' }, 'Fenwold Aerials').rainClimate
 * // => "Rain climate read from the ITU-R maps at your site's coordinates (ITU-R P.837-7, P.839-4)."
 */
export function figuresSourceInWords(s: Pick<QuoteStudySnapshot, 'climate' | 'attenuationModel'>, companyName: string): FiguresSourceInWords {
  const rainClimate = s.climate.kind === 'itu-r-maps' ? MAPS_RAIN_CLIMATE : endSentence(`Rain climate from “${s.climate.name}”, ${profileWords(s.climate.kind, companyName)}`);
  const attenuation =
    s.attenuationModel === 'total'
      ? 'The outage figures count rain, clouds, the gases of the air and scintillation together (ITU-R P.618 total attenuation, with P.676 for gases and P.840 for clouds), read for your site.'
      : 'The outage figures count rain only (ITU-R P.618 rain attenuation); clouds, the gases of the air and scintillation, which add a little fade of their own, are not included.';
  return { rainClimate, attenuation, caution: 'Long-term statistics for an average year, not a guarantee for any one year.' };
}
