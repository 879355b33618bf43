import { meniscusCorrection } from '../formulas/capillary.js';
import { ANGLE_POORLY_DETERMINED, poorlyDetermined } from './angle-reading.js';
import { computer } from './engine.js';
import { runner } from './run.js';
import {
  choice,
  CONTACT_ANGLE_NEAR_90,
  fmt,
  gravityInput,
  MM,
  nearNinety,
  noteTaker,
  num,
  q,
  quantityInput,
  solved,
  warning,
} from './shared.js';
import { explain } from './tension-from-rise.working.js';
import type { CalculatorCore, InputValues, Solution, Warning } from './types.js';

/**
 * r/ℓc above which Rayleigh's r/3 is more than 2 % of the rise (r²/(6ℓc²) = 0.02), the tube-rise
 * calculator's threshold too; written here so this calculator's bundle does not carry the rise module.
 */
const NOT_SMALL_RATIO = Math.sqrt(0.12);

const forTension = [{ input: 'solveFor', values: ['surfaceTension'] }] as const;
const forAngle = [{ input: 'solveFor', values: ['contactAngle'] }] as const;

/** The rise to the bottom of the meniscus a contact angle gives: Jurin's rise less the meniscus correction, m. */
function riseFor(sigma: number, angleDeg: number, rho: number, g: number, d: number): number {
  return (
    (4 * sigma * Math.cos((angleDeg * Math.PI) / 180)) / (rho * g * d) -
    meniscusCorrection({ diameter: d, contactAngleDeg: angleDeg })
  );
}

/**
 * How far above the fully wetting rise a rise may lie and still read as θ = 0: the rounding of the
 * same rise worked out in another order (tube-rise's Jurin's law and meniscus term give it a few
 * units in the last place apart), not a tolerance on measurement.
 */
const ROUNDING = 1e-12;

/**
 * The contact angle, 0–90°, whose corrected rise is `h`, by bisection on a rise that falls as the
 * angle grows (null when `h` is above the fully wetting rise by more than rounding). 60 halvings put
 * it within 1e-16 of 90°.
 */
export function angleForRise(h: number, sigma: number, rho: number, g: number, d: number): number | null {
  const wetting = riseFor(sigma, 0, rho, g, d);
  if (h > wetting * (1 + ROUNDING)) return null;
  if (h >= wetting) return 0;
  let lo = 0;
  let hi = 90;
  for (let i = 0; i < 60; i++) {
    const mid = (lo + hi) / 2;
    if (riseFor(sigma, mid, rho, g, d) > h) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

/** What tension-from-rise.working.ts writes each step of the working from, by note key. */
export interface TensionFromRiseNotes {
  readonly tension: {
    readonly r: number;
    readonly angleIn: number;
    readonly m: number;
    readonly rho: number;
    readonly g: number;
    readonly h: number;
    readonly sigma: number;
  };
  readonly wettingRise: {
    readonly sigma: number;
    readonly rho: number;
    readonly g: number;
    readonly d: number;
    readonly r: number;
    readonly wetting: number;
  };
  readonly angle: {
    readonly h: number;
    readonly angle: number;
    readonly d: number;
    /** The meniscus correction at that angle, m (the working prints it). */
    readonly delta: number;
  };
  readonly size: {
    readonly sigma: number;
    readonly rho: number;
    readonly g: number;
    readonly lc: number;
    readonly r: number;
    readonly ratio: number;
  };
}

/** What the assumptions are written from. */
export interface TensionFromRiseAssumed {
  /** Solved for the surface tension (else for the contact angle). */
  readonly tension: boolean;
  readonly angleIn: number;
  readonly sigma: number;
  readonly g: number;
}

function solve(inputs: InputValues): Solution {
  const mode = choice(inputs, 'solveFor');
  const h = num(inputs, 'rise');
  const d = num(inputs, 'diameter');
  const rho = num(inputs, 'density');
  const g = num(inputs, 'gravity');
  const r = d / 2;
  // The working's text is written from these notes by tension-from-rise.working.ts (`calculate` only).
  const working = noteTaker<TensionFromRiseNotes>();
  const warnings: Warning[] = [];
  let sigma: number;
  let sigmaOut: number | null = null;
  let angleOut: number | null = null;
  let angleIn = 0;

  if (mode === 'surfaceTension') {
    angleIn = num(inputs, 'contactAngleDeg');
    const m = meniscusCorrection({ diameter: d, contactAngleDeg: angleIn });
    sigma = (rho * g * r * (h + m)) / (2 * Math.cos((angleIn * Math.PI) / 180));
    sigmaOut = sigma;
    working.add('tension', { r, angleIn, m, rho, g, h, sigma });
    if (angleIn > 0) {
      warnings.push(
        warning(
          'CONTACT_ANGLE_NOT_ZERO',
          `A contact angle of ${q(angleIn, 'deg')} is assumed: the method is run with a liquid that wets the clean tube fully (θ = 0); any other angle must be known independently, and its error goes straight into σ through cos θ.`,
          ['contactAngleDeg'],
          { step: 'solved' },
        ),
      );
    }
    const near = nearNinety(angleIn, ['contactAngleDeg']);
    if (near !== null) warnings.push({ ...near, step: 'solved' });
  } else {
    sigma = num(inputs, 'surfaceTension');
    const wetting = riseFor(sigma, 0, rho, g, d);
    working.add('wettingRise', { sigma, rho, g, d, r, wetting });
    const angle = angleForRise(h, sigma, rho, g, d);
    if (angle === null) {
      warnings.push(
        warning(
          'NO_ANGLE_FOR_RISE',
          `No contact angle gives this rise: ${q(h * 1000, 'mm')} is above the ${q(wetting * 1000, 'mm')} that a fully wetting liquid reaches in this bore. The surface tension entered is too low, the bore is narrower than stated, or the rise was read to the top of the meniscus instead of its bottom.`,
          ['rise', 'surfaceTension', 'diameter'],
          { step: 'wetting-rise', withholds: ['contactAngleDeg'] },
        ),
      );
    } else {
      angleOut = angle;
      working.add('angle', {
        h,
        angle,
        d,
        delta: meniscusCorrection({ diameter: d, contactAngleDeg: angle }),
      });
      const poor = poorlyDetermined(angle, 'rise', ['rise', 'surfaceTension'], 'solved');
      if (poor !== null) warnings.push(poor);
    }
  }

  const lc = Math.sqrt(sigma / (rho * g));
  const ratio = r / lc;
  working.add('size', { sigma, rho, g, lc, r, ratio });
  const solvedId = mode === 'surfaceTension' ? 'surfaceTension' : 'contactAngleDeg';
  if (ratio >= 1) {
    warnings.push(
      warning(
        'BORE_TOO_WIDE',
        `The bore radius is ${fmt(ratio)} times the capillary length (${q(lc * 1000, 'mm')}): the meniscus is flattened by gravity and Rayleigh's first-order form does not hold, so no ${mode === 'surfaceTension' ? 'surface tension' : 'contact angle'} is given. Use a narrower tube (radius well under ${q(lc * 1000, 'mm')}).`,
        ['diameter'],
        { step: 'size-ratio', withholds: [solvedId] },
      ),
    );
    if (mode === 'surfaceTension') sigmaOut = null;
    else angleOut = null;
  } else if (ratio > NOT_SMALL_RATIO) {
    warnings.push(
      warning(
        'BORE_NOT_SMALL',
        `The bore radius is ${fmt(ratio)} of the capillary length (${q(lc * 1000, 'mm')}): the meniscus term r/3 is more than 2 % of the rise and the higher terms of Rayleigh's series, left out here, start to count. A narrower tube gives a better figure.`,
        ['diameter'],
        { step: 'size-ratio' },
      ),
    );
  }

  return solved({
    outputs: {
      surfaceTension: sigmaOut,
      contactAngleDeg: angleOut,
      capillaryLength: lc,
      radiusToCapillaryLength: ratio,
    },
    warnings,
    band: null,
    notes: working.list,
    assumed: { tension: mode === 'surfaceTension', angleIn, sigma, g },
  });
}

export const calculator: CalculatorCore = {
  id: 'tension-from-rise',
  title: 'Surface tension or contact angle from a rise in a tube',
  summary:
    "The surface tension of a liquid from the height it rises in a narrow clean tube, or its contact angle on the tube when the surface tension is known, with Rayleigh's meniscus correction; withheld when the bore is not small against the capillary length.",
  inputs: [
    {
      id: 'solveFor',
      label: 'Find',
      kind: 'choice',
      default: 'surfaceTension',
      options: [
        { value: 'surfaceTension', label: 'Surface tension (contact angle known)' },
        { value: 'contactAngle', label: 'Contact angle (surface tension known)' },
      ],
    },
    quantityInput('length', 'rise', 'Measured rise to the bottom of the meniscus', 0.025, [1e-5, 1], {
      display: MM,
    }),
    quantityInput('length', 'diameter', 'Bore (inside diameter)', 1e-3, [1e-6, 0.05], { display: MM }),
    quantityInput('density', 'density', 'Liquid density', 998.2, [100, 25000]),
    quantityInput('angle', 'contactAngleDeg', 'Contact angle on the tube', 0, [0, 89], {
      help: 'Clean glass and water: 0° (common practice).',
      appliesWhen: forTension,
    }),
    quantityInput('surfaceTension', 'surfaceTension', 'Surface tension of the liquid', 0.0728, [1e-3, 1], {
      appliesWhen: forAngle,
    }),
    gravityInput(),
  ],
  outputs: [
    { id: 'surfaceTension', label: 'Surface tension', kind: 'surfaceTension' },
    { id: 'contactAngleDeg', label: 'Contact angle', kind: 'angle' },
    { id: 'capillaryLength', label: 'Capillary length', kind: 'length', display: MM },
    { id: 'radiusToCapillaryLength', label: 'Bore radius / capillary length', kind: 'dimensionless' },
  ],
  headline: {
    rules: [
      {
        when: [{ input: 'solveFor', values: ['surfaceTension'] }],
        output: 'surfaceTension',
        text: 'The rise gives a surface tension of about {value}.',
      },
      {
        when: [{ input: 'solveFor', values: ['contactAngle'] }],
        output: 'contactAngleDeg',
        text: 'The rise gives a contact angle of about {value} on the tube wall.',
      },
    ],
    missing: 'figure from this rise',
  },
  warnings: [
    {
      code: 'BORE_TOO_WIDE',
      summary: 'The bore radius is at least the capillary length: no surface tension or angle is given.',
    },
    {
      code: 'BORE_NOT_SMALL',
      summary: `The bore radius exceeds ${fmt(NOT_SMALL_RATIO)} of the capillary length, where the meniscus term is over 2 % of the rise.`,
    },
    {
      code: 'NO_ANGLE_FOR_RISE',
      summary: 'cos θ from the rise is above 1: no contact angle gives this rise.',
    },
    {
      code: 'CONTACT_ANGLE_NOT_ZERO',
      summary: 'A non-zero contact angle is assumed when reading the surface tension.',
    },
    CONTACT_ANGLE_NEAR_90,
    ANGLE_POORLY_DETERMINED,
  ],
  solve,
};

/** Runs this calculator alone (what a widget bundling one calculator calls); inputs in SI keyed by input id. */
export const run = /* @__PURE__ */ runner(calculator, explain);

/** Its numbers only (`compute`): no working, assumptions or input hash; what the widget's first result uses. */
export const compute = /* @__PURE__ */ computer(calculator);
