import {
  toCanonical,
  type FieldIssue,
  type TableInput,
  type TableRow,
  type UnitSystemId,
} from '@wickstone/calc-core';
import { displayUnitOf, unitSymbol } from '@wickstone/calc-core/display';
import { parseNumber } from '@wickstone/calc-core/format';
import { rowsFromCells, showTable } from '@wickstone/calc-core/table';
import { useEffect, useRef, useState } from 'preact/hooks';
import { fileProblem, MAX_FILE_BYTES, readCsv, readPasted } from './csv.js';

export interface TableFieldProps {
  readonly input: TableInput;
  /** The rows the form holds (canonical), or null when the cells typed do not all read. */
  readonly rows: readonly TableRow[] | null;
  readonly system: UnitSystemId;
  /** Rows as typed (numbers, NaN for unreadable text, null for empty), so calc-core names each bad cell. */
  readonly onRows: (rows: readonly Readonly<Record<string, number | null>>[]) => void;
}

const textsOf = (input: TableInput, rows: readonly TableRow[] | null, system: UnitSystemId): string[][] =>
  rows === null ? [] : showTable(input, rows, system).text.map((r) => [...r]);

/**
 * A table input: one text box per cell in the widget's units, rows added and removed, cells pasted
 * from a spreadsheet, or a CSV file read whole. A paste or a file is applied only when every cell
 * in it reads; otherwise the table stays as it was and the message names the line and column.
 */
export function TableField({ input, rows, system, onRows }: TableFieldProps) {
  const [texts, setTexts] = useState<string[][]>(() => textsOf(input, rows, system));
  const [problems, setProblems] = useState<readonly FieldIssue[]>([]);
  const [notice, setNotice] = useState('');
  const fileRef = useRef<HTMLInputElement>(null);
  const units = Object.fromEntries(input.columns.map((c) => [c.id, displayUnitOf(c, system)]));
  const id = `wk-in-${input.id}`;

  // Cells typed: what they read as goes to the form at once; problems show under the table.
  const typed = (next: string[][]): void => {
    setTexts(next);
    setNotice('');
    const read = rowsFromCells(input, next, parseNumber, { units });
    setProblems(read.issues);
    if (read.rows !== null) return onRows(read.rows);
    // Not all cells read: the form still gets every cell (NaN unreadable, null empty), so calc-core
    // names each bad one when the visitor calculates.
    onRows(
      next.map((cells) =>
        Object.fromEntries(
          input.columns.map((c, j) => {
            const n = parseNumber(cells[j] ?? '');
            const unit = units[c.id];
            return [c.id, n === null || Number.isNaN(n) || unit === undefined ? n : toCanonical(n, unit)];
          }),
        ),
      ),
    );
  };
  // A whole paste or file: all of it, or none of it.
  const replaceAll = (read: ReturnType<typeof readCsv>, what: string): void => {
    if (read.rows === null) {
      setProblems(read.issues);
      setNotice(`${what} was not used: nothing in the table changed.`);
      return;
    }
    setProblems([]);
    setNotice(`${what}: ${read.rows.length} rows read.`);
    setTexts(textsOf(input, read.rows, system));
    onRows(read.rows);
  };

  useEffect(() => {
    // New rows from outside (the firm's starting rows in a preview): show them.
    if (rows !== null && problems.length === 0) setTexts(textsOf(input, rows, system));
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [input, system]);

  const onFile = (e: Event): void => {
    const el = e.currentTarget as HTMLInputElement;
    const file = el.files?.[0];
    el.value = '';
    if (!file) return;
    const why = fileProblem(file);
    if (why) {
      setProblems([{ field: input.id, code: 'FILE_REFUSED', message: why }]);
      setNotice('The file was not used: nothing in the table changed.');
      return;
    }
    void file.text().then((text) => replaceAll(readCsv(text, input, system), `File ${file.name}`));
  };
  const onPaste = (e: ClipboardEvent): void => {
    const text = e.clipboardData?.getData('text/plain') ?? '';
    // A single value pasted into one cell is ordinary typing; several cells replace the table.
    if (!/[\t;\n]/.test(text.trim())) return;
    e.preventDefault();
    replaceAll(readPasted(text, input, system), 'The pasted cells');
  };

  const problemAt = (i: number, col: string): boolean =>
    problems.some((p) => p.field === `${input.id}.${i}.${col}` || p.field === `${input.id}.${i}`);
  return (
    <div class="field table-field" data-field={input.id} data-table-input={input.id}>
      <p class="label" id={`${id}-label`}>
        {input.label}
      </p>
      {input.help && <p class="note">{input.help}</p>}
      <div class="table-wrap" onPaste={onPaste}>
        <table class="cells" aria-labelledby={`${id}-label`} data-wickstone="table">
          <thead>
            <tr>
              <th scope="col" class="num">
                #
              </th>
              {input.columns.map((c) => (
                <th scope="col" key={c.id}>
                  {c.label} ({unitSymbol(units[c.id] ?? displayUnitOf(c, system))})
                </th>
              ))}
              <th scope="col">
                <span class="sr">Remove</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {texts.map((cells, i) => (
              <tr key={i} data-row={i}>
                <td class="num">{i + 1}</td>
                {input.columns.map((c, j) => (
                  <td key={c.id}>
                    <input
                      type="text"
                      inputMode="decimal"
                      autoComplete="off"
                      spellcheck={false}
                      aria-label={`${c.label}, row ${i + 1}`}
                      aria-invalid={problemAt(i, c.id) ? 'true' : undefined}
                      data-cell={`${i}.${c.id}`}
                      value={cells[j] ?? ''}
                      onInput={(e) => {
                        const next = texts.map((r) => [...r]);
                        (next[i] as string[])[j] = e.currentTarget.value;
                        typed(next);
                      }}
                    />
                  </td>
                ))}
                <td>
                  <button
                    type="button"
                    class="icon-btn"
                    aria-label={`Remove row ${i + 1}`}
                    onClick={() => typed(texts.filter((_, k) => k !== i))}
                  >
                    ×
                  </button>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <div class="table-actions">
        <button
          type="button"
          class="btn-quiet"
          data-wickstone="add-row"
          disabled={texts.length >= input.maxRows}
          onClick={() => typed([...texts, input.columns.map(() => '')])}
        >
          Add a row
        </button>
        <label class="btn-quiet file-btn">
          Read a CSV file…
          <input
            ref={fileRef}
            type="file"
            accept=".csv,.txt,text/csv,text/plain"
            data-wickstone="csv-file"
            onChange={onFile}
          />
        </label>
      </div>
      <p class="note">
        A CSV file starts with a header row naming the columns (
        {input.columns.map((c) => c.label.toLowerCase()).join(', ')}; a unit in brackets, such as &ldquo;time
        (h)&rdquo;, is read); up to {MAX_FILE_BYTES / 1024} KB. Cells copied from a spreadsheet can be pasted
        into the table.
      </p>
      {notice && (
        <p class="note" role="status" data-wickstone="table-notice">
          {notice}
        </p>
      )}
      {problems.length > 0 && (
        <div class="error" role="alert" data-wickstone="table-error">
          {problems.slice(0, 6).map((p, k) => (
            <p key={k}>{p.message}</p>
          ))}
          {problems.length > 6 && <p>and {problems.length - 6} more.</p>}
        </div>
      )}
    </div>
  );
}
