import type { FieldIssue } from '../errors.js';
import { displayUnitOf, unitSymbol } from '../display.js';
import { formatValue } from '../format.js';
import { fromCanonical, toCanonical, type UnitId, type UnitSystemId } from '../units.js';
import type { InputValues, TableInput, TableRow } from './types.js';

// A table input's rows, checked once here for the engine, the server (through the engine) and the
// widget's paste and file reading: every problem names its row (counted from 1, as a person reads
// a sheet) and its column, and its field is the JSON path `<input>.<row index>.<column>`.

export { cellName, parseTableField, tableField, tableIssues, type TableWording } from './table-issues.js';
import { tableField, tableIssues, where, type TableWording } from './table-issues.js';

/** The rows of a table that passed `tableIssues`, copied to plain objects in column order. */
export function tableRows(
  input: TableInput,
  value: readonly Readonly<Record<string, unknown>>[],
): TableRow[] {
  return value.map((row) => Object.fromEntries(input.columns.map((c) => [c.id, row[c.id] as number])));
}

/** A table as a person reads it: each column's label and unit symbol, and every cell in that unit. */
export interface ShownTable {
  readonly columns: readonly { readonly id: string; readonly label: string; readonly unit: string }[];
  /** Cells in the column's display unit, rows in order. */
  readonly rows: readonly (readonly number[])[];
  /** The same cells formatted (`formatValue`), for text and sheets. */
  readonly text: readonly (readonly string[])[];
}

/**
 * A table input's rows in the units a unit system shows them in: the one rule the widget, the
 * e-mail, the sheet and the dashboard's run page follow.
 */
export function showTable(input: TableInput, rows: readonly TableRow[], system: UnitSystemId): ShownTable {
  const unitsOf = input.columns.map((c) => displayUnitOf(c, system));
  const values = rows.map((row) =>
    input.columns.map((c, j) => fromCanonical(row[c.id] ?? Number.NaN, unitsOf[j] as UnitId)),
  );
  return {
    columns: input.columns.map((c, j) => ({
      id: c.id,
      label: c.label,
      unit: unitSymbol(unitsOf[j] as UnitId),
    })),
    rows: values,
    text: values.map((r) => r.map((v) => formatValue(v, 6))),
  };
}

/** One line for a table: `8 rows of time (min), mass (g)`. */
export function tableSummary(input: TableInput, rows: readonly TableRow[], system: UnitSystemId): string {
  const cols = input.columns.map((c) => `${c.label.toLowerCase()} (${unitSymbol(displayUnitOf(c, system))})`);
  return `${rows.length} ${rows.length === 1 ? 'row' : 'rows'} of ${cols.join(', ')}`;
}

/**
 * Rows typed, pasted or read from a file, as text cells in the table's column order and in the
 * given units, turned into canonical rows; every problem is named by row and column, and no rows
 * come back unless every cell is good (nothing half-applied).
 * @param cells one array of cell texts per row (a header row already taken off)
 * @param parse the number reader (`parseNumber`): null for an empty cell, NaN for unreadable text
 */
export function rowsFromCells(
  input: TableInput,
  cells: readonly (readonly string[])[],
  parse: (text: string) => number | null,
  wording: TableWording = {},
): { rows: TableRow[]; issues: [] } | { rows: null; issues: FieldIssue[] } {
  const issues: FieldIssue[] = [];
  const raw = cells.map((row, i) => {
    if (row.length > input.columns.length && row.slice(input.columns.length).some((c) => c.trim() !== '')) {
      issues.push({
        field: tableField(input.id, i),
        code: 'TOO_MANY_CELLS',
        message: `${where(input, i, undefined, wording)} has ${row.length} cells; the table has ${input.columns.length} columns (${input.columns.map((c) => c.label.toLowerCase()).join(', ')})`,
      });
    }
    return Object.fromEntries(
      input.columns.map((c, j) => {
        const n = parse(row[j] ?? '');
        const unit = wording.units?.[c.id];
        return [c.id, n === null ? null : unit === undefined || Number.isNaN(n) ? n : toCanonical(n, unit)];
      }),
    );
  });
  issues.push(...tableIssues(input, raw, wording));
  return issues.length > 0 ? { rows: null, issues } : { rows: tableRows(input, raw), issues: [] };
}

/** Resolved inputs as plain, mutable JSON (table rows copied): what a run report and a stored run carry. */
export function plainInputs(inputs: InputValues): Record<string, number | string | Record<string, number>[]> {
  return Object.fromEntries(
    Object.entries(inputs).map(([k, v]) => [k, typeof v === 'object' ? v.map((r) => ({ ...r })) : v]),
  );
}
