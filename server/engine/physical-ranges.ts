/**
 * The physical range of every engine input, checked before any arithmetic: a value outside it is
 * an EngineInputError naming the field, never a result (a tilt of 1e308 would reach cos 2τ as
 * NaN; monthly rainfall of 1e6 mm would give an R0.01 of 85 000 mm/h). The limits are generous
 * envelopes of what exists on Earth or in a satellite catalogue (engine conventions, no source,
 * unless a line says otherwise), not design rules.
 */
export const PHYSICAL_RANGES = {
  /** Polarization tilt τ, degrees; P.838-3 uses cos 2τ, so one turn either way is plenty. */
  tiltDeg: { min: -360, max: 360 },
  /**
   * R0.01, mm/h, given or derived. The ITU-R P.837-7 map peaks near 200 mm/h (from memory);
   * 300 mm/h leaves room for measured local data without admitting nonsense.
   */
  r001MmH: { min: 0, max: 300 },
  /** A point of a measured exceedance curve, mm/h (short-integration records reach a few hundred). */
  measuredRainRateMmH: { min: 0, max: 500 },
  /** Monthly mean total rainfall, mm (the wettest monthly normals on record are a few thousand mm). */
  monthlyRainfallMm: { min: 0, max: 5000 },
  /** Satellite EIRP toward the site, dBW. */
  eirpDbw: { min: -20, max: 90 },
  /** Required Es/N0, dB (DVB-S2/S2X span about −10 to +20 dB). */
  esN0Db: { min: -15, max: 40 },
  /** Implementation and other margins and losses, dB. */
  marginDb: { min: 0, max: 30 },
  otherLossesDb: { min: 0, max: 50 },
  /** Symbol rate, Msps. */
  symbolRateMsps: { min: 0.001, max: 2000 },
  /** Reflector diameter, m (hand-held terminals to large gateways). */
  diameterM: { min: 0.1, max: 20 },
  /** LNB / receiver noise temperature, K. */
  lnbNoiseTempK: { min: 1, max: 3000 },
  /** Antenna noise temperature, K. */
  antennaNoiseTempK: { min: 0, max: 3000 },
  /** Mean radiating temperature of the medium, K. */
  mediumTempK: { min: 150, max: 350 },
  /** HPA (BUC) power, W. */
  hpaPowerW: { min: 0.001, max: 10000 },
  /** Terminal EIRP, dBW. */
  terminalEirpDbw: { min: -20, max: 90 },
  /** Satellite receive G/T, dB/K. */
  satelliteGOverTDbK: { min: -50, max: 50 },
  /** Feed loss between HPA and feed, dB. */
  feedLossDb: { min: 0, max: 20 },
} as const;
