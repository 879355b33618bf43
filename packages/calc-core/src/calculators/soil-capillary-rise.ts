import { capillaryBreakCheck, HAZEN_C_RANGE_M2, hazenCapillaryRise } from '../formulas/soil.js';
import { bandOver, runner } from './engine.js';
import {
  choice,
  ESTIMATE_CAUTION,
  fmt,
  FOUNDATIONS_CAUTION,
  FROST_CAUTION,
  MM,
  num,
  q,
  quantityInput,
  warning,
  solved,
} from './shared.js';
import type { CalculatorDefinition, InputValues, Outputs, Warning, WorkingStep } from './types.js';

const HAZEN_SOURCE =
  'Terzaghi & Peck (1948): C = 0.1–0.5 cm² (10–50 mm²), as given by Smith, Elements of Soil Mechanics (from memory)';
/** IRC R506.2.2: a 4-inch-thick (102 mm) base course under a slab below grade. */
const CODE_MIN_LAYER_M = 4 * 0.0254;
/** ASTM E11 opening of the No. 4 sieve; ≤ 10 % passing it means D10 ≥ 4.75 mm. */
const NO4_SIEVE_M = 4.75e-3;
/** No. 200 sieve, the sand/fines boundary of ASTM D2487. */
const NO200_SIEVE_M = 0.075e-3;

const withLayer = [{ input: 'breakLayer', values: ['granular'] }] as const;

function riseStep(id: string, label: string, c: number, e: number, d10: number, value: number): WorkingStep {
  return {
    id,
    label,
    formula: 'h_c = C / (e·D10)',
    substituted: `${q(c, 'm2')} / (${fmt(e)} × ${q(d10, 'm')})`,
    value,
    unit: 'm',
    source: 'Hazen, as given by Terzaghi & Peck (1948) (from memory)',
  };
}

function solve(inputs: InputValues): ReturnType<CalculatorDefinition['solve']> {
  const d10 = num(inputs, 'd10');
  const e = num(inputs, 'voidRatio');
  const c = num(inputs, 'hazenC');
  const depth = num(inputs, 'waterTableDepth');
  const layered = choice(inputs, 'breakLayer') === 'granular';
  const t = layered ? num(inputs, 'layerThickness') : 0;
  const layerD10 = layered ? num(inputs, 'layerD10') : 0;
  const layerE = layered ? num(inputs, 'layerVoidRatio') : 0;

  // Hazen's relation was drawn from sands: finer than the No. 200 sieve it is no longer the method,
  // so no rise (and no clearance built on it) is given.
  const fine = d10 < NO200_SIEVE_M;
  const evaluate = (cValue: number): Outputs => {
    const soilRise = hazenCapillaryRise({ d10, voidRatio: e, c: cValue });
    const layerRise = layered ? hazenCapillaryRise({ d10: layerD10, voidRatio: layerE, c: cValue }) : null;
    const check = capillaryBreakCheck({
      waterTableDepth: depth,
      soilRise,
      ...(layerRise !== null ? { layer: { thickness: t, rise: layerRise } } : {}),
    });
    return {
      capillaryRise: fine ? null : soilRise,
      layerCapillaryRise: layerRise,
      slabClearance: fine ? null : check.clearance,
    };
  };
  const outputs = evaluate(c);
  const soilRise = hazenCapillaryRise({ d10, voidRatio: e, c });
  const layerRise = layered ? hazenCapillaryRise({ d10: layerD10, voidRatio: layerE, c }) : null;
  const check = capillaryBreakCheck({
    waterTableDepth: depth,
    soilRise,
    ...(layerRise !== null ? { layer: { thickness: t, rise: layerRise } } : {}),
  });
  const clearance = check.clearance;

  const working: WorkingStep[] = [];
  if (!fine) working.push(riseStep('soil-rise', 'Capillary rise in the soil', c, e, d10, soilRise));
  const fringe =
    'equilibrium suction ρ·g·z: each material holds water up to its own capillary height (common practice)';
  if (layerRise !== null) {
    working.push(
      riseStep('layer-rise', 'Capillary rise in the granular layer', c, layerE, layerD10, layerRise),
    );
  }
  if (!fine && layerRise !== null) {
    const base = Math.max(depth - t, 0);
    working.push(
      {
        id: 'layer-base',
        label: 'Height of the base of the layer above the water table',
        formula: 'z_b = max(D_w − t, 0)',
        substituted: `max(${q(depth, 'm')} − ${q(t, 'm')}, 0)`,
        value: base,
        unit: 'm',
        source: 'geometry of the profile',
      },
      {
        id: 'wet-top',
        label: check.soilReachesLayer
          ? 'Top of the wet zone: the soil fringe reaches the layer, which takes it to its own height'
          : 'Top of the wet zone: the soil fringe stops below the layer, which stays dry',
        formula: 'z_w = h_soil if h_soil < z_b, else max(z_b, h_layer)',
        substituted: check.soilReachesLayer
          ? `${q(soilRise, 'm')} ≥ ${q(base, 'm')}: max(${q(base, 'm')}, ${q(layerRise, 'm')})`
          : `${q(soilRise, 'm')} < ${q(base, 'm')}`,
        value: check.wetZoneTop,
        unit: 'm',
        source: fringe,
      },
      {
        id: 'clearance',
        label: 'Clearance between the capillary zone and the slab',
        formula: 'D_w − z_w',
        substituted: `${q(depth, 'm')} − ${q(check.wetZoneTop, 'm')}`,
        value: clearance,
        unit: 'm',
        source: fringe,
      },
    );
  } else if (!fine) {
    working.push({
      id: 'clearance',
      label: 'Clearance between the capillary zone and the slab',
      formula: 'D_w − h_soil',
      substituted: `${q(depth, 'm')} − ${q(soilRise, 'm')}`,
      value: clearance,
      unit: 'm',
      source: fringe,
    });
  }

  const band = bandOver(
    [{ input: 'hazenC', low: HAZEN_C_RANGE_M2.min, high: HAZEN_C_RANGE_M2.max, source: HAZEN_SOURCE }],
    outputs,
    (v) => evaluate(v.hazenC ?? c),
  );
  if (band !== null) {
    const lo = evaluate(HAZEN_C_RANGE_M2.min);
    const hi = evaluate(HAZEN_C_RANGE_M2.max);
    const corner = (o: Outputs): string =>
      Object.entries(o)
        .filter(([, v]) => v !== null)
        .map(([k, v]) => `${k} ${q(v ?? 0, 'm')}`)
        .join(', ');
    working.push({
      id: 'band',
      label: "Band over the published range of Hazen's constant: the lowest clearance",
      formula: 'the same steps at C = 0.1 cm² and C = 0.5 cm²',
      substituted: `C = 0.1 cm²: ${corner(lo)}; C = 0.5 cm²: ${corner(hi)}`,
      value: band.outputs.slabClearance?.low ?? band.outputs.layerCapillaryRise?.high ?? 0,
      unit: 'm',
      source: HAZEN_SOURCE,
    });
  }
  const worst = band?.outputs.slabClearance?.low ?? clearance;

  const warnings: Warning[] = [];
  if (!fine && clearance <= 0) {
    warnings.push(
      warning(
        'CAPILLARY_RISE_REACHES_SLAB',
        layered
          ? `The granular layer itself draws capillary water up to the slab (its rise of ${q(layerRise ?? 0, 'm')} against a water table ${q(depth, 'm')} below the slab): it does not work as a capillary break.`
          : `Capillary rise from the water table (${q(soilRise, 'm')}) reaches the underside of the slab ${q(depth, 'm')} above it.`,
        ['waterTableDepth'],
        { step: 'clearance' },
      ),
    );
  } else if (!fine && worst <= 0) {
    warnings.push(
      warning(
        'CAPILLARY_RISE_MAY_REACH_SLAB',
        `With Hazen's constant at the top of its published range (0.5 cm²) the capillary zone reaches the slab; the margin of ${q(clearance, 'm')} is not secure.`,
        ['waterTableDepth', 'hazenC'],
        { step: 'band' },
      ),
    );
  }
  if (layered && t < CODE_MIN_LAYER_M) {
    warnings.push(
      warning(
        'LAYER_THINNER_THAN_CODE_MINIMUM',
        `The granular layer is ${q(t, 'm')} thick; IRC R506.2.2 asks for at least 4 in (102 mm) of base course under a slab below grade. Local codes govern.`,
        ['layerThickness'],
      ),
    );
  }
  if (layered && layerD10 < NO4_SIEVE_M) {
    warnings.push(
      warning(
        'LAYER_NOT_CLEAN_GRAVEL',
        `A layer D10 of ${q(layerD10, 'm')} means more than 10 % passes the No. 4 (4.75 mm) sieve; the IBC floor base course asks for gravel or crushed stone with no more than 10 % passing it.`,
        ['layerD10'],
        { step: 'layer-rise' },
      ),
    );
  }
  if (layered && depth <= t) {
    warnings.push(
      warning(
        'WATER_TABLE_IN_LAYER',
        'The water table is within the granular layer: the layer is saturated from below and cannot act as a capillary break.',
        ['waterTableDepth', 'layerThickness'],
      ),
    );
  }
  if (fine) {
    warnings.push(
      warning(
        'FINE_GRAINED_SOIL',
        `D10 of ${q(d10, 'm')} is finer than the No. 200 sieve (0.075 mm): Hazen's relation was drawn from sands and does not hold in silts and clays, so no rise or clearance is given. Have the capillary rise measured, or use a soil-water retention curve.`,
        ['d10'],
        { withholds: ['capillaryRise', 'slabClearance'] },
      ),
    );
  }
  return solved({
    outputs,
    working,
    warnings,
    band,
    assumptions: [
      'Hydrostatic equilibrium above a static water table: no evaporation, infiltration or flow.',
      "Each material is uniform; its capillary height is Hazen's empirical estimate, a sharp top to the capillary fringe.",
      "Hazen's constant C within its published range of 0.1–0.5 cm² (the band spans all of it).",
      'Clean water at ordinary ground temperature.',
      ...(layered
        ? ['The granular layer lies directly under the slab, over the soil, with no membrane between.']
        : []),
    ],
  });
}

export const calculator: CalculatorDefinition = {
  id: 'soil-capillary-rise',
  title: 'Capillary rise in soil and capillary-break check',
  summary:
    "Height capillary water rises above the water table in a soil, by Hazen's formula with the band its published constant gives, and whether it reaches the underside of a slab or pavement through a granular capillary-break layer.",
  inputs: [
    quantityInput('length', 'd10', 'Effective grain size D10 of the soil', 0.1e-3, [1e-6, 0.02], {
      help: 'The sieve size that 10 % of the soil by mass passes.',
      display: MM,
    }),
    quantityInput('dimensionless', 'voidRatio', 'Void ratio e of the soil', 0.6, [0.1, 3]),
    quantityInput(
      'area',
      'hazenC',
      "Hazen's constant C",
      3e-5,
      [HAZEN_C_RANGE_M2.min, HAZEN_C_RANGE_M2.max],
      {
        spread: { low: HAZEN_C_RANGE_M2.min, high: HAZEN_C_RANGE_M2.max, source: HAZEN_SOURCE },
        help: 'Depends on grain shape and surface impurities; published range 0.1–0.5 cm². The default is the middle of the range; the band always spans all of it.',
        display: { si: 'cm2', us: 'cm2' },
      },
    ),
    quantityInput(
      'length',
      'waterTableDepth',
      'Depth of the water table below the underside of the slab',
      1,
      [0, 50],
      {
        display: { si: 'm', us: 'ft' },
      },
    ),
    {
      id: 'breakLayer',
      label: 'Under the slab',
      kind: 'choice',
      default: 'granular',
      options: [
        { value: 'granular', label: 'A granular capillary-break layer' },
        { value: 'none', label: 'Slab directly on the soil' },
      ],
    },
    quantityInput('length', 'layerThickness', 'Thickness of the granular layer', 0.15, [0.01, 3], {
      appliesWhen: withLayer,
      display: MM,
    }),
    quantityInput('length', 'layerD10', 'Effective grain size D10 of the layer', 6e-3, [1e-4, 0.1], {
      appliesWhen: withLayer,
      display: MM,
    }),
    quantityInput('dimensionless', 'layerVoidRatio', 'Void ratio of the layer', 0.5, [0.1, 3], {
      appliesWhen: withLayer,
    }),
  ],
  outputs: [
    {
      id: 'capillaryRise',
      label: 'Capillary rise in the soil',
      kind: 'length',
      display: { si: 'm', us: 'ft' },
    },
    {
      id: 'layerCapillaryRise',
      label: 'Capillary rise in the granular layer',
      kind: 'length',
      help: 'Measured from the water table; Hazen applied to gravel is an order-of-magnitude figure.',
      display: { si: 'mm', us: 'in' },
    },
    {
      id: 'slabClearance',
      label: 'Clearance between the capillary zone and the slab',
      kind: 'length',
      helpBySign: {
        above: 'How far below the underside of the slab the capillary water stops.',
        atOrBelow: 'Zero or less: capillary water reaches the underside of the slab.',
      },
      display: { si: 'm', us: 'ft' },
    },
  ],
  headline: {
    rules: [
      {
        output: 'slabClearance',
        text: 'Capillary water stays about {value} below the slab.',
        atOrBelow: 'Capillary water reaches the slab.',
      },
    ],
    missing: 'clearance under the slab',
  },
  warnings: [
    {
      code: 'CAPILLARY_RISE_REACHES_SLAB',
      summary: 'At the chosen C the capillary zone reaches the underside of the slab.',
    },
    {
      code: 'CAPILLARY_RISE_MAY_REACH_SLAB',
      summary:
        "The capillary zone stops below the slab at the chosen C but reaches it at the top of Hazen's published range.",
    },
    {
      code: 'LAYER_THINNER_THAN_CODE_MINIMUM',
      summary: 'The granular layer is thinner than the 4 in (102 mm) of IRC R506.2.2.',
    },
    {
      code: 'LAYER_NOT_CLEAN_GRAVEL',
      summary: 'More than 10 % of the layer passes the No. 4 sieve (D10 below 4.75 mm).',
    },
    { code: 'WATER_TABLE_IN_LAYER', summary: 'The water table is inside the granular layer.' },
    {
      code: 'FINE_GRAINED_SOIL',
      summary: "D10 is finer than 0.075 mm, outside the sands Hazen's relation was drawn from.",
    },
  ],
  cautions: [
    ESTIMATE_CAUTION,
    FROST_CAUTION,
    FOUNDATIONS_CAUTION,
    {
      code: 'DAMP_SLABS',
      text: 'A capillary break does not stop vapour: moisture-sensitive floor finishes also need a vapour retarder and a dry slab, checked by measurement.',
    },
    {
      code: 'LOCAL_CODES',
      text: 'The code checks quoted (IRC R506.2.2, the IBC floor base course) are US model-code provisions; the code that applies at the site governs the layer.',
    },
  ],
  references: [
    {
      id: 'terzaghi-peck-1948',
      citation: 'Terzaghi K., Peck R. B. (1948) Soil Mechanics in Engineering Practice, Wiley',
      usedFor:
        "Hazen's formula h_c = C/(e·D10) and the range of C, 0.1–0.5 cm² (as given by Smith, Elements of Soil Mechanics, and Holtz & Kovacs; recalled, not seen printed here)",
      basis: 'from memory',
    },
    {
      id: 'heath-1982',
      citation: 'Heath R. C. (1982, rev. 1983) Basic Ground-Water Hydrology, USGS Water-Supply Paper 2220',
      usedFor: 'typical capillary rise: coarse sand 12.5 cm, medium sand 25 cm, fine sand 40 cm, silt 100 cm',
      basis: 'printed',
    },
    {
      id: 'irc-r506-2-2',
      citation: 'International Residential Code, R506.2.2 Base',
      usedFor: '4 in (102 mm) base course under a slab below grade',
      basis: 'printed',
    },
    {
      id: 'ibc-floor-base-course',
      citation: 'International Building Code, floor base course (section 1807.4.1 in early editions)',
      usedFor: 'at least 4 in of gravel or crushed stone with no more than 10 % passing the No. 4 sieve',
      basis: 'printed',
    },
  ],
  solve,
};

/** Runs this calculator alone (what a widget bundling one calculator calls); inputs in SI keyed by input id. */
export const run = runner(calculator);
