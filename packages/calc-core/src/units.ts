import { inputError } from './errors.js';
import { finite } from './guards.js';
import { aliases, canonicalUnits, units, unitSystems, type UnitId } from './unit-table.js';

export { STANDARD_GRAVITY } from './gravity.js';
export { canonicalUnits, units, unitSystems, type UnitId } from './unit-table.js';

/** The physical quantities that calculator inputs and outputs are measured in. */
export type QuantityKind =
  | 'length'
  | 'area'
  | 'volume'
  | 'force'
  | 'pressure'
  | 'surfaceTension'
  | 'density'
  | 'temperature'
  | 'angle'
  | 'viscosity'
  | 'time'
  | 'acceleration'
  | 'sorptivity'
  | 'evaporationRate'
  | 'volumePerLength'
  | 'flowPerLength'
  | 'mass'
  | 'arealMass'
  | 'absorptionCoefficient'
  | 'dimensionless';

export const quantityKinds: readonly QuantityKind[] = [
  'length',
  'area',
  'volume',
  'force',
  'pressure',
  'surfaceTension',
  'density',
  'temperature',
  'angle',
  'viscosity',
  'time',
  'acceleration',
  'sorptivity',
  'evaporationRate',
  'volumePerLength',
  'flowPerLength',
  'mass',
  'arealMass',
  'absorptionCoefficient',
  'dimensionless',
];

export interface UnitDefinition {
  readonly kind: QuantityKind;
  /** What to print after a number, e.g. `mN/m`, `°C`, `µm`. */
  readonly symbol: string;
  readonly name: string;
  /** canonical value = (value + offset) × factor. */
  readonly factor: number;
  readonly offset: number;
}

export type UnitSystemId = 'si' | 'us';

/**
 * Units of the centimetre–gram–second system that calc-core knows. Each equals an SI unit with a
 * power of ten (1 dyn/cm = 1 mN/m, 1 cP = 1 mPa·s, 1 g/cm³ = 1000 kg/m³; NIST SP 811 B.8); a
 * definition may offer one where its trade writes it, but no unit system shows them by default.
 */
export const cgsUnits: readonly UnitId[] = ['dyn', 'dyn/cm', 'cP', 'g/cm3'];

/** Each unit's definition with its id, made on first lookup: lookups hand out these shared, frozen objects. */
const withIds = new Map<UnitId, Readonly<UnitDefinition & { id: UnitId }>>();

/** The definition of a unit id or alias; throws CalcInputError (`UNKNOWN_UNIT`) for anything else. */
export function getUnit(id: string, field = 'unit'): Readonly<UnitDefinition & { id: UnitId }> {
  const key = (Object.hasOwn(units, id) ? id : aliases[id]) as UnitId | undefined;
  if (key === undefined || !Object.hasOwn(units, key)) {
    throw inputError(field, 'UNKNOWN_UNIT', `unknown unit "${id}"`);
  }
  let def = withIds.get(key);
  if (def === undefined) withIds.set(key, (def = Object.freeze({ ...units[key], id: key })));
  return def;
}

/** The display unit of a kind in a unit system. */
export function displayUnit(kind: QuantityKind, system: UnitSystemId): UnitId {
  return unitSystems[system][kind];
}

/**
 * A conversion from one unit to another of the same kind, with both units looked up once: for
 * converting many values (an export's column) without resolving the units again for each.
 * Throws CalcInputError `UNIT_KIND_MISMATCH` across kinds and `UNKNOWN_UNIT` for an unknown id;
 * the function it returns throws `NOT_A_NUMBER`/`NOT_FINITE` for a non-finite value.
 */
export function converter(fromUnit: string, toUnit: string): (value: number) => number {
  const from = getUnit(fromUnit, 'fromUnit');
  const to = getUnit(toUnit, 'toUnit');
  if (from.kind !== to.kind) {
    throw inputError(
      'toUnit',
      'UNIT_KIND_MISMATCH',
      `cannot convert ${from.kind} (${from.symbol}) to ${to.kind} (${to.symbol})`,
    );
  }
  if (from.id === to.id) return (value) => finite('value', value);
  return (value) => ((finite('value', value) + from.offset) * from.factor) / to.factor - to.offset;
}

/**
 * Converts `value` from one unit to another of the same kind (e.g. `convert(1, 'in', 'mm')` → 25.4).
 * Throws CalcInputError `UNIT_KIND_MISMATCH` across kinds, `UNKNOWN_UNIT` for an unknown id and
 * `NOT_A_NUMBER`/`NOT_FINITE` for a non-finite value.
 */
export function convert(value: number, fromUnit: string, toUnit: string): number {
  finite('value', value);
  return converter(fromUnit, toUnit)(value);
}

/** A value in a kind's canonical unit, from any unit of that kind. */
export function toCanonical(value: number, fromUnit: string): number {
  return convert(value, fromUnit, canonicalUnits[getUnit(fromUnit, 'fromUnit').kind]);
}

/** A canonical value of a unit's kind, expressed in that unit. */
export function fromCanonical(value: number, toUnit: string): number {
  finite('value', value);
  return fromCanonicalTo(toUnit)(value);
}

/** `fromCanonical` with the unit looked up once, for converting many values into it. */
export function fromCanonicalTo(toUnit: string): (value: number) => number {
  return converter(canonicalUnits[getUnit(toUnit, 'toUnit').kind], toUnit);
}
