/**
 * The preview table's headers in words, with units: the parsers' field names (rainfallMm,
 * pPercent…) are for code. An unknown key falls back to words split from its camelCase.
 */
const LABELS: Record<string, string> = {
  line: 'Line',
  month: 'Month',
  rainfallMm: 'Rainfall (mm)',
  temperatureC: 'Mean temperature (°C)',
  pPercent: 'Exceeded (% of the year)',
  rainRateMmH: 'Rain rate (mm/h)',
  name: 'Name',
  diameterM: 'Diameter (m)',
  efficiency: 'Efficiency',
  hardwarePrice: 'Hardware price',
  labourPrice: 'Labour price',
  mountNotes: 'Mount notes',
  active: 'Active',
};

export function previewColumnLabel(key: string): string {
  if (LABELS[key]) return LABELS[key];
  const words = key.replace(/([a-z0-9])([A-Z])/g, '$1 $2').replace(/[_-]+/g, ' ').toLowerCase().trim();
  return words.charAt(0).toUpperCase() + words.slice(1);
}
