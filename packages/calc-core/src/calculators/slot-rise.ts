import { runner } from './engine.js';
import {
  RAYLEIGH_REFERENCE,
  riseHeadline,
  riseInputs,
  riseOutputs,
  riseWarnings,
  SLOT,
  solveRise,
} from './rise-common.js';
import {
  CLEAN_SURFACES_CAUTION,
  DAMP_CAUTION,
  ESTIMATE_CAUTION,
  LIQUID_TABLE_REFERENCES,
  MM,
  quantityInput,
  WATER_REFERENCES,
} from './shared.js';
import type { CalculatorDefinition } from './types.js';

export const calculator: CalculatorDefinition = {
  id: 'slot-rise',
  title: 'Rise in a slot or crack',
  summary:
    'Height a liquid climbs between two parallel walls a small gap apart (a crack, a joint, a gap behind a lining), with the meniscus-weight correction.',
  inputs: riseInputs(
    quantityInput('length', 'gap', 'Gap between the walls', 0.5e-3, [1e-6, 0.05], { display: MM }),
  ),
  outputs: riseOutputs(SLOT, 'Rise', 'Half the gap / capillary length'),
  warnings: riseWarnings(SLOT),
  headline: riseHeadline(SLOT, 'between walls {input.gap} apart'),
  cautions: [
    ESTIMATE_CAUTION,
    {
      code: 'REAL_CRACKS',
      text: 'Real cracks taper, branch and are rough; the parallel-wall result is an upper-bound style estimate for the narrowest sustained width, not a measurement.',
    },
    CLEAN_SURFACES_CAUTION,
    DAMP_CAUTION,
  ],
  references: [
    {
      id: 'jurin-slot',
      citation:
        "Force balance of Jurin's law per unit length of two parallel plates, as in standard capillarity texts",
      usedFor: 'h = 2σ cos θ/(ρ g w)',
      basis: 'common practice',
    },
    RAYLEIGH_REFERENCE,
    ...WATER_REFERENCES,
    ...LIQUID_TABLE_REFERENCES,
  ],
  solve: (inputs) => solveRise(SLOT, inputs),
};

/** Runs this calculator alone (what a widget bundling one calculator calls); inputs in SI keyed by input id. */
export const run = runner(calculator);
