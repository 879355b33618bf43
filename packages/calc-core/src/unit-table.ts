// calc-core's table of units, data only: every unit's definition, the spellings people type for a
// few, the canonical unit of each kind and the unit each unit system shows a kind in. `units.ts` looks units up in it and converts.
// Kept apart so that a bundle can put a smaller table in its place: the widget's first flight
// carries only its calculator's units and the whole table follows after first paint
// (packages/widget/scripts/bundle.mjs, `unitsOf`).

import { STANDARD_GRAVITY } from './gravity.js';
import type { QuantityKind, UnitDefinition, UnitSystemId } from './units.js';

// Exact definitions, NIST SP 811 (2008) Appendix B: the inch and the foot are exact in metres,
// the pound is exactly 0.45359237 kg and standard gravity exactly 9.806 65 m/s² (`gravity.ts`). Derived factors are
// computed from them rather than typed in, so a rounded table value cannot creep in.
const INCH_M = 0.0254;
const FOOT_M = 0.3048;
const POUND_KG = 0.45359237;
// 0.45359237 × 9.80665 is exactly 4.4482216152605, and that product is exact in binary64 too.
const POUND_FORCE_N = POUND_KG * STANDARD_GRAVITY;
const SQUARE_INCH_M2 = 0.00064516;
const SQUARE_FOOT_M2 = 0.09290304;
const CUBIC_FOOT_M3 = 0.028316846592;
/** US liquid gallon, 231 in³ exactly (NIST SP 811 B.8). */
const GALLON_M3 = 231 * INCH_M ** 3;
const DAY_S = 86400;

function unit(kind: QuantityKind, symbol: string, name: string, factor: number, offset = 0): UnitDefinition {
  return { kind, symbol, name, factor, offset };
}

/**
 * Every unit calc-core knows. The canonical unit of each kind (factor 1, offset 0) is the one
 * `calculate` takes and returns: SI, except that angles are in degrees and temperatures in
 * degrees Celsius, both accepted for use with the SI and the way every source here states them.
 */
export const units = {
  // length, canonical m
  m: unit('length', 'm', 'metre', 1),
  cm: unit('length', 'cm', 'centimetre', 0.01),
  mm: unit('length', 'mm', 'millimetre', 0.001),
  um: unit('length', 'µm', 'micrometre', 1e-6),
  nm: unit('length', 'nm', 'nanometre', 1e-9),
  in: unit('length', 'in', 'inch', INCH_M),
  ft: unit('length', 'ft', 'foot', FOOT_M),
  // area, canonical m²
  m2: unit('area', 'm²', 'square metre', 1),
  cm2: unit('area', 'cm²', 'square centimetre', 1e-4),
  mm2: unit('area', 'mm²', 'square millimetre', 1e-6),
  in2: unit('area', 'in²', 'square inch', SQUARE_INCH_M2),
  ft2: unit('area', 'ft²', 'square foot', SQUARE_FOOT_M2),
  // volume, canonical m³
  m3: unit('volume', 'm³', 'cubic metre', 1),
  cm3: unit('volume', 'cm³', 'cubic centimetre', 1e-6),
  mm3: unit('volume', 'mm³', 'cubic millimetre', 1e-9),
  in3: unit('volume', 'in³', 'cubic inch', INCH_M ** 3),
  // force, canonical N
  N: unit('force', 'N', 'newton', 1),
  mN: unit('force', 'mN', 'millinewton', 1e-3),
  uN: unit('force', 'µN', 'micronewton', 1e-6),
  dyn: unit('force', 'dyn', 'dyne', 1e-5),
  lbf: unit('force', 'lbf', 'pound-force', POUND_FORCE_N),
  // pressure, canonical Pa
  Pa: unit('pressure', 'Pa', 'pascal', 1),
  kPa: unit('pressure', 'kPa', 'kilopascal', 1e3),
  psi: unit('pressure', 'psi', 'pound-force per square inch', POUND_FORCE_N / SQUARE_INCH_M2),
  psf: unit('pressure', 'psf', 'pound-force per square foot', POUND_FORCE_N / SQUARE_FOOT_M2),
  // NIST SP 811 B.8: conventional inch of water = 0.0254 m × 1000 kg/m³ × gₙ = 249.088 91 Pa exactly.
  inH2O: unit('pressure', 'inH₂O', 'inch of water (conventional)', 249.08891),
  // surface tension, canonical N/m
  'N/m': unit('surfaceTension', 'N/m', 'newton per metre', 1),
  'mN/m': unit('surfaceTension', 'mN/m', 'millinewton per metre', 1e-3),
  'dyn/cm': unit('surfaceTension', 'dyn/cm', 'dyne per centimetre', 1e-3),
  'lbf/ft': unit('surfaceTension', 'lbf/ft', 'pound-force per foot', POUND_FORCE_N / FOOT_M),
  // density, canonical kg/m³
  'kg/m3': unit('density', 'kg/m³', 'kilogram per cubic metre', 1),
  'g/cm3': unit('density', 'g/cm³', 'gram per cubic centimetre', 1000),
  // ASTM D971 states the density difference of the ring correction in g/mL (1 mL = 1 cm³ exactly).
  'g/mL': unit('density', 'g/mL', 'gram per millilitre', 1000),
  'lb/ft3': unit('density', 'lb/ft³', 'pound per cubic foot', POUND_KG / CUBIC_FOOT_M3),
  // temperature, canonical °C; NIST SP 811 4.2.1.1: t/°C = T/K − 273.15 and t/°C = (t/°F − 32)/1.8
  degC: unit('temperature', '°C', 'degree Celsius', 1),
  degF: unit('temperature', '°F', 'degree Fahrenheit', 1 / 1.8, -32),
  K: unit('temperature', 'K', 'kelvin', 1, -273.15),
  // angle, canonical degree
  deg: unit('angle', '°', 'degree', 1),
  rad: unit('angle', 'rad', 'radian', 180 / Math.PI),
  // dynamic viscosity, canonical Pa·s
  'Pa*s': unit('viscosity', 'Pa·s', 'pascal second', 1),
  'mPa*s': unit('viscosity', 'mPa·s', 'millipascal second', 1e-3),
  cP: unit('viscosity', 'cP', 'centipoise', 1e-3),
  // time, canonical s
  s: unit('time', 's', 'second', 1),
  min: unit('time', 'min', 'minute', 60),
  h: unit('time', 'h', 'hour', 3600),
  day: unit('time', 'day', 'day', 86400),
  // acceleration, canonical m/s²
  'm/s2': unit('acceleration', 'm/s²', 'metre per second squared', 1),
  'ft/s2': unit('acceleration', 'ft/s²', 'foot per second squared', FOOT_M),
  // sorptivity (volume absorbed per unit area against √time), canonical m/s½; Hall & Hoff quote mm/min½
  'm/s^0.5': unit('sorptivity', 'm/s½', 'metre per root second', 1),
  'mm/s^0.5': unit('sorptivity', 'mm/s½', 'millimetre per root second', 0.001),
  'mm/min^0.5': unit('sorptivity', 'mm/min½', 'millimetre per root minute', 0.001 / Math.sqrt(60)),
  'in/h^0.5': unit('sorptivity', 'in/h½', 'inch per root hour', INCH_M / Math.sqrt(3600)),
  // evaporation rate (volume of water per unit area of surface and time), canonical m/s
  'm/s': unit('evaporationRate', 'm/s', 'metre per second', 1),
  'mm/day': unit('evaporationRate', 'mm/day', 'millimetre per day', 0.001 / DAY_S),
  'in/day': unit('evaporationRate', 'in/day', 'inch per day', INCH_M / DAY_S),
  // water held per unit length of wall, canonical m³/m
  'm3/m': unit('volumePerLength', 'm³/m', 'cubic metre per metre', 1),
  'L/m': unit('volumePerLength', 'L/m', 'litre per metre', 0.001),
  'gal/ft': unit('volumePerLength', 'gal/ft', 'US gallon per foot', GALLON_M3 / FOOT_M),
  // flow per unit length of wall, canonical m³/(m·s)
  'm3/(m*s)': unit('flowPerLength', 'm³/(m·s)', 'cubic metre per metre second', 1),
  'L/(m*day)': unit('flowPerLength', 'L/(m·day)', 'litre per metre day', 0.001 / DAY_S),
  'gal/(ft*day)': unit('flowPerLength', 'gal/(ft·day)', 'US gallon per foot day', GALLON_M3 / FOOT_M / DAY_S),
  // mass, canonical kg
  kg: unit('mass', 'kg', 'kilogram', 1),
  g: unit('mass', 'g', 'gram', 1e-3),
  lb: unit('mass', 'lb', 'pound', POUND_KG),
  // mass per area (water taken up per wetted face), canonical kg/m²
  'kg/m2': unit('arealMass', 'kg/m²', 'kilogram per square metre', 1),
  'lb/ft2': unit('arealMass', 'lb/ft²', 'pound per square foot', POUND_KG / SQUARE_FOOT_M2),
  // water absorption coefficient, canonical kg/(m²·√s); EN ISO 15148 also states it per √h (√3600 s = 60)
  'kg/(m2*s^0.5)': unit('absorptionCoefficient', 'kg/(m²·√s)', 'kilogram per square metre root second', 1),
  'kg/(m2*h^0.5)': unit('absorptionCoefficient', 'kg/(m²·√h)', 'kilogram per square metre root hour', 1 / 60),
  'lb/(ft2*h^0.5)': unit(
    'absorptionCoefficient',
    'lb/(ft²·√h)',
    'pound per square foot root hour',
    POUND_KG / SQUARE_FOOT_M2 / 60,
  ),
  // sorptivity, canonical m/√s; ASTM C1585 reports mm/√s, Hall & Hoff often mm/√min
  'in/min^0.5': unit('sorptivity', 'in/√min', 'inch per root minute', INCH_M / Math.sqrt(60)),
  // pure numbers
  '1': unit('dimensionless', '', 'dimensionless', 1),
} as const satisfies Record<string, UnitDefinition>;

export type UnitId = keyof typeof units;

/** Spellings people type for a few units (a CSV's header, an API call); mapped onto the ids above. */
export const aliases: Readonly<Record<string, UnitId>> = {
  µm: 'um',
  '°C': 'degC',
  '°F': 'degF',
  '°': 'deg',
  'Pa·s': 'Pa*s',
  'mPa·s': 'mPa*s',
  'm/s²': 'm/s2',
  'ft/s²': 'ft/s2',
};

/** The canonical (calculate-facing) unit of each kind. */
export const canonicalUnits: Readonly<Record<QuantityKind, UnitId>> = {
  length: 'm',
  area: 'm2',
  volume: 'm3',
  force: 'N',
  pressure: 'Pa',
  surfaceTension: 'N/m',
  density: 'kg/m3',
  temperature: 'degC',
  angle: 'deg',
  viscosity: 'Pa*s',
  time: 's',
  acceleration: 'm/s2',
  sorptivity: 'm/s^0.5',
  evaporationRate: 'm/s',
  volumePerLength: 'm3/m',
  flowPerLength: 'm3/(m*s)',
  mass: 'kg',
  arealMass: 'kg/m2',
  absorptionCoefficient: 'kg/(m2*s^0.5)',
  dimensionless: '1',
};

/**
 * The unit each kind is shown in by default. Surface tension has no US customary unit in use
 * (lbf/ft gives numbers like 0.005): US laboratories report it in mN/m, so the US system does too.
 * The dyne per centimetre, equal to it, is a CGS unit (`cgsUnits` in units.ts), not a US customary one.
 * Viscosity stays in cP, equal to mPa·s, as US practice writes it.
 */
export const unitSystems: Readonly<Record<UnitSystemId, Readonly<Record<QuantityKind, UnitId>>>> = {
  si: {
    length: 'm',
    area: 'cm2',
    volume: 'cm3',
    force: 'mN',
    pressure: 'kPa',
    surfaceTension: 'mN/m',
    density: 'kg/m3',
    temperature: 'degC',
    angle: 'deg',
    viscosity: 'mPa*s',
    time: 's',
    acceleration: 'm/s2',
    sorptivity: 'mm/min^0.5',
    evaporationRate: 'mm/day',
    volumePerLength: 'L/m',
    flowPerLength: 'L/(m*day)',
    mass: 'g',
    arealMass: 'kg/m2',
    absorptionCoefficient: 'kg/(m2*s^0.5)',
    dimensionless: '1',
  },
  us: {
    length: 'in',
    area: 'in2',
    volume: 'in3',
    force: 'lbf',
    pressure: 'psi',
    surfaceTension: 'mN/m',
    density: 'lb/ft3',
    temperature: 'degF',
    angle: 'deg',
    viscosity: 'cP',
    time: 's',
    acceleration: 'ft/s2',
    sorptivity: 'in/h^0.5',
    evaporationRate: 'in/day',
    volumePerLength: 'gal/ft',
    flowPerLength: 'gal/(ft*day)',
    mass: 'lb',
    arealMass: 'lb/ft2',
    absorptionCoefficient: 'lb/(ft2*h^0.5)',
    dimensionless: '1',
  },
};
