import fc from 'fast-check';
import { unit as mathUnit } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { CalcInputError } from './errors.js';
import {
  canonicalUnits,
  convert,
  converter,
  displayUnit,
  fromCanonical,
  fromCanonicalTo,
  getUnit,
  quantityKinds,
  toCanonical,
  units,
  unitSystems,
  type UnitId,
} from './units.js';

// mathjs is an independent implementation of the same definitions: every factor is checked
// against it. Its spelling of each unit, or null where it has none.
const mathjsName: Readonly<Record<UnitId, string | null>> = {
  m: 'm',
  cm: 'cm',
  mm: 'mm',
  um: 'um',
  nm: 'nm',
  in: 'inch',
  ft: 'ft',
  m2: 'm^2',
  cm2: 'cm^2',
  mm2: 'mm^2',
  in2: 'inch^2',
  ft2: 'ft^2',
  m3: 'm^3',
  cm3: 'cm^3',
  mm3: 'mm^3',
  in3: 'inch^3',
  N: 'N',
  mN: 'mN',
  uN: 'uN',
  dyn: 'dyn',
  lbf: 'lbf',
  Pa: 'Pa',
  kPa: 'kPa',
  // mathjs's own `psi` constant is rounded (6894.75729276459); lbf/inch² is built from its exact lbf and inch.
  psi: 'lbf/inch^2',
  psf: 'lbf/ft^2',
  inH2O: null,
  'N/m': 'N/m',
  'mN/m': 'mN/m',
  'dyn/cm': 'dyn/cm',
  'lbf/ft': 'lbf/ft',
  'kg/m3': 'kg/m^3',
  'g/cm3': 'g/cm^3',
  'g/mL': 'g/mL',
  'lb/ft3': 'lbm/ft^3',
  degC: 'degC',
  degF: 'degF',
  K: 'K',
  deg: 'deg',
  rad: 'rad',
  'Pa*s': 'Pa s',
  'mPa*s': 'mPa s',
  // mathjs has no poise; a centipoise is a millipascal second by definition (NIST SP 811 B.9).
  cP: 'mPa s',
  s: 's',
  min: 'min',
  h: 'h',
  day: 'day',
  'm/s2': 'm/s^2',
  'ft/s2': 'ft/s^2',
  'm/s^0.5': 'm/s^0.5',
  'mm/s^0.5': 'mm/s^0.5',
  'mm/min^0.5': 'mm/min^0.5',
  'in/h^0.5': 'inch/h^0.5',
  'm/s': 'm/s',
  'mm/day': 'mm/day',
  'in/day': 'inch/day',
  'm3/m': 'm^3/m',
  'L/m': 'L/m',
  // mathjs's gal is the US liquid gallon, 231 in³.
  'gal/ft': 'gal/ft',
  'm3/(m*s)': 'm^3/(m s)',
  'L/(m*day)': 'L/(m day)',
  'gal/(ft*day)': 'gal/(ft day)',
  kg: 'kg',
  g: 'g',
  lb: 'lbm',
  'kg/m2': 'kg/m^2',
  'lb/ft2': 'lbm/ft^2',
  'kg/(m2*s^0.5)': 'kg/(m^2 s^0.5)',
  'kg/(m2*h^0.5)': 'kg/(m^2 h^0.5)',
  'lb/(ft2*h^0.5)': 'lbm/(ft^2 h^0.5)',
  'in/min^0.5': 'inch/min^0.5',
  '1': null,
};

const ids = Object.keys(units) as UnitId[];

describe('unit factors against mathjs', () => {
  const rows = ids.filter((id) => mathjsName[id] !== null && units[id].kind !== 'temperature');
  it.each(rows)('1 %s in canonical units matches mathjs (relative 1e-14)', (id) => {
    const canonical = canonicalUnits[units[id].kind];
    const expected = mathUnit(1, mathjsName[id] ?? '').toNumber(mathjsName[canonical] ?? '');
    const actual = convert(1, id, canonical);
    expect(Math.abs(actual / expected - 1)).toBeLessThanOrEqual(1e-14);
  });

  it.each([-40, 0, 32, 98.6, 212, 451])('%s °F in °C and K matches mathjs', (f) => {
    expect(convert(f, 'degF', 'degC')).toBeCloseTo(mathUnit(f, 'degF').toNumber('degC'), 12);
    expect(convert(f, 'degF', 'K')).toBeCloseTo(mathUnit(f, 'degF').toNumber('K'), 12);
  });

  it('mathjs’s psi constant differs from lbf/in² by under 1e-10 relative, so ours follows the exact definition', () => {
    const exact = convert(1, 'psi', 'Pa');
    expect(Math.abs(mathUnit(1, 'psi').toNumber('Pa') / exact - 1)).toBeLessThan(1e-10);
  });
});

describe('unit factors against NIST SP 811', () => {
  // [unit, value in canonical units, tolerance (absolute), source]
  const nist: [UnitId, number, number, string][] = [
    ['in', 0.0254, 0, 'NIST SP 811 B.8, exact'],
    ['ft', 0.3048, 0, 'NIST SP 811 B.8, exact'],
    ['lbf', 4.4482216152605, 0, 'NIST SP 811 B.8: 0.45359237 kg × 9.80665 m/s², exact'],
    ['psi', 6894.757293168, 1e-9, 'NIST SP 811 (2008) B.8, printed'],
    ['lbf/ft', 14.59390294, 1e-8, 'NIST SP 811 (2008) B.8, printed'],
    ['dyn/cm', 1e-3, 0, 'NIST SP 811 B.8, exact'],
    ['inH2O', 249.08891, 1e-10, 'NIST SP 811 B.8: conventional inch of water, printed'],
    ['psf', 47.88026, 1e-5, 'NIST SP 811 B.8: 4.788 026 E+01, from memory'],
    ['lb/ft3', 16.01846, 1e-5, 'NIST SP 811 B.8: 1.601 846 E+01, from memory'],
    ['cP', 1e-3, 0, 'NIST SP 811 B.8, exact'],
    ['day', 86400, 0, 'NIST SP 811 B.8, exact'],
    [
      'gal/ft',
      3.785411784e-3 / 0.3048,
      1e-17,
      'NIST SP 811 B.8: US liquid gallon = 231 in³ = 3.785 411 784 E−03 m³, exact (from memory)',
    ],
  ];
  it.each(nist)('1 %s = %s canonical ±%s (%s)', (id, expected, tol) => {
    expect(Math.abs(toCanonical(1, id) - expected)).toBeLessThanOrEqual(tol);
  });

  it('°C = (°F − 32)/1.8 and K = °C + 273.15 (NIST SP 811 4.2.1.1, exact)', () => {
    expect(convert(212, 'degF', 'degC')).toBeCloseTo(100, 12);
    expect(convert(32, 'degF', 'degC')).toBe(0);
    expect(convert(0, 'K', 'degC')).toBe(-273.15);
    expect(convert(-40, 'degC', 'degF')).toBeCloseTo(-40, 12);
  });

  it('conventional inch of water is 0.0254 m × 1000 kg/m³ × gₙ (NIST SP 811 B.8)', () => {
    expect(toCanonical(1, 'inH2O')).toBeCloseTo(0.0254 * 1000 * 9.80665, 10);
  });
});

describe('convert', () => {
  it('round-trips between every pair of units of a kind', () => {
    const byKind = new Map<string, UnitId[]>();
    for (const id of ids) byKind.set(units[id].kind, [...(byKind.get(units[id].kind) ?? []), id]);
    const pairs = [...byKind.values()].flatMap((list) =>
      list.flatMap((a) => list.map((b) => [a, b] as const)),
    );
    fc.assert(
      fc.property(fc.constantFrom(...pairs), fc.double({ min: -1e6, max: 1e6, noNaN: true }), ([a, b], v) => {
        const back = convert(convert(v, a, b), b, a);
        expect(Math.abs(back - v)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(v)));
      }),
    );
  });

  it('is linear through zero for every kind but temperature (no hidden offsets)', () => {
    const linear = ids.filter((id) => units[id].kind !== 'temperature');
    fc.assert(
      fc.property(fc.constantFrom(...linear), fc.double({ min: -1e6, max: 1e6, noNaN: true }), (id, v) => {
        expect(toCanonical(0, id)).toBe(0);
        expect(toCanonical(2 * v, id)).toBeCloseTo(2 * toCanonical(v, id), 6);
      }),
    );
  });

  it('throws a CalcInputError between kinds, for unknown units and for non-finite values', () => {
    expect(() => convert(1, 'm', 'N')).toThrow(CalcInputError);
    expect(() => convert(1, 'm', 'N')).toThrow(/cannot convert length/);
    expect(() => convert(1, 'furlong', 'm')).toThrow(
      expect.objectContaining({ code: 'UNKNOWN_UNIT', field: 'fromUnit' }),
    );
    expect(() => convert(1, 'furlong', 'm')).toThrow(CalcInputError);
    expect(() => convert(Number.NaN, 'm', 'mm')).toThrow(/value must be a number/);
    expect(() => convert(Infinity, 'm', 'mm')).toThrow(/finite/);
  });

  it('accepts the spellings people type', () => {
    expect(convert(1, 'g/cm3', 'kg/m3')).toBe(1000);
    expect(convert(1, 'µm', 'm')).toBe(1e-6);
    expect(convert(1, 'Pa·s', 'cP')).toBeCloseTo(1000, 9);
    expect(getUnit('°C').id).toBe('degC');
    expect(fromCanonical(1, 'mm')).toBe(1000);
  });
});

describe('unit systems', () => {
  it('give a display unit of the right kind for every quantity kind in si and us', () => {
    for (const system of ['si', 'us'] as const) {
      for (const kind of quantityKinds) {
        expect(units[displayUnit(kind, system)].kind).toBe(kind);
      }
      expect(Object.keys(unitSystems[system]).sort()).toEqual([...quantityKinds].sort());
    }
    expect(displayUnit('length', 'us')).toBe('in');
    expect(displayUnit('temperature', 'us')).toBe('degF');
  });

  it('have a canonical unit with factor 1 and offset 0 for every kind', () => {
    for (const kind of quantityKinds) {
      expect(units[canonicalUnits[kind]]).toMatchObject({ kind, factor: 1, offset: 0 });
    }
  });

  it('have no other unit with factor 1 and offset 0 of a kind, so the canonical unit is the one the factors say', () => {
    for (const kind of quantityKinds) {
      const plain = (Object.keys(units) as UnitId[]).filter(
        (id) => units[id].kind === kind && units[id].factor === 1 && units[id].offset === 0,
      );
      expect(plain, kind).toEqual([canonicalUnits[kind]]);
    }
  });
});

describe('errors and spellings, exactly', () => {
  const issue = (f: () => unknown) => {
    try {
      f();
    } catch (e) {
      return (e as CalcInputError).issues[0];
    }
    return undefined;
  };

  it('names the field, the code and the unit it did not know', () => {
    expect(issue(() => getUnit('furlong'))).toEqual({
      field: 'unit',
      code: 'UNKNOWN_UNIT',
      message: 'unknown unit "furlong"',
    });
    expect(issue(() => convert(1, 'm', 'furlong'))?.field).toBe('toUnit');
    expect(issue(() => convert(1, 'furlong', 'm'))?.field).toBe('fromUnit');
    expect(issue(() => toCanonical(1, 'furlong'))?.field).toBe('fromUnit');
    expect(issue(() => fromCanonical(1, 'furlong'))?.field).toBe('toUnit');
    expect(issue(() => convert(1, 'm', 'N'))).toMatchObject({ field: 'toUnit', code: 'UNIT_KIND_MISMATCH' });
  });

  it('reads °F and ° as typed', () => {
    expect(getUnit('°F').id).toBe('degF');
    expect(getUnit('°').id).toBe('deg');
    expect(getUnit('°C').id).toBe('degC');
    expect(getUnit('Pa·s').id).toBe('Pa*s');
    expect(getUnit('mPa·s').id).toBe('mPa*s');
    expect(getUnit('m/s²').id).toBe('m/s2');
    expect(getUnit('ft/s²').id).toBe('ft/s2');
  });

  it('returns a value unchanged when the units are the same (no round trip through the canonical unit)', () => {
    // 0.1 °F through °C and back is 0.09999999999999432 in binary64.
    expect(convert(0.1, 'degF', 'degF')).toBe(0.1);
    expect(convert(0.1, 'in', 'in')).toBe(0.1);
  });
});

describe('conversions resolved once', () => {
  const samples = [-40, -0.5, 0, 1e-7, 0.1, 1, 25.4, 212, 9.8e5];

  it('fromCanonicalTo(unit) matches mathjs for every unit it names (relative 1e-12)', () => {
    let checked = 0;
    for (const id of ids) {
      const canonical = canonicalUnits[units[id].kind];
      const [to, from] = [mathjsName[id], mathjsName[canonical]];
      if (to === null || from === null) continue;
      const f = fromCanonicalTo(id);
      for (const v of samples) {
        const expected = mathUnit(v, from).toNumber(to);
        const actual = f(v);
        if (expected === 0) expect(Math.abs(actual), `${v} → ${id}`).toBeLessThan(1e-12);
        else expect(Math.abs(actual / expected - 1), `${v} → ${id}`).toBeLessThanOrEqual(1e-12);
      }
      checked += 1;
    }
    expect(checked).toBeGreaterThan(30);
  });

  it('converter(from, to) turns inches into millimetres by the exact inch (NIST SP 811 B.8: 1 in = 25.4 mm)', () => {
    const f = converter('in', 'mm');
    expect(f(1)).toBeCloseTo(25.4, 12);
    expect(f(-2)).toBeCloseTo(-50.8, 12);
  });

  it('checks the units when made and each value when called', () => {
    expect(() => converter('m', 'N')).toThrow(/cannot convert length/);
    expect(() => converter('m', 'furlong')).toThrow(/unknown unit "furlong"/);
    expect(() => fromCanonicalTo('furlong')).toThrow(/unknown unit "furlong"/);
    expect(() => converter('in', 'mm')(Number.NaN)).toThrow(CalcInputError);
    expect(() => converter('in', 'in')(Number.POSITIVE_INFINITY)).toThrow(CalcInputError);
  });

  it('hands out one frozen definition per unit, so a lookup copies nothing and nothing can change it', () => {
    const a = getUnit('°C');
    expect(getUnit('degC')).toBe(a);
    expect(Object.isFrozen(a)).toBe(true);
    expect(a).toEqual({ ...units.degC, id: 'degC' });
  });
});
