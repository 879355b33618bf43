import { inputError } from './errors.js';

// Every formula checks its arguments here so that no function can hand back NaN or an infinity:
// the check names the argument, which is what a caller needs to fix the call.

/** Throws the argument's issue; its sentence starts with the argument's name. */
function fail(field: string, code: string, message: string): never {
  throw inputError(field, code, `${field} ${message}`);
}

/** Throws unless `value` is a finite number. */
export function finite(field: string, value: number): number {
  if (typeof value !== 'number' || Number.isNaN(value)) fail(field, 'NOT_A_NUMBER', 'must be a number');
  if (!Number.isFinite(value)) fail(field, 'NOT_FINITE', 'must be finite');
  return value;
}

/** Throws unless `value` is finite and greater than zero. */
export function positive(field: string, value: number): number {
  finite(field, value);
  if (value <= 0) fail(field, 'NOT_POSITIVE', 'must be greater than zero');
  return value;
}

/** Throws unless `value` is finite and not negative. */
export function nonNegative(field: string, value: number): number {
  finite(field, value);
  if (value < 0) fail(field, 'NEGATIVE', 'must not be negative');
  return value;
}

/** Throws unless `value` is greater than zero; `Infinity` is allowed (a flat direction). */
export function positiveOrInfinite(field: string, value: number): number {
  if (value === Infinity) return value;
  return positive(field, value);
}

/** Throws unless `value` is a contact angle in degrees, 0–180 inclusive. */
export function contactAngle(field: string, value: number): number {
  finite(field, value);
  if (value < 0 || value > 180) fail(field, 'ANGLE_OUT_OF_RANGE', 'must be between 0° and 180°');
  return value;
}

/**
 * Throws a RangeError if a computed result is not finite. Finite arguments can still overflow
 * (a bore of 1e-320 m), and a caller must never receive Infinity or NaN as an answer.
 */
export function finiteResult(what: string, value: number): number {
  if (!Number.isFinite(value)) throw new RangeError(`${what} is not a finite number for these arguments`);
  return value;
}

/**
 * cos θ for θ in degrees, exact at 0°, 90° and 180°: Math.cos(π/2) is 6e-17, which would turn a
 * zero rise into a tiny positive one and make a 90° angle look wetting.
 */
export function cosDeg(angleDeg: number): number {
  if (angleDeg === 90) return 0;
  if (angleDeg === 0) return 1;
  if (angleDeg === 180) return -1;
  return Math.cos((angleDeg * Math.PI) / 180);
}
