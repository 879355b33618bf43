import {
  CASAGRANDE_THRESHOLDS,
  casagrandeCriterion,
  frostGroup,
  fringeGapBelowFrostLine,
  type CasagrandeResult,
  type FrostGroup,
  type SoilKind,
} from '../formulas/frost.js';
import { hazenCapillaryRise } from '../formulas/soil.js';
import { bandOver, computer } from './engine.js';
import { runner } from './run.js';
import { HAZEN_BASIS, hazenCInput } from './hazen.js';
import { choice, fmt, MM, noteTaker, num, q, quantityInput, solved, warning } from './shared.js';
import { explain } from './frost-screening.working.js';
import type { CalculatorCore, InputValues, Outputs, Solution, Warning } from './types.js';

/** No. 200 sieve, the sand/fines boundary of ASTM D2487: Hazen's relation was drawn from coarser soils. */
const NO200_SIEVE_M = 0.075e-3;
/** Our band around a Casagrande threshold, in share of mass: about the repeatability of a hydrometer test. */
const NEAR_THRESHOLD = 0.01;

const hazen = [{ input: 'riseFrom', values: ['hazen'] }] as const;
const measured = [{ input: 'riseFrom', values: ['measured'] }] as const;
const clay = [{ input: 'soilKind', values: ['clay'] }] as const;

const GROUP_INDEX: Readonly<Record<FrostGroup, number>> = { NFS: 0, F1: 1, F2: 2, F3: 3, F4: 4 };
const KIND_LABEL: Readonly<Record<SoilKind, string>> = {
  gravel: 'Gravelly soil',
  sand: 'Sand (not a very fine silty sand)',
  'very-fine-silty-sand': 'Very fine silty sand',
  silt: 'Silt',
  clay: 'Clay',
  'varved-clay': 'Varved clay or other fine-grained banded sediment',
};

/** What frost-screening.working.ts writes each step of the working from, by note key. */
export interface FrostScreeningNotes {
  readonly screen: {
    readonly crit: CasagrandeResult;
    readonly group: FrostGroup;
    readonly groupIndex: number;
    readonly kindLabel: string;
    readonly share: number;
    readonly cu: number;
    readonly pi: number | undefined;
    /** The criterion's thresholds (the working prints them). */
    readonly limits: typeof CASAGRANDE_THRESHOLDS;
  };
  readonly hazenRise: { readonly c: number; readonly e: number; readonly d10: number; readonly rise: number };
  readonly measuredRise: { readonly rise: number };
  readonly fringe: {
    readonly wt: number;
    readonly rise: number;
    readonly frostDepth: number;
    readonly gap: number;
  };
}

/** What the assumptions are written from. */
export interface FrostScreeningAssumed {
  readonly fromHazen: boolean;
}

function solve(inputs: InputValues): Solution {
  const share = num(inputs, 'finesShare');
  const cu = num(inputs, 'uniformity');
  const kind = choice(inputs, 'soilKind') as SoilKind;
  const pi = kind === 'clay' ? num(inputs, 'plasticityIndex') : undefined;
  const frostDepth = num(inputs, 'frostDepth');
  const wt = num(inputs, 'waterTableDepth');
  const fromHazen = choice(inputs, 'riseFrom') === 'hazen';
  const d10 = fromHazen ? num(inputs, 'd10') : 0;
  const e = fromHazen ? num(inputs, 'voidRatio') : 0;
  const c = fromHazen ? num(inputs, 'hazenC') : 0;

  const crit = casagrandeCriterion(share, cu);
  const group = frostGroup(kind, share, pi);
  const groupSusceptible = group !== 'NFS';
  const susceptible = crit.susceptible || groupSusceptible;
  const fine = fromHazen && d10 < NO200_SIEVE_M;
  const tableInFrost = wt <= frostDepth;

  const riseAt = (cValue: number): number =>
    fromHazen ? hazenCapillaryRise({ d10, voidRatio: e, c: cValue }) : num(inputs, 'capillaryRise');
  const evaluate = (cValue: number): Outputs => {
    const rise = riseAt(cValue);
    const gap = fringeGapBelowFrostLine({ waterTableDepth: wt, frostDepth, capillaryRise: rise });
    return {
      capillaryRise: fine ? null : rise,
      fringeGap: fine ? null : gap,
      fringeReachesFrostLine: tableInFrost ? 1 : fine ? null : gap <= 0 ? 1 : 0,
    };
  };
  const nominal = evaluate(c);
  const outputs: Outputs = {
    frostSusceptible: susceptible ? 1 : 0,
    frostGroup: GROUP_INDEX[group],
    ...nominal,
  };

  const pct = (x: number): string => `${fmt(x * 100)} %`;
  // The working's text is written from these notes by frost-screening.working.ts (`calculate` only).
  const working = noteTaker<FrostScreeningNotes>();
  working.add('screen', {
    crit,
    group,
    groupIndex: GROUP_INDEX[group],
    kindLabel: KIND_LABEL[kind],
    share,
    cu,
    pi,
    limits: CASAGRANDE_THRESHOLDS,
  });
  if (fromHazen && !fine) working.add('hazenRise', { c, e, d10, rise: riseAt(c) });
  else if (!fromHazen) working.add('measuredRise', { rise: riseAt(c) });
  if (!fine) working.add('fringe', { wt, rise: riseAt(c), frostDepth, gap: nominal.fringeGap ?? 0 });

  const band = fromHazen && !fine ? bandOver([HAZEN_BASIS], nominal, (v) => evaluate(v.hazenC ?? c)) : null;

  const warnings: Warning[] = [];
  if (fine) {
    warnings.push(
      warning(
        'FINE_GRAINED_SOIL',
        `D10 of ${q(d10 * 1000, 'mm')} is finer than the No. 200 sieve (0.075 mm): Hazen's relation was drawn from sands and does not hold here, so no capillary rise or gap is given${tableInFrost ? '' : ', nor whether the fringe reaches the frost line'}. Enter a measured capillary rise instead.`,
        ['d10', 'riseFrom'],
        {
          withholds: tableInFrost
            ? ['capillaryRise', 'fringeGap']
            : ['capillaryRise', 'fringeGap', 'fringeReachesFrostLine'],
        },
      ),
    );
  }
  if (tableInFrost) {
    warnings.push(
      warning(
        'WATER_TABLE_WITHIN_FROST_DEPTH',
        `The water table (${q(wt, 'm')} down) is within the frost depth (${q(frostDepth, 'm')}): free water freezes in place, so ${susceptible ? 'ice lenses and heave are to be expected in this frost-susceptible soil' : 'even a soil that screens as not susceptible can heave'}. Lower the water table or design for it.`,
        ['waterTableDepth', 'frostDepth'],
      ),
    );
  } else if (nominal.fringeReachesFrostLine === 0 && (band?.outputs.fringeReachesFrostLine?.high ?? 0) >= 1) {
    warnings.push(
      warning(
        'FRINGE_MAY_REACH_FROST_LINE',
        `With Hazen's constant at the top of its published range (0.5 cm²) the capillary fringe reaches the frost line: the gap of ${q(nominal.fringeGap ?? 0, 'm')} is not secure.`,
        ['waterTableDepth', 'hazenC'],
        { step: 'fringe' },
      ),
    );
  }
  if (crit.gradation === 'intermediate') {
    warnings.push(
      warning(
        'INTERMEDIATE_GRADATION',
        `Cu = ${fmt(cu)} lies between the very uniform (Cu < ${CASAGRANDE_THRESHOLDS.uniformBelowCu}) and non-uniform (Cu > ${CASAGRANDE_THRESHOLDS.nonUniformAboveCu}) soils the criterion names, where it gives no threshold of its own; the lower ${pct(CASAGRANDE_THRESHOLDS.nonUniformShare)} is applied, which may call a soil susceptible that a frost-heave test would pass.`,
        ['uniformity'],
        { step: 'casagrande' },
      ),
    );
  }
  if (Math.abs(share - crit.threshold) <= NEAR_THRESHOLD) {
    warnings.push(
      warning(
        'NEAR_THRESHOLD',
        `${pct(share)} finer than 0.02 mm is within one percentage point of the ${pct(crit.threshold)} threshold: the verdict turns on the precision of the hydrometer analysis; treat the soil as susceptible until a frost-heave test (ASTM D5918) says otherwise.`,
        ['finesShare'],
        { step: 'casagrande' },
      ),
    );
  }
  if (crit.susceptible !== groupSusceptible) {
    warnings.push(
      warning(
        'SCREENS_DISAGREE',
        `The Casagrande criterion says ${crit.susceptible ? 'susceptible' : 'not susceptible'} but the soil group (${group}) says ${groupSusceptible ? 'susceptible' : 'not susceptible'}: the screen takes the soil as frost-susceptible. Check the soil description against the grading.`,
        ['soilKind', 'finesShare', 'uniformity'],
        { step: 'group' },
      ),
    );
  }

  return solved({ outputs, warnings, band, notes: working.list, assumed: { fromHazen } });
}

export const calculator: CalculatorCore = {
  id: 'frost-screening',
  title: 'Frost-susceptibility screening of a soil',
  summary:
    "Whether a soil under a slab or pavement is frost-susceptible by Casagrande's grain-size criterion and the frost-design soil groups, and whether its capillary fringe reaches the frost line from the water table (Hazen's estimate or a measured rise).",
  inputs: [
    quantityInput('dimensionless', 'finesShare', 'Share by mass finer than 0.02 mm', 0.05, [0, 1], {
      help: 'From the grading (hydrometer) curve, as a fraction: 0.05 for 5 %.',
    }),
    quantityInput('dimensionless', 'uniformity', 'Coefficient of uniformity Cu = D60/D10', 20, [1, 1000]),
    {
      id: 'soilKind',
      label: 'Soil',
      kind: 'choice',
      default: 'sand',
      options: (Object.keys(KIND_LABEL) as SoilKind[]).map((value) => ({ value, label: KIND_LABEL[value] })),
    },
    quantityInput('dimensionless', 'plasticityIndex', 'Plasticity index PI', 15, [0, 100], {
      help: 'In percentage points; decides F3 (PI above 12) or F4 for a clay.',
      appliesWhen: clay,
    }),
    quantityInput('length', 'frostDepth', 'Frost depth below the finished surface', 1, [0.05, 5], {
      help: 'From the local code or climate records for the site.',
      display: { si: 'm', us: 'ft' },
    }),
    quantityInput(
      'length',
      'waterTableDepth',
      'Depth of the water table below the finished surface',
      2.5,
      [0.01, 50],
      {
        help: 'Its highest seasonal level.',
        display: { si: 'm', us: 'ft' },
      },
    ),
    {
      id: 'riseFrom',
      label: 'Capillary rise',
      kind: 'choice',
      default: 'hazen',
      options: [
        { value: 'hazen', label: "Estimate by Hazen's formula from D10" },
        { value: 'measured', label: 'Enter a measured capillary rise' },
      ],
    },
    quantityInput('length', 'd10', 'Effective grain size D10', 0.08e-3, [1e-6, 0.02], {
      help: 'The sieve size that 10 % of the soil by mass passes.',
      display: MM,
      appliesWhen: hazen,
    }),
    quantityInput('dimensionless', 'voidRatio', 'Void ratio e', 0.6, [0.1, 3], { appliesWhen: hazen }),
    hazenCInput('Published range 0.1–0.5 cm²; the band always spans all of it.', hazen),
    quantityInput('length', 'capillaryRise', 'Measured capillary rise', 0.5, [0, 50], {
      display: { si: 'm', us: 'ft' },
      appliesWhen: measured,
    }),
  ],
  outputs: [
    {
      id: 'frostSusceptible',
      label: 'Frost-susceptible (1 yes, 0 no)',
      kind: 'dimensionless',
      help: 'Yes when either the Casagrande criterion or the soil group says so.',
    },
    {
      id: 'frostGroup',
      label: 'Frost-design soil group (0 = NFS, 1–4 = F1–F4)',
      kind: 'dimensionless',
    },
    {
      id: 'capillaryRise',
      label: 'Capillary rise above the water table',
      kind: 'length',
      display: { si: 'm', us: 'ft' },
    },
    {
      id: 'fringeGap',
      label: 'Gap between the frost line and the capillary fringe',
      kind: 'length',
      help: 'Zero or negative: the fringe reaches the frost line.',
      display: { si: 'm', us: 'ft' },
    },
    {
      id: 'fringeReachesFrostLine',
      label: 'Capillary fringe reaches the frost line (1 yes, 0 no)',
      kind: 'dimensionless',
    },
  ],
  headline: {
    rules: [
      {
        output: 'fringeReachesFrostLine',
        text: 'Capillary water can reach the frost line in this soil.',
        atOrBelow: 'Capillary water stays below the frost line in this soil.',
      },
      {
        output: 'frostSusceptible',
        text: 'This soil screens as frost-susceptible.',
        atOrBelow: 'This soil does not screen as frost-susceptible.',
      },
    ],
    missing: 'frost screening answer',
  },
  warnings: [
    {
      code: 'FINE_GRAINED_SOIL',
      summary:
        "D10 is finer than 0.075 mm, outside the sands Hazen's relation was drawn from: no estimated rise.",
    },
    { code: 'WATER_TABLE_WITHIN_FROST_DEPTH' },
    { code: 'FRINGE_MAY_REACH_FROST_LINE' },
    { code: 'INTERMEDIATE_GRADATION' },
    { code: 'NEAR_THRESHOLD' },
    { code: 'SCREENS_DISAGREE' },
  ],
  solve,
};

/** Runs this calculator alone (what a widget bundling one calculator calls); inputs in SI keyed by input id. */
export const run = /* @__PURE__ */ runner(calculator, explain);

/** Its numbers only (`compute`): no working, assumptions or input hash; what the widget's first result uses. */
export const compute = /* @__PURE__ */ computer(calculator);
