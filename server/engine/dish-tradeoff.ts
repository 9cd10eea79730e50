import type Decimal from 'decimal.js';
import { acmEnvelope, acmThroughput } from './acm-throughput';
import { dishBeamwidthUnchecked } from './dish-beamwidth';
import { dishGainUnchecked } from './dish-gain';
import { findModcod, type Modcod } from './dvb-s2-modcods';
import { EngineInputError } from './errors';
import { fadeThresholdUnchecked } from './fade-threshold';
import { freeSpaceLossUnchecked } from './free-space-loss';
import { geoLookAnglesUnchecked } from './geo-look-angles';
import { linkBudgetUnchecked } from './link-budget';
import { parseMoneyUsd } from './money';
import { NEVER_WORKS, outageFigures, type OutageFigures } from './outage-figures';
import { combinedFadeExceedance } from './p618-combined-fade';
import { MAX_FREQUENCY_GHZ_P618_14, MIN_FREQUENCY_GHZ_P618_14, prepareRainPathUnchecked, type RainExceedance } from './p618-rain-path';
import { MIN_ELEVATION_DEG_ATMOSPHERE, prepareAtmosphericPath, rainOnHeldScan, totalAttenuationCurve, type AtmosphericPath, type TotalAttenuationCurve } from './p618-total-attenuation';
import { checkSiteAtmosphere, type SiteAtmosphere } from './site-atmosphere';
import { scintillationSigmaUnchecked } from './p618-scintillation';
import { resolveRainHeight } from './p839-rain-height';
import { pointingLossUnchecked } from './pointing-loss';
import { resolveRainClimate } from './rain-climate-source';
import { checkSystemNoise } from './system-noise';
import { tradeoffEconomics } from './tradeoff-economics';
import { meetsTargetAvailability, tradeoffRecommendation } from './tradeoff-recommendation';
import type {
  EngineWarning,
  ScintillationLayer,
  TradeoffOption,
  TradeoffResult,
  TradeoffScenario,
  TwoWayOutage,
  UplinkOption,
} from './tradeoff-types';
import { ENGINE_VERSION } from './version';
import { PHYSICAL_RANGES as R } from './physical-ranges';
import { requireNumberInRange, requirePositive } from './validate';

/** A path whose attenuation exceedance can be asked: rain alone, or the P.618 §2.5 total. */
type FadeCurve = { exceedanceOf(attenuationDb: number): RainExceedance } & Partial<Pick<TotalAttenuationCurve, 'componentsAt'>>;

/** Below this elevation the user is warned (server/engine/README.md §3). */
const LOW_ELEVATION_WARNING_DEG = 5;
/** Most dishes in one study (keeps one call bounded). */
const MAX_DISHES = 100;
/** Pointing errors above this share of the beamwidth leave the 12 (θ_e/θ_3dB)² main-lobe model (common practice, no source). */
const MAX_POINTING_ERROR_SHARE_OF_BEAMWIDTH = 0.5;

/**
 * The trade-off of server/engine/README.md §5: for one site and one satellite carrier, every candidate dish's
 * link budget, fade threshold and rain outage (annual and worst month), with money in
 * decimal.js and a recommendation.
 *
 * Chain per dish (server/engine/README.md §4): gain G = 10 log10(η(πDf/c)²); G/T = G − 10 log10(T_rx + T_ant);
 * C/N0 = EIRP − L_fs − L_other − L_pointing + G/T + 228.6; Es/N0 = C/N0 − 10 log10 R_s;
 * margin M = Es/N0 − (required + implementation); fade threshold A* from DND(A*) = M (exact
 * solution, see fadeThreshold); outage p* = P(A_rain > A*) from ITU-R P.618-14 §2.2.1.1 step 10
 * inverted (A_0.01 computed once per study); availability 100 − p*; minutes = p* / 100 × 525 960;
 * worst month by ITU-R P.841.
 *
 * Conventions (also on the result types):
 * - A dish with M ≤ 0 "does not close": `closes: false`, `fadeThresholdDb: null`, outage 100 %
 *   (bound 'none'), availability 0, 525 960 min/year — it never works; the negative `marginDb`
 *   is its shortfall.
 * - Outage below 0.001 % of the year: `outageBound: 'below-model-range'`, `outagePercent` 0.001
 *   as an upper bound (availability "> 99.999 %"); above 5 %: 'above-model-range', 5 as a lower
 *   bound. Minutes and worst month carry the same bound.
 * - Rain climate: any of the four sources of server/engine/README.md §1; P.618 uses R_0.01, reported with its
 *   provenance in `climateSource`. Rain height: given h_R, else h_0 + 0.36 km, else the
 *   latitude approximation (`rainHeightSource: 'latitude-approximation'`, with a warning).
 * - Uplink (optional): the same chain at the uplink frequency with the terminal's EIRP and the
 *   satellite's G/T, no noise increase at the satellite (A*_up = M_up); the two-way outage is the
 *   conservative sum p_up + p_down (`twoWay.isUpperBound: true`) and becomes the basis of the
 *   economics and the target.
 * - ACM (optional): expected throughput per dish over the MODCOD set (see acmThroughput).
 * - Scintillation (optional, `scintillation.nWet`): a separate downlink figure with
 *   A_T = √(A_R² + A_S²) (P.618-14 §2.5 without gases and clouds); not used for the economics.
 *
 * Bad input: every number is checked; NaN, a negative diameter, frequency outside 1–55 GHz, a
 * satellite below the horizon (`satellite.longitudeDeg`), a bad rain source etc. throw
 * EngineInputError whose `field` is the path in the scenario (e.g. `dishes[1].diameterM`).
 *
 * @example
 * const result = dishTradeoff({
 *   site: { latDeg: 41.9, lonDeg: 12.49, altitudeKm: 0.05 }, satellite: { longitudeDeg: 13 },
 *   downlink: { frequencyGHz: 11.7, tiltDeg: 0, eirpDbw: 50, symbolRateMsps: 27.5, requiredEsN0Db: 7.91, implementationMarginDb: 1 },
 *   receiver: { lnbNoiseTempK: 60, antennaNoiseTempK: 35 },
 *   rain: { r001MmH: 33.9, rainHeightKm: 3.05 },
 *   dishes: [{ diameterM: 0.6, efficiency: 0.65, priceUsd: '120' }, { diameterM: 0.8, efficiency: 0.65, priceUsd: '160' }],
 *   targetAvailabilityPercent: 99.9,
 * })
 * result.options.map((o) => Math.round(o.outageMinutesPerYear)) // => [259, 93]
 * result.options[1].costPerMinuteSavedUsd                      // => '0.2402'
 * result.recommendation // => { basis: 'downlink', smallestMeetingTargetIndex: 0, bestValueIndex: 1, diminishingReturnsIndex: 1, … }
 */
export function dishTradeoff(scenario: TradeoffScenario): TradeoffResult {
  if (!scenario || typeof scenario !== 'object') throw new EngineInputError('scenario', 'a scenario object is required', scenario);
  const site = requireObject(scenario.site, 'site');
  const sat = requireObject(scenario.satellite, 'satellite');
  const dl = requireObject(scenario.downlink, 'downlink');
  const rx = requireObject(scenario.receiver, 'receiver');

  const latDeg = requireNumberInRange(site.latDeg, 'site.latDeg', -90, 90);
  const lonDeg = requireNumberInRange(site.lonDeg, 'site.lonDeg', -360, 360);
  const altitudeKm = requireNumberInRange(site.altitudeKm, 'site.altitudeKm', -1, 10);
  const satLon = requireNumberInRange(sat.longitudeDeg, 'satellite.longitudeDeg', -360, 360);

  const fDown = requireNumberInRange(dl.frequencyGHz, 'downlink.frequencyGHz', MIN_FREQUENCY_GHZ_P618_14, MAX_FREQUENCY_GHZ_P618_14, 'ITU-R P.618-14 rain attenuation is stated for 1–55 GHz');
  const tiltDown = inRange(dl.tiltDeg, 'downlink.tiltDeg', R.tiltDeg);
  const eirpDown = inRange(dl.eirpDbw, 'downlink.eirpDbw', R.eirpDbw);
  const rsDown = inRange(dl.symbolRateMsps, 'downlink.symbolRateMsps', R.symbolRateMsps);
  const reqDown = inRange(dl.requiredEsN0Db, 'downlink.requiredEsN0Db', R.esN0Db);
  const implDown = inRange(dl.implementationMarginDb, 'downlink.implementationMarginDb', R.marginDb);
  const otherDown = dl.otherLossesDb === undefined ? 0 : inRange(dl.otherLossesDb, 'downlink.otherLossesDb', R.otherLossesDb);
  const pointingErr = dl.pointingErrorDeg === undefined ? 0 : requireNumberInRange(dl.pointingErrorDeg, 'downlink.pointingErrorDeg', 0, 10);
  const temps = checkSystemNoise(rx, 'receiver.');

  const target = scenario.targetAvailabilityPercent === undefined
    ? null
    : requireNumberInRange(scenario.targetAvailabilityPercent, 'targetAvailabilityPercent', 0, 100);

  const dishes = scenario.dishes;
  if (!Array.isArray(dishes) || dishes.length === 0) throw new EngineInputError('dishes', 'give at least one dish', dishes);
  if (dishes.length > MAX_DISHES) throw new EngineInputError('dishes', `at most ${MAX_DISHES} dishes per study; got ${dishes.length}`, dishes.length);
  const diam: number[] = [];
  const eff: number[] = [];
  const prices: (Decimal | null)[] = [];
  dishes.forEach((d, i) => {
    const f = `dishes[${i}]`;
    requireObject(d, f);
    diam.push(inRange(d.diameterM, `${f}.diameterM`, R.diameterM));
    const e = requirePositive(d.efficiency, `${f}.efficiency`);
    if (e > 1) throw new EngineInputError(`${f}.efficiency`, `must be at most 1; got ${e}`, e);
    eff.push(e);
    const hw = d.priceUsd === undefined ? null : parseMoneyUsd(d.priceUsd, `${f}.priceUsd`);
    const lab = d.labourUsd === undefined ? null : parseMoneyUsd(d.labourUsd, `${f}.labourUsd`);
    prices.push(hw && lab ? hw.plus(lab) : hw ?? lab);
  });

  // Geometry (server/engine/README.md §3): refuse a satellite below the horizon, warn below 5°.
  const look = geoLookAnglesUnchecked(latDeg, lonDeg, altitudeKm, satLon);
  if (look.elevationDeg <= 0) {
    throw new EngineInputError(
      'satellite.longitudeDeg',
      `the satellite is below the horizon at this site (elevation ${look.elevationDeg.toFixed(2)}°); nothing can be computed`,
      satLon,
    );
  }
  const warnings: EngineWarning[] = [];
  if (look.elevationDeg < LOW_ELEVATION_WARNING_DEG) {
    warnings.push({
      code: 'low-elevation',
      message: `Elevation ${look.elevationDeg.toFixed(1)}° is below 5°: terrain, buildings and trees may block the path, and fade figures are less certain.`,
    });
  }

  // Rain climate and height (server/engine/README.md §1).
  const climate = resolveRainClimate(scenario.rain);
  const rainIn = scenario.rain as { rainHeightKm?: number; zeroIsothermHeightKm?: number };
  const height = resolveRainHeight({ latDeg, rainHeightKm: rainIn.rainHeightKm, zeroIsothermHeightKm: rainIn.zeroIsothermHeightKm, fieldPrefix: 'rain.' });
  if (height.source === 'latitude-approximation') {
    warnings.push({
      code: 'rain-height-approximation',
      message: `Rain height ${height.rainHeightKm.toFixed(2)} km is a latitude approximation (older editions of ITU-R P.839); give the site's 0 °C isotherm height for a better figure.`,
    });
  }

  const pathBase = { latDeg, stationHeightKm: altitudeKm, elevationDeg: look.elevationDeg, r001MmH: climate.r001MmH, rainHeightKm: height.rainHeightKm };
  const downPath = prepareRainPathUnchecked({ ...pathBase, frequencyGHz: fDown, tiltDeg: tiltDown });
  if (downPath.a001Db === 0) {
    warnings.push({ code: 'no-rain-fade', message: 'The model predicts no rain fade at this site (no rain above the station, or R0.01 = 0).' });
  }
  const fslDown = freeSpaceLossUnchecked(look.rangeKm, fDown);

  // Gases, clouds and scintillation from the site's atmosphere (server/engine/README.md §7): the outage is then
  // where the TOTAL attenuation of P.618-14 §2.5 reaches the fade threshold.
  let atmosphere: SiteAtmosphere | null = scenario.atmosphere === undefined ? null : checkSiteAtmosphere(scenario.atmosphere);
  if (atmosphere && look.elevationDeg < MIN_ELEVATION_DEG_ATMOSPHERE) {
    warnings.push({ code: 'atmosphere-skipped', message: `Gases, clouds and scintillation (ITU-R P.676-12, P.840-8, P.618-14 §2.4.1) are stated for elevations of 5° and above; at ${look.elevationDeg.toFixed(1)}° the outage is rain only.` });
    atmosphere = null;
  }
  const atmPathOf = (frequencyGHz: number): AtmosphericPath | null =>
    atmosphere ? prepareAtmosphericPath({ frequencyGHz, elevationDeg: look.elevationDeg, stationHeightKm: altitudeKm, atmosphere }) : null;
  const atmDown = atmPathOf(fDown);

  // Optional layers, validated before any per-dish work.
  const up = scenario.uplink === undefined ? null : checkUplink(scenario.uplink, dishes);
  const upPath = up ? prepareRainPathUnchecked({ ...pathBase, frequencyGHz: up.frequencyGHz, tiltDeg: up.tiltDeg }) : null;
  const atmUp = up ? atmPathOf(up.frequencyGHz) : null;
  const fslUp = up ? freeSpaceLossUnchecked(look.rangeKm, up.frequencyGHz) : 0;
  const envelope = scenario.acm === undefined ? null : acmEnvelope(checkModcods(scenario.acm));
  let nWet: number | null = null;
  if (scenario.scintillation !== undefined) {
    nWet = requireNumberInRange(requireObject(scenario.scintillation, 'scintillation').nWet, 'scintillation.nWet', 0, 200);
    if (look.elevationDeg < 5) {
      warnings.push({ code: 'scintillation-skipped', message: 'Scintillation (ITU-R P.618-14 §2.4.1) is defined for elevations of 5° and above; the layer is left out.' });
      nWet = null;
    } else if (fDown < 4 || fDown > 20) {
      warnings.push({ code: 'scintillation-frequency-extrapolated', message: 'ITU-R P.618-14 §2.4.1 was tested for 4–20 GHz; the scintillation figure at this frequency is an extrapolation.' });
    }
  }

  // Rain on the below-1 % scan grid, once per path for all the dishes (rainOnHeldScan).
  let downScan: readonly number[] | undefined;
  let upScan: readonly number[] | undefined;
  const tSys0 = temps.lnb + temps.ant;
  const tSysDb = 10 * Math.log10(tSys0);
  const thresholdDown = reqDown + implDown;
  const options: TradeoffOption[] = [];
  const basisFigures: OutageFigures[] = [];

  for (let i = 0; i < dishes.length; i++) {
    const gain = dishGainUnchecked(diam[i], eff[i], fDown);
    const bw = dishBeamwidthUnchecked(diam[i], fDown);
    const lp = pointingErr > 0 ? pointingLossUnchecked(pointingErr, bw) : 0;
    if (pointingErr > MAX_POINTING_ERROR_SHARE_OF_BEAMWIDTH * bw) {
      warnings.push({ code: 'pointing-error-large', optionIndex: i, message: `Pointing error ${pointingErr}° is more than half the ${bw.toFixed(2)}° beamwidth of the ${diam[i]} m dish; the pointing-loss figure is unreliable.` });
    }
    const gt = gain - tSysDb;
    const lb = linkBudgetUnchecked(eirpDown, fslDown + otherDown + lp, gt, rsDown, thresholdDown);
    const aStar = fadeThresholdUnchecked(lb.marginDb, temps.lnb, temps.ant, temps.medium);
    const downCurve: FadeCurve = atmDown && atmosphere
      ? totalAttenuationCurve({ rainPath: downPath, atmosphericPath: atmDown, scintillationSigmaDb: scintillationSigmaUnchecked(fDown, look.elevationDeg, diam[i], eff[i], atmosphere.nWetMedian), rainOnHeldScan: (downScan ??= rainOnHeldScan(downPath)) })
      : downPath;
    const figures = aStar === null ? NEVER_WORKS : exceedanceFigures(downCurve, aStar);
    const componentsAtOutage = aStar !== null && downCurve.componentsAt ? downCurve.componentsAt(figures.outagePercent) : null;
    if (aStar === null) {
      warnings.push({ code: 'dish-does-not-close', optionIndex: i, message: `The ${diam[i]} m dish does not close the downlink even in clear sky (short by ${(-lb.marginDb).toFixed(2)} dB).` });
    } else if (figures.outageBound !== 'none') {
      warnings.push(boundWarning(figures, i, diam[i], 'downlink'));
    }

    let uplink: UplinkOption | null = null;
    let twoWay: TwoWayOutage | null = null;
    if (up && upPath) {
      const upCurve: FadeCurve = atmUp && atmosphere
        ? totalAttenuationCurve({ rainPath: upPath, atmosphericPath: atmUp, scintillationSigmaDb: scintillationSigmaUnchecked(up.frequencyGHz, look.elevationDeg, diam[i], eff[i], atmosphere.nWetMedian), rainOnHeldScan: (upScan ??= rainOnHeldScan(upPath)) })
        : upPath;
      uplink = uplinkOption(up, i, diam[i], eff[i], fslUp, pointingErr, upCurve);
      if (!uplink.closes) {
        warnings.push({ code: 'uplink-does-not-close', optionIndex: i, message: `The ${diam[i]} m dish does not close the uplink even in clear sky (short by ${(-uplink.marginDb).toFixed(2)} dB).` });
      }
      twoWay = twoWayOutage(uplink, figures);
    }

    const acm = envelope
      ? acmThroughput({ envelope, clearSkyEsN0Db: lb.esN0Db, symbolRateMsps: rsDown, implementationMarginDb: implDown, rainPath: downCurve, lnbNoiseTempK: temps.lnb, antennaNoiseTempK: temps.ant, mediumTempK: temps.medium })
      : null;
    if (acm?.modelRangeLimited) {
      warnings.push({ code: 'acm-model-range', optionIndex: i, message: `Some MODCOD steps of the ${diam[i]} m dish are exceeded more than 5 % of the year (beyond the ITU-R P.618 range); its expected throughput is an upper bound.` });
    }

    let scint: ScintillationLayer | null = null;
    if (nWet !== null) {
      const sigma = scintillationSigmaUnchecked(fDown, look.elevationDeg, diam[i], eff[i], nWet);
      const f2 = aStar === null ? NEVER_WORKS : (() => {
        const ex = combinedFadeExceedance({ rainPath: downPath, scintillationSigmaDb: sigma, attenuationDb: aStar, rainOnHeldScan: (downScan ??= rainOnHeldScan(downPath)) });
        return outageFigures(ex.pPercent, ex.bound);
      })();
      scint = { ...f2, sigmaDb: sigma };
    }

    basisFigures.push(twoWay ?? figures);
    options.push({
      index: i,
      diameterM: diam[i],
      efficiency: eff[i],
      gainDbi: gain,
      beamwidthDeg: bw,
      pointingLossDb: lp,
      systemNoiseTempK: tSys0,
      gOverTDbK: gt,
      cOverN0DbHz: lb.cOverN0DbHz,
      clearSkyEsN0Db: lb.esN0Db,
      marginDb: lb.marginDb,
      closes: aStar !== null,
      fadeThresholdDb: aStar,
      ...figures,
      attenuationAtOutage: componentsAtOutage,
      uplink,
      twoWay,
      acm,
      scintillation: scint,
      priceUsd: null,
      minutesSavedPerYear: 0,
      costPerMinuteSavedUsd: null,
      meetsTarget: null,
    });
  }

  // Economics and recommendation against the smallest dish (server/engine/README.md §5).
  let baselineIndex = 0;
  for (let i = 1; i < diam.length; i++) if (diam[i] < diam[baselineIndex]) baselineIndex = i;
  const econ = tradeoffEconomics({ prices, outageMinutesPerYear: basisFigures.map((f) => f.outageMinutesPerYear), baselineIndex });
  for (let i = 0; i < options.length; i++) {
    options[i].priceUsd = econ.priceUsd[i];
    options[i].minutesSavedPerYear = econ.minutesSavedPerYear[i];
    options[i].costPerMinuteSavedUsd = econ.costPerMinuteSavedUsd[i];
    options[i].meetsTarget = target === null ? null : meetsTargetAvailability(basisFigures[i], target);
  }
  const basis = up ? 'two-way' : 'downlink';
  const recommendation = tradeoffRecommendation({
    basis,
    diametersM: diam,
    figures: basisFigures,
    prices,
    costPerMinute: econ.costPerMinuteSaved,
    minutesSaved: econ.minutesSavedPerYear,
    target,
    baselineIndex,
  });
  if (up) {
    warnings.push({ code: 'two-way-upper-bound', message: 'Two-way outage is the sum of uplink and downlink outages (ITU-R P.618 gives each separately); it is an upper bound.' });
  }
  if (target !== null) {
    if (target > 99.999) {
      warnings.push({ code: 'target-beyond-model-range', message: `A target above 99.999 % lies beyond the ITU-R P.618 model range (0.001 % of the year); no dish can be shown to meet ${target} %.` });
    }
    if (recommendation.smallestMeetingTargetIndex === null) {
      warnings.push({ code: 'target-not-met', message: `No dish in the study is shown to meet ${target} % availability.` });
    }
  }

  return {
    engineVersion: ENGINE_VERSION,
    elevationDeg: look.elevationDeg,
    azimuthDeg: look.azimuthDeg,
    rangeKm: look.rangeKm,
    polarizationSkewDeg: look.polarizationSkewDeg,
    rainHeightKm: height.rainHeightKm,
    rainHeightSource: height.source,
    climateSource: climate,
    freeSpaceLossDb: fslDown,
    attenuationModel: atmDown ? 'total' : 'rain',
    atmosphere: atmDown && atmosphere
      ? { pressureHpa: atmDown.pressureHpa, surfaceTemperatureK: atmosphere.surfaceTemperatureK, nWetMedian: atmosphere.nWetMedian, gas1PctDb: atmDown.gasAt(1), cloud1PctDb: atmDown.cloudAt(1) }
      : null,
    rainAttenuation001Db: downPath.a001Db,
    options,
    recommendation,
    warnings,
  };
}

/** A number within its physical range (PHYSICAL_RANGES), else EngineInputError naming the field. */
function inRange(value: unknown, field: string, range: { min: number; max: number }): number {
  return requireNumberInRange(value, field, range.min, range.max, 'physical range');
}

function requireObject<T>(value: T, field: string): NonNullable<T> {
  if (value === null || typeof value !== 'object') throw new EngineInputError(field, 'is required', value);
  return value as NonNullable<T>;
}

function exceedanceFigures(path: FadeCurve, attenuationDb: number): OutageFigures {
  const ex = path.exceedanceOf(attenuationDb);
  return outageFigures(ex.pPercent, ex.bound);
}

function boundWarning(f: OutageFigures, i: number, d: number, link: string): EngineWarning {
  return f.outageBound === 'below-model-range'
    ? { code: 'outage-below-model-range', optionIndex: i, message: `The ${d} m dish's ${link} rain outage is below 0.001 % of the year (beyond the ITU-R P.618 range): shown as "less than".` }
    : { code: 'outage-above-model-range', optionIndex: i, message: `The ${d} m dish's ${link} rain outage is above 5 % of the year (beyond the ITU-R P.618 range): shown as "more than".` };
}

interface CheckedUplink {
  frequencyGHz: number;
  tiltDeg: number;
  terminalEirpDbw: number | null;
  hpaPowerW: number | null;
  perDishHpaW: (number | null)[];
  feedLossDb: number;
  satelliteGOverTDbK: number;
  symbolRateMsps: number;
  thresholdDb: number;
  otherLossesDb: number;
}

function checkUplink(raw: NonNullable<TradeoffScenario['uplink']>, dishes: TradeoffScenario['dishes']): CheckedUplink {
  const u = requireObject(raw, 'uplink');
  const perDishHpaW = dishes.map((d, i) => (d.hpaPowerW === undefined ? null : inRange(d.hpaPowerW, `dishes[${i}].hpaPowerW`, R.hpaPowerW)));
  const hasEirp = u.terminalEirpDbw !== undefined;
  const anyHpa = u.hpaPowerW !== undefined || perDishHpaW.some((p) => p !== null);
  if (hasEirp && anyHpa) {
    throw new EngineInputError('uplink.terminalEirpDbw', 'give either a fixed terminal EIRP or HPA power, not both', u.terminalEirpDbw);
  }
  if (!hasEirp && u.hpaPowerW === undefined) {
    const missing = perDishHpaW.findIndex((p) => p === null);
    if (missing >= 0) {
      throw new EngineInputError(
        anyHpa ? `dishes[${missing}].hpaPowerW` : 'uplink.terminalEirpDbw',
        'the uplink needs uplink.terminalEirpDbw, uplink.hpaPowerW, or hpaPowerW on every dish',
        undefined,
      );
    }
  }
  const implementationMarginDb = u.implementationMarginDb === undefined ? 0 : inRange(u.implementationMarginDb, 'uplink.implementationMarginDb', R.marginDb);
  return {
    frequencyGHz: requireNumberInRange(u.frequencyGHz, 'uplink.frequencyGHz', MIN_FREQUENCY_GHZ_P618_14, MAX_FREQUENCY_GHZ_P618_14, 'ITU-R P.618-14 rain attenuation is stated for 1–55 GHz'),
    tiltDeg: inRange(u.tiltDeg, 'uplink.tiltDeg', R.tiltDeg),
    terminalEirpDbw: hasEirp ? inRange(u.terminalEirpDbw, 'uplink.terminalEirpDbw', R.terminalEirpDbw) : null,
    hpaPowerW: u.hpaPowerW === undefined ? null : inRange(u.hpaPowerW, 'uplink.hpaPowerW', R.hpaPowerW),
    perDishHpaW,
    feedLossDb: u.feedLossDb === undefined ? 0 : inRange(u.feedLossDb, 'uplink.feedLossDb', R.feedLossDb),
    satelliteGOverTDbK: inRange(u.satelliteGOverTDbK, 'uplink.satelliteGOverTDbK', R.satelliteGOverTDbK),
    symbolRateMsps: inRange(u.symbolRateMsps, 'uplink.symbolRateMsps', R.symbolRateMsps),
    thresholdDb: inRange(u.requiredEsN0Db, 'uplink.requiredEsN0Db', R.esN0Db) + implementationMarginDb,
    otherLossesDb: u.otherLossesDb === undefined ? 0 : inRange(u.otherLossesDb, 'uplink.otherLossesDb', R.otherLossesDb),
  };
}

function uplinkOption(up: CheckedUplink, i: number, d: number, eta: number, fslUp: number, pointingErr: number, path: FadeCurve): UplinkOption {
  const gain = dishGainUnchecked(d, eta, up.frequencyGHz);
  const lp = pointingErr > 0 ? pointingLossUnchecked(pointingErr, dishBeamwidthUnchecked(d, up.frequencyGHz)) : 0;
  const hpa = up.perDishHpaW[i] ?? up.hpaPowerW;
  const eirp = up.terminalEirpDbw ?? 10 * Math.log10(hpa as number) + gain - up.feedLossDb;
  const lb = linkBudgetUnchecked(eirp, fslUp + up.otherLossesDb + lp, up.satelliteGOverTDbK, up.symbolRateMsps, up.thresholdDb);
  // No noise increase at the satellite (it already looks at a warm Earth): A*_up = M_up.
  const closes = lb.marginDb > 0;
  const figures = closes ? exceedanceFigures(path, lb.marginDb) : NEVER_WORKS;
  const attenuationAtOutage = closes && path.componentsAt ? path.componentsAt(figures.outagePercent) : null;
  return { gainDbi: gain, eirpDbw: eirp, clearSkyEsN0Db: lb.esN0Db, marginDb: lb.marginDb, closes, fadeThresholdDb: closes ? lb.marginDb : null, ...figures, attenuationAtOutage };
}

/** Conservative two-way sum p_up + p_down (server/engine/README.md §4), an upper bound. */
function twoWayOutage(up: OutageFigures, down: OutageFigures): TwoWayOutage {
  const p = Math.min(100, up.outagePercent + down.outagePercent);
  const bound = up.outagePercent + down.outagePercent >= 100
    ? 'none'
    : up.outageBound === 'above-model-range' || down.outageBound === 'above-model-range'
      ? 'above-model-range'
      : up.outageBound === 'below-model-range' && down.outageBound === 'below-model-range'
        ? 'below-model-range'
        : 'none';
  return { ...outageFigures(p, bound), isUpperBound: true };
}

function checkModcods(acm: NonNullable<TradeoffScenario['acm']>): Modcod[] {
  const list = requireObject(acm, 'acm').modcods;
  if (!Array.isArray(list) || list.length === 0) throw new EngineInputError('acm.modcods', 'give at least one MODCOD', list);
  return list.map((m, i) => {
    const f = `acm.modcods[${i}]`;
    if (typeof m === 'string') {
      const found = findModcod(m);
      if (!found) throw new EngineInputError(f, `unknown DVB-S2 MODCOD "${m}" (e.g. "QPSK 3/4", "8PSK 2/3")`, m);
      return found;
    }
    requireObject(m, f);
    if (typeof m.name !== 'string' || m.name.length === 0) throw new EngineInputError(`${f}.name`, 'a MODCOD needs a name', m.name);
    return {
      name: m.name,
      spectralEfficiencyBitPerSymbol: requireNumberInRange(m.spectralEfficiencyBitPerSymbol, `${f}.spectralEfficiencyBitPerSymbol`, 0.01, 10, 'physical range'),
      idealEsN0Db: inRange(m.idealEsN0Db, `${f}.idealEsN0Db`, R.esN0Db),
    };
  });
}
