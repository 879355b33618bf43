import type { CalculationResult, CalculatorDefinition } from '@wickstone/calc-core';
import type { mountWidget } from './mount.js';

/**
 * What a calculator's engine chunk exports (the build makes one per calculator from its calc-core
 * subpath): the calculator and the runtime's `mountWidget`, which it imports from the shared
 * runtime chunk, so loading the engine loads the runtime once for every widget of the release.
 */
export interface Engine {
  readonly calculator: CalculatorDefinition;
  readonly run: (inputs: unknown) => CalculationResult;
  readonly mountWidget: typeof mountWidget;
}
