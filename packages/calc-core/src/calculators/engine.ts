import { CalcInputError, inputError, SELF_CHECKS, type FieldIssue } from '../errors.js';
import { inputApplies } from '../display.js';
import { canonicalUnits } from '../units.js';
import { VERSION } from '../version.js';
import type {
  Band,
  CalculationResult,
  BandBasis,
  CalculatorCore,
  CalculatorTexts,
  Caution,
  ComputedResult,
  InputDefinition,
  InputValue,
  InputValues,
  Outputs,
  QuantityInput,
  Solution,
} from './types.js';
import { q } from './shared.js';

function isPlainObject(value: unknown): value is Readonly<Record<string, unknown>> {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) return false;
  const proto: unknown = Object.getPrototypeOf(value);
  return proto === Object.prototype || proto === null;
}

function rangeText(input: QuantityInput): string {
  const unit = canonicalUnits[input.kind];
  return `from ${q(input.min, unit, 6)} to ${q(input.max, unit, 6)}`;
}

/**
 * Checks raw inputs against a definition and fills defaults. Choice inputs are resolved first
 * because they decide which other inputs apply.
 * @returns the resolved inputs, in the definition's order, only those that apply
 * @throws CalcInputError listing every bad field at once
 */
export function resolveInputs(def: CalculatorCore, raw: unknown): InputValues {
  // The caller's side of the contract, an object keyed by the definition's input ids: checked where
  // inputs come from outside (the server's API), a self-check in the widget, whose form builds them
  // from the definition (SELF_CHECKS).
  if (SELF_CHECKS && !isPlainObject(raw)) {
    throw inputError('inputs', 'NOT_AN_OBJECT', 'inputs must be an object keyed by input id');
  }
  const sent = raw as Readonly<Record<string, unknown>>;
  const issues: FieldIssue[] = [];
  const add = (field: string, code: string, message: string): void =>
    void issues.push({ field, code, message });
  /** What was sent for an input, else its default. */
  const given = (input: InputDefinition): unknown =>
    sent[input.id] === undefined ? input.default : sent[input.id];
  if (SELF_CHECKS) {
    const known = new Set(def.inputs.map((i) => i.id));
    for (const key of Object.keys(sent)) {
      if (!known.has(key)) add(key, 'UNKNOWN_INPUT', `${def.id} has no input "${key}"`);
    }
  }

  const choices = new Map<string, string>();
  const badChoices = new Set<string>();
  for (const input of def.inputs) {
    if (input.kind !== 'choice') continue;
    const value = given(input);
    if (typeof value === 'string' && input.options.some((o) => o.value === value))
      choices.set(input.id, value);
    else badChoices.add(input.id);
  }

  const chosen = Object.fromEntries(choices);
  const applies = (input: InputDefinition): boolean => inputApplies(input, def.inputs, chosen);

  const resolved: Record<string, InputValue> = {};
  for (const input of def.inputs) {
    if (!applies(input)) continue;
    if (input.kind === 'choice') {
      const value = choices.get(input.id);
      if (value !== undefined) resolved[input.id] = value;
      // A bad value only matters for a choice that applies, as with numbers.
      if (badChoices.has(input.id))
        add(
          input.id,
          'NOT_AN_OPTION',
          `${input.label} must be one of: ${input.options.map((o) => o.value).join(', ')}`,
        );
      continue;
    }
    if (input.kind === 'table') {
      const value = given(input);
      if (SELF_CHECKS && def.checkTable === undefined)
        throw new Error(`${def.id}: table input ${input.id} needs checkTable`);
      const found = (def.checkTable as NonNullable<CalculatorCore['checkTable']>)(input, value);
      if (found.length > 0) issues.push(...found);
      // Checked: an array of plain objects holding a number in every column. Copied in column order.
      else
        resolved[input.id] = (value as readonly Readonly<Record<string, number>>[]).map((row) =>
          Object.fromEntries(input.columns.map((c) => [c.id, row[c.id] as number])),
        );
      continue;
    }
    const value = given(input);
    const fail = (code: string, message: string): void => add(input.id, code, `${input.label} ${message}`);
    if (value === null) fail('REQUIRED', 'needs a value');
    else if (typeof value !== 'number' || Number.isNaN(value)) fail('NOT_A_NUMBER', 'must be a number');
    else if (!Number.isFinite(value)) fail('NOT_FINITE', 'must be finite');
    else if (value < input.min || value > input.max) {
      fail(value > input.max ? 'ABOVE_MAX' : 'BELOW_MIN', `must be ${rangeText(input)}`);
    } else resolved[input.id] = value;
  }
  if (issues.length > 0) throw new CalcInputError(issues);
  return resolved;
}

/** Checks a solution's numbers and warnings against its definition (a warning's step: `runCalculation`). */
function checkSolution(def: CalculatorCore, solution: Solution): void {
  // A definition that breaks its own contract is a bug in calc-core, not a bad input: plain Error.
  const { outputs, warnings } = solution;
  for (const out of def.outputs) {
    const v = outputs[out.id];
    if (v === undefined || (v !== null && !Number.isFinite(v))) {
      throw new Error(`${def.id}: output ${out.id} is ${String(v)}`);
    }
  }
  const declared = new Set(def.warnings.map((w) => w.code));
  for (const w of warnings) {
    if (!declared.has(w.code)) throw new Error(`${def.id}: warning ${w.code} is not declared`);
    // A withheld output is null: never a figure beside the warning that says it does not hold.
    for (const id of w.withholds ?? []) {
      if (outputs[id] !== null) throw new Error(`${def.id}: ${w.code} withholds ${id} but it has a value`);
    }
  }
}

export function cautionsOf(def: Partial<CalculatorTexts>, solution: Solution): Caution[] {
  return [...(solution.hazards ?? []), ...(def.cautions ?? [])];
}

/** Solves resolved inputs and checks the solution; a RangeError from a formula is the visitor's input, not a bug. */
export function solveChecked(def: CalculatorCore, inputs: InputValues): Solution {
  let solution;
  try {
    solution = def.solve(inputs);
  } catch (err) {
    if (err instanceof RangeError) throw inputError('inputs', 'OUT_OF_RANGE', err.message);
    throw err;
  }
  if (SELF_CHECKS) checkSolution(def, solution);
  return solution;
}

/**
 * Runs one calculator for its numbers only: validates, solves and checks as `runCalculation` does,
 * but never writes the working or assumptions from the solution's notes (that text is in the
 * calculator's texts, `<id>.working.ts`) and hashes nothing. Its outputs, warnings and band are
 * those `runCalculation` gives for the same inputs; a widget shows them at once and asks for the
 * working when it shows it.
 * @param raw inputs keyed by input id, canonical units (SI, angles in degrees, temperatures in °C)
 * @throws CalcInputError listing every bad field
 */
export function computeCalculation(
  def: CalculatorCore & Partial<CalculatorTexts>,
  raw: unknown,
): ComputedResult {
  const inputs = resolveInputs(def, raw);
  const solution = solveChecked(def, inputs);
  return {
    calculator: def.id,
    inputs,
    outputs: solution.outputs,
    warnings: solution.warnings,
    band: solution.band,
    cautions: cautionsOf(def, solution),
    version: VERSION,
  };
}

/** `computeCalculation` bound to one definition: the `compute` each calculator subpath exports. */
export function computer(
  def: CalculatorCore & Partial<CalculatorTexts>,
): (inputs: unknown) => ComputedResult {
  return (inputs) => computeCalculation(def, inputs);
}

/**
 * The range of every output over all corners of the spread inputs (2ⁿ evaluations, n ≤ 3 here),
 * nominal included. Exact for outputs monotonic in each spread input, which all of ours are.
 * @returns null when no input has a spread
 */
export function bandOver(
  basis: readonly BandBasis[],
  nominal: Outputs,
  evaluate: (values: Readonly<Record<string, number>>) => Outputs,
): Band | null {
  if (basis.length === 0) return null;
  const ranges: Record<string, { low: number; high: number }> = {};
  // Only outputs that have a value at the nominal inputs get a band: a withheld output gets none.
  const take = (outputs: Outputs): void => {
    for (const [id, v] of Object.entries(outputs)) {
      if (v === null || v === undefined || typeof nominal[id] !== 'number') continue;
      const r = ranges[id];
      if (r === undefined) ranges[id] = { low: v, high: v };
      else {
        r.low = Math.min(r.low, v);
        r.high = Math.max(r.high, v);
      }
    }
  };
  take(nominal);
  for (let mask = 0; mask < 1 << basis.length; mask++) {
    const values: Record<string, number> = {};
    basis.forEach((b, i) => {
      values[b.input] = mask & (1 << i) ? b.high : b.low;
    });
    take(evaluate(values));
  }
  return { basis, outputs: ranges };
}

function close(a: number, b: number, tol: number): boolean {
  return a === b || Math.abs(a - b) <= tol * Math.max(Math.abs(a), Math.abs(b));
}

/**
 * Whether two results of the same run agree: same calculator, version, inputs hash and warning
 * codes, and every output and band edge within a relative tolerance. Exact equality is not the
 * test because Math.exp, Math.pow and Math.cos may differ in the last bit between JavaScript
 * engines (the language leaves them implementation-approximated).
 * @param relativeTolerance dimensionless; 1e-9 by default
 */
export function resultsAgree(a: CalculationResult, b: CalculationResult, relativeTolerance = 1e-9): boolean {
  if (a.calculator !== b.calculator || a.version !== b.version || a.inputHash !== b.inputHash) return false;
  const codes = (r: CalculationResult): string => r.warnings.map((w) => w.code).join(',');
  if (codes(a) !== codes(b)) return false;
  const keys = new Set([...Object.keys(a.outputs), ...Object.keys(b.outputs)]);
  for (const k of keys) {
    const x = a.outputs[k];
    const y = b.outputs[k];
    if (x === undefined || y === undefined) return false;
    if (x === null || y === null ? x !== y : !close(x, y, relativeTolerance)) return false;
  }
  if ((a.band === null) !== (b.band === null)) return false;
  if (a.band !== null && b.band !== null) {
    const bandKeys = new Set([...Object.keys(a.band.outputs), ...Object.keys(b.band.outputs)]);
    for (const k of bandKeys) {
      const x = a.band.outputs[k];
      const y = b.band.outputs[k];
      if (x === undefined || y === undefined) return false;
      if (!close(x.low, y.low, relativeTolerance) || !close(x.high, y.high, relativeTolerance)) return false;
    }
  }
  return true;
}
