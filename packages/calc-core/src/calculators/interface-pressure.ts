import { capillaryLength } from '../formulas/capillary.js';
import { bubblePressure, laplacePressure, poreEntryPressure } from '../formulas/laplace.js';
import { bandOver, computer } from './engine.js';
import { runner } from './run.js';
import {
  ANGLE_FIELDS,
  choice,
  CONTACT_ANGLE_NEAR_90,
  fmt,
  gravityAssumption,
  gravityInput,
  STATIC_ASSUMPTIONS,
  nearNinety,
  MM,
  num,
  q,
  quantityInput,
  warning,
  capillaryLengthStep,
  solvedLegacy,
  laterWorking,
} from './shared.js';
import { contactAngleInputs, liquidInputs, resolveContactAngle, resolveLiquid } from './shared-liquid.js';
import type { CalculatorCore, InputValues, Outputs, QuantityInput, Solution, Warning } from './types.js';

type Shape = 'drop' | 'film-bubble' | 'jet' | 'general' | 'pore';

const oneRadius = [{ input: 'shape', values: ['drop', 'film-bubble', 'jet'] }] as const;
const whenGeneral = [{ input: 'shape', values: ['general'] }] as const;
const whenPore = [{ input: 'shape', values: ['pore'] }] as const;

function radiusInput(
  id: string,
  label: string,
  defaultM: number,
  when: QuantityInput['appliesWhen'],
): QuantityInput {
  return quantityInput('length', id, label, defaultM, [1e-9, 1], {
    display: MM,
    ...(when !== undefined ? { appliesWhen: when } : {}),
  });
}

const FORMULAS: Readonly<Record<Shape, string>> = {
  drop: 'Δp = 2·σ / R',
  'film-bubble': 'Δp = 4·σ / R',
  jet: 'Δp = σ / R',
  general: 'Δp = σ·(1/R₁ + 1/R₂)',
  pore: 'P_c = 2·σ·cos θ / r',
};

function solve(inputs: InputValues): Solution {
  const shape = choice(inputs, 'shape') as Shape;
  const liquid = resolveLiquid(inputs, { density: true });
  const sigma = liquid.surfaceTension;
  const rho = liquid.density;
  const g = num(inputs, 'gravity');
  const angle = shape === 'pore' ? resolveContactAngle(inputs, liquid.id) : null;

  const pressureAt = (theta: number): { value: number; substituted: string } => {
    switch (shape) {
      case 'drop': {
        const R = num(inputs, 'radius');
        return {
          value: laplacePressure({ surfaceTension: sigma, r1: R }),
          substituted: `2 × ${q(sigma, 'N/m')} / ${q(R, 'm')}`,
        };
      }
      case 'film-bubble': {
        const R = num(inputs, 'radius');
        return {
          value: bubblePressure({ surfaceTension: sigma, radius: R }),
          substituted: `4 × ${q(sigma, 'N/m')} / ${q(R, 'm')}`,
        };
      }
      case 'jet': {
        const R = num(inputs, 'radius');
        return {
          value: laplacePressure({ surfaceTension: sigma, r1: R, r2: Infinity }),
          substituted: `${q(sigma, 'N/m')} / ${q(R, 'm')}`,
        };
      }
      case 'general': {
        const r1 = num(inputs, 'r1');
        const r2 = num(inputs, 'r2');
        return {
          value: laplacePressure({ surfaceTension: sigma, r1, r2 }),
          substituted: `${q(sigma, 'N/m')} × (1/${q(r1, 'm')} + 1/${q(r2, 'm')})`,
        };
      }
      case 'pore': {
        const r = num(inputs, 'poreRadius');
        return {
          value: poreEntryPressure({ surfaceTension: sigma, contactAngleDeg: theta, poreRadius: r }),
          substituted: `2 × ${q(sigma, 'N/m')} × cos ${q(theta, 'deg')} / ${q(r, 'm')}`,
        };
      }
    }
  };
  const evaluate = (theta: number): Outputs => {
    const p = pressureAt(theta).value;
    return { pressure: p, pressureHead: p / (rho * g) };
  };
  const theta = angle?.angleDeg ?? 0;
  // A resting drop as wide as the capillary length is flattened: one radius does not describe it,
  // so neither figure is given (the Bond number (R/ℓc)² is at least 1).
  const lc = capillaryLength({ surfaceTension: sigma, density: rho, gravity: g });
  const flattened = shape === 'drop' && num(inputs, 'radius') >= lc;
  const computed = evaluate(theta);
  const outputs: Outputs = flattened ? { pressure: null, pressureHead: null } : computed;
  const p = computed.pressure ?? 0;

  const working = laterWorking(() => [...liquid.working, ...(angle?.working ?? [])]);
  if (shape === 'drop') {
    working.add(() => [capillaryLengthStep(sigma, rho, g, lc)]);
  }
  if (!flattened) {
    working.add(() => [
      {
        id: 'pressure',
        label: shape === 'pore' ? 'Capillary (entry) pressure of the pore' : 'Pressure across the interface',
        formula: FORMULAS[shape],
        substituted: pressureAt(theta).substituted,
        value: p,
        unit: 'Pa',
        source: 'Young–Laplace equation (Young 1805, Laplace 1806)',
      },
      {
        id: 'head',
        label: 'As a head of the liquid',
        formula: 'Δp / (ρ·g)',
        substituted: `${q(p, 'Pa')} / (${q(rho, 'kg/m3')} × ${q(g, 'm/s2')})`,
        value: computed.pressureHead ?? 0,
        unit: 'm',
        source: 'hydrostatics, p = ρ·g·h',
      },
    ]);
  }

  const warnings: Warning[] = [];
  if (flattened) {
    const R = num(inputs, 'radius');
    warnings.push(
      warning(
        'SHAPE_NOT_SPHERICAL',
        `A radius of ${q(R, 'm')} is at least the capillary length (${q(lc, 'm')}): a resting drop of this size is flattened by gravity and one radius does not describe it (Bond number ${fmt((R / lc) ** 2)}), so no pressure is given.`,
        ['radius'],
        { step: 'capillary-length', withholds: ['pressure', 'pressureHead'] },
      ),
    );
  }
  if (shape === 'pore') {
    if (theta > 90) {
      warnings.push(
        warning(
          'PORE_NON_WETTING',
          'The liquid does not wet the pore (θ > 90°): the negative value is the pressure needed to push the liquid in.',
          ANGLE_FIELDS,
          { step: 'pressure' },
        ),
      );
    }
    const near = nearNinety(theta);
    if (near !== null) warnings.push({ ...near, step: 'pressure' });
  }
  const band = bandOver(angle?.basis ?? [], outputs, (v) => evaluate(v.contactAngleDeg ?? theta));
  const shapes: Readonly<Record<Shape, string>> = {
    drop: 'A spherical drop: one radius of curvature, the same everywhere.',
    'film-bubble': 'A thin-film bubble with two surfaces of the same radius.',
    jet: 'A long cylindrical jet: one radius, the other infinite.',
    general: 'The two principal radii of curvature as entered, at the point of interest.',
    pore: 'A cylindrical pore of the radius entered, with a hemispherical meniscus at the contact angle.',
  };
  const assumptions = (): string[] => [
    ...STATIC_ASSUMPTIONS,
    shapes[shape],
    liquid.assumption,
    ...(angle !== null ? [angle.assumption] : []),
    gravityAssumption(g),
  ];
  return solvedLegacy(
    { outputs, warnings, band, explain: () => ({ working: working.build(), assumptions: assumptions() }) },
    liquid,
  );
}

export const calculator: CalculatorCore = {
  id: 'interface-pressure',
  title: 'Pressure across a curved interface',
  summary:
    'Young–Laplace pressure difference across a drop, a soap bubble, a jet or any surface with two radii, and the capillary (air-entry) pressure of a pore.',
  inputs: [
    {
      id: 'shape',
      label: 'Interface',
      kind: 'choice',
      default: 'drop',
      options: [
        { value: 'drop', label: 'Drop, or gas bubble inside a liquid (one surface)', help: 'Δp = 2σ/R' },
        { value: 'film-bubble', label: 'Soap bubble (thin film, two surfaces)', help: 'Δp = 4σ/R' },
        { value: 'jet', label: 'Cylindrical jet or thread', help: 'Δp = σ/R' },
        { value: 'general', label: 'Any surface, two principal radii', help: 'Δp = σ(1/R₁ + 1/R₂)' },
        { value: 'pore', label: 'Air-entry pressure of a pore', help: 'P_c = 2σ cos θ / r' },
      ],
    },
    ...liquidInputs({ density: true }),
    radiusInput('radius', 'Radius', 1e-3, oneRadius),
    radiusInput('r1', 'First principal radius R₁', 1e-3, whenGeneral),
    radiusInput('r2', 'Second principal radius R₂', 2e-3, whenGeneral),
    {
      ...radiusInput('poreRadius', 'Pore radius', 1e-6, whenPore),
      max: 0.01,
      display: { si: 'um', us: 'in' },
    },
    ...contactAngleInputs({
      presetIds: ['water-mineral-grains', 'water-clean-glass', 'mercury-glass'],
      defaultPreset: 'water-mineral-grains',
      when: whenPore,
    }),
    gravityInput(),
  ],
  outputs: [
    {
      id: 'pressure',
      label: 'Pressure difference',
      kind: 'pressure',
      help: 'Higher on the concave side; for a pore, the suction the meniscus holds.',
      display: { si: 'kPa', us: 'psi' },
    },
    {
      id: 'pressureHead',
      label: 'As a head of the liquid',
      kind: 'length',
      help: 'Δp/(ρ g): for a pore, the equivalent capillary rise.',
    },
  ],
  headline: {
    rules: [
      {
        when: whenPore,
        output: 'pressure',
        text: 'Air needs about {value} to push into a pore {input.poreRadius} in radius.',
        atOrBelow: 'The liquid needs about {value} to be pushed into a pore {input.poreRadius} in radius.',
      },
      { output: 'pressure', text: 'The pressure on the inner, concave side is about {value} higher.' },
    ],
    missing: 'pressure',
  },
  warnings: [
    {
      code: 'SHAPE_NOT_SPHERICAL',
      summary: 'A drop at least as large as the capillary length is flattened by gravity.',
    },
    { code: 'PORE_NON_WETTING', summary: 'θ > 90°: the liquid must be pushed into the pore.' },
    CONTACT_ANGLE_NEAR_90,
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
