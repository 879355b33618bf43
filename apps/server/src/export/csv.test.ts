import { describe, expect, it } from 'vitest';
import { csvCell, csvRow, UTF8_BOM } from './csv.js';
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
