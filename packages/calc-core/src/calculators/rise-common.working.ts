// The working and assumptions of a rise (tube-rise, slot-rise), written from the notes solveRise
// records (rise-common.ts): carried by the two calculators' texts, so the widget's first flight
// has none of this text.
import { q } from './shared.js';
import { capillaryLengthStep, gravityAssumption, STATIC_ASSUMPTIONS } from './shared-working.js';
import type { RiseAssumed, RiseNotes } from './rise-common.js';
import type { Explain, StepWriters } from './types.js';

/** The words and formulas of each geometry, by its size input. */
const WORDS = {
  diameter: {
    noun: 'bore',
    symbol: 'd',
    riseLabel: "Rise, Jurin's law",
    riseFormula: 'h = 4·σ·cos θ / (ρ·g·d)',
    riseFactor: 4,
    riseSource: "Jurin 1718 (Jurin's law)",
    correctionFormula: 'δ = V_held / (π·r²); δ = r/3 at θ = 0',
    heldFormula:
      'R_m = r / cos θ, s = R_m·(1 − sin θ), V_cap = π·s²·(3·R_m − s) / 3, V_held = π·r²·s − V_cap',
    shape: 'A round, uniform, vertical bore, open to the liquid below.',
  },
  gap: {
    noun: 'gap',
    symbol: 'w',
    riseLabel: 'Rise between parallel walls',
    riseFormula: 'h = 2·σ·cos θ / (ρ·g·w)',
    riseFactor: 2,
    riseSource: "Jurin's force balance per unit length of two parallel walls (common practice)",
    correctionFormula: 'δ = A_held / w; δ = (1/2 − π/8)·w at θ = 0',
    heldFormula:
      'R_m = (w/2) / cos θ, s = R_m·(1 − sin θ), φ = 90° − θ, A_seg = R_m²·(φ − sin φ·cos φ), A_held = w·s − A_seg',
    shape: 'Two flat, parallel, vertical walls, long against the gap, open to the liquid below.',
  },
} as const;

const steps: StepWriters<RiseNotes> = {
  base: ({ sizeId, liquid, angle, sigma, rho, g, lc, size, ratio }) => [
    ...liquid.working,
    ...angle.working,
    capillaryLengthStep(sigma, rho, g, lc),
    {
      id: 'size-ratio',
      label: `Half the ${WORDS[sizeId].noun} against the capillary length`,
      formula: `(${WORDS[sizeId].symbol}/2) / ℓc`,
      substituted: `${q(size / 2, 'm')} / ${q(lc, 'm')}`,
      value: ratio,
      unit: '1',
      source: 'Rayleigh 1915 (the rise law and its correction need r ≪ ℓc)',
    },
  ],
  rise: ({ sizeId, sigma, theta, rho, g, size, rise }) => [
    {
      id: 'rise',
      label: WORDS[sizeId].riseLabel,
      formula: WORDS[sizeId].riseFormula,
      substituted: `${WORDS[sizeId].riseFactor} × ${q(sigma, 'N/m')} × cos ${q(theta, 'deg')} / (${q(rho, 'kg/m3')} × ${q(g, 'm/s2')} × ${q(size, 'm')})`,
      value: rise,
      unit: 'm',
      source: WORDS[sizeId].riseSource,
    },
  ],
  corrected: ({ sizeId, size, theta, rise, riseCorrected, meniscus: m }) => {
    const tube = sizeId === 'diameter';
    return [
      {
        id: 'meniscus-sag',
        label: 'Meniscus radius and sag',
        formula: tube ? 'R_m = r / cos θ, s = R_m·(1 − sin θ)' : 'R_m = (w/2) / cos θ, s = R_m·(1 − sin θ)',
        substituted: `${tube ? 'r' : 'w/2'} = ${q(size / 2, 'm')}, θ = ${q(theta, 'deg')}: R_m = ${Number.isFinite(m.radius) ? q(m.radius, 'm') : '∞ (flat)'}`,
        value: m.sag,
        unit: 'm',
        source: 'spherical (tube) or cylindrical (slot) meniscus, Rayleigh 1915',
      },
      {
        id: 'meniscus-held',
        label: tube
          ? 'Liquid held above the lowest point of the meniscus'
          : 'Liquid held above the lowest point, per unit length',
        formula: WORDS[sizeId].heldFormula,
        substituted: `s = ${q(m.sag, 'm')}, ${WORDS[sizeId].symbol} = ${q(size, 'm')}`,
        value: m.held,
        unit: tube ? 'm3' : 'm2',
        source: 'geometry of the meniscus, derived here',
      },
      {
        id: 'meniscus-correction',
        label: 'Meniscus-weight correction',
        formula: WORDS[sizeId].correctionFormula,
        substituted: tube
          ? `${q(m.held, 'm3')} / (π × (${q(size / 2, 'm')})²)`
          : `${q(m.held, 'm2')} / ${q(size, 'm')}`,
        value: m.correction,
        unit: 'm',
        source: 'Rayleigh 1915 (r/3 at θ = 0); the same geometry for θ > 0, derived here',
      },
      {
        id: 'rise-corrected',
        label: 'Rise to the bottom of the meniscus, corrected',
        formula: 'h − δ',
        substituted: `${q(rise, 'm')} − ${q(m.correction, 'm')}`,
        value: riseCorrected,
        unit: 'm',
        source: 'Rayleigh 1915',
      },
    ];
  },
};

function assumptions({ sizeId, liquid, angle, g }: RiseAssumed): string[] {
  return [
    ...STATIC_ASSUMPTIONS,
    WORDS[sizeId].shape,
    'The rise is measured from the flat free surface of a wide reservoir to the bottom of the meniscus.',
    liquid.assumption,
    angle.assumption,
    gravityAssumption(g),
  ];
}

/** The working of tube-rise and slot-rise (the notes say which geometry). */
export const explain: Explain = { steps, assumptions };
