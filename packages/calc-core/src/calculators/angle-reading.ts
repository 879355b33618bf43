import { acosDeg, ILL_CONDITIONED_BELOW_DEG, onePercentShift } from '../formulas/contact-angle.js';
import { fmt, q, warning } from './shared.js';
import type { Warning, WarningDefinition } from './types.js';

// A contact angle read back from its cosine, as the force and rise calculators do it.

/**
 * The angle of a cosine from a measurement, or null outside −1…1. A cosine past ±1 by no more than
 * rounding (1e-12) is the fully wetted or fully non-wetted case itself and reads as 0° or 180°.
 */
export function angleOf(cos: number): number | null {
  if (Math.abs(cos) > 1 + 1e-12) return null;
  return acosDeg(Math.max(-1, Math.min(1, cos)));
}

export const ANGLE_POORLY_DETERMINED: WarningDefinition = {
  code: 'ANGLE_POORLY_DETERMINED',
  summary: `An angle below ${ILL_CONDITIONED_BELOW_DEG}°, where a 1 % error in the measurement or the surface tension moves it by about 2° or more.`,
};

/**
 * The ANGLE_POORLY_DETERMINED warning for an angle below the threshold, else null.
 * @param measured what was measured, for the sentence ("force", "rise")
 */
export function poorlyDetermined(
  angleDeg: number,
  measured: string,
  fields: readonly string[],
  step: string,
): Warning | null {
  if (angleDeg >= ILL_CONDITIONED_BELOW_DEG) return null;
  return warning(
    ANGLE_POORLY_DETERMINED.code,
    `At ${q(angleDeg, 'deg')} the cosine is close to 1 and changes slowly with the angle: a 1 % error in the ${measured} or the surface tension moves the angle by ${fmt(onePercentShift(angleDeg), 2)}°. Report it as "below ${ILL_CONDITIONED_BELOW_DEG}°" unless both are known better than that.`,
    fields,
    { step },
  );
}
