import { describe, expect, it } from 'vitest';
import { csvCell, csvRow, keysetCsv, UTF8_BOM } from './csv.js';
import { readCsv } from '../../testing/csv.js';

describe('CSV cells (RFC 4180)', () => {
  it.each([
    ['plain', 'plain'],
    ['a, b', '"a, b"'],
    ['say "hi"', '"say ""hi"""'],
    ['two\r\nlines', '"two\r\nlines"'],
    ['one\nline feed', '"one\nline feed"'],
    ['', ''],
  ])('writes %j as %j', (value, written) => {
    expect(csvCell(value)).toBe(written);
  });

  it.each([
    ['=SUM(A1:A9)', "'=SUM(A1:A9)"],
    ['+44 20 7946 0000', "'+44 20 7946 0000"],
    ['-2+3', "'-2+3"],
    ['@cmd', "'@cmd"],
    ['\t=1', "'\t=1"],
    ['=HYPERLINK("http://x.example","y")', `"'=HYPERLINK(""http://x.example"",""y"")"`],
  ])('guards %j, which a spreadsheet would run as a formula, as %j', (value, written) => {
    expect(csvCell(value)).toBe(written);
  });

  it('writes numbers, booleans, dates and blanks plainly', () => {
    expect(csvCell(-0.5)).toBe('-0.5');
    expect(csvCell(1e-7)).toBe('1e-7');
    expect(csvCell(Number.NaN)).toBe('');
    expect(csvCell(true)).toBe('yes');
    expect(csvCell(false)).toBe('no');
    expect(csvCell(new Date('2026-01-10T08:00:00Z'))).toBe('2026-01-10T08:00:00.000Z');
    expect(csvCell(null)).toBe('');
    expect(csvCell(undefined)).toBe('');
  });

  it('ends each record with CRLF and reads back what it wrote', () => {
    const rows = [
      ['Name', 'Note', 'n'],
      ['Hester "Hes" Quayle', 'line one\r\nline two, with a comma', '3'],
      ['', "'=1+1", '-4'],
    ];
    const text = UTF8_BOM + rows.map((r) => csvRow(r)).join('');
    expect(text.endsWith('\r\n')).toBe(true);
    expect(text.split('\r\n')[0]).toBe(`${UTF8_BOM}Name,Note,n`);
    // A text cell starting with "-" gets the guard's quote, which is then part of it; one that
    // already starts with a quote is left alone.
    expect(readCsv(text)).toEqual([rows[0], rows[1], ['', "'=1+1", "'-4"]]);
  });
});

describe('keyset export', () => {
  /** Rows 1..n in pages of `chunk`, recording every page asked for. */
  const numbers = (n: number, chunk: number) => {
    const asked: (number | null)[] = [];
    const gen = keysetCsv<number, number>({
      header: ['n'],
      chunk,
      page: async (after) => {
        asked.push(after);
        const from = (after ?? 0) + 1;
        return Array.from({ length: Math.max(0, Math.min(chunk, n - from + 1)) }, (_, i) => from + i);
      },
      cells: (rows) => rows.map((r) => [r]),
      cursor: (last) => last,
    });
    return { gen, asked };
  };

  it('writes every row once, in order, after one header, and stops at a short page', async () => {
    const { gen, asked } = numbers(10, 4);
    let text = '';
    for await (const part of gen) text += part;
    expect(readCsv(text)).toEqual([['n'], ...Array.from({ length: 10 }, (_, i) => [String(i + 1)])]);
    expect(asked).toEqual([null, 4, 8]);
  });

  it('answers the header alone when nothing matches, and asks again after a full last page', async () => {
    const empty = numbers(0, 4);
    let text = '';
    for await (const part of empty.gen) text += part;
    expect(readCsv(text)).toEqual([['n']]);
    const exact = numbers(8, 4);
    for await (const part of exact.gen) void part;
    expect(exact.asked).toEqual([null, 4, 8]);
  });

  it('reads at most one page ahead of the reader, and no further once the reader stops', async () => {
    const { gen, asked } = numbers(100, 5);
    const first = await gen.next();
    expect(readCsv(String(first.value))).toEqual([['n'], ['1'], ['2'], ['3'], ['4'], ['5']]);
    expect(asked).toEqual([null, 5]);
    await gen.next();
    expect(asked).toEqual([null, 5, 10]);
    await gen.return(undefined);
    expect(asked).toEqual([null, 5, 10]);
  });

  it('passes on a failed read ahead when the reader gets to it', async () => {
    let calls = 0;
    const gen = keysetCsv<number, number>({
      header: ['n'],
      chunk: 2,
      page: async (after) => {
        calls += 1;
        if (after !== null) throw new Error('connection lost');
        return [1, 2];
      },
      cells: (rows) => rows.map((r) => [r]),
      cursor: (last) => last,
    });
    await gen.next();
    await expect(gen.next()).rejects.toThrow('connection lost');
    expect(calls).toBe(2);
  });
});
