import type { FieldIssue } from '../errors.js';
import type { Basis } from '../properties/liquids.js';
import type { QuantityKind, UnitId, UnitSystemId } from '../units.js';

// A calculator is data plus one pure function. Everything but `solve` survives JSON.stringify, so
// the widget, the dashboard's editor and the server can all render or store a definition as-is.

/** Holds when the choice input `input` currently has one of `values`. */
export interface Condition {
  readonly input: string;
  readonly values: readonly string[];
}

interface InputCommon {
  /** Stable camelCase id: the key in `calculate`'s inputs. Never renamed once released. */
  readonly id: string;
  readonly label: string;
  readonly help?: string;
  /**
   * The input takes part only while every condition holds; otherwise a form hides it, `calculate`
   * ignores any value sent for it and it is left out of the input hash.
   */
  readonly appliesWhen?: readonly Condition[];
}

/** A range of an input that a source gives; the result's band is drawn from it. Canonical units. */
export interface Spread {
  readonly low: number;
  readonly high: number;
  readonly source: string;
}

export interface QuantityInput extends InputCommon {
  readonly kind: QuantityKind;
  /** Canonical units (see `canonicalUnits`): SI, angles in degrees, temperatures in °C. */
  readonly default: number;
  /** Inclusive bounds, canonical units: physical limits of the formulas, not of the form. */
  readonly min: number;
  readonly max: number;
  readonly spread?: Spread;
  /** A better display unit than the unit system's default for this kind (a bore in mm, not m). */
  readonly display?: Partial<Readonly<Record<UnitSystemId, UnitId>>>;
}

export interface ChoiceOption {
  readonly value: string;
  readonly label: string;
  readonly help?: string;
  /**
   * The option is offered only while every condition holds (a contact-angle preset only for its own
   * liquid); a form leaves it out otherwise.
   */
  readonly appliesWhen?: readonly Condition[];
}

export interface ChoiceInput extends InputCommon {
  readonly kind: 'choice';
  readonly options: readonly ChoiceOption[];
  readonly default: string;
}

/** One numeric column of a table input. Canonical units, as for a quantity input. */
export interface TableColumn {
  /** Stable camelCase id: the key of the value in each row. */
  readonly id: string;
  readonly label: string;
  readonly kind: QuantityKind;
  /** Inclusive bounds of every value in the column, canonical units. */
  readonly min: number;
  readonly max: number;
  readonly display?: Partial<Readonly<Record<UnitSystemId, UnitId>>>;
  /** Each row's value must be greater than the one above it (readings in time order). */
  readonly increasing?: boolean;
}

/** One row of a table input: a number (canonical units) per column id. */
export type TableRow = Readonly<Record<string, number>>;

/** Rows of named numeric columns: a laboratory's readings, typed, pasted or uploaded. */
export interface TableInput extends InputCommon {
  readonly kind: 'table';
  readonly columns: readonly TableColumn[];
  readonly minRows: number;
  readonly maxRows: number;
  readonly default: readonly TableRow[];
}

export type InputDefinition = QuantityInput | ChoiceInput | TableInput;

export interface OutputDefinition {
  readonly id: string;
  readonly label: string;
  readonly kind: QuantityKind;
  readonly help?: string;
  /** Help that depends on the sign of the value: `above` for a value above zero, `atOrBelow` otherwise. */
  readonly helpBySign?: { readonly above: string; readonly atOrBelow: string };
  readonly display?: Partial<Readonly<Record<UnitSystemId, UnitId>>>;
}

/**
 * A validity check a calculator can raise: stable code, and what it means in general. A whole
 * calculator (the registry's) has every summary; its core carries only the summaries the first view
 * can show (`answer.ts`'s headline gives the one of a warning that withholds its output), and its
 * texts the others (`CalculatorTexts.warningSummaries`).
 */
export interface WarningDefinition {
  readonly code: string;
  readonly summary?: string;
}

export interface Caution {
  readonly code: string;
  readonly text: string;
  /** Where the caution's facts come from (a hazard's GHS classes, a diagnosis standard). */
  readonly source?: string;
}

export interface Reference {
  readonly id: string;
  readonly citation: string;
  readonly usedFor: string;
  readonly basis: Basis;
  /** The reference bears on a result only while every condition holds (a liquid's own table source). */
  readonly appliesWhen?: readonly Condition[];
}

/** One resolved input: a canonical number, a choice value, or a table's rows. */
export type InputValue = number | string | readonly TableRow[];

/** Resolved inputs: canonical numbers, choice values and tables, keyed by input id. */
export type InputValues = Readonly<Record<string, InputValue>>;

/** One line of working, what an engineer checks: formula, the numbers put in, the value out. */
export interface WorkingStep {
  readonly label: string;
  readonly formula: string;
  readonly substituted: string;
  /** Canonical units. */
  readonly value: number;
  readonly unit: UnitId;
  readonly source?: string;
  /** Stable key of the step within its calculator, for a warning to point at (`Warning.step`). */
  readonly id?: string;
}

export interface Warning {
  readonly code: string;
  readonly message: string;
  /** Input ids the warning is about, for a form to highlight. */
  readonly fields: readonly string[];
  /** The `id` of the working step whose method the warning qualifies. */
  readonly step?: string;
  /**
   * Output ids this warning withholds: the method does not hold there, so the output is `null`
   * and is shown as "not defined here" with this warning's message as the reason.
   */
  readonly withholds?: readonly string[];
}

export interface BandBasis {
  readonly input: string;
  readonly low: number;
  readonly high: number;
  readonly source: string;
}

/** The range of each output over the corners of the spread inputs. */
export interface Band {
  readonly basis: readonly BandBasis[];
  readonly outputs: Readonly<Record<string, { readonly low: number; readonly high: number }>>;
}

/**
 * Output values in canonical units; null where an output does not apply to the chosen mode, or where
 * a warning withholds it (`Warning.withholds`) because its method does not hold for these inputs.
 */
export type Outputs = Readonly<Record<string, number | null>>;

/**
 * One record of a solve's working: the key of the step writer in the calculator's `<id>.working.ts`
 * and the numbers (or resolved liquid and angle) it writes the steps from; never text.
 */
export type Note = readonly [key: string, data: unknown];

export interface Solution {
  readonly outputs: Outputs;
  readonly warnings: readonly Warning[];
  readonly band: Band | null;
  /** Cautions that belong to these inputs (the chosen liquid's hazard); shown before the calculator's own. */
  readonly hazards?: readonly Caution[];
  /** The working as records, in the order its steps read: `Explain.steps` writes them (`calculate` does, `compute` never). */
  readonly notes: readonly Note[];
  /** What the assumptions are written from (`Explain.assumptions`): numbers and choices, no text. */
  readonly assumed: unknown;
}

/** A solution's working and its assumptions, as text. */
export interface Explanation {
  readonly working: readonly WorkingStep[];
  /** What the result takes for granted (static equilibrium, clean surfaces, …), in plain sentences. */
  readonly assumptions: readonly string[];
}

/** The step writers of one calculator, typed by its notes (`{ washburn: { time: number }, … }`). */
export type StepWriters<N> = {
  readonly [K in keyof N]: (data: N[K], inputs: InputValues) => readonly WorkingStep[];
};

/**
 * How a calculator's working and assumptions are written from its solution (`<id>.working.ts`,
 * carried by its texts): a step writer per note key, and the assumptions from `Solution.assumed`.
 * `never` parameters take any calculator's writers; `runCalculation` hands each its own notes.
 */
export interface Explain {
  readonly steps: Readonly<Record<string, (data: never, inputs: InputValues) => readonly WorkingStep[]>>;
  readonly assumptions: (assumed: never, inputs: InputValues) => readonly string[];
}

/**
 * One way of saying a result in a sentence. Placeholders: `{value}` the output's magnitude in the
 * unit the result shows it in (a time in words: `3.6 seconds`), `{input.<id>}` an input in its
 * unit, `{liquid}` the liquid's name (`Water`, `The liquid` for one entered by hand).
 */
export interface HeadlineRule {
  /** The rule applies only while every condition holds for the inputs used. */
  readonly when?: readonly Condition[];
  /** The rule applies only when the result carries this warning. */
  readonly warning?: string;
  /** The output the sentence states; a rule whose output has no figure is passed over. */
  readonly output: string;
  /** The sentence for a value above zero, and for any value when `atOrBelow` is absent. */
  readonly text: string;
  /** The sentence for a value of zero or less (`{value}` is then the magnitude). */
  readonly atOrBelow?: string;
}

/** How a result is said in one sentence: the first rule that applies and has a figure. */
export interface HeadlineDefinition {
  readonly rules: readonly HeadlineRule[];
  /** What the answer is, for the sentence when no rule has a figure: "No {missing} is given…". */
  readonly missing: string;
}

/**
 * What computes and what a form shows: the calculation itself, in `calculators/<id>.ts`. The
 * widget's first flight carries this alone; its texts follow after first paint.
 */
export interface CalculatorCore {
  /** kebab-case, stable: used in subpath exports, stored runs and embed configuration. */
  readonly id: string;
  readonly title: string;
  readonly summary: string;
  readonly inputs: readonly InputDefinition[];
  readonly outputs: readonly OutputDefinition[];
  readonly warnings: readonly WarningDefinition[];
  /** The headline sentence of a result; without one, its first output with a figure is said plainly. */
  readonly headline?: HeadlineDefinition;
  /** Pure: resolved inputs in, solution out. Throws CalcInputError for combinations no single field shows. */
  readonly solve: (inputs: InputValues) => Solution;
  /**
   * Checks a table input's raw value (`tableIssues`): required of a calculator with a table input.
   * Carried by the definition rather than imported by the engine, so calculators without tables do
   * not bundle it.
   */
  readonly checkTable?: (input: TableInput, value: unknown) => readonly FieldIssue[];
}

/** What a calculator says beside its figures, in `calculators/<id>.texts.ts`: imported by nothing that computes. */
export interface CalculatorTexts {
  readonly cautions: readonly Caution[];
  readonly references: readonly Reference[];
  /**
   * The summary of each of the core's warnings that the core declares without one, by warning code
   * (`{ PORE_NON_WETTING: 'θ > 90°: …' }`): the core keeps only the summaries its first view shows,
   * those of the warnings that withhold an output. `withTexts` (calc-core's `join.ts`) gives each
   * of the core's warnings, in the core's order, its own summary or this one; it refuses a summary
   * for a code the core does not declare or one the core already has. Absent where the core
   * summarises every warning itself.
   */
  readonly warningSummaries?: Readonly<Record<string, string>>;
  /**
   * Writes the working and assumptions from a solution's notes (`<id>.working.ts`): the first
   * flight carries none of it. Every calculator's texts have one; it is optional for a definition
   * a widget makes from the core alone, which `runCalculation` is then given it beside.
   */
  readonly explain?: Explain;
}

/**
 * A whole calculator: its core and its texts, as `withTexts` joins them (calc-core's registry, the
 * widget once its texts arrive): every warning with its summary, and no `warningSummaries` of its own.
 */
export interface CalculatorDefinition extends CalculatorCore, Omit<CalculatorTexts, 'warningSummaries'> {
  readonly warnings: readonly WarningDefinition[];
}

/**
 * A result's numbers without its working, assumptions or input hash (`compute`): what a widget
 * needs to show the answer. Its outputs, warnings and band equal `calculate`'s for the same inputs.
 */
export interface ComputedResult {
  readonly calculator: string;
  /** The inputs actually used (defaults filled in, inputs that do not apply left out). */
  readonly inputs: InputValues;
  readonly outputs: Outputs;
  readonly warnings: readonly Warning[];
  readonly band: Band | null;
  /** The liquid's hazard first, then the calculator's own cautions (none from a core without texts). */
  readonly cautions: readonly Caution[];
  readonly version: string;
}

export interface CalculationResult {
  readonly calculator: string;
  /** The inputs actually used (defaults filled in, inputs that do not apply left out). */
  readonly inputs: InputValues;
  readonly outputs: Outputs;
  readonly warnings: readonly Warning[];
  readonly working: readonly WorkingStep[];
  readonly band: Band | null;
  /** What the result takes for granted. */
  readonly assumptions: readonly string[];
  /**
   * Cautions for this result: the liquid's hazard first, then the calculator's own (none when run
   * from a core without its texts, as the widget's engine does: it shows the texts' when they arrive).
   */
  readonly cautions: readonly Caution[];
  readonly version: string;
  /** SHA-256 (hex) of the canonical JSON of `{ calculator, inputs }`. */
  readonly inputHash: string;
}
