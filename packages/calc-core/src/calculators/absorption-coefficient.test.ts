import { describe, expect, it } from 'vitest';
import { CalcInputError } from '../errors.js';
import { calculate } from '../registry.js';
import { fromCanonical } from '../units.js';
import { readingsInput, run } from './absorption-coefficient.js';

// The calculator's default readings are an invented test (no published worked example of either
// standard could be seen). The expected figures come from an independent implementation of least
// squares, Python's standard library, run on the same readings:
//   python3 -c "import statistics as s, math; r=[(0,1.84213),(300,1.84581),(1200,1.84893),(3600,1.8535),
//     (7200,1.85804),(14400,1.86437),(28800,1.87329),(86400,1.89567)]; x=[math.sqrt(t) for t,m in r[1:]];
//     y=[(m-r[0][1])/0.01 for t,m in r[1:]]; f=s.linear_regression(x,y); print(f.slope, f.intercept, s.correlation(x,y)**2)"
// (Python 3.11, statistics.linear_regression and statistics.correlation); for ASTM C1585 the same
// with the rows from 60 s to 21 600 s only.

const issuesOf = (inputs: unknown) => {
  try {
    calculate('absorption-coefficient', inputs);
  } catch (e) {
    if (e instanceof CalcInputError) return e.issues;
    throw e;
  }
  return [];
};

describe('absorption-coefficient: reference checks', () => {
  it.each([
    // method, A_w kg/(m²·√s), intercept kg/m², R², points — source on each row
    ['en-iso-15148', 0.018024774978133994, 0.057486704189763316, 0.9999976315531227, 7], // Python statistics.linear_regression (independent route), all rows after t = 0
    ['astm-c1585', 0.018089081154903645, 0.05382394588669426, 0.9999949021251163, 5], // Python statistics.linear_regression (independent route), rows 60 s–21 600 s
  ] as const)('%s on the invented default readings', (method, aw, intercept, r2, n) => {
    const r = run({ method });
    expect(r.outputs.absorptionCoefficient).toBeCloseTo(aw, 12);
    expect(r.outputs.intercept).toBeCloseTo(intercept, 11);
    expect(r.outputs.rSquared).toBeCloseTo(r2, 12);
    expect(r.outputs.pointsInFit).toBe(n);
    // √h = 60 √s exactly; S = A_w / ρ_w (ASTM C1585's I = Δm/(a·d), from memory), ρ_w 1000 kg/m³ by default.
    // Outputs are canonical; shown per √h the figure is 60 × A_w per √s (√3600 = 60).
    expect(r.outputs.absorptionCoefficientPerRootHour).toBe(r.outputs.absorptionCoefficient);
    expect(fromCanonical(r.outputs.absorptionCoefficientPerRootHour ?? 0, 'kg/(m2*h^0.5)')).toBeCloseTo(
      aw * 60,
      10,
    );
    expect(r.outputs.sorptivity).toBeCloseTo(aw / 1000, 15);
    expect(r.warnings).toEqual([]);
  });

  it('takes the water density into the sorptivity only', () => {
    const a = run({ waterDensity: 998.2 });
    const b = run({});
    expect(a.outputs.absorptionCoefficient).toBe(b.outputs.absorptionCoefficient);
    expect(a.outputs.sorptivity).toBeCloseTo((b.outputs.absorptionCoefficient ?? 0) / 998.2, 15);
  });

  it('scales with the face area: half the area, twice the coefficient', () => {
    const a = run({ faceArea: 0.005 });
    expect(a.outputs.absorptionCoefficient).toBeCloseTo(2 * (run({}).outputs.absorptionCoefficient ?? 0), 12);
  });

  it('ASTM C1585 leaves readings before 1 min and after 6 h out of the fit', () => {
    const rows = [
      { time: 0, mass: 2 },
      { time: 30, mass: 2.05 }, // before 1 min: a wild value that must not count
      { time: 60, mass: 2.001 },
      { time: 300, mass: 2.001 + 0.00002 * (Math.sqrt(300) - Math.sqrt(60)) * 100 },
      { time: 3600, mass: 2.001 + 0.00002 * (Math.sqrt(3600) - Math.sqrt(60)) * 100 },
      { time: 86400, mass: 1.5 }, // after 6 h: likewise
    ];
    const r = run({ method: 'astm-c1585', readings: rows, faceArea: 0.01 });
    expect(r.outputs.pointsInFit).toBe(3);
    // The three points in the window lie on a line: 0.002 kg per √s over 0.01 m² = 0.2 kg/(m²·√s).
    expect(r.outputs.absorptionCoefficient).toBeCloseTo((0.00002 * 100) / 0.01, 10);
    expect(r.outputs.rSquared).toBeCloseTo(1, 12);
    const en = run({ method: 'en-iso-15148', readings: rows, faceArea: 0.01 });
    expect(en.outputs.pointsInFit).toBe(5);
    expect(en.outputs.absorptionCoefficient).toBeNull();
    expect(en.warnings.map((w) => w.code)).toEqual(['NO_UPTAKE']);
  });
});

describe('absorption-coefficient: when no rate is given', () => {
  it('withholds every rate when the points are not on a line (r < 0.98), keeping R² as the reason', () => {
    const readings = [0, 1.004, 1.001, 1.005, 1.002, 1.006].map((m, i) => ({
      time: [0, 300, 1200, 3600, 7200, 14400][i] ?? 0,
      mass: i === 0 ? 1 : m,
    }));
    const r = run({ readings });
    expect(r.outputs).toMatchObject({
      absorptionCoefficient: null,
      absorptionCoefficientPerRootHour: null,
      sorptivity: null,
      intercept: null,
    });
    expect(r.outputs.rSquared).toBeLessThan(0.98 ** 2);
    const w = r.warnings.find((x) => x.code === 'NOT_LINEAR');
    expect(w?.withholds).toEqual([
      'absorptionCoefficient',
      'absorptionCoefficientPerRootHour',
      'sorptivity',
      'intercept',
    ]);
    expect(w?.message).toMatch(/r = 0\.\d+, below 0\.98/);
  });

  it('gives a rate just above r = 0.98 and none just below', () => {
    // A straight line plus an alternating error ±d: r falls as d grows; step d until r drops below 0.98.
    const at = (d: number) =>
      run({
        faceArea: 0.01,
        readings: [0, 1, 4, 9, 16, 25, 36].map((t, i) => ({
          time: t * 3600,
          mass: 1 + (i === 0 ? 0 : (Math.sqrt(t * 3600) * 1e-4 + (i % 2 === 0 ? d : -d)) * 0.01),
        })),
      });
    const rOf = (d: number) => Math.sqrt(at(d).outputs.rSquared ?? 0);
    let d = 0;
    while (rOf(d + 1e-4) >= 0.98) d += 1e-4;
    expect(rOf(d)).toBeGreaterThanOrEqual(0.98);
    expect(at(d).outputs.absorptionCoefficient).not.toBeNull();
    expect(rOf(d + 1e-4)).toBeLessThan(0.98);
    expect(at(d + 1e-4).outputs.absorptionCoefficient).toBeNull();
  });
});

describe('absorption-coefficient: readings that are refused, naming row and column', () => {
  const good = readingsInput.default;
  it.each([
    [
      'a negative mass',
      good.map((r, i) => (i === 2 ? { ...r, mass: -0.1 } : r)),
      'readings.2.mass',
      'BELOW_MIN',
      /Readings, row 3, mass/,
    ],
    [
      'times out of order',
      good.map((r, i) => (i === 3 ? { ...r, time: 100 } : r)),
      'readings.3.time',
      'NOT_INCREASING',
      /Readings, row 4, time: must be later than the row above \(1200 s\)/,
    ],
    [
      'a cell that is not a number',
      good.map((r, i) => (i === 4 ? { ...r, mass: '1,85' } : r)),
      'readings.4.mass',
      'NOT_A_NUMBER',
      /row 5, mass/,
    ],
    [
      'a missing cell',
      good.map((r, i) => (i === 1 ? { time: r.time } : r)),
      'readings.1.mass',
      'REQUIRED',
      /row 2, mass/,
    ],
    [
      'a column the table does not have',
      good.map((r, i) => (i === 0 ? { ...r, temp: 20 } : r)),
      'readings.0.temp',
      'UNKNOWN_COLUMN',
      /row 1 has no column "temp"/,
    ],
    ['too few rows', good.slice(0, 4), 'readings', 'TOO_FEW_ROWS', /at least 5 rows; there are 4/],
    ['not a list', 'lots', 'readings', 'NOT_A_TABLE', /list of rows/],
  ])('%s', (_what, readings, field, code, message) => {
    const issues = issuesOf({ readings });
    expect(issues[0]).toMatchObject({ field, code });
    expect(issues[0]?.message).toMatch(message);
  });

  it('names every bad cell at once', () => {
    const readings = good.map((r, i) => (i === 1 ? { time: -5, mass: -1 } : r));
    expect(issuesOf({ readings }).map((i) => i.field)).toEqual(['readings.1.time', 'readings.1.mass']);
  });

  it('needs the first reading at time 0', () => {
    const readings = good.slice(1);
    expect(issuesOf({ readings })).toEqual([
      expect.objectContaining({ field: 'readings.0.time', code: 'NO_ZERO_READING' }),
    ]);
  });
});

describe('absorption-coefficient: the input hash covers the rows', () => {
  it('changes with any one cell and not with how the rows were written', () => {
    const base = run({});
    const same = run({ readings: readingsInput.default.map((r) => ({ mass: r.mass, time: r.time })) });
    expect(same.inputHash).toBe(base.inputHash);
    const nudged = readingsInput.default.map((r, i) => (i === 5 ? { ...r, mass: (r.mass ?? 0) + 1e-5 } : r));
    expect(run({ readings: nudged }).inputHash).not.toBe(base.inputHash);
    expect(base.inputs.readings).toEqual(readingsInput.default);
  });
});
