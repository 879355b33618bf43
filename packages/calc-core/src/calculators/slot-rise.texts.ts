// The slot-rise calculator's texts, apart from its core: see DEVELOPERS.md, "Adding a calculator".
import {
  CLEAN_SURFACES_CAUTION,
  DAMP_CAUTION,
  ESTIMATE_CAUTION,
  LIQUID_TABLE_REFERENCES,
  RAYLEIGH_REFERENCE,
  WATER_REFERENCES,
} from './shared-texts.js';
import { explain } from './rise-common.working.js';
import type { CalculatorTexts } from './types.js';

export const texts: CalculatorTexts = {
  cautions: [
    ESTIMATE_CAUTION,
    {
      code: 'REAL_CRACKS',
      text: 'Real cracks taper, branch and are rough; the parallel-wall result is an upper-bound style estimate for the narrowest sustained width, not a measurement.',
    },
    CLEAN_SURFACES_CAUTION,
    DAMP_CAUTION,
  ],
  references: [
    {
      id: 'jurin-slot',
      citation:
        "Force balance of Jurin's law per unit length of two parallel plates, as in standard capillarity texts",
      usedFor: 'h = 2σ cos θ/(ρ g w)',
      basis: 'common practice',
    },
    RAYLEIGH_REFERENCE,
    ...WATER_REFERENCES,
    ...LIQUID_TABLE_REFERENCES,
  ],
  explain,
};
