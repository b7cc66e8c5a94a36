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
import { type DensityOptions, type GasModel, N2_GAS_CONSTANT_J_MOLK } from "./nitrogen.js";

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
  minTempK: 203.15,
  maxTempK: 373.15,
  tempStepK: 2,
  maxDensityMolM3: 24000,
  densityStepMolM3: 200,
  maxPressurePa: 45e6,
  pressureStepPa: 0.25e6,
};

const cache = new Map<GasModel, GasModel>();

/**
 * Interpolation-table version of `model` (same interface, kind "table"). Fast for pressurePa,
 * pressureAndSlope and densityMolM3 inside the grid; all other properties come from `model` itself.
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

  // zRho[i*nRho + j] = Z(T_i, ρ_j); zP[i*nP + k] = Z(T_i, P_k)
  const zRho = new Float64Array(nT * nRho);
  const zP = new Float64Array(nT * nP);
  for (let i = 0; i < nT; i++) {
    const t = t0 + i * hT;
    for (let j = 0; j < nRho; j++) zRho[i * nRho + j] = base.compressibility(j * hRho, t);
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

  /** Bilinear P and ∂P/∂ρ from the (T, ρ) table; returns false outside the grid. */
  function lookupP(rho: number, tempK: number, out: Float64Array): boolean {
    if (!(tempK >= t0 && tempK <= tMax && rho >= 0 && rho <= rhoMax)) return false;
    const x = (tempK - t0) * invHT;
    let i = Math.floor(x);
    if (i >= nT - 1) i = nT - 2;
    const fx = x - i;
    const y = rho * invHRho;
    let j = Math.floor(y);
    if (j >= nRho - 1) j = nRho - 2;
    const fy = y - j;
    const a = i * nRho + j;
    const b = a + nRho;
    const z0 = zRho[a]! + (zRho[b]! - zRho[a]!) * fx; // at ρ_j
    const z1 = zRho[a + 1]! + (zRho[b + 1]! - zRho[a + 1]!) * fx; // at ρ_j+1
    const dz = (z1 - z0) * invHRho;
    const z = z0 + (z1 - z0) * fy;
    const rt = R * tempK;
    out[0] = rho * rt * z;
    out[1] = rt * (z + rho * dz);
    return true;
  }

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
    stateProperties: (rho, t, out) => base.stateProperties(rho, t, out),
    compressibility: (rho, t) => base.compressibility(rho, t),
    internalEnergyJMol: (rho, t) => base.internalEnergyJMol(rho, t),
    entropyJMolK: (rho, t) => base.entropyJMolK(rho, t),
    helmholtzJMol: (rho, t) => base.helmholtzJMol(rho, t),
    cvJMolK: (rho, t) => base.cvJMolK(rho, t),
    cpJMolK: (rho, t) => base.cpJMolK(rho, t),
    speedOfSoundMS: (rho, t) => base.speedOfSoundMS(rho, t),
  };
  return table;
}
