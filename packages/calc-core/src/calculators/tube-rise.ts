import { runner } from './engine.js';
import {
  RAYLEIGH_REFERENCE,
  riseHeadline,
  riseInputs,
  riseOutputs,
  riseWarnings,
  solveRise,
  TUBE,
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
  id: 'tube-rise',
  title: 'Capillary rise or depression in a tube',
  summary:
    "Height a liquid climbs (or is pushed down) in a narrow round tube, by Jurin's law, with the liquid's properties at its temperature and the meniscus-weight correction.",
  inputs: riseInputs(
    quantityInput('length', 'diameter', 'Bore (inside diameter)', 1e-3, [1e-6, 0.05], { display: MM }),
  ),
  outputs: riseOutputs(TUBE, "Rise (Jurin's law)", 'Bore radius / capillary length'),
  warnings: riseWarnings(TUBE),
  headline: riseHeadline(TUBE, 'in a {input.diameter} bore'),
  cautions: [ESTIMATE_CAUTION, CLEAN_SURFACES_CAUTION, DAMP_CAUTION],
  references: [
    {
      id: 'jurin-1718',
      citation:
        'Jurin J. (1718) An account of some experiments shown before the Royal Society, Phil. Trans. 30, 739–747',
      usedFor: "Jurin's law, h = 4σ cos θ/(ρ g d)",
      basis: 'printed',
    },
    RAYLEIGH_REFERENCE,
    ...WATER_REFERENCES,
    ...LIQUID_TABLE_REFERENCES,
  ],
  solve: (inputs) => solveRise(TUBE, inputs),
};

/** Runs this calculator alone (what a widget bundling one calculator calls); inputs in SI keyed by input id. */
export const run = runner(calculator);
