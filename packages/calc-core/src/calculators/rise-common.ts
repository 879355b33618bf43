import {
  capillaryLength,
  jurinRise,
  meniscusCorrection,
  slotMeniscusCorrection,
  slotRise,
} from '../formulas/capillary.js';
import { bandOver } from './engine.js';
import {
  contactAngleInputs,
  fmt,
  gravityInput,
  liquidInputs,
  MM,
  ANGLE_FIELDS,
  CONTACT_ANGLE_NEAR_90,
  nearNinety,
  num,
  q,
  resolveContactAngle,
  resolveLiquid,
  warning,
} from './shared.js';
import type {
  InputDefinition,
  InputValues,
  OutputDefinition,
  Outputs,
  Reference,
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
  readonly correction: (size: number, contactAngleDeg: number) => number;
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
  correctionFormula: 'δ = s − V_cap / (π·r²), s = r/cos θ·(1 − sin θ); δ = r/3 at θ = 0',
  rise: (a) => jurinRise({ ...a, diameter: a.size }),
  correction: (size, angle) => meniscusCorrection({ diameter: size, contactAngleDeg: angle }),
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
  correctionFormula: 'δ = s − A_seg / w, s = (w/2)/cos θ·(1 − sin θ); δ = (1/2 − π/8)·w at θ = 0',
  rise: (a) => slotRise({ ...a, gap: a.size }),
  correction: (size, angle) => slotMeniscusCorrection({ gap: size, contactAngleDeg: angle }),
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
      help: 'Negative values are a depression below the free surface.',
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

export const RAYLEIGH_REFERENCE: Reference = {
  id: 'rayleigh-1915',
  citation: 'Lord Rayleigh (1915) On the theory of the capillary tube, Proc. R. Soc. Lond. A 92, 184–195',
  usedFor:
    'the meniscus-weight correction r/3 and the small-bore condition (the slot form is derived from the same geometry)',
  basis: 'printed',
};

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

  const evaluate = (theta: number): Outputs => {
    const rise = geometry.rise({
      surfaceTension: sigma,
      contactAngleDeg: theta,
      density: rho,
      size,
      gravity: g,
    });
    return {
      rise,
      riseCorrected: theta <= 90 ? rise - geometry.correction(size, theta) : null,
      capillaryLength: lc,
      [geometry.ratioId]: ratio,
    };
  };
  const outputs = evaluate(angle.angleDeg);
  const rise = outputs.rise ?? 0;
  const s = geometry.sizeSymbol;

  const working: WorkingStep[] = [
    ...liquid.working,
    ...angle.working,
    {
      label: 'Capillary length',
      formula: 'ℓc = √(σ / (ρ·g))',
      substituted: `√(${q(sigma, 'N/m')} / (${q(rho, 'kg/m3')} × ${q(g, 'm/s2')}))`,
      value: lc,
      unit: 'm',
    },
    {
      label: geometry.sizeId === 'diameter' ? "Rise, Jurin's law" : 'Rise between parallel walls',
      formula: geometry.riseFormula,
      substituted: `${geometry.sizeId === 'diameter' ? 4 : 2} × ${q(sigma, 'N/m')} × cos ${q(angle.angleDeg, 'deg')} / (${q(rho, 'kg/m3')} × ${q(g, 'm/s2')} × ${q(size, 'm')})`,
      value: rise,
      unit: 'm',
    },
  ];
  if (outputs.riseCorrected !== null && outputs.riseCorrected !== undefined) {
    const delta = rise - outputs.riseCorrected;
    working.push(
      {
        label: 'Meniscus-weight correction',
        formula: geometry.correctionFormula,
        substituted: `${s} = ${q(size, 'm')}, θ = ${q(angle.angleDeg, 'deg')}`,
        value: delta,
        unit: 'm',
      },
      {
        label: 'Rise to the bottom of the meniscus, corrected',
        formula: 'h − δ',
        substituted: `${q(rise, 'm')} − ${q(delta, 'm')}`,
        value: outputs.riseCorrected,
        unit: 'm',
      },
    );
  }

  const warnings: Warning[] = [];
  const fields = [geometry.sizeId];
  if (ratio >= 1) {
    warnings.push(
      warning(
        geometry.codes.tooWide,
        `Half the ${geometry.noun} is ${fmt(ratio)} times the capillary length (${q(lc, 'm')}): the meniscus is flattened by gravity and neither ${geometry.sizeId === 'diameter' ? "Jurin's law" : 'the slot formula'} nor its correction holds.`,
        fields,
      ),
    );
  } else if (ratio > geometry.notSmallRatio) {
    warnings.push(
      warning(
        geometry.codes.notSmall,
        `Half the ${geometry.noun} is ${fmt(ratio)} of the capillary length (${q(lc, 'm')}), so the liquid in the meniscus changes the rise by more than 2 %: use the corrected rise.`,
        fields,
      ),
    );
  }
  const near = nearNinety(angle.angleDeg);
  if (near !== null) warnings.push(near);
  if (outputs.riseCorrected === null) {
    warnings.push(
      warning(
        'MENISCUS_CORRECTION_NOT_APPLIED',
        'The meniscus is convex (θ > 90°); the meniscus-weight correction is for a concave meniscus and is not applied.',
        ANGLE_FIELDS,
      ),
    );
  }

  const band = bandOver(angle.basis, outputs, (v) => evaluate(v.contactAngleDeg ?? angle.angleDeg));
  return { outputs, working, warnings, band };
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
