import {
  platePerimeter,
  RING_TABLE_RANGE,
  ringCorrection,
  type RingCorrection,
  wilhelmyForce,
  wilhelmyRodForce,
  wilhelmyRodSurfaceTension,
  wilhelmySurfaceTension,
  ZUIDEMA_WATERS,
} from '../formulas/tensiometry.js';
import { computer } from './engine.js';
import { runner } from './run.js';
import {
  choice,
  CONTACT_ANGLE_NEAR_90,
  fmt,
  gravityInput,
  MM,
  nearNinety,
  noteTaker,
  num,
  q,
  quantityInput,
  warning,
  withFieldNames,
} from './shared.js';
import { liquidInputs, resolveLiquid, type ResolvedLiquid } from './shared-liquid.js';
import { explain } from './wetting-force.working.js';
import type {
  Caution,
  CalculatorCore,
  Condition,
  InputValues,
  QuantityInput,
  Solution,
  Warning,
} from './types.js';

type Method = 'plate-force' | 'plate-tension' | 'rod-force' | 'rod-tension' | 'ring';

const forward = [{ input: 'method', values: ['plate-force', 'rod-force'] }] as const;
const plateInverse = [{ input: 'method', values: ['plate-tension'] }] as const;
const rodInverse = [{ input: 'method', values: ['rod-tension'] }] as const;
const plateOrRod = [
  { input: 'method', values: ['plate-force', 'plate-tension', 'rod-force', 'rod-tension'] },
] as const;
const plate = [{ input: 'method', values: ['plate-force', 'plate-tension'] }] as const;
const rod = [{ input: 'method', values: ['rod-force', 'rod-tension'] }] as const;
const ring = [{ input: 'method', values: ['ring'] }] as const;

/** ASTM D971: the ring's circumference is at least 40 mm. */
const ASTM_MIN_RING_CIRCUMFERENCE_M = 0.04;
const PLATE_FIELDS = { width: 'plateWidth', thickness: 'plateThickness' } as const;
const ROD_FIELDS = { diameter: 'rodDiameter' } as const;

/** What wetting-force.working.ts writes each step of the working from, by note key. */
export interface WettingForceNotes {
  readonly ring: {
    readonly F: number;
    readonly R: number;
    readonly r: number;
    readonly drho: number;
    readonly g: number;
    readonly x: RingCorrection;
    /** The range of the ring tables and the fit's coefficients (the working prints them). */
    readonly table: typeof RING_TABLE_RANGE;
    readonly fit: typeof ZUIDEMA_WATERS;
  };
  readonly ringFactor: {
    readonly radicand: number;
    readonly root: number;
    readonly factor: number;
    readonly apparent: number;
    /** The fit's constant term. */
    readonly base: number;
  };
  readonly perimeter: {
    readonly isPlate: boolean;
    readonly w: number;
    readonly t: number;
    readonly d: number;
    readonly perimeter: number;
  };
  readonly liquid: ResolvedLiquid;
  readonly force: {
    readonly s: number;
    readonly perimeter: number;
    readonly theta: number;
    readonly F: number;
  };
  readonly tension: {
    readonly F: number;
    readonly perimeter: number;
    readonly theta: number;
    readonly sigma: number;
  };
}

/** What the assumptions are written from. */
export type WettingForceAssumed =
  | { readonly ring: true; readonly g: number }
  | {
      readonly ring: false;
      readonly theta: number;
      readonly isPlate: boolean;
      readonly liquid: ResolvedLiquid | null;
    };

function solve(inputs: InputValues): Solution {
  const method = choice(inputs, 'method') as Method;
  // The working's text is written from these notes by wetting-force.working.ts (`calculate` only).
  const working = noteTaker<WettingForceNotes>();
  const warnings: Warning[] = [];
  let assumedLiquid: ResolvedLiquid | null = null;
  let force: number | null = null;
  let sigma: number | null = null;
  let apparent: number | null = null;
  let factor: number | null = null;
  let perimeter: number;

  let assumed: WettingForceAssumed;
  let hazards: Caution[] = [];
  if (method === 'ring') {
    const F = num(inputs, 'ringForce');
    const R = num(inputs, 'ringRadius');
    const r = num(inputs, 'wireRadius');
    const drho = num(inputs, 'densityDifference');
    const g = num(inputs, 'gravity');
    const x = withFieldNames({ force: 'ringForce' }, () =>
      ringCorrection({ force: F, ringRadius: R, wireRadius: r, densityDifference: drho, gravity: g }),
    );
    perimeter = 4 * Math.PI * R;
    apparent = x.apparent;
    const t = RING_TABLE_RANGE;
    const applies = x.inTableRange && x.factor !== null;
    factor = applies ? x.factor : null;
    sigma = applies && x.factor !== null ? x.factor * x.apparent : null;
    working.add('ring', { F, R, r, drho, g, x, table: t, fit: ZUIDEMA_WATERS });
    if (applies && x.root !== null && x.factor !== null) {
      working.add('ringFactor', {
        radicand: x.radicand,
        root: x.root,
        factor: x.factor,
        apparent: x.apparent,
        base: ZUIDEMA_WATERS.base,
      });
    }
    if (!applies) {
      const why: string[] = [];
      if (x.ringToWire < t.ringToWire.min || x.ringToWire > t.ringToWire.max) {
        why.push(`R/r = ${fmt(x.ringToWire)} is outside ${t.ringToWire.min}–${t.ringToWire.max}`);
      }
      if (x.r3OverV < t.r3OverV.min || x.r3OverV > t.r3OverV.max) {
        why.push(`R³/V = ${fmt(x.r3OverV)} is outside ${t.r3OverV.min}–${t.r3OverV.max}`);
      }
      if (x.factor === null) why.push(`the radicand is negative (${fmt(x.radicand)})`);
      warnings.push(
        warning(
          'RING_OUTSIDE_CORRECTION_RANGE',
          `The ring correction does not hold here: ${why.join('; ')}. The Zuidema–Waters fit reproduces the Harkins & Jordan tables only over their range (from memory), so no corrected value is given; the uncorrected F/(4πR) stands alone.`,
          ['ringRadius', 'wireRadius', 'ringForce', 'densityDifference'],
          {
            step: x.factor === null ? 'ring-radicand' : 'ring-range',
            withholds: ['surfaceTension', 'correctionFactor'],
          },
        ),
      );
    } else if (x.factor !== null && (x.factor < t.factor.min || x.factor > t.factor.max)) {
      warnings.push(
        warning(
          'RING_FACTOR_OUTSIDE_TABLES',
          `A factor of ${fmt(x.factor)} is outside the ${t.factor.min}–${t.factor.max} that the Harkins & Jordan tables give (from memory): check the ring dimensions and the density difference.`,
          ['ringRadius', 'wireRadius', 'densityDifference'],
          { step: 'ring-factor' },
        ),
      );
    }
    if (drho < 100) {
      warnings.push(
        warning(
          'DENSITY_DIFFERENCE_IMPLAUSIBLE',
          `A density difference of ${q(drho, 'kg/m3')} (${fmt(drho / 1000)} g/mL) is below 100 kg/m³. Against air it is the liquid's own density (about 1000 kg/m³ for water): a value in g/mL typed as kg/m³ gives this. Only two liquids of near-equal density come this close.`,
          ['densityDifference'],
          { step: 'lifted-volume' },
        ),
      );
    }
    if (2 * Math.PI * R < ASTM_MIN_RING_CIRCUMFERENCE_M) {
      warnings.push(
        warning(
          'RING_BELOW_ASTM_SIZE',
          `The ring's circumference is ${q(2 * Math.PI * R, 'm')}; ASTM D971 specifies at least 40 mm, and the Zuidema–Waters fit was made for such rings.`,
          ['ringRadius'],
          { step: 'apparent' },
        ),
      );
    }
    assumed = { ring: true, g };
  } else {
    const theta = num(inputs, 'contactAngleDeg');
    const isPlate = method === 'plate-force' || method === 'plate-tension';
    const w = isPlate ? num(inputs, 'plateWidth') : 0;
    const t = isPlate ? num(inputs, 'plateThickness') : 0;
    const d = isPlate ? 0 : num(inputs, 'rodDiameter');
    perimeter = isPlate ? platePerimeter(w, t) : Math.PI * d;
    working.add('perimeter', { isPlate, w, t, d, perimeter });
    if (method === 'plate-force' || method === 'rod-force') {
      const liquid = resolveLiquid(inputs, {});
      working.first('liquid', liquid);
      if (liquid.hazard !== undefined) hazards = [liquid.hazard];
      assumedLiquid = liquid;
      const s = liquid.surfaceTension;
      force = isPlate
        ? wilhelmyForce({ surfaceTension: s, contactAngleDeg: theta, width: w, thickness: t })
        : wilhelmyRodForce({ surfaceTension: s, contactAngleDeg: theta, diameter: d });
      working.add('force', { s, perimeter, theta, F: force });
    } else {
      const F = num(inputs, isPlate ? 'force' : 'rodForce');
      sigma = isPlate
        ? withFieldNames(PLATE_FIELDS, () =>
            wilhelmySurfaceTension({ force: F, contactAngleDeg: theta, width: w, thickness: t }),
          )
        : withFieldNames({ ...ROD_FIELDS, force: 'rodForce' }, () =>
            wilhelmyRodSurfaceTension({ force: F, contactAngleDeg: theta, diameter: d }),
          );
      working.add('tension', { F, perimeter, theta, sigma });
      if (theta > 0) {
        warnings.push(
          warning(
            'CONTACT_ANGLE_NOT_ZERO',
            `A contact angle of ${q(theta, 'deg')} is assumed. The plate method is normally run fully wetted (θ = 0, e.g. roughened platinum); any other angle must be known independently.`,
            ['contactAngleDeg'],
            { step: 'method' },
          ),
        );
      }
    }
    const near = nearNinety(theta, ['contactAngleDeg']);
    if (near !== null) warnings.push({ ...near, step: 'method' });
    assumed = { ring: false, theta, isPlate, liquid: assumedLiquid };
  }
  return {
    outputs: {
      force,
      surfaceTension: sigma,
      apparentSurfaceTension: apparent,
      correctionFactor: factor,
      wettedLength: perimeter,
    },
    warnings,
    band: null,
    notes: working.list,
    assumed,
    ...(hazards.length > 0 ? { hazards } : {}),
  };
}

function forceInput(id: string, label: string, defaultN: number, when: readonly Condition[]): QuantityInput {
  return quantityInput('force', id, label, defaultN, [1e-7, 1], {
    help: 'Net of the probe weight, at zero immersion depth.',
    appliesWhen: when,
    // Laboratories report force in mN in both unit systems.
    display: { si: 'mN', us: 'mN' },
  });
}

function lengthInput(
  id: string,
  label: string,
  defaultM: number,
  range: readonly [number, number],
  when: readonly Condition[],
): QuantityInput {
  return quantityInput('length', id, label, defaultM, range, { appliesWhen: when, display: MM });
}

export const calculator: CalculatorCore = {
  id: 'wetting-force',
  title: 'Wetting force (tensiometry)',
  summary:
    'Wilhelmy plate and rod, from surface tension to force and back, and the du Noüy ring with the Zuidema–Waters correction of ASTM D971 beside the uncorrected value.',
  inputs: [
    {
      id: 'method',
      label: 'Method',
      kind: 'choice',
      default: 'plate-tension',
      options: [
        { value: 'plate-tension', label: 'Wilhelmy plate: surface tension from the force' },
        { value: 'plate-force', label: 'Wilhelmy plate: force from the surface tension' },
        { value: 'rod-tension', label: 'Rod or fibre: surface tension from the force' },
        { value: 'rod-force', label: 'Rod or fibre: force from the surface tension' },
        { value: 'ring', label: 'du Noüy ring (ASTM D971 correction)' },
      ],
    },
    ...liquidInputs({ when: forward }),
    forceInput('force', 'Measured force on the plate', 2.9e-3, plateInverse),
    forceInput('rodForce', 'Measured force on the rod', 0.23e-3, rodInverse),
    {
      id: 'contactAngleDeg',
      label: 'Contact angle on the probe',
      kind: 'angle',
      default: 0,
      min: 0,
      max: 180,
      help: 'A clean roughened platinum plate is taken as fully wetted, 0° (common practice).',
      appliesWhen: plateOrRod,
    },
    lengthInput('plateWidth', 'Plate width', 0.02, [1e-4, 0.2], plate),
    lengthInput('plateThickness', 'Plate thickness', 1e-4, [0, 0.01], plate),
    lengthInput('rodDiameter', 'Rod diameter', 1e-3, [1e-5, 0.2], rod),
    forceInput('ringForce', 'Maximum pull on the ring', 9e-3, ring),
    {
      ...lengthInput('ringRadius', 'Mean ring radius R', 9.55e-3, [1e-3, 0.05], ring),
      help: 'Half the mean diameter; ASTM D971 rings have a circumference of at least 40 mm.',
    },
    lengthInput('wireRadius', 'Wire radius r', 0.2e-3, [1e-5, 1e-3], ring),
    quantityInput('density', 'densityDifference', 'Density difference of the two phases', 998, [1, 25000], {
      help: 'Lower phase minus upper; against air, the liquid density. ASTM D971 states it in g/mL.',
      appliesWhen: ring,
      display: { si: 'g/mL', us: 'g/mL' },
    }),
    gravityInput(ring),
  ],
  outputs: [
    { id: 'force', label: 'Wetting force', kind: 'force', display: { si: 'mN', us: 'mN' } },
    {
      id: 'surfaceTension',
      label: 'Surface tension',
      kind: 'surfaceTension',
      help: 'For the ring, the corrected value.',
    },
    { id: 'apparentSurfaceTension', label: 'Uncorrected ring value F/(4πR)', kind: 'surfaceTension' },
    { id: 'correctionFactor', label: 'Correction factor f', kind: 'dimensionless' },
    { id: 'wettedLength', label: 'Wetted length', kind: 'length', display: { si: 'mm', us: 'in' } },
  ],
  headline: {
    rules: [
      {
        when: [{ input: 'method', values: ['plate-force'] }],
        output: 'force',
        text: 'The liquid pulls on the plate with about {value}.',
      },
      {
        when: [{ input: 'method', values: ['rod-force'] }],
        output: 'force',
        text: 'The liquid pulls on the rod with about {value}.',
      },
      { output: 'surfaceTension', text: 'The surface tension is about {value}.' },
    ],
    missing: 'corrected surface tension',
  },
  warnings: [
    { code: 'CONTACT_ANGLE_NOT_ZERO' },
    CONTACT_ANGLE_NEAR_90,
    { code: 'RING_BELOW_ASTM_SIZE' },
    {
      code: 'RING_OUTSIDE_CORRECTION_RANGE',
      summary:
        'R/r or R³/V is outside the range of the Harkins & Jordan tables (from memory: R/r 30–80, R³/V 0.3–4.5), or the radicand is negative: no corrected value is given.',
    },
    { code: 'RING_FACTOR_OUTSIDE_TABLES' },
    { code: 'DENSITY_DIFFERENCE_IMPLAUSIBLE' },
  ],
  solve,
};

/**
 * Runs this calculator alone, from its core (what the widget's engine calls); inputs in SI keyed by
 * input id. Its results carry the liquid's hazards but not the calculator's own cautions, which are in
 * its texts: `calculate` (the registry) gives them.
 */
export const run = /* @__PURE__ */ runner(calculator, explain);

/** Its numbers only (`compute`): no working, assumptions or input hash; what the widget's first result uses. */
export const compute = /* @__PURE__ */ computer(calculator);
