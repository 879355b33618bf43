// The wicking-time calculator's working and assumptions, written from the notes its solve records
// (wicking-time.ts): carried by its texts, so the widget's first flight has none of this text.
import { fmt, q } from './shared.js';
import { capillaryLengthStep, gravityAssumption } from './shared-working.js';
import type { Explain, StepWriters } from './types.js';
import type { WickingTimeAssumed, WickingTimeNotes } from './wicking-time.js';

const WASHBURN = 'Lucas 1918; Washburn 1921';
const BOSANQUET = 'Bosanquet 1923';

const steps: StepWriters<WickingTimeNotes> = {
  base: ({ liquid, angle, sigma, rho, g, lc }) => [
    ...liquid.working,
    ...angle.working,
    capillaryLengthStep(sigma, rho, g, lc, 'Capillary length (the pore must be well below it)'),
  ],
  washburn: ({ mu, L, sigma, r, rho, theta, vertical, time, inertial, inertiaRatio }) => [
    {
      id: 'washburn',
      label: 'Time, Lucas–Washburn (gravity and inertia neglected)',
      formula: 't = 2·μ·L² / (σ·r·cos θ)',
      substituted: `2 × ${q(mu, 'Pa*s')} × (${q(L, 'm')})² / (${q(sigma, 'N/m')} × ${q(r, 'm')} × cos ${q(theta, 'deg')})`,
      value: time,
      unit: 's',
      source: WASHBURN,
    },
    {
      id: 'inertia-scale',
      label: 'Inertial time scale',
      formula: '1/b = ρ·r² / (8·μ)',
      substituted: `${q(rho, 'kg/m3')} × (${q(r, 'm')})² / (8 × ${q(mu, 'Pa*s')})`,
      value: 1 / inertial.b,
      unit: 's',
      source: BOSANQUET,
    },
    {
      id: 'bosanquet',
      label: vertical
        ? 'Time with inertia, horizontal (the size of the inertia effect)'
        : 'Time with inertia, Bosanquet',
      formula: 'L² = (a / b²)·(b·t − 1 + e^(−b·t)), a = 4·σ·cos θ / (ρ·r), b = 8·μ / (ρ·r²); solved for t',
      substituted: `a = ${fmt(inertial.a)} m²/s², b = ${fmt(inertial.b)} 1/s, b·t = ${fmt(inertial.tau)}; against Lucas–Washburn × ${fmt(inertiaRatio)}`,
      value: inertial.time,
      unit: 's',
      source: BOSANQUET,
    },
  ],
  jurinLimit: ({ sigma, rho, g, r, theta, limit }) => [
    {
      id: 'jurin-limit',
      label: 'Jurin limit of the rise',
      formula: 'h_J = 2·σ·cos θ / (ρ·g·r)',
      substituted: `2 × ${q(sigma, 'N/m')} × cos ${q(theta, 'deg')} / (${q(rho, 'kg/m3')} × ${q(g, 'm/s2')} × ${q(r, 'm')})`,
      value: limit,
      unit: 'm',
      source: "Jurin 1718 (Jurin's law)",
    },
  ],
  gravity: ({ L, limit, x, shape, sigma, r, mu, theta, tg }) => [
    {
      id: 'gravity-shape',
      label: 'Height against the Jurin limit, and the shape term',
      formula: 'x = h / h_J; −x − ln(1 − x)',
      substituted: `x = ${q(L, 'm')} / ${q(limit, 'm')} = ${fmt(x)}`,
      value: shape,
      unit: '1',
      source: WASHBURN,
    },
    {
      id: 'gravity-time',
      label: 'Time with gravity',
      formula: 't = (2·h_J² / K)·(−x − ln(1 − x)), K = σ·r·cos θ / (2μ)',
      substituted: `K = ${fmt((sigma * r * Math.cos((theta * Math.PI) / 180)) / (2 * mu))} m²/s, 2 × (${q(limit, 'm')})² / K × ${fmt(shape)}`,
      value: tg,
      unit: 's',
      source: WASHBURN,
    },
  ],
};

function assumptions({ tooWide, vertical, liquid, angle, g }: WickingTimeAssumed): string[] {
  return [
    'Laminar flow of a Newtonian liquid in a uniform cylindrical capillary of the effective radius given.',
    ...(tooWide
      ? []
      : [
          'The static contact angle holds while the liquid moves (no dynamic angle).',
          'Clean liquid and clean surfaces: no surfactant, oil or dirt.',
          'Entrance losses and the air displaced ahead of the liquid are neglected.',
          vertical
            ? 'Upward: gravity is included in the time with gravity only; inertia is judged from the horizontal solution.'
            : 'Horizontal: gravity plays no part.',
        ]),
    liquid.assumption,
    angle.assumption,
    gravityAssumption(g),
  ];
}

export const explain: Explain = { steps, assumptions };
