import { finite, positive } from '../guards.js';

// Water properties along the published correlations, SI out, temperature in °C (t) or K (T).
// Outside a correlation's stated range they throw a RangeError naming the range: a number
// extrapolated past its source is not a number anyone should sign.

const KELVIN_OFFSET = 273.15;

function checkRange(what: string, tC: number, minC: number, maxC: number): void {
  finite('temperatureC', tC);
  if (tC < minC || tC > maxC) {
    throw new RangeError(`${what}: ${tC} °C is outside its range of ${minC}–${maxC} °C`);
  }
}

// IAPWS R1-76(2014), Revised Release on Surface Tension of Ordinary Water Substance:
// σ = B·τ^μ·(1 + b·τ), τ = 1 − T/Tc. The working shown to a visitor is built from these same numbers.
/** IAPWS R1-76(2014) constants: B in N/m, b and μ dimensionless, Tc in K. */
export const IAPWS_R1_76 = { B: 235.8e-3, b: -0.625, mu: 1.256, Tc: 647.096 } as const;
const IAPWS_TC_K = IAPWS_R1_76.Tc;
/** Triple point 273.16 K and critical point 647.096 K, in °C: the range IAPWS R1-76 states. */
export const SURFACE_TENSION_RANGE_C = { min: 0.01, max: IAPWS_TC_K - KELVIN_OFFSET } as const;

/**
 * Surface tension of water against its vapour (≈ air), IAPWS R1-76(2014).
 * @param tC temperature in °C, 0.01–373.946 (triple point to critical point)
 * @returns surface tension in N/m
 * @throws RangeError outside 0.01–373.946 °C
 */
export function waterSurfaceTension(tC: number): number {
  checkRange(
    'water surface tension (IAPWS R1-76)',
    tC,
    SURFACE_TENSION_RANGE_C.min,
    SURFACE_TENSION_RANGE_C.max,
  );
  const tau = 1 - (tC + KELVIN_OFFSET) / IAPWS_TC_K;
  // tau can come out as -1e-16 at the critical point through rounding; σ is 0 there.
  if (tau <= 0) return 0;
  return IAPWS_R1_76.B * tau ** IAPWS_R1_76.mu * (1 + IAPWS_R1_76.b * tau);
}

export type DensityFormulation = 'tanaka-2001' | 'kell-1975';

export interface WaterDensity {
  /** kg/m³ */
  readonly value: number;
  readonly formulation: DensityFormulation;
  /** The formulation's short name; its full citation is among the calculators' references (`shared-texts.ts`). */
  readonly source: string;
}

export const DENSITY_RANGE_C = { min: 0, max: 150 } as const;

/** Tanaka et al. 2001 eq. (1) coefficients: a1, a2, a4 in °C, a3 in °C², a5 in kg/m³. */
export const TANAKA_2001 = {
  a1: -3.983035,
  a2: 301.797,
  a3: 522528.9,
  a4: 69.34881,
  a5: 999.97495,
} as const;

/** Kell 1975: numerator coefficients of t⁰…t⁵ (kg/m³ per °Cⁿ) and the denominator's b (1/°C). */
export const KELL_1975 = {
  a: [999.83952, 16.945176, -7.9870401e-3, -46.170461e-6, 105.56302e-9, -280.54253e-12],
  b: 16.87985e-3,
} as const;

/** IAPWS SR6-08 (2011) liquid water at 0.1 MPa: μ/(μPa·s) = Σ aᵢ·(T/T*)^bᵢ, T* = 300 K. */
export const IAPWS_SR6_08 = {
  a: [280.68, 511.45, 61.131, 0.45903],
  b: [-1.9, -7.7, -19.6, -40],
  Tstar: 300,
} as const;

/**
 * Density of air-free water at atmospheric pressure: Tanaka et al. 2001 from 0 to 40 °C (the
 * metrology standard), Kell 1975 above 40 °C up to 150 °C. The two agree within 0.0033 kg/m³ where
 * they overlap, so the switch at 40 °C leaves no step worth the name.
 * @param tC temperature in °C, 0–150
 * @returns density in kg/m³ with the formulation used and its source
 * @throws RangeError outside 0–150 °C
 */
export function waterDensity(tC: number): WaterDensity {
  checkRange('water density (Tanaka 2001 / Kell 1975)', tC, DENSITY_RANGE_C.min, DENSITY_RANGE_C.max);
  if (tC <= 40) {
    // Tanaka 2001 eq. (1), t in °C: ρ = a5·[1 − (t + a1)²(t + a2) / (a3·(t + a4))]
    const { a1, a2, a3, a4, a5 } = TANAKA_2001;
    const value = a5 * (1 - ((tC + a1) ** 2 * (tC + a2)) / (a3 * (tC + a4)));
    return { value, formulation: 'tanaka-2001', source: 'Tanaka et al. 2001' };
  }
  // Kell 1975, t in °C as printed (IPTS-68). Its offset from ITS-90 is a few hundredths of a kelvin
  // here, under 0.03 kg/m³ even at 100 °C: well inside what a capillarity estimate can resolve.
  const t = tC;
  let numerator = 0;
  KELL_1975.a.forEach((a, n) => {
    numerator += a * t ** n;
  });
  return { value: numerator / (1 + KELL_1975.b * t), formulation: 'kell-1975', source: 'Kell 1975' };
}

/** 253.15–383.15 K in °C: the range of IAPWS SR6-08 for liquid water at 0.1 MPa (incl. metastable states). */
export const VISCOSITY_RANGE_C = { min: -20, max: 110 } as const;

/**
 * Dynamic viscosity of liquid water at 0.1 MPa, IAPWS SR6-08 (2011) "Supplementary Release on
 * Properties of Liquid Water at 0.1 MPa": μ/(μPa·s) = Σ aᵢ (T/300 K)^bᵢ. It stays within 0.0032 %
 * of the full IAPWS 2008 formulation over 0–99 °C (see `iapws2008Viscosity`).
 * @param tC temperature in °C, −20 to 110
 * @returns viscosity in Pa·s
 * @throws RangeError outside −20 to 110 °C
 */
export function waterViscosity(tC: number): number {
  checkRange('water viscosity (IAPWS SR6-08)', tC, VISCOSITY_RANGE_C.min, VISCOSITY_RANGE_C.max);
  const tr = (tC + KELVIN_OFFSET) / IAPWS_SR6_08.Tstar;
  let micro = 0;
  IAPWS_SR6_08.a.forEach((a, i) => {
    micro += a * tr ** (IAPWS_SR6_08.b[i] ?? 0);
  });
  return micro * 1e-6;
}

// IAPWS R12-08 (2008) Release on the IAPWS Formulation 2008 for the Viscosity of Ordinary Water
// Substance, eqs. (10)–(12) with μ₂ = 1 (no critical enhancement, as the release allows for
// industrial use outside the critical region). Reduced by T* = 647.096 K, ρ* = 322 kg/m³, μ* = 1 μPa·s.
const H0 = [1.67752, 2.20462, 0.6366564, -0.241605] as const;
// H[i][j], i = 0…5 (powers of 1/T̄ − 1), j = 0…6 (powers of ρ̄ − 1), Table 2 of the release.
const H1: readonly (readonly number[])[] = [
  [5.20094e-1, 2.22531e-1, -2.81378e-1, 1.61913e-1, -3.25372e-2, 0, 0],
  [8.50895e-2, 9.99115e-1, -9.06851e-1, 2.57399e-1, 0, 0, 0],
  [-1.08374, 1.88797, -7.72479e-1, 0, 0, 0, 0],
  [-2.89555e-1, 1.26613, -4.89837e-1, 0, 6.98452e-2, 0, -4.35673e-3],
  [0, 0, -2.5704e-1, 0, 0, 8.72102e-3, 0],
  [0, 1.20573e-1, 0, 0, 0, 0, -5.93264e-4],
];

/** 253.15–1173.15 K: the temperature span of IAPWS 2008 (its lower edge follows the melting curve). */
export const IAPWS2008_RANGE_K = { min: 253.15, max: 1173.15 } as const;

/**
 * Viscosity of water at a given density and temperature, IAPWS 2008 without the critical
 * enhancement. Use it when the density is known (e.g. from IAPWS-95); `waterViscosity` is the
 * 0.1 MPa shortcut.
 * @param args.density density in kg/m³ (> 0)
 * @param args.temperatureK temperature in K, 253.15–1173.15
 * @returns viscosity in Pa·s
 */
export function iapws2008Viscosity(args: { density: number; temperatureK: number }): number {
  const rho = positive('density', args.density);
  const tK = finite('temperatureK', args.temperatureK);
  if (tK < IAPWS2008_RANGE_K.min || tK > IAPWS2008_RANGE_K.max) {
    throw new RangeError(
      `water viscosity (IAPWS 2008): ${tK} K is outside its range of ${IAPWS2008_RANGE_K.min}–${IAPWS2008_RANGE_K.max} K`,
    );
  }
  const tr = tK / 647.096;
  const rr = rho / 322;
  let sum0 = 0;
  for (let i = 0; i < H0.length; i++) sum0 += (H0[i] ?? 0) / tr ** i;
  const mu0 = (100 * Math.sqrt(tr)) / sum0;
  let outer = 0;
  for (let i = 0; i < H1.length; i++) {
    const row = H1[i] ?? [];
    let inner = 0;
    for (let j = 0; j < row.length; j++) inner += (row[j] ?? 0) * (rr - 1) ** j;
    outer += (1 / tr - 1) ** i * inner;
  }
  const mu1 = Math.exp(rr * outer);
  return mu0 * mu1 * 1e-6;
}

/** The water correlations as one object: `water.surfaceTension(20)` and so on. */
export const water = {
  surfaceTension: waterSurfaceTension,
  density: waterDensity,
  viscosity: waterViscosity,
} as const;
