import {
  capillaryLength,
  jurinRise,
  meniscusGeometry,
  slotMeniscusGeometry,
  slotRise,
  type MeniscusGeometry,
} from '../formulas/capillary.js';
import { bandOver } from './engine.js';
import {
  fmt,
  gravityAssumption,
  STATIC_ASSUMPTIONS,
  gravityInput,
  MM,
  ANGLE_FIELDS,
  CONTACT_ANGLE_NEAR_90,
  nearNinety,
  num,
  q,
  warning,
  capillaryLengthStep,
  solvedLegacy,
  type Explanation,
} from './shared.js';
import { contactAngleInputs, liquidInputs, resolveContactAngle, resolveLiquid } from './shared-liquid.js';
import type {
  HeadlineDefinition,
  InputDefinition,
  InputValues,
  OutputDefinition,
  Outputs,
  Solution,
  Warning,
  WorkingStep,
} from './types.js';

// Tube and slot rise share everything but the geometry: the rise law, the meniscus correction, and
// which half-size is compared with the capillary length.

export interface RiseGeometry {
  /** Input id of the bore or gap. */
  readonly sizeId: 'diameter' | 'gap';
  readonly sizeSymbol: 'd' | 'w';
  readonly riseFormula: string;
  readonly correctionFormula: string;
  /** 4 for a tube (4σ cos θ/(ρ g d)), 2 for a slot. */
  readonly rise: (a: {
    surfaceTension: number;
    contactAngleDeg: number;
    density: number;
    size: number;
    gravity: number;
  }) => number;
  readonly correction: (size: number, contactAngleDeg: number) => MeniscusGeometry;
  /** How the liquid held above the meniscus's lowest point is worked out, for the working. */
  readonly heldFormula: string;
  readonly riseSource: string;
  readonly shape: string;
  /** Half the bore or gap over ℓc above which the meniscus correction exceeds 2 % of the rise at θ = 0. */
  readonly notSmallRatio: number;
  readonly codes: { readonly notSmall: string; readonly tooWide: string };
  readonly noun: string;
  /** Output id of half the size over ℓc. */
  readonly ratioId: 'radiusToCapillaryLength' | 'halfGapToCapillaryLength';
}

/** Rayleigh's r/3 against 2ℓc²/r: r²/(6ℓc²) = 0.02 at r/ℓc = √0.12. */
export const TUBE: RiseGeometry = {
  sizeId: 'diameter',
  sizeSymbol: 'd',
  riseFormula: 'h = 4·σ·cos θ / (ρ·g·d)',
  correctionFormula: 'δ = V_held / (π·r²); δ = r/3 at θ = 0',
  heldFormula: 'R_m = r / cos θ, s = R_m·(1 − sin θ), V_cap = π·s²·(3·R_m − s) / 3, V_held = π·r²·s − V_cap',
  rise: (a) => jurinRise({ ...a, diameter: a.size }),
  correction: (size, angle) => meniscusGeometry({ diameter: size, contactAngleDeg: angle }),
  riseSource: "Jurin 1718 (Jurin's law)",
  shape: 'A round, uniform, vertical bore, open to the liquid below.',
  notSmallRatio: Math.sqrt(0.12),
  codes: { notSmall: 'BORE_NOT_SMALL', tooWide: 'BORE_TOO_WIDE' },
  noun: 'bore',
  ratioId: 'radiusToCapillaryLength',
};

/** (1/2 − π/8)·w against 2ℓc²/w is 0.02 at (w/2)/ℓc = √(0.01 / (1/2 − π/8)). */
export const SLOT: RiseGeometry = {
  sizeId: 'gap',
  sizeSymbol: 'w',
  riseFormula: 'h = 2·σ·cos θ / (ρ·g·w)',
  correctionFormula: 'δ = A_held / w; δ = (1/2 − π/8)·w at θ = 0',
  heldFormula:
    'R_m = (w/2) / cos θ, s = R_m·(1 − sin θ), φ = 90° − θ, A_seg = R_m²·(φ − sin φ·cos φ), A_held = w·s − A_seg',
  rise: (a) => slotRise({ ...a, gap: a.size }),
  correction: (size, angle) => slotMeniscusGeometry({ gap: size, contactAngleDeg: angle }),
  riseSource: "Jurin's force balance per unit length of two parallel walls (common practice)",
  shape: 'Two flat, parallel, vertical walls, long against the gap, open to the liquid below.',
  notSmallRatio: Math.sqrt(0.01 / (0.5 - Math.PI / 8)),
  codes: { notSmall: 'GAP_NOT_SMALL', tooWide: 'GAP_TOO_WIDE' },
  noun: 'gap',
  ratioId: 'halfGapToCapillaryLength',
};

/** Inputs of a rise calculator: liquid, contact angle, the bore or gap (m), gravity (m/s²). */
/** Outputs of a rise calculator: the rise and its corrected value (m), ℓc (m), half the size over ℓc. */
export function riseOutputs(
  geometry: RiseGeometry,
  riseLabel: string,
  ratioLabel: string,
): OutputDefinition[] {
  return [
    {
      id: 'rise',
      label: riseLabel,
      kind: 'length',
      helpBySign: {
        above: 'Height above the free surface of the liquid outside.',
        atOrBelow: 'Negative: the liquid is pushed down below the free surface outside.',
      },
      display: MM,
    },
    {
      id: 'riseCorrected',
      label: 'Rise with meniscus-weight correction',
      kind: 'length',
      help: 'To the bottom of the meniscus; only for a concave meniscus (θ ≤ 90°).',
      display: MM,
    },
    { id: 'capillaryLength', label: 'Capillary length', kind: 'length', display: MM },
    { id: geometry.ratioId, label: ratioLabel, kind: 'dimensionless' },
  ];
}

export function riseInputs(sizeInput: InputDefinition): InputDefinition[] {
  return [
    ...liquidInputs({ density: true }),
    ...contactAngleInputs({
      presetIds: ['water-clean-glass', 'mercury-glass'],
      defaultPreset: 'water-clean-glass',
    }),
    sizeInput,
    gravityInput(),
  ];
}

/** Solves a tube or slot rise: outputs in m (and the dimensionless size ratio), with working and warnings. */
export function solveRise(geometry: RiseGeometry, inputs: InputValues): Solution {
  const liquid = resolveLiquid(inputs, { density: true });
  const angle = resolveContactAngle(inputs, liquid.id);
  const size = num(inputs, geometry.sizeId);
  const g = num(inputs, 'gravity');
  const sigma = liquid.surfaceTension;
  const rho = liquid.density;
  const lc = capillaryLength({ surfaceTension: sigma, density: rho, gravity: g });
  const ratio = size / 2 / lc;
  // Half the bore or gap at or above ℓc: the meniscus is flattened by gravity and neither the rise
  // law nor its correction holds, so neither is given (Rayleigh 1915: both are for r ≪ ℓc).
  const tooWide = ratio >= 1;

  const evaluate = (theta: number): Outputs => {
    const rise = geometry.rise({
      surfaceTension: sigma,
      contactAngleDeg: theta,
      density: rho,
      size,
      gravity: g,
    });
    return {
      rise: tooWide ? null : rise,
      riseCorrected: !tooWide && theta <= 90 ? rise - geometry.correction(size, theta).correction : null,
      capillaryLength: lc,
      [geometry.ratioId]: ratio,
    };
  };
  const outputs = evaluate(angle.angleDeg);
  const rise = geometry.rise({
    surfaceTension: sigma,
    contactAngleDeg: angle.angleDeg,
    density: rho,
    size,
    gravity: g,
  });
  const s = geometry.sizeSymbol;

  const warnings: Warning[] = [];
  const fields = [geometry.sizeId];
  if (tooWide) {
    warnings.push(
      warning(
        geometry.codes.tooWide,
        `Half the ${geometry.noun} is ${fmt(ratio, 2)} times the capillary length (${q(lc, 'm')}): the meniscus is flattened by gravity and neither ${geometry.sizeId === 'diameter' ? "Jurin's law" : 'the slot formula'} nor its correction holds, so no rise is given.`,
        fields,
        { step: 'size-ratio', withholds: ['rise', 'riseCorrected'] },
      ),
    );
  } else if (ratio > geometry.notSmallRatio) {
    warnings.push(
      warning(
        geometry.codes.notSmall,
        `Half the ${geometry.noun} is ${fmt(ratio, 2)} of the capillary length (${q(lc, 'm')}), so the liquid in the meniscus changes the rise by more than 2 %: use the corrected rise.`,
        fields,
        { step: 'size-ratio' },
      ),
    );
  }
  const near = nearNinety(angle.angleDeg);
  if (near !== null) warnings.push(tooWide ? near : { ...near, step: 'rise' });
  if (!tooWide && angle.angleDeg > 90) {
    warnings.push(
      warning(
        'MENISCUS_CORRECTION_NOT_APPLIED',
        'The meniscus is convex (θ > 90°); the meniscus-weight correction is for a concave meniscus and is not applied: the corrected rise is not defined here.',
        ANGLE_FIELDS,
        { step: 'rise', withholds: ['riseCorrected'] },
      ),
    );
  }

  const band = bandOver(angle.basis, outputs, (v) => evaluate(v.contactAngleDeg ?? angle.angleDeg));
  // The working and assumptions are text: built only when read (by `calculate`, not `compute`).
  const explain = (): Explanation => {
    const working: WorkingStep[] = [
      ...liquid.working,
      ...angle.working,
      capillaryLengthStep(sigma, rho, g, lc),
      {
        id: 'size-ratio',
        label: `Half the ${geometry.noun} against the capillary length`,
        formula: `(${s}/2) / ℓc`,
        substituted: `${q(size / 2, 'm')} / ${q(lc, 'm')}`,
        value: ratio,
        unit: '1',
        source: 'Rayleigh 1915 (the rise law and its correction need r ≪ ℓc)',
      },
    ];
    if (outputs.rise !== null && outputs.rise !== undefined) {
      working.push({
        id: 'rise',
        label: geometry.sizeId === 'diameter' ? "Rise, Jurin's law" : 'Rise between parallel walls',
        formula: geometry.riseFormula,
        substituted: `${geometry.sizeId === 'diameter' ? 4 : 2} × ${q(sigma, 'N/m')} × cos ${q(angle.angleDeg, 'deg')} / (${q(rho, 'kg/m3')} × ${q(g, 'm/s2')} × ${q(size, 'm')})`,
        value: rise,
        unit: 'm',
        source: geometry.riseSource,
      });
    }
    if (outputs.riseCorrected !== null && outputs.riseCorrected !== undefined) {
      const m = geometry.correction(size, angle.angleDeg);
      const tube = geometry.sizeId === 'diameter';
      working.push(
        {
          id: 'meniscus-sag',
          label: 'Meniscus radius and sag',
          formula: tube ? 'R_m = r / cos θ, s = R_m·(1 − sin θ)' : 'R_m = (w/2) / cos θ, s = R_m·(1 − sin θ)',
          substituted: `${tube ? 'r' : 'w/2'} = ${q(size / 2, 'm')}, θ = ${q(angle.angleDeg, 'deg')}: R_m = ${Number.isFinite(m.radius) ? q(m.radius, 'm') : '∞ (flat)'}`,
          value: m.sag,
          unit: 'm',
          source: 'spherical (tube) or cylindrical (slot) meniscus, Rayleigh 1915',
        },
        {
          id: 'meniscus-held',
          label: tube
            ? 'Liquid held above the lowest point of the meniscus'
            : 'Liquid held above the lowest point, per unit length',
          formula: geometry.heldFormula,
          substituted: `s = ${q(m.sag, 'm')}, ${s} = ${q(size, 'm')}`,
          value: m.held,
          unit: tube ? 'm3' : 'm2',
          source: 'geometry of the meniscus, derived here',
        },
        {
          id: 'meniscus-correction',
          label: 'Meniscus-weight correction',
          formula: geometry.correctionFormula,
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
          value: outputs.riseCorrected,
          unit: 'm',
          source: 'Rayleigh 1915',
        },
      );
    }
    const assumptions = [
      ...STATIC_ASSUMPTIONS,
      geometry.shape,
      'The rise is measured from the flat free surface of a wide reservoir to the bottom of the meniscus.',
      liquid.assumption,
      angle.assumption,
      gravityAssumption(g),
    ];
    return { working, assumptions };
  };
  return solvedLegacy({ outputs, warnings, band, explain }, liquid);
}

/**
 * The headline of a rise: the corrected rise when the bore or gap is wide enough for the meniscus
 * to matter (its warning asks for it), else the rise; pushed down when it is negative.
 * @param where how the size reads in the sentence, `{input.diameter}` or `{input.gap}` in it
 */
export function riseHeadline(geometry: RiseGeometry, where: string): HeadlineDefinition {
  const say = (output: string, warning?: string) => ({
    output,
    ...(warning !== undefined ? { warning } : {}),
    text: `{liquid} can climb about {value} ${where}.`,
    atOrBelow: `{liquid} is pushed down about {value} ${where}.`,
  });
  return { rules: [say('riseCorrected', geometry.codes.notSmall), say('rise')], missing: 'rise' };
}

/** The warning catalogue of a rise calculator. */
export function riseWarnings(geometry: RiseGeometry): { code: string; summary: string }[] {
  return [
    {
      code: geometry.codes.notSmall,
      summary: `Half the ${geometry.noun} exceeds ${fmt(geometry.notSmallRatio)} of the capillary length, where the meniscus weight changes the rise by more than 2 % (common practice threshold, ours).`,
    },
    {
      code: geometry.codes.tooWide,
      summary: `Half the ${geometry.noun} is at least the capillary length: the capillary formulas do not hold.`,
    },
    CONTACT_ANGLE_NEAR_90,
    {
      code: 'MENISCUS_CORRECTION_NOT_APPLIED',
      summary: 'A convex meniscus (θ > 90°): the meniscus-weight correction is not applied.',
    },
  ];
}
