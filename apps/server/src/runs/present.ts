import {
  displayUnitOf,
  fromCanonical,
  getCalculator,
  showTable,
  tableSummary,
  units,
  withUnit,
  type CalculatorDefinition,
  type InputDefinition,
  type OutputDefinition,
  type TableRow,
  type UnitSystemId,
} from '@wickstone/calc-core';
import type { ShownValue, WidgetSettings } from '@wickstone/contracts';
import { formatValue as formatNumber } from '@wickstone/calc-core/format';

/** An input as stored: a number, a choice value, or a table's rows. */
type SentValue = number | string | readonly unknown[];

/** A value in the unit the widget shows it in: the definition's own choice for the system, else the system's unit for its kind. */
function shown(def: InputDefinition | OutputDefinition, raw: SentValue, system: UnitSystemId): ShownValue {
  const base = { id: def.id, label: def.label };
  if (def.kind === 'table') {
    if (!Array.isArray(raw)) return { ...base, value: null, unit: null, text: String(raw) };
    const t = showTable(def, raw as TableRow[], system);
    return {
      ...base,
      value: null,
      unit: null,
      text: tableSummary(def, raw as TableRow[], system),
      table: { columns: [...t.columns], rows: t.rows.map((r) => [...r]) },
    };
  }
  if (typeof raw === 'object') return { ...base, value: null, unit: null, text: `${raw.length} rows` };
  if (def.kind === 'choice') {
    const option = def.options.find((o) => o.value === raw);
    return { ...base, value: raw, unit: null, text: option?.label ?? String(raw) };
  }
  if (typeof raw !== 'number') return { ...base, value: raw, unit: null, text: String(raw) };
  const unit = displayUnitOf(def, system);
  const value = fromCanonical(raw, unit);
  return { ...base, value, unit: units[unit].symbol || null, text: withUnit(formatNumber(value), unit) };
}

/** What the runs table shows of one run's inputs and outputs. */
export interface ShownRun {
  title: string;
  inputs: ShownValue[];
  outputs: ShownValue[];
}

/**
 * The key inputs (those the visitor could set: not locked or hidden by the firm, and sent) and the
 * outputs the visitor saw, in the calculator's order and the widget's unit system. A calculator
 * this server no longer has shows its stored numbers as they are.
 */
export function showRun(
  calculatorId: string,
  settings: Pick<WidgetSettings, 'inputs'>,
  sent: Record<string, SentValue>,
  outputs: Record<string, number | null>,
  system: UnitSystemId,
): ShownRun {
  const calc: CalculatorDefinition | undefined = getCalculator(calculatorId);
  if (!calc) {
    const plain = (id: string, v: SentValue): ShownValue => ({
      id,
      label: id,
      value: typeof v === 'object' ? null : v,
      unit: null,
      text: typeof v === 'number' ? formatNumber(v) : typeof v === 'object' ? `${v.length} rows` : v,
    });
    return {
      title: calculatorId,
      inputs: Object.entries(sent).map(([id, v]) => plain(id, v)),
      outputs: Object.entries(outputs).flatMap(([id, v]) => (v === null ? [] : [plain(id, v)])),
    };
  }
  const editable = (id: string) => (settings.inputs[id]?.mode ?? 'editable') === 'editable';
  return {
    title: calc.title,
    inputs: calc.inputs.flatMap((i) => {
      const v = sent[i.id];
      return v === undefined || !editable(i.id) ? [] : [shown(i, v, system)];
    }),
    outputs: calc.outputs.flatMap((o) => {
      const v = outputs[o.id];
      return typeof v === 'number' ? [shown(o, v, system)] : [];
    }),
  };
}
