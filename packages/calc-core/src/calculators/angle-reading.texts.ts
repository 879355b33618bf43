// The summary of the warning angle-reading.ts raises, for the texts of the calculators that read an
// angle back from its cosine (contact-angle-from-force, tension-from-rise): after first paint.
import { ILL_CONDITIONED_BELOW_DEG } from '../formulas/contact-angle.js';
import type { WarningDefinition } from './types.js';

export const ANGLE_POORLY_DETERMINED: WarningDefinition = {
  code: 'ANGLE_POORLY_DETERMINED',
  summary: `An angle below ${ILL_CONDITIONED_BELOW_DEG}°, where a 1 % error in the measurement or the surface tension moves it by about 2° or more.`,
};
