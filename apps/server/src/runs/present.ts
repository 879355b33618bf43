import {
  displayUnitOf,
  fromCanonical,
  getCalculator,
  units,
  withUnit,
  type CalculatorDefinition,
  type InputDefinition,
  type OutputDefinition,
  type UnitSystemId,
} from '@wickstone/calc-core';
import type { ShownValue, WidgetSettings } from '@wickstone/contracts';
import { formatValue as formatNumber } from '@wickstone/calc-core/format';

/** A value in the unit the widget shows it in: the definition's own choice for the system, else the system's unit for its kind. */
function shown(
  def: InputDefinition | OutputDefinition,
  raw: number | string,
  system: UnitSystemId,
): ShownValue {
  const base = { id: def.id, label: def.label };
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
 * outputs the visitor saw, in the calculator's order and the unit system the visitor saw. A calculator
 * this server no longer has shows its stored numbers as they are.
 */
export function showRun(
  calculatorId: string,
  settings: Pick<WidgetSettings, 'inputs'>,
  sent: Record<string, number | string>,
  outputs: Record<string, number | null>,
  system: UnitSystemId,
): ShownRun {
  const calc: CalculatorDefinition | undefined = getCalculator(calculatorId);
  if (!calc) {
    const plain = (id: string, v: number | string): ShownValue => ({
      id,
      label: id,
      value: v,
      unit: null,
      text: typeof v === 'number' ? formatNumber(v) : v,
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
