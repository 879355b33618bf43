import type { FieldIssue } from '../errors.js';
import { withUnit } from '../display.js';
import { formatValue } from '../format.js';
import { canonicalUnits, fromCanonical, type UnitId } from '../units.js';
import type { TableColumn, TableInput } from './types.js';

// A table input's rows checked (`tableIssues`): what the engine runs, apart from table.ts's reading
// and showing of rows, which only the widget's table editor, the server and the dashboard use, so
// that the engine of a calculator with a table does not carry them. table.ts re-exports all of it.

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

/** The row (and column) a problem is in, as `wording` names rows. */
export function where(
  input: TableInput,
  i: number,
  column: TableColumn | undefined,
  wording: TableWording,
): string {
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
