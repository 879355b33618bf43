// The absorption-coefficient calculator's working and assumptions, written from the notes its
// solve records (absorption-coefficient.ts): carried by its texts, so the widget's first flight has
// none of this text.
import type { AbsorptionMethod } from '../formulas/absorption.js';
import type { AbsorptionCoefficientNotes } from './absorption-coefficient.js';
import { fmt, q } from './shared.js';
import type { Explain, StepWriters } from './types.js';

const EN = 'EN ISO 15148:2002';
const ASTM = 'ASTM C1585';
const sourceOf = (method: AbsorptionMethod): string => (method === 'astm-c1585' ? ASTM : EN);

const steps: StepWriters<AbsorptionCoefficientNotes> = {
  gain: ({ method, lastMass, firstMass, area, lastGain, inFit, rows, windowText }) => [
    {
      id: 'gain',
      label: 'Mass gained per area of the wet face, last reading',
      formula: 'Δm/A = (m_t − m_0) / A',
      substituted: `(${q(lastMass, 'kg', 6)} − ${q(firstMass, 'kg', 6)}) / ${q(area, 'm2')}`,
      value: lastGain,
      unit: 'kg/m2',
      source: sourceOf(method),
    },
    {
      id: 'points',
      label: 'Readings in the fit',
      formula: method === 'astm-c1585' ? '1 min ≤ t ≤ 6 h' : 't > 0',
      substituted: `${inFit} of ${rows} rows: ${windowText}`,
      value: inFit,
      unit: '1',
      source: sourceOf(method),
    },
  ],
  fit: ({ method, fit, r }) => [
    {
      id: 'sums',
      label: 'Sums of the fit (x = √t in √s, y = Δm/A in kg/m²)',
      formula: 'Sxx = Σ(x − x̄)², Sxy = Σ(x − x̄)(y − ȳ)',
      substituted: `n = ${fit.n}, x̄ = ${fmt(fit.meanX)}, ȳ = ${fmt(fit.meanY)}, Sxx = ${fmt(fit.sxx)}, Sxy = ${fmt(fit.sxy)}, Syy = ${fmt(fit.syy)}`,
      value: fit.sxx,
      unit: '1',
      source: 'Ordinary least squares',
    },
    {
      id: 'slope',
      label: 'Water absorption coefficient (slope of the line)',
      formula: 'A_w = Sxy / Sxx',
      substituted: `${fmt(fit.sxy)} / ${fmt(fit.sxx)}`,
      value: fit.slope,
      unit: 'kg/(m2*s^0.5)',
      source: sourceOf(method),
    },
    {
      id: 'intercept',
      label: 'Intercept of the line at t = 0',
      formula: 'a = ȳ − A_w·x̄',
      substituted: `${fmt(fit.meanY)} − ${fmt(fit.slope)} × ${fmt(fit.meanX)}`,
      value: fit.intercept,
      unit: 'kg/m2',
      source: sourceOf(method),
    },
    {
      id: 'r-squared',
      label: 'Coefficient of determination',
      formula: 'R² = Sxy² / (Sxx·Syy)',
      substituted: `${fmt(fit.sxy)}² / (${fmt(fit.sxx)} × ${fmt(fit.syy)}); r = ${fmt(r)}`,
      value: fit.rSquared,
      unit: '1',
      source: 'Ordinary least squares',
    },
  ],
  rates: ({ slope, rhoW, sorptivity, perRootHour }) => [
    {
      id: 'per-root-hour',
      label: 'Water absorption coefficient per root hour',
      formula: `A_w,h = ${perRootHour}·A_w  (√3600 s = 60 √s)`,
      // The step's value stays canonical (per √s), as every step's does; the text shows the √h figure.
      substituted: `${perRootHour} × ${q(slope, 'kg/(m2*s^0.5)')} = ${q(slope * perRootHour, 'kg/(m2*h^0.5)')}`,
      value: slope,
      unit: 'kg/(m2*s^0.5)',
      source: EN,
    },
    {
      id: 'sorptivity',
      label: 'Sorptivity',
      formula: 'S = A_w / ρ_w',
      substituted: `${q(slope, 'kg/(m2*s^0.5)')} / ${q(rhoW, 'kg/m3')}`,
      value: sorptivity,
      unit: 'm/s^0.5',
      source: ASTM,
    },
  ],
};

const ASSUMPTIONS: readonly string[] = [
  'One face in water, the sides sealed, so water enters through the face area given only.',
  'The mass at time 0 is the specimen before it touched the water; every later mass is weighed after the surface water is wiped off.',
  'Water density as given for the sorptivity; the absorption coefficient does not use it.',
  'The line is fitted by ordinary least squares to Δm/A against √t (every point weighted alike).',
];

export const explain: Explain = { steps, assumptions: () => ASSUMPTIONS };
