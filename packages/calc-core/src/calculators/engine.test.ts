import { describe, expect, it } from 'vitest';
import { CalcInputError, SELF_CHECKS } from '../errors.js';
import { computeCalculation } from './engine.js';
import { choice, num, quantityInput, warning } from './shared.js';
import type { CalculatorCore, Solution, TableInput } from './types.js';

// calc-core's checks of its own definitions (SELF_CHECKS): a definition that breaks its contract is a
// calc-core bug, thrown as a plain Error wherever calc-core runs unbundled (these tests, the server,
// a published release's engine.mjs). Only the widget's release build leaves them out.

/** A made-up one-input calculator whose solution is whatever the test hands it. */
function brokenCalculator(solution: Solution, extra: Partial<CalculatorCore> = {}): CalculatorCore {
  return {
    id: 'broken',
    title: 'A broken calculator',
    summary: 'Returns the solution it is given, right or wrong.',
    inputs: [quantityInput('length', 'length', 'Length', 1, [0, 10])],
    outputs: [{ id: 'double', label: 'Twice the length', kind: 'length' }],
    warnings: [{ code: 'DECLARED', summary: 'A warning the definition declares.' }],
    solve: () => solution,
    ...extra,
  };
}
const solution = (parts: Partial<Solution>): Solution => ({
  outputs: { double: 2 },
  warnings: [],
  band: null,
  notes: [],
  assumed: null,
  ...parts,
});

describe('self-checks', () => {
  it('run here: nothing defines __WICKSTONE_RELEASE__ outside the widget release build', () => {
    expect(SELF_CHECKS).toBe(true);
  });

  it('pass a solution that keeps the contract', () => {
    const declared = warning('DECLARED', 'Declared and withholding.', ['length'], { withholds: ['double'] });
    const r = computeCalculation(
      brokenCalculator(solution({ outputs: { double: null }, warnings: [declared] })),
      {},
    );
    expect(r.outputs).toEqual({ double: null });
    expect(r.warnings.map((w) => w.code)).toEqual(['DECLARED']);
  });

  it('reject a warning the definition does not declare', () => {
    const def = brokenCalculator(solution({ warnings: [warning('UNDECLARED', 'Not declared.', [])] }));
    expect(() => computeCalculation(def, {})).toThrow('broken: warning UNDECLARED is not declared');
  });

  it('reject a withheld output that still has a figure', () => {
    const w = warning('DECLARED', 'Withholds the figure.', ['length'], { withholds: ['double'] });
    const def = brokenCalculator(solution({ warnings: [w] }));
    expect(() => computeCalculation(def, {})).toThrow('broken: DECLARED withholds double but it has a value');
  });

  it('reject an output that is missing or not finite', () => {
    expect(() => computeCalculation(brokenCalculator(solution({ outputs: {} })), {})).toThrow(
      'broken: output double is undefined',
    );
    expect(() => computeCalculation(brokenCalculator(solution({ outputs: { double: NaN } })), {})).toThrow(
      'broken: output double is NaN',
    );
  });

  it('reject a table input without its checker', () => {
    const table: TableInput = {
      id: 'rows',
      label: 'Rows',
      kind: 'table',
      columns: [{ id: 'x', label: 'x', kind: 'length', min: 0, max: 1 }],
      minRows: 1,
      maxRows: 2,
      default: [{ x: 0.5 }],
    };
    const def = brokenCalculator(solution({}), { inputs: [table] });
    expect(() => computeCalculation(def, {})).toThrow('broken: table input rows needs checkTable');
  });

  it('reject reading an input as a type it was not resolved to', () => {
    expect(() => num({ liquid: 'water' }, 'liquid')).toThrow('input liquid is not a resolved number');
    expect(() => num({}, 'length')).toThrow('input length is not a resolved number');
    expect(() => choice({ length: 1 }, 'length')).toThrow('input length is not a resolved choice');
    expect(num({ length: 1 }, 'length')).toBe(1);
    expect(choice({ liquid: 'water' }, 'liquid')).toBe('water');
  });

  it("reject inputs that are not an object keyed by the definition's input ids, listing unknown ids first", () => {
    const def = brokenCalculator(solution({}));
    expect(() => computeCalculation(def, null)).toThrow('inputs must be an object keyed by input id');
    expect(() => computeCalculation(def, { length: 2, width: 1 })).toThrow(
      expect.objectContaining({
        issues: [{ field: 'width', code: 'UNKNOWN_INPUT', message: 'broken has no input "width"' }],
      }),
    );
    expect(() => computeCalculation(def, { width: 1, length: 20 })).toThrow(
      expect.objectContaining({ code: 'INVALID_INPUTS', field: 'width' }),
    );
  });

  it('reject an input error without an issue', () => {
    expect(() => new CalcInputError([])).toThrow(TypeError);
  });
});
