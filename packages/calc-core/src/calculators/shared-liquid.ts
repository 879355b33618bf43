import { CalcInputError } from '../errors.js';
import {
  type ContactAngleValues,
  contactAngleValues,
  getContactAngleValues,
} from '../properties/contactAngleValues.js';
import {
  type LiquidValues,
  TABLE_TEMPERATURE_C,
  getLiquidValues,
  liquidValues,
} from '../properties/liquidValues.js';
import { type WaterDensity, waterDensity, waterSurfaceTension, waterViscosity } from '../properties/water.js';
import { CUSTOM, OTHER_LIQUID_CAUTION, choice, num, quantityInput } from './shared.js';
import type {
  BandBasis,
  Caution,
  ChoiceInput,
  Condition,
  InputDefinition,
  InputValues,
  QuantityInput,
  WorkingStep,
} from './types.js';

// The liquid and contact-angle inputs and how they resolve into numbers. Apart from shared.ts so that
// the liquids' and contact angles' data and the water correlations travel only with the engines of
// the calculators that take a liquid, not with every calculator's first flight. It reads the
// values alone (`liquidValues.ts`, `contactAngleValues.ts`): where each comes from is written by the
// working (`shared-working.ts`, from `liquids.ts` and `contactAngles.ts`), which follows first paint.
//
// Liquid design: the `liquid` choice decides where σ, ρ and μ come from.
//   water  → the IAPWS / Tanaka / Kell correlations at `temperatureC` (the only input that then shows);
//   a table liquid → its 20 °C row in `liquidValues` (temperature does not apply: the table has one row);
//   custom → the `surfaceTension`, `density` and `viscosity` inputs as typed.
// So a temperature never silently changes a value it cannot change, and a typed σ is never
// overwritten by a correlation.

// ---------------------------------------------------------------- liquid

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
        ...liquidValues.map((l) => ({
          value: l.id,
          label: l.name,
          help: `Table values at ${TABLE_TEMPERATURE_C} °C.`,
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
  | {
      readonly kind: 'table';
      readonly row: LiquidValues;
      readonly density: boolean;
      readonly viscosity: boolean;
    };

/** What a resolved contact angle's working and assumption are written from. */
export type AngleFacts =
  | { readonly kind: typeof CUSTOM; readonly angleDeg: number }
  | { readonly kind: 'preset'; readonly preset: ContactAngleValues };

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
  const row = getLiquidValues(id);
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
    surfaceTension: row.surfaceTension,
    density: needs.density === true ? row.density : 0,
    viscosity: needs.viscosity === true ? row.viscosity : 0,
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
  const options = contactAngleValues
    .filter((p) => opts.presetIds.includes(p.id))
    .map((p) => ({
      value: p.id,
      label: p.label,
      help: p.spread === undefined ? `${p.angleDeg}°` : `${p.angleDeg}° (${p.spread.low}–${p.spread.high}°)`,
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
  const preset = getContactAngleValues(presetId);
  if (preset === undefined) throw new Error(`contact-angle preset ${presetId} is offered but not defined`);
  if (liquidId !== CUSTOM && preset.liquid !== liquidId) {
    throw new CalcInputError({
      field: 'contactAnglePreset',
      code: 'PRESET_LIQUID_MISMATCH',
      message: `"${preset.label}" is for ${preset.liquid}, not the liquid chosen; pick a matching preset or enter the angle`,
    });
  }
  const spread = preset.spread;
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
              source: `${preset.label}: ${spread.source} (${spread.basis})`,
            },
          ],
    get working() {
      return writers().angleWorking(facts);
    },
  };
}
