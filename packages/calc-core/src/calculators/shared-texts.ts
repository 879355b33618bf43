// Cautions and references several calculators share. Texts, not code: a calculator's
// `<id>.texts.ts` lists them, and nothing a calculation runs imports this file, so the widget
// fetches them after first paint (see DEVELOPERS.md, "Adding a calculator").
import { liquids } from '../properties/liquids.js';
import type { Caution, Reference } from './types.js';

/** References that bear on a result only with water chosen. */
const WITH_WATER = [{ input: 'liquid', values: ['water'] }] as const;

const TANAKA_SOURCE =
  'Tanaka M., Girard G., Davis R., Peuto A., Bignell N. (2001) Recommended table for the density of water between 0 °C and 40 °C based on recent experimental reports, Metrologia 38, 301–309';
const KELL_SOURCE =
  'Kell G. S. (1975) Density, thermal expansivity, and compressibility of liquid water from 0° to 150 °C, J. Chem. Eng. Data 20, 97–105';

export const ESTIMATE_CAUTION: Caution = {
  code: 'ESTIMATE_ONLY',
  text: 'Results are estimates from idealised published formulas. They do not replace a site investigation or the judgement of a licensed professional working under local codes.',
};

export const CLEAN_SURFACES_CAUTION: Caution = {
  code: 'CLEAN_SURFACES',
  text: 'Surface tension falls sharply with contamination (detergents, oils, organic matter) and contact angles depend on the cleanliness of the surface; the values assume clean liquids and surfaces.',
};

export const DAMP_CAUTION: Caution = {
  code: 'DAMP_DIAGNOSIS',
  text: 'A rise in a tube, slot or crack is not the height of rising damp in a wall: in a wall, evaporation from its faces limits how high water climbs, and salts, the pore structure and the history of the masonry change it. Diagnose damp from gravimetric moisture profiles of drilled samples (BS 6576, BRE Digest 245) before specifying damp-proofing or remedial work.',
  source: 'BS 6576 and BRE Digest 245 (from memory)',
};

export const FROST_CAUTION: Caution = {
  code: 'FROST_HEAVE',
  text: 'Water drawn up by capillarity feeds ice lenses in frost-susceptible soils (silts, fine sands, some clays); where the capillary zone reaches the frost depth, frost heave of slabs, pavements and shallow foundations is possible.',
};

export const FOUNDATIONS_CAUTION: Caution = {
  code: 'FOUNDATIONS',
  text: 'Capillary water changes the moisture and effective stress of the soil under foundations and slabs; foundation design needs a geotechnical investigation.',
};

export const WATER_REFERENCES: readonly Reference[] = [
  {
    id: 'iapws-r1-76',
    citation: 'IAPWS R1-76(2014), Revised Release on Surface Tension of Ordinary Water Substance',
    usedFor: 'surface tension of water from 0.01 °C to the critical point',
    basis: 'printed',
    appliesWhen: WITH_WATER,
  },
  {
    id: 'tanaka-2001',
    citation: TANAKA_SOURCE,
    usedFor: 'density of air-free water at 101 325 Pa, 0–40 °C',
    basis: 'printed',
    appliesWhen: WITH_WATER,
  },
  {
    id: 'kell-1975',
    citation: KELL_SOURCE,
    usedFor: 'density of water at 1 atm above 40 °C (above 100 °C a liquid held at 1 atm)',
    basis: 'printed',
    appliesWhen: WITH_WATER,
  },
];

export const VISCOSITY_REFERENCE: Reference = {
  id: 'iapws-sr6-08',
  citation: 'IAPWS SR6-08 (2011), Supplementary Release on Properties of Liquid Water at 0.1 MPa',
  usedFor: 'viscosity of water',
  basis: 'printed',
  appliesWhen: WITH_WATER,
};

export const LIQUID_TABLE_REFERENCES: readonly Reference[] = [
  {
    id: 'jasper-1972',
    citation:
      'Jasper J. J. (1972) The surface tension of pure liquid compounds, J. Phys. Chem. Ref. Data 1, 841–1009',
    usedFor: 'surface tension of the organic liquids in the table',
    basis: 'printed',
    appliesWhen: [
      {
        input: 'liquid',
        values: liquids.filter((l) => l.surfaceTension.source.startsWith('Jasper')).map((l) => l.id),
      },
    ],
  },
  {
    id: 'adamson-gast-1997',
    citation: 'Adamson A. W., Gast A. P. (1997) Physical Chemistry of Surfaces, 6th ed., Wiley',
    usedFor: 'surface tension of mercury',
    basis: 'printed',
    appliesWhen: [{ input: 'liquid', values: ['mercury'] }],
  },
  {
    id: 'crc-handbook',
    citation: 'CRC Handbook of Chemistry and Physics',
    usedFor:
      'densities and viscosities of the liquids in the table at 20 °C (recalled from the handbook, not read from a printed page here: from memory)',
    basis: 'from memory',
    appliesWhen: [{ input: 'liquid', values: liquids.map((l) => l.id) }],
  },
];

export const RAYLEIGH_REFERENCE: Reference = {
  id: 'rayleigh-1915',
  citation: 'Lord Rayleigh (1915) On the theory of the capillary tube, Proc. R. Soc. Lond. A 92, 184–195',
  usedFor:
    'the meniscus-weight correction r/3 and the small-bore condition (the slot form is derived from the same geometry)',
  basis: 'printed',
};
