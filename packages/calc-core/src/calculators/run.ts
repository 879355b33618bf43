import { canonicalJson, sha256Hex } from '../hash.js';
import { VERSION } from '../version.js';
import { cautionsOf, resolveInputs, solveChecked } from './engine.js';
import { bindWriters } from './shared-liquid.js';
import { sharedWriters } from './shared-working.js';
import type {
  CalculationResult,
  CalculatorCore,
  CalculatorTexts,
  Explain,
  Explanation,
  InputValues,
  Solution,
  WorkingStep,
} from './types.js';

// The full run of a calculator: its numbers with the working, the assumptions and the input hash.
// Apart from engine.ts (numbers only, `compute`) so that a bundle that computes, as the widget's
// first flight does, carries neither this nor the hash.

/** The stable hash of a calculator's resolved inputs: SHA-256 hex of `{ calculator, inputs }`. */
export function hashInputs(calculatorId: string, inputs: InputValues): string {
  return sha256Hex(canonicalJson({ calculator: calculatorId, inputs }));
}

/**
 * Writes a solution's working and assumptions from its notes with the calculator's `explain`, and
 * checks that every warning's step is one the working has.
 */
function explained(
  def: CalculatorCore,
  solution: Solution,
  inputs: InputValues,
  explain: Explain | undefined,
): Explanation {
  if (explain === undefined)
    throw new Error(
      `${def.id}: its working is written by its texts (calculators/${def.id}.working.ts): give runCalculation their explain`,
    );
  const working = solution.notes.flatMap(([key, data]): readonly WorkingStep[] => {
    const write = explain.steps[key] as
      ((data: unknown, inputs: InputValues) => readonly WorkingStep[]) | undefined;
    if (write === undefined) throw new Error(`${def.id}: its working has no writer for the note ${key}`);
    return write(data, inputs);
  });
  // A calc-core bug, not a bad input: a warning that points at a step the working does not have.
  const steps = new Set(working.map((s) => s.id));
  for (const w of solution.warnings) {
    if (w.step !== undefined && !steps.has(w.step))
      throw new Error(`${def.id}: warning ${w.code} points at a step ${w.step} the working does not have`);
  }
  const assumptions = (explain.assumptions as (assumed: unknown, inputs: InputValues) => readonly string[])(
    solution.assumed,
    inputs,
  );
  return { working, assumptions };
}

/**
 * Runs one calculator: validates, solves, writes the working and assumptions, stamps the version
 * and the input hash. Deterministic and JSON-serialisable, so the server can re-run a visitor's
 * inputs and compare. A core without its texts gives a result whose cautions are the liquid's
 * hazards only; its working needs the texts' `explain`, given in the definition or apart (the
 * widget holds the core and, once its texts chunk arrives, the texts).
 * @param raw inputs keyed by input id, canonical units (SI, angles in degrees, temperatures in °C)
 * @throws CalcInputError listing every bad field
 */
export function runCalculation(
  def: CalculatorCore & Partial<CalculatorTexts>,
  raw: unknown,
  explain: Explain | undefined = def.explain,
): CalculationResult {
  // The shared inputs' working is written by shared-working.ts, which only this full run carries.
  bindWriters(sharedWriters);
  const inputs = resolveInputs(def, raw);
  const solution = solveChecked(def, inputs);
  const { working, assumptions } = explained(def, solution, inputs, explain);
  return {
    calculator: def.id,
    inputs,
    outputs: solution.outputs,
    warnings: solution.warnings,
    working,
    band: solution.band,
    assumptions,
    cautions: cautionsOf(def, solution),
    version: VERSION,
    inputHash: hashInputs(def.id, inputs),
  };
}

/**
 * `runCalculation` bound to one definition: the `run` each calculator subpath exports, given the
 * calculator's `explain` (its `<id>.working.ts`) beside its core, whose texts it does not carry.
 */
export function runner(
  def: CalculatorCore & Partial<CalculatorTexts>,
  explain?: Explain,
): (inputs: unknown) => CalculationResult {
  return (inputs) => runCalculation(def, inputs, explain ?? def.explain);
}
