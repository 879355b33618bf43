import { computer } from './engine.js';
import { runner } from './run.js';
import { riseHeadline, riseInputs, riseOutputs, riseWarnings, solveRise, TUBE } from './rise-common.js';
import { explain } from './rise-common.working.js';
import { MM, quantityInput } from './shared.js';
import type { CalculatorCore } from './types.js';

export const calculator: CalculatorCore = {
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
  solve: (inputs) => solveRise(TUBE, inputs),
};

/**
 * Runs this calculator alone, from its core (what the widget's engine calls); inputs in SI keyed by
 * input id. Its results carry the liquid's hazards but not the calculator's own cautions, which are in
 * its texts: `calculate` (the registry) gives them.
 */
export const run = /* @__PURE__ */ runner(calculator, explain);

/** Its numbers only (`compute`): no working, assumptions or input hash; what the widget's first result uses. */
export const compute = /* @__PURE__ */ computer(calculator);
