/*
 * CSV as RFC 4180 has it: fields separated by commas, records by CRLF, a field holding a comma,
 * a double quote, CR or LF enclosed in double quotes with its quotes doubled. Text that a
 * spreadsheet would read as a formula (= + - @, or a tab or CR before one) gets a leading single
 * quote, because visitors type some of these cells (names, messages) and a firm opens the file in
 * a spreadsheet.
 */

export type CsvCell = string | number | boolean | Date | null | undefined;

const NEEDS_QUOTES = /[",\r\n]/;

/**
 * One text field: the formula guard, then the quotes where needed. Exports write most of their
 * cells through here, a million rows at a time, so the first character is looked at by its code
 * rather than with a regular expression.
 */
export function csvText(text: string): string {
  if (text === '') return '';
  const c = text.charCodeAt(0);
  // = + - @ tab CR
  if (c === 61 || c === 43 || c === 45 || c === 64 || c === 9 || c === 13) text = `'${text}`;
  return NEEDS_QUOTES.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** One field. Numbers we wrote ourselves go out as they are, so a spreadsheet reads -0.5 as a number. */
export function csvCell(value: CsvCell): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : '';
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  return csvText(value instanceof Date ? value.toISOString() : value);
}

/** One record, with its CRLF. */
export function csvRow(cells: readonly CsvCell[]): string {
  return `${cells.map(csvCell).join(',')}\r\n`;
}

/**
 * A UTF-8 byte order mark: without it the spreadsheets firms use read the file as a legacy code
 * page and turn °C and µm into mojibake. RFC 4180 parsers that do not expect it see it only before
 * the first header name.
 */
export const UTF8_BOM = '\uFEFF';

/**
 * A listing as CSV text, read from the database a chunk at a time in keyset order: `page(after)`
 * answers up to `chunk` rows after the cursor (the first ones for null), `cells` turns rows into
 * fields (or `records` writes them as CSV text itself), `cursor` is where the next chunk starts. So the rows are never all in memory, and each
 * query is a short index range however far the export has gone. The next chunk's query is sent as
 * soon as a chunk arrives, so the database reads it while this one is formatted and written: one
 * chunk ahead at most, and only while the reader keeps reading (a reader that stops, or a client
 * that goes away, leaves at most that one query to finish). The header comes out with the first
 * rows, so a failure before any of them still answers with an error rather than half a file.
 */
export async function* keysetCsv<R, C>(
  opts: {
    header: readonly string[];
    chunk: number;
    page: (after: C | null) => Promise<R[]>;
    cursor: (last: R) => C;
  } & (
    | { cells: (rows: R[]) => Promise<CsvCell[][]> | CsvCell[][] }
    /** The chunk's records written straight to text, each with its CRLF (what `csvRow` writes). */
    | { records: (rows: R[]) => string }
  ),
): AsyncGenerator<string> {
  let head = UTF8_BOM + csvRow(opts.header);
  let next: Promise<R[]> | null = opts.page(null);
  try {
    while (next) {
      const rows: R[] = await next;
      const last = rows.at(-1);
      next = last === undefined || rows.length < opts.chunk ? null : opts.page(opts.cursor(last));
      // A failed read ahead is thrown where it is awaited, not reported as unhandled meanwhile.
      next?.catch(() => undefined);
      let out = head;
      head = '';
      if ('records' in opts) out += opts.records(rows);
      else for (const row of await opts.cells(rows)) out += csvRow(row);
      if (out) yield out;
    }
  } finally {
    // The reader stopped early: let the query already sent finish before the connection is reused.
    await next?.catch(() => undefined);
  }
}
