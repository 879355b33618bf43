import {
  platePerimeter,
  RING_TABLE_RANGE,
  ringCorrection,
  ZUIDEMA_WATERS,
  wilhelmyForce,
  wilhelmyRodForce,
  wilhelmyRodSurfaceTension,
  wilhelmySurfaceTension,
} from '../formulas/tensiometry.js';
import { computer } from './engine.js';
import { runner } from './run.js';
import {
  choice,
  coef,
  CONTACT_ANGLE_NEAR_90,
  fmt,
  gravityAssumption,
  gravityInput,
  laterWorking,
  MM,
  nearNinety,
  num,
  q,
  quantityInput,
  warning,
  withFieldNames,
} from './shared.js';
import { liquidInputs, resolveLiquid } from './shared-liquid.js';
import { STANDARD_GRAVITY } from '../units.js';
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

function solve(inputs: InputValues): Solution {
  const method = choice(inputs, 'method') as Method;
  const working = laterWorking();
  const warnings: Warning[] = [];
  // The liquid's assumption is written when the assumptions are read (`calculate`), never by `compute`.
  let liquidAssumption: (() => string) | null = null;
  let force: number | null = null;
  let sigma: number | null = null;
  let apparent: number | null = null;
  let factor: number | null = null;
  let perimeter: number;

  let assumptions: () => string[];
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
    const { base, k, c, m } = ZUIDEMA_WATERS;
    const applies = x.inTableRange && x.factor !== null;
    factor = applies ? x.factor : null;
    sigma = applies && x.factor !== null ? x.factor * x.apparent : null;
    working.add(() => [
      {
        id: 'apparent',
        label: 'Apparent surface tension (uncorrected)',
        formula: 'σ* = F / (4π·R)',
        substituted: `${q(F, 'N')} / (4π × ${q(R, 'm')})`,
        value: x.apparent,
        unit: 'N/m',
        source: 'du Noüy 1925',
      },
      {
        id: 'ring-ratio',
        label: 'Ring to wire radius',
        formula: 'R / r',
        substituted: `${q(R, 'm')} / ${q(r, 'm')}`,
        value: x.ringToWire,
        unit: '1',
        source: `Harkins & Jordan 1930: tables span R/r ${t.ringToWire.min}–${t.ringToWire.max} (from memory)`,
      },
      {
        id: 'lifted-volume',
        label: 'Volume of liquid lifted',
        formula: 'V = F / (Δρ·g)',
        substituted: `${q(F, 'N')} / (${q(drho, 'kg/m3')} × ${q(g, 'm/s2')})`,
        value: x.liftedVolume,
        unit: 'm3',
        source: 'Harkins & Jordan 1930',
      },
      {
        id: 'ring-range',
        label: 'Ring size against the lifted volume',
        formula: 'R³ / V',
        substituted: `(${q(R, 'm')})³ / ${q(x.liftedVolume, 'm3')}`,
        value: x.r3OverV,
        unit: '1',
        source: `Harkins & Jordan 1930: tables span R³/V ${t.r3OverV.min}–${t.r3OverV.max} (from memory)`,
      },
      {
        id: 'ring-radicand',
        label: 'Zuidema–Waters radicand',
        formula: `k·P·(gₙ/g) / (C²·(D − d)) + c − m·r/R; k = ${coef(k)}, c = ${coef(c)}, m = ${coef(m)}; P in dyn/cm, C in cm, D − d in g/mL`,
        substituted: `P = ${fmt(x.apparent * 1000)} dyn/cm, C = ${fmt(2 * Math.PI * R * 100)} cm, D − d = ${fmt(drho / 1000)} g/mL, gₙ/g = ${fmt(STANDARD_GRAVITY / g, 6)}, r/R = ${fmt(r / R)}`,
        value: x.radicand,
        unit: '1',
        source: 'Zuidema & Waters 1941 in the form of ASTM D971 (from memory)',
      },
    ]);
    if (applies && x.root !== null && x.factor !== null) {
      const { root, factor } = x;
      working.add(() => [
        {
          id: 'ring-factor',
          label: 'Zuidema–Waters correction factor',
          formula: `f = ${coef(base)} + √radicand`,
          substituted: `${coef(base)} + √${fmt(x.radicand)} = ${coef(base)} + ${fmt(root)}`,
          value: factor,
          unit: '1',
          source: 'Zuidema & Waters 1941 in the form of ASTM D971 (from memory)',
        },
        {
          id: 'ring-corrected',
          label: 'Surface tension, corrected',
          formula: 'σ = f·σ*',
          substituted: `${fmt(factor)} × ${q(x.apparent, 'N/m')}`,
          value: factor * x.apparent,
          unit: 'N/m',
          source: 'Harkins & Jordan 1930',
        },
      ]);
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
    assumptions = () => [
      'The maximum pull, net of the weight of the ring, read as the ring is drawn slowly through the surface.',
      'The ring is horizontal, round and fully wetted by the liquid (contact angle 0° on clean platinum).',
      'Clean liquid and a fresh surface: no surfactant, oil or dust.',
      'Against air the density difference is the liquid density; air density neglected.',
      gravityAssumption(g),
    ];
  } else {
    const theta = num(inputs, 'contactAngleDeg');
    const isPlate = method === 'plate-force' || method === 'plate-tension';
    const w = isPlate ? num(inputs, 'plateWidth') : 0;
    const t = isPlate ? num(inputs, 'plateThickness') : 0;
    const d = isPlate ? 0 : num(inputs, 'rodDiameter');
    perimeter = isPlate ? platePerimeter(w, t) : Math.PI * d;
    working.add(() => [
      {
        id: 'perimeter',
        source: 'geometry of the probe',
        label: 'Wetted length',
        formula: isPlate ? 'P = 2·(w + t)' : 'P = π·d',
        substituted: isPlate ? `2 × (${q(w, 'm')} + ${q(t, 'm')})` : `π × ${q(d, 'm')}`,
        value: perimeter,
        unit: 'm',
      },
    ]);
    if (method === 'plate-force' || method === 'rod-force') {
      const liquid = resolveLiquid(inputs, {});
      working.first(() => liquid.working);
      if (liquid.hazard !== undefined) hazards = [liquid.hazard];
      liquidAssumption = () => liquid.assumption;
      const s = liquid.surfaceTension;
      force = isPlate
        ? wilhelmyForce({ surfaceTension: s, contactAngleDeg: theta, width: w, thickness: t })
        : wilhelmyRodForce({ surfaceTension: s, contactAngleDeg: theta, diameter: d });
      const F = force;
      working.add(() => [
        {
          id: 'method',
          source: 'Wilhelmy 1863',
          label: 'Wetting force',
          formula: 'F = σ·P·cos θ',
          substituted: `${q(s, 'N/m')} × ${q(perimeter, 'm')} × cos ${q(theta, 'deg')}`,
          value: F,
          unit: 'N',
        },
      ]);
    } else {
      const F = num(inputs, isPlate ? 'force' : 'rodForce');
      sigma = isPlate
        ? withFieldNames(PLATE_FIELDS, () =>
            wilhelmySurfaceTension({ force: F, contactAngleDeg: theta, width: w, thickness: t }),
          )
        : withFieldNames({ ...ROD_FIELDS, force: 'rodForce' }, () =>
            wilhelmyRodSurfaceTension({ force: F, contactAngleDeg: theta, diameter: d }),
          );
      const found = sigma;
      working.add(() => [
        {
          id: 'method',
          source: 'Wilhelmy 1863',
          label: 'Surface tension',
          formula: 'σ = F / (P·cos θ)',
          substituted: `${q(F, 'N')} / (${q(perimeter, 'm')} × cos ${q(theta, 'deg')})`,
          value: found,
          unit: 'N/m',
        },
      ]);
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
    assumptions = () => [
      'The force is read at zero immersion depth, net of the weight of the probe: buoyancy is not included.',
      `A contact angle of ${q(theta, 'deg')} on the probe, known independently (0° for a clean roughened platinum plate, common practice).`,
      'Clean liquid and a fresh surface: no surfactant, oil or dust.',
      isPlate
        ? 'A thin rectangular plate wetted along its whole perimeter 2·(w + t).'
        : 'A round rod or fibre wetted around its circumference π·d.',
      ...(liquidAssumption !== null ? [liquidAssumption()] : []),
    ];
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
    // Written only when read (`calculate`), never by `compute`.
    get working() {
      return working.build();
    },
    get assumptions() {
      return assumptions();
    },
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
    {
      code: 'CONTACT_ANGLE_NOT_ZERO',
      summary: 'A non-zero contact angle is assumed for a plate or rod reading.',
    },
    CONTACT_ANGLE_NEAR_90,
    {
      code: 'RING_BELOW_ASTM_SIZE',
      summary: 'The ring is smaller than the 40 mm circumference of ASTM D971.',
    },
    {
      code: 'RING_OUTSIDE_CORRECTION_RANGE',
      summary:
        'R/r or R³/V is outside the range of the Harkins & Jordan tables (from memory: R/r 30–80, R³/V 0.3–4.5), or the radicand is negative: no corrected value is given.',
    },
    {
      code: 'RING_FACTOR_OUTSIDE_TABLES',
      summary: 'The correction factor is outside the 0.75–1.05 band of the tables (from memory).',
    },
    {
      code: 'DENSITY_DIFFERENCE_IMPLAUSIBLE',
      summary: 'A density difference below 100 kg/m³: against air, likely a g/mL value typed as kg/m³.',
    },
  ],
  solve,
};

/**
 * Runs this calculator alone, from its core (what the widget's engine calls); inputs in SI keyed by
 * input id. Its results carry the liquid's hazards but not the calculator's own cautions, which are in
 * its texts: `calculate` (the registry) gives them.
 */
export const run = /* @__PURE__ */ runner(calculator);

/** Its numbers only (`compute`): no working, assumptions or input hash; what the widget's first result uses. */
export const compute = /* @__PURE__ */ computer(calculator);
