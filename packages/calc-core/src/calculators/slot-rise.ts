import { computer } from './engine.js';
import { runner } from './run.js';
import { riseHeadline, riseInputs, riseOutputs, riseWarnings, SLOT, solveRise } from './rise-common.js';
import { explain } from './rise-common.working.js';
import { MM, quantityInput } from './shared.js';
import type { CalculatorCore } from './types.js';

export const calculator: CalculatorCore = {
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
  solve: (inputs) => solveRise(SLOT, inputs),
};

/**
 * Runs this calculator alone, from its core (what the widget's engine calls); inputs in SI keyed by
 * input id. Its results carry the liquid's hazards but not the calculator's own cautions, which are in
 * its texts: `calculate` (the registry) gives them.
 */
export const run = /* @__PURE__ */ runner(calculator, explain);

/** Its numbers only (`compute`): no working, assumptions or input hash; what the widget's first result uses. */
export const compute = /* @__PURE__ */ computer(calculator);
