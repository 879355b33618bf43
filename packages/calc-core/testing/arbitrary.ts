import fc from 'fast-check';
import type {
  CalculatorDefinition,
  InputDefinition,
  TableInput,
  TableRow,
} from '../src/calculators/types.js';

// Test-only: inputs a form could send, shared by the contract and validity sweeps.

/**
 * Rows a form could send: within every column's range, increasing columns in order (cumulative
 * steps from the column's minimum), between the table's least rows and a dozen more.
 */
export function arbitraryTable(input: TableInput): fc.Arbitrary<TableRow[]> {
  const row = fc.record(
    Object.fromEntries(
      input.columns.map((c) => [
        c.id,
        c.increasing === true
          ? fc.double({ min: 1e-3, max: (c.max - c.min) / (input.minRows + 12), noNaN: true })
          : fc.double({ min: c.min, max: c.max, noNaN: true }),
      ]),
    ),
  );
  return fc.array(row, { minLength: input.minRows, maxLength: input.minRows + 12 }).map((rows) => {
    const sums = new Map<string, number>();
    return rows.map((r, i) =>
      Object.fromEntries(
        input.columns.map((c) => {
          if (c.increasing !== true) return [c.id, r[c.id] as number];
          const next = i === 0 ? c.min : (sums.get(c.id) ?? c.min) + (r[c.id] as number);
          sums.set(c.id, next);
          return [c.id, next];
        }),
      ),
    );
  });
}

/** Every choice from its options, every number over `number`'s arbitrary, every table from `arbitraryTable`. */
export function arbitraryInputs(
  def: CalculatorDefinition,
  number: (input: Exclude<InputDefinition, { kind: 'choice' | 'table' }>) => fc.Arbitrary<number>,
): fc.Arbitrary<Record<string, number | string | TableRow[]>> {
  const fields: Record<string, fc.Arbitrary<number | string | TableRow[]>> = {};
  for (const input of def.inputs) {
    if (input.kind === 'choice') fields[input.id] = fc.constantFrom(...input.options.map((o) => o.value));
    else if (input.kind === 'table') fields[input.id] = arbitraryTable(input);
    else fields[input.id] = number(input);
  }
  return fc.record(fields);
}

/** Every choice from its options, every number over its whole range (log-uniform where it spans decades). */
export function anyInputs(
  def: CalculatorDefinition,
): fc.Arbitrary<Record<string, number | string | TableRow[]>> {
  return arbitraryInputs(def, (input) => {
    if (input.min > 0 && input.max / input.min > 100) {
      const lo = Math.log(input.min);
      const hi = Math.log(input.max);
      return fc
        .double({ min: 0, max: 1, noNaN: true })
        .map((u) => Math.min(input.max, Math.max(input.min, Math.exp(lo + u * (hi - lo)))));
    }
    return fc.double({ min: input.min, max: input.max, noNaN: true });
  });
}
