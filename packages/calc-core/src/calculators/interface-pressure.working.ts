// The interface-pressure calculator's working and assumptions, written from the notes its solve
// records (interface-pressure.ts): carried by its texts, so the widget's first flight has none of
// this text.
import { num, q } from './shared.js';
import { capillaryLengthStep, gravityAssumption, STATIC_ASSUMPTIONS } from './shared-working.js';
import type { InterfacePressureAssumed, InterfacePressureNotes, Shape } from './interface-pressure.js';
import type { Explain, InputValues, StepWriters } from './types.js';

const FORMULAS: Readonly<Record<Shape, string>> = {
  drop: 'Δp = 2·σ / R',
  'film-bubble': 'Δp = 4·σ / R',
  jet: 'Δp = σ / R',
  general: 'Δp = σ·(1/R₁ + 1/R₂)',
  pore: 'P_c = 2·σ·cos θ / r',
};

/** The pressure's formula with the numbers put in, for each shape. */
function substituted(shape: Shape, sigma: number, theta: number, inputs: InputValues): string {
  switch (shape) {
    case 'drop':
      return `2 × ${q(sigma, 'N/m')} / ${q(num(inputs, 'radius'), 'm')}`;
    case 'film-bubble':
      return `4 × ${q(sigma, 'N/m')} / ${q(num(inputs, 'radius'), 'm')}`;
    case 'jet':
      return `${q(sigma, 'N/m')} / ${q(num(inputs, 'radius'), 'm')}`;
    case 'general':
      return `${q(sigma, 'N/m')} × (1/${q(num(inputs, 'r1'), 'm')} + 1/${q(num(inputs, 'r2'), 'm')})`;
    case 'pore':
      return `2 × ${q(sigma, 'N/m')} × cos ${q(theta, 'deg')} / ${q(num(inputs, 'poreRadius'), 'm')}`;
  }
}

const steps: StepWriters<InterfacePressureNotes> = {
  shared: ({ liquid, angle }) => [...liquid.working, ...(angle?.working ?? [])],
  capillaryLength: ({ sigma, rho, g, lc }) => [capillaryLengthStep(sigma, rho, g, lc)],
  pressure: ({ shape, sigma, theta, rho, g, p, head }, inputs) => [
    {
      id: 'pressure',
      label: shape === 'pore' ? 'Capillary (entry) pressure of the pore' : 'Pressure across the interface',
      formula: FORMULAS[shape],
      substituted: substituted(shape, sigma, theta, inputs),
      value: p,
      unit: 'Pa',
      source: 'Young–Laplace equation (Young 1805, Laplace 1806)',
    },
    {
      id: 'head',
      label: 'As a head of the liquid',
      formula: 'Δp / (ρ·g)',
      substituted: `${q(p, 'Pa')} / (${q(rho, 'kg/m3')} × ${q(g, 'm/s2')})`,
      value: head,
      unit: 'm',
      source: 'hydrostatics, p = ρ·g·h',
    },
  ],
};

const SHAPES: Readonly<Record<Shape, string>> = {
  drop: 'A spherical drop: one radius of curvature, the same everywhere.',
  'film-bubble': 'A thin-film bubble with two surfaces of the same radius.',
  jet: 'A long cylindrical jet: one radius, the other infinite.',
  general: 'The two principal radii of curvature as entered, at the point of interest.',
  pore: 'A cylindrical pore of the radius entered, with a hemispherical meniscus at the contact angle.',
};

function assumptions({ shape, liquid, angle, g }: InterfacePressureAssumed): string[] {
  return [
    ...STATIC_ASSUMPTIONS,
    SHAPES[shape],
    liquid.assumption,
    ...(angle !== null ? [angle.assumption] : []),
    gravityAssumption(g),
  ];
}

export const explain: Explain = { steps, assumptions };
