import { CalcInputError } from '../errors.js';
import {
  absorptionPoints,
  FIT_WINDOW_S,
  fitLine,
  inFitWindow,
  ROOT_SECONDS_PER_ROOT_HOUR,
  type AbsorptionMethod,
  type LineFit,
} from '../formulas/absorption.js';
import { computer } from './engine.js';
import { runner } from './run.js';
import { tableIssues } from './table-issues.js';
import { explain } from './absorption-coefficient.working.js';
import { choice, fmt, noteTaker, num, q, solved, warning } from './shared.js';
import type {
  CalculatorCore,
  InputValues,
  Outputs,
  Solution,
  TableInput,
  TableRow,
  Warning,
} from './types.js';

// Water absorption coefficient and sorptivity from a partial-immersion test: the specimen stands
// with one face a few millimetres in water and is weighed at intervals. Δm/A against √t is a
// straight line while the wetting front is inside the specimen; its slope is A_w (EN ISO 15148)
// and A_w/ρ_w the sorptivity S (ASTM C1585's initial rate of absorption, Hall's sorptivity).

/**
 * The least correlation coefficient r of the fit for a rate to be reported. ASTM C1585: data
 * between 1 min and 6 h with r below 0.98 do not give an initial rate (from memory). EN ISO 15148
 * prints no such number that we could see; the same limit is applied to it as our threshold.
 */
export const MIN_CORRELATION = 0.98;
/** Fewer points than this in the fit window and no line is fitted (two points always lie on one). */
export const MIN_POINTS_IN_FIT = 3;
/** EN ISO 15148's test runs 24 h (from memory). */
const EN_TEST_DURATION_S = 24 * 3600;

const FITTED = [
  'absorptionCoefficient',
  'absorptionCoefficientPerRootHour',
  'sorptivity',
  'intercept',
  'rSquared',
] as const;
const RATES = [
  'absorptionCoefficient',
  'absorptionCoefficientPerRootHour',
  'sorptivity',
  'intercept',
] as const;

/** The readings input: time (s) and the specimen's mass (kg), the dry weighing first at time 0. */
export const readingsInput: TableInput = {
  id: 'readings',
  label: 'Readings',
  kind: 'table',
  help: "Time since the face touched the water and the specimen's mass, one row per weighing; the first row is the mass at time 0.",
  columns: [
    {
      id: 'time',
      label: 'Time',
      kind: 'time',
      min: 0,
      max: 30 * 86400,
      display: { si: 'min', us: 'min' },
      increasing: true,
    },
    { id: 'mass', label: 'Mass', kind: 'mass', min: 0, max: 100, display: { si: 'g', us: 'g' } },
  ],
  minRows: 5,
  maxRows: 200,
  // An invented test on a 100 mm × 100 mm face: weighings at 5 min, 20 min, 1 h, 2 h, 4 h, 8 h, 24 h.
  default: [
    { time: 0, mass: 1.84213 },
    { time: 300, mass: 1.84581 },
    { time: 1200, mass: 1.84893 },
    { time: 3600, mass: 1.8535 },
    { time: 7200, mass: 1.85804 },
    { time: 14400, mass: 1.86437 },
    { time: 28800, mass: 1.87329 },
    { time: 86400, mass: 1.89567 },
  ],
};

function readings(inputs: InputValues): readonly TableRow[] {
  const v = inputs.readings;
  if (!Array.isArray(v)) throw new Error('input readings is not a resolved table');
  return v as readonly TableRow[];
}

/** What absorption-coefficient.working.ts writes each step of the working from, by note key. */
export interface AbsorptionCoefficientNotes {
  readonly gain: {
    readonly method: AbsorptionMethod;
    readonly lastMass: number;
    readonly firstMass: number;
    readonly area: number;
    readonly lastGain: number;
    readonly inFit: number;
    readonly rows: number;
    /** Which readings the method fits, as its warning says it too. */
    readonly windowText: string;
  };
  readonly fit: { readonly method: AbsorptionMethod; readonly fit: LineFit; readonly r: number };
  readonly rates: {
    readonly slope: number;
    readonly rhoW: number;
    readonly sorptivity: number;
    /** √s per √h (the working gives the coefficient per √h too). */
    readonly perRootHour: number;
  };
}

const withheld = (): Outputs => Object.fromEntries(FITTED.map((id) => [id, null]));

function solve(inputs: InputValues): Solution {
  const method = choice(inputs, 'method') as AbsorptionMethod;
  const rows = readings(inputs);
  const area = num(inputs, 'faceArea');
  const rhoW = num(inputs, 'waterDensity');
  if (rows[0]?.time !== 0) {
    throw new CalcInputError({
      field: 'readings.0.time',
      code: 'NO_ZERO_READING',
      message:
        "Readings, row 1, time: the first row must be the specimen's mass at time 0, before it touches the water",
    });
  }
  const points = absorptionPoints(
    rows.map((r) => ({ time: r.time as number, mass: r.mass as number })),
    area,
  );
  const chosen = points.filter((_, i) => i > 0 && inFitWindow(method, rows[i]?.time as number));
  const [from, to] = FIT_WINDOW_S[method];
  const windowText =
    method === 'astm-c1585'
      ? `readings from ${q(from, 's')} (1 min) to ${q(to, 's')} (6 h)`
      : 'every reading after the one at time 0';
  const last = rows[rows.length - 1] as TableRow;
  const lastGain = points[points.length - 1]?.y ?? 0;
  const firstMass = rows[0].mass as number;
  // The working's text is written from these notes by absorption-coefficient.working.ts (`calculate` only).
  const working = noteTaker<AbsorptionCoefficientNotes>();
  working.add('gain', {
    method,
    lastMass: last.mass as number,
    firstMass,
    area,
    lastGain,
    inFit: chosen.length,
    rows: rows.length,
    windowText,
  });
  const parts = { band: null, notes: working.list, assumed: null };
  const outputs = (values: Partial<Record<(typeof FITTED)[number], number | null>>): Outputs => ({
    ...withheld(),
    ...values,
    pointsInFit: chosen.length,
  });

  if (chosen.length < MIN_POINTS_IN_FIT) {
    return solved({
      ...parts,
      outputs: outputs({}),
      warnings: [
        warning(
          'TOO_FEW_POINTS_IN_FIT',
          `Only ${chosen.length} reading${chosen.length === 1 ? '' : 's'} fall in the fit (${windowText}); at least ${MIN_POINTS_IN_FIT} are needed to judge a straight line, so no rate is given.`,
          ['readings', 'method'],
          { step: 'points', withholds: [...FITTED] },
        ),
      ],
    });
  }
  const fit = fitLine(chosen);
  const r = Math.sign(fit.slope) * Math.sqrt(fit.rSquared);
  working.add('fit', { method, fit, r });
  const warnings: Warning[] = [];
  if (!(fit.slope > 0)) {
    warnings.push(
      warning(
        'NO_UPTAKE',
        `The fitted line does not rise (slope ${q(fit.slope, 'kg/(m2*s^0.5)')}): the specimen took up no water over the readings in the fit, so no absorption rate is given. Check that the masses are the specimen's own and in time order.`,
        ['readings'],
        { step: 'slope', withholds: [...RATES] },
      ),
    );
    return solved({ ...parts, outputs: outputs({ rSquared: fit.rSquared }), warnings });
  }
  if (r < MIN_CORRELATION) {
    warnings.push(
      warning(
        'NOT_LINEAR',
        `The readings in the fit do not lie on a straight line against √t (r = ${fmt(r, 3)}, below ${MIN_CORRELATION}; R² = ${fmt(fit.rSquared, 3)}): ${method === 'astm-c1585' ? 'ASTM C1585 gives no initial rate for such data' : 'the wetting front may have reached the top of the specimen, or the sides leak'}, so no rate is given.`,
        ['readings'],
        { step: 'r-squared', withholds: [...RATES] },
      ),
    );
    return solved({ ...parts, outputs: outputs({ rSquared: fit.rSquared }), warnings });
  }
  const sorptivity = fit.slope / rhoW;
  working.add('rates', { slope: fit.slope, rhoW, sorptivity, perRootHour: ROOT_SECONDS_PER_ROOT_HOUR });
  if (method === 'en-iso-15148' && (last.time as number) < EN_TEST_DURATION_S) {
    warnings.push(
      warning(
        'SHORTER_THAN_TEST',
        `The last reading is at ${q((last.time as number) / 3600, 'h')}; EN ISO 15148 runs the test for 24 h (from memory). The coefficient stands for the readings given; state the test's length with it.`,
        ['readings'],
        { step: 'points' },
      ),
    );
  }
  return solved({
    ...parts,
    outputs: outputs({
      absorptionCoefficient: fit.slope,
      // The same quantity as A_w, kept canonical (per √s); its display unit kg/(m²·√h) shows 60 × the figure.
      absorptionCoefficientPerRootHour: fit.slope,
      sorptivity,
      intercept: fit.intercept,
      rSquared: fit.rSquared,
    }),
    warnings,
  });
}

export const calculator: CalculatorCore = {
  id: 'absorption-coefficient',
  title: 'Water absorption coefficient',
  summary:
    "A material's water absorption coefficient and sorptivity from a partial-immersion test: the straight line of mass gained per area of the wet face against the square root of time.",
  inputs: [
    {
      id: 'method',
      label: 'Test method',
      kind: 'choice',
      default: 'en-iso-15148',
      options: [
        {
          value: 'en-iso-15148',
          label: 'EN ISO 15148 (building materials)',
          help: 'Every weighing after the dry one enters the fit.',
        },
        {
          value: 'astm-c1585',
          label: 'ASTM C1585 (concrete)',
          help: 'The initial rate: readings from 1 min to 6 h enter the fit.',
        },
      ],
    },
    readingsInput,
    {
      id: 'faceArea',
      label: 'Area of the face in water',
      kind: 'area',
      default: 0.01,
      min: 1e-4,
      max: 1,
      display: { si: 'cm2', us: 'in2' },
      help: 'The wetted face only, its sides sealed.',
    },
    {
      id: 'waterDensity',
      label: 'Density of water',
      kind: 'density',
      default: 1000,
      min: 950,
      max: 1050,
      help: 'Turns the coefficient into a sorptivity; ASTM C1585 takes 0.001 g/mm³ (1000 kg/m³, from memory).',
    },
  ],
  outputs: [
    {
      id: 'absorptionCoefficient',
      label: 'Water absorption coefficient A_w',
      kind: 'absorptionCoefficient',
      display: { si: 'kg/(m2*s^0.5)', us: 'lb/(ft2*h^0.5)' },
    },
    {
      id: 'absorptionCoefficientPerRootHour',
      label: 'Water absorption coefficient per √h',
      kind: 'absorptionCoefficient',
      display: { si: 'kg/(m2*h^0.5)', us: 'lb/(ft2*h^0.5)' },
    },
    {
      id: 'sorptivity',
      label: 'Sorptivity S',
      kind: 'sorptivity',
      display: { si: 'mm/s^0.5', us: 'in/min^0.5' },
    },
    {
      id: 'intercept',
      label: 'Intercept of the line at t = 0',
      kind: 'arealMass',
      help: 'Water taken up at once by open pores of the face.',
    },
    { id: 'rSquared', label: 'Coefficient of determination R²', kind: 'dimensionless' },
    { id: 'pointsInFit', label: 'Readings in the fit', kind: 'dimensionless' },
  ],
  headline: {
    rules: [
      {
        output: 'absorptionCoefficient',
        text: 'The readings give a water absorption coefficient of about {value}.',
      },
    ],
    missing: 'absorption coefficient',
  },
  warnings: [
    {
      code: 'TOO_FEW_POINTS_IN_FIT',
      summary: `Fewer than ${MIN_POINTS_IN_FIT} readings in the method's fit window: no rate is given.`,
    },
    { code: 'NO_UPTAKE', summary: 'The fitted line does not rise: no rate is given.' },
    {
      code: 'NOT_LINEAR',
      summary: `The fit's correlation coefficient is below ${MIN_CORRELATION} (ASTM C1585, from memory; our threshold for EN ISO 15148): no rate is given.`,
    },
    {
      code: 'SHORTER_THAN_TEST',
      summary: 'An EN ISO 15148 test whose last reading is before 24 h.',
    },
  ],
  solve,
  checkTable: (input, value) => tableIssues(input, value),
};

/** Runs this calculator alone (what a widget bundling one calculator calls); inputs in SI keyed by input id. */
export const run = /* @__PURE__ */ runner(calculator, explain);

/** Its numbers only (`compute`): no working, assumptions or input hash; what the widget's first result uses. */
export const compute = /* @__PURE__ */ computer(calculator);
