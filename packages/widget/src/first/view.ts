// The first view: what a visitor needs to type and get a result, in plain DOM, without Preact, so it
// fits the first flight. Header (widget name, calculator title, unit switch), summary, the fields
// (label with unit, control, locked note, help, error), "Work it out", and the result's headline,
// figures, hazards and warnings (a figure never without its warnings). The markup and classes are
// the ones `ui/App.tsx` renders, so when the full widget takes over (after first paint, with this
// view's state) nothing moves.
import type {
  CalculatorDefinition,
  ChoiceInput,
  ComputedResult,
  FieldIssue,
  QuantityInput,
  TableInput,
  UnitId,
  UnitSystemId,
} from '@wickstone/calc-core';
import type { EmbedWidget } from '@wickstone/contracts';
import { formatResult, headline, isSecondaryOutput } from '@wickstone/calc-core/answer';
import { outputHelp } from '@wickstone/calc-core/display';
import { CalcInputError } from '@wickstone/calc-core';
import {
  applicable,
  collectInputs,
  initialForm,
  offeredOptions,
  reformat,
  settleChoices,
  typed,
  type FieldState,
} from '../lib/form.js';
import { lookVariables } from '../lib/look.js';
import { resolveInputSettings, type ResolvedInput } from '../lib/settings.js';
import { displayUnitOf, outputUnitFor, toDisplay, unitGap, unitSymbol, withUnit } from '../lib/units.js';
import {
  answerAnnouncement,
  controlId,
  DISCLAIMER,
  FAILED_ISSUE,
  isHazard,
  issuesAnnouncement,
  placeIssues,
  resultCautions,
  safeLogoUrl,
  UNIT_OPTIONS,
  warnedFields,
  warningId,
  withheldOutputs,
  type ViewState,
} from '../lib/view.js';

type Child = Node | string | null | undefined | false;

/** An element with attributes (null, undefined and false leave one out) and children. */
function h(tag: string, attrs: Record<string, string | null | undefined | false>, ...children: Child[]) {
  const el = document.createElement(tag);
  for (const [k, v] of Object.entries(attrs)) if (v != null && v !== false) el.setAttribute(k, v);
  for (const c of children) if (c != null && c !== false) el.append(c);
  return el;
}

/** The lock note's icon, as `ui/Field.tsx` draws it (a constant: no text of anyone's goes into it). */
const LOCK_ICON =
  '<svg viewBox="0 0 12 14" width="11" height="13" aria-hidden="true"><path d="M3 6V4a3 3 0 0 1 6 0v2h1.5v7h-9V6zm1.5 0h3V4a1.5 1.5 0 0 0-3 0z" fill="currentColor"></path></svg>';

/** One calculator input, as `ui/Field.tsx` renders it. */
function field(
  input: ResolvedInput,
  state: FieldState,
  system: UnitSystemId,
  error: string | undefined,
  options: readonly ChoiceInput['options'][number][],
  warningIds: readonly string[],
): HTMLElement {
  const def = input.def;
  const id = controlId(def.id);
  const locked = input.mode === 'locked';
  const choice = def.kind === 'choice' ? def : null;
  const option = choice?.options.find((o) => o.value === state.value);
  const help = choice ? option?.help : def.help;
  const symbol = choice ? '' : unitSymbol(displayUnitOf(def as QuantityInput, system));
  const describedBy =
    [help ? `${id}-help` : '', locked ? `${id}-lock` : '', error ? `${id}-error` : '', ...warningIds]
      .filter(Boolean)
      .join(' ') || null;
  const common = {
    id,
    'data-input': def.id,
    'aria-describedby': describedBy,
    'aria-invalid': error ? 'true' : null,
  };
  let control: HTMLInputElement | HTMLSelectElement;
  if (choice && !locked) {
    control = h(
      'select',
      common,
      ...options.map((o) => h('option', { value: o.value }, o.label)),
    ) as HTMLSelectElement;
    control.value = String(state.value);
  } else {
    control = h('input', {
      ...common,
      type: 'text',
      inputmode: choice ? null : 'decimal',
      autocomplete: 'off',
      spellcheck: 'false',
      'aria-readonly': locked ? 'true' : null,
    }) as HTMLInputElement;
    control.readOnly = locked;
    control.value = choice ? (option?.label ?? String(state.value)) : state.text;
  }
  const lockNote =
    locked && h('p', { class: 'note lock-note', id: `${id}-lock` }, 'Fixed by the firm for this calculator');
  if (lockNote) lockNote.insertAdjacentHTML('afterbegin', LOCK_ICON);
  return h(
    'div',
    {
      class: ['field', locked && 'locked', error && 'invalid', warningIds.length > 0 && 'warned']
        .filter(Boolean)
        .join(' '),
      'data-field': def.id,
      'data-mode': input.mode,
      'data-invalid': error ? '' : null,
      'data-warned': warningIds.length > 0 ? '' : null,
    },
    h(
      'label',
      { class: 'label', for: id },
      def.label,
      symbol !== '' && h('span', { class: 'unit' }, `, ${symbol}`),
    ),
    h('div', { class: 'box' }, control),
    lockNote,
    help && h('p', { class: 'note', id: `${id}-help` }, help),
    error && h('p', { class: 'error', id: `${id}-error`, 'data-field-error': def.id }, error),
  );
}

/** A table input's place, held until the tables chunk (and the full widget) arrive, as `ui/TableSlot.tsx` holds it. */
function tableSlot(def: TableInput): HTMLElement {
  const slot = h(
    'div',
    { class: 'table-slot' },
    h(
      'div',
      { class: 'field', 'data-field': def.id, 'data-wickstone': 'table-loading' },
      h('p', { class: 'label' }, def.label),
      h('p', { class: 'note' }, 'Loading the table of readings…'),
    ),
  );
  slot.style.gridColumn = '1 / -1';
  return slot;
}

function figure(value: number, unit: UnitId): HTMLElement {
  const text = formatResult(toDisplay(value, unit));
  const gap = unitGap(unit);
  return gap === ''
    ? h('span', { class: 'figure' }, withUnit(text, unit))
    : h('span', { class: 'figure' }, text, gap, h('span', { class: 'u' }, unitSymbol(unit)));
}

/** The answer, as `ui/Result.tsx` renders it before the working arrives: figures, hazards, warnings, disclaimer. */
function resultView(
  calculator: CalculatorDefinition,
  result: ComputedResult,
  system: UnitSystemId,
  stale: boolean,
  name: string,
): HTMLElement {
  const answer = headline(calculator, result, system);
  const main = calculator.outputs.filter(
    (o) => typeof result.outputs[o.id] === 'number' && !isSecondaryOutput(o),
  );
  const withheld = withheldOutputs(calculator, result);
  const hazards = resultCautions(calculator, result).filter(isHazard);
  const readout = (output: (typeof main)[number]): HTMLElement => {
    const value = result.outputs[output.id] as number;
    const unit = outputUnitFor(output, system, value);
    const range = result.band?.outputs[output.id];
    const help = outputHelp(output, value);
    return h(
      'div',
      { class: 'readout', 'data-output': output.id, 'data-value': String(value), 'data-unit': unit },
      h('dt', {}, output.label),
      h(
        'dd',
        {},
        figure(value, unit),
        range &&
          range.low !== range.high &&
          h(
            'span',
            { class: 'band', 'data-band': output.id },
            `likely ${withUnit(`${formatResult(toDisplay(range.low, unit))} – ${formatResult(toDisplay(range.high, unit))}`, unit)}`,
          ),
      ),
      help && h('dd', { class: 'help' }, help),
    );
  };
  return h(
    'section',
    {
      class: stale ? 'result is-stale' : 'result',
      'data-wickstone': 'result',
      'data-result': '',
      'data-stale': stale ? '' : null,
      'aria-label': `${name}: answer`,
    },
    stale &&
      h(
        'p',
        { class: 'stale', 'data-wickstone': 'stale' },
        'The inputs have changed since this answer. Work it out again to update it.',
      ),
    h(
      'div',
      { class: 'answer' },
      h(
        'div',
        { class: 'answer-text' },
        h(
          'p',
          {
            class: answer.withheld ? 'headline is-withheld' : 'headline',
            'data-wickstone': 'headline',
            'data-headline-output': answer.output,
          },
          answer.text,
        ),
        (main.length > 0 || withheld.length > 0) &&
          h(
            'dl',
            { class: 'readouts' },
            ...main.map(readout),
            ...withheld.map(({ output, warning }) =>
              h(
                'div',
                { class: 'readout is-withheld', 'data-output': output.id, 'data-withheld': warning.code },
                h('dt', {}, output.label),
                h('dd', {}, h('span', { class: 'figure withheld' }, 'no figure')),
              ),
            ),
          ),
      ),
    ),
    hazards.length > 0 &&
      h(
        'div',
        {
          class: 'hazards',
          role: 'note',
          'aria-label': `${name}: hazards of the liquid`,
          'data-wickstone': 'hazards',
        },
        ...hazards.map((c) =>
          h(
            'p',
            { class: 'hazard', 'data-caution': c.code, 'data-hazard': c.code },
            h('strong', {}, 'Hazard. '),
            c.text,
            c.source && h('span', { class: 'note' }, ` Source: ${c.source}.`),
          ),
        ),
      ),
    result.warnings.length > 0 &&
      h(
        'div',
        { class: 'warnings', role: 'group', 'aria-label': `${name}: warnings` },
        ...result.warnings.map((w) =>
          h('p', { class: 'warning', id: warningId(w.code), 'data-warning': w.code }, w.message),
        ),
      ),
    h('p', { class: 'disclaimer', 'data-wickstone': 'disclaimer' }, DISCLAIMER),
  );
}

export interface FirstViewOptions {
  readonly widget: EmbedWidget;
  readonly calculator: CalculatorDefinition;
  readonly compute: (inputs: unknown) => ComputedResult;
  /** For a relative logo URL: the server's base, else the page. */
  readonly apiBase: string | null;
}

export interface FirstView {
  /** What the visitor has done so far: typed texts, unit system, problems, the answer. */
  state(): ViewState;
  /** The root element (`.root`), inside `target`. */
  readonly root: HTMLElement;
  /** Stops listening: the full widget has taken its elements over. */
  stop(): void;
}

/**
 * Renders the first view into `target` (emptied first) and keeps it working: typing, choices, the
 * unit switch and "Work it out", as the full widget does. Redraws keep the focused control and its caret.
 */
export function renderFirstView(target: HTMLElement, o: FirstViewOptions): FirstView {
  const { widget, calculator, compute } = o;
  const { settings } = widget;
  const name = widget.name;
  const inputs = resolveInputSettings(calculator, settings.inputs);
  const byId = new Map(inputs.map((i) => [i.def.id, i] as const));
  const mayEdit = settings.units.visitorMaySwitch;
  let s: ViewState = {
    form: initialForm(inputs, settings.units.system),
    system: settings.units.system,
    issues: [],
    outcome: null,
    stale: false,
    announcement: '',
  };
  const shown = (): UnitSystemId => (mayEdit ? s.system : settings.units.system);

  const logo = safeLogoUrl(settings.look.logoUrl, o.apiBase ?? location.href);
  const grid = h('div', { class: 'grid' });
  const formError = h('div', { class: 'form-error', 'data-wickstone': 'form-error' });
  const actions = h(
    'div',
    { class: 'actions' },
    h('button', { class: 'btn', type: 'submit', 'data-wickstone': 'calculate' }, 'Work it out'),
    h('span', { class: 'hint' }, 'Worked out in your browser, instantly.'),
  );
  const form = h(
    'form',
    { class: 'body', 'data-wickstone': 'form', novalidate: '', 'aria-label': `${name}: inputs` },
    grid,
    actions,
  );
  const announcer = h('div', { class: 'sr', 'aria-live': 'polite', 'data-wickstone': 'announcer' });
  const radios = UNIT_OPTIONS.map(([value, text, title]) => {
    const radio = h('input', {
      type: 'radio',
      name: 'wk-units',
      value,
      'data-unit': value,
      'aria-label': title,
    }) as HTMLInputElement;
    return [radio, h('label', { title }, radio, h('span', {}, text))] as const;
  });
  const root = h(
    'div',
    {
      class: 'root',
      'data-wickstone': 'root',
      'data-calculator': calculator.id,
    },
    h(
      'header',
      { class: 'head' },
      h(
        'div',
        { class: 'brand' },
        logo && h('img', { class: 'logo', src: logo, alt: '', 'data-wickstone': 'logo' }),
        h(
          'div',
          { class: 'titles' },
          h('p', { class: 'widget-name' }, name),
          h('h2', { class: 'title' }, calculator.title),
        ),
      ),
      mayEdit &&
        h(
          'div',
          {
            class: 'units',
            role: 'radiogroup',
            'aria-label': `${name}: units`,
            'data-wickstone': 'unit-switch',
          },
          h('span', { class: 'units-lead', 'aria-hidden': 'true' }, 'Figures in'),
          ...radios.map(([, label]) => label),
        ),
    ),
    h('p', { class: 'summary' }, calculator.summary),
    form,
    announcer,
  );
  for (const [k, v] of Object.entries(lookVariables(settings.look))) root.style.setProperty(k, v);
  let result: HTMLElement | null = null;

  /** Draws what depends on the state (fields, problems, answer), keeping the focused control and its caret. */
  const draw = (): void => {
    // A redraw makes the fields again (the unit switch and the button stay): focus and caret follow
    // the focused field by its id. Only fields are remade, and each has an id, so this is all the
    // first view needs of lib/focus.ts, which the full widget's takeover uses (it may meet any control).
    const active = (target.getRootNode() as ShadowRoot).activeElement as HTMLInputElement | null;
    const id = active?.id;
    const text = active?.localName === 'input' ? active : null;
    const start = text?.selectionStart ?? null;
    const end = text?.selectionEnd ?? null;
    const direction = text?.selectionDirection ?? undefined;
    const system = shown();
    root.setAttribute('data-system', system);
    for (const [radio] of radios) radio.checked = radio.value === system;
    const visible = applicable(inputs, s.form).filter((i) => i.mode !== 'hidden');
    const { fieldErrors, otherErrors } = placeIssues(s.issues, inputs, visible, system);
    const warned = warnedFields(s.outcome && !s.stale ? s.outcome.result : null);
    grid.replaceChildren(
      ...visible.map((input) =>
        input.def.kind === 'table'
          ? tableSlot(input.def)
          : field(
              input,
              s.form[input.def.id] ?? { text: '', value: null },
              system,
              fieldErrors.get(input.def.id),
              offeredOptions(input, inputs, s.form),
              warned.get(input.def.id) ?? [],
            ),
      ),
    );
    formError.replaceChildren(h('div', {}, ...otherErrors.map((m) => h('p', {}, m))));
    if (otherErrors.length > 0) grid.after(formError);
    else formError.remove();
    announcer.textContent = s.announcement;
    const next = s.outcome && resultView(calculator, s.outcome.result, system, s.stale, name);
    if (result && next) result.replaceWith(next);
    else if (next) announcer.after(next);
    else result?.remove();
    result = next;
    const again = id ? root.querySelector<HTMLInputElement>(`#${id}`) : null;
    if (again && again !== active) {
      again.focus({ preventScroll: true });
      if (start !== null && end !== null) again.setSelectionRange(start, end, direction);
    }
  };

  const edit = (next: ViewState['form']): void => {
    const wasStale = s.stale;
    s = { ...s, form: next, stale: s.outcome !== null };
    // Only a change of what is shown redraws: typing into a box leaves the box alone.
    if (s.stale !== wasStale) draw();
  };

  const listening = new AbortController();
  const on = { signal: listening.signal };
  root.addEventListener(
    'input',
    (e) => {
      const el = e.target as HTMLInputElement;
      const input = byId.get(el.getAttribute('data-input') ?? '');
      if (input && el.localName === 'input' && input.def.kind !== 'choice' && input.mode === 'editable')
        edit({ ...s.form, [input.def.id]: typed(input, el.value, shown()) });
    },
    on,
  );
  root.addEventListener(
    'change',
    (e) => {
      const el = e.target as HTMLInputElement | HTMLSelectElement;
      const input = byId.get(el.getAttribute('data-input') ?? '');
      const unit = el.getAttribute('data-unit') as UnitSystemId | null;
      if (input && el.localName === 'select') {
        // A new liquid may leave the chosen preset unoffered: the form settles on one that goes with it.
        edit(settleChoices(inputs, { ...s.form, [input.def.id]: { text: el.value, value: el.value } }));
        draw();
      } else if (unit) {
        s = { ...s, system: unit, form: reformat(s.form, inputs, unit) };
        draw();
      }
    },
    on,
  );
  form.addEventListener(
    'submit',
    (e) => {
      e.preventDefault();
      const system = shown();
      const raw = collectInputs(inputs, s.form);
      let computed: ComputedResult;
      try {
        computed = compute(raw);
      } catch (err) {
        if (!(err instanceof CalcInputError)) console.error('Wickstone: calculation failed', err);
        const found: readonly FieldIssue[] = err instanceof CalcInputError ? err.issues : [FAILED_ISSUE];
        s = { ...s, issues: found, announcement: issuesAnnouncement(found, inputs, system) };
        draw();
        const first = found.find((i) => byId.get(i.field)?.mode === 'editable');
        if (first) root.querySelector<HTMLElement>(`#${controlId(first.field)}`)?.focus();
        return;
      }
      s = {
        ...s,
        issues: [],
        stale: false,
        announcement: answerAnnouncement(calculator, computed, system),
        outcome: { result: computed, raw, system },
      };
      draw();
    },
    on,
  );

  target.replaceChildren(root);
  draw();
  return { state: () => s, root, stop: () => listening.abort() };
}
