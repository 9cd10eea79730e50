import type { StudyInputsSnapshot, StudyResultSnapshot } from '@/server/studies/snapshot';
import { lowElevationCaution } from '@/server/pointing/elevation-caution';
import { declinationWords, studyPointing } from '@/server/pointing/magnetic-declination';
import { quoteCautions } from '@/server/quotes/cautions';

/**
 * The words of the installer's engineering record (the study PDF), apart from the layout, so they
 * can be read and tested without rendering a page. One section per service of the study.
 */

const fixed = (v: number, places: number) => v.toLocaleString('en-US', { minimumFractionDigits: places, maximumFractionDigits: places });
const deg = (v: number, places = 1) => `${fixed(v, places)}°`;
const slot = (lon: number) => (lon === 0 ? '0.0°' : `${fixed(Math.abs(lon), 1)}° ${lon < 0 ? 'W' : 'E'}`);
const POLARIZATION: Record<string, string> = { circular: 'circular', 'linear-vertical': 'linear vertical', 'linear-horizontal': 'linear horizontal' };
const dateWords = (d: Date) => d.toLocaleDateString('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });

/** From this diameter on, the record names the wind load of the largest dish compared (as the study page does from 1.2 m). */
const WIND_LOAD_CAUTION_CM = 120;

export type Line = [term: string, value: string, note?: string];

export function inputLines(inputs: StudyInputsSnapshot): Line[] {
  const s = inputs.service;
  const lines: Line[] = [
    ['Customer · site', `${inputs.site.customerName} · ${inputs.site.name}`],
    // With the hemisphere letters: on paper "49.10300, -22.41600" leaves which is which, and the sign, to memory.
    ['Coordinates', `${fixed(Math.abs(inputs.site.latDeg), 5)}° ${inputs.site.latDeg < 0 ? 'S' : 'N'}, ${fixed(Math.abs(inputs.site.lonDeg), 5)}° ${inputs.site.lonDeg < 0 ? 'W' : 'E'}`, `altitude ${fixed(inputs.site.altitudeM, 0)} m${inputs.site.altitudeSource === 'itu-r-p1511-1' ? ' (ITU-R P.1511-1 map)' : inputs.site.altitudeSource === 'user' ? ' (entered)' : ''}`],
    ['Service', `${s.name} on ${s.satelliteName} at ${slot(s.satelliteLongitudeDeg)}`],
    ['Downlink', `${fixed(s.downlinkFrequencyGHz, 3)} GHz, ${POLARIZATION[s.polarization] ?? s.polarization}, EIRP ${fixed(s.eirpDbw, 1)} dBW, ${fixed(s.symbolRateMsps, 1)} Msps`],
    ['Required Es/N0', `${s.modcod ? `${s.modcod}: ` : ''}${fixed(s.requiredEsN0Db, 2)} dB + ${fixed(s.implementationMarginDb, 1)} dB implementation margin`],
    ['Receive chain', `LNB ${fixed(s.lnbNoiseTempK, 0)} K, antenna ${fixed(s.antennaNoiseTempK, 0)} K, other losses ${fixed(s.otherLossesDb, 1)} dB`],
  ];
  if (s.uplink) lines.push(['Uplink', `${fixed(s.uplink.frequencyGHz, 3)} GHz, ${s.uplink.hpaPowerW !== undefined ? `${fixed(s.uplink.hpaPowerW, 1)} W HPA` : `${fixed(s.uplink.terminalEirpDbw ?? 0, 1)} dBW terminal EIRP`}`]);
  if (s.acmModcods?.length) lines.push(['ACM MODCODs', s.acmModcods.join(', ')]);
  lines.push(['Target availability', `${inputs.targetAvailabilityPercent} % of an average year`]);
  lines.push(['Dishes compared', inputs.dishes.map((d) => `${d.name} (${Math.round(d.diameterM * 100)} cm, efficiency ${fixed(d.efficiency, 2)})`).join('; ')]);
  return lines;
}

export function climateLines(inputs: StudyInputsSnapshot, result: StudyResultSnapshot): Line[] {
  const t = result.tradeoff;
  const c = inputs.climate;
  const atm = t.atmosphere;
  const onMaps = c.kind === 'itu-r-maps';
  const lines: Line[] = [
    ['Rain climate', onMaps ? c.name : `profile "${c.name}", an override of the ITU-R maps`, onMaps ? 'ITU-R P.837-7 maps at the site' : `source: ${c.sourceNote}`],
    ['Method', t.climateSource.label],
    ['R0.01', `${fixed(t.climateSource.r001MmH, 1)} mm/h`, 'rain rate exceeded 0.01 % of the year'],
  ];
  if (t.climateSource.p0Percent !== null) lines.push(['P0', `${fixed(t.climateSource.p0Percent, 2)} %`, 'share of the year with rain, ITU-R P.837-7 Annex 1']);
  lines.push(['Rain height hR', `${fixed(t.rainHeightKm, 2)} km`, 'ITU-R P.839-4: h0 + 0.36 km']);
  if (atm) {
    lines.push(['Gases at 1 %', `${fixed(atm.gas1PctDb, 2)} dB`, 'ITU-R P.676-12 Annex 2, P.836-6 vapour, P.835 pressure']);
    lines.push(['Clouds at 1 %', `${fixed(atm.cloud1PctDb, 2)} dB`, 'ITU-R P.840-8']);
  }
  if (inputs.siteMaps) lines.push(['N_wet (median)', fixed(atm?.nWetMedian ?? inputs.siteMaps.nWetMedian, 1), 'ITU-R P.453-14; scintillation ITU-R P.618-14 §2.4.1']);
  lines.push(['A0.01 (rain)', `${fixed(t.rainAttenuation001Db, 2)} dB`, 'ITU-R P.618-14 §2.2.1.1, downlink']);
  lines.push(['Attenuation counted', t.attenuationModel === 'total' ? 'total: gases, clouds, rain and scintillation (ITU-R P.618-14 §2.5)' : 'rain only (ITU-R P.618-14 §2.2.1.1)']);
  lines.push(['Worst month', 'ITU-R P.841 from the yearly figure']);
  if (inputs.siteMaps) lines.push(['Map data', `${inputs.siteMaps.mapDataVersion}: ${inputs.siteMaps.mapVersions.filter((v) => !v.startsWith('maps:')).join(', ')}`]);
  return lines;
}

export function pointingLines(inputs: StudyInputsSnapshot, result: StudyResultSnapshot): { lines: Line[]; pointing: ReturnType<typeof studyPointing> } {
  const t = result.tradeoff;
  const p = studyPointing(inputs.site, t, new Date(result.computedAt));
  const d = p.declination;
  const linear = inputs.service.polarization !== 'circular';
  return {
    pointing: p,
    lines: [
      ['Azimuth (true)', deg(t.azimuthDeg), 'from true north, clockwise'],
      ['Azimuth (magnetic)', deg(p.magneticAzimuthDeg), 'what a compass reads, away from steel and power lines'],
      ['Magnetic declination', declinationWords(d.declinationDeg), `${d.modelName}, epoch ${d.modelEpoch.toFixed(1)}, for ${dateWords(d.evaluatedFor)}${d.dateHeld ? ' (nearest date the model covers)' : ''}`],
      ['Elevation', deg(t.elevationDeg)],
      ['Polarization skew', linear ? `${t.polarizationSkewDeg >= 0 ? '+' : '-'}${fixed(Math.abs(t.polarizationSkewDeg), 1)}°` : 'none (circular)', linear ? 'turn the feed clockwise for a positive angle, seen from behind the dish' : undefined],
      ['Polarization tilt (P.838-3)', deg(inputs.downlinkTiltDeg), 'tilt used for the rain coefficients'],
      ['Slant range', `${fixed(t.rangeKm, 0)} km`],
    ],
  };
}

/** The record's cautions: the engine's notes, the look-angle caution, then the cautions every quote carries. */
export function recordCautions(inputs: StudyInputsSnapshot, result: StudyResultSnapshot): { title: string; body: string }[] {
  const t = result.tradeoff;
  const list: { title: string; body: string }[] = [];
  const look = lowElevationCaution(t.elevationDeg);
  if (look) list.push({ title: look.title, body: look.text });
  for (const w of t.warnings) if (w.optionIndex === undefined) list.push({ title: w.code === 'low-elevation' ? 'Low elevation' : 'Note on these figures', body: w.message });
  const [statistics, installation, ...rest] = quoteCautions({ transmits: inputs.service.uplink !== null });
  list.push(statistics, installation);
  // The same threshold and words as the study page's caution (components/study/cautions.tsx).
  const largestCm = Math.round(Math.max(...inputs.dishes.map((d) => d.diameterM)) * 100);
  if (largestCm >= WIND_LOAD_CAUTION_CM) {
    list.push({ title: 'Wind load', body: `A ${largestCm} cm reflector catches a lot of wind: check the mount, the wall or roof it is fixed to, and the wind-load figures for the site before choosing it.` });
  }
  list.push(...rest);
  return list;
}
