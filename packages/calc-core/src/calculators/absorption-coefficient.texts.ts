// The absorption-coefficient calculator's texts, apart from its core: see DEVELOPERS.md, "Adding a calculator".
import { DAMP_CAUTION, ESTIMATE_CAUTION } from './shared-texts.js';
import { explain } from './absorption-coefficient.working.js';
import type { CalculatorTexts } from './types.js';

export const texts: CalculatorTexts = {
  cautions: [
    ESTIMATE_CAUTION,
    {
      code: 'LABORATORY_RESULT',
      text: "The coefficient describes the specimens tested under the method's conditions. Weathering, salts, coatings and moisture already in a wall change how much water it takes up; judge a building from its own survey.",
    },
    DAMP_CAUTION,
  ],
  references: [
    {
      id: 'en-iso-15148',
      citation:
        'EN ISO 15148:2002 (+A1:2016) Hygrothermal performance of building materials and products — Determination of water absorption coefficient by partial immersion',
      usedFor: 'A_w as the slope of Δm/A against √t, stated per √s and per √h (clause details from memory)',
      basis: 'from memory',
    },
    {
      id: 'astm-c1585',
      citation:
        'ASTM C1585 Standard Test Method for Measurement of Rate of Absorption of Water by Hydraulic-Cement Concretes',
      usedFor:
        'I = Δm/(a·ρ_w) against √t, the initial rate from 1 min to 6 h, and no rate when r < 0.98 (clause details from memory)',
      basis: 'from memory',
    },
    {
      id: 'hall-1989',
      citation:
        'Hall C. (1989) Water sorptivity of mortars and concretes: a review, Magazine of Concrete Research 41, 51–61',
      usedFor: 'sorptivity as the slope of the absorbed volume per area against √t (citation from memory)',
      basis: 'from memory',
    },
  ],
  explain,
};
