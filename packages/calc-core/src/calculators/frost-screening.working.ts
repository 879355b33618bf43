// The frost-screening calculator's working and assumptions, written from the notes its solve
// records (frost-screening.ts): carried by its texts, so the widget's first flight has none of
// this text.
import type { FrostScreeningAssumed, FrostScreeningNotes } from './frost-screening.js';
import { fmt, q } from './shared.js';
import { hazenRiseStep } from './shared-working.js';
import type { Explain, StepWriters } from './types.js';

const CASAGRANDE = 'Casagrande 1931 grain-size criterion (from memory, common practice)';
const GROUPS = 'frost-design soil groups of US Army Corps of Engineers pavement practice (from memory)';

const pct = (x: number): string => `${fmt(x * 100)} %`;

const steps: StepWriters<FrostScreeningNotes> = {
  screen: ({ crit, group, groupIndex, kindLabel, share, cu, pi, limits }) => [
    {
      id: 'casagrande',
      label: `Casagrande criterion: ${crit.gradation} soil, threshold ${pct(crit.threshold)} finer than 0.02 mm`,
      formula: `susceptible if share finer than 0.02 mm > ${pct(limits.uniformShare)} (Cu < ${limits.uniformBelowCu}) or > ${pct(limits.nonUniformShare)} (otherwise)`,
      substituted: `Cu = ${fmt(cu)}, share = ${pct(share)} ${crit.susceptible ? '>' : '≤'} ${pct(crit.threshold)}`,
      value: crit.susceptible ? 1 : 0,
      unit: '1',
      source: CASAGRANDE,
    },
    {
      id: 'group',
      label: `Frost-design soil group: ${group === 'NFS' ? 'not frost-susceptible (NFS)' : group}`,
      formula: '0 = NFS, 1–4 = F1–F4 (F4 most susceptible)',
      substituted: `${kindLabel}, ${pct(share)} finer than 0.02 mm${pi !== undefined ? `, PI = ${fmt(pi)}` : ''}`,
      value: groupIndex,
      unit: '1',
      source: GROUPS,
    },
  ],
  hazenRise: ({ c, e, d10, rise }) => [
    hazenRiseStep('rise', 'Capillary rise above the water table', c, e, d10, rise),
  ],
  measuredRise: ({ rise }) => [
    {
      id: 'rise',
      label: 'Capillary rise above the water table (measured)',
      formula: 'h_c',
      substituted: q(rise, 'm'),
      value: rise,
      unit: 'm',
      source: 'measured for this soil',
    },
  ],
  fringe: ({ wt, rise, frostDepth, gap }) => [
    {
      id: 'fringe',
      label: 'Gap between the frost line and the top of the capillary fringe',
      formula: 'D_w − h_c − D_f (zero or less: the fringe reaches the frost line)',
      substituted: `${q(wt, 'm')} − ${q(rise, 'm')} − ${q(frostDepth, 'm')}`,
      value: gap,
      unit: 'm',
      source: 'depths below the finished surface; the fringe top taken as sharp (common practice)',
    },
  ],
};

function assumptions({ fromHazen }: FrostScreeningAssumed): string[] {
  return [
    "A screen by grain size only: Casagrande's criterion and the frost-design soil groups, both recalled from the published practice, not seen printed here.",
    'The soil is the one within the frost depth and below it down to the water table; layered ground needs each layer checked.',
    'A static water table at its highest seasonal level; the top of the capillary fringe taken as a sharp line.',
    fromHazen
      ? "The capillary rise by Hazen's empirical formula, with the band over the published range of its constant."
      : 'The capillary rise as measured for this soil.',
    'The frost depth as given, from the local code or climate records.',
  ];
}

export const explain: Explain = { steps, assumptions };
