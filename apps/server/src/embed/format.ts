import { formatResult } from '@wickstone/calc-core/answer';
import { formatValue as formatNumber } from '@wickstone/calc-core/format';
import {
  displayUnitOf,
  fromCanonical,
  showTable,
  withUnit,
  type CalculationResult,
  type CalculatorDefinition,
  type Displayable,
  type UnitSystemId,
} from '@wickstone/calc-core';

/**
 * A canonical value in the unit the widget shows it in, written as the widget writes it (3
 * significant figures, no powers of ten: calc-core's `formatResult`), its symbol spaced as everywhere
 * else: the sheet and the e-mails print the figure the visitor saw.
 */
export function shown(value: number, item: Displayable, system: UnitSystemId): string {
  const unit = displayUnitOf(item, system);
  return withUnit(formatResult(fromCanonical(value, unit)), unit);
}

/**
 * The result as plain lines, in the widget's unit system, for the copy e-mailed to a visitor and
 * the firm's notification: inputs, outputs, band, warnings and the working in canonical units.
 */
export function resultLines(
  calc: CalculatorDefinition,
  result: CalculationResult,
  system: UnitSystemId,
  /** `hide`: inputs left out (the firm hid them from visitors); `codes: false`: warnings without their codes. */
  options: { hide?: ReadonlySet<string>; codes?: boolean } = {},
): string[] {
  const codes = options.codes ?? true;
  const lines: string[] = [`${calc.title}`, '', 'Inputs'];
  for (const input of calc.inputs) {
    const v = result.inputs[input.id];
    if (v === undefined || options.hide?.has(input.id)) continue;
    if (input.kind === 'choice') {
      lines.push(`  ${input.label}: ${input.options.find((o) => o.value === v)?.label ?? String(v)}`);
    } else if (input.kind === 'table') {
      if (!Array.isArray(v)) continue;
      const t = showTable(input, v, system);
      lines.push(`  ${input.label} (${t.columns.map((c) => `${c.label}, ${c.unit}`).join(' | ')}):`);
      for (const row of t.text) lines.push(`    ${row.join(' | ')}`);
    } else if (typeof v === 'number') {
      lines.push(`  ${input.label}: ${shown(v, input, system)}`);
    }
  }
  lines.push('', 'Result');
  for (const out of calc.outputs) {
    const v = result.outputs[out.id];
    // A withheld output is named with the reason, never given a figure.
    const withheldBy = result.warnings.find((w) => (w.withholds ?? []).includes(out.id));
    if (v === null && withheldBy) {
      lines.push(`  ${out.label}: not defined here (${codes ? withheldBy.code : withheldBy.message})`);
      continue;
    }
    if (v === undefined || v === null) continue;
    const band = result.band?.outputs[out.id];
    const range = band ? ` (band ${shown(band.low, out, system)} to ${shown(band.high, out, system)})` : '';
    lines.push(`  ${out.label}: ${shown(v, out, system)}${range}`);
  }
  if (result.warnings.length) {
    lines.push('', 'Validity warnings');
    for (const w of result.warnings) lines.push(codes ? `  [${w.code}] ${w.message}` : `  - ${w.message}`);
  }
  if (result.assumptions.length) {
    lines.push('', 'Assumptions');
    for (const a of result.assumptions) lines.push(`  - ${a}`);
  }
  lines.push('', 'Working');
  for (const step of result.working) {
    lines.push(
      `  ${step.label}: ${step.formula}`,
      `    = ${step.substituted}`,
      `    = ${withUnit(formatNumber(step.value), step.unit)}`,
      ...(step.source ? [`    (${step.source})`] : []),
    );
  }
  return lines;
}
