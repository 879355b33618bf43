// The rising-damp-height calculator's texts, apart from its core: see DEVELOPERS.md, "Adding a calculator".
import { ESTIMATE_CAUTION } from './shared-texts.js';
import { explain } from './rising-damp-height.working.js';
import type { CalculatorTexts } from './types.js';

export const texts: CalculatorTexts = {
  cautions: [
    ESTIMATE_CAUTION,
    {
      code: 'RISING_DAMP_DIAGNOSIS',
      text: 'A calculated height is not a diagnosis. Leaks, rain penetration, condensation and hygroscopic salts wet walls more often than rising damp does: establish the source from gravimetric moisture profiles of drilled samples (BS 6576, BRE Digest 245) before specifying a damp-proof course, injection or any remedial work.',
      source: 'BS 6576 and BRE Digest 245 (from memory)',
    },
    {
      code: 'FINISHES_RAISE_DAMP',
      text: 'Anything that lowers evaporation from the faces (cement renders, impermeable paints, tanking, raised ground or floor levels) raises the height water climbs to; removing breathable finishes can make rising damp worse, not better.',
    },
    {
      code: 'STRUCTURE_AND_HEALTH',
      text: 'Persistently wet masonry loses strength and frost resistance and can rot embedded timber; mould from damp walls is a health risk. Have a surveyor or structural engineer assess the wall under local building regulations.',
    },
  ],
  references: [
    {
      id: 'hall-hoff-2007',
      citation:
        'Hall C., Hoff W. D. (2007) Rising damp: capillary rise dynamics in walls, Proc. R. Soc. A 463, 1871–1884',
      usedFor:
        'the sharp-front model of rising damp and its steady height h_ss = S·(b/(2eθ_w))^½ (the form recalled, the paper not seen printed here); the water held, flow, time constant and time to steady state are derived here from the same balance',
      basis: 'from memory',
    },
    {
      id: 'hall-hoff-book',
      citation: 'Hall C., Hoff W. D., Water Transport in Brick, Stone and Concrete, Taylor & Francis',
      usedFor: 'sorptivity and the sharp-front description of capillary absorption',
      basis: 'from memory',
    },
    {
      id: 'bs-6576-bre-245',
      citation:
        'BS 6576, Code of practice for diagnosis of rising damp in walls of buildings; BRE Digest 245',
      usedFor: 'diagnosis by gravimetric moisture profiles',
      basis: 'from memory',
    },
  ],
  warningSummaries: {
    WET_ZONE_NOT_TALL:
      'The steady height is below the wall thickness, where an even water content across the wall is a poor approximation.',
    HEIGHT_ABOVE_OBSERVED:
      'The steady height is above 2 m, which rising damp rarely reaches in practice (common practice).',
    SLOW_APPROACH:
      'More than ten years to approach steady state: the steady figures are a limit the wall does not reach.',
  },
  explain,
};
