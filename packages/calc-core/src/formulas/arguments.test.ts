import { describe, expect, it } from 'vitest';
import { CalcInputError } from '../errors.js';
import { waterDensity, waterSurfaceTension, waterViscosity } from '../properties/water.js';
import {
  capillaryLength,
  jurinRise,
  meniscusCorrection,
  slotMeniscusCorrection,
  slotRise,
} from './capillary.js';
import { bubblePressure, laplacePressure, poreEntryPressure } from './laplace.js';
import { capillaryBreakCheck, hazenCapillaryRise } from './soil.js';
import {
  platePerimeter,
  ringCorrection,
  wilhelmyForce,
  wilhelmyRodForce,
  wilhelmyRodSurfaceTension,
  wilhelmySurfaceTension,
} from './tensiometry.js';
import * as wicking from './wicking.js';

const { bosanquetTime, gravityRestrainedRiseTime, gravityShape, washburnLength, washburnTime } = wicking;

// Every formula names the argument it refuses (what a caller needs to fix the call) and the
// quantity that overflowed; and the cos θ of each law is exercised away from θ = 0, where a formula
// that dropped it would still pass.

// Any formula: it takes one argument object. Called here with deliberately wrong objects.
type Fn = (args: never) => unknown;
const callWith = (fn: Fn, args: Record<string, unknown>): unknown =>
  (fn as unknown as (a: Record<string, unknown>) => unknown)(args);
const rise = { surfaceTension: 0.072, contactAngleDeg: 30, density: 1000, gravity: 9.81 };
const wick = { poreRadius: 1e-5, surfaceTension: 0.072, contactAngleDeg: 30, viscosity: 1e-3 };
const ring = { force: 9e-3, ringRadius: 9.55e-3, wireRadius: 0.2e-3, densityDifference: 998, gravity: 9.81 };

const cases: readonly (readonly [string, Fn, Record<string, unknown>])[] = [
  ['jurinRise', jurinRise, { ...rise, diameter: 1e-3 }],
  ['slotRise', slotRise, { ...rise, gap: 1e-3 }],
  ['capillaryLength', capillaryLength, { surfaceTension: 0.072, density: 1000, gravity: 9.81 }],
  ['meniscusCorrection', meniscusCorrection, { diameter: 1e-3, contactAngleDeg: 30 }],
  ['slotMeniscusCorrection', slotMeniscusCorrection, { gap: 1e-3, contactAngleDeg: 30 }],
  ['laplacePressure', laplacePressure, { surfaceTension: 0.072, r1: 1e-3, r2: 2e-3 }],
  ['bubblePressure', bubblePressure, { surfaceTension: 0.072, radius: 1e-3 }],
  ['poreEntryPressure', poreEntryPressure, { surfaceTension: 0.072, contactAngleDeg: 30, poreRadius: 1e-6 }],
  [
    'wilhelmyForce',
    wilhelmyForce,
    { surfaceTension: 0.072, contactAngleDeg: 30, width: 0.02, thickness: 1e-4 },
  ],
  [
    'wilhelmySurfaceTension',
    wilhelmySurfaceTension,
    { force: 1e-3, contactAngleDeg: 30, width: 0.02, thickness: 1e-4 },
  ],
  ['wilhelmyRodForce', wilhelmyRodForce, { surfaceTension: 0.072, contactAngleDeg: 30, diameter: 1e-3 }],
  [
    'wilhelmyRodSurfaceTension',
    wilhelmyRodSurfaceTension,
    { force: 1e-4, contactAngleDeg: 30, diameter: 1e-3 },
  ],
  ['ringCorrection', ringCorrection, ring],
  ['hazenCapillaryRise', hazenCapillaryRise, { d10: 1e-4, voidRatio: 0.6, c: 3e-5 }],
  ['washburnTime', washburnTime, { ...wick, length: 0.01 }],
  ['washburnLength', washburnLength, { ...wick, time: 10 }],
  [
    'gravityRestrainedRiseTime',
    gravityRestrainedRiseTime,
    { ...wick, height: 0.01, density: 1000, gravity: 9.81 },
  ],
  ['bosanquetTime', bosanquetTime, { ...wick, length: 0.01, density: 1000 }],
];

function refusal(fn: Fn, args: Record<string, unknown>): { field: string; code: string } | undefined {
  try {
    callWith(fn, args);
  } catch (e) {
    if (e instanceof CalcInputError) return e.issues[0];
    throw e;
  }
  return undefined;
}

describe('formulas name what they refuse', () => {
  it.each(cases)('%s names each bad argument', (_name, fn, args) => {
    expect(refusal(fn, args)).toBeUndefined();
    for (const key of Object.keys(args)) {
      expect(refusal(fn, { ...args, [key]: Number.NaN })).toMatchObject({ field: key, code: 'NOT_A_NUMBER' });
    }
  });

  it('names the parts of a capillary break and of a plate', () => {
    const layer = { thickness: 0.15, rise: 0.01 };
    const check = (a: Record<string, unknown>) => refusal(capillaryBreakCheck, a);
    expect(check({ waterTableDepth: -1, soilRise: 0.1 })?.field).toBe('waterTableDepth');
    expect(check({ waterTableDepth: 1, soilRise: -1 })?.field).toBe('soilRise');
    expect(check({ waterTableDepth: 1, soilRise: 0.1, layer: { ...layer, thickness: 0 } })?.field).toBe(
      'layer.thickness',
    );
    expect(check({ waterTableDepth: 1, soilRise: 0.1, layer: { ...layer, rise: -1 } })?.field).toBe(
      'layer.rise',
    );
    expect(() => platePerimeter(0, 0)).toThrow(expect.objectContaining({ field: 'width' }));
    expect(() => platePerimeter(1, -1)).toThrow(expect.objectContaining({ field: 'thickness' }));
  });

  it('names the angle a wetting-only formula refuses, with its own code and message', () => {
    expect(() => meniscusCorrection({ diameter: 1e-3, contactAngleDeg: 120 })).toThrow(
      expect.objectContaining({
        field: 'contactAngleDeg',
        code: 'MENISCUS_NOT_CONCAVE',
        message: expect.stringMatching(/concave/),
      }),
    );
    expect(() =>
      wilhelmySurfaceTension({ force: 1e-3, contactAngleDeg: 95, width: 0.02, thickness: 0 }),
    ).toThrow(
      expect.objectContaining({ field: 'contactAngleDeg', message: expect.stringMatching(/below 90°/) }),
    );
    expect(() => washburnTime({ ...wick, contactAngleDeg: 95, length: 1 })).toThrow(
      expect.objectContaining({ field: 'contactAngleDeg', message: expect.stringMatching(/does not wick/) }),
    );
    expect(() => ringCorrection({ ...ring, wireRadius: 0.01 })).toThrow(
      expect.objectContaining({ message: expect.stringMatching(/smaller than the ring radius/) }),
    );
  });

  it.each([
    ['capillary rise', () => jurinRise({ ...rise, contactAngleDeg: 0, diameter: 1e-320 })],
    ['capillary rise', () => slotRise({ ...rise, contactAngleDeg: 0, gap: 1e-320 })],
    ['capillary length', () => capillaryLength({ surfaceTension: 1e300, density: 1e-300 })],
    ['Laplace pressure', () => laplacePressure({ surfaceTension: 1, r1: 1e-320 })],
    ['bubble pressure', () => bubblePressure({ surfaceTension: 1, radius: 1e-320 })],
    [
      'pore entry pressure',
      () => poreEntryPressure({ surfaceTension: 1, contactAngleDeg: 0, poreRadius: 1e-320 }),
    ],
    [
      'Wilhelmy force',
      () => wilhelmyForce({ surfaceTension: 1e300, contactAngleDeg: 0, width: 1e300, thickness: 0 }),
    ],
    [
      'Wilhelmy force',
      () => wilhelmyRodForce({ surfaceTension: 1e300, contactAngleDeg: 0, diameter: 1e300 }),
    ],
    [
      'surface tension',
      () => wilhelmySurfaceTension({ force: 1e300, contactAngleDeg: 0, width: 1e-320, thickness: 0 }),
    ],
    [
      'surface tension',
      () => wilhelmyRodSurfaceTension({ force: 1e300, contactAngleDeg: 0, diameter: 1e-320 }),
    ],
    [
      'apparent surface tension',
      () => ringCorrection({ ...ring, force: 1e300, ringRadius: 1e-320, wireRadius: 1e-321 }),
    ],
    ['wicking time', () => washburnTime({ ...wick, length: 1e300 })],
    ['wicking distance', () => washburnLength({ ...wick, time: 1e300, surfaceTension: 1e300 })],
    [
      'rise time',
      () => gravityRestrainedRiseTime({ ...wick, viscosity: 1e308, height: 0.01, density: 1000 }),
    ],
    ['Bosanquet time', () => bosanquetTime({ ...wick, viscosity: 1e300, length: 1e-300, density: 1e-300 })],
  ] as const)('says which quantity overflowed: %s', (what, f) => {
    expect(f).toThrow(new RegExp(`^${what}`));
  });
});

describe('cos θ where it is not 1', () => {
  const sigma = waterSurfaceTension(20);
  const rho = waterDensity(20).value;
  const mu = waterViscosity(20);
  const c60 = 0.5;

  it('puts cos θ in the pore entry pressure and the Lucas–Washburn time (θ = 60°)', () => {
    expect(poreEntryPressure({ surfaceTension: sigma, contactAngleDeg: 60, poreRadius: 1e-6 })).toBeCloseTo(
      (2 * sigma * c60) / 1e-6,
      6,
    );
    const a = { poreRadius: 1e-5, surfaceTension: sigma, contactAngleDeg: 60, viscosity: mu };
    expect(washburnTime({ ...a, length: 0.01 })).toBeCloseTo((2 * mu * 1e-4) / (sigma * 1e-5 * c60), 9);
  });

  it('puts cos θ in the Jurin height of the rise with gravity (θ = 60°), checked by integrating dh/dt', () => {
    const r = 1e-4;
    const a = { poreRadius: r, surfaceTension: sigma, contactAngleDeg: 60, viscosity: mu, density: rho };
    const hJ = (2 * sigma * c60) / (rho * 9.80665 * r);
    const h = 0.5 * hJ;
    // Independent route: t = ∫ dh / v(h), v = (r²ρg/8μ)(h_J − h)/h, by the midpoint rule.
    const k = (r * r * rho * 9.80665) / (8 * mu);
    const n = 200000;
    let t = 0;
    for (let i = 0; i < n; i++) {
      const z = ((i + 0.5) * h) / n;
      t += h / n / ((k * (hJ - z)) / z);
    }
    expect(gravityRestrainedRiseTime({ ...a, height: h }) / t).toBeCloseTo(1, 6);
  });

  it('gives the shape term to the last digits on both sides of the switch to its series', () => {
    for (const x of [1e-8, 1e-6, 9e-5, 1.1e-4]) {
      let series = 0;
      for (let n = 2; n < 40; n++) series += x ** n / n;
      expect(Math.abs(gravityShape(x) / series - 1)).toBeLessThan(x < 1e-4 ? 1e-14 : 1e-10);
    }
  });

  it('solves Bosanquet to the last digits for short times, on both sides of the switch to its series', () => {
    const args = { poreRadius: 1e-3, surfaceTension: sigma, contactAngleDeg: 0, viscosity: mu, density: rho };
    const { a, b } = bosanquetTime({ ...args, length: 1 });
    for (const tau of [1e-6, 5e-4, 2e-3]) {
      // x² = (a/b²)(τ − 1 + e^(−τ)) with the bracket by its own series, an independent evaluation.
      let bracket = 0;
      let term = 1;
      for (let n = 1; n < 30; n++) {
        term *= -tau / n;
        if (n >= 2) bracket += term;
      }
      const L = Math.sqrt((a / (b * b)) * bracket);
      expect(Math.abs(bosanquetTime({ ...args, length: L }).tau / tau - 1)).toBeLessThan(3e-12);
    }
  });

  it('refuses inputs whose Bosanquet time is outside floating-point range', () => {
    expect(() =>
      bosanquetTime({
        poreRadius: 1e-300,
        surfaceTension: 1e-300,
        contactAngleDeg: 0,
        viscosity: 1e300,
        density: 1e-300,
        length: 1e300,
      }),
    ).toThrow('Bosanquet time: the inputs are outside floating-point range');
  });
});

describe('capillary-break edges', () => {
  it('counts a fringe that just reaches the slab, or just reaches the layer base, as reaching', () => {
    expect(capillaryBreakCheck({ waterTableDepth: 1, soilRise: 1 })).toMatchObject({
      reachesSlab: true,
      soilReachesLayer: false,
    });
    const atBase = capillaryBreakCheck({
      waterTableDepth: 1,
      soilRise: 0.75,
      layer: { thickness: 0.25, rise: 1 },
    });
    expect(atBase).toMatchObject({ soilReachesLayer: true, reachesSlab: true, clearance: 0 });
  });

  it('takes Hazen’s constant at exactly the ends of its range', () => {
    expect(hazenCapillaryRise({ d10: 1e-4, voidRatio: 1, c: 1e-5 })).toBeCloseTo(0.1, 12);
    expect(hazenCapillaryRise({ d10: 1e-4, voidRatio: 1, c: 5e-5 })).toBeCloseTo(0.5, 12);
    expect(() => hazenCapillaryRise({ d10: 1e-4, voidRatio: 1, c: 5.0001e-5 })).toThrow(RangeError);
    expect(() => hazenCapillaryRise({ d10: 1e-4, voidRatio: 1, c: 0.9999e-5 })).toThrow(RangeError);
  });
});
