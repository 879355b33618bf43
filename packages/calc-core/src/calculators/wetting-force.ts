import {
  duNouySurfaceTension,
  platePerimeter,
  wilhelmyForce,
  wilhelmyRodForce,
  wilhelmyRodSurfaceTension,
  wilhelmySurfaceTension,
} from '../formulas/tensiometry.js';
import { CalcInputError } from '../errors.js';
import { runner } from './engine.js';
import {
  choice,
  CLEAN_SURFACES_CAUTION,
  CONTACT_ANGLE_NEAR_90,
  ESTIMATE_CAUTION,
  fmt,
  gravityInput,
  LIQUID_TABLE_REFERENCES,
  liquidInputs,
  MERCURY_CAUTION,
  MM,
  nearNinety,
  num,
  q,
  quantityInput,
  resolveLiquid,
  warning,
  WATER_REFERENCES,
  withFieldNames,
} from './shared.js';
import type {
  CalculatorDefinition,
  Condition,
  InputValues,
  QuantityInput,
  Solution,
  Warning,
  WorkingStep,
} from './types.js';

type Method = 'plate-force' | 'plate-tension' | 'rod-force' | 'rod-tension' | 'ring';

const forward = [{ input: 'method', values: ['plate-force', 'rod-force'] }] as const;
const plateInverse = [{ input: 'method', values: ['plate-tension'] }] as const;
const rodInverse = [{ input: 'method', values: ['rod-tension'] }] as const;
const plateOrRod = [
  { input: 'method', values: ['plate-force', 'plate-tension', 'rod-force', 'rod-tension'] },
] as const;
const plate = [{ input: 'method', values: ['plate-force', 'plate-tension'] }] as const;
const rod = [{ input: 'method', values: ['rod-force', 'rod-tension'] }] as const;
const ring = [{ input: 'method', values: ['ring'] }] as const;

/** ASTM D971: the ring's circumference is at least 40 mm. */
const ASTM_MIN_RING_CIRCUMFERENCE_M = 0.04;
const PLATE_FIELDS = { width: 'plateWidth', thickness: 'plateThickness' } as const;
const ROD_FIELDS = { diameter: 'rodDiameter' } as const;

function solve(inputs: InputValues): Solution {
  const method = choice(inputs, 'method') as Method;
  const working: WorkingStep[] = [];
  const warnings: Warning[] = [];
  let force: number | null = null;
  let sigma: number | null = null;
  let apparent: number | null = null;
  let factor: number | null = null;
  let perimeter: number;

  if (method === 'ring') {
    const F = num(inputs, 'ringForce');
    const R = num(inputs, 'ringRadius');
    const r = num(inputs, 'wireRadius');
    const drho = num(inputs, 'densityDifference');
    const g = num(inputs, 'gravity');
    const result = withFieldNames({ force: 'ringForce' }, () => {
      try {
        return duNouySurfaceTension({
          force: F,
          ringRadius: R,
          wireRadius: r,
          densityDifference: drho,
          gravity: g,
        });
      } catch (err) {
        // The square root goes negative for thick wires on small rings: r/R is what takes it out of range.
        if (err instanceof RangeError) {
          throw new CalcInputError({
            field: 'wireRadius',
            code: 'OUTSIDE_RING_CORRECTION',
            message: err.message,
          });
        }
        throw err;
      }
    });
    perimeter = 4 * Math.PI * R;
    ({ surfaceTension: sigma, apparentSurfaceTension: apparent, correctionFactor: factor } = result);
    working.push(
      {
        label: 'Apparent surface tension (uncorrected)',
        formula: 'σ* = F / (4π·R)',
        substituted: `${q(F, 'N')} / (4π × ${q(R, 'm')})`,
        value: apparent,
        unit: 'N/m',
      },
      {
        label: 'Zuidema–Waters correction factor',
        formula:
          'f = 0.7250 + √(0.01452·P / (C²·(D − d)) + 0.04534 − 1.679·r/R), P in dyn/cm, C in cm, D − d in g/mL',
        substituted: `P = ${fmt(apparent * 1000)} dyn/cm, C = ${fmt(2 * Math.PI * R * 100)} cm, D − d = ${fmt(drho / 1000)} g/mL, r/R = ${fmt(r / R)}`,
        value: factor,
        unit: '1',
        source: 'ASTM D971 (Zuidema & Waters 1941)',
      },
      {
        label: 'Surface tension, corrected',
        formula: 'σ = f·σ*',
        substituted: `${fmt(factor)} × ${q(apparent, 'N/m')}`,
        value: sigma,
        unit: 'N/m',
      },
    );
    if (2 * Math.PI * R < ASTM_MIN_RING_CIRCUMFERENCE_M) {
      warnings.push(
        warning(
          'RING_BELOW_ASTM_SIZE',
          `The ring's circumference is ${q(2 * Math.PI * R, 'm')}; ASTM D971 specifies at least 40 mm, and the Zuidema–Waters fit was made for such rings.`,
          ['ringRadius'],
        ),
      );
    }
  } else {
    const theta = num(inputs, 'contactAngleDeg');
    const isPlate = method === 'plate-force' || method === 'plate-tension';
    const w = isPlate ? num(inputs, 'plateWidth') : 0;
    const t = isPlate ? num(inputs, 'plateThickness') : 0;
    const d = isPlate ? 0 : num(inputs, 'rodDiameter');
    perimeter = isPlate ? platePerimeter(w, t) : Math.PI * d;
    working.push({
      label: 'Wetted length',
      formula: isPlate ? 'P = 2·(w + t)' : 'P = π·d',
      substituted: isPlate ? `2 × (${q(w, 'm')} + ${q(t, 'm')})` : `π × ${q(d, 'm')}`,
      value: perimeter,
      unit: 'm',
    });
    if (method === 'plate-force' || method === 'rod-force') {
      const liquid = resolveLiquid(inputs, {});
      working.unshift(...liquid.working);
      const s = liquid.surfaceTension;
      force = isPlate
        ? wilhelmyForce({ surfaceTension: s, contactAngleDeg: theta, width: w, thickness: t })
        : wilhelmyRodForce({ surfaceTension: s, contactAngleDeg: theta, diameter: d });
      working.push({
        label: 'Wetting force',
        formula: 'F = σ·P·cos θ',
        substituted: `${q(s, 'N/m')} × ${q(perimeter, 'm')} × cos ${q(theta, 'deg')}`,
        value: force,
        unit: 'N',
      });
    } else {
      const F = num(inputs, isPlate ? 'force' : 'rodForce');
      sigma = isPlate
        ? withFieldNames(PLATE_FIELDS, () =>
            wilhelmySurfaceTension({ force: F, contactAngleDeg: theta, width: w, thickness: t }),
          )
        : withFieldNames({ ...ROD_FIELDS, force: 'rodForce' }, () =>
            wilhelmyRodSurfaceTension({ force: F, contactAngleDeg: theta, diameter: d }),
          );
      working.push({
        label: 'Surface tension',
        formula: 'σ = F / (P·cos θ)',
        substituted: `${q(F, 'N')} / (${q(perimeter, 'm')} × cos ${q(theta, 'deg')})`,
        value: sigma,
        unit: 'N/m',
      });
      if (theta > 0) {
        warnings.push(
          warning(
            'CONTACT_ANGLE_NOT_ZERO',
            `A contact angle of ${q(theta, 'deg')} is assumed. The plate method is normally run fully wetted (θ = 0, e.g. roughened platinum); any other angle must be known independently.`,
            ['contactAngleDeg'],
          ),
        );
      }
    }
    const near = nearNinety(theta, ['contactAngleDeg']);
    if (near !== null) warnings.push(near);
  }
  return {
    outputs: {
      force,
      surfaceTension: sigma,
      apparentSurfaceTension: apparent,
      correctionFactor: factor,
      wettedLength: perimeter,
    },
    working,
    warnings,
    band: null,
  };
}

function forceInput(id: string, label: string, defaultN: number, when: readonly Condition[]): QuantityInput {
  return quantityInput('force', id, label, defaultN, [1e-7, 1], {
    help: 'Net of the probe weight, at zero immersion depth.',
    appliesWhen: when,
    display: { si: 'mN', us: 'lbf' },
  });
}

function lengthInput(
  id: string,
  label: string,
  defaultM: number,
  range: readonly [number, number],
  when: readonly Condition[],
): QuantityInput {
  return quantityInput('length', id, label, defaultM, range, { appliesWhen: when, display: MM });
}

export const calculator: CalculatorDefinition = {
  id: 'wetting-force',
  title: 'Wetting force (tensiometry)',
  summary:
    'Wilhelmy plate and rod, from surface tension to force and back, and the du Noüy ring with the Zuidema–Waters correction of ASTM D971 beside the uncorrected value.',
  inputs: [
    {
      id: 'method',
      label: 'Method',
      kind: 'choice',
      default: 'plate-tension',
      options: [
        { value: 'plate-tension', label: 'Wilhelmy plate: surface tension from the force' },
        { value: 'plate-force', label: 'Wilhelmy plate: force from the surface tension' },
        { value: 'rod-tension', label: 'Rod or fibre: surface tension from the force' },
        { value: 'rod-force', label: 'Rod or fibre: force from the surface tension' },
        { value: 'ring', label: 'du Noüy ring (ASTM D971 correction)' },
      ],
    },
    ...liquidInputs({ when: forward }),
    forceInput('force', 'Measured force on the plate', 2.9e-3, plateInverse),
    forceInput('rodForce', 'Measured force on the rod', 0.23e-3, rodInverse),
    {
      id: 'contactAngleDeg',
      label: 'Contact angle on the probe',
      kind: 'angle',
      default: 0,
      min: 0,
      max: 180,
      help: 'A clean roughened platinum plate is taken as fully wetted, 0° (common practice).',
      appliesWhen: plateOrRod,
    },
    lengthInput('plateWidth', 'Plate width', 0.02, [1e-4, 0.2], plate),
    lengthInput('plateThickness', 'Plate thickness', 1e-4, [0, 0.01], plate),
    lengthInput('rodDiameter', 'Rod diameter', 1e-3, [1e-5, 0.2], rod),
    forceInput('ringForce', 'Maximum pull on the ring', 9e-3, ring),
    {
      ...lengthInput('ringRadius', 'Mean ring radius R', 9.55e-3, [1e-3, 0.05], ring),
      help: 'Half the mean diameter; ASTM D971 rings have a circumference of at least 40 mm.',
    },
    lengthInput('wireRadius', 'Wire radius r', 0.2e-3, [1e-5, 1e-3], ring),
    quantityInput('density', 'densityDifference', 'Density difference of the two phases', 998, [1, 25000], {
      help: 'Lower phase minus upper; against air, the liquid density.',
      appliesWhen: ring,
    }),
    gravityInput(ring),
  ],
  outputs: [
    { id: 'force', label: 'Wetting force', kind: 'force', display: { si: 'mN', us: 'lbf' } },
    {
      id: 'surfaceTension',
      label: 'Surface tension',
      kind: 'surfaceTension',
      help: 'For the ring, the corrected value.',
    },
    { id: 'apparentSurfaceTension', label: 'Uncorrected ring value F/(4πR)', kind: 'surfaceTension' },
    { id: 'correctionFactor', label: 'Correction factor f', kind: 'dimensionless' },
    { id: 'wettedLength', label: 'Wetted length', kind: 'length', display: { si: 'mm', us: 'in' } },
  ],
  warnings: [
    {
      code: 'CONTACT_ANGLE_NOT_ZERO',
      summary: 'A non-zero contact angle is assumed for a plate or rod reading.',
    },
    CONTACT_ANGLE_NEAR_90,
    {
      code: 'RING_BELOW_ASTM_SIZE',
      summary: 'The ring is smaller than the 40 mm circumference of ASTM D971.',
    },
  ],
  cautions: [
    ESTIMATE_CAUTION,
    {
      code: 'PROBE_CLEANING',
      text: 'Plates and rings must be cleaned (e.g. flamed platinum) and the liquid surface fresh; a trace of contamination lowers the reading more than any correction changes it.',
    },
    {
      code: 'BUOYANCY_NEGLECTED',
      text: 'The plate and rod forms take the force at zero immersion depth; any immersion adds a buoyancy term that is not included.',
    },
    CLEAN_SURFACES_CAUTION,
    MERCURY_CAUTION,
  ],
  references: [
    {
      id: 'wilhelmy-1863',
      citation:
        'Wilhelmy L. (1863) Ueber die Abhängigkeit der Capillaritäts-Constanten des Alkohols von Substanz und Gestalt des benetzten festen Körpers, Ann. Phys. 195, 177–217',
      usedFor: 'F = σ·P·cos θ',
      basis: 'printed',
    },
    {
      id: 'astm-d971',
      citation:
        'ASTM D971, Standard Test Method for Interfacial Tension of Insulating Liquids Against Water by the Ring Method',
      usedFor:
        'the Zuidema–Waters factor as ASTM writes it (recalled, to be checked against the current edition), ring of at least 40 mm circumference',
      basis: 'from memory',
    },
    {
      id: 'zuidema-waters-1941',
      citation:
        'Zuidema H. H., Waters G. W. (1941) Ring method for the determination of interfacial tension, Ind. Eng. Chem. Anal. Ed. 13, 312–313',
      usedFor: 'the ring correction factor',
      basis: 'printed',
    },
    {
      id: 'du-nouy-1925',
      citation:
        'du Noüy P. L. (1925) An interfacial tensiometer for universal use, J. Gen. Physiol. 7, 625–631',
      usedFor: 'the ring method, σ* = F/(4πR)',
      basis: 'printed',
    },
    ...WATER_REFERENCES,
    ...LIQUID_TABLE_REFERENCES,
  ],
  solve,
};

/** Runs this calculator alone (what a widget bundling one calculator calls); inputs in SI keyed by input id. */
export const run = runner(calculator);
