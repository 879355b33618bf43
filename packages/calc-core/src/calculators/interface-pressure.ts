import { capillaryLength } from '../formulas/jurin.js';
import { bubblePressure, laplacePressure, poreEntryPressure } from '../formulas/laplace.js';
import { bandOver, computer } from './engine.js';
import { runner } from './run.js';
import {
  ANGLE_FIELDS,
  choice,
  CONTACT_ANGLE_NEAR_90,
  fmt,
  gravityInput,
  nearNinety,
  MM,
  num,
  q,
  quantityInput,
  warning,
  solved,
  noteTaker,
} from './shared.js';
import {
  contactAngleInputs,
  liquidInputs,
  resolveContactAngle,
  resolveLiquid,
  type ResolvedAngle,
  type ResolvedLiquid,
} from './shared-liquid.js';
import { explain } from './interface-pressure.working.js';
import type { CalculatorCore, InputValues, Outputs, QuantityInput, Solution, Warning } from './types.js';

export type Shape = 'drop' | 'film-bubble' | 'jet' | 'general' | 'pore';

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

/** What interface-pressure.working.ts writes each step of the working from, by note key. */
export interface InterfacePressureNotes {
  readonly shared: { readonly liquid: ResolvedLiquid; readonly angle: ResolvedAngle | null };
  readonly capillaryLength: {
    readonly sigma: number;
    readonly rho: number;
    readonly g: number;
    readonly lc: number;
  };
  readonly pressure: {
    readonly shape: Shape;
    readonly sigma: number;
    readonly theta: number;
    readonly rho: number;
    readonly g: number;
    readonly p: number;
    readonly head: number;
  };
}

/** What the assumptions are written from. */
export interface InterfacePressureAssumed {
  readonly shape: Shape;
  readonly liquid: ResolvedLiquid;
  readonly angle: ResolvedAngle | null;
  readonly g: number;
}

function solve(inputs: InputValues): Solution {
  const shape = choice(inputs, 'shape') as Shape;
  const liquid = resolveLiquid(inputs, { density: true });
  const sigma = liquid.surfaceTension;
  const rho = liquid.density;
  const g = num(inputs, 'gravity');
  const angle = shape === 'pore' ? resolveContactAngle(inputs, liquid.id) : null;

  const pressureAt = (theta: number): number => {
    switch (shape) {
      case 'drop':
        return laplacePressure({ surfaceTension: sigma, r1: num(inputs, 'radius') });
      case 'film-bubble':
        return bubblePressure({ surfaceTension: sigma, radius: num(inputs, 'radius') });
      case 'jet':
        return laplacePressure({ surfaceTension: sigma, r1: num(inputs, 'radius'), r2: Infinity });
      case 'general':
        return laplacePressure({ surfaceTension: sigma, r1: num(inputs, 'r1'), r2: num(inputs, 'r2') });
      case 'pore':
        return poreEntryPressure({
          surfaceTension: sigma,
          contactAngleDeg: theta,
          poreRadius: num(inputs, 'poreRadius'),
        });
    }
  };
  const evaluate = (theta: number): Outputs => {
    const p = pressureAt(theta);
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

  // The working's text is written from these notes by interface-pressure.working.ts (`calculate` only).
  const working = noteTaker<InterfacePressureNotes>();
  working.add('shared', { liquid, angle });
  if (shape === 'drop') working.add('capillaryLength', { sigma, rho, g, lc });
  if (!flattened)
    working.add('pressure', { shape, sigma, theta, rho, g, p, head: computed.pressureHead ?? 0 });

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
  return solved(
    { outputs, warnings, band, notes: working.list, assumed: { shape, liquid, angle, g } },
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
    { code: 'PORE_NON_WETTING' },
    CONTACT_ANGLE_NEAR_90,
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
