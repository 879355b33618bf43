import type {
  CalculationResult,
  CalculatorCore,
  CalculatorTexts,
  ComputedResult,
} from '@wickstone/calc-core';
import type { ChunkTable } from './chunks.js';
import type { mountFirst } from './first/mount.js';

/**
 * What a calculator's engine chunk exports (the build makes one per calculator from its calc-core
 * subpath): the calculator's core (no texts), its `compute` and the first view's `mountFirst`, which
 * it imports from the shared runtime chunk, so loading the engine loads the runtime once for every
 * widget of the release; and the SRI table of every chunk that follows first paint for this
 * calculator (the loader carries only the first flight's), trusted because the engine's own
 * integrity was checked.
 */
export interface Engine {
  readonly calculator: CalculatorCore;
  /** The numbers only (calc-core's `compute`): what the first result shows. */
  readonly compute: (inputs: unknown) => ComputedResult;
  readonly mountFirst: typeof mountFirst;
  readonly chunks: ChunkTable;
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
