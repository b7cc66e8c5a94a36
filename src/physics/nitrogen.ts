/**
 * Nitrogen properties from the reference equation of state of
 *   R. Span, E. W. Lemmon, R. T Jacobsen, W. Wagner, A. Yokozeki, "A Reference Equation of State for the
 *   Thermodynamic Properties of Nitrogen for Temperatures from 63.151 to 1000 K and Pressures to
 *   2200 MPa", J. Phys. Chem. Ref. Data 29(6):1361–1433 (2000), doi:10.1063/1.1349047.
 *
 * The equation gives the molar Helmholtz energy a(ρ, T) = R·T·[α⁰(δ, τ) + αʳ(δ, τ)] with δ = ρ/ρc and
 * τ = Tc/T. Every property is a combination of α and its derivatives (the paper's Table 3): pressure is
 * explicit in (ρ, T); density from (P, T) is found by a bracketed Newton iteration.
 *
 * The "ideal" model is the same equation with the residual part αʳ set to zero: an ideal gas with the
 * real temperature-dependent ideal-gas heat capacity cp⁰(T) (docs/methods.md §3).
 *
 * Units: SI throughout (Pa absolute, K, mol/m³, J/mol, J/(mol·K), m/s).
 */
import { InputError } from "../errors.js";
import { kToC } from "../units/index.js";

// ---------------------------------------------------------------------------------------------------
// Constants and coefficients, transcribed from Span et al. (2000) (copy kept in
// ../shared/reference/nitrogen-span2000.json; the program never reads that file).
// ---------------------------------------------------------------------------------------------------

/** Molar gas constant used by the equation, J/(mol·K) (Span et al. 2000). */
export const N2_GAS_CONSTANT_J_MOLK = 8.31451;
/** Molar mass of nitrogen, kg/mol (Span et al. 2000: 28.01348 g/mol). */
export const N2_MOLAR_MASS_KG_MOL = 0.02801348;
/** Critical temperature, K. */
export const N2_CRITICAL_TEMP_K = 126.192;
/** Critical density, mol/m³ (11.1839 mol/dm³). */
export const N2_CRITICAL_DENSITY_MOL_M3 = 11183.9;
/** Validity range of the equation (title of the paper). */
export const N2_MIN_TEMP_K = 63.151;
export const N2_MAX_TEMP_K = 1000;
export const N2_MAX_PRESSURE_PA = 2200e6;

const R = N2_GAS_CONSTANT_J_MOLK;
const TC = N2_CRITICAL_TEMP_K;
const RHOC = N2_CRITICAL_DENSITY_MOL_M3;

/** Ideal-gas part: α⁰ = ln δ + a1·ln τ + a2 + a3·τ + a4/τ + a5/τ² + a6/τ³ + a7·ln(1 − exp(−a8·τ)). */
const A1 = 2.5;
const A2 = -12.76952708;
const A3 = -0.00784163;
const A4 = -0.0001934819;
const A5 = -1.247742e-5;
const A6 = 6.678326e-8;
const A7 = 1.012941;
const A8 = 26.65788;

/**
 * Residual part, 36 terms: 6 polynomial n·δ^d·τ^t, 26 exponential n·δ^d·τ^t·exp(−δ^c) and 4 Gaussian
 * n·δ^d·τ^t·exp(−φ(δ − 1)² − β(τ − γ)²) terms.
 */
const N_POLY = 6;
const N_EXP = 26;
const N_GAUSS = 4;
const N_TERMS = N_POLY + N_EXP + N_GAUSS;

const RES_N = new Float64Array([
  // polynomial
  0.924803575275, -0.492448489428, 0.661883336938, -1.92902649201, -0.0622469309629, 0.349943957581,
  // exponential
  0.564857472498, -1.61720005987, -0.481395031883, 0.421150636384, -0.0161962230825, 0.172100994165,
  0.00735448924933, 0.0168077305479, -0.00107626664179, -0.0137318088513, 0.000635466899859, 0.00304432279419,
  -0.0435762336045, -0.0723174889316, 0.0389644315272, -0.021220136391, 0.00408822981509, -5.51990017984e-5,
  -0.0462016716479, -0.00300311716011, 0.0368825891208, -0.0025585684622, 0.00896915264558, -0.0044151337035,
  0.00133722924858, 0.000264832491957,
  // Gaussian
  19.6688194015, -20.911560073, 0.0167788306989, 2627.67566274,
]);
const RES_D = new Int32Array([
  1, 1, 2, 2, 3, 3, 1, 1, 1, 3, 3, 4, 6, 6, 7, 7, 8, 8, 1, 2, 3, 4, 5, 8, 4, 5, 5, 8, 3, 5, 6, 9, 1, 1, 3, 2,
]);
const RES_T = new Float64Array([
  0.25, 0.875, 0.5, 0.875, 0.375, 0.75, 0.5, 0.75, 2.0, 1.25, 3.5, 1.0, 0.5, 3.0, 0.0, 2.75, 0.75, 2.5, 4.0,
  6.0, 6.0, 3.0, 3.0, 6.0, 16.0, 11.0, 15.0, 12.0, 12.0, 7.0, 4.0, 16.0, 0.0, 1.0, 2.0, 3.0,
]);
/** Exponent c of exp(−δ^c) for the 26 exponential terms. */
const RES_C = new Int32Array([1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 2, 2, 2, 2, 2, 2, 3, 3, 3, 3, 4, 4, 4, 4]);
const GAUSS_PHI = new Float64Array([20, 20, 15, 25]);
const GAUSS_BETA = new Float64Array([325, 325, 300, 275]);
const GAUSS_GAMMA = new Float64Array([1.16, 1.16, 1.13, 1.25]);

// ---------------------------------------------------------------------------------------------------
// Evaluation of α and its derivatives. Scaled derivatives avoid divisions at δ → 0:
//   ar = αʳ, d1 = δ·αʳ_δ, d2 = δ²·αʳ_δδ, t1 = τ·αʳ_τ, t2 = τ²·αʳ_ττ, dt = δ·τ·αʳ_δτ.
// The τ-dependent factors are cached for the last temperature: a Newton iteration in density at fixed
// temperature (the common case) then costs only the δ-dependent part.
// ---------------------------------------------------------------------------------------------------

const tauA = new Float64Array(N_TERMS); // n·τ^t (× Gaussian τ factor)
const tauA1 = new Float64Array(N_TERMS); // τ·∂/∂τ of the above
const tauA2 = new Float64Array(N_TERMS); // τ²·∂²/∂τ² of the above
let cachedTau = Number.NaN;

/** Every exponent t is a multiple of 1/8 (≤ 16): τ^t = τ^⌊t⌋ · τ^(k/8), from square roots and products. */
const T_INT = Int32Array.from(RES_T, (t) => Math.floor(t));
const T_EIGHTHS = Int32Array.from(RES_T, (t) => Math.round((t - Math.floor(t)) * 8));
const tauInt = new Float64Array(17);
const tauFrac = new Float64Array(8);

function prepareTau(tau: number): void {
  if (tau === cachedTau) return;
  tauInt[0] = 1;
  for (let k = 1; k <= 16; k++) tauInt[k] = tauInt[k - 1]! * tau;
  const r2 = Math.sqrt(tau);
  const r4 = Math.sqrt(r2);
  const r8 = Math.sqrt(r4);
  tauFrac[0] = 1;
  tauFrac[1] = r8;
  tauFrac[2] = r4;
  tauFrac[3] = r4 * r8;
  tauFrac[4] = r2;
  tauFrac[5] = r2 * r8;
  tauFrac[6] = r2 * r4;
  tauFrac[7] = r2 * r4 * r8;
  for (let i = 0; i < N_POLY + N_EXP; i++) {
    const t = RES_T[i]!;
    const a = RES_N[i]! * tauInt[T_INT[i]!]! * tauFrac[T_EIGHTHS[i]!]!;
    tauA[i] = a;
    tauA1[i] = t * a;
    tauA2[i] = t * (t - 1) * a;
  }
  for (let k = 0; k < N_GAUSS; k++) {
    const i = N_POLY + N_EXP + k;
    const t = RES_T[i]!;
    const beta = GAUSS_BETA[k]!;
    const dTau = tau - GAUSS_GAMMA[k]!;
    const a = RES_N[i]! * tauInt[T_INT[i]!]! * tauFrac[T_EIGHTHS[i]!]! * Math.exp(-beta * dTau * dTau);
    const g = t - 2 * beta * tau * dTau; // τ·(ln A)_τ
    tauA[i] = a;
    tauA1[i] = g * a;
    tauA2[i] = (g * g - t - 2 * beta * tau * tau) * a;
  }
  cachedTau = tau;
}

/** Result slots of {@link residual}: [ar, d1, d2, t1, t2, dt]. Shared scratch, read immediately. */
const RES = new Float64Array(6);
const deltaPow = new Float64Array(10);

/** Fills RES with the scaled residual derivatives at (δ, τ). */
function residual(delta: number, tau: number): void {
  prepareTau(tau);
  deltaPow[0] = 1;
  for (let k = 1; k < 10; k++) deltaPow[k] = deltaPow[k - 1]! * delta;
  let ar = 0;
  let d1 = 0;
  let d2 = 0;
  let t1 = 0;
  let t2 = 0;
  let dt = 0;
  for (let i = 0; i < N_POLY; i++) {
    const d = RES_D[i]!;
    const b = deltaPow[d]!;
    const a = tauA[i]!;
    const ab = a * b;
    ar += ab;
    d1 += d * ab;
    d2 += d * (d - 1) * ab;
    t1 += tauA1[i]! * b;
    t2 += tauA2[i]! * b;
    dt += d * tauA1[i]! * b;
  }
  // exp(−δ^c) for c = 1…4
  const e1 = Math.exp(-delta);
  const dc2 = deltaPow[2]!;
  const dc3 = deltaPow[3]!;
  const dc4 = deltaPow[4]!;
  const e2 = Math.exp(-dc2);
  const e3 = Math.exp(-dc3);
  const e4 = Math.exp(-dc4);
  for (let j = 0; j < N_EXP; j++) {
    const i = N_POLY + j;
    const d = RES_D[i]!;
    const c = RES_C[j]!;
    const dcc = c === 1 ? delta : c === 2 ? dc2 : c === 3 ? dc3 : dc4;
    const e = c === 1 ? e1 : c === 2 ? e2 : c === 3 ? e3 : e4;
    const b = deltaPow[d]! * e;
    const g = d - c * dcc; // δ·(ln B)_δ
    const bd1 = g * b;
    const bd2 = (g * (g - 1) - c * c * dcc) * b;
    const a = tauA[i]!;
    ar += a * b;
    d1 += a * bd1;
    d2 += a * bd2;
    t1 += tauA1[i]! * b;
    t2 += tauA2[i]! * b;
    dt += tauA1[i]! * bd1;
  }
  const dm1 = delta - 1;
  for (let k = 0; k < N_GAUSS; k++) {
    const i = N_POLY + N_EXP + k;
    const d = RES_D[i]!;
    const phi = GAUSS_PHI[k]!;
    const b = deltaPow[d]! * Math.exp(-phi * dm1 * dm1);
    const g = d - 2 * phi * delta * dm1;
    const bd1 = g * b;
    const bd2 = (g * g - d - 2 * phi * delta * delta) * b;
    const a = tauA[i]!;
    ar += a * b;
    d1 += a * bd1;
    d2 += a * bd2;
    t1 += tauA1[i]! * b;
    t2 += tauA2[i]! * b;
    dt += tauA1[i]! * bd1;
  }
  RES[0] = ar;
  RES[1] = d1;
  RES[2] = d2;
  RES[3] = t1;
  RES[4] = t2;
  RES[5] = dt;
}

/** Ideal-gas part without the ln δ term: α⁰ − ln δ. */
function ideal0(tau: number): number {
  return (
    A1 * Math.log(tau) +
    A2 +
    A3 * tau +
    A4 / tau +
    A5 / (tau * tau) +
    A6 / (tau * tau * tau) +
    A7 * Math.log(1 - Math.exp(-A8 * tau))
  );
}
/** τ·α⁰_τ. */
function ideal1(tau: number): number {
  return (
    A1 +
    A3 * tau -
    A4 / tau -
    (2 * A5) / (tau * tau) -
    (3 * A6) / (tau * tau * tau) +
    (A7 * A8 * tau) / Math.expm1(A8 * tau)
  );
}
/** τ²·α⁰_ττ. */
function ideal2(tau: number): number {
  const x = A8 * tau;
  const em = Math.expm1(x);
  return (
    -A1 +
    (2 * A4) / tau +
    (6 * A5) / (tau * tau) +
    (12 * A6) / (tau * tau * tau) -
    (A7 * x * x * (em + 1)) / (em * em)
  );
}

// ---------------------------------------------------------------------------------------------------
// Validation
// ---------------------------------------------------------------------------------------------------

function checkTemp(tempK: number): void {
  if (!(tempK >= N2_MIN_TEMP_K && tempK <= N2_MAX_TEMP_K)) {
    throw new InputError(
      `tempK: ${tempK} K (${fmt(kToC(tempK))} °C) is outside the nitrogen equation's validity range ${N2_MIN_TEMP_K}–${N2_MAX_TEMP_K} K`,
    );
  }
}
function checkDensity(densityMolM3: number): void {
  if (!(densityMolM3 >= 0 && Number.isFinite(densityMolM3))) {
    throw new InputError(`densityMolM3: ${densityMolM3} mol/m³ is not a physical density (expected ≥ 0)`);
  }
}
function checkPressure(pressurePa: number): void {
  if (!(pressurePa > 0 && pressurePa <= N2_MAX_PRESSURE_PA)) {
    throw new InputError(
      `pressurePa: ${pressurePa} Pa absolute is outside the nitrogen equation's range (above 0, up to ${N2_MAX_PRESSURE_PA / 1e6} MPa)`,
    );
  }
}
function fmt(x: number): string {
  return Number.isFinite(x) ? String(Math.round(x * 1000) / 1000) : String(x);
}

// ---------------------------------------------------------------------------------------------------
// Gas model interface
// ---------------------------------------------------------------------------------------------------

/** Options for the density search. */
export interface DensityOptions {
  /** Starting density for the Newton search, mol/m³ (e.g. a liquid-like value below the critical temperature). */
  guessMolM3?: number;
}

/** A nitrogen property model. SI units: Pa absolute, K, mol/m³, J/mol, J/(mol·K), m/s. */
export interface GasModel {
  readonly kind: "real" | "ideal" | "table";
  pressurePa(densityMolM3: number, tempK: number): number;
  /**
   * Pressure and its slope ∂P/∂ρ at constant temperature in one evaluation, written into `out`:
   * out[0] = P (Pa), out[1] = ∂P/∂ρ (Pa·m³/mol). Used by Newton iterations in hot loops; no allocation.
   */
  pressureAndSlope(densityMolM3: number, tempK: number, out: Float64Array): void;
  /** Density from pressure by Newton iteration in a safe bracket; below Tc the stable phase is returned. */
  densityMolM3(pressurePa: number, tempK: number, options?: DensityOptions): number;
  /**
   * Several properties from one evaluation of the equation, written into `out` (length ≥ 6):
   * [P (Pa), ∂P/∂ρ at constant T, ∂P/∂T at constant ρ (Pa/K), s (J/(mol·K)), u (J/mol), cv (J/(mol·K))].
   */
  stateProperties(densityMolM3: number, tempK: number, out: Float64Array): void;
  compressibility(densityMolM3: number, tempK: number): number;
  internalEnergyJMol(densityMolM3: number, tempK: number): number;
  entropyJMolK(densityMolM3: number, tempK: number): number;
  /** Helmholtz energy a = u − T·s, J/mol (isothermal work: ∫P dV = n·(a₁ − a₂)). */
  helmholtzJMol(densityMolM3: number, tempK: number): number;
  cvJMolK(densityMolM3: number, tempK: number): number;
  cpJMolK(densityMolM3: number, tempK: number): number;
  speedOfSoundMS(densityMolM3: number, tempK: number): number;
}

/** Scaled residual derivatives for a model: zero for the ideal model. */
function evalResidual(withResidual: boolean, densityMolM3: number, tempK: number): void {
  if (withResidual) residual(densityMolM3 / RHOC, TC / tempK);
  else RES.fill(0);
}

function makeHelmholtzModel(kind: "real" | "ideal"): GasModel {
  const withResidual = kind === "real";

  const pressurePa = (densityMolM3: number, tempK: number): number => {
    checkDensity(densityMolM3);
    checkTemp(tempK);
    evalResidual(withResidual, densityMolM3, tempK);
    return densityMolM3 * R * tempK * (1 + RES[1]!);
  };
  const pressureAndSlope = (densityMolM3: number, tempK: number, out: Float64Array): void => {
    checkDensity(densityMolM3);
    checkTemp(tempK);
    evalResidual(withResidual, densityMolM3, tempK);
    out[0] = densityMolM3 * R * tempK * (1 + RES[1]!);
    out[1] = R * tempK * (1 + 2 * RES[1]! + RES[2]!);
  };

  const densityMolM3 = (pressurePa: number, tempK: number, options?: DensityOptions): number => {
    checkPressure(pressurePa);
    checkTemp(tempK);
    if (!withResidual) return pressurePa / (R * tempK);
    return realDensity(pressurePa, tempK, options?.guessMolM3);
  };

  const model: GasModel = {
    kind,
    pressurePa,
    pressureAndSlope,
    densityMolM3,
    stateProperties(rho, tempK, out) {
      checkDensity(rho);
      checkTemp(tempK);
      if (!(rho > 0)) throw new InputError(`densityMolM3: ${rho} mol/m³ must be above 0 for an entropy`);
      evalResidual(withResidual, rho, tempK);
      const tau = TC / tempK;
      const rt = R * tempK;
      const i1 = ideal1(tau);
      out[0] = rho * rt * (1 + RES[1]!);
      out[1] = rt * (1 + 2 * RES[1]! + RES[2]!);
      out[2] = rho * R * (1 + RES[1]! - RES[5]!);
      out[3] = R * (i1 + RES[3]! - Math.log(rho / RHOC) - ideal0(tau) - RES[0]!);
      out[4] = rt * (i1 + RES[3]!);
      out[5] = -R * (ideal2(tau) + RES[4]!);
    },
    compressibility(rho, tempK) {
      checkDensity(rho);
      checkTemp(tempK);
      evalResidual(withResidual, rho, tempK);
      return 1 + RES[1]!;
    },
    internalEnergyJMol(rho, tempK) {
      checkDensity(rho);
      checkTemp(tempK);
      evalResidual(withResidual, rho, tempK);
      const tau = TC / tempK;
      return R * tempK * (ideal1(tau) + RES[3]!);
    },
    entropyJMolK(rho, tempK) {
      checkDensity(rho);
      checkTemp(tempK);
      if (!(rho > 0)) throw new InputError(`densityMolM3: ${rho} mol/m³ must be above 0 for an entropy`);
      evalResidual(withResidual, rho, tempK);
      const tau = TC / tempK;
      const alpha0 = Math.log(rho / RHOC) + ideal0(tau);
      return R * (ideal1(tau) + RES[3]! - alpha0 - RES[0]!);
    },
    helmholtzJMol(rho, tempK) {
      checkDensity(rho);
      checkTemp(tempK);
      if (!(rho > 0))
        throw new InputError(`densityMolM3: ${rho} mol/m³ must be above 0 for a Helmholtz energy`);
      evalResidual(withResidual, rho, tempK);
      const tau = TC / tempK;
      return R * tempK * (Math.log(rho / RHOC) + ideal0(tau) + RES[0]!);
    },
    cvJMolK(rho, tempK) {
      checkDensity(rho);
      checkTemp(tempK);
      evalResidual(withResidual, rho, tempK);
      return -R * (ideal2(TC / tempK) + RES[4]!);
    },
    cpJMolK(rho, tempK) {
      checkDensity(rho);
      checkTemp(tempK);
      evalResidual(withResidual, rho, tempK);
      const cvR = -(ideal2(TC / tempK) + RES[4]!);
      const num = 1 + RES[1]! - RES[5]!;
      return R * (cvR + (num * num) / (1 + 2 * RES[1]! + RES[2]!));
    },
    speedOfSoundMS(rho, tempK) {
      checkDensity(rho);
      checkTemp(tempK);
      evalResidual(withResidual, rho, tempK);
      const cvR = -(ideal2(TC / tempK) + RES[4]!);
      const num = 1 + RES[1]! - RES[5]!;
      const w2 = ((R * tempK) / N2_MOLAR_MASS_KG_MOL) * (1 + 2 * RES[1]! + RES[2]! + (num * num) / cvR);
      return Math.sqrt(w2);
    },
  };
  return model;
}

// ---------------------------------------------------------------------------------------------------
// Density from pressure (real gas)
// ---------------------------------------------------------------------------------------------------

/** Pressure and ∂P/∂ρ of the full real-gas equation without validation (internal hot path). */
function realPressureAndSlope(rho: number, tempK: number): number {
  residual(rho / RHOC, TC / tempK);
  slopeScratch = R * tempK * (1 + 2 * RES[1]! + RES[2]!);
  return rho * R * tempK * (1 + RES[1]!);
}
let slopeScratch = 0;

/**
 * Newton iteration on P(ρ) = target, kept inside a bracket [lo, hi] with P(lo) < target < P(hi); a step
 * that leaves the bracket, or meets a non-positive slope, is replaced by bisection. Returns NaN if no
 * mechanically stable root (∂P/∂ρ > 0) is found.
 */
function bracketedNewton(target: number, tempK: number, start: number, hiStart: number): number {
  let lo = 0;
  let hi = hiStart;
  let rho = Math.min(Math.max(start, 0), hi);
  for (let iter = 0; iter < 200; iter++) {
    const p = realPressureAndSlope(rho, tempK);
    const slope = slopeScratch;
    const f = p - target;
    if (f < 0) lo = Math.max(lo, rho);
    else hi = Math.min(hi, rho);
    if (Math.abs(f) <= 1e-13 * target) return slope > 0 ? rho : Number.NaN;
    let next = slope > 0 ? rho - f / slope : Number.NaN;
    if (!(next > lo && next < hi)) {
      // Bisect inside a known bracket; without an upper bound yet, step outward.
      next = Number.isFinite(hi) ? 0.5 * (lo + hi) : Math.max(2 * rho, 1000);
      if (next > 2e5) return Number.NaN;
    }
    if (Math.abs(next - rho) <= 1e-13 * rho) return slope > 0 ? next : Number.NaN;
    rho = next;
  }
  return slopeScratch > 0 ? rho : Number.NaN;
}

/** Molar Gibbs energy over R·T without the ideal temperature-only part: ln δ + αʳ + Z (phase choice). */
function reducedGibbsSansIdealT(rho: number, tempK: number): number {
  residual(rho / RHOC, TC / tempK);
  return Math.log(rho / RHOC) + RES[0]! + 1 + RES[1]!;
}

function realDensity(pressurePa: number, tempK: number, guess?: number): number {
  const idealGuess = pressurePa / (R * tempK);
  if (tempK >= TC) {
    // Above the critical temperature P(ρ) rises monotonically: one root, no upper bound needed up front.
    const root = bracketedNewton(pressurePa, tempK, guess ?? idealGuess, Number.POSITIVE_INFINITY);
    if (Number.isNaN(root)) {
      throw new InputError(
        `pressurePa: ${pressurePa} Pa at ${tempK} K is beyond the equation's density range`,
      );
    }
    return root;
  }
  // Upper bracket: a density where the equation's pressure exceeds the target.
  let hi = 40000;
  while (realPressureAndSlope(hi, tempK) <= pressurePa) {
    hi *= 1.25;
    if (hi > 1e5) {
      throw new InputError(
        `pressurePa: ${pressurePa} Pa at ${tempK} K is beyond the equation's density range`,
      );
    }
  }
  // Below the critical temperature there can be a vapour-like and a liquid-like root: search from both
  // sides (and from the caller's guess) and keep the mechanically stable root of lowest Gibbs energy.
  const starts = [idealGuess, hi * 0.999];
  if (guess !== undefined) starts.push(guess);
  let best = Number.NaN;
  let bestG = Number.POSITIVE_INFINITY;
  for (const s of starts) {
    const root = bracketedNewton(pressurePa, tempK, s, hi);
    if (Number.isNaN(root)) continue;
    const g = reducedGibbsSansIdealT(root, tempK);
    if (g < bestG) {
      bestG = g;
      best = root;
    }
  }
  if (Number.isNaN(best)) throw new Error(`density search failed at ${pressurePa} Pa, ${tempK} K`);
  return best;
}

// ---------------------------------------------------------------------------------------------------
// Public models
// ---------------------------------------------------------------------------------------------------

/** Nitrogen by the full reference equation of Span et al. (2000). */
export const realGas: GasModel = makeHelmholtzModel("real");
/** Same equation with the residual part set to zero: ideal gas with the real cp⁰(T). */
export const idealGas: GasModel = makeHelmholtzModel("ideal");

export function gasModel(kind: "real" | "ideal"): GasModel {
  if (kind === "real") return realGas;
  if (kind === "ideal") return idealGas;
  throw new InputError(`gas model: "${String(kind)}" is not a model (expected "real" or "ideal")`);
}

export interface GasState {
  tempK: number;
  pressurePa: number;
  densityMolM3: number;
}

const ST = new Float64Array(6);

/**
 * Temperature on the isentrope s = s₁ at a fixed density: Newton iteration on T with (∂s/∂T)_ρ = cv/T.
 * Leaves the state's properties in ST.
 */
function isentropeAtDensity(model: GasModel, s1: number, rho: number, tGuess: number): number {
  let t = Math.min(Math.max(tGuess, N2_MIN_TEMP_K), N2_MAX_TEMP_K);
  for (let iter = 0; iter < 50; iter++) {
    model.stateProperties(rho, t, ST);
    const next = Math.min(Math.max(t - ((ST[3]! - s1) * t) / ST[5]!, N2_MIN_TEMP_K), N2_MAX_TEMP_K);
    if (Math.abs(next - t) < 1e-10 * t) {
      model.stateProperties(rho, next, ST);
      return next;
    }
    t = next;
  }
  throw new Error(`isentrope: no convergence at ${rho} mol/m³`);
}

/**
 * State (ρ, T) on the isentrope s = s₁ at a given pressure: Newton iteration in two unknowns on
 * P(ρ, T) = P and s(ρ, T) = s₁, with (∂s/∂ρ)_T = −(∂P/∂T)_ρ/ρ² (Maxwell relation) and (∂s/∂T)_ρ = cv/T.
 * Leaves the state's properties in ST.
 */
function isentropeAtPressure(
  model: GasModel,
  s1: number,
  p: number,
  rhoGuess: number,
  tGuess: number,
): GasState {
  let rho = rhoGuess;
  let t = Math.min(Math.max(tGuess, N2_MIN_TEMP_K), N2_MAX_TEMP_K);
  for (let iter = 0; iter < 60; iter++) {
    model.stateProperties(rho, t, ST);
    const f1 = ST[0]! - p;
    const f2 = ST[3]! - s1;
    const pRho = ST[1]!;
    const pT = ST[2]!;
    const sRho = -pT / (rho * rho);
    const sT = ST[5]! / t;
    const det = pRho * sT - pT * sRho;
    let dRho = (f1 * sT - pT * f2) / det;
    let dT = (pRho * f2 - sRho * f1) / det;
    // Damping: keep the density positive and the temperature inside the equation's range.
    if (dRho > 0.5 * rho) dRho = 0.5 * rho;
    if (dRho < -0.5 * rho) dRho = -0.5 * rho;
    if (t - dT < N2_MIN_TEMP_K) dT = t - N2_MIN_TEMP_K;
    if (t - dT > N2_MAX_TEMP_K) dT = t - N2_MAX_TEMP_K;
    rho -= dRho;
    t -= dT;
    if (Math.abs(dRho) < 1e-11 * rho && Math.abs(dT) < 1e-11 * t) {
      model.stateProperties(rho, t, ST);
      return { tempK: t, pressurePa: p, densityMolM3: rho };
    }
  }
  throw new Error(`isentrope: no convergence at ${p} Pa`);
}

/**
 * Reversible adiabatic (isentropic) change of a closed amount of gas to a new volume: solves
 * s(n/V₂, T₂) = s(n/V₁, T₁) for T₂ by Newton iteration, with (∂s/∂T)_ρ = cv/T.
 */
export function isentropicToVolume(
  model: GasModel,
  amountMol: number,
  tempK: number,
  volumeM3: number,
  newVolumeM3: number,
): GasState {
  if (!(amountMol > 0)) throw new InputError(`amountMol: ${amountMol} mol must be above 0`);
  if (!(volumeM3 > 0)) throw new InputError(`volumeM3: ${volumeM3} m³ must be above 0`);
  if (!(newVolumeM3 > 0)) throw new InputError(`newVolumeM3: ${newVolumeM3} m³ must be above 0`);
  const rho1 = amountMol / volumeM3;
  const rho2 = amountMol / newVolumeM3;
  model.stateProperties(rho1, tempK, ST);
  const s1 = ST[3]!;
  // Ideal-gas first guess with the local cv.
  const t = isentropeAtDensity(model, s1, rho2, tempK * (rho2 / rho1) ** (R / ST[5]!));
  return { tempK: t, pressurePa: ST[0]!, densityMolM3: rho2 };
}

/**
 * State on the isentrope through (ρ₁, T₁) at a given pressure (Newton iteration in ρ and T on
 * P(ρ, T) = P and s(ρ, T) = s₁).
 */
export function isentropicToPressure(
  model: GasModel,
  densityMolM3: number,
  tempK: number,
  newPressurePa: number,
): GasState {
  checkPressure(newPressurePa);
  model.stateProperties(densityMolM3, tempK, ST);
  const p1 = ST[0]!;
  const s1 = ST[3]!;
  const cp1 = ST[5]! + R; // ideal-gas estimate of cp for the first guess only
  const tGuess = tempK * (newPressurePa / p1) ** (R / cp1);
  const rhoGuess = densityMolM3 * (newPressurePa / p1) ** (ST[5]! / cp1);
  return isentropeAtPressure(model, s1, newPressurePa, rhoGuess, tGuess);
}

export interface ExpansionEnd extends GasState {
  internalEnergyJMol: number;
}

/**
 * End of an isentropic expansion from (ρ₁, T₁) that stops at whichever comes first: the density
 * minDensityMolM3 (a volume stop) or the pressure minPressurePa. Solves the pressure end first
 * (the common case for a starter) and the density end only if the pressure end lies beyond the stop.
 * Returns the start state unchanged if it is already at or below minPressurePa.
 */
export function isentropicExpansionEnd(
  model: GasModel,
  densityMolM3: number,
  tempK: number,
  minDensityMolM3: number,
  minPressurePa: number,
): ExpansionEnd {
  model.stateProperties(densityMolM3, tempK, ST);
  const p1 = ST[0]!;
  const s1 = ST[3]!;
  const u1 = ST[4]!;
  const cv1 = ST[5]!;
  if (p1 <= minPressurePa || densityMolM3 <= minDensityMolM3) {
    return { tempK, pressurePa: p1, densityMolM3, internalEnergyJMol: u1 };
  }
  const cp1 = cv1 + R; // ideal-gas estimate for the first guess only
  const tGuess = tempK * (minPressurePa / p1) ** (R / cp1);
  const rhoGuess = densityMolM3 * (minPressurePa / p1) ** (cv1 / cp1);
  if (rhoGuess > minDensityMolM3 * 0.8) {
    const atP = isentropeAtPressure(model, s1, minPressurePa, rhoGuess, tGuess);
    if (atP.densityMolM3 >= minDensityMolM3) return { ...atP, internalEnergyJMol: ST[4]! };
  }
  const t = isentropeAtDensity(
    model,
    s1,
    minDensityMolM3,
    tempK * (minDensityMolM3 / densityMolM3) ** (R / cv1),
  );
  return { tempK: t, pressurePa: ST[0]!, densityMolM3: minDensityMolM3, internalEnergyJMol: ST[4]! };
}
