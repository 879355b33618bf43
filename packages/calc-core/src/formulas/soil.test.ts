import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { capillaryBreakCheck, HAZEN_C_RANGE_M2, hazenCapillaryRise } from './soil.js';

describe("Hazen's capillary rise", () => {
  it('agrees with the formula as Terzaghi & Peck write it in cm (C cm², D10 cm → h cm) and as Smith writes it in mm', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-6, max: 1e-2, noNaN: true }),
        fc.double({ min: 0.2, max: 2, noNaN: true }),
        fc.double({ min: 0.1, max: 0.5, noNaN: true }),
        (d10, e, cCm2) => {
          const hCm = cCm2 / (e * d10 * 100);
          const hMm = (cCm2 * 100) / (e * d10 * 1000);
          const h = hazenCapillaryRise({ d10, voidRatio: e, c: cCm2 * 1e-4 });
          expect(h * 100).toBeCloseTo(hCm, 8);
          expect(h * 1000).toBeCloseTo(hMm, 8);
        },
      ),
    );
  });

  // [soil, D10 m, e, typical rise m, source] — D10 and e are invented typical values for each soil;
  // the typical rise is USGS Heath 1982 (printed). The check: Hazen's band over C = 0.1–0.5 cm² holds it.
  const heath: [string, number, number, number, string][] = [
    ['coarse sand', 0.5e-3, 0.6, 0.125, 'Heath 1982 USGS WSP 2220, printed'],
    ['medium sand', 0.25e-3, 0.6, 0.25, 'Heath 1982 USGS WSP 2220, printed'],
    ['fine sand', 0.1e-3, 0.6, 0.4, 'Heath 1982 USGS WSP 2220, printed'],
    ['silt', 0.02e-3, 0.8, 1.0, 'Heath 1982 USGS WSP 2220, printed'],
  ];
  it.each(heath)('%s (D10 %s m, e %s): band holds the typical %s m (%s)', (_soil, d10, e, typical) => {
    const low = hazenCapillaryRise({ d10, voidRatio: e, c: HAZEN_C_RANGE_M2.min });
    const high = hazenCapillaryRise({ d10, voidRatio: e, c: HAZEN_C_RANGE_M2.max });
    expect(low).toBeLessThanOrEqual(typical);
    expect(high).toBeGreaterThanOrEqual(typical);
  });

  it('falls as the grains coarsen or the voids grow (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-6, max: 1e-2, noNaN: true }),
        fc.double({ min: 1.01, max: 10, noNaN: true }),
        (d10, k) => {
          const c = 3e-5;
          expect(hazenCapillaryRise({ d10: d10 * k, voidRatio: 0.6, c })).toBeLessThan(
            hazenCapillaryRise({ d10, voidRatio: 0.6, c }),
          );
          expect(hazenCapillaryRise({ d10, voidRatio: 0.6 * k, c })).toBeLessThan(
            hazenCapillaryRise({ d10, voidRatio: 0.6, c }),
          );
        },
      ),
    );
  });

  it('refuses C outside the published 0.1–0.5 cm² but accepts its ends as typed', () => {
    expect(() => hazenCapillaryRise({ d10: 1e-4, voidRatio: 0.6, c: 0.6e-4 })).toThrow(/0\.1–0\.5 cm²/);
    expect(() => hazenCapillaryRise({ d10: 1e-4, voidRatio: 0.6, c: 0.05e-4 })).toThrow(RangeError);
    expect(hazenCapillaryRise({ d10: 1e-4, voidRatio: 0.6, c: 0.1 * 1e-4 })).toBeCloseTo(1 / 6, 12);
    expect(() => hazenCapillaryRise({ d10: 0, voidRatio: 0.6, c: 3e-5 })).toThrow(
      expect.objectContaining({ field: 'd10' }),
    );
  });
});

describe('capillary-break check', () => {
  it('slab on soil: the rise reaches the slab when it exceeds the depth to the water table', () => {
    expect(capillaryBreakCheck({ waterTableDepth: 1, soilRise: 0.4 })).toMatchObject({
      clearance: 0.6,
      reachesSlab: false,
    });
    const wet = capillaryBreakCheck({ waterTableDepth: 1, soilRise: 1.3 });
    expect(wet.reachesSlab).toBe(true);
    expect(wet.clearance).toBeCloseTo(-0.3, 12);
  });

  it('a coarse layer stops a fringe that reaches its base; the clearance is then the layer thickness', () => {
    const r = capillaryBreakCheck({
      waterTableDepth: 1,
      soilRise: 2,
      layer: { thickness: 0.15, rise: 0.01 },
    });
    expect(r).toMatchObject({ reachesSlab: false, soilReachesLayer: true });
    expect(r.clearance).toBeCloseTo(0.15, 12);
  });

  it('a fine layer fails: its own rise from the water table reaches the slab', () => {
    const r = capillaryBreakCheck({
      waterTableDepth: 0.5,
      soilRise: 2,
      layer: { thickness: 0.15, rise: 0.6 },
    });
    expect(r.reachesSlab).toBe(true);
    expect(r.clearance).toBeCloseTo(-0.1, 12);
  });

  it('a fringe that stops short of the layer leaves the full gap, whatever the layer', () => {
    const r = capillaryBreakCheck({
      waterTableDepth: 2,
      soilRise: 0.5,
      layer: { thickness: 0.15, rise: 0.01 },
    });
    expect(r).toMatchObject({ soilReachesLayer: false, reachesSlab: false });
    expect(r.clearance).toBeCloseTo(1.5, 12);
  });

  it('never reports more clearance with a deeper water table taken away (fast-check: monotonic in depth)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 5, noNaN: true }),
        fc.double({ min: 0, max: 5, noNaN: true }),
        fc.double({ min: 0.01, max: 1, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.double({ min: 0.001, max: 1, noNaN: true }),
        (depth, soilRise, thickness, layerRise, more) => {
          const a = capillaryBreakCheck({
            waterTableDepth: depth,
            soilRise,
            layer: { thickness, rise: layerRise },
          });
          const b = capillaryBreakCheck({
            waterTableDepth: depth + more,
            soilRise,
            layer: { thickness, rise: layerRise },
          });
          expect(b.clearance).toBeGreaterThanOrEqual(a.clearance - 1e-12);
          expect(a.reachesSlab).toBe(a.clearance <= 0);
        },
      ),
    );
  });

  it('agrees with a march up a layered profile (independent route, fast-check)', () => {
    // Independent route: step up from the water table in 0.1 mm steps; a point is wet while its
    // height is below the capillary height of the material there and every point below it is wet
    // (water arrives only through the material beneath). The top of the wet run is the wet zone.
    const march = (depth: number, soilRise: number, t: number, layerRise: number): number => {
      const base = Math.max(depth - t, 0);
      const dz = 1e-4;
      let z = 0;
      for (;;) {
        const next = z + dz;
        const h = next <= base ? soilRise : layerRise;
        if (next > h || next > depth + 1) return z;
        z = next;
      }
    };
    fc.assert(
      fc.property(
        fc.double({ min: 0.2, max: 2, noNaN: true }),
        fc.double({ min: 0, max: 2, noNaN: true }),
        fc.double({ min: 0.05, max: 0.5, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (depth, soilRise, t, layerRise) => {
          const r = capillaryBreakCheck({
            waterTableDepth: depth,
            soilRise,
            layer: { thickness: t, rise: layerRise },
          });
          const top = Math.min(march(depth, soilRise, t, layerRise), depth);
          expect(Math.min(r.wetZoneTop, depth)).toBeCloseTo(top, 3);
        },
      ),
      { numRuns: 60 },
    );
    // The case of issue 10 by hand: the soil fringe (0.05 m) stops 0.80 m below a layer whose own
    // rise (0.25 m) would end below its base (0.85 m): the layer stays dry, clearance 0.95 m.
    expect(march(1, 0.05, 0.15, 0.25)).toBeCloseTo(0.05, 3);
    expect(
      capillaryBreakCheck({ waterTableDepth: 1, soilRise: 0.05, layer: { thickness: 0.15, rise: 0.25 } })
        .clearance,
    ).toBeCloseTo(0.95, 12);
  });
});
