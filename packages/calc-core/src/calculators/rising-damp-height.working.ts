// The rising-damp-height calculator's working and assumptions, written from the notes its solve
// records (rising-damp-height.ts): carried by its texts, so the widget's first flight has none of
// this text.
import type { RisingDampHeightAssumed, RisingDampHeightNotes } from './rising-damp-height.js';
import { fmt, q } from './shared.js';
import type { Explain, StepWriters } from './types.js';

const HALL_HOFF = 'Hall & Hoff 2007, Proc. R. Soc. A 463, 1871–1884 (form from memory)';
const DERIVED = 'sharp-front water balance of Hall & Hoff 2007, derived here';

const steps: StepWriters<RisingDampHeightNotes> = {
  steady: ({ S, b, e, theta, n, r, tSteady, f }) => [
    {
      id: 'steady-height',
      label: 'Steady-state height of the wet front',
      formula: 'h_ss = S·√(b / (2·n·e·θ_w))',
      substituted: `${q(S, 'm/s^0.5')} × √(${q(b, 'm')} / (2 × ${n} × ${q(e, 'm/s')} × ${fmt(theta)}))`,
      value: r.steadyHeight,
      unit: 'm',
      source: `${HALL_HOFF}; n drying faces, derived here`,
    },
    {
      id: 'water-held',
      label: 'Water held in the wet zone, per metre of wall',
      formula: 'W = θ_w·b·h_ss',
      substituted: `${fmt(theta)} × ${q(b, 'm')} × ${q(r.steadyHeight, 'm')}`,
      value: r.waterHeld,
      unit: 'm3/m',
      source: DERIVED,
    },
    {
      id: 'flow',
      label: 'Flow through the wall at steady state, per metre of wall',
      formula: 'Q = n·e·h_ss = b·S² / (2·θ_w·h_ss)',
      substituted: `${n} × ${q(e, 'm/s')} × ${q(r.steadyHeight, 'm')}`,
      value: r.flow,
      unit: 'm3/(m*s)',
      source: DERIVED,
    },
    {
      id: 'time-constant',
      label: 'Time constant of the approach to steady state',
      formula: 'τ = b·θ_w / (2·n·e); h(t) = h_ss·√(1 − exp(−t/τ))',
      substituted: `${q(b, 'm')} × ${fmt(theta)} / (2 × ${n} × ${q(e, 'm/s')})`,
      value: r.timeConstant,
      unit: 's',
      source: DERIVED,
    },
    {
      id: 'time-to-steady',
      label: `Time for a dry wall to wet to ${fmt(f * 100)} % of the steady height`,
      formula: `t = −τ·ln(1 − f²), f = ${fmt(f)}`,
      substituted: `−${q(r.timeConstant, 's')} × ln(1 − ${fmt(f)}²)`,
      value: tSteady,
      unit: 's',
      source: DERIVED,
    },
    {
      id: 'residence',
      label: 'Mean time water spends in the wall',
      formula: 't_r = W / Q = 2·τ',
      substituted: `${q(r.waterHeld, 'm3/m')} / ${q(r.flow, 'm3/(m*s)')}`,
      value: r.residenceTime,
      unit: 's',
      source: DERIVED,
    },
  ],
};

function assumptions({ both }: RisingDampHeightAssumed): string[] {
  return [
    'A sharp wet front: the wall below it is at the wet water content θw, above it dry (Hall & Hoff sharp-front model).',
    'A uniform wall of one material standing in a permanent water supply at its base; no damp-proof course.',
    `Evaporation at a steady rate e per unit area from ${both ? 'both faces' : 'one face'} over the whole wet height, none above it.`,
    'Gravity neglected against capillary suction, and the sorptivity that of the masonry as built (mortar joints included).',
    'No salts: salts crystallising near the faces change the evaporation and the sorptivity.',
  ];
}

export const explain: Explain = { steps, assumptions };
