import type { ChoiceInput, FieldIssue, QuantityInput, TableRow, UnitSystemId } from '@wickstone/calc-core';
import { practicalDefault } from '@wickstone/calc-core/answer';
import { inputApplies, optionsFor } from '@wickstone/calc-core/display';
import type { ResolvedInput } from './settings.js';
import { displayUnitOf, formatInput, fromDisplay, parseNumber, toDisplay, withUnit } from './units.js';

/**
 * One input as the form holds it. `value` is canonical and is what the text says: a round default
 * converted into another unit is shown rounded as an engineer writes it (1 m → 3.3 ft) and that
 * rounded value is what is sent, so the box, the headline and the stored run agree. A locked or
 * hidden value is the firm's, exact. null = empty, NaN = unreadable text. `fromDefault` marks a
 * value still at its default, re-derived from it on a unit switch.
 */
export interface FieldState {
  readonly text: string;
  /** A table input holds its rows (canonical units) here and no text. */
  readonly value: number | string | readonly TableRow[] | null;
  readonly fromDefault?: true;
}

/** A value the form sends: what a field holds, or a locked input's starting value. */
type FormValue = FieldState['value'];

export type FormState = Readonly<Record<string, FieldState>>;

function shown(value: ResolvedInput['initial'], input: ResolvedInput, system: UnitSystemId): string {
  if (typeof value === 'string') return value;
  if (typeof value === 'object') return '';
  return formatInput(toDisplay(value, displayUnitOf(input.def as QuantityInput, system)));
}

/** An input at its starting value in `system`: rounded practically when the visitor can edit it. */
function atDefault(input: ResolvedInput, system: UnitSystemId): FieldState {
  const value = input.initial;
  if (typeof value === 'string' || typeof value === 'object' || input.mode !== 'editable') {
    return { text: shown(value, input, system), value };
  }
  const unit = displayUnitOf(input.def as QuantityInput, system);
  const exact = toDisplay(value, unit);
  const text = practicalDefault(exact, value);
  // Not rounded (standard gravity keeps its figures): the exact default is sent, not the six-figure text.
  if (text === formatInput(exact)) return { text, value, fromDefault: true };
  const n = parseNumber(text);
  return { text, value: n === null || Number.isNaN(n) ? value : fromDisplay(n, unit), fromDefault: true };
}

/** Every input at its starting value, texts in the unit system's units, choices settled on offered options. */
export function initialForm(inputs: readonly ResolvedInput[], system: UnitSystemId): FormState {
  const state: Record<string, FieldState> = {};
  for (const input of inputs) state[input.def.id] = atDefault(input, system);
  return settleChoices(inputs, state);
}

/**
 * The options a choice offers now: those that go with the other choices (a preset for the liquid
 * chosen) and, when the firm limited them, only the firm's.
 */
export function offeredOptions(
  input: ResolvedInput,
  inputs: readonly ResolvedInput[],
  state: FormState,
): ChoiceInput['options'] {
  if (input.def.kind !== 'choice') return [];
  return optionsFor(input.def, effectiveValues(inputs, state), input.allowed);
}

/**
 * The form with every editable choice on an option it offers: after the liquid changes, a preset
 * for the old liquid gives way to the firm's default if offered, else to the first offered.
 */
export function settleChoices(inputs: readonly ResolvedInput[], state: FormState): FormState {
  let next: Record<string, FieldState> = { ...state };
  for (const input of inputs) {
    if (input.def.kind !== 'choice' || input.mode !== 'editable') continue;
    const offered = offeredOptions(input, inputs, next);
    const current = next[input.def.id]?.value;
    if (offered.length === 0 || offered.some((o) => o.value === current)) continue;
    const pick = offered.find((o) => o.value === input.initial) ?? offered[0];
    if (pick) next = { ...next, [input.def.id]: { text: pick.value, value: pick.value } };
  }
  return next;
}

/** What a visitor typed into a quantity box, read in the box's current unit. */
export function typed(input: ResolvedInput, text: string, system: UnitSystemId): FieldState {
  const n = parseNumber(text);
  if (n === null || Number.isNaN(n)) return { text, value: n };
  return { text, value: fromDisplay(n, displayUnitOf(input.def as QuantityInput, system)) };
}

/** The form after a unit switch: every readable number re-shown in the new units; unreadable text kept as typed. */
export function reformat(
  state: FormState,
  inputs: readonly ResolvedInput[],
  system: UnitSystemId,
): FormState {
  const next: Record<string, FieldState> = { ...state };
  for (const input of inputs) {
    const f = state[input.def.id];
    if (f === undefined || typeof f.value !== 'number' || Number.isNaN(f.value)) continue;
    next[input.def.id] =
      f.fromDefault === true
        ? atDefault(input, system)
        : { text: shown(f.value, input, system), value: f.value };
  }
  return next;
}

/** The value each input takes now: what the form holds, except that locked and hidden inputs keep the firm's. */
export function effectiveValues(
  inputs: readonly ResolvedInput[],
  state: FormState,
): Record<string, FormValue> {
  const out: Record<string, FormValue> = {};
  for (const input of inputs)
    out[input.def.id] = input.mode === 'editable' ? (state[input.def.id]?.value ?? null) : input.initial;
  return out;
}

/** The inputs that take part now, in the calculator's order (calc-core's rule, so the form shows exactly the inputs `calculate` uses). */
export function applicable(inputs: readonly ResolvedInput[], state: FormState): ResolvedInput[] {
  const defs = inputs.map((i) => i.def);
  const values = effectiveValues(inputs, state);
  return inputs.filter((i) => inputApplies(i.def, defs, values));
}

/**
 * The raw inputs handed to calc-core's `run`: every input that takes part. Locked and hidden
 * inputs always send their starting value, whatever the form holds.
 */
export function collectInputs(inputs: readonly ResolvedInput[], state: FormState): Record<string, FormValue> {
  const values = effectiveValues(inputs, state);
  const out: Record<string, FormValue> = {};
  for (const input of applicable(inputs, state)) out[input.def.id] = values[input.def.id] ?? null;
  return out;
}

/**
 * A field problem from calc-core, worded for the form. Range messages are re-stated in the unit the
 * visitor sees (calc-core states them in SI, which reads wrongly beside a box in inches).
 */
export function issueMessage(
  issue: FieldIssue,
  input: ResolvedInput | undefined,
  system: UnitSystemId,
): string {
  if (input === undefined || input.def.kind === 'choice' || input.def.kind === 'table') return issue.message;
  if (issue.code === 'REQUIRED') return 'Enter a value';
  if (issue.code === 'NOT_A_NUMBER' || issue.code === 'NOT_FINITE') return 'Enter a number, such as 0.5';
  if (issue.code !== 'BELOW_MIN' && issue.code !== 'ABOVE_MAX') return issue.message;
  const def = input.def;
  const unit = displayUnitOf(def, system);
  const edge = (v: number): string => withUnit(formatInput(toDisplay(v, unit)), unit);
  return `Use a value from ${edge(def.min)} to ${edge(def.max)}`;
}
