import {
  displayUnit,
  fromCanonical,
  toCanonical,
  units,
  type QuantityKind,
  type UnitId,
  type UnitSystemId,
} from '@wickstone/calc-core';

/** Anything with a kind and an optional per-system display unit: a quantity input or an output. */
export interface Displayable {
  readonly kind: QuantityKind;
  readonly display?: Partial<Readonly<Record<UnitSystemId, UnitId>>>;
}

/** The unit a quantity is shown in: the definition's own choice for the system, else the system's default. */
export function unitFor(item: Displayable, system: UnitSystemId): UnitId {
  return item.display?.[system] ?? displayUnit(item.kind, system);
}

// Durations span seconds to weeks (wicking through a wall): shown in the largest unit that keeps
// the number at or above about two, so "3.2 h" rather than "11 520 s".
const TIME_STEPS: readonly (readonly [UnitId, number])[] = [
  ['day', 2 * 86400],
  ['h', 2 * 3600],
  ['min', 120],
];

/**
 * The unit an output value is shown in. Times with no unit of their own pick a readable one by
 * magnitude; everything else is `unitFor`.
 * @param canonicalValue the output in its canonical unit (seconds for a time)
 */
export function outputUnitFor(item: Displayable, system: UnitSystemId, canonicalValue: number): UnitId {
  if (item.kind === 'time' && item.display?.[system] === undefined) {
    const abs = Math.abs(canonicalValue);
    for (const [unit, from] of TIME_STEPS) if (abs >= from) return unit;
    return 's';
  }
  return unitFor(item, system);
}

/** The quantity a unit measures. */
export function unitKind(unit: UnitId): QuantityKind {
  return units[unit].kind;
}

/** The printed symbol of a unit (empty for a pure number). */
export function unitSymbol(unit: UnitId): string {
  return units[unit].symbol;
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

/** A value with its unit for reading: `12.5 mm`, `20 °C`, `35°`, `0.42`. */
export function withUnit(text: string, unit: UnitId): string {
  const symbol = unitSymbol(unit);
  if (symbol === '') return text;
  return symbol === '°' ? `${text}°` : `${text} ${symbol}`;
}
