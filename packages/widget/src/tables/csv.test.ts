import { readingsInput } from '@wickstone/calc-core/calculators/absorption-coefficient';
import { describe, expect, it } from 'vitest';
import { delimiterOf, fileProblem, MAX_FILE_BYTES, readCsv, readPasted } from './csv.js';

// Files and pastes as laboratories save them: read whole or not at all, every problem naming the
// file's line and the column. Expected rows are the cells converted by hand (min × 60 = s, g / 1000 = kg).

const good = 'time (min),mass (g)\n0,1842.13\n5,1845.81\n20,1848.93\n60,1853.50\n120,1858.04\n';

describe('readCsv', () => {
  it('reads a header row and cells in the units the header names', () => {
    const r = readCsv(good, readingsInput, 'si');
    expect(r.issues).toEqual([]);
    expect(r.rows?.[2]?.time).toBe(1200);
    expect(r.rows?.[2]?.mass).toBeCloseTo(1.84893, 14);
    const inHours = readCsv(
      'Time [h];Mass [kg]\n0;1,84213\n1;1,8535\n2;1,85804\n4;1,86437\n8;1,87329',
      readingsInput,
      'si',
    );
    expect(inHours.rows?.[4]).toEqual({ time: 28800, mass: 1.87329 });
  });

  it('takes a byte-order mark, semicolons with decimal commas, CRLF line ends and a trailing blank line', () => {
    const text =
      '\uFEFFtime;mass\r\n0;1842,13\r\n5;1845,81\r\n20;1848,93\r\n60;1853,5\r\n120;1858,04\r\n\r\n';
    const r = readCsv(text, readingsInput, 'si');
    expect(r.issues).toEqual([]);
    expect(r.rows).toEqual(readCsv(good, readingsInput, 'si').rows);
    expect(delimiterOf('a;b')).toBe(';');
    expect(delimiterOf('a\tb')).toBe('\t');
  });

  it.each([
    [
      'wrong columns',
      'when,weight\n0,1\n',
      /Line 1 of the file: no "time" column; expected time, mass, found "when", "weight"/,
    ],
    ['an extra column', 'time,mass,temp\n0,1,20\n', /columns "temp" are not in the table/],
    ['a unit of the wrong kind', 'time (g),mass\n0,1\n', /"g" is not a unit of time/],
    [
      'a non-numeric cell',
      good.replace('1848.93', 'wet'),
      /Line 4 of the file \(row 3\), mass: must be a number/,
    ],
    [
      'times out of order',
      good.replace('60,1853.50', '15,1853.50'),
      /Line 5 of the file \(row 4\), time: must be later than the row above \(20 min\)/,
    ],
    [
      'a negative mass',
      good.replace('1845.81', '-1845.81'),
      /Line 3 of the file \(row 2\), mass: must be from 0 g/,
    ],
    ['an empty cell', good.replace('1858.04', ''), /Line 6 of the file \(row 5\), mass: needs a value/],
    ['missing rows', 'time,mass\n0,1\n5,2\n', /Readings needs at least 5 rows; there are 2/],
    ['no header', '\n0,1\n', /expected a header row/],
  ])('refuses %s, naming line and column, with no rows', (_what, text, message) => {
    const r = readCsv(text, readingsInput, 'si');
    expect(r.rows).toBeNull();
    expect(r.issues.map((i) => i.message).join(' | ')).toMatch(message);
  });
});

describe('readPasted', () => {
  it('reads tab-separated cells from a spreadsheet, with or without a header', () => {
    const cells = '0\t1842.13\n5\t1845.81\n20\t1848.93\n60\t1853.5\n120\t1858.04\n';
    expect(readPasted(cells, readingsInput, 'si').rows?.[1]).toEqual({ time: 300, mass: 1.84581 });
    expect(readPasted(`time\tmass\n${cells}`, readingsInput, 'si').rows?.[1]).toEqual({
      time: 300,
      mass: 1.84581,
    });
    expect(readPasted('0\t1\n5\tx', readingsInput, 'si').issues.map((i) => i.message)).toContain(
      'Pasted row 2, mass: must be a number',
    );
  });
});

describe('fileProblem', () => {
  it('refuses a file over 256 KB or one that is not text, before reading it', () => {
    expect(fileProblem({ size: MAX_FILE_BYTES, name: 'a.csv', type: 'text/csv' })).toBeNull();
    expect(fileProblem({ size: MAX_FILE_BYTES + 1, name: 'big.csv', type: 'text/csv' })).toMatch(
      /257 KB; files up to 256 KB/,
    );
    expect(fileProblem({ size: 10, name: 'a.png', type: 'image/png' })).toMatch(/not a CSV/);
    expect(fileProblem({ size: 10, name: 'a.csv', type: '' })).toBeNull();
  });
});
