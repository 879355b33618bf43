// Warnings and calc-core's other sentences as a person reads them: a plain title for each warning
// code, and the values in a sentence re-stated in the reader's unit system. The text-heavy half
// of the answer, kept apart from the headline so a widget can fetch it after first paint.

import type { CalculatorDefinition, Warning } from './calculators/types.js';
import { readable } from './answer.js';
import type { QuantityKind, UnitSystemId } from './units.js';

// Canonical symbols calc-core's messages print values in (the `q` helper of the calculators),
// longest first so `m/s²` is not read as `m`.
const CANONICAL_SYMBOLS: readonly (readonly [string, QuantityKind])[] = [
  ['m/s²', 'acceleration'],
  ['kg/m³', 'density'],
  ['N/m', 'surfaceTension'],
  ['Pa·s', 'viscosity'],
  ['m²', 'area'],
  ['m³', 'volume'],
  ['°C', 'temperature'],
  ['Pa', 'pressure'],
  ['N', 'force'],
  ['m', 'length'],
];
const SUPERSCRIPT_DIGITS = '⁰¹²³⁴⁵⁶⁷⁸⁹';
const NUMBER = String.raw`(−?\d+(?:\.\d+)?(?:×10⁻?[⁰¹²³⁴⁵⁶⁷⁸⁹]+)?)`;
const QUANTITY = new RegExp(
  `${NUMBER} (${CANONICAL_SYMBOLS.map(([s]) => s.replace(/[/.*+?^${}()|[\]\\]/g, '\\$&')).join('|')})(?![\\w/²³·])`,
  'g',
);

function readNumber(text: string): number {
  const [mantissa = '', power] = text.replace('−', '-').split('×10');
  if (power === undefined) return Number(mantissa);
  const exp = [...power].map((c) => (c === '⁻' ? '-' : String(SUPERSCRIPT_DIGITS.indexOf(c)))).join('');
  return Number(mantissa) * 10 ** Number(exp);
}

/**
 * A calc-core sentence re-stated in a reader's units: every value printed in a canonical SI unit
 * (`0.00002 m`, `2×10⁻⁵ m`, `0.002726 m`, `20 °C`) becomes the readable unit of the system
 * (`0.02 mm`, `2.73 mm`; `0.0000787 in`, `68 °F`). Values already in a chosen unit (`4 in`,
 * `0.075 mm`) and pure numbers are left as written.
 */
export function inReaderUnits(text: string, system: UnitSystemId): string {
  return text.replace(QUANTITY, (whole, num: string, symbol: string) => {
    const kind = CANONICAL_SYMBOLS.find(([s]) => s === symbol)?.[1];
    const value = readNumber(num);
    if (kind === undefined || !Number.isFinite(value)) return whole;
    return readable(value, kind, system);
  });
}

// ---------------------------------------------------------------- warnings

/** A plain title for each warning code calc-core raises; codes stay in data and the dashboard. */
const WARNING_TITLES: Readonly<Record<string, string>> = {
  BORE_TOO_WIDE: 'Bore too wide for this formula',
  GAP_TOO_WIDE: 'Gap too wide for this formula',
  BORE_NOT_SMALL: 'Wide bore: read the corrected rise',
  GAP_NOT_SMALL: 'Wide gap: read the corrected rise',
  CONTACT_ANGLE_NEAR_90: 'Contact angle close to 90°',
  MENISCUS_CORRECTION_NOT_APPLIED: 'Convex meniscus: no correction',
  CAPILLARY_RISE_REACHES_SLAB: 'Capillary water reaches the slab',
  CAPILLARY_RISE_MAY_REACH_SLAB: 'The margin under the slab is not secure',
  LAYER_THINNER_THAN_CODE_MINIMUM: 'Layer thinner than the code minimum',
  LAYER_NOT_CLEAN_GRAVEL: 'Layer too fine to be clean gravel',
  WATER_TABLE_IN_LAYER: 'Water table inside the layer',
  FINE_GRAINED_SOIL: "Soil too fine for Hazen's formula",
  SHAPE_NOT_SPHERICAL: 'Too large to stay round',
  PORE_NON_WETTING: 'The liquid does not wet the pore',
  CONTACT_ANGLE_NOT_ZERO: 'The probe is not fully wetted',
  RING_BELOW_ASTM_SIZE: 'Ring smaller than the standard ring',
  RING_OUTSIDE_CORRECTION_RANGE: 'Ring outside its correction tables',
  RING_FACTOR_OUTSIDE_TABLES: 'Correction factor outside its tables',
  DENSITY_DIFFERENCE_IMPLAUSIBLE: 'Unlikely density difference',
  BEYOND_JURIN_LIMIT: 'Higher than the liquid can climb',
  INERTIA_NOT_NEGLIGIBLE: 'Too quick to ignore inertia',
  PORE_TOO_WIDE: 'Pore too wide for this formula',
  GRAVITY_NOT_NEGLIGIBLE: 'Gravity slows the rise',
};

/**
 * A warning's title. A code this module does not know (a calculator added later) gets the
 * summary its calculator declares, cut at the first colon, or else a general title.
 */
export function warningTitle(code: string, def?: Pick<CalculatorDefinition, 'warnings'>): string {
  const known = Object.hasOwn(WARNING_TITLES, code) ? WARNING_TITLES[code] : undefined;
  if (known !== undefined) return known;
  const summary = def?.warnings.find((w) => w.code === code)?.summary;
  if (summary !== undefined && summary !== '')
    return (summary.split(/[:;]/)[0] ?? summary).replace(/\.$/, '');
  return 'Check this result';
}

/** A warning as a person reads it: a title and its sentence in the reader's units. */
export interface ReadWarning {
  readonly code: string;
  readonly title: string;
  readonly text: string;
}

/** The title and the sentence of a warning, its values re-stated in `system`'s units. */
export function readWarning(
  warning: Pick<Warning, 'code' | 'message'>,
  system: UnitSystemId,
  def?: Pick<CalculatorDefinition, 'warnings'>,
): ReadWarning {
  return {
    code: warning.code,
    title: warningTitle(warning.code, def),
    text: inReaderUnits(warning.message, system),
  };
}
