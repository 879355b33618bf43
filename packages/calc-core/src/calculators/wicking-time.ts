import { capillaryLength, jurinRise } from '../formulas/jurin.js';
import { bosanquetTime, gravityRestrainedRiseTime, gravityShape, washburnTime } from '../formulas/wicking.js';
import { bandOver, computer } from './engine.js';
import { runner } from './run.js';
import {
  choice,
  CONTACT_ANGLE_NEAR_90,
  fmt,
  gravityInput,
  nearNinety,
  MM,
  num,
  q,
  quantityInput,
  warning,
  solved,
  noteTaker,
} from './shared.js';
import {
  contactAngleInputs,
  liquidInputs,
  resolveContactAngle,
  resolveLiquid,
  type ResolvedAngle,
  type ResolvedLiquid,
} from './shared-liquid.js';
import { explain } from './wicking-time.working.js';
import type { CalculatorCore, InputValues, Outputs, Solution, Warning } from './types.js';

/** Gravity-restrained time over Lucas–Washburn time above which gravity is called not negligible. */
const GRAVITY_RATIO_LIMIT = 1.05;
/**
 * Bosanquet time over Lucas–Washburn time above which inertia is called not negligible (our
 * threshold, the same 5 % as for gravity). Since t_B/t_LW − 1 ≈ 1/(b·t_LW) for long times, this is
 * about t_LW < 20·ρr²/(8μ): the wicking time is less than twenty inertial time scales.
 */
const INERTIA_RATIO_LIMIT = 1.05;

/** What wicking-time.working.ts writes each step of the working from, by note key. */
export interface WickingTimeNotes {
  readonly base: {
    readonly liquid: ResolvedLiquid;
    readonly angle: ResolvedAngle;
    readonly sigma: number;
    readonly rho: number;
    readonly g: number;
    readonly lc: number;
  };
  readonly washburn: {
    readonly mu: number;
    readonly L: number;
    readonly sigma: number;
    readonly r: number;
    readonly rho: number;
    readonly theta: number;
    readonly vertical: boolean;
    readonly time: number;
    readonly inertial: ReturnType<typeof bosanquetTime>;
    readonly inertiaRatio: number;
  };
  readonly jurinLimit: {
    readonly sigma: number;
    readonly rho: number;
    readonly g: number;
    readonly r: number;
    readonly theta: number;
    readonly limit: number;
  };
  readonly gravity: {
    readonly L: number;
    readonly limit: number;
    readonly x: number;
    readonly shape: number;
    readonly sigma: number;
    readonly r: number;
    readonly mu: number;
    readonly theta: number;
    readonly tg: number;
  };
}

/** What the assumptions are written from. */
export interface WickingTimeAssumed {
  readonly tooWide: boolean;
  readonly vertical: boolean;
  readonly liquid: ResolvedLiquid;
  readonly angle: ResolvedAngle;
  readonly g: number;
}

function solve(inputs: InputValues): Solution {
  const vertical = choice(inputs, 'direction') === 'vertical';
  const liquid = resolveLiquid(inputs, { density: true, viscosity: true });
  const angle = resolveContactAngle(inputs, liquid.id);
  const L = num(inputs, 'length');
  const r = num(inputs, 'poreRadius');
  const g = num(inputs, 'gravity');
  const { surfaceTension: sigma, density: rho, viscosity: mu } = liquid;

  interface Raw {
    readonly time: number;
    readonly inertial: ReturnType<typeof bosanquetTime>;
    readonly limit: number | null;
    readonly withGravity: number | null;
  }
  const compute = (theta: number): Raw => {
    const args = { poreRadius: r, surfaceTension: sigma, contactAngleDeg: theta, viscosity: mu };
    const time = washburnTime({ ...args, length: L });
    const inertial = bosanquetTime({ ...args, length: L, density: rho });
    if (!vertical) return { time, inertial, limit: null, withGravity: null };
    const limit = jurinRise({
      surfaceTension: sigma,
      contactAngleDeg: theta,
      density: rho,
      diameter: 2 * r,
      gravity: g,
    });
    const withGravity =
      L < limit ? gravityRestrainedRiseTime({ ...args, height: L, density: rho, gravity: g }) : null;
    return { time, inertial, limit, withGravity };
  };
  // What holds: above the Jurin limit no time at all; where inertia matters the viscous-only times
  // are withheld (horizontally Bosanquet's time stands in; upward, gravity and inertia together
  // are not solved here, so no time is given).
  // A pore as wide as the capillary length has a meniscus flattened by gravity: the capillary
  // pressure 2σ·cos θ/r behind every formula here does not hold, so nothing is given.
  const lc = capillaryLength({ surfaceTension: sigma, density: rho, gravity: g });
  const tooWide = r >= lc;
  const evaluate = (theta: number): Outputs => {
    if (tooWide) return { time: null, timeWithInertia: null, jurinLimit: null, timeWithGravity: null };
    const x = compute(theta);
    const inertiaMatters = x.inertial.time / x.time > INERTIA_RATIO_LIMIT;
    if (!vertical) {
      return {
        time: inertiaMatters ? null : x.time,
        timeWithInertia: x.inertial.time,
        jurinLimit: null,
        timeWithGravity: null,
      };
    }
    const reached = x.withGravity !== null;
    return {
      time: reached && !inertiaMatters ? x.time : null,
      timeWithInertia: null,
      jurinLimit: x.limit,
      timeWithGravity: reached && !inertiaMatters ? x.withGravity : null,
    };
  };
  const outputs = evaluate(angle.angleDeg);

  // The working's text is written from these notes by wicking-time.working.ts (`calculate` only).
  const working = noteTaker<WickingTimeNotes>();
  working.add('base', { liquid, angle, sigma, rho, g, lc });
  const warnings: Warning[] = [];
  if (tooWide) {
    warnings.push(
      warning(
        'PORE_TOO_WIDE',
        `A radius of ${q(r, 'm')} is at least the capillary length (${q(lc, 'm')}): the meniscus is flattened by gravity and the capillary pressure behind every time here does not hold, so none is given.`,
        ['poreRadius'],
        { step: 'capillary-length', withholds: ['time', 'timeWithInertia', 'jurinLimit', 'timeWithGravity'] },
      ),
    );
    return solved(
      {
        outputs,
        warnings,
        band: null,
        notes: working.list,
        assumed: { tooWide, vertical, liquid, angle, g },
      },
      liquid,
    );
  }
  const raw = compute(angle.angleDeg);
  const inertiaRatio = raw.inertial.time / raw.time;
  const inertiaMatters = inertiaRatio > INERTIA_RATIO_LIMIT;
  working.add('washburn', {
    mu,
    L,
    sigma,
    r,
    rho,
    theta: angle.angleDeg,
    vertical,
    time: raw.time,
    inertial: raw.inertial,
    inertiaRatio,
  });
  const withheldByInertia = vertical ? ['time', 'timeWithGravity'] : ['time'];
  if (vertical && raw.limit !== null) {
    const limit = raw.limit;
    working.add('jurinLimit', { sigma, rho, g, r, theta: angle.angleDeg, limit });
    const tg = raw.withGravity;
    if (tg === null) {
      warnings.push(
        warning(
          'BEYOND_JURIN_LIMIT',
          `A height of ${q(L, 'm')} is at or above the Jurin limit of ${q(limit, 'm')}: the liquid never gets there, so there is no time to give.`,
          ['length', 'poreRadius'],
          { step: 'jurin-limit', withholds: ['time', 'timeWithGravity'] },
        ),
      );
    } else if (!inertiaMatters) {
      const x = L / limit;
      const shape = gravityShape(x);
      working.add('gravity', { L, limit, x, shape, sigma, r, mu, theta: angle.angleDeg, tg });
      if (tg / raw.time > GRAVITY_RATIO_LIMIT) {
        warnings.push(
          warning(
            'GRAVITY_NOT_NEGLIGIBLE',
            `The height is ${fmt(x)} of the Jurin limit: gravity slows the rise and the time with gravity (${fmt(tg / raw.time)} × the Lucas–Washburn time) is the one to use.`,
            ['length'],
            { step: 'gravity-time' },
          ),
        );
      }
    }
  }
  if (inertiaMatters && !(vertical && raw.withGravity === null)) {
    warnings.push(
      warning(
        'INERTIA_NOT_NEGLIGIBLE',
        vertical
          ? `Inertia lengthens the time by ${fmt((inertiaRatio - 1) * 100, 3)} % (more than 5 %: the time is under twenty inertial time scales ρr²/(8μ)). The Lucas–Washburn times neglect it, and a rise with both gravity and inertia is not solved here, so no time is given.`
          : `Inertia lengthens the time by ${fmt((inertiaRatio - 1) * 100, 3)} % (more than 5 %: the time is under twenty inertial time scales ρr²/(8μ)): the Lucas–Washburn time is withheld; use the time with inertia.`,
        ['poreRadius', 'length'],
        { step: 'bosanquet', withholds: withheldByInertia },
      ),
    );
  }
  const near = nearNinety(angle.angleDeg);
  if (near !== null) warnings.push({ ...near, step: 'washburn' });
  const band = bandOver(angle.basis, outputs, (v) => evaluate(v.contactAngleDeg ?? angle.angleDeg));
  return solved(
    { outputs, warnings, band, notes: working.list, assumed: { tooWide, vertical, liquid, angle, g } },
    liquid,
  );
}

export const calculator: CalculatorCore = {
  id: 'wicking-time',
  title: 'Wicking time',
  summary:
    'Time for a liquid to wick a given distance along a capillary or porous path by the Lucas–Washburn equation, and for a vertical rise the Jurin limit and the time with gravity.',
  inputs: [
    {
      id: 'direction',
      label: 'Direction',
      kind: 'choice',
      default: 'vertical',
      options: [
        { value: 'vertical', label: 'Upward (height)' },
        { value: 'horizontal', label: 'Horizontal (distance)' },
      ],
    },
    quantityInput('length', 'length', 'Height or distance', 0.05, [1e-6, 100], { display: MM }),
    quantityInput('length', 'poreRadius', 'Effective capillary radius', 20e-6, [1e-9, 0.01], {
      help: 'For a porous material this is an effective value, best fitted to a measured sorption test.',
      display: { si: 'um', us: 'in' },
    }),
    ...liquidInputs({ density: true, viscosity: true }),
    ...contactAngleInputs({
      presetIds: ['water-clean-glass', 'water-mineral-grains'],
      defaultPreset: 'water-clean-glass',
      maxDeg: 180,
    }),
    gravityInput(),
  ],
  outputs: [
    { id: 'time', label: 'Time, Lucas–Washburn', kind: 'time', help: 'Gravity and inertia neglected.' },
    {
      id: 'timeWithInertia',
      label: 'Time with inertia (Bosanquet)',
      kind: 'time',
      help: 'Horizontal only: viscous drag and the inertia of the liquid.',
    },
    {
      id: 'jurinLimit',
      label: 'Jurin limit (highest possible rise)',
      kind: 'length',
      help: 'Upward only.',
      display: { si: 'mm', us: 'in' },
    },
    {
      id: 'timeWithGravity',
      label: 'Time with gravity',
      kind: 'time',
      help: 'Upward only, below the Jurin limit.',
    },
  ],
  headline: {
    rules: [
      {
        warning: 'BEYOND_JURIN_LIMIT',
        output: 'jurinLimit',
        text: '{liquid} never climbs {input.length}: it stops at about {value}.',
      },
      {
        when: [{ input: 'direction', values: ['vertical'] }],
        output: 'timeWithGravity',
        text: '{liquid} takes about {value} to wick {input.length} upward.',
      },
      {
        when: [{ input: 'direction', values: ['horizontal'] }],
        output: 'timeWithInertia',
        text: '{liquid} takes about {value} to wick {input.length} along the path.',
      },
      {
        when: [{ input: 'direction', values: ['vertical'] }],
        output: 'time',
        text: '{liquid} takes about {value} to wick {input.length} upward.',
      },
      { output: 'time', text: '{liquid} takes about {value} to wick {input.length} along the path.' },
    ],
    missing: 'time',
  },
  warnings: [
    { code: 'BEYOND_JURIN_LIMIT', summary: 'An upward height at or above the Jurin limit is never reached.' },
    {
      code: 'INERTIA_NOT_NEGLIGIBLE',
      summary:
        'Inertia lengthens the time by more than 5 % (our threshold: the time is under twenty inertial time scales ρr²/(8μ)); the viscous-only times are withheld.',
    },
    CONTACT_ANGLE_NEAR_90,
    {
      code: 'PORE_TOO_WIDE',
      summary: 'The pore radius is at least the capillary length: no time is given.',
    },
    { code: 'GRAVITY_NOT_NEGLIGIBLE' },
  ],
  solve,
};

/**
 * Runs this calculator alone, from its core (what the widget's engine calls); inputs in SI keyed by
 * input id. Its results carry the liquid's hazards but not the calculator's own cautions, which are in
 * its texts: `calculate` (the registry) gives them.
 */
export const run = /* @__PURE__ */ runner(calculator, explain);

/** Its numbers only (`compute`): no working, assumptions or input hash; what the widget's first result uses. */
export const compute = /* @__PURE__ */ computer(calculator);
