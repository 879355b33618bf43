import {
  risingDampSteadyState,
  STEADY_FRACTION,
  timeToFraction,
  type RisingDampResult,
} from '../formulas/rising-damp.js';
import { computer } from './engine.js';
import { runner } from './run.js';
import { explain } from './rising-damp-height.working.js';
import { choice, fmt, noteTaker, num, q, quantityInput, solved, warning } from './shared.js';
import type { CalculatorCore, InputValues, Solution, Warning } from './types.js';

/** Our threshold: below one wall thickness the wet zone is not tall against the wall, see the warning. */
const SHALLOW_RATIO = 1;
/** Heights above this are rarely seen in walls (common practice); the model then points at its inputs. */
const TALL_HEIGHT_M = 2;
const DAY_S = 86400;

/** What rising-damp-height.working.ts writes each step of the working from, by note key. */
export interface RisingDampHeightNotes {
  readonly steady: {
    readonly S: number;
    readonly b: number;
    readonly e: number;
    readonly theta: number;
    readonly n: number;
    readonly r: RisingDampResult;
    readonly tSteady: number;
    /** The fraction of the steady height `tSteady` is the time to (the working prints it). */
    readonly f: number;
  };
}

/** What the assumptions are written from. */
export interface RisingDampHeightAssumed {
  /** Both faces of the wall dry. */
  readonly both: boolean;
}

function solve(inputs: InputValues): Solution {
  const S = num(inputs, 'sorptivity');
  const b = num(inputs, 'wallThickness');
  const e = num(inputs, 'evaporationRate');
  const theta = num(inputs, 'wetWaterContent');
  const both = choice(inputs, 'dryingFaces') === 'both';
  const n = both ? 2 : 1;
  const r = risingDampSteadyState({
    sorptivity: S,
    wallThickness: b,
    evaporationRate: e,
    wetWaterContent: theta,
    dryingFaces: n,
  });
  const tSteady = timeToFraction(STEADY_FRACTION, r.timeConstant);

  // The working's text is written from these notes by rising-damp-height.working.ts (`calculate` only).
  const working = noteTaker<RisingDampHeightNotes>();
  working.add('steady', { S, b, e, theta, n, r, tSteady, f: STEADY_FRACTION });

  const warnings: Warning[] = [];
  if (r.steadyHeight < SHALLOW_RATIO * b) {
    warnings.push(
      warning(
        'WET_ZONE_NOT_TALL',
        `The steady height (${q(r.steadyHeight, 'm')}) is less than the wall thickness (${q(b, 'm')}): the model treats the water content as even across the wall, which needs a wet zone tall against the thickness. Read the height as an order of magnitude.`,
        ['wallThickness', 'evaporationRate'],
        { step: 'steady-height' },
      ),
    );
  }
  if (r.steadyHeight > TALL_HEIGHT_M) {
    warnings.push(
      warning(
        'HEIGHT_ABOVE_OBSERVED',
        `A steady height of ${q(r.steadyHeight, 'm')} is above the ${q(TALL_HEIGHT_M, 'm')} that rising damp rarely exceeds in practice (common practice). Such heights come from a very low evaporation rate (impermeable finishes, buried or sheltered faces) or a high sorptivity: check both, and look for other sources of water.`,
        ['evaporationRate', 'sorptivity'],
        { step: 'steady-height' },
      ),
    );
  }
  if (tSteady > 10 * 365.25 * DAY_S) {
    warnings.push(
      warning(
        'SLOW_APPROACH',
        `The wall takes ${fmt(tSteady / (365.25 * DAY_S))} years to approach steady state: seasons change the evaporation rate long before then, so the wall is never at the steady height; the steady figures are a limit, not a state to expect.`,
        ['evaporationRate', 'wallThickness', 'wetWaterContent'],
        { step: 'time-to-steady' },
      ),
    );
  }

  return solved({
    outputs: {
      steadyHeight: r.steadyHeight,
      waterHeld: r.waterHeld,
      dailyFlow: r.flow,
      timeToSteady: tSteady,
      timeConstant: r.timeConstant,
      residenceTime: r.residenceTime,
    },
    warnings,
    band: null,
    notes: working.list,
    assumed: { both },
  });
}

export const calculator: CalculatorCore = {
  id: 'rising-damp-height',
  title: 'Height of rising damp in a wall',
  summary:
    'The evaporation-limited height that water rises to in a wall standing in wet ground, by the sharp-front model of Hall & Hoff (2007), with the water the wall holds, the daily flow through it and how long it takes to get there.',
  inputs: [
    quantityInput(
      'sorptivity',
      'sorptivity',
      'Sorptivity of the masonry',
      1e-3 / Math.sqrt(60),
      [1e-6, 2e-3],
      {
        help: 'Water absorbed per unit area against the square root of time, from a partial-immersion test of the masonry.',
      },
    ),
    quantityInput('length', 'wallThickness', 'Wall thickness', 0.35, [0.05, 3], {
      display: { si: 'mm', us: 'in' },
    }),
    quantityInput(
      'evaporationRate',
      'evaporationRate',
      'Evaporation rate from each drying face',
      1e-3 / DAY_S,
      [1e-10, 1e-6],
      {
        help: 'Volume of water leaving per unit area of wall face, as a depth of water per day.',
      },
    ),
    quantityInput('dimensionless', 'wetWaterContent', 'Wet water content θw', 0.2, [0.01, 0.6], {
      help: 'Volume fraction of the masonry filled with water in the wet zone (the capillary-saturated content, below the porosity).',
    }),
    {
      id: 'dryingFaces',
      label: 'The wall dries from',
      kind: 'choice',
      default: 'both',
      options: [
        { value: 'both', label: 'Both faces' },
        { value: 'one', label: 'One face (the other sealed, rendered hard or buried)' },
      ],
    },
  ],
  outputs: [
    {
      id: 'steadyHeight',
      label: 'Steady-state height of rising damp',
      kind: 'length',
      display: { si: 'm', us: 'ft' },
    },
    { id: 'waterHeld', label: 'Water held per metre of wall', kind: 'volumePerLength' },
    { id: 'dailyFlow', label: 'Flow through the wall per metre', kind: 'flowPerLength' },
    {
      id: 'timeToSteady',
      label: `Time to reach ${STEADY_FRACTION * 100} % of the steady height`,
      kind: 'time',
      help: 'From a dry wall under a steady evaporation rate.',
      display: { si: 'day', us: 'day' },
    },
    { id: 'timeConstant', label: 'Time constant τ', kind: 'time', display: { si: 'day', us: 'day' } },
    {
      id: 'residenceTime',
      label: 'Mean time water spends in the wall',
      kind: 'time',
      display: { si: 'day', us: 'day' },
    },
  ],
  headline: {
    rules: [
      {
        output: 'steadyHeight',
        text: 'Damp can rise to about {value} in this wall, where evaporation from its faces balances the water drawn up.',
      },
    ],
    missing: 'steady height',
  },
  warnings: [{ code: 'WET_ZONE_NOT_TALL' }, { code: 'HEIGHT_ABOVE_OBSERVED' }, { code: 'SLOW_APPROACH' }],
  solve,
};

/** Runs this calculator alone (what a widget bundling one calculator calls); inputs in SI keyed by input id. */
export const run = /* @__PURE__ */ runner(calculator, explain);

/** Its numbers only (`compute`): no working, assumptions or input hash; what the widget's first result uses. */
export const compute = /* @__PURE__ */ computer(calculator);
