// The interface-pressure calculator's texts, apart from its core: see DEVELOPERS.md, "Adding a calculator".
import {
  CLEAN_SURFACES_CAUTION,
  ESTIMATE_CAUTION,
  LIQUID_TABLE_REFERENCES,
  WATER_REFERENCES,
} from './shared-texts.js';
import { explain } from './interface-pressure.working.js';
import type { CalculatorTexts } from './types.js';

export const texts: CalculatorTexts = {
  cautions: [
    ESTIMATE_CAUTION,
    {
      code: 'REAL_PORES',
      text: 'A soil or building material has a distribution of pore sizes and shapes; its air-entry value comes from a measured water-retention curve, and the single-pore figure is a guide to the order of magnitude.',
    },
    CLEAN_SURFACES_CAUTION,
  ],
  references: [
    {
      id: 'young-laplace',
      citation:
        'Young T. (1805) Phil. Trans. R. Soc. 95, 65–87; Laplace P. S. (1806) Traité de mécanique céleste, suppl. au livre X',
      usedFor: 'Δp = σ(1/R₁ + 1/R₂) and its drop, bubble, jet and pore forms',
      basis: 'printed',
    },
    ...WATER_REFERENCES,
    ...LIQUID_TABLE_REFERENCES,
  ],
  warningSummaries: {
    PORE_NON_WETTING: 'θ > 90°: the liquid must be pushed into the pore.',
  },
  explain,
};
