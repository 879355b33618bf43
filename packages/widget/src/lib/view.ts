// What the first view (`first/view.ts`, plain DOM, in the first flight) and the full widget
// (`ui/App.tsx`, Preact, after first paint) both show, worked out once: the ids that tie a field to
// its error and warnings, the problems to show beside each field, the hazards beside the figures,
// and the state the first view hands over, so both render the same markup from the same state.
import type {
  CalculationResult,
  CalculatorDefinition,
  ComputedResult,
  FieldIssue,
  UnitSystemId,
} from '@wickstone/calc-core';
import { headline } from '@wickstone/calc-core/answer';
import { issueMessage, type FormState } from './form.js';
import type { ResolvedInput } from './settings.js';

/** The DOM id of an input's control (unique within the widget's shadow root). */
export const controlId = (id: string): string => `wk-in-${id}`;

/** A warning's DOM id, so the fields it names can point at it. */
export const warningId = (code: string): string => `wk-warn-${code}`;

export const DISCLAIMER =
  'Results are estimates. They do not replace a site investigation or the judgement of a licensed professional working to local codes.';

/** The unit switch's choices: value, the word shown, its accessible name. */
export const UNIT_OPTIONS: readonly (readonly [UnitSystemId, string, string])[] = [
  ['si', 'metric', 'Metric (SI) units'],
  ['us', 'US', 'US customary units'],
];

/** A logo URL the widget will show: http(s), or a blob/data image the dashboard's preview made. */
export function safeLogoUrl(url: string | null, base: string): string | null {
  if (url === null || url === '') return null;
  try {
    const u = new URL(url, base);
    if (u.protocol === 'https:' || u.protocol === 'http:' || u.protocol === 'blob:') return u.href;
    return u.protocol === 'data:' && /^data:image\/(png|jpeg|webp);/i.test(url) ? url : null;
  } catch {
    return null;
  }
}

/**
 * A result's cautions: its own (the chosen liquid's hazard first), then the calculator's from its
 * texts, which follow first paint (the widget's engine computes without them).
 */
export function resultCautions(
  calculator: Pick<CalculatorDefinition, 'cautions'>,
  result: Pick<CalculationResult, 'cautions'>,
): CalculationResult['cautions'] {
  return [
    ...result.cautions,
    ...calculator.cautions.filter((c) => !result.cautions.some((r) => r.code === c.code)),
  ];
}

/** A caution about the liquid itself, shown beside the figures rather than in the notes. */
export const isHazard = (c: { code: string }): boolean =>
  c.code.startsWith('HAZARD_') || c.code === 'OTHER_LIQUID_HAZARD';

/** The warning that withholds an output, if any: the output is then shown as not defined, with its reason. */
export function withholdingWarning(result: ComputedResult, outputId: string) {
  return result.warnings.find((w) => (w.withholds ?? []).includes(outputId));
}

/** The outputs a result withholds (named, with the reason, never a figure). */
export function withheldOutputs(calculator: Pick<CalculatorDefinition, 'outputs'>, result: ComputedResult) {
  return calculator.outputs.flatMap((o) => {
    const w = result.outputs[o.id] === null ? withholdingWarning(result, o.id) : undefined;
    return w ? [{ output: o, warning: w }] : [];
  });
}

/**
 * Where each problem calc-core found is shown: beside its field when the field is shown, else in
 * the form's own error box, named after its input (hidden inputs, whole-calculation problems).
 */
export function placeIssues(
  issues: readonly FieldIssue[],
  inputs: readonly ResolvedInput[],
  visible: readonly ResolvedInput[],
  system: UnitSystemId,
): { fieldErrors: Map<string, string>; otherErrors: string[] } {
  const byId = new Map(inputs.map((i) => [i.def.id, i] as const));
  const fieldErrors = new Map<string, string>();
  const otherErrors: string[] = [];
  for (const issue of issues) {
    // A cell of a table input (`readings.2.mass`): the table names it beside the cell itself.
    if (issue.field.includes('.') && byId.get(issue.field.split('.')[0] ?? '')?.def.kind === 'table')
      continue;
    const input = byId.get(issue.field);
    if (input && input.mode !== 'hidden' && visible.includes(input)) {
      const note = input.mode === 'locked' ? ' (a value set by the firm)' : '';
      if (!fieldErrors.has(issue.field))
        fieldErrors.set(issue.field, issueMessage(issue, input, system) + note);
    } else {
      const label = input ? `${input.def.label}: ` : '';
      otherErrors.push(
        label +
          issueMessage(issue, input, system) +
          (input?.mode === 'hidden' ? ' (a value set by the firm)' : ''),
      );
    }
  }
  return { fieldErrors, otherErrors };
}

/** The warning ids each input is named in, for a current (not stale) result. */
export function warnedFields(result: ComputedResult | null): Map<string, string[]> {
  const out = new Map<string, string[]>();
  for (const w of result?.warnings ?? [])
    for (const f of w.fields) out.set(f, [...(out.get(f) ?? []), warningId(w.code)]);
  return out;
}

/** What the live region says after a calculation that found problems. */
export function issuesAnnouncement(
  found: readonly FieldIssue[],
  inputs: readonly ResolvedInput[],
  system: UnitSystemId,
): string {
  const byId = new Map(inputs.map((i) => [i.def.id, i] as const));
  const n = found.length;
  return `${n === 1 ? 'One input needs' : `${n} inputs need`} attention: ${found.map((i) => issueMessage(i, byId.get(i.field), system)).join('; ')}`;
}

/** What the live region says after an answer: its headline and how many warnings follow. */
export function answerAnnouncement(
  calculator: CalculatorDefinition,
  result: ComputedResult,
  system: UnitSystemId,
): string {
  const w = result.warnings.length;
  return `${headline(calculator, result, system).text}${w > 0 ? ` ${w === 1 ? 'One warning' : `${w} warnings`} below.` : ''}`;
}

/** A calculation that could not be made for a reason other than the inputs: said in the form. */
export const FAILED_ISSUE: FieldIssue = {
  field: 'inputs',
  code: 'FAILED',
  message: 'The calculation could not be completed with these inputs.',
};

/** The last answer: compute's numbers and the inputs and units it was worked out with. */
export interface ShownOutcome {
  readonly result: ComputedResult;
  readonly raw: Record<string, unknown>;
  readonly system: UnitSystemId;
}

/**
 * What the visitor has done in the first view, handed to the full widget when it takes over, so
 * the typed text, the unit system, the problems shown and the answer stay as they are.
 */
export interface ViewState {
  readonly form: FormState;
  readonly system: UnitSystemId;
  readonly issues: readonly FieldIssue[];
  readonly outcome: ShownOutcome | null;
  readonly stale: boolean;
  readonly announcement: string;
}
