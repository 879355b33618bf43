import type {
  CalculationResult,
  CalculatorCore,
  CalculatorTexts,
  ComputedResult,
} from '@wickstone/calc-core';
import type { mountWidget } from './mount.js';

/**
 * What a calculator's engine chunk exports (the build makes one per calculator from its calc-core
 * subpath): the calculator's core (no texts), its `compute` and the runtime's `mountWidget`, which it imports from the shared
 * runtime chunk, so loading the engine loads the runtime once for every widget of the release.
 */
export interface Engine {
  readonly calculator: CalculatorCore;
  /** The numbers only (calc-core's `compute`): what the first result shows. */
  readonly compute: (inputs: unknown) => ComputedResult;
  readonly mountWidget: typeof mountWidget;
}

/**
 * What a calculator's texts chunk exports (from calc-core's `calculators/<id>.texts`), fetched after
 * first paint: its cautions and references, and calc-core's full run (working, assumptions, input
 * hash), which the working and the run report need and the first result does not.
 */
export interface TextsChunk {
  readonly texts: CalculatorTexts;
  readonly runCalculation: (def: CalculatorCore, inputs: unknown) => CalculationResult;
}
