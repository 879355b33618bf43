import { CalcInputError } from './errors.js';
import { calculator as absorptionCoefficientCore } from './calculators/absorption-coefficient.js';
import { texts as absorptionCoefficientTexts } from './calculators/absorption-coefficient.texts.js';
import { computeCalculation } from './calculators/engine.js';
import { withTexts } from './join.js';
import { runCalculation } from './calculators/run.js';
import { calculator as contactAngleFromForceCore } from './calculators/contact-angle-from-force.js';
import { texts as contactAngleFromForceTexts } from './calculators/contact-angle-from-force.texts.js';
import { calculator as frostScreeningCore } from './calculators/frost-screening.js';
import { texts as frostScreeningTexts } from './calculators/frost-screening.texts.js';
import { calculator as interfacePressureCore } from './calculators/interface-pressure.js';
import { texts as interfacePressureTexts } from './calculators/interface-pressure.texts.js';
import { calculator as risingDampHeightCore } from './calculators/rising-damp-height.js';
import { texts as risingDampHeightTexts } from './calculators/rising-damp-height.texts.js';
import { calculator as slotRiseCore } from './calculators/slot-rise.js';
import { texts as slotRiseTexts } from './calculators/slot-rise.texts.js';
import { calculator as soilCapillaryRiseCore } from './calculators/soil-capillary-rise.js';
import { texts as soilCapillaryRiseTexts } from './calculators/soil-capillary-rise.texts.js';
import { calculator as tensionFromRiseCore } from './calculators/tension-from-rise.js';
import { texts as tensionFromRiseTexts } from './calculators/tension-from-rise.texts.js';
import { calculator as tubeRiseCore } from './calculators/tube-rise.js';
import { texts as tubeRiseTexts } from './calculators/tube-rise.texts.js';
import type { CalculationResult, CalculatorDefinition, ComputedResult } from './calculators/types.js';
import { calculator as wettingForceCore } from './calculators/wetting-force.js';
import { texts as wettingForceTexts } from './calculators/wetting-force.texts.js';
import { calculator as wickingTimeCore } from './calculators/wicking-time.js';
import { texts as wickingTimeTexts } from './calculators/wicking-time.texts.js';

// Each calculator whole: its core joined with its texts by `withTexts` (`join.ts`), the
// join the widget makes when the texts arrive; a texts module that does not fit its core throws here.
export const tubeRise: CalculatorDefinition = withTexts(tubeRiseCore, tubeRiseTexts);
export const slotRise: CalculatorDefinition = withTexts(slotRiseCore, slotRiseTexts);
export const soilCapillaryRise: CalculatorDefinition = withTexts(
  soilCapillaryRiseCore,
  soilCapillaryRiseTexts,
);
export const interfacePressure: CalculatorDefinition = withTexts(
  interfacePressureCore,
  interfacePressureTexts,
);
export const wettingForce: CalculatorDefinition = withTexts(wettingForceCore, wettingForceTexts);
export const wickingTime: CalculatorDefinition = withTexts(wickingTimeCore, wickingTimeTexts);
export const contactAngleFromForce: CalculatorDefinition = withTexts(
  contactAngleFromForceCore,
  contactAngleFromForceTexts,
);
export const tensionFromRise: CalculatorDefinition = withTexts(tensionFromRiseCore, tensionFromRiseTexts);
export const risingDampHeight: CalculatorDefinition = withTexts(risingDampHeightCore, risingDampHeightTexts);
export const frostScreening: CalculatorDefinition = withTexts(frostScreeningCore, frostScreeningTexts);
export const absorptionCoefficient: CalculatorDefinition = withTexts(
  absorptionCoefficientCore,
  absorptionCoefficientTexts,
);

/** Every calculator, in the order a picker shows them. Registered by hand: nothing registers itself on import. */
export const calculators: readonly CalculatorDefinition[] = [
  tubeRise,
  slotRise,
  soilCapillaryRise,
  interfacePressure,
  wettingForce,
  wickingTime,
  contactAngleFromForce,
  tensionFromRise,
  risingDampHeight,
  frostScreening,
  absorptionCoefficient,
];

export type CalculatorId =
  | 'tube-rise'
  | 'slot-rise'
  | 'soil-capillary-rise'
  | 'interface-pressure'
  | 'wetting-force'
  | 'wicking-time'
  | 'contact-angle-from-force'
  | 'tension-from-rise'
  | 'rising-damp-height'
  | 'frost-screening'
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
  return runCalculation(known(id), inputs);
}

/**
 * Runs a calculator by id for its numbers only: `calculate` without the working, the assumptions
 * and the input hash, several times faster. Its outputs, warnings and band equal `calculate`'s.
 * @param id a calculator id (`calculatorIds`)
 * @param inputs canonical units keyed by input id, as for `calculate`
 * @returns calculator, inputs used, outputs (canonical units), warnings, band, cautions, version
 * @throws CalcInputError `UNKNOWN_CALCULATOR`, or one listing every bad input field
 */
export function compute(id: string, inputs: unknown): ComputedResult {
  return computeCalculation(known(id), inputs);
}

function known(id: string): CalculatorDefinition {
  const def = getCalculator(id);
  if (def === undefined) {
    throw new CalcInputError({
      field: 'calculator',
      code: 'UNKNOWN_CALCULATOR',
      message: `no calculator "${id}"`,
    });
  }
  return def;
}
