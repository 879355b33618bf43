import { CalcInputError, SELF_CHECKS } from '../errors.js';
import { withUnit } from '../display.js';
import { formatValue } from '../format.js';
import { STANDARD_GRAVITY, type UnitId } from '../units.js';
import type { Caution, Condition, InputValues, Note, QuantityInput, Solution, Warning } from './types.js';

// Pieces every calculator shares: gravity, number formatting, the common warnings and cautions, and
// how a solve records its working (notes; the text is written in shared-working.ts and each
// calculator's `<id>.working.ts`, which only the full run carries). The liquid and contact-angle inputs are in
// shared-liquid.ts, so that only the calculators that take a liquid carry the liquids' data.

// ---------------------------------------------------------------- number formatting for working

/** Working and warnings print numbers with the one formatter people see everywhere (`format.ts`). */
export { formatValue as fmt } from '../format.js';

/** A number with its unit symbol, spaced by the one rule (`display.ts`): `0.07274 N/m`, `20 °C`, `0°`. */
export function q(value: number, unit: UnitId, digits = 4): string {
  return withUnit(formatValue(value, digits), unit);
}

/** A warning instance; `fields` are the input ids a form should highlight. */
export function warning(
  code: string,
  message: string,
  fields: readonly string[],
  extra: { readonly step?: string; readonly withholds?: readonly string[] } = {},
): Warning {
  return {
    code,
    message,
    fields,
    ...(extra.step !== undefined ? { step: extra.step } : {}),
    ...(extra.withholds !== undefined && extra.withholds.length > 0 ? { withholds: extra.withholds } : {}),
  };
}

// ---------------------------------------------------------------- reading resolved inputs

/** A resolved numeric input; throws if the definition and the solver disagree (a calc-core bug). */
export function num(inputs: InputValues, id: string): number {
  const v = inputs[id];
  if (SELF_CHECKS && typeof v !== 'number') throw new Error(`input ${id} is not a resolved number`);
  return v as number;
}

/** A resolved choice input. */
export function choice(inputs: InputValues, id: string): string {
  const v = inputs[id];
  if (SELF_CHECKS && typeof v !== 'string') throw new Error(`input ${id} is not a resolved choice`);
  return v as string;
}

// ---------------------------------------------------------------- input builders

/** The choice value of an input entered by hand (a liquid's properties, a contact angle). */
export const CUSTOM = 'custom';

/** Small lengths read best in millimetres and inches. */
export const MM = { si: 'mm', us: 'in' } as const;

/** A numeric input; bounds are the physical range the formulas are used over, canonical units. */
export function quantityInput(
  kind: QuantityInput['kind'],
  id: string,
  label: string,
  defaultValue: number,
  range: readonly [min: number, max: number],
  extra: Partial<Pick<QuantityInput, 'help' | 'appliesWhen' | 'display' | 'spread'>> = {},
): QuantityInput {
  return { id, label, kind, default: defaultValue, min: range[0], max: range[1], ...extra };
}

// ---------------------------------------------------------------- gravity

/** The gravity input, m/s², standard gravity by default. */
export function gravityInput(when?: readonly Condition[]): QuantityInput {
  return {
    id: 'gravity',
    label: 'Gravity',
    kind: 'acceleration',
    default: STANDARD_GRAVITY,
    min: 9.7,
    max: 9.9,
    help: 'Standard gravity 9.80665 m/s² unless the local value is known (about 9.78 at the equator to 9.83 at the poles).',
    ...(when !== undefined && when.length > 0 ? { appliesWhen: when } : {}),
  };
}

// ---------------------------------------------------------------- shared warnings, cautions, references

export const NEAR_90_DEG = 10;

/** The inputs that set a contact angle where a preset can stand in for it. */
export const ANGLE_FIELDS: readonly string[] = ['contactAngleDeg', 'contactAnglePreset'];

export const CONTACT_ANGLE_NEAR_90 = {
  code: 'CONTACT_ANGLE_NEAR_90',
  summary:
    'The contact angle is within 10° of 90°, where cos θ is small: a few degrees of error in the angle change the result by a large fraction.',
} as const;

/**
 * The CONTACT_ANGLE_NEAR_90 warning when an angle (degrees) is within 10° of 90°, else null.
 * The 10° is our threshold: at 80° a 2° error already changes cos θ by 20 %.
 */
export function nearNinety(angleDeg: number, fields: readonly string[] = ANGLE_FIELDS): Warning | null {
  if (Math.abs(angleDeg - 90) >= NEAR_90_DEG) return null;
  return warning(
    CONTACT_ANGLE_NEAR_90.code,
    `A contact angle of ${q(angleDeg, 'deg')} is close to 90°, where the result is proportional to a small cos θ (${formatValue(Math.cos((angleDeg * Math.PI) / 180))}); treat it as very uncertain.`,
    fields,
  );
}

/** Attached to a result whose liquid was entered by hand: its hazards are unknown to the table. */
export const OTHER_LIQUID_CAUTION: Caution = {
  code: 'OTHER_LIQUID_HAZARD',
  text: "The liquid's hazards are not known to this calculator: read its safety data sheet before handling it.",
};

/** Notes of one calculator's working, typed by its writers' data (`StepWriters`). */
export interface NoteTaker<N> {
  readonly list: Note[];
  add<K extends keyof N & string>(key: K, data: N[K]): void;
  /** A note that goes before every note added so far. */
  first<K extends keyof N & string>(key: K, data: N[K]): void;
}

/**
 * A solve's working, recorded as it goes as notes (a key and the numbers its step is written from):
 * the text is written from them by the calculator's `<id>.working.ts`, which only `calculate` runs.
 */
export function noteTaker<N>(): NoteTaker<N> {
  const list: Note[] = [];
  return {
    list,
    add: (key, data) => void list.push([key, data]),
    first: (key, data) => void list.unshift([key, data]),
  };
}

/** A solution with the liquid's hazard (if it has one) attached to the result's cautions. */
export function solved(
  parts: Omit<Solution, 'hazards'>,
  liquid?: { readonly hazard?: Caution } | null,
): Solution {
  return liquid?.hazard !== undefined ? { ...parts, hazards: [liquid.hazard] } : parts;
}

/**
 * Runs a formula whose argument names differ from the calculator's input ids, renaming the field of
 * any CalcInputError it throws so that the form marks the right input.
 */
export function withFieldNames<T>(names: Readonly<Record<string, string>>, compute: () => T): T {
  try {
    return compute();
  } catch (err) {
    if (err instanceof CalcInputError) {
      throw new CalcInputError(err.issues.map((i) => ({ ...i, field: names[i.field] ?? i.field })));
    }
    throw err;
  }
}
