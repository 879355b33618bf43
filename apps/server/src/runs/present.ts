import {
  displayUnitOf,
  fromCanonicalTo,
  getCalculator,
  showTable,
  tableSummary,
  units,
  withUnit,
  type InputDefinition,
  type OutputDefinition,
  type TableRow,
  type UnitSystemId,
} from '@wickstone/calc-core';
import type { ShownValue, WidgetSettings } from '@wickstone/contracts';
import { formatResult } from '@wickstone/calc-core/answer';
import { formatValue as formatNumber } from '@wickstone/calc-core/format';

/** An input as stored: a number, a choice value, or a table's rows. */
export type SentValue = number | string | readonly unknown[];

/**
 * How one input or output is printed in one unit system, worked out once (its display unit, the
 * conversion into it, the symbol and its spacing) and then applied to any number of runs: the runs
 * table, the run's page and the CSV export all print through here, one value at a time.
 */
export interface ValuePrinter {
  id: string;
  label: string;
  /** The value, its unit and its text, for the runs table and a run's page. */
  shown(raw: SentValue): ShownValue;
  /** Only the text (`1.2 mm`, `35°`, `Water`, a table's summary), for an export cell. */
  text(raw: SentValue): string;
}

/** The printer of a definition: the definition's own unit for the system, else the system's unit for its kind. */
export function valuePrinter(
  def: InputDefinition | OutputDefinition,
  system: UnitSystemId,
  /** How a figure is written on screen: results as the widget writes them (3 s.f.), inputs in full. */
  figure: (n: number) => string = formatNumber,
): ValuePrinter {
  const base = { id: def.id, label: def.label };
  const rows = (raw: readonly unknown[]) => `${raw.length} rows`;
  if (def.kind === 'table') {
    const text = (raw: SentValue) =>
      Array.isArray(raw) ? tableSummary(def, raw as TableRow[], system) : String(raw);
    return {
      ...base,
      text,
      shown: (raw) => {
        if (!Array.isArray(raw)) return { ...base, value: null, unit: null, text: String(raw) };
        const t = showTable(def, raw as TableRow[], system);
        return {
          ...base,
          value: null,
          unit: null,
          text: text(raw),
          table: { columns: [...t.columns], rows: t.rows.map((r) => [...r]) },
        };
      },
    };
  }
  if (def.kind === 'choice') {
    const labels = new Map<unknown, string>(def.options.map((o) => [o.value, o.label]));
    const text = (raw: SentValue) => (typeof raw === 'object' ? rows(raw) : (labels.get(raw) ?? String(raw)));
    return {
      ...base,
      text,
      shown: (raw) => ({ ...base, value: typeof raw === 'object' ? null : raw, unit: null, text: text(raw) }),
    };
  }
  const unit = displayUnitOf(def, system);
  const toShown = fromCanonicalTo(unit);
  const symbol = units[unit].symbol || null;
  const suffix = withUnit('', unit);
  const text = (raw: SentValue) =>
    typeof raw === 'number' ? formatNumber(toShown(raw)) + suffix : typeof raw === 'object' ? rows(raw) : raw;
  return {
    ...base,
    // The export keeps every figure's digits; the screens write them as the visitor saw them.
    text,
    shown: (raw) =>
      typeof raw === 'number'
        ? { ...base, value: toShown(raw), unit: symbol, text: figure(toShown(raw)) + suffix }
        : { ...base, value: typeof raw === 'object' ? null : raw, unit: null, text: text(raw) },
  };
}

/** A stored value of a calculator this server no longer has: its id and number as they are. */
function plainPrinter(id: string): ValuePrinter {
  const text = (v: SentValue) =>
    typeof v === 'number' ? formatNumber(v) : typeof v === 'object' ? `${v.length} rows` : v;
  return {
    id,
    label: id,
    text,
    shown: (v) => ({ id, label: id, value: typeof v === 'object' ? null : v, unit: null, text: text(v) }),
  };
}

/**
 * What of a widget's runs is printed, in the calculator's order and one unit system: the key inputs
 * (those the visitor could set: not locked or hidden by the firm) and the outputs. `inputs(sent)`
 * and `outputs(values)` pick the printers of the values a run has. Made once per widget and
 * system, it serves every run of that widget.
 */
export interface RunPrinter {
  title: string;
  inputs(sent: Record<string, SentValue>): [ValuePrinter, SentValue][];
  outputs(values: Record<string, number | null>): [ValuePrinter, number][];
}

export function runPrinter(
  calculatorId: string,
  settings: Pick<WidgetSettings, 'inputs'>,
  system: UnitSystemId,
): RunPrinter {
  const calc = getCalculator(calculatorId);
  if (!calc) {
    const plain = new Map<string, ValuePrinter>();
    const of = (id: string) => plain.get(id) ?? plain.set(id, plainPrinter(id)).get(id)!;
    return {
      title: calculatorId,
      inputs: (sent) => Object.entries(sent).map(([id, v]) => [of(id), v]),
      outputs: (values) => Object.entries(values).flatMap(([id, v]) => (v === null ? [] : [[of(id), v]])),
    };
  }
  const editable = (id: string) => (settings.inputs[id]?.mode ?? 'editable') === 'editable';
  const inputs = calc.inputs.filter((i) => editable(i.id)).map((i) => valuePrinter(i, system));
  const outputs = calc.outputs.map((o) => valuePrinter(o, system, formatResult));
  return {
    title: calc.title,
    inputs: (sent) => {
      const out: [ValuePrinter, SentValue][] = [];
      for (const p of inputs) {
        const v = sent[p.id];
        if (v !== undefined) out.push([p, v]);
      }
      return out;
    },
    outputs: (values) => {
      const out: [ValuePrinter, number][] = [];
      for (const p of outputs) {
        const v = values[p.id];
        if (typeof v === 'number') out.push([p, v]);
      }
      return out;
    },
  };
}

/** What the runs table shows of one run's inputs and outputs. */
export interface ShownRun {
  title: string;
  inputs: ShownValue[];
  outputs: ShownValue[];
}

/**
 * The key inputs (those the visitor could set: not locked or hidden by the firm, and sent) and the
 * outputs the visitor saw, in the calculator's order and the unit system the visitor saw. A calculator
 * this server no longer has shows its stored numbers as they are.
 */
export function showRun(
  calculatorId: string,
  settings: Pick<WidgetSettings, 'inputs'>,
  sent: Record<string, SentValue>,
  outputs: Record<string, number | null>,
  system: UnitSystemId,
): ShownRun {
  const p = runPrinter(calculatorId, settings, system);
  return {
    title: p.title,
    inputs: p.inputs(sent).map(([v, raw]) => v.shown(raw)),
    outputs: p.outputs(outputs).map(([v, raw]) => v.shown(raw)),
  };
}

/** One export cell of a run's inputs or outputs: `Label: text`, separated by `; `. */
export function valuesCell(values: readonly [ValuePrinter, SentValue][]): string {
  let cell = '';
  for (const [p, raw] of values) cell += `${cell ? '; ' : ''}${p.label}: ${p.text(raw)}`;
  return cell;
}
