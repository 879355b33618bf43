import { CalcInputError } from '../errors.js';
import {
  type ContactAnglePreset,
  contactAnglePresets,
  getContactAnglePreset,
} from '../properties/contactAngles.js';
import { type Liquid, getLiquid, liquids } from '../properties/liquids.js';
import { type WaterDensity, waterDensity, waterSurfaceTension, waterViscosity } from '../properties/water.js';
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
  Solution,
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

/**
 * A published coefficient exactly as the code holds it (all its digits, a true minus sign), so the
 * working shows the very number computed with.
 */
export function coef(value: number): string {
  return String(value).replace('-', '−');
}

/** A warning instance; `fields` are the input ids a form should highlight. */
export function warning(
  code: string,
  message: string,
  fields: readonly string[],
  extra: { readonly step?: string; readonly withholds?: readonly string[] } = {},
): Warning {
  return {
    code,
    message,
    fields,
    ...(extra.step !== undefined ? { step: extra.step } : {}),
    ...(extra.withholds !== undefined && extra.withholds.length > 0 ? { withholds: extra.withholds } : {}),
  };
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
  /** The liquid's own hazard, for the result's cautions (first in the list). */
  readonly hazard?: Caution;
  /** Where the properties come from, as an assumption of the result. */
  readonly assumption: string;
}

/**
 * What a resolved liquid's working and assumption are written from: the numbers `compute` already
 * has (a property not asked for is null), and for a table liquid its row.
 */
export type LiquidFacts =
  | {
      readonly kind: 'water';
      readonly t: number;
      readonly sigma: number;
      readonly density: WaterDensity | null;
      readonly viscosity: number | null;
    }
  | {
      readonly kind: typeof CUSTOM;
      readonly sigma: number;
      readonly density: number | null;
      readonly viscosity: number | null;
    }
  | { readonly kind: 'table'; readonly row: Liquid; readonly density: boolean; readonly viscosity: boolean };

/** What a resolved contact angle's working and assumption are written from. */
export type AngleFacts =
  | { readonly kind: typeof CUSTOM; readonly angleDeg: number }
  | { readonly kind: 'preset'; readonly preset: ContactAnglePreset };

/** The text of the shared inputs' working and assumptions (`shared-working.ts`). */
export interface SharedWriters {
  liquidWorking(facts: LiquidFacts): WorkingStep[];
  liquidAssumption(facts: LiquidFacts): string;
  angleWorking(facts: AngleFacts): WorkingStep[];
  angleAssumption(facts: AngleFacts): string;
}

let boundWriters: SharedWriters | null = null;

/**
 * Gives the shared inputs their working's writers. `runCalculation` (run.ts) binds them before it
 * solves; `compute` never reads a working, so the first flight of a widget carries no such text.
 */
export function bindWriters(w: SharedWriters): void {
  boundWriters = w;
}

function writers(): SharedWriters {
  if (boundWriters === null)
    throw new Error(
      'the working of a liquid or contact angle is read before its writers are bound: run the calculator with runCalculation (calculators/run.ts)',
    );
  return boundWriters;
}

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

/** The most answers `resolveLiquid` and `resolveContactAngle` each keep: the oldest goes first. */
const RESOLVED_KEPT = 256;
const resolvedLiquids = new Map<string, ResolvedLiquid>();
const resolvedAngles = new Map<string, ResolvedAngle>();

/** The answer `kept` holds for `key`, else `make()`'s, kept (dropping the oldest past RESOLVED_KEPT). */
function keptOr<T>(kept: Map<string, T>, key: string, make: () => T): T {
  let found = kept.get(key);
  if (found === undefined) {
    found = make();
    if (kept.size >= RESOLVED_KEPT) kept.delete(kept.keys().next().value!);
    kept.set(key, found);
  }
  return found;
}

/**
 * σ, ρ and μ for the chosen liquid, with one working line each for what the calculator uses.
 * Values not asked for are NaN-free placeholders (0) and carry no working.
 */
export function resolveLiquid(inputs: InputValues, needs: LiquidNeeds): ResolvedLiquid {
  // A liquid is resolved from these inputs alone, and what comes back is read-only (its working is
  // made on each read), so the same inputs share one answer: a re-run of many runs that differ only
  // in their geometry (an upgrade preview, a server re-checking reports) resolves each liquid once.
  const key = `${String(inputs.liquid)}|${String(inputs.temperatureC)}|${String(inputs.surfaceTension)}|${String(inputs.density)}|${String(inputs.viscosity)}|${needs.density === true}|${needs.viscosity === true}`;
  return keptOr(resolvedLiquids, key, () => resolveLiquidAfresh(inputs, needs));
}

function resolveLiquidAfresh(inputs: InputValues, needs: LiquidNeeds): ResolvedLiquid {
  const id = choice(inputs, 'liquid');
  // The working lines and the assumption are written only when read (`calculate`), never by
  // `compute`, and by `shared-working.ts`, which the first flight does not carry (`writers`).
  if (id === 'water') {
    const t = num(inputs, 'temperatureC');
    const sigma = waterProperty(() => waterSurfaceTension(t));
    const density = needs.density === true ? waterProperty(() => waterDensity(t)) : null;
    const viscosity = needs.viscosity === true ? waterProperty(() => waterViscosity(t)) : null;
    const facts: LiquidFacts = { kind: 'water', t, sigma, density, viscosity };
    return {
      id,
      name: 'water',
      surfaceTension: sigma,
      density: density?.value ?? 0,
      viscosity: viscosity ?? 0,
      get working() {
        return writers().liquidWorking(facts);
      },
      get assumption() {
        return writers().liquidAssumption(facts);
      },
    };
  }
  if (id === CUSTOM) {
    const sigma = num(inputs, 'surfaceTension');
    const density = needs.density === true ? num(inputs, 'density') : null;
    const viscosity = needs.viscosity === true ? num(inputs, 'viscosity') : null;
    const facts: LiquidFacts = { kind: CUSTOM, sigma, density, viscosity };
    return {
      id,
      name: 'the liquid',
      surfaceTension: sigma,
      density: density ?? 0,
      viscosity: viscosity ?? 0,
      get working() {
        return writers().liquidWorking(facts);
      },
      hazard: OTHER_LIQUID_CAUTION,
      get assumption() {
        return writers().liquidAssumption(facts);
      },
    };
  }
  const row = getLiquid(id);
  if (row === undefined) throw new Error(`liquid ${id} is offered but not tabulated`);
  const facts: LiquidFacts = {
    kind: 'table',
    row,
    density: needs.density === true,
    viscosity: needs.viscosity === true,
  };
  return {
    id,
    name: row.name.toLowerCase(),
    surfaceTension: row.surfaceTension.value,
    density: needs.density === true ? row.density.value : 0,
    viscosity: needs.viscosity === true ? row.viscosity.value : 0,
    get working() {
      return writers().liquidWorking(facts);
    },
    ...(row.hazard !== undefined
      ? {
          hazard: {
            code: row.hazard.code,
            text: row.hazard.text,
            source: `${row.hazard.source} (${row.hazard.basis})`,
          },
        }
      : {}),
    get assumption() {
      return writers().liquidAssumption(facts);
    },
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
      // Offered only with its own liquid (or one entered by hand): any other pairing is refused below.
      appliesWhen: [{ input: 'liquid', values: [p.liquid, CUSTOM] }],
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
  /** Where the angle comes from, as an assumption of the result. */
  readonly assumption: string;
}

/** The contact angle from the preset or the typed value; a preset for another liquid is refused. */
export function resolveContactAngle(inputs: InputValues, liquidId: string): ResolvedAngle {
  // As with liquids: read-only answers from these inputs alone, kept for the same inputs.
  const key = `${String(inputs.contactAnglePreset)}|${String(inputs.contactAngleDeg)}|${liquidId}`;
  return keptOr(resolvedAngles, key, () => resolveContactAngleAfresh(inputs, liquidId));
}

function resolveContactAngleAfresh(inputs: InputValues, liquidId: string): ResolvedAngle {
  const presetId = choice(inputs, 'contactAnglePreset');
  if (presetId === CUSTOM) {
    const facts: AngleFacts = { kind: CUSTOM, angleDeg: num(inputs, 'contactAngleDeg') };
    return {
      angleDeg: facts.angleDeg,
      basis: [],
      get assumption() {
        return writers().angleAssumption(facts);
      },
      get working() {
        return writers().angleWorking(facts);
      },
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
  const facts: AngleFacts = { kind: 'preset', preset };
  return {
    angleDeg: preset.angleDeg,
    get assumption() {
      return writers().angleAssumption(facts);
    },
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
    get working() {
      return writers().angleWorking(facts);
    },
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

/** Attached to a result whose liquid was entered by hand: its hazards are unknown to the table. */
export const OTHER_LIQUID_CAUTION: Caution = {
  code: 'OTHER_LIQUID_HAZARD',
  text: "The liquid's hazards are not known to this calculator: read its safety data sheet before handling it.",
};

/** The assumptions every capillary result shares. */
export const STATIC_ASSUMPTIONS: readonly string[] = [
  'Static equilibrium: the liquid has stopped moving.',
  'Clean liquid and clean surfaces: no surfactant, oil or dirt.',
  'Air density neglected against the liquid density (0.12 % for water).',
];

/** The capillary length step ℓc = √(σ/(ρ·g)), id `capillary-length`, for a warning to point at. */
export function capillaryLengthStep(
  sigma: number,
  rho: number,
  g: number,
  lc: number,
  label = 'Capillary length',
): WorkingStep {
  return {
    id: 'capillary-length',
    label,
    formula: 'ℓc = √(σ / (ρ·g))',
    substituted: `√(${q(sigma, 'N/m')} / (${q(rho, 'kg/m3')} × ${q(g, 'm/s2')}))`,
    value: lc,
    unit: 'm',
    source: 'de Gennes, Brochard-Wyart & Quéré (2004) Capillarity and Wetting Phenomena',
  };
}

type StepMaker = () => WorkingStep | readonly WorkingStep[];

/**
 * A solve's working recorded as it goes and written only when read: each step is given as a
 * function that makes it (`working.add(() => ({ ... }))`), called by `build()` from `explain`.
 */
export interface LaterWorking {
  add(...makers: StepMaker[]): void;
  /** Steps that go before every step added so far. */
  first(maker: StepMaker): void;
  build(): WorkingStep[];
}

export function laterWorking(...makers: StepMaker[]): LaterWorking {
  const list = [...makers];
  return {
    add: (...more) => void list.push(...more),
    first: (maker) => void list.unshift(maker),
    build: () => list.flatMap((make) => make()),
  };
}

/** What a solution explains: its working and its assumptions, text built with `fmt`/`q`. */
export interface Explanation {
  readonly working: readonly WorkingStep[];
  readonly assumptions: readonly string[];
}

/**
 * A solution with the liquid's hazard (if it has one) attached to the result's cautions. Given
 * `explain` instead of `working` and `assumptions`, those two are built on first reading only
 * (`calculate` reads them; `compute` never does, so it formats no number it does not show).
 */
export function solved(
  parts: Omit<Solution, 'hazards' | 'working' | 'assumptions'> &
    (Explanation | { readonly explain: () => Explanation }),
  liquid?: { readonly hazard?: Caution } | null,
): Solution {
  const hazards = liquid?.hazard !== undefined ? { hazards: [liquid.hazard] } : {};
  if (!('explain' in parts)) return { ...parts, ...hazards };
  const { explain } = parts;
  let explained: Explanation | undefined;
  const read = (): Explanation => (explained ??= explain());
  return {
    outputs: parts.outputs,
    warnings: parts.warnings,
    band: parts.band,
    ...hazards,
    get working() {
      return read().working;
    },
    get assumptions() {
      return read().assumptions;
    },
  };
}

/** The gravity assumption, naming the value used. */
export function gravityAssumption(g: number): string {
  return g === STANDARD_GRAVITY
    ? `Standard gravity, ${coef(STANDARD_GRAVITY)} m/s².`
    : `Local gravity of ${q(g, 'm/s2')} as entered.`;
}

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
