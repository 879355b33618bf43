import type { FieldIssue } from '../errors.js';
import { displayUnitOf, unitSymbol, withUnit } from '../display.js';
import { formatValue } from '../format.js';
import { canonicalUnits, fromCanonical, toCanonical, type UnitId, type UnitSystemId } from '../units.js';
import type { InputValues, TableColumn, TableInput, TableRow } from './types.js';

// A table input's rows, checked once here for the engine, the server (through the engine) and the
// widget's paste and file reading: every problem names its row (counted from 1, as a person reads
// a sheet) and its column, and its field is the JSON path `<input>.<row index>.<column>`.

function isPlainObject(value: unknown): value is Readonly<Record<string, unknown>> {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) return false;
  const proto: unknown = Object.getPrototypeOf(value);
  return proto === Object.prototype || proto === null;
}

/** Where a problem in a table sits: `readings`, `readings.2` or `readings.2.mass`. */
export function tableField(inputId: string, rowIndex?: number, columnId?: string): string {
  if (rowIndex === undefined) return inputId;
  return columnId === undefined ? `${inputId}.${rowIndex}` : `${inputId}.${rowIndex}.${columnId}`;
}

/** Reads a table field path back: the input id, and the row index and column where it names them. */
export function parseTableField(field: string): { input: string; row?: number; column?: string } {
  const [input = '', row, column] = field.split('.');
  const index = row !== undefined && /^\d+$/.test(row) ? Number(row) : undefined;
  return {
    input,
    ...(index !== undefined ? { row: index } : {}),
    ...(column !== undefined ? { column } : {}),
  };
}

/** `Readings, row 3, mass` — how a person finds the cell. */
export function cellName(input: Pick<TableInput, 'label'>, rowIndex: number, column?: TableColumn): string {
  return `${input.label}, row ${rowIndex + 1}${column ? `, ${column.label.toLowerCase()}` : ''}`;
}

/** How problems are worded: the unit of each column (canonical by default) and the name of a row. */
export interface TableWording {
  /** Display unit per column id; values in messages are stated in it. */
  readonly units?: Readonly<Record<string, UnitId>>;
  /** `Readings, row 3` by default; a file reader may say `Line 4 of the file (row 3)`. */
  readonly rowName?: (rowIndex: number) => string;
}

function shownIn(column: TableColumn, value: number, wording: TableWording): string {
  const unit = wording.units?.[column.id] ?? canonicalUnits[column.kind];
  return withUnit(formatValue(fromCanonical(value, unit), 6), unit);
}

function where(input: TableInput, i: number, column: TableColumn | undefined, wording: TableWording): string {
  if (wording.rowName === undefined) return cellName(input, i, column);
  return `${wording.rowName(i)}${column ? `, ${column.label.toLowerCase()}` : ''}`;
}

/**
 * Every problem with a table's raw value, in row order; no problem means `value` is the rows.
 * @param value what was sent: an array of `{ <column id>: number }` objects, canonical units
 */
export function tableIssues(input: TableInput, value: unknown, wording: TableWording = {}): FieldIssue[] {
  const issues: FieldIssue[] = [];
  const issue = (field: string, code: string, message: string): void => {
    issues.push({ field, code, message });
  };
  if (!Array.isArray(value)) {
    issue(input.id, 'NOT_A_TABLE', `${input.label} must be a list of rows`);
    return issues;
  }
  const rows = value as readonly unknown[];
  if (rows.length < input.minRows) {
    issue(
      input.id,
      'TOO_FEW_ROWS',
      `${input.label} needs at least ${input.minRows} rows; ${rows.length === 1 ? 'there is 1' : `there are ${rows.length}`}`,
    );
  }
  if (rows.length > input.maxRows) {
    issue(
      input.id,
      'TOO_MANY_ROWS',
      `${input.label} takes at most ${input.maxRows} rows; there are ${rows.length}`,
    );
    return issues;
  }
  const known = new Set(input.columns.map((c) => c.id));
  const previous = new Map<string, number>();
  rows.forEach((row, i) => {
    if (!isPlainObject(row)) {
      issue(
        tableField(input.id, i),
        'ROW_NOT_AN_OBJECT',
        `${cellName(input, i)} must have a value in each column`,
      );
      return;
    }
    for (const key of Object.keys(row)) {
      if (!known.has(key))
        issue(
          tableField(input.id, i, key),
          'UNKNOWN_COLUMN',
          `${where(input, i, undefined, wording)} has no column "${key}"`,
        );
    }
    for (const column of input.columns) {
      const field = tableField(input.id, i, column.id);
      const v = row[column.id];
      const cell = where(input, i, column, wording);
      const shown = (x: number): string => shownIn(column, x, wording);
      if (v === undefined || v === null) issue(field, 'REQUIRED', `${cell}: needs a value`);
      else if (typeof v !== 'number' || Number.isNaN(v))
        issue(field, 'NOT_A_NUMBER', `${cell}: must be a number`);
      else if (!Number.isFinite(v)) issue(field, 'NOT_FINITE', `${cell}: must be finite`);
      else if (v < column.min || v > column.max) {
        issue(
          field,
          v > column.max ? 'ABOVE_MAX' : 'BELOW_MIN',
          `${cell}: must be from ${shown(column.min)} to ${shown(column.max)}`,
        );
      } else {
        const before = previous.get(column.id);
        if (column.increasing === true && before !== undefined && !(v > before)) {
          issue(
            field,
            'NOT_INCREASING',
            `${cell}: must be later than the row above (${shown(before)}); rows go in time order`,
          );
        }
        previous.set(column.id, v);
      }
    }
  });
  return issues;
}

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
