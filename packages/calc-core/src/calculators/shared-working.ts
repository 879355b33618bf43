import { getContactAnglePreset } from '../properties/contactAngles.js';
import { getLiquid } from '../properties/liquids.js';
import { IAPWS_R1_76, IAPWS_SR6_08, KELL_1975, TANAKA_2001 } from '../properties/water.js';
import { formatValue } from '../format.js';
import { STANDARD_GRAVITY, type UnitId } from '../units.js';
import { CUSTOM, fmt, q } from './shared.js';
import { type AngleFacts, type LiquidFacts, type SharedWriters } from './shared-liquid.js';
import type { WorkingStep } from './types.js';

// The working and the assumptions of the shared inputs (the liquid, the contact angle), written from
// what `resolveLiquid` and `resolveContactAngle` resolved, and the steps and assumptions several
// calculators' `<id>.working.ts` share. Text only: `runCalculation` binds it (`bindWriters`),
// `compute` never reads it, so a widget's first flight, which computes, carries none.
// Not every calculator's working may import this module: the widget's build puts a calc-core module
// that every engine's subpath reaches (their `run` imports their working) into the shared runtime.

/** The assumptions every capillary result shares. */
export const STATIC_ASSUMPTIONS: readonly string[] = [
  'Static equilibrium: the liquid has stopped moving.',
  'Clean liquid and clean surfaces: no surfactant, oil or dirt.',
  'Air density neglected against the liquid density (0.12 % for water).',
];

/** The capillary length step ℓc = √(σ/(ρ·g)), id `capillary-length`, for a warning to point at. */
export function capillaryLengthStep(
  sigma: number,
  rho: number,
  g: number,
  lc: number,
  label = 'Capillary length',
): WorkingStep {
  return {
    id: 'capillary-length',
    label,
    formula: 'ℓc = √(σ / (ρ·g))',
    substituted: `√(${q(sigma, 'N/m')} / (${q(rho, 'kg/m3')} × ${q(g, 'm/s2')}))`,
    value: lc,
    unit: 'm',
    source: 'de Gennes, Brochard-Wyart & Quéré (2004) Capillarity and Wetting Phenomena',
  };
}

/** The working step of h_c = C/(e·D10): C in m², D10 in m, the rise in m. */
export function hazenRiseStep(
  id: string,
  label: string,
  c: number,
  e: number,
  d10: number,
  value: number,
): WorkingStep {
  return {
    id,
    label,
    formula: 'h_c = C / (e·D10)',
    substituted: `${q(c, 'm2')} / (${fmt(e)} × ${q(d10, 'm')})`,
    value,
    unit: 'm',
    source: 'Hazen, as given by Terzaghi & Peck (1948) (from memory)',
  };
}

/** The gravity assumption, naming the value used. */
export function gravityAssumption(g: number): string {
  return g === STANDARD_GRAVITY
    ? `Standard gravity, ${coef(STANDARD_GRAVITY)} m/s².`
    : `Local gravity of ${q(g, 'm/s2')} as entered.`;
}

/**
 * A published coefficient exactly as the code holds it (all its digits, a true minus sign), so the
 * working shows the very number computed with.
 */
export function coef(value: number): string {
  return String(value).replace('-', '−');
}

/** Superscript digits, for the powers of t in a printed polynomial (Kell 1975). */
const SUPERSCRIPT: Readonly<Record<string, string>> = { '2': '²', '3': '³', '4': '⁴', '5': '⁵' };

const IAPWS_ST = 'IAPWS R1-76(2014)';
const SR6 = 'IAPWS SR6-08 (2011)';

/** The cited row (`liquids.ts`, `contactAngles.ts`) of a liquid or preset the calculation resolved. */
function cited<T>(row: T | undefined, id: string): T {
  if (row === undefined) throw new Error(`${id} is resolved but has no sources`);
  return row;
}

function liquidWorking(facts: LiquidFacts): WorkingStep[] {
  const steps: WorkingStep[] = [];
  if (facts.kind === 'water') {
    const { t, sigma, density: d, viscosity: mu } = facts;
    const T = t + 273.15;
    const { B, b, mu: expo, Tc } = IAPWS_R1_76;
    const tau = 1 - T / Tc;
    steps.push({
      label: `Surface tension of water at ${q(t, 'degC')}`,
      formula: `σ = B·τ^μ·(1 + b·τ), τ = 1 − T / Tc; B = ${coef(B * 1000)} mN/m, b = ${coef(b)}, μ = ${coef(expo)}, Tc = ${coef(Tc)} K`,
      substituted: `T = ${q(T, 'K', 6)}, τ = 1 − ${formatValue(T, 6)} / ${coef(Tc)} = ${formatValue(tau, 6)}; σ = ${coef(B)} N/m × ${formatValue(tau, 6)}^${coef(expo)} × (1 + (${coef(b)}) × ${formatValue(tau, 6)})`,
      value: sigma,
      unit: 'N/m',
      source: IAPWS_ST,
    });
    if (d !== null) {
      const { a1, a2, a3, a4, a5 } = TANAKA_2001;
      const kellTerms = (): string[] =>
        KELL_1975.a.map((a, n) =>
          n === 0 ? coef(a) : `${coef(a)}·t${n === 1 ? '' : SUPERSCRIPT[String(n)]}`,
        );
      steps.push({
        label: `Density of water at ${q(t, 'degC')}`,
        formula:
          d.formulation === 'tanaka-2001'
            ? `ρ = a₅·[1 − (t + a₁)²·(t + a₂) / (a₃·(t + a₄))]; a₁ = ${coef(a1)} °C, a₂ = ${coef(a2)} °C, a₃ = ${coef(a3)} °C², a₄ = ${coef(a4)} °C, a₅ = ${coef(a5)} kg/m³`
            : `ρ = (${kellTerms().join(' + ').replaceAll('+ −', '− ')}) / (1 + ${coef(KELL_1975.b)}·t), kg/m³, t in °C`,
        substituted:
          d.formulation === 'tanaka-2001'
            ? `t = ${q(t, 'degC')}: ${coef(a5)} × [1 − (${formatValue(t + a1, 6)})² × ${formatValue(t + a2, 6)} / (${coef(a3)} × ${formatValue(t + a4, 6)})]`
            : `t = ${q(t, 'degC')}`,
        value: d.value,
        unit: 'kg/m3',
        source: d.formulation === 'tanaka-2001' ? 'Tanaka et al. 2001' : 'Kell 1975',
      });
    }
    if (mu !== null) {
      const { a, b: bs, Tstar } = IAPWS_SR6_08;
      steps.push({
        label: `Viscosity of water at ${q(t, 'degC')}`,
        formula: `μ = Σ aᵢ·(T / ${coef(Tstar)} K)^bᵢ μPa·s; a = ${a.map(coef).join(', ')}; b = ${bs.map(coef).join(', ')}`,
        substituted: `T / ${coef(Tstar)} K = ${formatValue(T / Tstar, 6)}`,
        value: mu,
        unit: 'Pa*s',
        source: SR6,
      });
    }
    return steps;
  }
  if (facts.kind === CUSTOM) {
    const { sigma, density: rho, viscosity: mu } = facts;
    steps.push({
      label: 'Surface tension (entered)',
      formula: 'σ',
      substituted: q(sigma, 'N/m'),
      value: sigma,
      unit: 'N/m',
    });
    if (rho !== null)
      steps.push({
        label: 'Density (entered)',
        formula: 'ρ',
        substituted: q(rho, 'kg/m3'),
        value: rho,
        unit: 'kg/m3',
      });
    if (mu !== null)
      steps.push({
        label: 'Viscosity (entered)',
        formula: 'μ',
        substituted: q(mu, 'Pa*s'),
        value: mu,
        unit: 'Pa*s',
      });
    return steps;
  }
  const row = cited(getLiquid(facts.row.id), facts.row.id);
  const tableStep = (
    label: string,
    symbol: string,
    value: number,
    unit: UnitId,
    source: string,
  ): WorkingStep => ({
    label: `${label} of ${row.name.toLowerCase()} at ${q(row.temperatureC, 'degC')}`,
    formula: `${symbol} (table value)`,
    substituted: q(value, unit),
    value,
    unit,
    source,
  });
  steps.push(tableStep('Surface tension', 'σ', row.surfaceTension.value, 'N/m', row.surfaceTension.source));
  if (facts.density) steps.push(tableStep('Density', 'ρ', row.density.value, 'kg/m3', row.density.source));
  if (facts.viscosity)
    steps.push(tableStep('Viscosity', 'μ', row.viscosity.value, 'Pa*s', row.viscosity.source));
  return steps;
}

function liquidAssumption(facts: LiquidFacts): string {
  if (facts.kind === 'water')
    return `Pure, air-free water at ${q(facts.t, 'degC')} and atmospheric pressure, properties from the IAPWS, Tanaka and Kell correlations.`;
  if (facts.kind === CUSTOM)
    return 'The liquid properties as entered, taken as those of the liquid at the temperature of use.';
  const row = cited(getLiquid(facts.row.id), facts.row.id);
  return `${row.name} at ${q(row.temperatureC, 'degC')}, pure, with the table's values; at another temperature they differ.`;
}

function angleWorking(facts: AngleFacts): WorkingStep[] {
  if (facts.kind === CUSTOM) {
    const a = facts.angleDeg;
    return [
      { label: 'Contact angle (entered)', formula: 'θ', substituted: q(a, 'deg'), value: a, unit: 'deg' },
    ];
  }
  const preset = cited(getContactAnglePreset(facts.preset.id), facts.preset.id);
  const spread = preset.spreadDeg;
  return [
    {
      label: `Contact angle, ${preset.label.toLowerCase()}`,
      formula: 'θ (preset)',
      substituted:
        spread === undefined
          ? q(preset.angleDeg, 'deg')
          : `${q(preset.angleDeg, 'deg')} (range ${spread.low}–${spread.high}°)`,
      value: preset.angleDeg,
      unit: 'deg',
      source: `${preset.source} (${preset.basis})`,
    },
  ];
}

function angleAssumption(facts: AngleFacts): string {
  if (facts.kind === CUSTOM)
    return `A contact angle of ${q(facts.angleDeg, 'deg')} as entered, taken as the static angle of the liquid on this surface.`;
  const preset = cited(getContactAnglePreset(facts.preset.id), facts.preset.id);
  const spread = preset.spreadDeg;
  return `A contact angle of ${q(preset.angleDeg, 'deg')} from the preset "${preset.label}" (${preset.source}, ${preset.basis})${spread === undefined ? '' : `; the likely range spans ${spread.low}–${spread.high}°`}.`;
}

/** The writers `runCalculation` binds into shared.ts (`bindWriters`). */
export const sharedWriters: SharedWriters = {
  liquidWorking,
  liquidAssumption,
  angleWorking,
  angleAssumption,
};
