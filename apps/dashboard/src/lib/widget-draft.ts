import { formatInput as formatNumber, parseNumber } from '@wickstone/calc-core/format';
import {
  type ChoiceInput,
  displayUnitOf,
  fromCanonical,
  rowsFromCells,
  showTable,
  toCanonical,
  unitSymbol,
  withUnit,
  type CalculatorDefinition,
  type InputDefinition,
  type QuantityInput,
  type TableInput,
  type TableRow,
  type UnitSystemId,
} from '@wickstone/calc-core';
import {
  contrastRatio,
  emailSchema,
  hexColorPattern,
  originSchema,
  updateWidgetBodySchema,
  WCAG_AA_TEXT,
  type EmbedWidget,
  type InputMode,
  type Widget,
  type WidgetSettings,
  type WidgetStatus,
} from '@wickstone/contracts';
import type { FieldErrors } from './form';

/*
 * The widget editor's unsaved state and everything computed from it: the PATCH body, the checks
 * made before anything is sent, and the EmbedWidget the live preview renders. Pure functions, so
 * the rules are tested without a browser.
 */

export type UpdateWidgetBody = NonNullable<ReturnType<typeof updateWidgetBodySchema.safeParse>['data']>;
export type WidgetColors = WidgetSettings['look']['colors'];
export type ColorKey = keyof WidgetColors;

export interface WidgetDraft {
  name: string;
  status: WidgetStatus;
  /** The allowed origins as typed, one a line. */
  sitesText: string;
  /** The lead notification addresses as typed, one a line. */
  notifyText: string;
  /** Input defaults are canonical (SI, degrees, °C); colours may hold half-typed text. */
  settings: WidgetSettings;
  /**
   * What is typed in each quantity input's default box, in the draft's unit system. Empty means
   * "the calculator's own default", so a setting is stored only where the firm chose a value.
   */
  defaultTexts: Record<string, string>;
  /** The logo the preview shows: the saved image's URL, or the one just uploaded. */
  logoUrl: string | null;
}

/** Numbers typed into the editor read and print as in the widget (calc-core's input format). */
export { formatNumber, parseNumber };

/** The calculator's default of a quantity input as a number in the unit it is typed in. */
export function calculatorDefaultNumber(input: QuantityInput, system: UnitSystemId): string {
  return formatNumber(fromCanonical(input.default, displayUnitOf(input, system)));
}

/** The same with its unit: `1 mm`, `68 °F`. */
export function calculatorDefaultText(input: QuantityInput, system: UnitSystemId): string {
  return withUnit(calculatorDefaultNumber(input, system), displayUnitOf(input, system));
}

/** Non-empty trimmed lines. */
export function lines(text: string): string[] {
  return text
    .split(/\r?\n/)
    .map((l) => l.trim())
    .filter((l) => l !== '');
}

function defaultTextsFor(calc: CalculatorDefinition, settings: WidgetSettings): Record<string, string> {
  const texts: Record<string, string> = {};
  for (const input of calc.inputs) {
    if (input.kind === 'choice') continue;
    const value = settings.inputs[input.id]?.default;
    if (input.kind === 'table') {
      texts[input.id] = Array.isArray(value)
        ? tableText(input, value as TableRow[], settings.units.system)
        : '';
      continue;
    }
    texts[input.id] =
      typeof value === 'number'
        ? formatNumber(fromCanonical(value, displayUnitOf(input, settings.units.system)))
        : '';
  }
  return texts;
}

/** An input setting that says nothing (editable, no default) is left out, as a new widget has it. */
function tidyInputs(inputs: WidgetSettings['inputs']): WidgetSettings['inputs'] {
  return Object.fromEntries(
    Object.entries(inputs).filter(
      ([, s]) => s.mode !== 'editable' || s.default !== undefined || s.options !== undefined,
    ),
  );
}

export function draftFromWidget(widget: Widget, calc: CalculatorDefinition): WidgetDraft {
  const settings = { ...widget.settings, inputs: tidyInputs(widget.settings.inputs) };
  return {
    name: widget.name,
    status: widget.status,
    sitesText: widget.allowedOrigins.join('\n'),
    notifyText: widget.settings.leadForm.notify.join('\n'),
    settings,
    defaultTexts: defaultTextsFor(calc, settings),
    logoUrl: widget.logoUrl,
  };
}

/** The draft in another unit system: every default box shows the same value in the new units. */
export function withUnitSystem(
  draft: WidgetDraft,
  calc: CalculatorDefinition,
  system: UnitSystemId,
): WidgetDraft {
  const settings = { ...draft.settings, units: { ...draft.settings.units, system } };
  const texts = defaultTextsFor(calc, settings);
  // A box holding something unreadable keeps it, so the person sees what to fix.
  for (const [id, text] of Object.entries(draft.defaultTexts)) {
    if (Number.isNaN(parseNumber(text))) texts[id] = text;
  }
  return { ...draft, settings, defaultTexts: texts };
}

function withInput(
  draft: WidgetDraft,
  id: string,
  change: {
    mode?: InputMode;
    default?: WidgetSettings['inputs'][string]['default'];
    options?: string[] | undefined;
  },
): WidgetDraft {
  const current = draft.settings.inputs[id] ?? { mode: 'editable' as InputMode };
  const next = { ...current, ...change };
  if (next.default === undefined) delete next.default;
  if (next.options === undefined) delete next.options;
  const inputs = tidyInputs({ ...draft.settings.inputs, [id]: next });
  return { ...draft, settings: { ...draft.settings, inputs } };
}

export function setInputMode(draft: WidgetDraft, id: string, mode: InputMode): WidgetDraft {
  return withInput(draft, id, { mode });
}

/** A typed default: stored canonical when it reads as a number, dropped when the box is emptied. */
export function setDefaultText(draft: WidgetDraft, input: QuantityInput, text: string): WidgetDraft {
  const parsed = parseNumber(text);
  const texts = { ...draft.defaultTexts, [input.id]: text };
  const base = { ...draft, defaultTexts: texts };
  if (parsed === null) return withInput(base, input.id, { default: undefined });
  if (Number.isNaN(parsed)) return base;
  return withInput(base, input.id, {
    default: toCanonical(parsed, displayUnitOf(input, draft.settings.units.system)),
  });
}

// ---- a table input's starting rows, typed or pasted as lines of cells in the display units

const LINE_CELLS = /\s*[;\t]\s*|\s*,\s+|\s+/;

/** The table's rows as lines of cells (`5  1845.81`), in the unit system's display units. */
export function tableText(input: TableInput, rows: readonly TableRow[], system: UnitSystemId): string {
  return showTable(input, rows, system)
    .text.map((r) => r.join('  '))
    .join('\n');
}

/** Lines of cells (spaces, tabs, semicolons or a comma and a space between them) read as rows; every problem named by row and column. */
export function readTableText(input: TableInput, text: string, system: UnitSystemId) {
  const cells = lines(text).map((l) => l.split(LINE_CELLS).filter((c) => c !== ''));
  if (cells.length === 0) return { rows: [] as TableRow[], issues: [] };
  const units = Object.fromEntries(input.columns.map((c) => [c.id, displayUnitOf(c, system)]));
  return rowsFromCells(input, cells, parseNumber, { units });
}

/** Typed starting rows: stored canonical when every cell reads, dropped when the box is emptied. */
export function setTableDefaultText(draft: WidgetDraft, input: TableInput, text: string): WidgetDraft {
  const base = { ...draft, defaultTexts: { ...draft.defaultTexts, [input.id]: text } };
  const read = readTableText(input, text, draft.settings.units.system);
  if (read.rows === null) return base;
  return withInput(base, input.id, {
    default: read.rows.length === 0 ? undefined : read.rows.map((r) => ({ ...r })),
  });
}

/** A chosen option; the calculator's own default is stored as no setting at all. */
export function setChoiceDefault(draft: WidgetDraft, input: InputDefinition, value: string): WidgetDraft {
  return withInput(draft, input.id, { default: value === input.default ? undefined : value });
}

/**
 * Offers or withdraws one option of a choice. Every option offered is stored as no list at all;
 * withdrawing the default's option is left to the server to refuse, naming the field.
 */
export function setOptionOffered(
  draft: WidgetDraft,
  input: ChoiceInput,
  value: string,
  offered: boolean,
): WidgetDraft {
  const all = input.options.map((o) => o.value);
  const now = draft.settings.inputs[input.id]?.options ?? all;
  const next = all.filter((v) => (v === value ? offered : now.includes(v)));
  return withInput(draft, input.id, { options: next.length === all.length ? undefined : next });
}

/** The choice values the widget starts from: the firm's default, else the calculator's. */
export function startingChoices(
  calc: CalculatorDefinition,
  settings: WidgetSettings,
): Record<string, string> {
  const values: Record<string, string> = {};
  for (const input of calc.inputs) {
    if (input.kind !== 'choice') continue;
    const set = settings.inputs[input.id]?.default;
    values[input.id] =
      typeof set === 'string' && input.options.some((o) => o.value === set) ? set : input.default;
  }
  return values;
}

/** "Liquid is Custom liquid and Liquid and surface is Custom", for an input that applies only sometimes. */
export function conditionText(input: InputDefinition, calc: CalculatorDefinition): string | null {
  const parts = (input.appliesWhen ?? []).map((cond) => {
    const parent = calc.inputs.find((i) => i.id === cond.input);
    const names = cond.values.map((v) =>
      parent?.kind === 'choice' ? (parent.options.find((o) => o.value === v)?.label ?? v) : v,
    );
    const joined = names.length > 1 ? `${names.slice(0, -1).join('”, “')}” or “${names.at(-1)}` : names[0];
    return `${parent?.label ?? cond.input} is “${joined}”`;
  });
  return parts.length ? parts.join(' and ') : null;
}

export const colorPairs = [
  { fg: 'text', bg: 'background', label: 'text and background' },
  { fg: 'primaryText', bg: 'primary', label: 'button text and button colour' },
] as const satisfies readonly { fg: ColorKey; bg: ColorKey; label: string }[];

/** The WCAG contrast of a pair, or null while either colour is not a complete #rrggbb. */
export function pairRatio(colors: WidgetColors, pair: (typeof colorPairs)[number]): number | null {
  const fg = colors[pair.fg];
  const bg = colors[pair.bg];
  return hexColorPattern.test(fg) && hexColorPattern.test(bg) ? contrastRatio(fg, bg) : null;
}

/** The ratio as people read it, to two decimals; a failing 4.497 shows as 4.49, never as "4.50". */
export function formatRatio(ratio: number): string {
  const rounded = ratio.toFixed(2);
  const shown =
    ratio < WCAG_AA_TEXT && Number(rounded) >= WCAG_AA_TEXT
      ? (Math.floor(ratio * 100) / 100).toFixed(2)
      : rounded;
  return `${shown}:1`;
}

/** Colours the preview can use: a half-typed one keeps the last complete value. */
export function usableColors(colors: WidgetColors, fallback: WidgetColors): WidgetColors {
  const pick = (k: ColorKey) => (hexColorPattern.test(colors[k]) ? colors[k] : fallback[k]);
  return {
    background: pick('background'),
    text: pick('text'),
    primary: pick('primary'),
    primaryText: pick('primaryText'),
  };
}

/** What the widget bundle renders for this draft: the saved widget's identity, the unsaved settings. */
export function previewWidget(widget: Widget, draft: WidgetDraft, colors: WidgetColors): EmbedWidget {
  const s = draft.settings;
  return {
    publicKey: widget.publicKey,
    name: draft.name.trim() || widget.name,
    calculatorId: widget.calculatorId,
    release: widget.release,
    settings: {
      inputs: s.inputs,
      units: s.units,
      look: { colors, font: s.look.font, corner: s.look.corner, logoUrl: draft.logoUrl },
      cautions: s.cautions.trim(),
      leadForm: {
        enabled: s.leadForm.enabled,
        fields: s.leadForm.fields,
        consentText: s.leadForm.consentText,
      },
      sheet: { enabled: s.sheet.enabled },
      result: s.result,
    },
  };
}

/** The PATCH body as the draft stands, before any check: the full settings, always. */
export function draftBody(draft: WidgetDraft) {
  return {
    name: draft.name,
    status: draft.status,
    allowedOrigins: lines(draft.sitesText),
    settings: {
      ...draft.settings,
      leadForm: { ...draft.settings.leadForm, notify: lines(draft.notifyText) },
    },
  };
}

/** Whether the draft differs from what is saved. */
export function isDirty(draft: WidgetDraft, saved: WidgetDraft): boolean {
  return (
    JSON.stringify(draftBody(draft)) !== JSON.stringify(draftBody(saved)) ||
    JSON.stringify(draft.defaultTexts) !== JSON.stringify(saved.defaultTexts)
  );
}

export type SiteCheck =
  { ok: true; origin: string } | { ok: false; message: string; suggestion: string | null };

/** One typed site, checked with the contracts' `originSchema`; a URL with a path suggests its origin. */
export function checkSite(line: string): SiteCheck {
  const parsed = originSchema.safeParse(line);
  if (parsed.success) return { ok: true, origin: parsed.data };
  let suggestion: string | null = null;
  try {
    const u = new URL(line.includes('://') ? line : `https://${line}`);
    const origin = u.origin.toLowerCase();
    if (origin !== 'null' && origin !== line && originSchema.safeParse(origin).success) suggestion = origin;
  } catch {
    // Nothing to suggest.
  }
  return { ok: false, message: parsed.error.issues[0]?.message ?? 'Not an origin', suggestion };
}

export function checkEmail(line: string): string | null {
  const parsed = emailSchema.safeParse(line);
  return parsed.success ? null : (parsed.error.issues[0]?.message ?? 'Enter a valid e-mail address');
}

const MAX_SITES = 20;
const MAX_NOTIFY = 10;

/**
 * The checks made before saving: the contracts' own schema (contrast, origins, addresses, lengths),
 * plus what it cannot see in the draft (unreadable numbers, the input ranges in the widget's
 * units, a live widget with no site). Keys are body paths without `body.`, as the server names them.
 */
export function validateDraft(
  draft: WidgetDraft,
  calc: CalculatorDefinition,
): { body: UpdateWidgetBody; errors: null } | { body: null; errors: FieldErrors } {
  const errors: FieldErrors = {};
  const add = (key: string, message: string) => {
    errors[key] ??= message;
  };
  const raw = draftBody(draft);
  const system = draft.settings.units.system;

  for (const input of calc.inputs) {
    if (input.kind === 'choice') continue;
    const key = `settings.inputs.${input.id}.default`;
    const text = draft.defaultTexts[input.id] ?? '';
    if (input.kind === 'table') {
      const read = readTableText(input, text, system);
      if (read.rows === null) add(key, read.issues.map((i) => i.message).join('; '));
      continue;
    }
    const parsed = parseNumber(text);
    const unit = displayUnitOf(input, system);
    if (Number.isNaN(parsed)) {
      add(key, `Enter a number in ${unitSymbol(unit) || 'plain figures'}`);
      continue;
    }
    const value = draft.settings.inputs[input.id]?.default;
    if (typeof value !== 'number') continue;
    // A hair of slack: a bound typed exactly in other units may convert a rounding step past it.
    const slack = 1e-9 * Math.max(Math.abs(input.min), Math.abs(input.max), 1e-12);
    if (value < input.min - slack || value > input.max + slack) {
      const low = formatNumber(fromCanonical(input.min, unit));
      const high = formatNumber(fromCanonical(input.max, unit));
      add(key, `Between ${low} and ${withUnit(high, unit)}`);
    }
  }

  raw.allowedOrigins.forEach((line, i) => {
    const check = checkSite(line);
    if (!check.ok) add(`allowedOrigins.${i}`, check.message);
  });
  if (raw.allowedOrigins.length > MAX_SITES) add('allowedOrigins', `At most ${MAX_SITES} sites`);
  if (draft.status === 'live' && raw.allowedOrigins.length === 0) {
    add('allowedOrigins', 'A widget in service needs at least one site allowed to embed it');
  }
  raw.settings.leadForm.notify.forEach((line, i) => {
    const problem = checkEmail(line);
    if (problem) add(`settings.leadForm.notify.${i}`, problem);
  });
  if (raw.settings.leadForm.notify.length > MAX_NOTIFY)
    add('settings.leadForm.notify', `At most ${MAX_NOTIFY} recipients`);

  // Said before the schema's own (same) message, so the ratio reads exactly as beside the colours,
  // and whether or not the schema got as far as comparing them.
  const colors = draft.settings.look.colors;
  for (const pair of colorPairs) {
    const ratio = pairRatio(colors, pair);
    if (ratio !== null && ratio < WCAG_AA_TEXT) {
      add(
        `settings.look.colors.${pair.fg}`,
        `Contrast between ${pair.label} is ${formatRatio(ratio)}; WCAG AA needs at least ${WCAG_AA_TEXT}:1`,
      );
    }
  }
  const parsed = updateWidgetBodySchema.safeParse(raw);
  if (!parsed.success) {
    for (const issue of parsed.error.issues) add(issue.path.map(String).join('.') || '_form', issue.message);
  }
  if (Object.keys(errors).length > 0 || !parsed.success) return { body: null, errors };
  return { body: parsed.data, errors: null };
}

/** The server's `details.fields`, keyed like `validateDraft`'s errors (`body.` taken off). */
export function serverFieldErrors(fields: readonly { field: string; message: string }[]): FieldErrors {
  const errors: FieldErrors = {};
  for (const f of fields) errors[f.field.replace(/^body\./, '')] ??= f.message;
  return errors;
}

/** The errors under one key or its list items (`allowedOrigins`, `allowedOrigins.2`, …). */
export function errorsUnder(errors: FieldErrors, key: string): [string, string][] {
  return Object.entries(errors).filter(([k]) => k === key || k.startsWith(`${key}.`));
}
