import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { iapws2008Viscosity, water, waterDensity, waterSurfaceTension, waterViscosity } from './water.js';

describe('water surface tension, IAPWS R1-76(2014)', () => {
  // [t °C, σ mN/m as printed, tolerance mN/m, source]. The table is printed to 2 decimals, so the
  // formula must land within half a unit of the last place.
  const table: [number, number, number, string][] = [
    [0.01, 75.65, 0.005, 'IAPWS R1-76(2014) Table 1'],
    [10, 74.22, 0.005, 'IAPWS R1-76(2014) Table 1'],
    [20, 72.74, 0.005, 'IAPWS R1-76(2014) Table 1'],
    [40, 69.6, 0.005, 'IAPWS R1-76(2014) Table 1'],
    [50, 67.94, 0.005, 'IAPWS R1-76(2014) Table 1'],
    [60, 66.24, 0.005, 'IAPWS R1-76(2014) Table 1'],
    [80, 62.67, 0.005, 'IAPWS R1-76(2014) Table 1'],
    [100, 58.91, 0.005, 'IAPWS R1-76(2014) Table 1'],
    [200, 37.67, 0.005, 'IAPWS R1-76(2014) Table 1'],
    [300, 14.36, 0.005, 'IAPWS R1-76(2014) Table 1'],
    [370, 0.39, 0.005, 'IAPWS R1-76(2014) Table 1'],
  ];
  it.each(table)('%s °C → %s mN/m ±%s (%s)', (t, expected, tol) => {
    expect(Math.abs(waterSurfaceTension(t) * 1000 - expected)).toBeLessThanOrEqual(tol);
  });

  it('is zero at the critical point and refuses anything past it (IAPWS R1-76: Tc = 647.096 K)', () => {
    expect(waterSurfaceTension(647.096 - 273.15)).toBe(0);
    expect(() => waterSurfaceTension(374)).toThrow(RangeError);
    expect(() => waterSurfaceTension(374)).toThrow(/0\.01–373\.946 °C/);
  });

  it('does not extrapolate below the triple point (IAPWS R1-76 range starts at 0.01 °C)', () => {
    expect(() => waterSurfaceTension(0)).toThrow(RangeError);
    expect(() => waterSurfaceTension(-5)).toThrow(/outside its range/);
  });

  it('falls as temperature rises across its whole range', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.01, max: 373.9, noNaN: true }),
        fc.double({ min: 0.001, max: 10, noNaN: true }),
        (t, dt) => {
          const t2 = Math.min(t + dt, 373.946);
          expect(waterSurfaceTension(t2)).toBeLessThan(waterSurfaceTension(t));
        },
      ),
    );
  });

  it('names the argument for a non-number', () => {
    expect(() => waterSurfaceTension(Number.NaN)).toThrow(/temperatureC/);
  });
});

describe('water density, Tanaka 2001 and Kell 1975', () => {
  // [t °C, ρ kg/m³, tolerance, source]
  const tanaka: [number, number, number, string][] = [
    [0, 999.8428, 5e-5, 'Tanaka 2001 eq. (1) evaluated by hand with its printed coefficients'],
    [4, 999.9749, 5e-5, 'Tanaka 2001 eq. (1) evaluated by hand with its printed coefficients'],
    [10, 999.7027, 5e-5, 'Tanaka 2001 eq. (1) evaluated by hand with its printed coefficients'],
    [20, 998.2067, 5e-5, 'Tanaka 2001 eq. (1) evaluated by hand with its printed coefficients'],
    [25, 997.047, 5e-5, 'Tanaka 2001 eq. (1) evaluated by hand with its printed coefficients'],
    [30, 995.6488, 5e-5, 'Tanaka 2001 eq. (1) evaluated by hand with its printed coefficients'],
    [40, 992.2152, 5e-5, 'Tanaka 2001 eq. (1) evaluated by hand with its printed coefficients'],
  ];
  it.each(tanaka)('Tanaka: %s °C → %s kg/m³ ±%s (%s)', (t, expected, tol) => {
    const d = waterDensity(t);
    expect(d.formulation).toBe('tanaka-2001');
    expect(Math.abs(d.value - expected)).toBeLessThanOrEqual(tol);
  });

  const kell: [number, number, number, string][] = [
    [100, 958.3637, 5e-5, 'Kell 1975 table, printed'],
    [150, 916.829, 5e-4, 'Kell 1975 table, printed'],
  ];
  it.each(kell)('Kell: %s °C → %s kg/m³ ±%s (%s)', (t, expected, tol) => {
    const d = waterDensity(t);
    expect(d.formulation).toBe('kell-1975');
    expect(d.source).toMatch(/Kell/);
    expect(Math.abs(d.value - expected)).toBeLessThanOrEqual(tol);
  });

  it('has its maximum at 3.983 °C, Tanaka’s a₁ (Tanaka 2001, printed)', () => {
    const at = (t: number): number => waterDensity(t).value;
    expect(at(3.983035)).toBeGreaterThan(at(3.9));
    expect(at(3.983035)).toBeGreaterThan(at(4.07));
  });

  it('switches formulation at 40 °C with a step under 0.001 kg/m³ (Kell within 0.0033 of Tanaka over 0–40 °C, computed from both printed formulas)', () => {
    const below = waterDensity(40).value;
    const above = waterDensity(40 + 1e-9).value;
    expect(waterDensity(40 + 1e-9).formulation).toBe('kell-1975');
    expect(Math.abs(above - below)).toBeLessThan(0.001);
  });

  it('refuses temperatures outside 0–150 °C, naming the range', () => {
    expect(() => waterDensity(-0.5)).toThrow(/0–150 °C/);
    expect(() => waterDensity(151)).toThrow(RangeError);
  });
});

describe('water viscosity, IAPWS 2008 and SR6-08', () => {
  // [ρ kg/m³, T K, μ μPa·s, tolerance μPa·s, source]
  const checks: [number, number, number, number, string][] = [
    [998, 298.15, 889.7351, 1e-6, 'IAPWS R12-08 Table 4 (μ₂ = 1), printed'],
    [1200, 298.15, 1437.649467, 1e-6, 'IAPWS R12-08 Table 4 (μ₂ = 1), printed'],
    [1000, 373.15, 307.883622, 1e-6, 'IAPWS R12-08 Table 4 (μ₂ = 1), printed'],
  ];
  it.each(checks)('IAPWS 2008: ρ = %s, T = %s K → %s μPa·s ±%s (%s)', (rho, T, expected, tol) => {
    expect(
      Math.abs(iapws2008Viscosity({ density: rho, temperatureK: T }) * 1e6 - expected),
    ).toBeLessThanOrEqual(tol);
  });

  it('SR6-08: 298.15 K → 889.996774 μPa·s ±1e-6 (IAPWS SR6-08 check value, printed)', () => {
    expect(Math.abs(waterViscosity(25) * 1e6 - 889.996774)).toBeLessThanOrEqual(1e-6);
  });

  it('SR6-08: 20 °C → 1.0016 mPa·s ±0.0001 (ISO/TR 3666, from memory)', () => {
    expect(Math.abs(waterViscosity(20) * 1e3 - 1.0016)).toBeLessThanOrEqual(1e-4);
  });

  it('SR6-08 stays within 0.0035 % of IAPWS 2008 at atmospheric pressure over 0–99 °C (REFERENCES.md: ≈0.003 %, computed)', () => {
    let worst = 0;
    for (let t = 0; t <= 99; t += 0.5) {
      const full = iapws2008Viscosity({ density: waterDensity(t).value, temperatureK: t + 273.15 });
      worst = Math.max(worst, Math.abs(waterViscosity(t) / full - 1));
    }
    expect(worst).toBeLessThan(3.5e-5);
  });

  it('refuses temperatures outside SR6-08’s 253.15–383.15 K', () => {
    expect(() => waterViscosity(-21)).toThrow(/-20–110 °C/);
    expect(() => waterViscosity(111)).toThrow(RangeError);
    expect(() => iapws2008Viscosity({ density: 1000, temperatureK: 200 })).toThrow(/253\.15–1173\.15 K/);
  });

  it('falls as temperature rises over the liquid range', () => {
    fc.assert(
      fc.property(fc.double({ min: -20, max: 109, noNaN: true }), (t) => {
        expect(waterViscosity(t + 1)).toBeLessThan(waterViscosity(t));
      }),
    );
  });

  it('is reachable as water.viscosity, water.density, water.surfaceTension', () => {
    expect(water.viscosity(25)).toBe(waterViscosity(25));
    expect(water.density(25).value).toBe(waterDensity(25).value);
    expect(water.surfaceTension(25)).toBe(waterSurfaceTension(25));
  });
});
