/**
 * A precomputed interpolation table of a gas model for the hour-by-hour simulation, where the full
 * Helmholtz equation would be the bottleneck. Compressibility Z is tabulated on regular grids in
 * (T, ρ) and (T, P) and interpolated bilinearly (Z is smooth and close to 1, so the relative error of
 * P = ρ·R·T·Z and ρ = P/(R·T·Z) is the interpolation error of Z). The density lookup is polished by one
 * Newton step on the (T, ρ) table so that pressure and density lookups are each other's inverse.
 *
 * Coverage: 203.15–373.15 K (−70…+100 °C) and 0–45 MPa, wider than the required −60…+80 °C and
 * 0…40 MPa; outside it, and for every other property, the underlying model answers.
 */
import { InputError } from "../errors.js";
import { type DensityOptions, type GasModel, idealGas, N2_GAS_CONSTANT_J_MOLK } from "./nitrogen.js";

const R = N2_GAS_CONSTANT_J_MOLK;

export interface GasTableGrid {
  minTempK: number;
  maxTempK: number;
  tempStepK: number;
  maxDensityMolM3: number;
  densityStepMolM3: number;
  maxPressurePa: number;
  pressureStepPa: number;
}

/** Default grid: errors below 0.005 % against the full equation (tests/physics/gasTable.test.ts). */
export const DEFAULT_GAS_TABLE_GRID: GasTableGrid = {
  minTempK: 143.15,
  maxTempK: 373.15,
  tempStepK: 2,
  maxDensityMolM3: 24000,
  densityStepMolM3: 200,
  maxPressurePa: 45e6,
  pressureStepPa: 0.25e6,
};

const cache = new Map<GasModel, GasModel>();

/**
 * Interpolation-table version of `model` (same interface, kind "table"). Inside the grid pressure,
 * density, Z, entropy, internal energy, cv and stateProperties come from the tables; cp, speed of
 * sound and Helmholtz energy (and everything outside the grid) come from `model` itself.
 * Tables for the default grid are built once per model and shared.
 */
export function tabulatedGas(model: GasModel, grid: GasTableGrid = DEFAULT_GAS_TABLE_GRID): GasModel {
  if (model.kind === "table") return model;
  if (grid === DEFAULT_GAS_TABLE_GRID) {
    const hit = cache.get(model);
    if (hit) return hit;
  }
  const built = buildTable(model, grid);
  if (grid === DEFAULT_GAS_TABLE_GRID) cache.set(model, built);
  return built;
}

function buildTable(base: GasModel, grid: GasTableGrid): GasModel {
  const { minTempK: t0, tempStepK: hT, densityStepMolM3: hRho, pressureStepPa: hP } = grid;
  const nT = Math.round((grid.maxTempK - t0) / hT) + 1;
  const nRho = Math.round(grid.maxDensityMolM3 / hRho) + 1;
  const nP = Math.round(grid.maxPressurePa / hP) + 1;
  const tMax = t0 + (nT - 1) * hT;
  const rhoMax = (nRho - 1) * hRho;
  const pMax = (nP - 1) * hP;

  // zRho[i*nRho + j] = Z(T_i, ρ_j); zP[i*nP + k] = Z(T_i, P_k). For the isentropic start discharge also
  // (∂P/∂T)_ρ/(ρR) and the residual (real minus ideal-gas) entropy, internal energy and cv on the (T, ρ)
  // grid; the ideal-gas parts are evaluated exactly (they hold the ln ρ singularity).
  const zRho = new Float64Array(nT * nRho);
  const zT = new Float64Array(nT * nRho);
  const sRes = new Float64Array(nT * nRho);
  const uRes = new Float64Array(nT * nRho);
  const cvRes = new Float64Array(nT * nRho);
  const zP = new Float64Array(nT * nP);
  const real6 = new Float64Array(6);
  const ideal6 = new Float64Array(6);
  for (let i = 0; i < nT; i++) {
    const t = t0 + i * hT;
    for (let j = 0; j < nRho; j++) {
      const at = i * nRho + j;
      if (j === 0) {
        // zero density: the residual part vanishes
        zRho[at] = 1;
        zT[at] = 1;
        continue;
      }
      const rho = j * hRho;
      base.stateProperties(rho, t, real6);
      idealGas.stateProperties(rho, t, ideal6);
      zRho[at] = real6[0]! / (rho * R * t);
      zT[at] = real6[2]! / (rho * R);
      sRes[at] = real6[3]! - ideal6[3]!;
      uRes[at] = real6[4]! - ideal6[4]!;
      cvRes[at] = real6[5]! - ideal6[5]!;
    }
    zP[i * nP] = base.compressibility(0, t);
    for (let k = 1; k < nP; k++) {
      const p = k * hP;
      const rho = base.densityMolM3(p, t);
      zP[i * nP + k] = p / (rho * R * t);
    }
  }
  const invHT = 1 / hT;
  const invHRho = 1 / hRho;
  const invHP = 1 / hP;

  const scratch = new Float64Array(2);

  // The grid cell of the last successful lookup: index of its (T_i, ρ_j) corner and the fractions
  // within it. Kept in closure variables so the hot path allocates nothing.
  let cellA = 0;
  let cellFx = 0;
  let cellFy = 0;

  /** Finds the grid cell of (ρ, T) into cellA/cellFx/cellFy; false outside the grid. */
  function locate(rho: number, tempK: number): boolean {
    if (!(tempK >= t0 && tempK <= tMax && rho >= 0 && rho <= rhoMax)) return false;
    const x = (tempK - t0) * invHT;
    let i = Math.floor(x);
    if (i >= nT - 1) i = nT - 2;
    const y = rho * invHRho;
    let j = Math.floor(y);
    if (j >= nRho - 1) j = nRho - 2;
    cellA = i * nRho + j;
    cellFx = x - i;
    cellFy = y - j;
    return true;
  }

  /** Bilinear P and ∂P/∂ρ from the (T, ρ) table; returns false outside the grid. */
  function lookupP(rho: number, tempK: number, out: Float64Array): boolean {
    if (!locate(rho, tempK)) return false;
    const a = cellA;
    const b = a + nRho;
    const z0 = zRho[a]! + (zRho[b]! - zRho[a]!) * cellFx; // at ρ_j
    const z1 = zRho[a + 1]! + (zRho[b + 1]! - zRho[a + 1]!) * cellFx; // at ρ_j+1
    const dz = (z1 - z0) * invHRho;
    const z = z0 + (z1 - z0) * cellFy;
    const rt = R * tempK;
    out[0] = rho * rt * z;
    out[1] = rt * (z + rho * dz);
    return true;
  }

  /**
   * All six stateProperties slots from the tables (bilinear) plus the exact ideal-gas parts; false
   * outside the grid or at zero density.
   */
  function lookupState(rho: number, tempK: number, out: Float64Array): boolean {
    if (!(rho > 0 && lookupP(rho, tempK, out))) return false; // lookupP located the cell
    const a = cellA;
    const b = a + nRho;
    const fx = cellFx;
    const fy = cellFy;
    const w00 = (1 - fx) * (1 - fy);
    const w01 = (1 - fx) * fy;
    const w10 = fx * (1 - fy);
    const w11 = fx * fy;
    idealGas.stateProperties(rho, tempK, ideal6);
    out[2] = rho * R * (w00 * zT[a]! + w01 * zT[a + 1]! + w10 * zT[b]! + w11 * zT[b + 1]!);
    out[3] = ideal6[3]! + (w00 * sRes[a]! + w01 * sRes[a + 1]! + w10 * sRes[b]! + w11 * sRes[b + 1]!);
    out[4] = ideal6[4]! + (w00 * uRes[a]! + w01 * uRes[a + 1]! + w10 * uRes[b]! + w11 * uRes[b + 1]!);
    out[5] = ideal6[5]! + (w00 * cvRes[a]! + w01 * cvRes[a + 1]! + w10 * cvRes[b]! + w11 * cvRes[b + 1]!);
    return true;
  }
  const state6 = new Float64Array(6);

  function checkArgs(rho: number, tempK: number): void {
    if (!(rho >= 0 && Number.isFinite(rho)))
      throw new InputError(`densityMolM3: ${rho} mol/m³ is not a physical density (expected ≥ 0)`);
    if (!(tempK > 0)) throw new InputError(`tempK: ${tempK} K is not a temperature`);
  }

  const table: GasModel = {
    kind: "table",
    pressurePa(rho, tempK) {
      checkArgs(rho, tempK);
      if (lookupP(rho, tempK, scratch)) return scratch[0]!;
      return base.pressurePa(rho, tempK);
    },
    pressureAndSlope(rho, tempK, out) {
      checkArgs(rho, tempK);
      if (!lookupP(rho, tempK, out)) base.pressureAndSlope(rho, tempK, out);
    },
    densityMolM3(pressurePa: number, tempK: number, options?: DensityOptions) {
      if (!(pressurePa > 0 && pressurePa <= pMax && tempK >= t0 && tempK <= tMax)) {
        return base.densityMolM3(pressurePa, tempK, options);
      }
      const x = (tempK - t0) * invHT;
      let i = Math.floor(x);
      if (i >= nT - 1) i = nT - 2;
      const fx = x - i;
      const y = pressurePa * invHP;
      let k = Math.floor(y);
      if (k >= nP - 1) k = nP - 2;
      const fy = y - k;
      const a = i * nP + k;
      const b = a + nP;
      const z0 = zP[a]! + (zP[b]! - zP[a]!) * fx;
      const z1 = zP[a + 1]! + (zP[b + 1]! - zP[a + 1]!) * fx;
      let rho = pressurePa / (R * tempK * (z0 + (z1 - z0) * fy));
      // One Newton step on the (T, ρ) table makes density and pressure lookups mutually consistent.
      if (lookupP(rho, tempK, scratch)) rho -= (scratch[0]! - pressurePa) / scratch[1]!;
      return rho;
    },
    stateProperties(rho, t, out) {
      checkArgs(rho, t);
      if (!lookupState(rho, t, out)) base.stateProperties(rho, t, out);
    },
    compressibility(rho, t) {
      checkArgs(rho, t);
      return lookupP(rho, t, scratch)
        ? rho > 0
          ? scratch[0]! / (rho * R * t)
          : 1
        : base.compressibility(rho, t);
    },
    internalEnergyJMol(rho, t) {
      checkArgs(rho, t);
      return lookupState(rho, t, state6) ? state6[4]! : base.internalEnergyJMol(rho, t);
    },
    entropyJMolK(rho, t) {
      checkArgs(rho, t);
      return lookupState(rho, t, state6) ? state6[3]! : base.entropyJMolK(rho, t);
    },
    helmholtzJMol: (rho, t) => base.helmholtzJMol(rho, t),
    cvJMolK(rho, t) {
      checkArgs(rho, t);
      return lookupState(rho, t, state6) ? state6[5]! : base.cvJMolK(rho, t);
    },
    cpJMolK: (rho, t) => base.cpJMolK(rho, t),
    speedOfSoundMS: (rho, t) => base.speedOfSoundMS(rho, t),
  };
  return table;
}
