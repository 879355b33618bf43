import type { CalculationResult, CalculatorCore, CalculatorTexts } from '@wickstone/calc-core';
import type { mountWidget } from './mount.js';

/**
 * What a calculator's engine chunk exports (the build makes one per calculator from its calc-core
 * subpath): the calculator's core (no texts) and the runtime's `mountWidget`, which it imports from the shared
 * runtime chunk, so loading the engine loads the runtime once for every widget of the release.
 */
export interface Engine {
  readonly calculator: CalculatorCore;
  readonly run: (inputs: unknown) => CalculationResult;
  readonly mountWidget: typeof mountWidget;
}

/** What a calculator's texts chunk exports (from calc-core's `calculators/<id>.texts`): fetched after first paint. */
export interface TextsChunk {
  readonly texts: CalculatorTexts;
}
