/**
 * Nitrogen supply from high-pressure cylinders (docs/methods.md §7). Transfers are isothermal at
 * the site temperature. A servicing draws from the cylinders in order of increasing pressure (a
 * cascade): a cylinder gives gas while its pressure exceeds the accumulator's gas pressure plus the
 * transfer differential; the next higher cylinder finishes. The charging hose is vented at disconnect:
 * loss = hose volume × gas density at the final transfer pressure. Other uses of the same cylinders
 * draw a stated amount down to the spent pressure; a cylinder's usable gas is its fill less what is
 * left when it is spent.
 */
import { InputError } from "../errors.js";
import type { GasModel } from "./nitrogen.js";

export interface Cylinder {
  /** Internal (water) volume, m³. */
  waterVolumeM3: number;
  /** Gas held, mol. */
  amountMol: number;
}

export interface SupplySpec {
  cylinderWaterVolumeM3: number;
  /** Fill pressure of a full cylinder, Pa absolute, at fillTempK. */
  fillAbsPa: number;
  fillTempK: number;
  /** A cylinder gives gas only while P_cyl > P_acc + this differential, Pa. */
  transferDifferentialPa: number;
  /** Charging hose internal volume, m³, vented at each disconnect. */
  hoseVolumeM3: number;
}

function fail(param: string, message: string): never {
  throw new InputError(`${param}: ${message}`);
}

function checkSpec(spec: SupplySpec): void {
  if (!(spec.cylinderWaterVolumeM3 > 0))
    fail("cylinderWaterVolumeM3", `${spec.cylinderWaterVolumeM3} m³ must be above 0`);
  if (!(spec.fillAbsPa > 0)) fail("fillAbsPa", `${spec.fillAbsPa} Pa must be above 0`);
  if (!(spec.transferDifferentialPa >= 0)) {
    fail("transferDifferentialPa", `${spec.transferDifferentialPa} Pa must be ≥ 0`);
  }
  if (!(spec.hoseVolumeM3 >= 0)) fail("hoseVolumeM3", `${spec.hoseVolumeM3} m³ must be ≥ 0`);
}

/** A full cylinder: amount = ρ(fill pressure, fill temperature) × water volume. */
export function fullCylinder(model: GasModel, spec: SupplySpec): Cylinder {
  checkSpec(spec);
  return {
    waterVolumeM3: spec.cylinderWaterVolumeM3,
    amountMol: model.densityMolM3(spec.fillAbsPa, spec.fillTempK) * spec.cylinderWaterVolumeM3,
  };
}

/** Pressure in a cylinder at a temperature, Pa absolute. */
export function cylinderPressureAbsPa(model: GasModel, cyl: Cylinder, tempK: number): number {
  if (!(cyl.waterVolumeM3 > 0)) fail("waterVolumeM3", `${cyl.waterVolumeM3} m³ must be above 0`);
  if (!(cyl.amountMol >= 0)) fail("amountMol", `${cyl.amountMol} mol must be ≥ 0`);
  return cyl.amountMol > 0 ? model.pressurePa(cyl.amountMol / cyl.waterVolumeM3, tempK) : 0;
}

/** Gas (mol) to take an accumulator from fromMol to targetMol; 0 if it already holds at least the target. */
export function gasToAddMol(fromMol: number, targetMol: number): number {
  if (!(fromMol >= 0)) fail("fromMol", `${fromMol} mol must be ≥ 0`);
  if (!(targetMol >= 0)) fail("targetMol", `${targetMol} mol must be ≥ 0`);
  return Math.max(0, targetMol - fromMol);
}

export interface CascadeResult {
  /** Cylinders after the servicing (same order as given; the input is not changed). */
  cylinders: Cylinder[];
  /** Gas that ended up in the accumulator, mol. */
  addedMol: number;
  /** Gas vented with the hose at disconnect, mol. */
  ventedMol: number;
  reachedTarget: boolean;
}

/**
 * Cascade servicing of one accumulator (gas volume `accumulatorVolumeM3`, piston on its stop, V0) from
 * fromMol toward targetMol, isothermal at tempK. On connection the hose fills from the accumulator, so
 * accumulator and hose form one receiver of volume V_acc + V_hose at one pressure; the receiver's target
 * is targetMol·(V_acc + V_hose)/V_acc. Cylinders are used in order of increasing pressure; each gives
 * the gas x that reaches the target or brings it down to P_receiver + differential,
 * P_cyl((n_c − x)/V_c) = P_rec((n_r + x)/V_r) + ΔP, solved by bisection (monotonic in x). The first
 * cylinder is connected only if it can also fill the hose to the accumulator's pressure and still exceed
 * it by the differential (else the accumulator is not touched). At disconnect the
 * hose's gas, V_hose × ρ(final pressure), is vented. Cylinders give addedMol + ventedMol in total.
 */
export function cascadeFill(
  model: GasModel,
  cylinders: Cylinder[],
  accumulatorVolumeM3: number,
  fromMol: number,
  targetMol: number,
  tempK: number,
  spec: SupplySpec,
): CascadeResult {
  checkSpec(spec);
  if (!(accumulatorVolumeM3 > 0)) fail("accumulatorVolumeM3", `${accumulatorVolumeM3} m³ must be above 0`);
  if (!(fromMol >= 0)) fail("fromMol", `${fromMol} mol must be ≥ 0`);
  if (!(targetMol > 0)) fail("targetMol", `${targetMol} mol must be above 0`);
  const out = cylinders.map((c) => ({ ...c }));
  if (fromMol >= targetMol) return { cylinders: out, addedMol: 0, ventedMol: 0, reachedTarget: true };

  const vRec = accumulatorVolumeM3 + spec.hoseVolumeM3;
  const recTarget = (targetMol * vRec) / accumulatorVolumeM3;
  let nRec = fromMol;
  const pRec = (n: number): number => (n > 0 ? model.pressurePa(n / vRec, tempK) : 0);
  /** Receiver amount at the accumulator's pressure before connection (hose filled at that pressure). */
  const pAccMolAtReceiver = (n: number): number =>
    n > 0 ? model.densityMolM3(model.pressurePa(n / accumulatorVolumeM3, tempK), tempK) * vRec : 0;
  const order = out
    .map((c, i) => ({ i, p: cylinderPressureAbsPa(model, c, tempK) }))
    .sort((a, b) => a.p - b.p || a.i - b.i);
  let connected = false;
  for (const { i } of order) {
    if (nRec >= recTarget) break;
    const cyl = out[i]!;
    const excess = (x: number): number =>
      cylinderPressureAbsPa(
        model,
        { waterVolumeM3: cyl.waterVolumeM3, amountMol: cyl.amountMol - x },
        tempK,
      ) -
      pRec(nRec + x) -
      spec.transferDifferentialPa;
    // Before the first connection the hose is empty: a cylinder is used only if it can fill the hose and
    // still push, i.e. bring the receiver to the accumulator's own pressure with the differential to spare.
    const base = connected ? 0 : Math.max(0, pAccMolAtReceiver(nRec) - nRec);
    if (base >= cyl.amountMol || !(excess(base) > 0)) continue;
    connected = true;
    const need = recTarget - nRec;
    const most = Math.min(need, cyl.amountMol);
    let x: number;
    if (excess(most) >= 0) {
      x = most;
    } else {
      let lo = base;
      let hi = most;
      for (let k = 0; k < 200 && hi - lo > 1e-13 * hi; k++) {
        const mid = 0.5 * (lo + hi);
        if (excess(mid) > 0) lo = mid;
        else hi = mid;
      }
      x = lo;
    }
    cyl.amountMol -= x;
    nRec += x;
  }
  const accMol = connected ? (nRec * accumulatorVolumeM3) / vRec : fromMol;
  const ventedMol = connected ? nRec - accMol : 0;
  return {
    cylinders: out,
    addedMol: accMol - fromMol,
    ventedMol,
    reachedTarget: nRec >= recTarget * (1 - 1e-12),
  };
}

/** A cylinder is spent once its pressure is below the lowest precharge it will be asked to raise plus the differential. */
export function isCylinderSpent(
  model: GasModel,
  cyl: Cylinder,
  tempK: number,
  lowestTargetAbsPa: number,
  differentialPa: number,
): boolean {
  if (!(lowestTargetAbsPa > 0)) fail("lowestTargetAbsPa", `${lowestTargetAbsPa} Pa must be above 0`);
  if (!(differentialPa >= 0)) fail("differentialPa", `${differentialPa} Pa must be ≥ 0`);
  return cylinderPressureAbsPa(model, cyl, tempK) < lowestTargetAbsPa + differentialPa;
}

/** The gas of one full cylinder at a site temperature: what it holds, what stays in it, what it gives. */
export interface CylinderGas {
  /** Gas of a full cylinder (filled at the fill pressure and temperature), mol. */
  fullMol: number;
  /** Pressure of the full cylinder at the site temperature, Pa absolute. */
  fullAbsPa: number;
  /** Pressure at which it is spent: lowest target + transfer differential, Pa absolute. */
  residualAbsPa: number;
  /** Gas left in it when spent, ρ(residual pressure, T) × water volume, mol (at most the full amount). */
  residualMol: number;
  /** Usable gas = full − residual, mol (0 when the cylinder starts spent). */
  usableMol: number;
}

/**
 * Full, residual and usable gas of one cylinder at a site temperature (isothermal transfers, the
 * cylinder at the site temperature). A cylinder is spent once its pressure is below the lowest precharge
 * target it will be asked to raise plus the transfer differential (`isCylinderSpent`); the gas left
 * then is the residual, ρ(lowest target + differential, T)·V_water, and the rest of the fill is usable.
 * A cylinder filled warm holds the same gas in the cold at a lower pressure, so it gives less before it
 * is spent unless the target falls with the temperature too.
 *
 * @param model gas model (the reference equation of state)
 * @param spec cylinder specification: water volume m³, fill Pa absolute at fillTempK K, differential Pa
 * @param lowestTargetAbsPa lowest precharge target at this temperature, Pa absolute
 * @param tempK site temperature, K
 * @returns full, residual and usable gas, mol, with the full and residual pressures, Pa absolute
 *
 * References: Span et al. (2000) for ρ(P, T); docs/methods.md §7 (spent cylinder, usable gas).
 *
 * @example
 * // 49.9 L filled to 2640 psig at 70 °F, target 1450 psig, differential 50 psi, at 70 °F:
 * // full ≈ 358.6 mol (10.05 kg), residual ≈ 212.4 mol (5.95 kg), usable ≈ 146.2 mol (4.10 kg)
 * cylinderGas(realGas, spec, 1450 * PA_PER_PSI + 101325, fToK(70));
 */
export function cylinderGas(
  model: GasModel,
  spec: SupplySpec,
  lowestTargetAbsPa: number,
  tempK: number,
): CylinderGas {
  const full = fullCylinder(model, spec);
  if (!(lowestTargetAbsPa > 0)) fail("lowestTargetAbsPa", `${lowestTargetAbsPa} Pa must be above 0`);
  const residualAbsPa = lowestTargetAbsPa + spec.transferDifferentialPa;
  const residualMol = Math.min(
    full.amountMol,
    model.densityMolM3(residualAbsPa, tempK) * spec.cylinderWaterVolumeM3,
  );
  return {
    fullMol: full.amountMol,
    fullAbsPa: cylinderPressureAbsPa(model, full, tempK),
    residualAbsPa,
    residualMol,
    usableMol: full.amountMol - residualMol,
  };
}

/**
 * Usable gas of one full cylinder at tempK: fill amount minus the amount left when it becomes spent,
 * ρ(lowest target + differential, T) × water volume (`cylinderGas`).
 */
export function usableMolPerCylinder(
  model: GasModel,
  spec: SupplySpec,
  lowestTargetAbsPa: number,
  tempK: number,
): number {
  return cylinderGas(model, spec, lowestTargetAbsPa, tempK).usableMol;
}

export interface DrawResult {
  /** Cylinders after the draw (same order as given; the input is not changed). */
  cylinders: Cylinder[];
  /** Gas taken from the cylinders, mol. */
  drawnMol: number;
  reachedAmount: boolean;
}

/**
 * A draw of a given amount of gas for another use of the same cylinders (a strut, a tyre): taken from
 * the cylinders in order of increasing pressure, each down to no lower than `floorAbsPa` (the pressure
 * at which it is spent for accumulator servicing), isothermal at tempK. The amount is what the user
 * states the other use takes, its own losses included, so no hose vent is added.
 *
 * @param model gas model
 * @param cylinders the pool (not changed)
 * @param amountMol gas the use takes, mol
 * @param floorAbsPa pressure below which a cylinder gives nothing, Pa absolute
 * @param tempK site temperature, K
 * @returns the pool after the draw, the gas drawn (mol) and whether the whole amount was drawn
 *
 * References: mass balance; docs/methods.md §7 (other uses).
 *
 * @example
 * // 0.5 mol from a pool whose lowest cylinder holds 0.3 mol above the floor: 0.3 from it, 0.2 from the next
 * drawFromCylinders(realGas, pool, 0.5, floorAbsPa, 288.15);
 */
export function drawFromCylinders(
  model: GasModel,
  cylinders: Cylinder[],
  amountMol: number,
  floorAbsPa: number,
  tempK: number,
): DrawResult {
  if (!(amountMol >= 0 && Number.isFinite(amountMol))) fail("amountMol", `${amountMol} mol must be ≥ 0`);
  if (!(floorAbsPa > 0)) fail("floorAbsPa", `${floorAbsPa} Pa must be above 0`);
  const out = cylinders.map((c) => ({ ...c }));
  const order = out
    .map((c, i) => ({ i, p: cylinderPressureAbsPa(model, c, tempK) }))
    .sort((a, b) => a.p - b.p || a.i - b.i);
  const floorMolM3 = model.densityMolM3(floorAbsPa, tempK);
  let left = amountMol;
  for (const { i } of order) {
    if (left <= 0) break;
    const cyl = out[i]!;
    const x = Math.min(left, Math.max(0, cyl.amountMol - floorMolM3 * cyl.waterVolumeM3));
    cyl.amountMol -= x;
    left -= x;
  }
  return { cylinders: out, drawnMol: amountMol - left, reachedAmount: left <= amountMol * 1e-12 };
}

/** Cylinders needed for a gas demand (mol): ⌈demand / usable gas per cylinder⌉. */
export function cylindersForDemand(
  model: GasModel,
  demandMol: number,
  spec: SupplySpec,
  lowestTargetAbsPa: number,
  tempK: number,
): number {
  if (!(demandMol >= 0 && Number.isFinite(demandMol))) fail("demandMol", `${demandMol} mol must be ≥ 0`);
  if (demandMol === 0) return 0;
  const usable = usableMolPerCylinder(model, spec, lowestTargetAbsPa, tempK);
  if (!(usable > 0)) {
    fail(
      "fillAbsPa",
      `a full cylinder (${spec.fillAbsPa} Pa) cannot raise a precharge to ${lowestTargetAbsPa} Pa plus the differential`,
    );
  }
  return Math.ceil(demandMol / usable - 1e-12);
}
