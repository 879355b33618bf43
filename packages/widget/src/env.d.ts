/// <reference types="vite/client" />

/** This bundle's calculator: the build points it at one `@wickstone/calc-core/calculators/<id>` subpath. */
declare module 'virtual:wickstone-calculator' {
  import type { CalculationResult, CalculatorDefinition } from '@wickstone/calc-core';
  export const calculator: CalculatorDefinition;
  export function run(inputs: unknown): CalculationResult;
}

/** packages/widget/package.json's version, put in by the build. */
declare const __WICKSTONE_VERSION__: string;
/** The Manrope file the release ships (one variable font), put in by the build. */
declare const __WICKSTONE_MANROPE_FILE__: string;
