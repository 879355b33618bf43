// The wetting-force calculator's working and assumptions, written from the notes its solve records
// (wetting-force.ts): carried by its texts, so the widget's first flight has none of this text.
import { STANDARD_GRAVITY } from '../units.js';
import { fmt, q } from './shared.js';
import { coef, gravityAssumption } from './shared-working.js';
import type { Explain, StepWriters } from './types.js';
import type { WettingForceAssumed, WettingForceNotes } from './wetting-force.js';

const steps: StepWriters<WettingForceNotes> = {
  ring: ({ F, R, r, drho, g, x, table: t, fit }) => {
    const { k, c, m } = fit;
    return [
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
    ];
  },
  ringFactor: ({ radicand, root, factor, apparent, base }) => {
    return [
      {
        id: 'ring-factor',
        label: 'Zuidema–Waters correction factor',
        formula: `f = ${coef(base)} + √radicand`,
        substituted: `${coef(base)} + √${fmt(radicand)} = ${coef(base)} + ${fmt(root)}`,
        value: factor,
        unit: '1',
        source: 'Zuidema & Waters 1941 in the form of ASTM D971 (from memory)',
      },
      {
        id: 'ring-corrected',
        label: 'Surface tension, corrected',
        formula: 'σ = f·σ*',
        substituted: `${fmt(factor)} × ${q(apparent, 'N/m')}`,
        value: factor * apparent,
        unit: 'N/m',
        source: 'Harkins & Jordan 1930',
      },
    ];
  },
  perimeter: ({ isPlate, w, t, d, perimeter }) => [
    {
      id: 'perimeter',
      source: 'geometry of the probe',
      label: 'Wetted length',
      formula: isPlate ? 'P = 2·(w + t)' : 'P = π·d',
      substituted: isPlate ? `2 × (${q(w, 'm')} + ${q(t, 'm')})` : `π × ${q(d, 'm')}`,
      value: perimeter,
      unit: 'm',
    },
  ],
  liquid: (liquid) => liquid.working,
  force: ({ s, perimeter, theta, F }) => [
    {
      id: 'method',
      source: 'Wilhelmy 1863',
      label: 'Wetting force',
      formula: 'F = σ·P·cos θ',
      substituted: `${q(s, 'N/m')} × ${q(perimeter, 'm')} × cos ${q(theta, 'deg')}`,
      value: F,
      unit: 'N',
    },
  ],
  tension: ({ F, perimeter, theta, sigma }) => [
    {
      id: 'method',
      source: 'Wilhelmy 1863',
      label: 'Surface tension',
      formula: 'σ = F / (P·cos θ)',
      substituted: `${q(F, 'N')} / (${q(perimeter, 'm')} × cos ${q(theta, 'deg')})`,
      value: sigma,
      unit: 'N/m',
    },
  ],
};

function assumptions(a: WettingForceAssumed): string[] {
  if (a.ring)
    return [
      'The maximum pull, net of the weight of the ring, read as the ring is drawn slowly through the surface.',
      'The ring is horizontal, round and fully wetted by the liquid (contact angle 0° on clean platinum).',
      'Clean liquid and a fresh surface: no surfactant, oil or dust.',
      'Against air the density difference is the liquid density; air density neglected.',
      gravityAssumption(a.g),
    ];
  return [
    'The force is read at zero immersion depth, net of the weight of the probe: buoyancy is not included.',
    `A contact angle of ${q(a.theta, 'deg')} on the probe, known independently (0° for a clean roughened platinum plate, common practice).`,
    'Clean liquid and a fresh surface: no surfactant, oil or dust.',
    a.isPlate
      ? 'A thin rectangular plate wetted along its whole perimeter 2·(w + t).'
      : 'A round rod or fibre wetted around its circumference π·d.',
    ...(a.liquid !== null ? [a.liquid.assumption] : []),
  ];
}

export const explain: Explain = { steps, assumptions };
