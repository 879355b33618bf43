import { formatValue as formatNumber } from '@wickstone/calc-core/format';
import {
  displayUnit,
  fromCanonical,
  units,
  type CalculationResult,
  type CalculatorDefinition,
  type UnitId,
  type UnitSystemId,
} from '@wickstone/calc-core';

function shown(
  value: number,
  kind: Parameters<typeof displayUnit>[0],
  system: UnitSystemId,
  override?: Partial<Record<UnitSystemId, UnitId>>,
) {
  const unit = override?.[system] ?? displayUnit(kind, system);
  const symbol = units[unit].symbol;
  return `${formatNumber(fromCanonical(value, unit))}${symbol ? ` ${symbol}` : ''}`;
}

/**
 * The result as plain lines, in the widget's unit system, for the copy e-mailed to a visitor and
 * the firm's notification: inputs, outputs, band, warnings and the working in canonical units.
 */
export function resultLines(
  calc: CalculatorDefinition,
  result: CalculationResult,
  system: UnitSystemId,
): string[] {
  const lines: string[] = [`${calc.title}`, '', 'Inputs'];
  for (const input of calc.inputs) {
    const v = result.inputs[input.id];
    if (v === undefined) continue;
    if (input.kind === 'choice') {
      lines.push(`  ${input.label}: ${input.options.find((o) => o.value === v)?.label ?? String(v)}`);
    } else if (typeof v === 'number') {
      lines.push(`  ${input.label}: ${shown(v, input.kind, system, input.display)}`);
    }
  }
  lines.push('', 'Result');
  for (const out of calc.outputs) {
    const v = result.outputs[out.id];
    // A withheld output is named with the reason, never given a figure.
    const withheldBy = result.warnings.find((w) => (w.withholds ?? []).includes(out.id));
    if (v === null && withheldBy) {
      lines.push(`  ${out.label}: not defined here (${withheldBy.code})`);
      continue;
    }
    if (v === undefined || v === null) continue;
    const band = result.band?.outputs[out.id];
    const range = band
      ? ` (band ${shown(band.low, out.kind, system, out.display)} to ${shown(band.high, out.kind, system, out.display)})`
      : '';
    lines.push(`  ${out.label}: ${shown(v, out.kind, system, out.display)}${range}`);
  }
  if (result.warnings.length) {
    lines.push('', 'Validity warnings');
    for (const w of result.warnings) lines.push(`  [${w.code}] ${w.message}`);
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
      `    = ${formatNumber(step.value)} ${units[step.unit].symbol}`,
      ...(step.source ? [`    (${step.source})`] : []),
    );
  }
  return lines;
}
