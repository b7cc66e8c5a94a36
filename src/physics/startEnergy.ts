/**
 * Start energy of a charge in a known state, for the energy-against-temperature curves and the
 * break-even temperatures (docs/methods.md §3, "Start energy", and "Break-even temperatures"): a
 * charge at thermal equilibrium, and a charge trapped since a warmer recharge and cooled by the
 * overnight drop. Pure functions, SI inside (Pa absolute, K, m³, mol, J).
 */
import {
  type AccumulatorGeometry,
  chargedState,
  type FluidProps,
  type StarterSpec,
  startDischarge,
  trappedState,
} from "./accumulator.js";
import type { GasModel } from "./nitrogen.js";

/** The units discharged and the starter they drive. */
export interface StartUnits {
  geometry: AccumulatorGeometry;
  /** Identical units in parallel (energies scale with the count). */
  count: number;
  starter: StarterSpec;
}

/** True when the gas amount at V0 and tempK already holds the system pressure: no fluid can be stored. */
function prechargeAtOrAbove(
  model: GasModel,
  v0M3: number,
  amountMol: number,
  tempK: number,
  systemAbsPa: number,
): boolean {
  return model.pressurePa(amountMol / v0M3, tempK) >= systemAbsPa;
}

/**
 * Hydraulic start energy of `count` units charged at thermal equilibrium at tempK to the system
 * pressure, then discharged at once (isentropic expansion, or isothermal as the starter says, to the
 * 0 % stop or the starter's minimum useful pressure): the charged gas volume is n/ρ(P_sys, T), held
 * at Vmin when the piston would pass its gas-side stop; a precharge at or above the system pressure
 * stores no fluid and delivers nothing.
 *
 * @param model gas model (Span et al. 2000 real gas, or its ideal part)
 * @param units geometry (V0, Vmin, m³), count and starter (minimum useful and return pressures, Pa absolute)
 * @param amountMol gas amount per unit, mol
 * @param tempK accumulator (= ambient) temperature, K
 * @param systemAbsPa system pressure the pump charges to, Pa absolute
 * @returns hydraulic energy ∫(P − P_return) dV over all units, J
 *
 * References: Span, R. et al. (2000), "A reference equation of state for the thermodynamic properties
 * of nitrogen ...", J. Phys. Chem. Ref. Data 29(6); first law for a reversible adiabatic closed
 * system (the gas work is its internal-energy drop); docs/methods.md §3, "Start energy".
 *
 * @example
 * // 5 L unit, 1450 psig at 70 °F, charged to 3000 psig at 70 °F, discharged to 1000 psig: ≈ 25.40 kJ
 * equilibriumStartEnergyJ(realGas, { geometry: { v0M3: 5e-3, vminM3: 1.5e-3 }, count: 1, starter }, n, 294.261, 20.786e6);
 */
export function equilibriumStartEnergyJ(
  model: GasModel,
  units: StartUnits,
  amountMol: number,
  tempK: number,
  systemAbsPa: number,
): number {
  const { geometry } = units;
  if (prechargeAtOrAbove(model, geometry.v0M3, amountMol, tempK, systemAbsPa)) return 0;
  const volumeM3 = Math.max(geometry.vminM3, amountMol / model.densityMolM3(systemAbsPa, tempK));
  return startDischarge(model, geometry, units.count, amountMol, tempK, volumeM3, units.starter)
    .hydraulicEnergyJ;
}

/**
 * Hydraulic start energy after an overnight drop: the units were charged at thermal equilibrium at
 * chargeTempK to the system pressure, the fluid was trapped (accumulator plus line volume, expansion
 * and bulk modulus of the fluid: `trappedState`), the charge cooled to tempK, and it is discharged
 * there. The gas keeps its amount; no thermal relief opens on cooling.
 *
 * @param model gas model
 * @param units geometry (m³), count and starter (Pa absolute)
 * @param fluid α (1/K), bulk modulus (Pa) and trapped line volume (m³)
 * @param amountMol gas amount per unit, mol
 * @param chargeTempK temperature of the recharge (the afternoon), K
 * @param tempK temperature at the start (the morning), K
 * @param systemAbsPa system pressure of the recharge, Pa absolute
 * @returns hydraulic energy over all units, J
 *
 * References: Span, R. et al. (2000), J. Phys. Chem. Ref. Data 29(6); docs/methods.md §3, "Trapped
 * charge" and "Start energy".
 *
 * @example
 * // The 5 L unit charged to 3000 psig at 80 °F and cooled by 10 K before the start:
 * trappedStartEnergyJ(realGas, units, fluid, n, 299.82, 289.82, 20.786e6); // below the equilibrium value at 289.82 K
 */
export function trappedStartEnergyJ(
  model: GasModel,
  units: StartUnits,
  fluid: FluidProps,
  amountMol: number,
  chargeTempK: number,
  tempK: number,
  systemAbsPa: number,
): number {
  const { geometry } = units;
  if (prechargeAtOrAbove(model, geometry.v0M3, amountMol, chargeTempK, systemAbsPa)) return 0;
  const c = chargedState(model, geometry, fluid, amountMol, chargeTempK, systemAbsPa);
  const now = trappedState(model, geometry, fluid, c, tempK, amountMol);
  return startDischarge(model, geometry, units.count, amountMol, tempK, now.gasVolumeM3, units.starter)
    .hydraulicEnergyJ;
}
