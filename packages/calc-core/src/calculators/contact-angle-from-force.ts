import { plateForceTerms } from '../formulas/contact-angle.js';
import { angleOf, ANGLE_POORLY_DETERMINED, poorlyDetermined } from './angle-reading.js';
import { computer } from './engine.js';
import { runner } from './run.js';
import {
  choice,
  fmt,
  gravityAssumption,
  gravityInput,
  MM,
  num,
  q,
  quantityInput,
  solvedLegacy,
  laterWorking,
  warning,
} from './shared.js';
import type { CalculatorCore, InputValues, Solution, Warning } from './types.js';

const cycle = [{ input: 'readings', values: ['cycle'] }] as const;
const WILHELMY = 'Wilhelmy 1863, with the buoyancy of the immersed plate';
function noAngle(cos: number, which: string, field: string, step: string, withholds: string[]): Warning {
  const why =
    cos > 1
      ? `the plate is pulled down harder than the liquid's surface tension can pull it, even fully wetted: the surface tension entered is too low for this liquid (a contaminated or mis-identified liquid), or the balance was not tared with the plate hanging in air`
      : `the plate is pushed up harder than the surface tension can push it, even fully non-wetted: check the tare, the sign of the force and the surface tension`;
  return warning(
    field === 'force' ? 'NO_ANGLE_FOR_FORCE' : 'NO_ANGLE_FOR_RECEDING_FORCE',
    `No ${which} exists for this reading: cos θ comes out at ${fmt(cos)}, outside −1 to 1, because ${why}.`,
    [field, 'surfaceTension'],
    { step, withholds },
  );
}

function solve(inputs: InputValues): Solution {
  const both = choice(inputs, 'readings') === 'cycle';
  const F = num(inputs, 'force');
  const sigma = num(inputs, 'surfaceTension');
  const rho = num(inputs, 'density');
  const w = num(inputs, 'plateWidth');
  const t = num(inputs, 'plateThickness');
  const h = num(inputs, 'immersionDepth');
  const g = num(inputs, 'gravity');
  const plate = {
    surfaceTension: sigma,
    density: rho,
    plateWidth: w,
    plateThickness: t,
    immersionDepth: h,
    gravity: g,
  };
  const adv = plateForceTerms({ ...plate, force: F });

  const working = laterWorking(() => [
    {
      id: 'perimeter',
      label: 'Wetted length of the plate',
      formula: 'P = 2·(w + t)',
      substituted: `2 × (${q(w, 'm')} + ${q(t, 'm')})`,
      value: adv.perimeter,
      unit: 'm',
      source: 'geometry of the plate',
    },
    {
      id: 'buoyancy',
      label: 'Buoyancy of the immersed part of the plate',
      formula: 'B = ρ·g·w·t·h',
      substituted: `${q(rho, 'kg/m3')} × ${q(g, 'm/s2')} × ${q(w, 'm')} × ${q(t, 'm')} × ${q(h, 'm')}`,
      value: adv.buoyancy,
      unit: 'N',
      source: 'Archimedes: the displaced liquid of the immersed depth',
    },
    {
      id: 'cos',
      label: both ? 'Cosine of the advancing angle (immersion force)' : 'Cosine of the contact angle',
      formula: 'cos θ = (F + B) / (σ·P)',
      substituted: `(${q(F, 'N')} + ${q(adv.buoyancy, 'N')}) / (${q(sigma, 'N/m')} × ${q(adv.perimeter, 'm')})`,
      value: adv.cosTheta,
      unit: '1',
      source: WILHELMY,
    },
  ]);
  const warnings: Warning[] = [];
  const angle = angleOf(adv.cosTheta);
  if (angle !== null) {
    working.add(() => [
      {
        id: 'angle',
        label: both ? 'Advancing contact angle' : 'Contact angle',
        formula: 'θ = arccos(cos θ)',
        substituted: `arccos(${fmt(adv.cosTheta, 6)})`,
        value: angle,
        unit: 'deg',
        source: WILHELMY,
      },
    ]);
  } else {
    warnings.push(
      noAngle(adv.cosTheta, both ? 'advancing angle' : 'contact angle', 'force', 'cos', [
        'contactAngleDeg',
        'hysteresisDeg',
      ]),
    );
  }

  let receding: number | null = null;
  let recCos: number | null = null;
  if (both) {
    const Fr = num(inputs, 'recedingForce');
    const rc = plateForceTerms({ ...plate, force: Fr }).cosTheta;
    recCos = rc;
    working.add(() => [
      {
        id: 'receding-cos',
        label: 'Cosine of the receding angle (withdrawal force)',
        formula: 'cos θ_r = (F_r + B) / (σ·P)',
        substituted: `(${q(Fr, 'N')} + ${q(adv.buoyancy, 'N')}) / (${q(sigma, 'N/m')} × ${q(adv.perimeter, 'm')})`,
        value: rc,
        unit: '1',
        source: WILHELMY,
      },
    ]);
    const rec = angleOf(rc);
    receding = rec;
    if (rec !== null) {
      working.add(() => [
        {
          id: 'receding-angle',
          label: 'Receding contact angle',
          formula: 'θ_r = arccos(cos θ_r)',
          substituted: `arccos(${fmt(rc, 6)})`,
          value: rec,
          unit: 'deg',
          source: WILHELMY,
        },
      ]);
    } else {
      warnings.push(
        noAngle(recCos, 'receding angle', 'recedingForce', 'receding-cos', [
          'recedingAngleDeg',
          'hysteresisDeg',
        ]),
      );
    }
  }

  let hysteresis: number | null = null;
  if (angle !== null && receding !== null) {
    if (receding > angle) {
      warnings.push(
        warning(
          'RECEDING_ABOVE_ADVANCING',
          `The receding angle (${q(receding, 'deg')}) comes out above the advancing angle (${q(angle, 'deg')}): the withdrawal force is below the immersion force, which a plate cannot give. The two readings look swapped, so no hysteresis is given.`,
          ['force', 'recedingForce'],
          { step: 'receding-angle', withholds: ['hysteresisDeg'] },
        ),
      );
    } else {
      const h = angle - receding;
      hysteresis = h;
      working.add(() => [
        {
          id: 'hysteresis',
          label: 'Contact-angle hysteresis',
          formula: 'Δθ = θ_a − θ_r',
          substituted: `${q(angle, 'deg')} − ${q(receding, 'deg')}`,
          value: h,
          unit: 'deg',
          source: 'definition',
        },
      ]);
    }
  }

  for (const [value, field, step] of [
    [angle, 'force', 'angle'],
    [receding, 'recedingForce', 'receding-angle'],
  ] as const) {
    const poor = value === null ? null : poorlyDetermined(value, 'force', [field, 'surfaceTension'], step);
    if (poor !== null) warnings.push(poor);
  }

  return solvedLegacy({
    outputs: {
      contactAngleDeg: angle,
      recedingAngleDeg: both ? receding : null,
      hysteresisDeg: both ? hysteresis : null,
      cosTheta: adv.cosTheta,
      buoyancy: adv.buoyancy,
      wettedLength: adv.perimeter,
    },
    warnings,
    band: null,
    explain: () => ({
      working: working.build(),
      assumptions: [
        'The force is net of the weight of the plate in air (the balance tared with the plate hanging above the liquid).',
        'The immersion depth is that of the lower edge below the undisturbed liquid surface when the force was read.',
        'A thin rectangular plate of the test material, uniform on all four sides, wetted along its whole perimeter 2·(w + t).',
        both
          ? 'The immersion force gives the advancing angle and the withdrawal force the receding angle, both read while the plate moves slowly at a steady speed.'
          : 'A single reading taken as the contact angle of the plate at rest (for a moving plate, the advancing or receding angle).',
        'The surface tension and density are those of the liquid as used: a clean liquid, air density neglected.',
        gravityAssumption(g),
      ],
    }),
  });
}

function forceInput(
  id: string,
  label: string,
  defaultN: number,
  help: string,
  when?: typeof cycle,
): CalculatorCore['inputs'][number] {
  return quantityInput('force', id, label, defaultN, [-0.1, 0.1], {
    help,
    display: { si: 'mN', us: 'mN' },
    ...(when !== undefined ? { appliesWhen: when } : {}),
  });
}

export const calculator: CalculatorCore = {
  id: 'contact-angle-from-force',
  title: 'Contact angle from a Wilhelmy plate force',
  summary:
    'The contact angle of a liquid on a plate of the test material, from the force measured on the plate at a known immersion depth, with buoyancy; advancing and receding angles and their hysteresis from an immersion and a withdrawal reading.',
  inputs: [
    {
      id: 'readings',
      label: 'Readings',
      kind: 'choice',
      default: 'single',
      options: [
        { value: 'single', label: 'One force reading' },
        { value: 'cycle', label: 'Immersion and withdrawal forces (advancing and receding)' },
      ],
    },
    forceInput(
      'force',
      'Measured force on the plate',
      1.4e-3,
      'Net of the plate weight in air; positive pulls the plate down. With two readings, the force while immersing.',
    ),
    forceInput(
      'recedingForce',
      'Force while withdrawing',
      2.2e-3,
      'Net of the plate weight in air, read while the plate is drawn out.',
      cycle,
    ),
    quantityInput('surfaceTension', 'surfaceTension', 'Surface tension of the liquid', 0.0728, [1e-3, 1], {
      help: 'Measured on the same liquid (e.g. with a roughened platinum plate, ASTM D1331 Method C).',
    }),
    quantityInput('density', 'density', 'Liquid density', 998.2, [100, 25000]),
    quantityInput('length', 'plateWidth', 'Plate width w', 0.02, [1e-4, 0.2], { display: MM }),
    quantityInput('length', 'plateThickness', 'Plate thickness t', 2e-4, [0, 0.01], { display: MM }),
    quantityInput('length', 'immersionDepth', 'Immersion depth h of the lower edge', 2e-3, [0, 0.05], {
      help: 'Zero when the force is read with the lower edge level with the liquid surface.',
      display: MM,
    }),
    gravityInput(),
  ],
  outputs: [
    {
      id: 'contactAngleDeg',
      label: 'Contact angle (advancing, with two readings)',
      kind: 'angle',
    },
    { id: 'recedingAngleDeg', label: 'Receding contact angle', kind: 'angle' },
    { id: 'hysteresisDeg', label: 'Contact-angle hysteresis', kind: 'angle' },
    {
      id: 'cosTheta',
      label: 'cos θ from the force balance',
      kind: 'dimensionless',
      help: 'Outside −1 to 1 no contact angle gives the force measured.',
    },
    { id: 'buoyancy', label: 'Buoyancy correction', kind: 'force', display: { si: 'mN', us: 'mN' } },
    { id: 'wettedLength', label: 'Wetted length', kind: 'length', display: MM },
  ],
  headline: {
    rules: [
      { output: 'contactAngleDeg', text: 'The liquid meets the plate at a contact angle of about {value}.' },
    ],
    missing: 'contact angle',
  },
  warnings: [
    {
      code: 'NO_ANGLE_FOR_FORCE',
      summary:
        'cos θ from the force is outside −1 to 1: no contact angle gives this reading (surface tension too low, or a tare error).',
    },
    {
      code: 'NO_ANGLE_FOR_RECEDING_FORCE',
      summary: 'cos θ from the withdrawal force is outside −1 to 1: no receding angle gives this reading.',
    },
    {
      code: 'RECEDING_ABOVE_ADVANCING',
      summary:
        'The withdrawal force is below the immersion force: the readings look swapped, no hysteresis is given.',
    },
    ANGLE_POORLY_DETERMINED,
  ],
  solve,
};

/** Runs this calculator alone (what a widget bundling one calculator calls); inputs in SI keyed by input id. */
export const run = /* @__PURE__ */ runner(calculator);

/** Its numbers only (`compute`): no working, assumptions or input hash; what the widget's first result uses. */
export const compute = /* @__PURE__ */ computer(calculator);
