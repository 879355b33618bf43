import { jurinRise } from '../formulas/capillary.js';
import { gravityRestrainedRiseTime, washburnTime } from '../formulas/wicking.js';
import { bandOver, runner } from './engine.js';
import {
  choice,
  CLEAN_SURFACES_CAUTION,
  contactAngleInputs,
  DAMP_CAUTION,
  ESTIMATE_CAUTION,
  fmt,
  gravityInput,
  LIQUID_TABLE_REFERENCES,
  liquidInputs,
  MERCURY_CAUTION,
  MM,
  num,
  q,
  quantityInput,
  resolveContactAngle,
  resolveLiquid,
  VISCOSITY_REFERENCE,
  warning,
  WATER_REFERENCES,
} from './shared.js';
import type { CalculatorDefinition, InputValues, Outputs, Solution, Warning, WorkingStep } from './types.js';

/** Gravity-restrained time over Lucas–Washburn time above which gravity is called not negligible. */
const GRAVITY_RATIO_LIMIT = 1.05;

function solve(inputs: InputValues): Solution {
  const vertical = choice(inputs, 'direction') === 'vertical';
  const liquid = resolveLiquid(inputs, { density: true, viscosity: true });
  const angle = resolveContactAngle(inputs, liquid.id);
  const L = num(inputs, 'length');
  const r = num(inputs, 'poreRadius');
  const g = num(inputs, 'gravity');
  const { surfaceTension: sigma, density: rho, viscosity: mu } = liquid;

  const evaluate = (theta: number): Outputs => {
    const args = { poreRadius: r, surfaceTension: sigma, contactAngleDeg: theta, viscosity: mu };
    const time = washburnTime({ ...args, length: L });
    if (!vertical) return { time, jurinLimit: null, timeWithGravity: null };
    const limit = jurinRise({
      surfaceTension: sigma,
      contactAngleDeg: theta,
      density: rho,
      diameter: 2 * r,
      gravity: g,
    });
    const withGravity =
      L < limit ? gravityRestrainedRiseTime({ ...args, height: L, density: rho, gravity: g }) : null;
    return { time, jurinLimit: limit, timeWithGravity: withGravity };
  };
  const outputs = evaluate(angle.angleDeg);
  const time = outputs.time ?? 0;
  const working: WorkingStep[] = [
    ...liquid.working,
    ...angle.working,
    {
      label: 'Time, Lucas–Washburn (gravity neglected)',
      formula: 't = 2·μ·L² / (σ·r·cos θ)',
      substituted: `2 × ${q(mu, 'Pa*s')} × (${q(L, 'm')})² / (${q(sigma, 'N/m')} × ${q(r, 'm')} × cos ${q(angle.angleDeg, 'deg')})`,
      value: time,
      unit: 's',
    },
  ];
  const warnings: Warning[] = [];
  if (vertical && outputs.jurinLimit !== null && outputs.jurinLimit !== undefined) {
    const limit = outputs.jurinLimit;
    working.push({
      label: 'Jurin limit of the rise',
      formula: 'h_J = 2·σ·cos θ / (ρ·g·r)',
      substituted: `2 × ${q(sigma, 'N/m')} × cos ${q(angle.angleDeg, 'deg')} / (${q(rho, 'kg/m3')} × ${q(g, 'm/s2')} × ${q(r, 'm')})`,
      value: limit,
      unit: 'm',
    });
    const tg = outputs.timeWithGravity;
    if (tg === null || tg === undefined) {
      warnings.push(
        warning(
          'BEYOND_JURIN_LIMIT',
          `A height of ${q(L, 'm')} is at or above the Jurin limit of ${q(limit, 'm')}: the liquid never gets there, and the Lucas–Washburn time is meaningless for it.`,
          ['length', 'poreRadius'],
        ),
      );
    } else {
      const x = L / limit;
      working.push({
        label: 'Time with gravity',
        formula: 't = (2·h_J² / K)·(−x − ln(1 − x)), x = h / h_J, K = σ·r·cos θ / (2μ)',
        substituted: `h_J = ${q(limit, 'm')}, x = ${fmt(x)}`,
        value: tg,
        unit: 's',
      });
      if (tg / time > GRAVITY_RATIO_LIMIT) {
        warnings.push(
          warning(
            'GRAVITY_NOT_NEGLIGIBLE',
            `The height is ${fmt(x)} of the Jurin limit: gravity slows the rise and the time with gravity (${fmt(tg / time)} × the Lucas–Washburn time) is the one to use.`,
            ['length'],
          ),
        );
      }
    }
  }
  const band = bandOver(angle.basis, outputs, (v) => evaluate(v.contactAngleDeg ?? angle.angleDeg));
  return { outputs, working, warnings, band };
}

export const calculator: CalculatorDefinition = {
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
  warnings: [
    { code: 'BEYOND_JURIN_LIMIT', summary: 'An upward height at or above the Jurin limit is never reached.' },
    {
      code: 'GRAVITY_NOT_NEGLIGIBLE',
      summary: 'Gravity lengthens the time by more than 5 % (our threshold); use the time with gravity.',
    },
  ],
  cautions: [
    ESTIMATE_CAUTION,
    {
      code: 'REAL_POROUS_MEDIA',
      text: 'Real materials have a range of pore sizes, tortuous paths and swelling or dissolving walls; the effective radius has to be fitted to a sorption test on the material itself.',
    },
    DAMP_CAUTION,
    CLEAN_SURFACES_CAUTION,
    MERCURY_CAUTION,
  ],
  references: [
    {
      id: 'washburn-1921',
      citation: 'Washburn E. W. (1921) The dynamics of capillary flow, Phys. Rev. 17, 273–283',
      usedFor:
        'L² = σ r t cos θ/(2μ), and the equation of motion with gravity that gives the time with gravity',
      basis: 'printed',
    },
    {
      id: 'lucas-1918',
      citation:
        'Lucas R. (1918) Ueber das Zeitgesetz des kapillaren Aufstiegs von Flüssigkeiten, Kolloid-Z. 23, 15–22',
      usedFor: 'the same law, found independently',
      basis: 'printed',
    },
    ...WATER_REFERENCES,
    VISCOSITY_REFERENCE,
    ...LIQUID_TABLE_REFERENCES,
  ],
  solve,
};

/** Runs this calculator alone (what a widget bundling one calculator calls); inputs in SI keyed by input id. */
export const run = runner(calculator);
