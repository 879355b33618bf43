import { CalcInputError } from '../errors.js';
import { contactAnglePresets, getContactAnglePreset } from '../properties/contactAngles.js';
import { getLiquid, liquids, MERCURY_HAZARD } from '../properties/liquids.js';
import {
  KELL_SOURCE,
  TANAKA_SOURCE,
  waterDensity,
  waterSurfaceTension,
  waterViscosity,
} from '../properties/water.js';
import { withUnit } from '../display.js';
import { formatValue } from '../format.js';
import { STANDARD_GRAVITY, type UnitId } from '../units.js';
import type {
  BandBasis,
  Caution,
  ChoiceInput,
  Condition,
  InputDefinition,
  InputValues,
  QuantityInput,
  Reference,
  Warning,
  WorkingStep,
} from './types.js';

// Pieces every calculator shares: the liquid and contact-angle inputs and how they resolve into
// numbers (with their working), gravity, number formatting, and the common cautions.
//
// Liquid design: the `liquid` choice decides where σ, ρ and μ come from.
//   water  → the IAPWS / Tanaka / Kell correlations at `temperatureC` (the only input that then shows);
//   a table liquid → its 20 °C row in `liquids` (temperature does not apply: the table has one row);
//   custom → the `surfaceTension`, `density` and `viscosity` inputs as typed.
// So a temperature never silently changes a value it cannot change, and a typed σ is never
// overwritten by a correlation.

// ---------------------------------------------------------------- number formatting for working

/** Working and warnings print numbers with the one formatter people see everywhere (`format.ts`). */
export { formatValue as fmt } from '../format.js';

/** A number with its unit symbol, spaced by the one rule (`display.ts`): `0.07274 N/m`, `20 °C`, `0°`. */
export function q(value: number, unit: UnitId, digits = 4): string {
  return withUnit(formatValue(value, digits), unit);
}

/** A warning instance; `fields` are the input ids a form should highlight. */
export function warning(code: string, message: string, fields: readonly string[]): Warning {
  return { code, message, fields };
}

// ---------------------------------------------------------------- reading resolved inputs

/** A resolved numeric input; throws if the definition and the solver disagree (a calc-core bug). */
export function num(inputs: InputValues, id: string): number {
  const v = inputs[id];
  if (typeof v !== 'number') throw new Error(`input ${id} is not a resolved number`);
  return v;
}

/** A resolved choice input. */
export function choice(inputs: InputValues, id: string): string {
  const v = inputs[id];
  if (typeof v !== 'string') throw new Error(`input ${id} is not a resolved choice`);
  return v;
}

// ---------------------------------------------------------------- input builders

/** Small lengths read best in millimetres and inches. */
export const MM = { si: 'mm', us: 'in' } as const;

/** A numeric input; bounds are the physical range the formulas are used over, canonical units. */
export function quantityInput(
  kind: QuantityInput['kind'],
  id: string,
  label: string,
  defaultValue: number,
  range: readonly [min: number, max: number],
  extra: Partial<Pick<QuantityInput, 'help' | 'appliesWhen' | 'display' | 'spread'>> = {},
): QuantityInput {
  return { id, label, kind, default: defaultValue, min: range[0], max: range[1], ...extra };
}

// ---------------------------------------------------------------- liquid

export const CUSTOM = 'custom';

export interface LiquidNeeds {
  readonly density?: boolean;
  readonly viscosity?: boolean;
  /** Conditions under which the liquid inputs apply at all (e.g. only in some methods). */
  readonly when?: readonly Condition[];
}

/** The liquid choice, the water temperature and the custom property inputs. */
export function liquidInputs(needs: LiquidNeeds): InputDefinition[] {
  const when = needs.when ?? [];
  const custom: readonly Condition[] = [...when, { input: 'liquid', values: [CUSTOM] }];
  const list: InputDefinition[] = [
    {
      id: 'liquid',
      label: 'Liquid',
      kind: 'choice',
      default: 'water',
      options: [
        {
          value: 'water',
          label: 'Water',
          help: 'Properties from the IAPWS, Tanaka and Kell correlations at the temperature given.',
        },
        ...liquids.map((l) => ({
          value: l.id,
          label: l.name,
          help: `Table values at ${l.temperatureC} °C.`,
        })),
        { value: CUSTOM, label: 'Other (enter properties)' },
      ],
      ...(when.length > 0 ? { appliesWhen: when } : {}),
    },
    {
      id: 'temperatureC',
      label: 'Water temperature',
      kind: 'temperature',
      default: 20,
      min: 0.01,
      max: 100,
      help: 'Sets the surface tension, density and viscosity of water. 0.01 °C is the triple point, below which IAPWS R1-76 does not go.',
      appliesWhen: [...when, { input: 'liquid', values: ['water'] }],
    },
    quantityInput('surfaceTension', 'surfaceTension', 'Surface tension', 0.072, [1e-3, 1], {
      appliesWhen: custom,
    }),
  ];
  if (needs.density === true) {
    list.push(
      quantityInput('density', 'density', 'Liquid density', 1000, [100, 25000], { appliesWhen: custom }),
    );
  }
  if (needs.viscosity === true) {
    list.push(
      quantityInput('viscosity', 'viscosity', 'Viscosity', 1e-3, [1e-5, 100], { appliesWhen: custom }),
    );
  }
  return list;
}

export interface ResolvedLiquid {
  readonly id: string;
  readonly name: string;
  readonly surfaceTension: number;
  readonly density: number;
  readonly viscosity: number;
  readonly working: readonly WorkingStep[];
  readonly hazard?: string;
}

const IAPWS_ST = 'IAPWS R1-76(2014)';
const SR6 = 'IAPWS SR6-08 (2011)';

function waterProperty<T>(compute: () => T): T {
  try {
    return compute();
  } catch (err) {
    if (err instanceof RangeError) {
      throw new CalcInputError({
        field: 'temperatureC',
        code: 'OUT_OF_CORRELATION_RANGE',
        message: err.message,
      });
    }
    throw err;
  }
}

/**
 * σ, ρ and μ for the chosen liquid, with one working line each for what the calculator uses.
 * Values not asked for are NaN-free placeholders (0) and carry no working.
 */
export function resolveLiquid(inputs: InputValues, needs: LiquidNeeds): ResolvedLiquid {
  const id = choice(inputs, 'liquid');
  const working: WorkingStep[] = [];
  if (id === 'water') {
    const t = num(inputs, 'temperatureC');
    const T = t + 273.15;
    const sigma = waterProperty(() => waterSurfaceTension(t));
    working.push({
      label: `Surface tension of water at ${q(t, 'degC')}`,
      formula: 'σ = 235.8 mN/m · τ^1.256 · (1 − 0.625·τ), τ = 1 − T / 647.096 K',
      substituted: `T = ${q(T, 'K', 6)}, τ = ${formatValue(1 - T / 647.096)}`,
      value: sigma,
      unit: 'N/m',
      source: IAPWS_ST,
    });
    let rho = 0;
    if (needs.density === true) {
      const d = waterProperty(() => waterDensity(t));
      rho = d.value;
      working.push({
        label: `Density of water at ${q(t, 'degC')}`,
        formula:
          d.formulation === 'tanaka-2001'
            ? 'ρ = a₅·[1 − (t + a₁)²·(t + a₂) / (a₃·(t + a₄))]'
            : 'ρ = (999.83952 + 16.945176·t − 7.9870401×10⁻³·t² − 46.170461×10⁻⁶·t³ + 105.56302×10⁻⁹·t⁴ − 280.54253×10⁻¹²·t⁵) / (1 + 16.87985×10⁻³·t)',
        substituted: `t = ${q(t, 'degC')}`,
        value: rho,
        unit: 'kg/m3',
        source: d.formulation === 'tanaka-2001' ? 'Tanaka et al. 2001' : 'Kell 1975',
      });
    }
    let mu = 0;
    if (needs.viscosity === true) {
      mu = waterProperty(() => waterViscosity(t));
      working.push({
        label: `Viscosity of water at ${q(t, 'degC')}`,
        formula:
          'μ = Σ aᵢ·(T / 300 K)^bᵢ μPa·s, a = 280.68, 511.45, 61.131, 0.45903; b = −1.9, −7.7, −19.6, −40',
        substituted: `T = ${q(T, 'K', 6)}`,
        value: mu,
        unit: 'Pa*s',
        source: SR6,
      });
    }
    return { id, name: 'water', surfaceTension: sigma, density: rho, viscosity: mu, working };
  }
  if (id === CUSTOM) {
    const sigma = num(inputs, 'surfaceTension');
    working.push({
      label: 'Surface tension (entered)',
      formula: 'σ',
      substituted: q(sigma, 'N/m'),
      value: sigma,
      unit: 'N/m',
    });
    const rho = needs.density === true ? num(inputs, 'density') : 0;
    if (needs.density === true) {
      working.push({
        label: 'Density (entered)',
        formula: 'ρ',
        substituted: q(rho, 'kg/m3'),
        value: rho,
        unit: 'kg/m3',
      });
    }
    const mu = needs.viscosity === true ? num(inputs, 'viscosity') : 0;
    if (needs.viscosity === true) {
      working.push({
        label: 'Viscosity (entered)',
        formula: 'μ',
        substituted: q(mu, 'Pa*s'),
        value: mu,
        unit: 'Pa*s',
      });
    }
    return { id, name: 'the liquid', surfaceTension: sigma, density: rho, viscosity: mu, working };
  }
  const row = getLiquid(id);
  if (row === undefined) throw new Error(`liquid ${id} is offered but not tabulated`);
  const at = `at ${q(row.temperatureC, 'degC')}`;
  const tableStep = (
    label: string,
    symbol: string,
    value: number,
    unit: UnitId,
    source: string,
  ): WorkingStep => ({
    label: `${label} of ${row.name.toLowerCase()} ${at}`,
    formula: `${symbol} (table value)`,
    substituted: q(value, unit),
    value,
    unit,
    source,
  });
  working.push(tableStep('Surface tension', 'σ', row.surfaceTension.value, 'N/m', row.surfaceTension.source));
  if (needs.density === true)
    working.push(tableStep('Density', 'ρ', row.density.value, 'kg/m3', row.density.source));
  if (needs.viscosity === true) {
    working.push(tableStep('Viscosity', 'μ', row.viscosity.value, 'Pa*s', row.viscosity.source));
  }
  return {
    id,
    name: row.name.toLowerCase(),
    surfaceTension: row.surfaceTension.value,
    density: needs.density === true ? row.density.value : 0,
    viscosity: needs.viscosity === true ? row.viscosity.value : 0,
    working,
    ...(row.hazard !== undefined ? { hazard: row.hazard } : {}),
  };
}

// ---------------------------------------------------------------- contact angle

/** The preset choice (restricted to `presetIds`) and the typed angle used when the choice is `custom`. */
export function contactAngleInputs(opts: {
  readonly presetIds: readonly string[];
  readonly defaultPreset: string;
  readonly when?: readonly Condition[];
  readonly maxDeg?: number;
}): InputDefinition[] {
  const when = opts.when ?? [];
  const options = contactAnglePresets
    .filter((p) => opts.presetIds.includes(p.id))
    .map((p) => ({
      value: p.id,
      label: p.label,
      help:
        p.spreadDeg === undefined
          ? `${p.angleDeg}°`
          : `${p.angleDeg}° (${p.spreadDeg.low}–${p.spreadDeg.high}°)`,
    }));
  const preset: ChoiceInput = {
    id: 'contactAnglePreset',
    label: 'Liquid and surface',
    kind: 'choice',
    default: opts.defaultPreset,
    options: [...options, { value: CUSTOM, label: 'Enter the contact angle' }],
    ...(when.length > 0 ? { appliesWhen: when } : {}),
  };
  const angle: QuantityInput = {
    id: 'contactAngleDeg',
    label: 'Contact angle',
    kind: 'angle',
    default: 0,
    min: 0,
    max: opts.maxDeg ?? 180,
    help: 'Measured through the liquid: 0° wets fully, above 90° the liquid is depressed.',
    appliesWhen: [...when, { input: 'contactAnglePreset', values: [CUSTOM] }],
  };
  return [preset, angle];
}

export interface ResolvedAngle {
  readonly angleDeg: number;
  readonly basis: readonly BandBasis[];
  readonly working: readonly WorkingStep[];
}

/** The contact angle from the preset or the typed value; a preset for another liquid is refused. */
export function resolveContactAngle(inputs: InputValues, liquidId: string): ResolvedAngle {
  const presetId = choice(inputs, 'contactAnglePreset');
  if (presetId === CUSTOM) {
    const a = num(inputs, 'contactAngleDeg');
    return {
      angleDeg: a,
      basis: [],
      working: [
        { label: 'Contact angle (entered)', formula: 'θ', substituted: q(a, 'deg'), value: a, unit: 'deg' },
      ],
    };
  }
  const preset = getContactAnglePreset(presetId);
  if (preset === undefined) throw new Error(`contact-angle preset ${presetId} is offered but not defined`);
  if (liquidId !== CUSTOM && preset.liquid !== liquidId) {
    throw new CalcInputError({
      field: 'contactAnglePreset',
      code: 'PRESET_LIQUID_MISMATCH',
      message: `"${preset.label}" is for ${preset.liquid}, not the liquid chosen; pick a matching preset or enter the angle`,
    });
  }
  const spread = preset.spreadDeg;
  return {
    angleDeg: preset.angleDeg,
    basis:
      spread === undefined
        ? []
        : [
            {
              input: 'contactAngleDeg',
              low: spread.low,
              high: spread.high,
              source: `${preset.label}: ${preset.source} (${preset.basis})`,
            },
          ],
    working: [
      {
        label: `Contact angle, ${preset.label.toLowerCase()}`,
        formula: 'θ (preset)',
        substituted:
          spread === undefined
            ? q(preset.angleDeg, 'deg')
            : `${q(preset.angleDeg, 'deg')} (range ${spread.low}–${spread.high}°)`,
        value: preset.angleDeg,
        unit: 'deg',
        source: `${preset.source} (${preset.basis})`,
      },
    ],
  };
}

// ---------------------------------------------------------------- gravity

/** The gravity input, m/s², standard gravity by default. */
export function gravityInput(when?: readonly Condition[]): QuantityInput {
  return {
    id: 'gravity',
    label: 'Gravity',
    kind: 'acceleration',
    default: STANDARD_GRAVITY,
    min: 9.7,
    max: 9.9,
    help: 'Standard gravity 9.80665 m/s² unless the local value is known (about 9.78 at the equator to 9.83 at the poles).',
    ...(when !== undefined && when.length > 0 ? { appliesWhen: when } : {}),
  };
}

// ---------------------------------------------------------------- shared warnings, cautions, references

export const NEAR_90_DEG = 10;

/** The inputs that set a contact angle where a preset can stand in for it. */
export const ANGLE_FIELDS: readonly string[] = ['contactAngleDeg', 'contactAnglePreset'];

export const CONTACT_ANGLE_NEAR_90 = {
  code: 'CONTACT_ANGLE_NEAR_90',
  summary:
    'The contact angle is within 10° of 90°, where cos θ is small: a few degrees of error in the angle change the result by a large fraction.',
} as const;

/**
 * The CONTACT_ANGLE_NEAR_90 warning when an angle (degrees) is within 10° of 90°, else null.
 * The 10° is our threshold: at 80° a 2° error already changes cos θ by 20 %.
 */
export function nearNinety(angleDeg: number, fields: readonly string[] = ANGLE_FIELDS): Warning | null {
  if (Math.abs(angleDeg - 90) >= NEAR_90_DEG) return null;
  return warning(
    CONTACT_ANGLE_NEAR_90.code,
    `A contact angle of ${q(angleDeg, 'deg')} is close to 90°, where the result is proportional to a small cos θ (${formatValue(Math.cos((angleDeg * Math.PI) / 180))}); treat it as very uncertain.`,
    fields,
  );
}

export const ESTIMATE_CAUTION: Caution = {
  code: 'ESTIMATE_ONLY',
  text: 'Results are estimates from idealised published formulas. They do not replace a site investigation or the judgement of a licensed professional working under local codes.',
};

export const CLEAN_SURFACES_CAUTION: Caution = {
  code: 'CLEAN_SURFACES',
  text: 'Surface tension falls sharply with contamination (detergents, oils, organic matter) and contact angles depend on the cleanliness of the surface; the values assume clean liquids and surfaces.',
};

export const MERCURY_CAUTION: Caution = { code: 'MERCURY_TOXIC', text: MERCURY_HAZARD };

export const DAMP_CAUTION: Caution = {
  code: 'DAMP_DIAGNOSIS',
  text: 'Capillary rise in walls and floors also depends on salts, evaporation, the pore structure of the material and its history. Measure moisture on site before specifying damp-proofing or remedial work.',
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
  },
  {
    id: 'tanaka-2001',
    citation: TANAKA_SOURCE,
    usedFor: 'density of air-free water at 101 325 Pa, 0–40 °C',
    basis: 'printed',
  },
  {
    id: 'kell-1975',
    citation: KELL_SOURCE,
    usedFor: 'density of water at 1 atm above 40 °C (above 100 °C a liquid held at 1 atm)',
    basis: 'printed',
  },
];

export const VISCOSITY_REFERENCE: Reference = {
  id: 'iapws-sr6-08',
  citation: 'IAPWS SR6-08 (2011), Supplementary Release on Properties of Liquid Water at 0.1 MPa',
  usedFor: 'viscosity of water',
  basis: 'printed',
};

export const LIQUID_TABLE_REFERENCES: readonly Reference[] = [
  {
    id: 'jasper-1972',
    citation:
      'Jasper J. J. (1972) The surface tension of pure liquid compounds, J. Phys. Chem. Ref. Data 1, 841–1009',
    usedFor: 'surface tension of the organic liquids in the table',
    basis: 'printed',
  },
  {
    id: 'adamson-gast-1997',
    citation: 'Adamson A. W., Gast A. P. (1997) Physical Chemistry of Surfaces, 6th ed., Wiley',
    usedFor: 'surface tension of mercury',
    basis: 'printed',
  },
  {
    id: 'crc-handbook',
    citation: 'CRC Handbook of Chemistry and Physics',
    usedFor:
      'densities and viscosities of the liquids in the table (values from memory, to be checked against the printed edition)',
    basis: 'from memory',
  },
];

/**
 * Runs a formula whose argument names differ from the calculator's input ids, renaming the field of
 * any CalcInputError it throws so that the form marks the right input.
 */
export function withFieldNames<T>(names: Readonly<Record<string, string>>, compute: () => T): T {
  try {
    return compute();
  } catch (err) {
    if (err instanceof CalcInputError) {
      throw new CalcInputError(err.issues.map((i) => ({ ...i, field: names[i.field] ?? i.field })));
    }
    throw err;
  }
}
