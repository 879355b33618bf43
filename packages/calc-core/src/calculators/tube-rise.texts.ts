// The tube-rise calculator's texts, apart from its core: see DEVELOPERS.md, "Adding a calculator".
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
  cautions: [ESTIMATE_CAUTION, CLEAN_SURFACES_CAUTION, DAMP_CAUTION],
  references: [
    {
      id: 'jurin-1718',
      citation:
        'Jurin J. (1718) An account of some experiments shown before the Royal Society, Phil. Trans. 30, 739–747',
      usedFor: "Jurin's law, h = 4σ cos θ/(ρ g d)",
      basis: 'printed',
    },
    RAYLEIGH_REFERENCE,
    ...WATER_REFERENCES,
    ...LIQUID_TABLE_REFERENCES,
  ],
  explain,
};
