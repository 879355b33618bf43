/**
 * Set to true by the widget's release build (a Vite `define`), nowhere else: calc-core's tests, the
 * server and a published release's `engine.mjs` leave it undefined.
 */
declare const __WICKSTONE_RELEASE__: boolean | undefined;

/**
 * Whether calc-core checks its own definitions as it runs (a solution's warnings declared, a withheld
 * output null, a table input's checker present, a resolved input of the type its solver reads) and
 * its caller's side of the contract (inputs an object keyed by the definition's input ids): bugs in
 * calc-core or in the code that calls it, never a visitor's input, caught by its tests and on the
 * server (where the inputs of an API call are checked so). The widget's release leaves them out: its
 * form builds the inputs from the definition, and its minifier drops the code behind a false constant.
 */
export const SELF_CHECKS = typeof __WICKSTONE_RELEASE__ === 'undefined' || !__WICKSTONE_RELEASE__;

/** One bad argument or input field: which one, a stable code, and a sentence for a person. */
export interface FieldIssue {
  readonly field: string;
  readonly code: string;
  readonly message: string;
}

/**
 * The one error type for bad arguments and bad calculator inputs.
 *
 * A formula function throws it with a single issue naming the argument; `calculate` throws it with
 * every bad field at once, so a form can mark them all in one pass. `code` and `field` repeat the
 * first issue so that callers that only care about one field need not look into `issues`.
 */
export class CalcInputError extends Error {
  override readonly name = 'CalcInputError';
  // Declared only (set in the constructor, in this order): no class fields to define first.
  /** `INVALID_INPUTS` when several fields are bad, otherwise the single issue's code. */
  declare readonly code: string;
  /** The first bad field or argument. */
  declare readonly field: string;
  declare readonly issues: readonly FieldIssue[];

  constructor(issues: FieldIssue | readonly FieldIssue[]) {
    const list = Array.isArray(issues) ? [...(issues as readonly FieldIssue[])] : [issues as FieldIssue];
    // An empty list is a calc-core bug (the release then fails reading `first`).
    if (SELF_CHECKS && list.length === 0) throw new TypeError('CalcInputError needs at least one issue');
    const first = list[0] as FieldIssue;
    super(list.length === 1 ? first.message : list.map((i) => `${i.field}: ${i.message}`).join('; '));
    this.code = list.length === 1 ? first.code : 'INVALID_INPUTS';
    this.field = first.field;
    this.issues = list;
  }

  /** Plain data for an API error body: `{ code, message, issues }`. */
  toJSON(): { code: string; message: string; issues: FieldIssue[] } {
    return { code: this.code, message: this.message, issues: this.issues.map((i) => ({ ...i })) };
  }
}

/** A CalcInputError with one issue. */
export function inputError(field: string, code: string, message: string): CalcInputError {
  return new CalcInputError({ field, code, message });
}
