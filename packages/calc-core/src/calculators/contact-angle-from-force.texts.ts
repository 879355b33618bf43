// The contact-angle-from-force calculator's texts, apart from its core: see DEVELOPERS.md, "Adding a calculator".
import { CLEAN_SURFACES_CAUTION, ESTIMATE_CAUTION } from './shared-texts.js';
import { OTHER_LIQUID_CAUTION } from './shared.js';
import { explain } from './contact-angle-from-force.working.js';
import type { CalculatorTexts } from './types.js';

export const texts: CalculatorTexts = {
  cautions: [
    ESTIMATE_CAUTION,
    OTHER_LIQUID_CAUTION,
    {
      code: 'PLATE_PREPARATION',
      text: 'The angle belongs to the plate as tested: its surface must be clean, uniform on every side and free of swelling or dissolution in the liquid; a trace of contamination on the plate or the liquid changes the angle more than any correction.',
    },
    CLEAN_SURFACES_CAUTION,
  ],
  references: [
    {
      id: 'wilhelmy-1863',
      citation:
        'Wilhelmy L. (1863) Ueber die Abhängigkeit der Capillaritäts-Constanten des Alkohols von Substanz und Gestalt des benetzten festen Körpers, Ann. Phys. 195, 177–217',
      usedFor: 'the plate force balance F = σ·P·cos θ − B',
      basis: 'printed',
    },
    {
      id: 'astm-d1331',
      citation:
        'ASTM D1331-20, Standard Test Methods for Surface and Interfacial Tension of Solutions of Paints, Solvents, Solutions of Surface-Active Agents, and Related Materials',
      usedFor:
        'Method C, surface tension by the Wilhelmy plate read at zero depth with no buoyancy correction (scope as published); this calculator runs the same balance backwards for the angle, with buoyancy',
      basis: 'printed',
    },
    {
      id: 'iso-19403',
      citation:
        'ISO 19403 series, Paints and varnishes — Wettability (ISO 19403-1:2017 general principles; ISO 19403-6:2024 dynamic advancing and receding angles by changing the volume of a drop)',
      usedFor:
        'the optical contact-angle methods (as its published scope says) that a force-derived angle is compared with; the force method itself is not in the series',
      basis: 'printed',
    },
  ],
  explain,
};
