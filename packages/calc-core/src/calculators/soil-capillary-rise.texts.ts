// The soil-capillary-rise calculator's texts, apart from its core: see DEVELOPERS.md, "Adding a calculator".
import { ESTIMATE_CAUTION, FOUNDATIONS_CAUTION, FROST_CAUTION } from './shared-texts.js';
import { explain } from './soil-capillary-rise.working.js';
import type { CalculatorTexts } from './types.js';

export const texts: CalculatorTexts = {
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
  warningSummaries: {
    CAPILLARY_RISE_REACHES_SLAB: 'At the chosen C the capillary zone reaches the underside of the slab.',
    CAPILLARY_RISE_MAY_REACH_SLAB:
      "The capillary zone stops below the slab at the chosen C but reaches it at the top of Hazen's published range.",
    LAYER_THINNER_THAN_CODE_MINIMUM: 'The granular layer is thinner than the 4 in (102 mm) of IRC R506.2.2.',
    LAYER_NOT_CLEAN_GRAVEL: 'More than 10 % of the layer passes the No. 4 sieve (D10 below 4.75 mm).',
    WATER_TABLE_IN_LAYER: 'The water table is inside the granular layer.',
  },
  explain,
};
