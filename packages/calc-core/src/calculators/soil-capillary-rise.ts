import { capillaryBreakCheck } from '../formulas/capillary-break.js';
import { HAZEN_C_RANGE_M2, hazenCapillaryRise } from '../formulas/soil.js';
import { bandOver, computer } from './engine.js';
import { runner } from './run.js';
import { HAZEN_BASIS, hazenCInput } from './hazen.js';
import { choice, MM, noteTaker, num, q, quantityInput, solved, warning } from './shared.js';
import { explain } from './soil-capillary-rise.working.js';
import type { CalculatorCore, InputValues, Outputs, Warning } from './types.js';

/** IRC R506.2.2: a 4-inch-thick (102 mm) base course under a slab below grade. */
const CODE_MIN_LAYER_M = 4 * 0.0254;
/** ASTM E11 opening of the No. 4 sieve; ≤ 10 % passing it means D10 ≥ 4.75 mm. */
const NO4_SIEVE_M = 4.75e-3;
/** No. 200 sieve, the sand/fines boundary of ASTM D2487. */
const NO200_SIEVE_M = 0.075e-3;

const withLayer = [{ input: 'breakLayer', values: ['granular'] }] as const;

/** What soil-capillary-rise.working.ts writes each step of the working from, by note key. */
export interface SoilCapillaryRiseNotes {
  readonly soilRise: {
    readonly c: number;
    readonly e: number;
    readonly d10: number;
    readonly soilRise: number;
  };
  readonly layerRise: {
    readonly c: number;
    readonly layerE: number;
    readonly layerD10: number;
    readonly layerRise: number;
  };
  readonly layered: {
    readonly depth: number;
    readonly t: number;
    readonly soilRise: number;
    readonly layerRise: number;
    readonly soilReachesLayer: boolean;
    readonly wetZoneTop: number;
    readonly clearance: number;
  };
  readonly clearance: { readonly depth: number; readonly soilRise: number; readonly clearance: number };
  /** The outputs at either end of Hazen's constant's range, and the band's worst value. */
  readonly band: { readonly lo: Outputs; readonly hi: Outputs; readonly value: number };
}

/** What the assumptions are written from. */
export interface SoilCapillaryRiseAssumed {
  readonly layered: boolean;
}

function solve(inputs: InputValues): ReturnType<CalculatorCore['solve']> {
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

  // The working's text is written from these notes by soil-capillary-rise.working.ts (`calculate` only).
  const working = noteTaker<SoilCapillaryRiseNotes>();
  if (!fine) working.add('soilRise', { c, e, d10, soilRise });
  if (layerRise !== null) working.add('layerRise', { c, layerE, layerD10, layerRise });
  if (!fine && layerRise !== null) {
    working.add('layered', {
      depth,
      t,
      soilRise,
      layerRise,
      soilReachesLayer: check.soilReachesLayer,
      wetZoneTop: check.wetZoneTop,
      clearance,
    });
  } else if (!fine) working.add('clearance', { depth, soilRise, clearance });

  const band = bandOver([HAZEN_BASIS], outputs, (v) => evaluate(v.hazenC ?? c));
  if (band !== null) {
    working.add('band', {
      lo: evaluate(HAZEN_C_RANGE_M2.min),
      hi: evaluate(HAZEN_C_RANGE_M2.max),
      value: band.outputs.slabClearance?.low ?? band.outputs.layerCapillaryRise?.high ?? 0,
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
  return solved({ outputs, warnings, band, notes: working.list, assumed: { layered } });
}

export const calculator: CalculatorCore = {
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
    hazenCInput(
      'Depends on grain shape and surface impurities; published range 0.1–0.5 cm². The default is the middle of the range; the band always spans all of it.',
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
    { code: 'CAPILLARY_RISE_REACHES_SLAB' },
    { code: 'CAPILLARY_RISE_MAY_REACH_SLAB' },
    { code: 'LAYER_THINNER_THAN_CODE_MINIMUM' },
    { code: 'LAYER_NOT_CLEAN_GRAVEL' },
    { code: 'WATER_TABLE_IN_LAYER' },
    {
      code: 'FINE_GRAINED_SOIL',
      summary: "D10 is finer than 0.075 mm, outside the sands Hazen's relation was drawn from.",
    },
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
