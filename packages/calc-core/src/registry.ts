import { CalcInputError } from './errors.js';
import { calculator as absorptionCoefficient } from './calculators/absorption-coefficient.js';
import { runCalculation } from './calculators/engine.js';
import { calculator as interfacePressure } from './calculators/interface-pressure.js';
import { calculator as slotRise } from './calculators/slot-rise.js';
import { calculator as soilCapillaryRise } from './calculators/soil-capillary-rise.js';
import { calculator as tubeRise } from './calculators/tube-rise.js';
import type { CalculationResult, CalculatorDefinition } from './calculators/types.js';
import { calculator as wettingForce } from './calculators/wetting-force.js';
import { calculator as wickingTime } from './calculators/wicking-time.js';

/** Every calculator, in the order a picker shows them. Registered by hand: nothing registers itself on import. */
export const calculators: readonly CalculatorDefinition[] = [
  tubeRise,
  slotRise,
  soilCapillaryRise,
  interfacePressure,
  wettingForce,
  wickingTime,
  absorptionCoefficient,
];

export type CalculatorId =
  | 'tube-rise'
  | 'slot-rise'
  | 'soil-capillary-rise'
  | 'interface-pressure'
  | 'wetting-force'
  | 'wicking-time'
  | 'absorption-coefficient';

export const calculatorIds: readonly CalculatorId[] = calculators.map((c) => c.id as CalculatorId);

/** A calculator definition by id, or undefined. */
export function getCalculator(id: string): CalculatorDefinition | undefined {
  return calculators.find((c) => c.id === id);
}

/**
 * Runs a calculator by id.
 * @param id a calculator id (`calculatorIds`)
 * @param inputs canonical units keyed by input id: SI, angles in degrees, temperatures in °C;
 *   missing inputs take their defaults
 * @returns outputs (canonical units), warnings, working, band, version and input hash
 * @throws CalcInputError `UNKNOWN_CALCULATOR`, or one listing every bad input field
 */
export function calculate(id: string, inputs: unknown): CalculationResult {
  const def = getCalculator(id);
  if (def === undefined) {
    throw new CalcInputError({
      field: 'calculator',
      code: 'UNKNOWN_CALCULATOR',
      message: `no calculator "${id}"`,
    });
  }
  return runCalculation(def, inputs);
}
