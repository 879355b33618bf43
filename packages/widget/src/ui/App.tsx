import {
  CalcInputError,
  type CalculationResult,
  type CalculatorDefinition,
  type ComputedResult,
  type FieldIssue,
  type TableInput,
  type TableRow,
  type UnitSystemId,
} from '@wickstone/calc-core';
import type { EmbedWidget } from '@wickstone/contracts';
import type { ComponentProps } from 'preact';
import { useCallback, useEffect, useLayoutEffect, useMemo, useRef, useState } from 'preact/hooks';
import {
  applicable,
  collectInputs,
  initialForm,
  offeredOptions,
  reformat,
  settleChoices,
  typed,
  type FieldState,
  type FormState,
} from '../lib/form.js';
import { lookVariables } from '../lib/look.js';
import type { Reporter } from '../lib/reporter.js';
import { resolveInputSettings, type ResolvedInput } from '../lib/settings.js';
import {
  answerAnnouncement,
  controlId,
  FAILED_ISSUE,
  issuesAnnouncement,
  placeIssues,
  safeLogoUrl,
  UNIT_OPTIONS,
  warnedFields,
  type ShownOutcome,
  type ViewState,
} from '../lib/view.js';
import { afterThisPaint } from './after-paint.js';
import { Field } from './Field.js';
import { useExtras, type ExtrasModule } from '../lazy.js';
import type { LeadTarget } from './LeadForm.js';
import { pure } from './pure.js';
import { Result } from './Result.js';
import { ChartSlot, TableSlot } from './TableSlot.js';

export interface AppProps {
  readonly widget: EmbedWidget;
  readonly calculator: CalculatorDefinition;
  /** The numbers only: the answer shown at once. */
  readonly compute: (inputs: unknown) => ComputedResult;
  /** The full run (working, assumptions, input hash) once it is here (after first paint), else null. */
  readonly run: ((inputs: unknown) => CalculationResult) | null;
  /** Where runs and leads go; null in preview, where nothing is sent. */
  readonly apiBase: string | null;
  /** null in preview: runs are not reported and leads not sent. */
  readonly reporter: Reporter | null;
  /** The first view's state when the App takes over from it (typed texts, units, problems, answer). */
  readonly initial?: ViewState | undefined;
}

// Held once, so a field with no problems, warnings or text is handed the same props on every render.
const NO_ISSUES: readonly FieldIssue[] = [];
const NO_WARNINGS: readonly string[] = [];
const EMPTY: FieldState = { text: '', value: null };

interface Outcome extends ShownOutcome {
  /** The same run with its working and input hash, made after the answer is painted; null until then. */
  readonly full: CalculationResult | null;
  readonly target: LeadTarget | null;
}

/**
 * The unit choice: a short line of two plain radio buttons in the header ("Figures in ◉ metric
 * ○ US"), named after the widget so two widgets on a page have distinct groups.
 */
const UnitSwitch = pure(function UnitSwitch({
  name,
  system,
  onChange,
}: {
  name: string;
  system: UnitSystemId;
  onChange: (s: UnitSystemId) => void;
}) {
  return (
    <div class="units" role="radiogroup" aria-label={`${name}: units`} data-wickstone="unit-switch">
      <span class="units-lead" aria-hidden="true">
        Figures in
      </span>
      {UNIT_OPTIONS.map(([value, text, title]) => (
        <label key={value} title={title}>
          <input
            type="radio"
            name="wk-units"
            value={value}
            data-unit={value}
            checked={system === value}
            aria-label={title}
            onChange={() => onChange(value)}
          />
          <span>{text}</span>
        </label>
      ))}
    </div>
  );
});

// The sheet and lead form come with the extras chunk: rendered again, like the fields, only when
// their own props change (a new run to attach to), not on every keystroke beside an answer.
const Sheet = pure(function Sheet({
  extras,
  ...props
}: { extras: ExtrasModule } & ComponentProps<ExtrasModule['SheetBlock']>) {
  return <extras.SheetBlock {...props} />;
});
const Lead = pure(function Lead({
  extras,
  ...props
}: { extras: ExtrasModule } & ComponentProps<ExtrasModule['LeadForm']>) {
  return <extras.LeadForm {...props} />;
});

/** The whole widget: header, inputs, result and lead form for one calculator. */
export function App({ widget, calculator, compute, run, apiBase, reporter, initial }: AppProps) {
  const { settings } = widget;
  const inputs = useMemo(
    () => resolveInputSettings(calculator, settings.inputs),
    [calculator, settings.inputs],
  );
  const [system, setSystem] = useState<UnitSystemId>(initial?.system ?? settings.units.system);
  const [form, setForm] = useState<FormState>(
    () => initial?.form ?? initialForm(inputs, settings.units.system),
  );
  const [issues, setIssues] = useState<readonly FieldIssue[]>(initial?.issues ?? NO_ISSUES);
  const [outcome, setOutcome] = useState<Outcome | null>(() =>
    initial?.outcome ? { ...initial.outcome, full: null, target: null } : null,
  );
  const [stale, setStale] = useState(initial?.stale ?? false);
  const [report, setReport] = useState<'pending' | 'stored' | 'failed' | null>(null);
  const [announcement, setAnnouncement] = useState(initial?.announcement ?? '');
  const rootRef = useRef<HTMLDivElement>(null);
  // The working and the lead form arrive after first paint (the extras chunk).
  const extras = useExtras();

  // New settings (the dashboard's preview as an admin edits): start the form again from them.
  const settingsKey = JSON.stringify([settings.inputs, settings.units]);
  const appliedKeyRef = useRef(settingsKey);
  useEffect(() => {
    if (appliedKeyRef.current === settingsKey) return;
    appliedKeyRef.current = settingsKey;
    setSystem(settings.units.system);
    setForm(initialForm(inputs, settings.units.system));
    setIssues(NO_ISSUES);
    setOutcome(null);
    setReport(null);
  }, [settingsKey, inputs, settings.units.system]);

  const shownSystem: UnitSystemId = settings.units.visitorMaySwitch ? system : settings.units.system;
  const visible = applicable(inputs, form).filter((i) => i.mode !== 'hidden');
  const byId = new Map(inputs.map((i) => [i.def.id, i] as const));
  const { fieldErrors, otherErrors } = placeIssues(issues, inputs, visible, shownSystem);
  const warned = warnedFields(outcome && !stale ? outcome.result : null);

  // The handlers keep their identity from render to render (they change the form through updater
  // functions), so a field whose own props are unchanged is not rendered again. `stale` is only
  // read beside an answer, and every new answer clears it: an edit may set it whether or not one is shown.
  const edit = useCallback((change: (form: FormState) => FormState): void => {
    setForm(change);
    setStale(true);
  }, []);
  const onText = useCallback(
    (input: ResolvedInput, text: string): void =>
      edit((f) => ({ ...f, [input.def.id]: typed(input, text, shownSystem) })),
    [edit, shownSystem],
  );
  // A new liquid may leave the chosen preset unoffered: the form settles on one that goes with it.
  const onChoice = useCallback(
    (input: ResolvedInput, value: string): void =>
      edit((f) => settleChoices(inputs, { ...f, [input.def.id]: { text: value, value } })),
    [edit, inputs],
  );
  const onRows = useCallback(
    (input: TableInput, rows: readonly Readonly<Record<string, number | null>>[]): void =>
      edit((f) => ({ ...f, [input.id]: { text: '', value: rows as TableRow[] } })),
    [edit],
  );
  const onSystem = useCallback(
    (next: UnitSystemId): void => {
      setSystem(next);
      setForm((f) => reformat(f, inputs, next));
    },
    [inputs],
  );

  // The working and the run report need the full run: made once the answer is on screen (and the
  // full run has arrived with the texts), so typing to answer costs compute's numbers alone. A
  // layout effect only schedules it, from the render that put the answer in the DOM: the full run
  // starts in the task after that frame's paint, never before it (a passive effect may run before
  // the paint when the frame is late) nor inside the next frame (it would hold that frame back).
  useLayoutEffect(() => {
    if (outcome === null || outcome.full !== null || run === null) return;
    return afterThisPaint(() => {
      let full: CalculationResult;
      try {
        full = run(outcome.raw);
      } catch (err) {
        console.error('Wickstone: the working could not be made', err);
        return;
      }
      if (reporter === null) {
        setOutcome((o) => (o === outcome ? { ...o, full } : o));
        return;
      }
      const sent = reporter.report(full, outcome.system);
      setOutcome((o) =>
        o === outcome ? { ...o, full, target: { runId: sent.id, stored: sent.stored } } : o,
      );
      setReport('pending');
      void sent.stored.then((ok) =>
        setReport((current) => (current === 'pending' ? (ok ? 'stored' : 'failed') : current)),
      );
    });
  }, [outcome, run, reporter]);

  const calculate = (e: Event): void => {
    e.preventDefault();
    let result: ComputedResult;
    const raw = collectInputs(inputs, form);
    try {
      result = compute(raw);
    } catch (err) {
      // A calc-core bug must not take the host page's script down with it: say so in the form.
      if (!(err instanceof CalcInputError)) console.error('Wickstone: calculation failed', err);
      const found: readonly FieldIssue[] = err instanceof CalcInputError ? err.issues : [FAILED_ISSUE];
      setIssues(found);
      setAnnouncement(issuesAnnouncement(found, inputs, shownSystem));
      const first = found.find((i) => byId.get(i.field)?.mode === 'editable');
      if (first) rootRef.current?.querySelector<HTMLElement>(`#${controlId(first.field)}`)?.focus();
      return;
    }
    setIssues(NO_ISSUES);
    setStale(false);
    setAnnouncement(answerAnnouncement(calculator, result, shownSystem));
    setReport(null);
    setOutcome({ result, raw, system: shownSystem, full: null, target: null });
  };

  const preview = reporter === null;
  const logo = safeLogoUrl(settings.look.logoUrl, apiBase ?? location.href);
  const leadTarget: LeadTarget | null = outcome?.target ?? null;
  return (
    <div
      class="root"
      ref={rootRef}
      style={lookVariables(settings.look)}
      data-wickstone="root"
      data-calculator={calculator.id}
      data-system={shownSystem}
    >
      <header class="head">
        <div class="brand">
          {logo && <img class="logo" src={logo} alt="" data-wickstone="logo" />}
          <div class="titles">
            <p class="widget-name">{widget.name}</p>
            <h2 class="title">{calculator.title}</h2>
          </div>
        </div>
        {settings.units.visitorMaySwitch && (
          <UnitSwitch name={widget.name} system={shownSystem} onChange={onSystem} />
        )}
      </header>
      <p class="summary">{calculator.summary}</p>
      <form
        class="body"
        data-wickstone="form"
        noValidate
        onSubmit={calculate}
        aria-label={`${widget.name}: inputs`}
      >
        <div class="grid">
          {visible.map((input) =>
            input.def.kind === 'table' ? (
              <TableSlot
                key={input.def.id}
                input={input.def}
                rows={
                  Array.isArray(form[input.def.id]?.value) ? (form[input.def.id]?.value as TableRow[]) : null
                }
                system={shownSystem}
                onRows={onRows}
              />
            ) : (
              <Field
                key={input.def.id}
                input={input}
                state={form[input.def.id] ?? EMPTY}
                system={shownSystem}
                error={fieldErrors.get(input.def.id)}
                options={offeredOptions(input, inputs, form)}
                warningIds={warned.get(input.def.id) ?? NO_WARNINGS}
                onText={onText}
                onChoice={onChoice}
              />
            ),
          )}
        </div>
        {otherErrors.length > 0 && (
          <div class="form-error" data-wickstone="form-error">
            <div>
              {otherErrors.map((m, i) => (
                <p key={i}>{m}</p>
              ))}
            </div>
          </div>
        )}
        <div class="actions">
          <button class="btn" type="submit" data-wickstone="calculate">
            Work it out
          </button>
          <span class="hint">Worked out in your browser, instantly.</span>
        </div>
      </form>
      <div class="sr" aria-live="polite" data-wickstone="announcer">
        {announcement}
      </div>
      {outcome && (
        <Result
          calculator={calculator}
          result={outcome.result}
          full={outcome.full}
          system={shownSystem}
          stale={stale}
          firmCautions={settings.cautions}
          runId={leadTarget?.runId ?? null}
          report={report}
          name={widget.name}
          secondary={settings.result?.secondary ?? 'folded'}
          extras={extras}
        />
      )}
      {outcome?.full && calculator.inputs.some((i) => i.kind === 'table') && (
        <ChartSlot result={outcome.full} />
      )}
      {extras && (outcome !== null || preview) && settings.sheet.enabled && (
        <Sheet
          extras={extras}
          publicKey={widget.publicKey}
          apiBase={preview ? null : apiBase}
          target={leadTarget}
        />
      )}
      {/* In preview the form shows from the start, so an admin sees the fields as they set them. */}
      {extras && (outcome !== null || preview) && settings.leadForm.enabled && (
        <Lead
          extras={extras}
          form={settings.leadForm}
          publicKey={widget.publicKey}
          apiBase={preview ? null : apiBase}
          target={leadTarget}
        />
      )}
    </div>
  );
}
