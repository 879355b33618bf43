import {
  fromCanonical,
  toCanonical,
  units,
  type QuantityKind,
  type UnitId,
  type UnitSystemId,
} from '@wickstone/calc-core';
import { DURATION_STEPS } from '@wickstone/calc-core/answer';
import { displayUnitOf, type Displayable } from '@wickstone/calc-core/display';

/**
 * The unit an output value is shown in. Times with no unit of their own pick a readable one by
 * magnitude (calc-core's `DURATION_STEPS`, as its headline does); everything else is calc-core's `displayUnitOf`.
 * @param canonicalValue the output in its canonical unit (seconds for a time)
 */
export function outputUnitFor(item: Displayable, system: UnitSystemId, canonicalValue: number): UnitId {
  if (item.kind === 'time' && item.display?.[system] === undefined) {
    const abs = Math.abs(canonicalValue);
    for (const [unit, from] of DURATION_STEPS) if (abs >= from) return unit;
    return 's';
  }
  return displayUnitOf(item, system);
}

/** The quantity a unit measures. */
export function unitKind(unit: UnitId): QuantityKind {
  return units[unit].kind;
}

/** A canonical value (SI, degrees, °C) expressed in `unit`. */
export function toDisplay(canonicalValue: number, unit: UnitId): number {
  return fromCanonical(canonicalValue, unit);
}

/** A value typed in `unit`, as the canonical value calc-core takes. */
export function fromDisplay(displayValue: number, unit: UnitId): number {
  return toCanonical(displayValue, unit);
}

export { formatValue, formatInput, parseNumber } from '@wickstone/calc-core/format';
export { displayUnitOf, unitGap, unitSymbol, withUnit } from '@wickstone/calc-core/display';
