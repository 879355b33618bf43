// The wicking-time calculator's texts, apart from its core: see DEVELOPERS.md, "Adding a calculator".
import {
  CLEAN_SURFACES_CAUTION,
  DAMP_CAUTION,
  ESTIMATE_CAUTION,
  LIQUID_TABLE_REFERENCES,
  VISCOSITY_REFERENCE,
  WATER_REFERENCES,
} from './shared-texts.js';
import type { CalculatorTexts } from './types.js';
import { explain } from './wicking-time.working.js';

export const texts: CalculatorTexts = {
  cautions: [
    ESTIMATE_CAUTION,
    {
      code: 'REAL_POROUS_MEDIA',
      text: 'Real materials have a range of pore sizes, tortuous paths and swelling or dissolving walls; the effective radius has to be fitted to a sorption test on the material itself.',
    },
    DAMP_CAUTION,
    CLEAN_SURFACES_CAUTION,
  ],
  references: [
    {
      id: 'washburn-1921',
      citation: 'Washburn E. W. (1921) The dynamics of capillary flow, Phys. Rev. 17, 273–283',
      usedFor:
        'L² = σ r t cos θ/(2μ), and the equation of motion with gravity that gives the time with gravity',
      basis: 'printed',
    },
    {
      id: 'bosanquet-1923',
      citation: 'Bosanquet C. H. (1923) On the flow of liquids into capillary tubes, Phil. Mag. 45, 525–531',
      usedFor:
        'the time with inertia, d/dt(ρ·x·dx/dt) = 2σ·cos θ/r − 8μ·x·(dx/dt)/r² (citation details from memory)',
      basis: 'from memory',
    },
    {
      id: 'lucas-1918',
      citation:
        'Lucas R. (1918) Ueber das Zeitgesetz des kapillaren Aufstiegs von Flüssigkeiten, Kolloid-Z. 23, 15–22',
      usedFor: 'the same law, found independently',
      basis: 'printed',
    },
    ...WATER_REFERENCES,
    VISCOSITY_REFERENCE,
    ...LIQUID_TABLE_REFERENCES,
  ],
  warningSummaries: {
    GRAVITY_NOT_NEGLIGIBLE:
      'Gravity lengthens the time by more than 5 % (our threshold); use the time with gravity.',
  },
  explain,
};
