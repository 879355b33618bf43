import { displayUnit, fromCanonical, toCanonical, units, type QuantityKind, type UnitId, type UnitSystemId } from '@wickstone/calc-core';

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

const SUPERSCRIPT = '⁰¹²³⁴⁵⁶⁷⁸⁹';

/**
 * A result figure for a person: `digits` significant figures, a true minus sign, powers of ten
 * outside 0.001–999 999 (written ×10ⁿ, as the working is), grouping never (a thin space reads as
 * two numbers in a narrow column).
 */
export function formatValue(value: number, digits = 4): string {
  if (!Number.isFinite(value)) return String(value);
  if (value === 0) return '0';
  const abs = Math.abs(value);
  const sign = value < 0 ? '−' : '';
  if (abs >= 1e-3 && abs < 1e6) return sign + String(Number(abs.toPrecision(digits)));
  const [mantissa = '', exponent = ''] = abs.toExponential(digits - 1).split('e');
  const power = Number(exponent);
  const sup = [...String(Math.abs(power))].map((c) => SUPERSCRIPT[Number(c)] ?? c).join('');
  return `${sign}${String(Number(mantissa))}×10${power < 0 ? '⁻' : ''}${sup}`;
}

/**
 * A number put into an input box: plain digits a person can edit (no ×10ⁿ, no unicode minus),
 * six significant figures so a converted default such as 1 mm → 0.0393701 in stays readable.
 */
export function formatInput(value: number): string {
  if (!Number.isFinite(value)) return '';
  const rounded = Number(value.toPrecision(6));
  const text = String(rounded);
  if (!/e/i.test(text)) return text;
  // Very small or large values: print without an exponent while that stays short enough to edit.
  const abs = Math.abs(rounded);
  if (abs >= 1e-9 && abs < 1e-6) return rounded.toFixed(5 - Math.floor(Math.log10(abs))).replace(/\.?0+$/, '');
  return text;
}

/**
 * What a person typed, as a number: trims, accepts one comma as the decimal mark when there is no
 * point (many visitors write 0,5), and a leading unicode minus. Empty → null; anything else
 * unreadable → NaN, which calc-core reports as "must be a number".
 */
export function parseNumber(text: string): number | null {
  let t = text.trim().replace(/^[−–]/, '-');
  if (t === '') return null;
  if (!t.includes('.') && /^-?\d*,\d+$/.test(t)) t = t.replace(',', '.');
  if (!/^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(t)) return Number.NaN;
  return Number(t);
}

/** A value with its unit for reading: `12.5 mm`, `20 °C`, `35°`, `0.42`. */
export function withUnit(text: string, unit: UnitId): string {
  const symbol = unitSymbol(unit);
  if (symbol === '') return text;
  return symbol === '°' ? `${text}°` : `${text} ${symbol}`;
}
