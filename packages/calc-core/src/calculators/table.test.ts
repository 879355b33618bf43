import { describe, expect, it } from 'vitest';
import { parseNumber } from '../format.js';
import { readingsInput } from './absorption-coefficient.js';
import { parseTableField, rowsFromCells, showTable, tableIssues, tableSummary } from './table.js';

// Rows from cells as a person types, pastes or uploads them: every problem named by row and
// column, in the units the person sees, and no rows at all unless every cell is good.

const inMinutesAndGrams = { units: { time: 'min', mass: 'g' } } as const;

describe('rowsFromCells', () => {
  it('reads cells in display units into canonical rows (min → s, g → kg, decimal comma)', () => {
    const got = rowsFromCells(
      readingsInput,
      [
        ['0', '1842.13'],
        ['5', '1845,81'],
        ['20', '1848.93'],
        ['60', '1853.5'],
        ['120', '1858.04'],
      ],
      parseNumber,
      inMinutesAndGrams,
    );
    expect(got.issues).toEqual([]);
    expect(got.rows?.[1]).toEqual({ time: 300, mass: 1.84581 });
    expect(got.rows?.[4]?.time).toBe(7200);
  });

  it('names each bad cell by row and column, in the units shown, and gives no rows', () => {
    const got = rowsFromCells(
      readingsInput,
      [
        ['0', '1842.13'],
        ['5', 'heavy'],
        ['3', '1848.93'],
        ['60', '-2'],
        ['120', ''],
        ['130', '1860', '7'],
      ],
      parseNumber,
      { ...inMinutesAndGrams, rowName: (i) => `Line ${i + 2} of the file` },
    );
    expect(got.rows).toBeNull();
    expect(got.issues.map((i) => [i.field, i.code])).toEqual([
      ['readings.5', 'TOO_MANY_CELLS'],
      ['readings.1.mass', 'NOT_A_NUMBER'],
      ['readings.2.time', 'NOT_INCREASING'],
      ['readings.3.mass', 'BELOW_MIN'],
      ['readings.4.mass', 'REQUIRED'],
    ]);
    const text = got.issues.map((i) => i.message);
    expect(text[1]).toBe('Line 3 of the file, mass: must be a number');
    expect(text[2]).toBe(
      'Line 4 of the file, time: must be later than the row above (5 min); rows go in time order',
    );
    expect(text[3]).toBe('Line 5 of the file, mass: must be from 0 g to 100000 g');
  });

  it('counts rows against the table’s least number', () => {
    const got = rowsFromCells(readingsInput, [['0', '1']], parseNumber);
    expect(got.issues).toEqual([expect.objectContaining({ field: 'readings', code: 'TOO_FEW_ROWS' })]);
  });
});

describe('showing and naming a table', () => {
  it('shows rows in a unit system’s units with the column symbols', () => {
    const t = showTable(readingsInput, readingsInput.default.slice(0, 2), 'si');
    expect(t.columns).toEqual([
      { id: 'time', label: 'Time', unit: 'min' },
      { id: 'mass', label: 'Mass', unit: 'g' },
    ]);
    expect(t.rows[1]?.[0]).toBeCloseTo(5, 12);
    expect(t.rows[1]?.[1]).toBeCloseTo(1845.81, 9);
    expect(tableSummary(readingsInput, readingsInput.default, 'si')).toBe('8 rows of time (min), mass (g)');
  });

  it('reads a field path back to input, row and column', () => {
    expect(parseTableField('readings.12.mass')).toEqual({ input: 'readings', row: 12, column: 'mass' });
    expect(parseTableField('readings')).toEqual({ input: 'readings' });
  });

  it('refuses more rows than the table takes, without reading them', () => {
    const rows = Array.from({ length: readingsInput.maxRows + 1 }, (_, i) => ({ time: i, mass: 1 }));
    expect(tableIssues(readingsInput, rows).map((i) => i.code)).toEqual(['TOO_MANY_ROWS']);
  });
});
