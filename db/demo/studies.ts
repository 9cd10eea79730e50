/**
 * The invented demo scenario of the studies part: customers in places of our own making, at
 * coordinates on an island of our own making in the open North Atlantic (about 48–50° N,
 * 20–23° W, where there is no land and so no real town), two invented satellites at unremarkable
 * slots, an invented dish catalogue and price list, and climate profiles of each kind with
 * invented figures. Nothing here names a real person, brand,
 * town or satellite. PART B (quotes) finds the demo studies by the titles below.
 */
export const DEMO_SERVICES = [
  {
    key: 'corvid-tv',
    name: 'Corvid TV bouquet',
    satelliteName: 'Corvid-2',
    satelliteLongitudeDeg: '19.5 W',
    downlinkFrequencyGHz: '11.720',
    polarization: 'linear-horizontal',
    eirpDbw: '50.5',
    symbolRateMsps: '27.5',
    modcod: '8PSK 3/4',
    implementationMarginDb: '1.0',
    otherLossesDb: '0.4',
    lnbNoiseTempK: '55',
    antennaNoiseTempK: '40',
    notes: 'Direct-to-home TV on the Corvid-2 western beam.',
  },
  {
    key: 'halcyon-broadband',
    name: 'Halcyon two-way broadband',
    satelliteName: 'Halcyon-4',
    satelliteLongitudeDeg: '6.3 E',
    downlinkFrequencyGHz: '19.950',
    polarization: 'circular',
    eirpDbw: '55',
    symbolRateMsps: '45',
    modcod: 'QPSK 3/4',
    implementationMarginDb: '1.0',
    otherLossesDb: '0.8',
    lnbNoiseTempK: '110',
    antennaNoiseTempK: '60',
    acmModcods: 'QPSK 1/2, QPSK 3/4, 8PSK 2/3, 8PSK 5/6, 16APSK 3/4',
    uplinkEnabled: 'on',
    uplinkFrequencyGHz: '29.750',
    uplinkHpaPowerW: '3',
    uplinkSatelliteGOverTDbK: '14',
    uplinkSymbolRateMsps: '2',
    uplinkModcod: 'QPSK 1/2',
    uplinkImplementationMarginDb: '1.5',
    notes: 'Ka-band VSAT service; the terminal transmits at 29.75 GHz.',
  },
] as const;

/** Diameter m, efficiency, hardware and labour (USD), mount notes. Invented names and prices. */
export const DEMO_DISHES = [
  ['Quill 60', '0.60', '0.64', '79.00', '95.00', 'Wall bracket, 40 mm mast'],
  ['Quill 75', '0.75', '0.65', '109.00', '110.00', 'Wall bracket, 50 mm mast'],
  ['Quill 90', '0.90', '0.66', '159.00', '130.00', 'Wall or pole, 60 mm mast'],
  ['Quill 100', '1.00', '0.66', '219.00', '150.00', 'Pole, 60 mm, heavy bracket'],
  ['Quill 120', '1.20', '0.67', '329.00', '210.00', 'Pole or ground mount, 76 mm'],
  ['Quill 150', '1.50', '0.68', '549.00', '340.00', 'Ground mount with ballast; two-person lift'],
  ['Quill 180', '1.80', '0.68', '899.00', '520.00', 'Ground mount, concrete base; crane or three-person lift'],
] as const;

/** Invented monthly normals (January first) for the made-up town of Brindlewick. */
export const DEMO_NORMALS = {
  monthlyRainfallMm: [88, 71, 69, 62, 66, 58, 54, 67, 72, 96, 104, 97],
  monthlyTemperatureC: [4.1, 4.6, 7.0, 9.4, 12.9, 15.8, 18.2, 18.0, 15.3, 11.6, 7.4, 4.8],
};

/** An invented measured curve from the made-up Saltmarrow Quay gauge. */
export const DEMO_MEASURED_CURVE = [
  { pPercent: 1, rainRateMmH: 2.4 },
  { pPercent: 0.3, rainRateMmH: 5.6 },
  { pPercent: 0.1, rainRateMmH: 10.8 },
  { pPercent: 0.03, rainRateMmH: 20.5 },
  { pPercent: 0.01, rainRateMmH: 33.0 },
  { pPercent: 0.003, rainRateMmH: 51.0 },
  { pPercent: 0.001, rainRateMmH: 72.0 },
];

/**
 * Override profiles of each kind. `location` is the invented place the figures were measured or
 * made for, on the same invented island, near the demo sites that use them; the legacy zone has
 * none, so a study on it shows the "made for an unknown place" warning.
 */
export const DEMO_CLIMATES = [
  { key: 'normals', name: 'Brindlewick normals', kind: 'monthly-normals', data: DEMO_NORMALS, zeroIsothermKm: 2.85, sourceNote: 'Invented 30-year monthly normals for the demo town of Brindlewick', location: { latDeg: 49.11, lonDeg: -22.43 } },
  { key: 'curve', name: 'Saltmarrow Quay gauge', kind: 'measured-curve', data: { points: DEMO_MEASURED_CURVE }, zeroIsothermKm: 2.9, sourceNote: 'Invented tipping-bucket gauge record, demo data', location: { latDeg: 47.9, lonDeg: -20.74 } },
  { key: 'r001', name: 'Ottermere hills, known R0.01', kind: 'known-r001', data: { r001MmH: 36 }, zeroIsothermKm: 2.7, sourceNote: 'Invented value for the demo, as if read off the ITU-R P.837 map', location: { latDeg: 48.65, lonDeg: -21.8 } },
  { key: 'zone', name: 'Zone K (legacy)', kind: 'climate-zone', data: { zone: 'K' }, zeroIsothermKm: null, sourceNote: 'ITU-R P.837-1 zone chosen for the demo; no isotherm height, so the P.839-4 map value at each site applies', location: null },
] as const;

export const DEMO_CUSTOMERS = [
  { key: 'ottermere', name: 'Ottermere Lodge', email: 'bookings@ottermere-lodge.example', phone: '+00 1000 200 301', sites: [{ key: 'lodge', name: 'Lodge roof, north gable', address: '1 Lakeside Track, Lower Ottermere', latDeg: 48.612, lonDeg: -21.847, altitudeM: 212 }] },
  { key: 'brindlewick', name: 'Brindlewick Farm Cooperative', email: 'office@brindlewick-coop.example', phone: '+00 1000 200 302', sites: [
    { key: 'barn', name: 'Grain barn', address: 'Top Field Lane, Brindlewick', latDeg: 49.103, lonDeg: -22.416, altitudeM: 118 },
    { key: 'farmhouse', name: 'Farmhouse chimney breast', address: 'Brindlewick Farmhouse', latDeg: 49.1043, lonDeg: -22.4141, altitudeM: 121 },
  ] },
  { key: 'saltmarrow', name: 'Saltmarrow Boatyard', email: 'yard@saltmarrow.example', phone: '+00 1000 200 303', sites: [{ key: 'yard', name: 'Chandlery roof', address: 'The Hard, Saltmarrow Quay', latDeg: 47.905, lonDeg: -20.733, altitudeM: 6 }] },
  { key: 'fennick', name: 'Fennick & Daughters Garage', email: null, phone: '+00 1000 200 304', sites: [{ key: 'garage', name: 'Workshop wall', address: 'Old Turnpike, Fennick End', latDeg: 49.388, lonDeg: -21.162, altitudeM: 74 }] },
  { key: 'cobblestep', name: 'Cobblestep Village School', email: 'bursar@cobblestep-school.example', phone: null, sites: [{ key: 'school', name: 'Hall flat roof', address: 'School Lane, Cobblestep', latDeg: 49.702, lonDeg: -22.905, altitudeM: 165 }] },
] as const;

/**
 * The demo studies: customer site × service × climate, with the dishes (by name) they compare.
 * `climate: 'maps'` is the default source, the ITU-R maps at the site; the others are overrides.
 */
export const DEMO_STUDIES = [
  { title: 'Ottermere Lodge — TV upgrade', site: 'ottermere/lodge', service: 'corvid-tv', climate: 'r001', dishes: ['Quill 60', 'Quill 75', 'Quill 90', 'Quill 100', 'Quill 120'], target: 99.95 },
  { title: 'Brindlewick barn — two-way broadband', site: 'brindlewick/barn', service: 'halcyon-broadband', climate: 'normals', dishes: ['Quill 60', 'Quill 75', 'Quill 90', 'Quill 100', 'Quill 120', 'Quill 150', 'Quill 180'], target: 99.9 },
  { title: 'Brindlewick farmhouse — TV', site: 'brindlewick/farmhouse', service: 'corvid-tv', climate: 'normals', dishes: ['Quill 60', 'Quill 75', 'Quill 90'], target: 99.9 },
  { title: 'Saltmarrow Boatyard — TV at the quay', site: 'saltmarrow/yard', service: 'corvid-tv', climate: 'curve', dishes: ['Quill 60', 'Quill 75', 'Quill 90', 'Quill 100'], target: 99.95 },
  { title: 'Fennick garage — broadband backup', site: 'fennick/garage', service: 'halcyon-broadband', climate: 'zone', dishes: ['Quill 75', 'Quill 90', 'Quill 100', 'Quill 120', 'Quill 150'], target: 99.85 },
  { title: 'Cobblestep School — TV for the hall', site: 'cobblestep/school', service: 'corvid-tv', climate: 'maps', dishes: ['Quill 60', 'Quill 75', 'Quill 90', 'Quill 100', 'Quill 120', 'Quill 150', 'Quill 180'], target: 99.99 },
] as const;

/** Bramblecote Aerials' little world (to show that companies never see each other's rows). */
export const BRAMBLECOTE_DEMO = {
  customer: { name: 'Hollin Row Allotments', email: 'secretary@hollin-row.example' },
  site: { name: 'Tool shed', address: 'Hollin Row, Bramblecote', latDeg: 48.955, lonDeg: -20.288, altitudeM: 40 },
  service: { ...DEMO_SERVICES[0], name: 'Corvid TV (Bramblecote)' },
  climate: { name: 'Bramblecote known R0.01', kind: 'known-r001', data: { r001MmH: 30 }, zeroIsothermKm: 2.6, sourceNote: 'Invented for the demo', location: { latDeg: 48.96, lonDeg: -20.3 } },
  dishes: [
    ['Bramble 65', '0.65', '0.63', '85.00', '90.00', 'Wall bracket'],
    ['Bramble 85', '0.85', '0.65', '145.00', '120.00', 'Pole mount'],
  ],
  study: { title: 'Hollin Row allotments — shed TV', target: 99.9 },
} as const;
