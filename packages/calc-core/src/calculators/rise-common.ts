import { meniscusGeometry, slotMeniscusGeometry, type MeniscusGeometry } from '../formulas/capillary.js';
import { capillaryLength, jurinRise, slotRise } from '../formulas/jurin.js';
import { bandOver } from './engine.js';
import {
  fmt,
  gravityInput,
  MM,
  ANGLE_FIELDS,
  CONTACT_ANGLE_NEAR_90,
  nearNinety,
  num,
  q,
  noteTaker,
  warning,
  solved,
} from './shared.js';
import {
  contactAngleInputs,
  liquidInputs,
  resolveContactAngle,
  resolveLiquid,
  type ResolvedAngle,
  type ResolvedLiquid,
} from './shared-liquid.js';
import type {
  HeadlineDefinition,
  InputDefinition,
  InputValues,
  OutputDefinition,
  Outputs,
  Solution,
  Warning,
} from './types.js';

// Tube and slot rise share everything but the geometry: the rise law, the meniscus correction, and
// which half-size is compared with the capillary length.

export interface RiseGeometry {
  /** Input id of the bore or gap. */
  readonly sizeId: 'diameter' | 'gap';
  /** 4 for a tube (4σ cos θ/(ρ g d)), 2 for a slot. */
  readonly rise: (a: {
    surfaceTension: number;
    contactAngleDeg: number;
    density: number;
    size: number;
    gravity: number;
  }) => number;
  readonly correction: (size: number, contactAngleDeg: number) => MeniscusGeometry;
  /** Half the bore or gap over ℓc above which the meniscus correction exceeds 2 % of the rise at θ = 0. */
  readonly notSmallRatio: number;
  readonly codes: { readonly notSmall: string; readonly tooWide: string };
  readonly noun: string;
  /** Output id of half the size over ℓc. */
  readonly ratioId: 'radiusToCapillaryLength' | 'halfGapToCapillaryLength';
}

/** What rise-common.working.ts writes each step of a rise's working from, by note key. */
export interface RiseNotes {
  readonly base: {
    readonly sizeId: RiseGeometry['sizeId'];
    readonly liquid: ResolvedLiquid;
    readonly angle: ResolvedAngle;
    readonly sigma: number;
    readonly rho: number;
    readonly g: number;
    readonly lc: number;
    readonly size: number;
    readonly ratio: number;
  };
  readonly rise: {
    readonly sizeId: RiseGeometry['sizeId'];
    readonly sigma: number;
    readonly theta: number;
    readonly rho: number;
    readonly g: number;
    readonly size: number;
    readonly rise: number;
  };
  readonly corrected: {
    readonly sizeId: RiseGeometry['sizeId'];
    readonly size: number;
    readonly theta: number;
    readonly rise: number;
    readonly riseCorrected: number;
    /** The meniscus the correction is drawn from (the working prints its radius, sag and volume). */
    readonly meniscus: MeniscusGeometry;
  };
}

/** What a rise's assumptions are written from. */
export interface RiseAssumed {
  readonly sizeId: RiseGeometry['sizeId'];
  readonly liquid: ResolvedLiquid;
  readonly angle: ResolvedAngle;
  readonly g: number;
}

/** Rayleigh's r/3 against 2ℓc²/r: r²/(6ℓc²) = 0.02 at r/ℓc = √0.12. */
export const TUBE: RiseGeometry = {
  sizeId: 'diameter',
  rise: (a) => jurinRise({ ...a, diameter: a.size }),
  correction: (size, angle) => meniscusGeometry({ diameter: size, contactAngleDeg: angle }),
  notSmallRatio: Math.sqrt(0.12),
  codes: { notSmall: 'BORE_NOT_SMALL', tooWide: 'BORE_TOO_WIDE' },
  noun: 'bore',
  ratioId: 'radiusToCapillaryLength',
};

/** (1/2 − π/8)·w against 2ℓc²/w is 0.02 at (w/2)/ℓc = √(0.01 / (1/2 − π/8)). */
export const SLOT: RiseGeometry = {
  sizeId: 'gap',
  rise: (a) => slotRise({ ...a, gap: a.size }),
  correction: (size, angle) => slotMeniscusGeometry({ gap: size, contactAngleDeg: angle }),
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
  // The working's text is written from these notes by rise-common.working.ts (`calculate` only).
  const sizeId = geometry.sizeId;
  const theta = angle.angleDeg;
  const working = noteTaker<RiseNotes>();
  working.add('base', { sizeId, liquid, angle, sigma, rho, g, lc, size, ratio });
  if (outputs.rise !== null && outputs.rise !== undefined)
    working.add('rise', { sizeId, sigma, theta, rho, g, size, rise });
  if (outputs.riseCorrected !== null && outputs.riseCorrected !== undefined)
    working.add('corrected', {
      sizeId,
      size,
      theta,
      rise,
      riseCorrected: outputs.riseCorrected,
      meniscus: geometry.correction(size, theta),
    });
  const assumed: RiseAssumed = { sizeId, liquid, angle, g };
  return solved({ outputs, warnings, band, notes: working.list, assumed }, liquid);
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
