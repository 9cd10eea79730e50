import { z } from 'zod';
import { CLIMATE_ZONES } from '@/server/engine/p837-1-climate-zones';
import { idField, numberIn, optionalCoordinateField, optionalNumberIn, requiredText } from './fields';

/** How each climate source reads on screen; 'itu-r-maps' is the default (no profile), the rest are profile kinds. */
export const CLIMATE_KIND_LABELS = {
  'itu-r-maps': 'ITU-R digital maps at the site (P.837-7, P.839-4, P.1510-1)',
  'monthly-normals': 'Monthly normals (ITU-R P.837-7 Annex 1)',
  'measured-curve': 'Measured exceedance curve',
  'known-r001': 'Known R0.01',
  'climate-zone': 'Climate zone (ITU-R P.837-1)',
} as const;

const twelve = (label: string, min: number, max: number, unit: string) =>
  z
    .array(numberIn(label, min, max, unit), { error: `${label}: 12 monthly values are required.` })
    .length(12, `${label}: exactly 12 monthly values (January to December) are required.`);

/** Monthly mean total rainfall MT (mm) and mean surface temperature T (°C), January first. */
const monthlyNormalsDataSchema = z.object({
  monthlyRainfallMm: twelve('Monthly rainfall', 0, 3000, 'mm'),
  monthlyTemperatureC: twelve('Monthly temperature', -70, 50, '°C'),
});

const measuredPointSchema = z.object({
  pPercent: z.number().gt(0, 'p must be above 0 %.').lte(100, 'p must be at most 100 %.'),
  rainRateMmH: z.number().gt(0, 'The rain rate must be above 0 mm/h.').lte(1000, 'The rain rate must be at most 1000 mm/h.'),
});

/**
 * A measured exceedance curve: p (% of the year) against the rain rate exceeded. A real curve
 * falls: the rarer the percentage, the heavier the rain. Checked here so a bad upload is refused
 * with a line number before anything reaches the engine.
 */
export const measuredCurveDataSchema = z.object({
  points: z
    .array(measuredPointSchema)
    .min(2, 'A measured curve needs at least 2 points.')
    .max(200, 'A measured curve has at most 200 points.')
    .superRefine((points, ctx) => {
      const sorted = points.map((p, i) => ({ ...p, i })).sort((a, b) => b.pPercent - a.pPercent);
      for (let k = 1; k < sorted.length; k++) {
        const prev = sorted[k - 1];
        const cur = sorted[k];
        if (cur.pPercent === prev.pPercent) {
          ctx.addIssue({ code: 'custom', path: [cur.i, 'pPercent'], message: `p = ${cur.pPercent} % appears twice.` });
        } else if (cur.rainRateMmH < prev.rainRateMmH) {
          ctx.addIssue({
            code: 'custom',
            path: [cur.i, 'rainRateMmH'],
            message: `The rain rate must not fall as p gets smaller: ${cur.rainRateMmH} mm/h at ${cur.pPercent} % is below ${prev.rainRateMmH} mm/h at ${prev.pPercent} %.`,
          });
        }
      }
    }),
});

const knownR001DataSchema = z.object({ r001MmH: numberIn('R0.01', 0, 300, 'mm/h') });

const climateZoneDataSchema = z.object({
  zone: z.preprocess(
    (v) => (typeof v === 'string' ? v.trim().toUpperCase() : v),
    z.enum(CLIMATE_ZONES as unknown as [string, ...string[]], { error: 'Choose an ITU-R P.837-1 zone (A–H, J–N, P, Q).' }),
  ),
});

/**
 * The place a profile's figures were measured or made for (decimal or DMS, like a site): both or
 * neither. A study warns when its override profile was made far from the site or for no known place.
 */
export const profileLocationFields = {
  latDeg: optionalCoordinateField('lat'),
  lonDeg: optionalCoordinateField('lon'),
};

/** Refuses a location with only one of its two coordinates, naming the missing box. */
export function requireBothCoordinates(v: { latDeg?: number; lonDeg?: number }, ctx: z.RefinementCtx): void {
  if (v.latDeg !== undefined && v.lonDeg === undefined) ctx.addIssue({ code: 'custom', path: ['lonDeg'], message: 'Give the longitude too, or leave both blank.' });
  if (v.lonDeg !== undefined && v.latDeg === undefined) ctx.addIssue({ code: 'custom', path: ['latDeg'], message: 'Give the latitude too, or leave both blank.' });
}

const profileFields = {
  name: requiredText('Name', 120),
  // ITU-R P.839-4 h0 above mean sea level; blank → the P.839-4 map value at each study's site.
  zeroIsothermKm: optionalNumberIn('0 °C isotherm height', 0, 8, 'km'),
  sourceNote: requiredText('Source', 500),
  ...profileLocationFields,
};

/** A climate profile with its data, as the API, the seed and the form (known R0.01 / zone) give it. */
export const climateProfileSchema = z
  .discriminatedUnion('kind', [
    z.object({ kind: z.literal('monthly-normals'), ...profileFields, data: monthlyNormalsDataSchema }),
    z.object({ kind: z.literal('measured-curve'), ...profileFields, data: measuredCurveDataSchema }),
    z.object({ kind: z.literal('known-r001'), ...profileFields, data: knownR001DataSchema }),
    z.object({ kind: z.literal('climate-zone'), ...profileFields, data: climateZoneDataSchema }),
  ])
  .superRefine(requireBothCoordinates);
export type ClimateProfileInput = z.infer<typeof climateProfileSchema>;

/**
 * The climate form (flat fields): known R0.01 or a zone typed in; monthly normals and measured
 * curves come in as CSV uploads (server/uploads). Output has the same shape as climateProfileSchema.
 */
export const climateFormSchema = z
  .object({
    ...profileFields,
    kind: z.enum(['known-r001', 'climate-zone'], { error: 'Choose known R0.01 or a climate zone (normals and curves are uploaded as CSV).' }),
    r001MmH: optionalNumberIn('R0.01', 0, 300, 'mm/h'),
    zone: z.string().optional(),
  })
  .superRefine(requireBothCoordinates)
  .transform((v, ctx) => {
    const base = { name: v.name, zeroIsothermKm: v.zeroIsothermKm, sourceNote: v.sourceNote, latDeg: v.latDeg, lonDeg: v.lonDeg };
    if (v.kind === 'known-r001') {
      if (v.r001MmH === undefined) {
        ctx.addIssue({ code: 'custom', path: ['r001MmH'], message: 'R0.01 is required.' });
        return z.NEVER;
      }
      return { ...base, kind: 'known-r001' as const, data: { r001MmH: v.r001MmH } };
    }
    const zone = climateZoneDataSchema.safeParse({ zone: v.zone });
    if (!zone.success) {
      ctx.addIssue({ code: 'custom', path: ['zone'], message: zone.error.issues[0].message });
      return z.NEVER;
    }
    return { ...base, kind: 'climate-zone' as const, data: zone.data };
  });

export const climateProfileIdSchema = z.object({ id: idField('climate profile') });
