import { z } from 'zod';
import { optionalNumberIn, optionalText } from './fields';
import { profileLocationFields, requireBothCoordinates } from './climate';

/** A file from a form (a File/Blob in the browser and in Node's FormData). */
const fileField = z.custom<File>(
  (v) => typeof v === 'object' && v !== null && typeof (v as Blob).arrayBuffer === 'function' && (v as Blob).size > 0,
  { error: 'Choose a CSV file.' },
);

const uploadKindField = z.enum(['dish-catalogue', 'rain-curve', 'climate-normals'], { error: 'Choose what the file holds.' });

/** Preview: the file and what it holds; nothing else is needed and nothing is saved. */
export const cataloguePreviewSchema = z.object({ kind: z.literal('dish-catalogue').default('dish-catalogue'), file: fileField });
export const climatePreviewSchema = z.object({ kind: z.enum(['rain-curve', 'climate-normals'], { error: 'Choose a measured curve or monthly normals.' }), file: fileField });

/**
 * Confirm: the same file again (it is parsed again on the server: a preview is never trusted),
 * plus, for climate files, the profile's name, its source, an optional 0 °C isotherm height and
 * the optional place the figures were measured for.
 */
export const uploadConfirmSchema = z
  .object({
    kind: uploadKindField,
    file: fileField,
    name: optionalText('Profile name', 120),
    sourceNote: optionalText('Source', 500),
    zeroIsothermKm: optionalNumberIn('0 °C isotherm height', 0, 8, 'km'),
    ...profileLocationFields,
  })
  .superRefine((v, ctx) => {
    if (v.kind === 'dish-catalogue') return;
    requireBothCoordinates(v, ctx);
    if (!v.name) ctx.addIssue({ code: 'custom', path: ['name'], message: 'Name the climate profile.' });
    if (!v.sourceNote) ctx.addIssue({ code: 'custom', path: ['sourceNote'], message: 'Say where the figures come from (weather service, station, years).' });
  });
export type UploadConfirmInput = z.infer<typeof uploadConfirmSchema>;

export const catalogueConfirmSchema = z.object({ kind: z.literal('dish-catalogue').default('dish-catalogue'), file: fileField });
export const climateConfirmSchema = uploadConfirmSchema.refine((v) => v.kind !== 'dish-catalogue', { path: ['kind'], message: 'Choose a measured curve or monthly normals.' });
