/**
 * Piston accumulator: nitrogen on one side of a floating piston, hydraulic fluid on the other
 * (docs/methods.md §3). All functions are pure; SI inside (Pa absolute, K, m³, mol, J, s).
 *
 * Geometry: V0 is the gas volume with the piston on the fluid-side stop (0 % fill), Vmin the gas volume
 * on the gas-side stop (100 % fill). n identical units in parallel read alike; `count` scales energies
 * and fluid volumes only.
 */
import { InputError } from "../errors.js";
import { S_PER_MONTH } from "../units/index.js";
import { type GasModel, isentropicExpansionEnd } from "./nitrogen.js";

export interface AccumulatorGeometry {
  /** Gas volume with the piston on the fluid-side stop (0 % fill), m³. */
  v0M3: number;
  /** Gas volume with the piston on the gas-side stop (100 % fill), m³. */
  vminM3: number;
}

function fail(param: string, message: string): never {
  throw new InputError(`${param}: ${message}`);
}
function requirePositive(param: string, value: number, unit: string): void {
  if (!(value > 0 && Number.isFinite(value))) fail(param, `${value} ${unit} must be a finite number above 0`);
}
function requireNonNegative(param: string, value: number, unit: string): void {
  if (!(value >= 0 && Number.isFinite(value))) fail(param, `${value} ${unit} must be a finite number ≥ 0`);
}

/** Rejects non-physical geometry: volumes must be positive and Vmin below V0. */
export function checkGeometry(geometry: AccumulatorGeometry): void {
  requirePositive("v0M3", geometry.v0M3, "m³");
  requirePositive("vminM3", geometry.vminM3, "m³");
  if (!(geometry.vminM3 < geometry.v0M3)) {
    fail("vminM3", `${geometry.vminM3} m³ must be below v0M3 (${geometry.v0M3} m³)`);
  }
}
function checkCount(count: number): void {
  if (!(Number.isInteger(count) && count >= 1)) fail("count", `${count} must be a whole number of units ≥ 1`);
}

/** Gas amount (mol) fixed by a service reference "P at T" with the piston on the fluid-side stop: n = ρ(P, T)·V. */
export function gasAmountMol(
  model: GasModel,
  pressureAbsPa: number,
  tempK: number,
  volumeM3: number,
): number {
  requirePositive("volumeM3", volumeM3, "m³");
  requirePositive("pressureAbsPa", pressureAbsPa, "Pa");
  return model.densityMolM3(pressureAbsPa, tempK) * volumeM3;
}

/** Precharge line: pressure of amountMol confined at V0 and tempK (piston on the fluid-side stop). */
export function prechargePressureAbsPa(
  model: GasModel,
  amountMol: number,
  tempK: number,
  v0M3: number,
): number {
  requirePositive("amountMol", amountMol, "mol");
  requirePositive("v0M3", v0M3, "m³");
  return model.pressurePa(amountMol / v0M3, tempK);
}

/** Gas volume of amountMol at tempK and pressure, V = n/ρ(P, T) (not clamped to the stops). */
export function gasVolumeM3(
  model: GasModel,
  amountMol: number,
  tempK: number,
  pressureAbsPa: number,
): number {
  requirePositive("amountMol", amountMol, "mol");
  requirePositive("pressureAbsPa", pressureAbsPa, "Pa");
  return amountMol / model.densityMolM3(pressureAbsPa, tempK);
}

/** Fill reading in %: (V0 − Vgas)/(V0 − Vmin) × 100, clamped to 0–100 (docs/methods.md §3). */
export function readingPct(geometry: AccumulatorGeometry, gasVolumeM3: number): number {
  const pct = ((geometry.v0M3 - gasVolumeM3) / (geometry.v0M3 - geometry.vminM3)) * 100;
  return Math.min(100, Math.max(0, pct));
}

/** Service reference, tolerance and system pressures that define the precharge lines and reading band. */
export interface BandInputs {
  /** Service reference precharge, gauge Pa, at refTempK. */
  refGaugePa: number;
  refTempK: number;
  /** ± tolerance on the reference precharge, Pa. */
  tolerancePa: number;
  systemLowGaugePa: number;
  systemNominalGaugePa: number;
  systemHighGaugePa: number;
  /** Local atmospheric pressure, Pa absolute. */
  atmPa: number;
}

function checkBand(band: BandInputs): void {
  requirePositive("refGaugePa", band.refGaugePa, "Pa");
  requireNonNegative("tolerancePa", band.tolerancePa, "Pa");
  requirePositive("atmPa", band.atmPa, "Pa");
  if (!(band.tolerancePa < band.refGaugePa))
    fail("tolerancePa", `${band.tolerancePa} Pa must be below refGaugePa`);
  if (
    !(
      band.systemLowGaugePa <= band.systemNominalGaugePa &&
      band.systemNominalGaugePa <= band.systemHighGaugePa
    )
  ) {
    fail("systemNominalGaugePa", "system pressures must satisfy low ≤ nominal ≤ high");
  }
  if (!(band.refGaugePa + band.tolerancePa < band.systemLowGaugePa)) {
    fail(
      "refGaugePa",
      `precharge ${band.refGaugePa} Pa gauge (+ tolerance ${band.tolerancePa} Pa) is not below the lowest system pressure ${band.systemLowGaugePa} Pa gauge`,
    );
  }
}

/**
 * Gas amounts per m³ of V0 fixed by the reference and its tolerance lines (mol/m³ at V0): nominal
 * through P_ref, largest through P_ref + tol, smallest through P_ref − tol, all at T_ref.
 */
export function prechargeDensitiesMolM3(
  model: GasModel,
  band: BandInputs,
): { nominal: number; largest: number; smallest: number } {
  checkBand(band);
  const refAbs = band.refGaugePa + band.atmPa;
  return {
    nominal: model.densityMolM3(refAbs, band.refTempK),
    largest: model.densityMolM3(refAbs + band.tolerancePa, band.refTempK),
    smallest: model.densityMolM3(refAbs - band.tolerancePa, band.refTempK),
  };
}

/** Precharge line and tolerance lines at tempK (absolute Pa): pressure of each amount at V0. */
export function prechargeLinesAbsPa(
  model: GasModel,
  band: BandInputs,
  tempK: number,
): { nominalAbsPa: number; lowAbsPa: number; highAbsPa: number } {
  const d = prechargeDensitiesMolM3(model, band);
  return {
    nominalAbsPa: model.pressurePa(d.nominal, tempK),
    lowAbsPa: model.pressurePa(d.smallest, tempK),
    highAbsPa: model.pressurePa(d.largest, tempK),
  };
}

/**
 * Reading band at thermal equilibrium at tempK (docs/methods.md §3): nominal from the nominal
 * amount at nominal system pressure, lowest from the largest amount at the lowest system pressure,
 * highest from the smallest amount at the highest system pressure.
 */
export function readingBand(
  model: GasModel,
  geometry: AccumulatorGeometry,
  band: BandInputs,
  tempK: number,
): { lowPct: number; nominalPct: number; highPct: number } {
  checkGeometry(geometry);
  const d = prechargeDensitiesMolM3(model, band);
  const reading = (densityAtV0: number, systemGaugePa: number): number => {
    const amount = densityAtV0 * geometry.v0M3;
    const v = amount / model.densityMolM3(systemGaugePa + band.atmPa, tempK);
    return readingPct(geometry, v);
  };
  return {
    lowPct: reading(d.largest, band.systemLowGaugePa),
    nominalPct: reading(d.nominal, band.systemNominalGaugePa),
    highPct: reading(d.smallest, band.systemHighGaugePa),
  };
}

/**
 * The air around the accumulator over one time step: its temperature at the step's start and end,
 * taken as linear in time between them (the hourly series is linear between grid hours; a held value
 * over a data gap has `startK` = `endK`).
 */
export interface AmbientStep {
  /** Length of the step, s (≥ 0). */
  dtS: number;
  /** Ambient temperature at the start of the step, K. */
  startK: number;
  /** Ambient temperature at the end of the step, K. */
  endK: number;
}

/**
 * Accumulator temperature after one step of a first-order lag behind the ambient (lumped
 * capacitance), dT/dt = (Ta(t) − T)/τ, solved exactly for an ambient linear in time over the step,
 * Ta(t) = Ta(0) + r·t with r = (Ta(Δt) − Ta(0))/Δt:
 * T(Δt) = Ta(Δt) − r·τ + (T(0) − Ta(0) + r·τ)·exp(−Δt/τ).
 * On a steady ramp the accumulator trails the air by τ (r·τ in temperature) once the transient has
 * died out; a held ambient (r = 0) gives T ← Ta + (T − Ta)·exp(−Δt/τ); τ = 0 gives Ta(Δt).
 *
 * @param tempK accumulator temperature at the start of the step, K
 * @param step the step's length `dtS` (s) and its ambient at the start `startK` and end `endK` (K)
 * @param tauS thermal time constant τ, s (≥ 0)
 * @returns accumulator temperature at the end of the step, K
 *
 * References: Incropera, F. P., DeWitt, D. P. et al., "Fundamentals of Heat and Mass Transfer",
 * the lumped capacitance method (transient conduction); the solution of a first-order linear ordinary
 * differential equation with a ramp input (integrating factor); docs/methods.md, "Accumulator
 * temperature".
 *
 * @example
 * // τ = 2 h, accumulator and air at 0 °C, the air falling linearly to −10 °C over one hour:
 * lagTempK(273.15, { dtS: 3600, startK: 273.15, endK: 263.15 }, 7200); // ≈ 271.0194 K (−2.1306 °C)
 */
export function lagTempK(tempK: number, step: AmbientStep, tauS: number): number {
  requireNonNegative("dtS", step.dtS, "s");
  requireNonNegative("tauS", tauS, "s");
  if (tauS === 0) return step.endK;
  if (step.dtS === 0) return tempK;
  const rTauK = ((step.endK - step.startK) / step.dtS) * tauS;
  return step.endK - rTauK + (tempK - step.startK + rTauK) * Math.exp(-step.dtS / tauS);
}

/**
 * Slow gas loss: a precharge pressure drop per month, stated at the reference temperature with the
 * piston on the fluid-side stop, converted to an amount lost per second:
 * [ρ(P_ref, T_ref) − ρ(P_ref − ΔP, T_ref)]·V0 / month.
 *
 * @param model gas model (density from pressure and temperature)
 * @param refAbsPa precharge reference pressure, Pa absolute
 * @param refTempK reference temperature, K
 * @param v0M3 gas volume on the fluid-side stop V0, m³
 * @param lossPaPerMonth pressure drop per month at the reference, Pa (≥ 0, below refAbsPa)
 * @returns amount lost per unit, mol/s
 *
 * References: Span, R. et al. (2000), "A reference equation of state for the thermodynamic properties
 * of nitrogen ...", J. Phys. Chem. Ref. Data 29(6) (the density); docs/methods.md, "Slow gas loss".
 *
 * @example
 * // Ideal gas, 10 psi a month at 1450 psig and 70 °F in 5 L: ΔP·V0/(R·T)/month
 * gasLossMolPerS(idealGas, 10.099e6, 294.26, 5e-3, 68_948); // ≈ 5.36e-8 mol/s
 */
export function gasLossMolPerS(
  model: GasModel,
  refAbsPa: number,
  refTempK: number,
  v0M3: number,
  lossPaPerMonth: number,
): number {
  requirePositive("v0M3", v0M3, "m³");
  requireNonNegative("lossPaPerMonth", lossPaPerMonth, "Pa");
  if (!(lossPaPerMonth < refAbsPa))
    fail("lossPaPerMonth", `${lossPaPerMonth} Pa must be below the reference ${refAbsPa} Pa`);
  if (lossPaPerMonth === 0) return 0;
  const lost =
    (model.densityMolM3(refAbsPa, refTempK) - model.densityMolM3(refAbsPa - lossPaPerMonth, refTempK)) * v0M3;
  return lost / S_PER_MONTH;
}

/** Hydraulic fluid properties for the trapped-charge model. */
export interface FluidProps {
  /** Volumetric thermal expansion coefficient α, 1/K. */
  alphaPerK: number;
  /** Bulk modulus K, Pa; Infinity means rigid fluid. */
  bulkModulusPa: number;
  /** Trapped line volume outside the accumulator, m³. */
  lineVolumeM3: number;
}

function checkFluid(fluid: FluidProps): void {
  if (!Number.isFinite(fluid.alphaPerK) || fluid.alphaPerK < 0)
    fail("alphaPerK", `${fluid.alphaPerK} /K must be a finite number ≥ 0`);
  if (!(fluid.bulkModulusPa > 0))
    fail("bulkModulusPa", `${fluid.bulkModulusPa} Pa must be above 0 (Infinity: rigid)`);
  requireNonNegative("lineVolumeM3", fluid.lineVolumeM3, "m³");
}

/** State captured at the end of a recharge (subscript c of the fluid model, docs/methods.md §3). */
export interface ChargedState {
  amountMol: number;
  tempK: number;
  gasPressureAbsPa: number;
  /** Fluid pressure at the end of recharge (= system pressure); above the gas pressure if the piston bottomed. */
  fluidPressureAbsPa: number;
  gasVolumeM3: number;
  /** Fluid volume in the accumulator plus the trapped line volume, m³. */
  fluidVolumeM3: number;
}

/**
 * Charged state at thermal equilibrium at tempK and system pressure. If the gas would be compressed
 * below Vmin the piston sits on the gas-side stop: gas at Vmin below system pressure, fluid at system
 * pressure. A system pressure below the precharge (gas above V0) is rejected.
 */
export function chargedState(
  model: GasModel,
  geometry: AccumulatorGeometry,
  fluid: FluidProps,
  amountMol: number,
  tempK: number,
  pressureAbsPa: number,
): ChargedState {
  checkGeometry(geometry);
  checkFluid(fluid);
  requirePositive("amountMol", amountMol, "mol");
  requirePositive("pressureAbsPa", pressureAbsPa, "Pa");
  let v = amountMol / model.densityMolM3(pressureAbsPa, tempK);
  let gasP = pressureAbsPa;
  if (v > geometry.v0M3 * (1 + 1e-12)) {
    const pre = model.pressurePa(amountMol / geometry.v0M3, tempK);
    fail(
      "pressureAbsPa",
      `system pressure ${Math.round(pressureAbsPa)} Pa is below the precharge ${Math.round(pre)} Pa at ${tempK.toFixed(2)} K: precharge above system pressure`,
    );
  }
  if (v > geometry.v0M3) v = geometry.v0M3;
  if (v < geometry.vminM3) {
    v = geometry.vminM3;
    gasP = model.pressurePa(amountMol / v, tempK);
  }
  return {
    amountMol,
    tempK,
    gasPressureAbsPa: gasP,
    fluidPressureAbsPa: pressureAbsPa,
    gasVolumeM3: v,
    fluidVolumeM3: geometry.v0M3 - v + fluid.lineVolumeM3,
  };
}

export interface TrappedState {
  gasPressureAbsPa: number;
  gasVolumeM3: number;
  /** Equal to the gas pressure unless the piston sits on a stop. */
  fluidPressureAbsPa: number;
}

const slopeOut = new Float64Array(2);

/**
 * Trapped fluid (docs/methods.md §3): with the fluid side closed since the charged state c,
 * V_f = V_f,c·(1 + α(T − T_c) − (P − P_c)/K) and V_gas(P, T, n) + V_f = V_gas,c + V_f,c. Solved for the
 * gas density ρ (V_gas = n/ρ, P = P(ρ, T) explicit) by Newton iteration inside the bracket of the two
 * stops; the residual is strictly monotonic, so the root is unique. On a stop the gas keeps its volume
 * (Vmin or V0) and the fluid pressure follows from the fluid equation alone (held ≥ 0 on the V0 stop).
 * Allocation-free when `out` is given.
 */
export function trappedState(
  model: GasModel,
  geometry: AccumulatorGeometry,
  fluid: FluidProps,
  c: ChargedState,
  tempK: number,
  amountMol: number,
  out?: TrappedState,
): TrappedState {
  const res = out ?? { gasPressureAbsPa: 0, gasVolumeM3: 0, fluidPressureAbsPa: 0 };
  if (!(amountMol > 0)) fail("amountMol", `${amountMol} mol must be above 0`);
  if (!(geometry.vminM3 > 0 && geometry.vminM3 < geometry.v0M3)) checkGeometry(geometry);
  const vTotal = c.gasVolumeM3 + c.fluidVolumeM3;
  const vfc = c.fluidVolumeM3;
  const k = fluid.bulkModulusPa;
  const thermal = 1 + fluid.alphaPerK * (tempK - c.tempK);
  // g(ρ) = n/ρ + A − B·P(ρ): the total-volume residual, strictly decreasing in ρ.
  const a = vfc * (thermal + c.fluidPressureAbsPa / k) - vTotal;
  const b = vfc / k;
  const rhoAtV0 = amountMol / geometry.v0M3;
  const rhoAtVmin = amountMol / geometry.vminM3;
  let lo = rhoAtV0;
  let hi = rhoAtVmin;
  // Start from the rigid-fluid solution (exact when B = 0), else the charged gas volume.
  const rigidV = -a;
  let rho = amountMol / (rigidV > 0 ? rigidV : c.gasVolumeM3);
  if (!(rho > lo)) rho = lo;
  if (!(rho < hi)) rho = hi;
  let stop = 0; // −1: on the V0 stop, +1: on the Vmin stop
  for (let iter = 0; iter < 100; iter++) {
    model.pressureAndSlope(rho, tempK, slopeOut);
    const p = slopeOut[0]!;
    const g = amountMol / rho + a - b * p;
    if (rho === rhoAtVmin && g >= 0) {
      stop = 1;
      break;
    }
    if (rho === rhoAtV0 && g <= 0) {
      stop = -1;
      break;
    }
    const dg = -amountMol / (rho * rho) - b * slopeOut[1]!;
    let next = rho - g / dg;
    if (Math.abs(g) <= 1e-14 * vTotal || Math.abs(next - rho) <= 1e-13 * rho) {
      if (next >= rhoAtV0 && next <= rhoAtVmin) rho = next;
      break;
    }
    if (g > 0) lo = rho;
    else hi = rho;
    if (!(next > lo && next < hi)) {
      // Leaving the bracket: try the stop itself once, then bisect.
      if (next >= hi) next = hi === rhoAtVmin && rho !== hi ? hi : 0.5 * (lo + hi);
      else next = lo === rhoAtV0 && rho !== lo ? lo : 0.5 * (lo + hi);
    }
    rho = next;
  }
  if (stop === 0) {
    const p = model.pressurePa(rho, tempK);
    res.gasPressureAbsPa = p;
    res.gasVolumeM3 = amountMol / rho;
    res.fluidPressureAbsPa = p;
    return res;
  }
  const vGas = stop > 0 ? geometry.vminM3 : geometry.v0M3;
  res.gasVolumeM3 = vGas;
  res.gasPressureAbsPa = model.pressurePa(amountMol / vGas, tempK);
  // Fluid alone fills vTotal − vGas: V_f,c·(thermal − (P − P_c)/K) = vTotal − vGas.
  const squeeze = thermal - (vTotal - vGas) / vfc;
  let pf = vfc > 0 ? c.fluidPressureAbsPa + k * squeeze : Number.NaN;
  if (!Number.isFinite(pf)) pf = squeeze > 0 ? Number.POSITIVE_INFINITY : 0;
  res.fluidPressureAbsPa =
    stop < 0 ? Math.max(0, Math.min(pf, res.gasPressureAbsPa)) : Math.max(pf, res.gasPressureAbsPa);
  return res;
}

/** A trapped charge at one instant: its reference state c, its temperature and gas amount, its solved state. */
export interface TrappedNow {
  /** The reference state of the trapped fluid (end of the last recharge, or the last relief). */
  c: ChargedState;
  /** Accumulator (and trapped fluid) temperature, K. */
  tempK: number;
  /** Gas amount per unit, mol. */
  amountMol: number;
  /** `trappedState` of the above. */
  trapped: TrappedState;
}

/** A thermal relief of a trapped charge: the new reference state and the fluid let out. */
export interface ReliefResult {
  /** The relief state, the fluid model's new reference c (fluid kept, at the relief pressure and tempK). */
  charge: ChargedState;
  /** Fluid relieved per unit, m³, measured at tempK and the relief pressure. */
  relievedM3: number;
}

/**
 * Thermal relief of a trapped charge (docs/methods.md §3, "Thermal relief"): where the trapped fluid
 * pressure would exceed the relief valve's pressure, the valve lets fluid out and the pressure holds at
 * the relief value. The gas takes its volume at the relief pressure and tempK, n/ρ(P_r, T) (or Vmin on
 * the gas-side stop, where the gas stays below the fluid), the fluid kept fills the rest of the closed
 * volume V_gas,c + V_f,c, and the fluid relieved is what the trapped-fluid law would have held at
 * (T, P_r), V_f,c·(1 + α(T − T_c) − (P_r − P_c)/K), less the fluid kept. The relief state becomes the
 * reference state c of the fluid model, so a later cooling starts from the fluid that is left.
 *
 * @param model gas model
 * @param geometry V0 and Vmin, m³
 * @param fluid α (1/K), K (Pa) and the trapped line volume (m³)
 * @param now the trapped charge now: its reference state `c`, `tempK` (K), `amountMol` (mol per unit)
 *   and its solved state `trapped`
 * @param reliefAbsPa relief pressure, Pa absolute
 * @returns the relief state and the fluid relieved, or null when the fluid pressure does not exceed
 *   the relief pressure
 *
 * References: Span, R. et al. (2000), J. Phys. Chem. Ref. Data 29(6) (the gas density); linear
 * thermal expansion and bulk modulus of the trapped fluid (docs/methods.md §3, "Trapped charge").
 *
 * @example
 * // 1 L unit (1450 psig at 70 °F), 0.2 L line, α 8e-4/K, K 1.5 GPa, charged to 3000 psig at 0 °C,
 * // warmed to 30 °C with relief at 3300 psig (22.854 MPa absolute): 39.4 mL relieved
 * const trapped = trappedState(realGas, geometry, fluid, c, 303.15, n);
 * thermalRelief(realGas, geometry, fluid, { c, tempK: 303.15, amountMol: n, trapped }, 22.854e6);
 */
export function thermalRelief(
  model: GasModel,
  geometry: AccumulatorGeometry,
  fluid: FluidProps,
  { c, tempK, amountMol, trapped }: TrappedNow,
  reliefAbsPa: number,
): ReliefResult | null {
  requirePositive("reliefAbsPa", reliefAbsPa, "Pa");
  if (!(trapped.fluidPressureAbsPa > reliefAbsPa)) return null;
  let gasVolumeM3 = amountMol / model.densityMolM3(reliefAbsPa, tempK);
  let gasPressureAbsPa = reliefAbsPa;
  if (gasVolumeM3 < geometry.vminM3) {
    gasVolumeM3 = geometry.vminM3;
    gasPressureAbsPa = model.pressurePa(amountMol / gasVolumeM3, tempK);
  } else if (gasVolumeM3 > geometry.v0M3) {
    gasVolumeM3 = geometry.v0M3;
    gasPressureAbsPa = model.pressurePa(amountMol / gasVolumeM3, tempK);
  }
  const fluidVolumeM3 = c.gasVolumeM3 + c.fluidVolumeM3 - gasVolumeM3;
  const heldM3 =
    c.fluidVolumeM3 *
    (1 + fluid.alphaPerK * (tempK - c.tempK) - (reliefAbsPa - c.fluidPressureAbsPa) / fluid.bulkModulusPa);
  return {
    charge: {
      amountMol,
      tempK,
      gasPressureAbsPa,
      fluidPressureAbsPa: reliefAbsPa,
      gasVolumeM3,
      fluidVolumeM3,
    },
    relievedM3: Math.max(0, heldM3 - fluidVolumeM3),
  };
}

const startProps = new Float64Array(6);

/** The starter's needs from the accumulator. */
export interface StarterSpec {
  /** Below this gas pressure the starter no longer turns usefully, Pa absolute. */
  minUsefulAbsPa: number;
  /** Return-line pressure the fluid works against, Pa absolute (default in plans: atmospheric). */
  returnAbsPa: number;
  /** Isothermal instead of isentropic expansion. */
  isothermal?: boolean;
}

export interface DischargeResult {
  /** ∫(P − P_return) dV, J, total over `count` units. */
  hydraulicEnergyJ: number;
  /** ∫P dV done by the gas, J, total over `count` units. */
  gasWorkJ: number;
  /** Fluid delivered, m³, total over `count` units. */
  fluidDeliveredM3: number;
  /** End state of each unit. */
  end: { gasPressureAbsPa: number; tempK: number; gasVolumeM3: number };
}

/**
 * Start discharge of `count` identical units in parallel (docs/methods.md §3). The gas expands
 * isentropically (reversible adiabatic, real gas by the model) until the piston reaches its 0 % stop (V0)
 * or the pressure falls to the starter's minimum useful pressure. By the first law for an adiabatic
 * closed system the gas work ∫P dV equals the internal-energy drop n·(u₁ − u₂); the isothermal option
 * uses the Helmholtz-energy drop n·(a₁ − a₂), exact at constant temperature. Hydraulic energy
 * ∫(P − P_return) dV = gas work − P_return·ΔV.
 */
export function startDischarge(
  model: GasModel,
  geometry: AccumulatorGeometry,
  count: number,
  amountMol: number,
  tempK: number,
  gasVolumeM3: number,
  starter: StarterSpec,
): DischargeResult {
  checkGeometry(geometry);
  checkCount(count);
  requirePositive("amountMol", amountMol, "mol");
  requirePositive("gasVolumeM3", gasVolumeM3, "m³");
  requirePositive("minUsefulAbsPa", starter.minUsefulAbsPa, "Pa");
  requireNonNegative("returnAbsPa", starter.returnAbsPa, "Pa");
  if (!(starter.returnAbsPa < starter.minUsefulAbsPa)) {
    fail(
      "returnAbsPa",
      `${starter.returnAbsPa} Pa must be below minUsefulAbsPa (${starter.minUsefulAbsPa} Pa)`,
    );
  }
  const v1 = Math.min(Math.max(gasVolumeM3, geometry.vminM3), geometry.v0M3);
  const rho1 = amountMol / v1;
  model.stateProperties(rho1, tempK, startProps);
  const p1 = startProps[0]!;
  const u1 = startProps[4]!;
  const start = { gasPressureAbsPa: p1, tempK, gasVolumeM3: v1 };
  if (p1 <= starter.minUsefulAbsPa || v1 >= geometry.v0M3) {
    return { hydraulicEnergyJ: 0, gasWorkJ: 0, fluidDeliveredM3: 0, end: start };
  }
  let v2: number;
  let t2: number;
  let p2: number;
  let workPerUnit: number;
  if (starter.isothermal) {
    const pAtV0 = model.pressurePa(amountMol / geometry.v0M3, tempK);
    v2 =
      pAtV0 >= starter.minUsefulAbsPa
        ? geometry.v0M3
        : amountMol / model.densityMolM3(starter.minUsefulAbsPa, tempK);
    t2 = tempK;
    p2 = v2 === geometry.v0M3 ? pAtV0 : starter.minUsefulAbsPa;
    workPerUnit = amountMol * (model.helmholtzJMol(rho1, tempK) - model.helmholtzJMol(amountMol / v2, tempK));
  } else {
    const end = isentropicExpansionEnd(model, rho1, tempK, amountMol / geometry.v0M3, starter.minUsefulAbsPa);
    // On the V0 stop the volume is exactly V0 (the density end was solved at n/V0).
    v2 = end.pressurePa > starter.minUsefulAbsPa ? geometry.v0M3 : amountMol / end.densityMolM3;
    t2 = end.tempK;
    p2 = end.pressurePa;
    workPerUnit = amountMol * (u1 - end.internalEnergyJMol);
  }
  const dv = v2 - v1;
  return {
    hydraulicEnergyJ: count * (workPerUnit - starter.returnAbsPa * dv),
    gasWorkJ: count * workPerUnit,
    fluidDeliveredM3: count * dv,
    end: { gasPressureAbsPa: p2, tempK: t2, gasVolumeM3: v2 },
  };
}

/** Pump delivery: flow against gauge pressure at the pump, and the run timer. */
export interface PumpSpec {
  /** Flow-versus-pressure table, gauge pressure strictly increasing; no flow above the last pressure. */
  curve: { gaugePa: number; flowM3S: number }[];
  /** The pump stops after this run time, s. */
  timerS: number;
  /** Local atmospheric pressure for the gauge readings, Pa. */
  atmPa: number;
}

function checkPump(pump: PumpSpec): void {
  if (pump.curve.length === 0) fail("curve", "the pump table needs at least one point");
  for (let i = 0; i < pump.curve.length; i++) {
    const pt = pump.curve[i]!;
    if (!(pt.flowM3S >= 0 && Number.isFinite(pt.flowM3S)))
      fail(`curve[${i}].flowM3S`, `${pt.flowM3S} m³/s must be ≥ 0`);
    if (!Number.isFinite(pt.gaugePa)) fail(`curve[${i}].gaugePa`, `${pt.gaugePa} Pa is not a pressure`);
    if (i > 0 && !(pt.gaugePa > pump.curve[i - 1]!.gaugePa)) {
      fail(`curve[${i}].gaugePa`, "pump table pressures must strictly increase");
    }
  }
  requirePositive("timerS", pump.timerS, "s");
  requirePositive("atmPa", pump.atmPa, "Pa");
}

/** Pump flow at an absolute pressure: linear in the table, first flow below it, zero above its last pressure. */
export function pumpFlowM3S(pump: PumpSpec, pressureAbsPa: number): number {
  const g = pressureAbsPa - pump.atmPa;
  const c = pump.curve;
  const last = c[c.length - 1]!;
  if (g > last.gaugePa) return 0;
  if (g <= c[0]!.gaugePa) return c[0]!.flowM3S;
  let i = 1;
  while (c[i]!.gaugePa < g) i++;
  const p0 = c[i - 1]!;
  const p1 = c[i]!;
  return p0.flowM3S + ((p1.flowM3S - p0.flowM3S) * (g - p0.gaugePa)) / (p1.gaugePa - p0.gaugePa);
}

export interface RechargeResult {
  /** Pump run time, s (the timer when the system pressure was not reached). */
  timeS: number;
  reachedSystem: boolean;
  gasVolumeM3: number;
  gasPressureAbsPa: number;
  /** Fluid pumped in, m³, total over `count` units. */
  fluidAddedM3: number;
}

const RECHARGE_STEPS = 48;

/**
 * Recharge of `count` units in parallel (docs/methods.md §3): the pump's flow, shared by the
 * units, compresses each gas charge isothermally at tempK toward system pressure: dV/dt = −Q(P)/count with
 * P = P(n/V, T). Integrated over N equal volume steps, taking Q linear in V within a step, so a step
 * lasts h·ln(Q₀/Q₁)/(Q₀ − Q₁); the timer may end first, the fill then stays where it is. If the piston
 * reaches the gas-side stop first the fill ends there.
 */
export function recharge(
  model: GasModel,
  geometry: AccumulatorGeometry,
  count: number,
  amountMol: number,
  tempK: number,
  gasVolumeM3: number,
  systemAbsPa: number,
  pump: PumpSpec,
): RechargeResult {
  checkGeometry(geometry);
  checkCount(count);
  checkPump(pump);
  requirePositive("amountMol", amountMol, "mol");
  requirePositive("gasVolumeM3", gasVolumeM3, "m³");
  requirePositive("systemAbsPa", systemAbsPa, "Pa");
  const vStart = Math.min(Math.max(gasVolumeM3, geometry.vminM3), geometry.v0M3);
  const pStart = model.pressurePa(amountMol / vStart, tempK);
  if (pStart >= systemAbsPa) {
    return { timeS: 0, reachedSystem: true, gasVolumeM3: vStart, gasPressureAbsPa: pStart, fluidAddedM3: 0 };
  }
  // The pump delivers nothing above its table's last pressure: the fill can then only approach that.
  const capAbsPa = pump.curve[pump.curve.length - 1]!.gaugePa + pump.atmPa;
  const reachable = systemAbsPa <= capAbsPa;
  const targetAbsPa = reachable ? systemAbsPa : capAbsPa;
  if (!reachable && pStart >= targetAbsPa) {
    return {
      timeS: pump.timerS,
      reachedSystem: false,
      gasVolumeM3: vStart,
      gasPressureAbsPa: pStart,
      fluidAddedM3: 0,
    };
  }
  const vSystem = amountMol / model.densityMolM3(targetAbsPa, tempK);
  const vEnd = Math.max(vSystem, geometry.vminM3);
  if (vEnd >= vStart) {
    return {
      timeS: 0,
      reachedSystem: reachable,
      gasVolumeM3: vStart,
      gasPressureAbsPa: pStart,
      fluidAddedM3: 0,
    };
  }
  const h = (vStart - vEnd) / RECHARGE_STEPS;
  let t = 0;
  let v = vStart;
  let q0 = pumpFlowM3S(pump, pStart) / count;
  for (let i = 1; i <= RECHARGE_STEPS; i++) {
    const vNext = i === RECHARGE_STEPS ? vEnd : vStart - i * h;
    const pNext =
      i === RECHARGE_STEPS && vEnd === vSystem ? targetAbsPa : model.pressurePa(amountMol / vNext, tempK);
    // Just below the system pressure the pump still delivers; the last node uses the flow there.
    const q1 = pumpFlowM3S(pump, Math.min(pNext, targetAbsPa * (1 - 1e-12))) / count;
    const step = v - vNext;
    const dt = stepTime(step, q0, q1);
    if (t + dt > pump.timerS) {
      const x = stepVolumeWithin(step, q0, q1, pump.timerS - t);
      const vFinal = v - x;
      return {
        timeS: pump.timerS,
        reachedSystem: false,
        gasVolumeM3: vFinal,
        gasPressureAbsPa: model.pressurePa(amountMol / vFinal, tempK),
        fluidAddedM3: count * (vStart - vFinal),
      };
    }
    t += dt;
    v = vNext;
    q0 = q1;
  }
  return {
    timeS: reachable ? t : pump.timerS,
    reachedSystem: reachable,
    gasVolumeM3: vEnd,
    gasPressureAbsPa: vEnd === vSystem ? targetAbsPa : model.pressurePa(amountMol / vEnd, tempK),
    fluidAddedM3: count * (vStart - vEnd),
  };
}

/** Time to move volume h with flow varying linearly from q0 to q1 along the volume: h·ln(q0/q1)/(q0 − q1). */
function stepTime(h: number, q0: number, q1: number): number {
  if (!(q0 > 0) || !(q1 > 0)) return Number.POSITIVE_INFINITY;
  const dq = q1 - q0;
  if (Math.abs(dq) <= 1e-9 * q0) return h / q0;
  return (h * Math.log(q1 / q0)) / dq;
}
/** Volume moved within a step after time τ: inverse of the above (Q(x) = q0·exp(Δq·τ/h)). */
function stepVolumeWithin(h: number, q0: number, q1: number, tau: number): number {
  if (!(q0 > 0)) return 0;
  const dq = q1 - q0;
  if (Math.abs(dq) <= 1e-9 * q0) return Math.min(h, q0 * tau);
  const qx = q0 * Math.exp((dq * tau) / h);
  return Math.min(h, Math.max(0, (h * (qx - q0)) / dq));
}

/** Hand-pump strokes to move a fluid volume: fluid / (displacement × volumetric efficiency), not rounded. */
export function handPumpStrokes(
  fluidM3: number,
  displacementM3: number,
  volumetricEfficiency: number,
): number {
  requireNonNegative("fluidM3", fluidM3, "m³");
  requirePositive("displacementM3", displacementM3, "m³");
  if (!(volumetricEfficiency > 0 && volumetricEfficiency <= 1)) {
    fail("volumetricEfficiency", `${volumetricEfficiency} must be in (0, 1]`);
  }
  return fluidM3 / (displacementM3 * volumetricEfficiency);
}

/** Linear interpolation in a table sorted by x, held constant beyond its ends (e.g. start energy vs ambient). */
export function interpolateClamped(table: { x: number; y: number }[], x: number): number {
  if (table.length === 0) fail("table", "needs at least one point");
  for (let i = 1; i < table.length; i++) {
    if (!(table[i]!.x > table[i - 1]!.x)) fail(`table[${i}].x`, "x values must strictly increase");
  }
  const first = table[0]!;
  const last = table[table.length - 1]!;
  if (!(x > first.x)) return first.y;
  if (!(x < last.x)) return last.y;
  let i = 1;
  while (table[i]!.x < x) i++;
  const a = table[i - 1]!;
  const b = table[i]!;
  return a.y + ((b.y - a.y) * (x - a.x)) / (b.x - a.x);
}
