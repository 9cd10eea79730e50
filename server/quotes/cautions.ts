/**
 * The cautions a quote carries (product.md "Cautions the product shows"), in the order shown.
 * The first two always apply; RF exposure only when the terminal transmits.
 */
export function quoteCautions(opts: { transmits: boolean }): { title: string; body: string }[] {
  const list = [
    {
      title: 'Predictions are statistics, not guarantees',
      body: 'The outage figures are long-term averages from the ITU-R propagation methods. Any one year can be better or worse, and local measured rain data, where it exists, beats a global model.',
    },
    {
      title: 'Installation by qualified, licensed installers',
      body: 'Work at height, grounding and lightning protection, and the mounting and wind loading of larger dishes follow the manufacturer’s instructions and local building and electrical codes.',
    },
  ];
  if (opts.transmits) {
    list.push({
      title: 'This terminal transmits',
      body: 'Keep people out of the beam in front of the dish while it transmits; the RF exposure limits of the local regulator apply.',
    });
  }
  return list;
}
