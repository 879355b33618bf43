import { canonicalJson, sha256Hex } from '../hash.js';
import { VERSION } from '../version.js';
import { cautionsOf, resolveInputs, solveChecked } from './engine.js';
import { bindWriters } from './shared-liquid.js';
import { sharedWriters } from './shared-working.js';
import type { CalculationResult, CalculatorCore, CalculatorTexts, InputValues } from './types.js';

// The full run of a calculator: its numbers with the working, the assumptions and the input hash.
// Apart from engine.ts (numbers only, `compute`) so that a bundle that computes, as the widget's
// first flight does, carries neither this nor the hash.

/** The stable hash of a calculator's resolved inputs: SHA-256 hex of `{ calculator, inputs }`. */
export function hashInputs(calculatorId: string, inputs: InputValues): string {
  return sha256Hex(canonicalJson({ calculator: calculatorId, inputs }));
}

/**
 * Runs one calculator: validates, solves, stamps the version and the input hash. Deterministic
 * and JSON-serialisable, so the server can re-run a visitor's inputs and compare. A core without
 * its texts gives a result whose cautions are the liquid's hazards only.
 * @param raw inputs keyed by input id, canonical units (SI, angles in degrees, temperatures in °C)
 * @throws CalcInputError listing every bad field
 */
export function runCalculation(
  def: CalculatorCore & Partial<CalculatorTexts>,
  raw: unknown,
): CalculationResult {
  // The shared inputs' working is written by shared-working.ts, which only this full run carries.
  bindWriters(sharedWriters);
  const inputs = resolveInputs(def, raw);
  const solution = solveChecked(def, inputs, true);
  return {
    calculator: def.id,
    inputs,
    outputs: solution.outputs,
    warnings: solution.warnings,
    working: solution.working,
    band: solution.band,
    assumptions: solution.assumptions,
    cautions: cautionsOf(def, solution),
    version: VERSION,
    inputHash: hashInputs(def.id, inputs),
  };
}

/** `runCalculation` bound to one definition: the `run` each calculator subpath exports. */
export function runner(
  def: CalculatorCore & Partial<CalculatorTexts>,
): (inputs: unknown) => CalculationResult {
  return (inputs) => runCalculation(def, inputs);
}
