// The tension-from-rise calculator's texts, apart from its core: see DEVELOPERS.md, "Adding a calculator".
import { CLEAN_SURFACES_CAUTION, ESTIMATE_CAUTION } from './shared-texts.js';
import { OTHER_LIQUID_CAUTION } from './shared.js';
import { explain } from './tension-from-rise.working.js';
import type { CalculatorTexts } from './types.js';

export const texts: CalculatorTexts = {
  cautions: [
    ESTIMATE_CAUTION,
    OTHER_LIQUID_CAUTION,
    {
      code: 'TUBE_CLEANING',
      text: 'The tube must be scrupulously clean and wetted before the reading; grease or detergent residue changes the contact angle and the result more than any correction.',
    },
    CLEAN_SURFACES_CAUTION,
  ],
  references: [
    {
      id: 'rayleigh-1915',
      citation: 'Lord Rayleigh (1915) On the theory of the capillary tube, Proc. R. Soc. Lond. A 92, 184–195',
      usedFor:
        'surface tension from a rise in a narrow tube with the meniscus correction r/3, valid for r ≪ ℓc (the same geometry for θ > 0 derived here)',
      basis: 'printed',
    },
    {
      id: 'jurin-1718',
      citation:
        'Jurin J. (1718) An account of some experiments shown before the Royal Society, Phil. Trans. 30, 739–747',
      usedFor: 'the force balance of a rise in a tube',
      basis: 'printed',
    },
    {
      id: 'de-gennes-2004',
      citation:
        'de Gennes P.-G., Brochard-Wyart F., Quéré D. (2004) Capillarity and Wetting Phenomena, Springer',
      usedFor: 'the capillary length ℓc = √(σ/(ρ·g))',
      basis: 'printed',
    },
  ],
  explain,
};
