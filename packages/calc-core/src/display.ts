// How a quantity is put in front of a person, written once for the engine, the widget, the
// dashboard and the server: which inputs take part, which unit a value is shown in, and how a
// number and its unit symbol are joined. Pure and small: the widget bundles it.

import type {
  ChoiceInput,
  ChoiceOption,
  Condition,
  InputDefinition,
  OutputDefinition,
  Reference,
} from './calculators/types.js';
import { displayUnit, units, type QuantityKind, type UnitId, type UnitSystemId } from './units.js';

/** Anything with a kind and an optional per-system display unit: a quantity input or an output. */
export interface Displayable {
  readonly kind: QuantityKind;
  readonly display?: Partial<Readonly<Record<UnitSystemId, UnitId>>>;
}

/** The unit a quantity is shown in: the definition's own choice for the system, else the system's unit for its kind. */
export function displayUnitOf(item: Displayable, system: UnitSystemId): UnitId {
  return item.display?.[system] ?? displayUnit(item.kind, system);
}

/**
 * What stands between a number and a unit's symbol. SI Brochure (BIPM, 9th ed., 2019) §5.4.3 and
 * NIST SP 811 (2008) §7.2: a space always separates the number from the unit, `20 °C` included;
 * the one exception is the degree, minute and second of a plane angle, written against the number
 * (`35°`). A pure number has no symbol and so nothing after it.
 */
export function unitGap(unit: UnitId): '' | ' ' {
  const def = units[unit];
  return def.symbol === '' || (def.kind === 'angle' && def.symbol === '°') ? '' : ' ';
}

/** The printed symbol of a unit (`mN/m`, `°C`, `kg/m³`; empty for a pure number). */
export function unitSymbol(unit: UnitId): string {
  return units[unit].symbol;
}

/**
 * A formatted number with its unit for reading: `12.5 mm`, `20 °C`, `35°`, `998.2 kg/m³`, `0.42`.
 * @param text the number as already formatted (`formatValue`, `formatInput` or a range bound)
 */
export function withUnit(text: string, unit: UnitId): string {
  return text + unitGap(unit) + unitSymbol(unit);
}

/**
 * Whether an input takes part given the current choice values: every `appliesWhen` condition holds
 * and the input it depends on takes part itself. A chain deeper than eight (only a definition
 * that refers to itself) never applies.
 * @param inputs the calculator's inputs, where the conditions' parents are looked up
 * @param choices current values keyed by input id; only strings match a condition
 */
export function inputApplies(
  input: InputDefinition,
  inputs: readonly InputDefinition[],
  choices: Readonly<Record<string, unknown>>,
  depth = 0,
): boolean {
  if (depth >= 8) return false;
  return (input.appliesWhen ?? []).every((cond) => {
    const parent = inputs.find((i) => i.id === cond.input);
    return parent !== undefined && holds(cond, choices) && inputApplies(parent, inputs, choices, depth + 1);
  });
}

/** Whether one condition holds: its input's value is a string among the condition's values. */
function holds(cond: Condition, values: Readonly<Record<string, unknown>>): boolean {
  const value = Object.hasOwn(values, cond.input) ? values[cond.input] : undefined;
  return typeof value === 'string' && cond.values.includes(value);
}

/** Whether every condition holds for these values (only strings match a condition). */
export function conditionsHold(
  conditions: readonly Condition[] | undefined,
  values: Readonly<Record<string, unknown>>,
): boolean {
  return (conditions ?? []).every((cond) => holds(cond, values));
}

/**
 * The options of a choice offered for the current values: those whose conditions hold (a preset
 * for another liquid is left out), then, when `allowed` is given (a firm's list), only those in it.
 * @param values current values keyed by input id
 */
export function optionsFor(
  input: ChoiceInput,
  values: Readonly<Record<string, unknown>>,
  allowed?: readonly string[],
): ChoiceOption[] {
  return input.options.filter(
    (o) => conditionsHold(o.appliesWhen, values) && (allowed === undefined || allowed.includes(o.value)),
  );
}

/** The references that bear on a result: those whose conditions hold for the inputs it used. */
export function referencesFor(
  references: readonly Reference[],
  inputs: Readonly<Record<string, unknown>>,
): Reference[] {
  return references.filter((r) => conditionsHold(r.appliesWhen, inputs));
}

/** An output's help line for its value: the sign-dependent help when it has one, else its fixed help. */
export function outputHelp(output: OutputDefinition, value: number | null): string | undefined {
  if (output.helpBySign !== undefined && value !== null) {
    return value > 0 ? output.helpBySign.above : output.helpBySign.atOrBelow;
  }
  return output.help;
}
