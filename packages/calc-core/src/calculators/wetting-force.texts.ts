// The wetting-force calculator's texts, apart from its core: see DEVELOPERS.md, "Adding a calculator".
import {
  CLEAN_SURFACES_CAUTION,
  ESTIMATE_CAUTION,
  LIQUID_TABLE_REFERENCES,
  WATER_REFERENCES,
} from './shared-texts.js';
import type { CalculatorTexts } from './types.js';
import { explain } from './wetting-force.working.js';

export const texts: CalculatorTexts = {
  cautions: [
    ESTIMATE_CAUTION,
    {
      code: 'PROBE_CLEANING',
      text: 'Plates and rings must be cleaned (e.g. flamed platinum) and the liquid surface fresh; a trace of contamination lowers the reading more than any correction changes it.',
    },
    {
      code: 'BUOYANCY_NEGLECTED',
      text: 'The plate and rod forms take the force at zero immersion depth; any immersion adds a buoyancy term that is not included.',
    },
    CLEAN_SURFACES_CAUTION,
  ],
  references: [
    {
      id: 'wilhelmy-1863',
      citation:
        'Wilhelmy L. (1863) Ueber die Abhängigkeit der Capillaritäts-Constanten des Alkohols von Substanz und Gestalt des benetzten festen Körpers, Ann. Phys. 195, 177–217',
      usedFor: 'F = σ·P·cos θ',
      basis: 'printed',
    },
    {
      id: 'astm-d971',
      citation:
        'ASTM D971, Standard Test Method for Interfacial Tension of Insulating Liquids Against Water by the Ring Method',
      usedFor:
        'the Zuidema–Waters factor as ASTM writes it (recalled, from memory; the current edition governs), ring of at least 40 mm circumference',
      basis: 'from memory',
    },
    {
      id: 'zuidema-waters-1941',
      citation:
        'Zuidema H. H., Waters G. W. (1941) Ring method for the determination of interfacial tension, Ind. Eng. Chem. Anal. Ed. 13, 312–313',
      usedFor: 'the ring correction factor (the form of the fit recalled, not seen printed here)',
      basis: 'from memory',
    },
    {
      id: 'harkins-jordan-1930',
      citation:
        'Harkins W. D., Jordan H. F. (1930) A method for the determination of surface and interfacial tension from the maximum pull on a ring, J. Am. Chem. Soc. 52, 1751–1772',
      usedFor: 'the variables R/r and R³/V and the range of the correction tables (range from memory)',
      basis: 'from memory',
    },
    {
      id: 'du-nouy-1925',
      citation:
        'du Noüy P. L. (1925) An interfacial tensiometer for universal use, J. Gen. Physiol. 7, 625–631',
      usedFor: 'the ring method, σ* = F/(4πR)',
      basis: 'printed',
    },
    ...WATER_REFERENCES,
    ...LIQUID_TABLE_REFERENCES,
  ],
  warningSummaries: {
    CONTACT_ANGLE_NOT_ZERO: 'A non-zero contact angle is assumed for a plate or rod reading.',
    RING_BELOW_ASTM_SIZE: 'The ring is smaller than the 40 mm circumference of ASTM D971.',
    RING_FACTOR_OUTSIDE_TABLES:
      'The correction factor is outside the 0.75–1.05 band of the tables (from memory).',
    DENSITY_DIFFERENCE_IMPLAUSIBLE:
      'A density difference below 100 kg/m³: against air, likely a g/mL value typed as kg/m³.',
  },
  explain,
};
