import { z } from 'zod';
import { DVB_S2_MODCODS, findModcod } from '@/server/engine/dvb-s2-modcods';
import { checkboxField, coordinateField, idField, numberIn, optionalNumberIn, optionalText, requiredText } from './fields';

export const POLARIZATION_CHOICES = [
  { value: 'linear-horizontal', label: 'Linear, horizontal' },
  { value: 'linear-vertical', label: 'Linear, vertical' },
  { value: 'circular', label: 'Circular' },
] as const;

export const MODCOD_NAMES = DVB_S2_MODCODS.map((m) => m.name);

// ITU-R P.618-14 is valid from 1 to 55 GHz; the engine refuses anything else, so the form does too.
const FREQUENCY_GHZ = { min: 1, max: 55 } as const;

const modcodName = (label: string) =>
  z.preprocess(
    (v) => (typeof v === 'string' && v.trim() === '' ? null : v ?? null),
    z
      .string()
      .refine((s) => findModcod(s) !== undefined, `${label} must be a DVB-S2 MODCOD such as "QPSK 3/4".`)
      .nullable(),
  );

/** "QPSK 1/2, 8PSK 2/3" or an array → the names, each a DVB-S2 MODCOD; blank → null (fixed carrier). */
const acmSet = z.preprocess(
  (v) => {
    if (v === undefined || v === null) return null;
    if (typeof v === 'string') {
      const names = v.split(',').map((s) => s.trim()).filter((s) => s !== '');
      return names.length ? names : null;
    }
    return v;
  },
  z
    .array(z.string().refine((s) => findModcod(s) !== undefined, { error: (i) => `"${String(i.input)}" is not a DVB-S2 MODCOD.` }))
    .min(2, 'An ACM set needs at least two MODCODs.')
    .max(28)
    .refine((a) => new Set(a).size === a.length, 'List each MODCOD once.')
    .nullable(),
);

/**
 * A service profile as the form posts it (flat fields, so FormData works); the optional return
 * link is enabled by `uplinkEnabled` and comes out as one `uplink` object or null. A MODCOD fills
 * the required Es/N0 from the DVB-S2 table (ETSI EN 302 307-1) when no figure is typed.
 */
export const serviceProfileSchema = z
  .object({
    name: requiredText('Name', 120),
    satelliteName: requiredText('Satellite name', 120),
    satelliteLongitudeDeg: coordinateField('lon', 'Satellite longitude'),
    downlinkFrequencyGHz: numberIn('Downlink frequency', FREQUENCY_GHZ.min, FREQUENCY_GHZ.max, 'GHz'),
    polarization: z.enum(['linear-horizontal', 'linear-vertical', 'circular'], { error: 'Choose a polarization.' }),
    polarizationTiltDeg: z.preprocess((v) => (v === undefined || v === null || v === '' ? 0 : v), numberIn('Polarization tilt', -90, 90, '°')),
    eirpDbw: numberIn('EIRP', 0, 80, 'dBW'),
    symbolRateMsps: numberIn('Symbol rate', 0.05, 500, 'Msps'),
    modcod: modcodName('MODCOD'),
    requiredEsN0Db: optionalNumberIn('Required Es/N0', -5, 30, 'dB'),
    implementationMarginDb: z.preprocess((v) => (v === undefined || v === null || v === '' ? 0 : v), numberIn('Implementation margin', 0, 10, 'dB')),
    otherLossesDb: z.preprocess((v) => (v === undefined || v === null || v === '' ? 0 : v), numberIn('Other losses', 0, 10, 'dB')),
    lnbNoiseTempK: numberIn('LNB noise temperature', 5, 1000, 'K'),
    antennaNoiseTempK: numberIn('Antenna noise temperature', 5, 500, 'K'),
    acmModcods: acmSet,
    notes: optionalText('Notes', 2000),
    uplinkEnabled: checkboxField(),
    uplinkFrequencyGHz: optionalNumberIn('Uplink frequency', FREQUENCY_GHZ.min, FREQUENCY_GHZ.max, 'GHz'),
    uplinkTerminalEirpDbw: optionalNumberIn('Terminal EIRP', -10, 80, 'dBW'),
    uplinkHpaPowerW: optionalNumberIn('HPA power', 0.05, 500, 'W'),
    uplinkSatelliteGOverTDbK: optionalNumberIn('Satellite G/T', -30, 30, 'dB/K'),
    uplinkSymbolRateMsps: optionalNumberIn('Uplink symbol rate', 0.01, 500, 'Msps'),
    uplinkModcod: modcodName('Uplink MODCOD'),
    uplinkRequiredEsN0Db: optionalNumberIn('Uplink required Es/N0', -5, 30, 'dB'),
    uplinkImplementationMarginDb: optionalNumberIn('Uplink implementation margin', 0, 10, 'dB'),
  })
  .superRefine((v, ctx) => {
    if (v.requiredEsN0Db === undefined && !v.modcod) {
      ctx.addIssue({ code: 'custom', path: ['requiredEsN0Db'], message: 'Give the MODCOD or the required Es/N0.' });
    }
    if (!v.uplinkEnabled) return;
    const need: [keyof typeof v, string][] = [
      ['uplinkFrequencyGHz', 'Uplink frequency'],
      ['uplinkSatelliteGOverTDbK', 'Satellite G/T'],
      ['uplinkSymbolRateMsps', 'Uplink symbol rate'],
    ];
    for (const [key, label] of need) {
      if (v[key] === undefined) ctx.addIssue({ code: 'custom', path: [key], message: `${label} is required for a two-way service.` });
    }
    if ((v.uplinkTerminalEirpDbw === undefined) === (v.uplinkHpaPowerW === undefined)) {
      const message = 'Give either the terminal EIRP or the HPA power (the EIRP then follows each dish’s gain), not both.';
      ctx.addIssue({ code: 'custom', path: ['uplinkTerminalEirpDbw'], message });
      ctx.addIssue({ code: 'custom', path: ['uplinkHpaPowerW'], message });
    }
    if (v.uplinkRequiredEsN0Db === undefined && !v.uplinkModcod) {
      ctx.addIssue({ code: 'custom', path: ['uplinkRequiredEsN0Db'], message: 'Give the uplink MODCOD or its required Es/N0.' });
    }
  })
  .transform((v) => ({
    name: v.name,
    satelliteName: v.satelliteName,
    satelliteLongitudeDeg: v.satelliteLongitudeDeg,
    downlinkFrequencyGHz: v.downlinkFrequencyGHz,
    polarization: v.polarization,
    polarizationTiltDeg: v.polarization === 'circular' ? 0 : v.polarizationTiltDeg,
    eirpDbw: v.eirpDbw,
    symbolRateMsps: v.symbolRateMsps,
    modcod: v.modcod,
    requiredEsN0Db: v.requiredEsN0Db ?? findModcod(v.modcod as string)!.idealEsN0Db,
    implementationMarginDb: v.implementationMarginDb,
    otherLossesDb: v.otherLossesDb,
    lnbNoiseTempK: v.lnbNoiseTempK,
    antennaNoiseTempK: v.antennaNoiseTempK,
    acmModcods: v.acmModcods,
    notes: v.notes,
    uplink: v.uplinkEnabled
      ? {
          frequencyGHz: v.uplinkFrequencyGHz as number,
          ...(v.uplinkHpaPowerW !== undefined ? { hpaPowerW: v.uplinkHpaPowerW } : { terminalEirpDbw: v.uplinkTerminalEirpDbw as number }),
          satelliteGOverTDbK: v.uplinkSatelliteGOverTDbK as number,
          symbolRateMsps: v.uplinkSymbolRateMsps as number,
          requiredEsN0Db: v.uplinkRequiredEsN0Db ?? findModcod(v.uplinkModcod as string)!.idealEsN0Db,
          implementationMarginDb: v.uplinkImplementationMarginDb ?? 0,
        }
      : null,
  }));
export type ServiceProfileInput = z.infer<typeof serviceProfileSchema>;

export const serviceProfileUpdateSchema = z.intersection(z.object({ id: idField('service profile') }), serviceProfileSchema);
export const serviceProfileIdSchema = z.object({ id: idField('service profile') });
