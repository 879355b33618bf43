// The frost-screening calculator's texts, apart from its core: see DEVELOPERS.md, "Adding a calculator".
import { ESTIMATE_CAUTION, FOUNDATIONS_CAUTION, FROST_CAUTION } from './shared-texts.js';
import { explain } from './frost-screening.working.js';
import type { CalculatorTexts } from './types.js';

export const texts: CalculatorTexts = {
  cautions: [
    ESTIMATE_CAUTION,
    FROST_CAUTION,
    FOUNDATIONS_CAUTION,
    {
      code: 'FROST_TESTING_AND_DESIGN',
      text: 'A grain-size screen is not a frost-heave test: where it matters, have the soil tested for frost heave and thaw weakening (ASTM D5918), and design foundations against frost heave to EN ISO 13793 or the code that applies at the site, with the frost depth it gives.',
      source: 'ASTM D5918; EN ISO 13793',
    },
  ],
  references: [
    {
      id: 'casagrande-1931',
      citation: 'Casagrande A. (1931) Discussion on frost heaving, Highway Research Board Proceedings 11',
      usedFor:
        'the grain-size criterion: 3 % finer than 0.02 mm for non-uniform soils, 10 % for very uniform soils',
      basis: 'from memory',
    },
    {
      id: 'usace-frost-groups',
      citation: 'US Army Corps of Engineers, frost-design soil classification for pavements (groups F1–F4)',
      usedFor: 'the frost-design soil groups by soil kind, share finer than 0.02 mm and plasticity index',
      basis: 'from memory',
    },
    {
      id: 'astm-d5918',
      citation:
        'ASTM D5918, Standard Test Methods for Frost Heave and Thaw Weakening Susceptibility of Soils',
      usedFor: 'the laboratory test this screen defers to',
      basis: 'printed',
    },
    {
      id: 'en-iso-13793',
      citation:
        'EN ISO 13793, Thermal performance of buildings — Thermal design of foundations to avoid frost heave',
      usedFor: 'the design of foundations against frost heave that this screen defers to',
      basis: 'printed',
    },
    {
      id: 'terzaghi-peck-1948',
      citation: 'Terzaghi K., Peck R. B. (1948) Soil Mechanics in Engineering Practice, Wiley',
      usedFor:
        "Hazen's formula h_c = C/(e·D10) and the range of C, 0.1–0.5 cm² (recalled, not seen printed here)",
      basis: 'from memory',
    },
  ],
  warningSummaries: {
    WATER_TABLE_WITHIN_FROST_DEPTH: 'The water table is at or above the frost line.',
    FRINGE_MAY_REACH_FROST_LINE:
      "The fringe stops below the frost line at the chosen C but reaches it at the top of Hazen's published range.",
    INTERMEDIATE_GRADATION:
      'Cu between 5 and 15, where the criterion gives no threshold of its own; the 3 % threshold is applied.',
    NEAR_THRESHOLD: 'The share finer than 0.02 mm is within one percentage point of the threshold.',
    SCREENS_DISAGREE:
      'The Casagrande criterion and the soil group disagree; the soil is taken as susceptible.',
  },
  explain,
};
