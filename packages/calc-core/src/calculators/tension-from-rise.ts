import { meniscusCorrection } from '../formulas/capillary.js';
import { ANGLE_POORLY_DETERMINED, poorlyDetermined } from './angle-reading.js';
import { computer } from './engine.js';
import { runner } from './run.js';
import {
  capillaryLengthStep,
  choice,
  CONTACT_ANGLE_NEAR_90,
  fmt,
  gravityAssumption,
  gravityInput,
  MM,
  nearNinety,
  num,
  q,
  quantityInput,
  solvedLegacy,
  laterWorking,
  warning,
} from './shared.js';
import type { CalculatorCore, InputValues, Solution, Warning } from './types.js';

/**
 * r/ℓc above which Rayleigh's r/3 is more than 2 % of the rise (r²/(6ℓc²) = 0.02), the tube-rise
 * calculator's threshold too; written here so this calculator's bundle does not carry the rise module.
 */
const NOT_SMALL_RATIO = Math.sqrt(0.12);

const forTension = [{ input: 'solveFor', values: ['surfaceTension'] }] as const;
const forAngle = [{ input: 'solveFor', values: ['contactAngle'] }] as const;
const RAYLEIGH = 'Rayleigh 1915, first order: r/3 of liquid held in the meniscus above its lowest point';

/** The rise to the bottom of the meniscus a contact angle gives: Jurin's rise less the meniscus correction, m. */
function riseFor(sigma: number, angleDeg: number, rho: number, g: number, d: number): number {
  return (
    (4 * sigma * Math.cos((angleDeg * Math.PI) / 180)) / (rho * g * d) -
    meniscusCorrection({ diameter: d, contactAngleDeg: angleDeg })
  );
}

/**
 * The contact angle, 0–90°, whose corrected rise is `h`, by bisection on a rise that falls as the
 * angle grows (null when `h` is above the fully wetting rise). 60 halvings put it within 1e-16 of 90°.
 */
export function angleForRise(h: number, sigma: number, rho: number, g: number, d: number): number | null {
  if (h > riseFor(sigma, 0, rho, g, d)) return null;
  let lo = 0;
  let hi = 90;
  for (let i = 0; i < 60; i++) {
    const mid = (lo + hi) / 2;
    if (riseFor(sigma, mid, rho, g, d) > h) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

function solve(inputs: InputValues): Solution {
  const mode = choice(inputs, 'solveFor');
  const h = num(inputs, 'rise');
  const d = num(inputs, 'diameter');
  const rho = num(inputs, 'density');
  const g = num(inputs, 'gravity');
  const r = d / 2;
  const working = laterWorking();
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
    working.add(() => [
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
    ]);
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
    working.add(() => [
      {
        id: 'wetting-rise',
        label: 'Rise of a fully wetting liquid (θ = 0) in this bore',
        formula: 'h₀ = 4·σ / (ρ·g·d) − r/3',
        substituted: `4 × ${q(sigma, 'N/m')} / (${q(rho, 'kg/m3')} × ${q(g, 'm/s2')} × ${q(d, 'm')}) − ${q(r, 'm')}/3`,
        value: wetting,
        unit: 'm',
        source: RAYLEIGH,
      },
    ]);
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
      working.add(() => [
        {
          id: 'solved',
          label: 'Contact angle',
          formula: 'θ such that h = 4·σ·cos θ / (ρ·g·d) − δ(θ), solved by bisection over 0–90°',
          substituted: `h = ${q(h, 'm')}: θ = ${q(angle, 'deg')}, δ(θ) = ${q(meniscusCorrection({ diameter: d, contactAngleDeg: angle }), 'm')}`,
          value: angle,
          unit: 'deg',
          source: "Jurin's law with Rayleigh's meniscus correction (its geometry for θ > 0 derived here)",
        },
      ]);
      const poor = poorlyDetermined(angle, 'rise', ['rise', 'surfaceTension'], 'solved');
      if (poor !== null) warnings.push(poor);
    }
  }

  const lc = Math.sqrt(sigma / (rho * g));
  const ratio = r / lc;
  working.add(() => [
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
  ]);
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

  return solvedLegacy({
    outputs: {
      surfaceTension: sigmaOut,
      contactAngleDeg: angleOut,
      capillaryLength: lc,
      radiusToCapillaryLength: ratio,
    },
    warnings,
    band: null,
    explain: () => ({
      working: working.build(),
      assumptions: [
        'Static equilibrium: the meniscus has stopped moving (read after it has risen and, better, after it has been let fall back to the same height).',
        'A clean, round, uniform, vertical bore dipping into a reservoir wide enough for its surface to be flat.',
        'The rise is measured from the flat reservoir surface to the bottom of the meniscus.',
        mode === 'surfaceTension'
          ? `A contact angle of ${q(angleIn, 'deg')} between the liquid and the tube, known independently.`
          : `A surface tension of ${q(sigma, 'N/m')}, measured on the same liquid.`,
        'Air density neglected against the liquid density.',
        gravityAssumption(g),
      ],
    }),
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
export const run = /* @__PURE__ */ runner(calculator);

/** Its numbers only (`compute`): no working, assumptions or input hash; what the widget's first result uses. */
export const compute = /* @__PURE__ */ computer(calculator);
