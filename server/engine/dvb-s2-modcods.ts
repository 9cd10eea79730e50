/** One DVB-S2 modulation and coding combination. */
export interface Modcod {
  /** Trade name, e.g. `'8PSK 3/4'`. */
  name: string;
  /** Spectral efficiency η, information bits per transmitted symbol. */
  spectralEfficiencyBitPerSymbol: number;
  /** Es/N0 for quasi-error-free operation in ideal AWGN, dB. */
  idealEsN0Db: number;
}

/**
 * DVB-S2 MODCODs, normal FECFRAME (64 800 bits), no pilots: spectral efficiency and ideal
 * Es/N0 in AWGN (ETSI EN 302 307-1, Table 13). Typed from memory, as the reference file
 * dvb-s2-modcods.csv also is; the unit tests check every row against that file. Real modems
 * need an implementation margin on top (scenario `implementationMarginDb`).
 *
 * @example
 * DVB_S2_MODCODS.find((m) => m.name === 'QPSK 1/2')?.idealEsN0Db // => 1
 */
export const DVB_S2_MODCODS: readonly Modcod[] = [
  { name: 'QPSK 1/4', spectralEfficiencyBitPerSymbol: 0.490243, idealEsN0Db: -2.35 },
  { name: 'QPSK 1/3', spectralEfficiencyBitPerSymbol: 0.656448, idealEsN0Db: -1.24 },
  { name: 'QPSK 2/5', spectralEfficiencyBitPerSymbol: 0.789412, idealEsN0Db: -0.3 },
  { name: 'QPSK 1/2', spectralEfficiencyBitPerSymbol: 0.988858, idealEsN0Db: 1.0 },
  { name: 'QPSK 3/5', spectralEfficiencyBitPerSymbol: 1.188304, idealEsN0Db: 2.23 },
  { name: 'QPSK 2/3', spectralEfficiencyBitPerSymbol: 1.322253, idealEsN0Db: 3.1 },
  { name: 'QPSK 3/4', spectralEfficiencyBitPerSymbol: 1.487473, idealEsN0Db: 4.03 },
  { name: 'QPSK 4/5', spectralEfficiencyBitPerSymbol: 1.587196, idealEsN0Db: 4.68 },
  { name: 'QPSK 5/6', spectralEfficiencyBitPerSymbol: 1.654663, idealEsN0Db: 5.18 },
  { name: 'QPSK 8/9', spectralEfficiencyBitPerSymbol: 1.766451, idealEsN0Db: 6.2 },
  { name: 'QPSK 9/10', spectralEfficiencyBitPerSymbol: 1.788612, idealEsN0Db: 6.42 },
  { name: '8PSK 3/5', spectralEfficiencyBitPerSymbol: 1.779991, idealEsN0Db: 5.5 },
  { name: '8PSK 2/3', spectralEfficiencyBitPerSymbol: 1.980636, idealEsN0Db: 6.62 },
  { name: '8PSK 3/4', spectralEfficiencyBitPerSymbol: 2.228124, idealEsN0Db: 7.91 },
  { name: '8PSK 5/6', spectralEfficiencyBitPerSymbol: 2.478562, idealEsN0Db: 9.35 },
  { name: '8PSK 8/9', spectralEfficiencyBitPerSymbol: 2.646012, idealEsN0Db: 10.69 },
  { name: '8PSK 9/10', spectralEfficiencyBitPerSymbol: 2.679207, idealEsN0Db: 10.98 },
  { name: '16APSK 2/3', spectralEfficiencyBitPerSymbol: 2.637201, idealEsN0Db: 8.97 },
  { name: '16APSK 3/4', spectralEfficiencyBitPerSymbol: 2.966728, idealEsN0Db: 10.21 },
  { name: '16APSK 4/5', spectralEfficiencyBitPerSymbol: 3.165623, idealEsN0Db: 11.03 },
  { name: '16APSK 5/6', spectralEfficiencyBitPerSymbol: 3.300184, idealEsN0Db: 11.61 },
  { name: '16APSK 8/9', spectralEfficiencyBitPerSymbol: 3.523143, idealEsN0Db: 12.89 },
  { name: '16APSK 9/10', spectralEfficiencyBitPerSymbol: 3.567342, idealEsN0Db: 13.13 },
  { name: '32APSK 3/4', spectralEfficiencyBitPerSymbol: 3.703295, idealEsN0Db: 12.73 },
  { name: '32APSK 4/5', spectralEfficiencyBitPerSymbol: 3.951571, idealEsN0Db: 13.64 },
  { name: '32APSK 5/6', spectralEfficiencyBitPerSymbol: 4.11954, idealEsN0Db: 14.28 },
  { name: '32APSK 8/9', spectralEfficiencyBitPerSymbol: 4.397854, idealEsN0Db: 15.69 },
  { name: '32APSK 9/10', spectralEfficiencyBitPerSymbol: 4.453027, idealEsN0Db: 16.05 },
];

/**
 * Look up a DVB-S2 MODCOD by name (`'QPSK 3/4'`; case and spacing are not forgiven).
 *
 * Bad input: an unknown name returns `undefined`; callers that need one throw EngineInputError.
 *
 * @example
 * findModcod('16APSK 3/4')?.spectralEfficiencyBitPerSymbol // => 2.966728
 */
export function findModcod(name: string): Modcod | undefined {
  return DVB_S2_MODCODS.find((m) => m.name === name);
}
