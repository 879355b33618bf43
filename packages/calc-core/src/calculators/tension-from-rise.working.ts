// The tension-from-rise calculator's working and assumptions, written from the notes its solve
// records (tension-from-rise.ts): carried by its texts, so the widget's first flight has none of
// this text.
import { q } from './shared.js';
import { capillaryLengthStep, gravityAssumption } from './shared-working.js';
import type { TensionFromRiseAssumed, TensionFromRiseNotes } from './tension-from-rise.js';
import type { Explain, StepWriters } from './types.js';

const RAYLEIGH = 'Rayleigh 1915, first order: r/3 of liquid held in the meniscus above its lowest point';

const steps: StepWriters<TensionFromRiseNotes> = {
  tension: ({ r, angleIn, m, rho, g, h, sigma }) => [
    {
      id: 'meniscus',
      label: 'Meniscus-weight correction',
      formula: 'δ = V_held / (π·r²); δ = r/3 at θ = 0',
      substituted: `r = ${q(r, 'm')}, θ = ${q(angleIn, 'deg')}`,
      value: m,
      unit: 'm',
      source: 'Rayleigh 1915 (r/3 at θ = 0); the same spherical-cap geometry for θ > 0, derived here',
    },
    {
      id: 'solved',
      label: 'Surface tension',
      formula: 'σ = ρ·g·r·(h + δ) / (2·cos θ)',
      substituted: `${q(rho, 'kg/m3')} × ${q(g, 'm/s2')} × ${q(r, 'm')} × (${q(h, 'm')} + ${q(m, 'm')}) / (2 × cos ${q(angleIn, 'deg')})`,
      value: sigma,
      unit: 'N/m',
      source: RAYLEIGH,
    },
  ],
  wettingRise: ({ sigma, rho, g, d, r, wetting }) => [
    {
      id: 'wetting-rise',
      label: 'Rise of a fully wetting liquid (θ = 0) in this bore',
      formula: 'h₀ = 4·σ / (ρ·g·d) − r/3',
      substituted: `4 × ${q(sigma, 'N/m')} / (${q(rho, 'kg/m3')} × ${q(g, 'm/s2')} × ${q(d, 'm')}) − ${q(r, 'm')}/3`,
      value: wetting,
      unit: 'm',
      source: RAYLEIGH,
    },
  ],
  angle: ({ h, angle, delta }) => [
    {
      id: 'solved',
      label: 'Contact angle',
      formula: 'θ such that h = 4·σ·cos θ / (ρ·g·d) − δ(θ), solved by bisection over 0–90°',
      substituted: `h = ${q(h, 'm')}: θ = ${q(angle, 'deg')}, δ(θ) = ${q(delta, 'm')}`,
      value: angle,
      unit: 'deg',
      source: "Jurin's law with Rayleigh's meniscus correction (its geometry for θ > 0 derived here)",
    },
  ],
  size: ({ sigma, rho, g, lc, r, ratio }) => [
    capillaryLengthStep(sigma, rho, g, lc),
    {
      id: 'size-ratio',
      label: 'Bore radius against the capillary length',
      formula: 'r / ℓc',
      substituted: `${q(r, 'm')} / ${q(lc, 'm')}`,
      value: ratio,
      unit: '1',
      source: 'Rayleigh 1915 (the first-order correction needs r ≪ ℓc)',
    },
  ],
};

function assumptions({ tension, angleIn, sigma, g }: TensionFromRiseAssumed): string[] {
  return [
    'Static equilibrium: the meniscus has stopped moving (read after it has risen and, better, after it has been let fall back to the same height).',
    'A clean, round, uniform, vertical bore dipping into a reservoir wide enough for its surface to be flat.',
    'The rise is measured from the flat reservoir surface to the bottom of the meniscus.',
    tension
      ? `A contact angle of ${q(angleIn, 'deg')} between the liquid and the tube, known independently.`
      : `A surface tension of ${q(sigma, 'N/m')}, measured on the same liquid.`,
    'Air density neglected against the liquid density.',
    gravityAssumption(g),
  ];
}

export const explain: Explain = { steps, assumptions };
