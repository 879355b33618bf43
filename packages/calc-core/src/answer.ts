// The answer as a person reads it: one headline sentence per calculator in the reader's unit
// system, warnings with a plain title and their sentence in the same units, and numbers written
// as an engineer writes them. One place for the widget, the dashboard, the sheet and the e-mail,
// so a result reads the same wherever it is shown. Pure and small: the widget bundles it.

import type { CalculationResult, CalculatorDefinition, HeadlineRule } from './calculators/types.js';
import { conditionsHold, withUnit } from './display.js';
import { formatInput, formatValue } from './format.js';
import {
  canonicalUnits,
  convert,
  displayUnit,
  type QuantityKind,
  type UnitId,
  type UnitSystemId,
} from './units.js';

// ---------------------------------------------------------------- numbers

/**
 * A result figure: `digits` significant figures (3 unless asked), a true minus sign, written out in
 * full (no ×10ⁿ) from 10⁻⁶ up to 10⁹, which every figure in a well-chosen unit falls within.
 */
export function formatResult(value: number, digits = 3): string {
  // NaN, ±Infinity and ±0 fail the range test and are written by formatValue (`NaN`, `0`).
  const rounded = Number(Math.abs(value).toPrecision(digits));
  if (rounded >= 1e-6 && rounded < 1e9) {
    // Enough decimals to keep `digits` significant figures, trailing zeros dropped.
    const decimals = Math.max(0, digits - 1 - Math.floor(Math.log10(rounded)));
    return (
      (value < 0 ? '−' : '') +
      rounded
        .toFixed(Math.min(decimals, 20))
        .replace(/(\.\d*?)0+$/, '$1')
        .replace(/\.$/, '')
    );
  }
  // Outside that range the one shared formatter writes the power of ten (×10ⁿ).
  return formatValue(value, digits);
}

/** Significant figures of a number as JavaScript prints it (0.15 → 2, 9.80665 → 6, 1000 → 1). */
export function significantFigures(value: number): number {
  if (!Number.isFinite(value) || value === 0) return 1;
  const digits = Number(Math.abs(value).toPrecision(15)).toExponential().split('e')[0]?.replace('.', '');
  return Math.max(1, (digits ?? '').length);
}

/**
 * How a default is written in the box after conversion into another unit. A round default stays
 * round in the new unit, as an engineer would write it (1 m → 3.3 ft, 0.15 m → 6 in, 0.1 mm →
 * 0.004 in): the fewest significant figures, one to three, within 2 % of the exact conversion
 * (our threshold). A default that is not round (standard gravity, 9.80665 m/s²) keeps six
 * figures, so nothing exact is blurred.
 * @param displayValue the default converted into the unit shown
 * @param canonicalDefault the default as defined, canonical units (its roundness decides)
 */
export function practicalDefault(displayValue: number, canonicalDefault: number): string {
  if (!Number.isFinite(displayValue)) return '';
  if (significantFigures(canonicalDefault) > 2) return formatInput(displayValue);
  for (let n = 1; n <= 3; n++) {
    const r = Number(displayValue.toPrecision(n));
    if (displayValue === 0 || Math.abs(r - displayValue) <= 0.02 * Math.abs(displayValue)) {
      return formatInput(r);
    }
  }
  return formatInput(displayValue);
}

// ---------------------------------------------------------------- units chosen for reading

/** The units a length reads in by size: below `from` (m) the small one, from it on the large one (1 ft = 0.3048 m). */
const READABLE_LENGTHS: Readonly<
  Record<UnitSystemId, readonly [small: UnitId, large: UnitId, from: number]>
> = {
  si: ['mm', 'm', 1],
  us: ['in', 'ft', 0.3048],
};

/**
 * The unit a quantity reads best in for a sentence: lengths by size (0.02 mm, 30 mm, 1.5 m;
 * 0.004 in, 6 in, 3.3 ft), everything else the system's unit for its kind.
 * @param canonicalValue the value in its kind's canonical unit (m for a length)
 */
export function readableUnit(kind: QuantityKind, system: UnitSystemId, canonicalValue: number): UnitId {
  if (kind !== 'length') return displayUnit(kind, system);
  const [small, large, from] = READABLE_LENGTHS[system];
  return Math.abs(canonicalValue) >= from ? large : small;
}

/**
 * Durations span seconds to weeks (wicking through a wall): read in the largest unit that keeps the
 * number at or above about two (`3.2 h` rather than `11 520 s`), seconds below two minutes. Each
 * step: the unit, the duration (s) from which it is used, its word in a sentence.
 */
export const DURATION_STEPS: readonly (readonly [unit: UnitId, from: number, word: string])[] = [
  ['day', 2 * 86400, 'days'],
  ['h', 2 * 3600, 'hours'],
  ['min', 120, 'minutes'],
];

/**
 * The units a value of a kind may be shown in besides its kind's canonical unit and the unit
 * systems' (lengths and durations by size, `readableUnit` and `DURATION_STEPS`): a bundle that
 * carries some units only must carry these for every kind it shows.
 */
export function unitsBySize(kind: QuantityKind): UnitId[] {
  if (kind === 'length') return Object.values(READABLE_LENGTHS).flatMap(([small, large]) => [small, large]);
  if (kind === 'time') return ['s', ...DURATION_STEPS.map(([unit]) => unit)];
  return [];
}

/** A canonical value with its unit for a sentence: `29.7 mm`, `1.17 in`, `0.5 m`. */
export function readable(
  canonicalValue: number,
  kind: QuantityKind,
  system: UnitSystemId,
  unit: UnitId = readableUnit(kind, system, canonicalValue),
): string {
  return withUnit(formatResult(convert(canonicalValue, canonicalUnitOf(kind), unit)), unit);
}

/** The canonical unit of a kind (factor 1, no offset): `m`, `N/m`, `°C`. */
export function canonicalUnitOf(kind: QuantityKind): UnitId {
  return canonicalUnits[kind] ?? '1';
}

// ---------------------------------------------------------------- the headline

/** The one sentence that answers the reader's question, and the output it states. */
export interface Headline {
  readonly text: string;
  /** The output the sentence states; null when no figure could be given. */
  readonly output: string | null;
  /** True when the main figure is withheld and the sentence says why. */
  readonly withheld: boolean;
}

type Result = Pick<CalculationResult, 'inputs' | 'outputs' | 'warnings'>;
type Def = Pick<CalculatorDefinition, 'inputs' | 'outputs' | 'warnings' | 'headline'>;

/** A value of one of the calculator's inputs or outputs, in the unit its definition shows it in; a time in words. */
function shown(def: Def, id: string, value: number, system: UnitSystemId): string {
  const item = [...def.outputs, ...def.inputs].find((x) => x.id === id);
  if (item === undefined || item.kind === 'choice' || item.kind === 'table') return formatResult(value);
  if (item.kind === 'time') return durationText(value);
  const unit = item.display?.[system];
  return readable(value, item.kind, system, unit ?? readableUnit(item.kind, system, value));
}

function durationText(seconds: number): string {
  for (const [unit, from, word] of DURATION_STEPS) {
    if (seconds >= from) return `${formatResult(convert(seconds, 's', unit))} ${word}`;
  }
  return `${formatResult(seconds)} ${seconds === 1 ? 'second' : 'seconds'}`;
}

/** The chosen liquid in words: `Water`, `Mercury`, or `The liquid` for one entered by hand. */
function liquidName(def: Def, r: Result): string {
  const id = r.inputs.liquid;
  const input = def.inputs.find((i) => i.id === 'liquid');
  const label =
    input?.kind === 'choice' && id !== 'custom'
      ? input.options.find((o) => o.value === id)?.label
      : undefined;
  return label ?? 'The liquid';
}

function fill(
  template: string,
  def: Def,
  r: Result,
  value: number,
  system: UnitSystemId,
  output: string,
): string {
  return template.replace(/\{(value|liquid|input\.(\w+))\}/g, (_, what: string, input?: string) => {
    if (what === 'liquid') return liquidName(def, r);
    if (input === undefined) return shown(def, output, Math.abs(value), system);
    const v = r.inputs[input];
    return typeof v === 'number' ? shown(def, input, v, system) : String(v);
  });
}

/**
 * The headline of a result: one plain sentence in the reader's unit system that answers the
 * calculator's question (its `headline` rules), or says why no figure is given (the general
 * statement of the warning that withholds it). A calculator without rules gets its first output
 * with a figure as a sentence, so one added later still has a headline.
 */
export function headline(def: Def, r: Result, system: UnitSystemId): Headline {
  const rules: readonly HeadlineRule[] =
    def.headline?.rules ?? def.outputs.map((o) => ({ output: o.id, text: `${o.label}: about {value}.` }));
  const applying = rules.filter(
    (rule) =>
      conditionsHold(rule.when, r.inputs) &&
      (rule.warning === undefined || r.warnings.some((w) => w.code === rule.warning)),
  );
  for (const rule of applying) {
    const value = r.outputs[rule.output];
    if (typeof value !== 'number') continue;
    const template = value <= 0 && rule.atOrBelow !== undefined ? rule.atOrBelow : rule.text;
    return { text: fill(template, def, r, value, system, rule.output), output: rule.output, withheld: false };
  }
  const first = applying[0]?.output ?? def.outputs[0]?.id;
  const w = r.warnings.find((x) => first !== undefined && (x.withholds ?? []).includes(first));
  const why = w === undefined ? undefined : def.warnings.find((d) => d.code === w.code)?.summary;
  const missing = def.headline?.missing ?? 'figure';
  return {
    text: `No ${missing} is given for these inputs.${why === undefined ? '' : ` ${why}`}`,
    output: null,
    withheld: true,
  };
}

/**
 * Outputs that back the headline up rather than answer the question (capillary length,
 * dimensionless ratios): shown folded under the working, and a firm may hide them.
 */
export function isSecondaryOutput(output: { readonly id: string; readonly kind: QuantityKind }): boolean {
  return output.kind === 'dimensionless' || output.id === 'capillaryLength';
}
