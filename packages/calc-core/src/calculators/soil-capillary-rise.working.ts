// The soil-capillary-rise calculator's working and assumptions, written from the notes its solve
// records (soil-capillary-rise.ts): carried by its texts, so the widget's first flight has none of
// this text.
import { HAZEN_SOURCE } from './hazen.js';
import { q } from './shared.js';
import { hazenRiseStep } from './shared-working.js';
import type { SoilCapillaryRiseAssumed, SoilCapillaryRiseNotes } from './soil-capillary-rise.js';
import type { Explain, Outputs, StepWriters } from './types.js';

const FRINGE =
  'equilibrium suction ρ·g·z: each material holds water up to its own capillary height (common practice)';

/** The outputs with a figure, each with its value: `capillaryRise 0.1 m, …`. */
const corner = (o: Outputs): string =>
  Object.entries(o)
    .filter(([, v]) => v !== null)
    .map(([k, v]) => `${k} ${q(v ?? 0, 'm')}`)
    .join(', ');

const steps: StepWriters<SoilCapillaryRiseNotes> = {
  soilRise: ({ c, e, d10, soilRise }) => [
    hazenRiseStep('soil-rise', 'Capillary rise in the soil', c, e, d10, soilRise),
  ],
  layerRise: ({ c, layerE, layerD10, layerRise }) => [
    hazenRiseStep('layer-rise', 'Capillary rise in the granular layer', c, layerE, layerD10, layerRise),
  ],
  layered: ({ depth, t, soilRise, layerRise, soilReachesLayer, wetZoneTop, clearance }) => {
    const base = Math.max(depth - t, 0);
    return [
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
        label: soilReachesLayer
          ? 'Top of the wet zone: the soil fringe reaches the layer, which takes it to its own height'
          : 'Top of the wet zone: the soil fringe stops below the layer, which stays dry',
        formula: 'z_w = h_soil if h_soil < z_b, else max(z_b, h_layer)',
        substituted: soilReachesLayer
          ? `${q(soilRise, 'm')} ≥ ${q(base, 'm')}: max(${q(base, 'm')}, ${q(layerRise, 'm')})`
          : `${q(soilRise, 'm')} < ${q(base, 'm')}`,
        value: wetZoneTop,
        unit: 'm',
        source: FRINGE,
      },
      {
        id: 'clearance',
        label: 'Clearance between the capillary zone and the slab',
        formula: 'D_w − z_w',
        substituted: `${q(depth, 'm')} − ${q(wetZoneTop, 'm')}`,
        value: clearance,
        unit: 'm',
        source: FRINGE,
      },
    ];
  },
  clearance: ({ depth, soilRise, clearance }) => [
    {
      id: 'clearance',
      label: 'Clearance between the capillary zone and the slab',
      formula: 'D_w − h_soil',
      substituted: `${q(depth, 'm')} − ${q(soilRise, 'm')}`,
      value: clearance,
      unit: 'm',
      source: FRINGE,
    },
  ],
  band: ({ lo, hi, value }) => [
    {
      id: 'band',
      label: "Band over the published range of Hazen's constant: the lowest clearance",
      formula: 'the same steps at C = 0.1 cm² and C = 0.5 cm²',
      substituted: `C = 0.1 cm²: ${corner(lo)}; C = 0.5 cm²: ${corner(hi)}`,
      value,
      unit: 'm',
      source: HAZEN_SOURCE,
    },
  ],
};

function assumptions({ layered }: SoilCapillaryRiseAssumed): string[] {
  return [
    'Hydrostatic equilibrium above a static water table: no evaporation, infiltration or flow.',
    "Each material is uniform; its capillary height is Hazen's empirical estimate, a sharp top to the capillary fringe.",
    "Hazen's constant C within its published range of 0.1–0.5 cm² (the band spans all of it).",
    'Clean water at ordinary ground temperature.',
    ...(layered
      ? ['The granular layer lies directly under the slab, over the soil, with no membrane between.']
      : []),
  ];
}

export const explain: Explain = { steps, assumptions };
