import { dsvFormat } from 'd3-dsv';
import {
  getUnit,
  type FieldIssue,
  type TableInput,
  type TableRow,
  type UnitId,
  type UnitSystemId,
} from '@wickstone/calc-core';
import { displayUnitOf } from '@wickstone/calc-core/display';
import { parseNumber } from '@wickstone/calc-core/format';
import { rowsFromCells } from '@wickstone/calc-core/table';

// Reading a table from a file (a CSV with a header row) or from cells pasted out of a spreadsheet.
// Everything is read and checked before anything is applied: a file with one bad cell changes
// nothing, and the message names its line and column.

/** The largest file taken, in bytes (a 200-row table is a few kilobytes). */
export const MAX_FILE_BYTES = 256 * 1024;

export type ReadResult = { rows: TableRow[]; issues: [] } | { rows: null; issues: FieldIssue[] };

const fail = (field: string, code: string, message: string): ReadResult => ({
  rows: null,
  issues: [{ field, code, message }],
});

/** `;` when a first line has semicolons and no commas (sheets saved where the comma is the decimal mark), a tab for pasted cells, else `,`. */
export function delimiterOf(firstLine: string): string {
  if (firstLine.includes('\t')) return '\t';
  if (firstLine.includes(';') && !firstLine.includes(',')) return ';';
  if (firstLine.includes(';')) return ';';
  return ',';
}

/** A header cell read as a column and, when it names one, a unit: `time (min)`, `mass [g]`, `Mass_g`. */
function headerCell(text: string): { name: string; unit: string | null } {
  const t = text.trim();
  const bracket = /^(.*?)\s*[([]\s*([^)\]]+?)\s*[)\]]\s*$/.exec(t);
  if (bracket) return { name: (bracket[1] ?? '').trim().toLowerCase(), unit: (bracket[2] ?? '').trim() };
  const under = /^([A-Za-z]+)[_ ]([A-Za-zµ°/²0-9.^*]+)$/.exec(t);
  if (under) return { name: (under[1] ?? '').toLowerCase(), unit: under[2] ?? null };
  return { name: t.toLowerCase(), unit: null };
}

/**
 * A file's text as the table's rows: BOM taken off, the separator found from the header, the header
 * matched to the columns by id or label (a unit in brackets is used, else the widget's display unit),
 * every cell read and checked, problems named by the file's line and the column.
 */
export function readCsv(text: string, input: TableInput, system: UnitSystemId): ReadResult {
  const body = text.replace(/^\uFEFF/, '').replace(/\r\n?/g, '\n');
  const lines = body.split('\n');
  const first = lines[0] ?? '';
  if (first.trim() === '')
    return fail(input.id, 'NO_HEADER', 'Line 1 of the file: expected a header row naming the columns');
  const delimiter = delimiterOf(first);
  const all = dsvFormat(delimiter).parseRows(body);
  const header = all[0] ?? [];
  const expected = input.columns.map((c) => c.label.toLowerCase()).join(', ');
  const order: number[] = [];
  const units: Record<string, UnitId> = {};
  for (const column of input.columns) {
    const j = header.findIndex((h) => {
      const { name } = headerCell(h);
      return name === column.id.toLowerCase() || name === column.label.toLowerCase();
    });
    if (j < 0) {
      return fail(
        input.id,
        'WRONG_COLUMNS',
        `Line 1 of the file: no "${column.label.toLowerCase()}" column; expected ${expected}, found ${header.map((h) => `"${h.trim()}"`).join(', ') || 'nothing'}`,
      );
    }
    order.push(j);
    const unitText = headerCell(header[j] ?? '').unit;
    let unit: UnitId = displayUnitOf(column, system);
    if (unitText !== null) {
      try {
        const u = getUnit(unitText);
        if (u.kind !== column.kind) throw new Error('kind');
        unit = u.id;
      } catch {
        return fail(
          input.id,
          'UNKNOWN_UNIT',
          `Line 1 of the file, ${column.label.toLowerCase()}: "${unitText}" is not a unit of ${column.label.toLowerCase()} here`,
        );
      }
    }
    units[column.id] = unit;
  }
  const extra = header.filter((_, j) => !order.includes(j) && header[j]?.trim() !== '');
  if (extra.length > 0) {
    return fail(
      input.id,
      'WRONG_COLUMNS',
      `Line 1 of the file: columns ${extra.map((h) => `"${h.trim()}"`).join(', ')} are not in the table; expected ${expected}`,
    );
  }
  // Data lines keep their line numbers in messages; blank lines (a trailing newline) are skipped.
  const data: { line: number; cells: string[] }[] = [];
  all.slice(1).forEach((cells, i) => {
    if (cells.every((c) => c.trim() === '')) return;
    data.push({ line: i + 2, cells: order.map((j) => cells[j] ?? '') });
  });
  return rowsFromCells(
    input,
    data.map((d) => d.cells),
    parseNumber,
    { units, rowName: (i) => `Line ${data[i]?.line ?? i + 2} of the file (row ${i + 1})` },
  );
}

/** Cells pasted from a spreadsheet (tab- or semicolon-separated lines), with or without a header row. */
export function readPasted(text: string, input: TableInput, system: UnitSystemId): ReadResult {
  const body = text
    .replace(/^\uFEFF/, '')
    .replace(/\r\n?/g, '\n')
    .replace(/\n+$/, '');
  const first = body.split('\n')[0] ?? '';
  const rows = dsvFormat(delimiterOf(first)).parseRows(body);
  const hasHeader = (rows[0] ?? []).some((c) => c.trim() !== '' && Number.isNaN(parseNumber(c) ?? 0));
  if (hasHeader) return readCsv(body, input, system);
  const units = Object.fromEntries(input.columns.map((c) => [c.id, displayUnitOf(c, system)]));
  return rowsFromCells(input, rows, parseNumber, { units, rowName: (i) => `Pasted row ${i + 1}` });
}

/** Why a file is not read at all, or null: too large, or not text. */
export function fileProblem(file: { size: number; name: string; type: string }): string | null {
  if (file.size > MAX_FILE_BYTES)
    return `${file.name} is ${Math.ceil(file.size / 1024)} KB; files up to ${MAX_FILE_BYTES / 1024} KB are read`;
  if (file.type !== '' && !/^text\/|csv|excel/.test(file.type))
    return `${file.name} is not a CSV text file (it is ${file.type})`;
  return null;
}
