import { plateForceTerms, type PlateForceTerms } from '../formulas/plate-force.js';
import { angleOf, ANGLE_POORLY_DETERMINED, poorlyDetermined } from './angle-reading.js';
import { computer } from './engine.js';
import { runner } from './run.js';
import {
  choice,
  fmt,
  gravityInput,
  MM,
  noteTaker,
  num,
  q,
  quantityInput,
  solved,
  warning,
} from './shared.js';
import { explain } from './contact-angle-from-force.working.js';
import type { CalculatorCore, InputValues, Solution, Warning } from './types.js';

const cycle = [{ input: 'readings', values: ['cycle'] }] as const;
/** What contact-angle-from-force.working.ts writes each step of the working from, by note key. */
export interface ContactAngleFromForceNotes {
  readonly plate: {
    readonly w: number;
    readonly t: number;
    readonly rho: number;
    readonly g: number;
    readonly h: number;
    readonly F: number;
    readonly sigma: number;
    readonly both: boolean;
    readonly adv: PlateForceTerms;
  };
  readonly angle: { readonly both: boolean; readonly cos: number; readonly angle: number };
  readonly recedingCos: {
    readonly Fr: number;
    readonly buoyancy: number;
    readonly sigma: number;
    readonly perimeter: number;
    readonly rc: number;
  };
  readonly recedingAngle: { readonly rc: number; readonly rec: number };
  readonly hysteresis: { readonly angle: number; readonly receding: number; readonly h: number };
}

/** What the assumptions are written from. */
export interface ContactAngleFromForceAssumed {
  /** Both the immersion and the withdrawal force were read. */
  readonly both: boolean;
  readonly g: number;
}

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

  // The working's text is written from these notes by contact-angle-from-force.working.ts (`calculate` only).
  const working = noteTaker<ContactAngleFromForceNotes>();
  working.add('plate', { w, t, rho, g, h, F, sigma, both, adv });
  const warnings: Warning[] = [];
  const angle = angleOf(adv.cosTheta);
  if (angle !== null) {
    working.add('angle', { both, cos: adv.cosTheta, angle });
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
    working.add('recedingCos', { Fr, buoyancy: adv.buoyancy, sigma, perimeter: adv.perimeter, rc });
    const rec = angleOf(rc);
    receding = rec;
    if (rec !== null) {
      working.add('recedingAngle', { rc, rec });
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
      working.add('hysteresis', { angle, receding, h });
    }
  }

  for (const [value, field, step] of [
    [angle, 'force', 'angle'],
    [receding, 'recedingForce', 'receding-angle'],
  ] as const) {
    const poor = value === null ? null : poorlyDetermined(value, 'force', [field, 'surfaceTension'], step);
    if (poor !== null) warnings.push(poor);
  }

  return solved({
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
    notes: working.list,
    assumed: { both, g },
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
export const run = /* @__PURE__ */ runner(calculator, explain);

/** Its numbers only (`compute`): no working, assumptions or input hash; what the widget's first result uses. */
export const compute = /* @__PURE__ */ computer(calculator);
