import { z } from 'zod';
import { checkboxField, idField, moneyField, numberIn, optionalText, requiredText } from './fields';

/** Reflector sizes we accept, m: from small DTH dishes to large earth-station antennas. */
export const DISH_DIAMETER_M = { min: 0.3, max: 13 } as const;
/** Aperture efficiency η as a fraction; real reflectors sit around 0.55–0.75 (common practice, no source). */
export const DISH_EFFICIENCY = { min: 0.2, max: 0.95 } as const;

export const dishFields = {
  name: requiredText('Name', 120),
  diameterM: numberIn('Diameter', DISH_DIAMETER_M.min, DISH_DIAMETER_M.max, 'm'),
  efficiency: numberIn('Efficiency', DISH_EFFICIENCY.min, DISH_EFFICIENCY.max),
  hardwarePrice: moneyField('Hardware price'),
  labourPrice: moneyField('Labour price'),
  mountNotes: optionalText('Mount notes', 1000),
};

/** A catalogue entry as the dish form posts it. */
export const dishSchema = z.object({ ...dishFields, active: checkboxField() });
export const dishUpdateSchema = dishSchema.extend({ id: idField('dish') });
export const dishIdSchema = z.object({ id: idField('dish') });
