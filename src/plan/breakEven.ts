/**
 * Start energy against temperature and the break-even temperatures of a profile (docs/methods.md,
 * "Break-even temperatures"): for one and for two accumulators (the cold-start option's count), with
 * the gas amount on the low tolerance line, the reference or the high line, charged to the low or the
 * nominal system pressure, the hydraulic energy a start delivers at thermal equilibrium (or after an
 * overnight drop: charged at the afternoon temperature, trapped, cooled) against the profile's
 * required energy. A break-even temperature is the ambient below which a case falls short; it is
 * found by bisection on the real-gas model inside a bracket, never read off a grid.
 */
import { bisect } from "simple-statistics";
import { interpolateClamped } from "../physics/accumulator.js";
import type { GasModel } from "../physics/nitrogen.js";
import { equilibriumStartEnergyJ, type StartUnits, trappedStartEnergyJ } from "../physics/startEnergy.js";
import { absPa, cToK, fToK, kToC, type Units } from "../units/index.js";
import { fluidOf, geometryOf, prechargeAmountsMol, starterOf } from "./context.js";
import type { ProfileInput } from "./planFile.js";
import type { BreakEvenReason, BreakEvenRow, DesignPointRow, PrechargeLine, SystemLine } from "./results.js";

export type { BreakEvenReason, BreakEvenRow, DesignPointRow, PrechargeLine, SystemLine };

/** One energy case: units, the gas amount's line and the system pressure charged to. */
export interface EnergyCase {
  units: 1 | 2;
  precharge: PrechargeLine;
  system: SystemLine;
}

/** Every case, in the order of `profiles[].breakEven[]`: units, then precharge line, then system pressure. */
export const ENERGY_CASES: readonly EnergyCase[] = ([1, 2] as const).flatMap((units) =>
  (["low", "nominal", "high"] as const).flatMap((precharge) =>
    (["low", "nominal"] as const).map((system) => ({ units, precharge, system })),
  ),
);

/** A temperature range, K. */
export interface TempRangeK {
  fromK: number;
  toK: number;
}

/**
 * The temperature range of the energy curves and break-even search: the `coldsoak band` command's
 * default range in the plan's units (−60 to 140 °F, or −50 to 60 °C).
 */
export function defaultEnergyRangeK(units: Units): TempRangeK {
  return units === "us" ? { fromK: fToK(-60), toK: fToK(140) } : { fromK: cToK(-50), toK: cToK(60) };
}

/** A profile at one atmosphere, in SI: what the energy of every case needs. */
export interface EnergyProfile {
  model: GasModel;
  units: Record<1 | 2, StartUnits>;
  fluid: ReturnType<typeof fluidOf>;
  amountMol: Record<PrechargeLine, number>;
  systemAbsPa: Record<SystemLine, number>;
  /** Required energy against ambient temperature (K → J), linear, held beyond its ends. */
  energyTable: { x: number; y: number }[];
}

/** The profile's energy inputs at atmPa with a gas model. */
export function energyProfile(profile: ProfileInput, atmPa: number, model: GasModel): EnergyProfile {
  const geometry = geometryOf(profile);
  const starter = starterOf(profile, atmPa);
  const amounts = prechargeAmountsMol(profile, model, atmPa);
  return {
    model,
    units: {
      1: { geometry, count: 1, starter },
      2: { geometry, count: profile.coldStartOption.count, starter },
    },
    fluid: fluidOf(profile),
    amountMol: { low: amounts.lowMol, nominal: amounts.nominalMol, high: amounts.highMol },
    systemAbsPa: {
      low: absPa(profile.system.low, atmPa),
      nominal: absPa(profile.system.nominal, atmPa),
    },
    energyTable: profile.startEnergy.map((r) => ({ x: r.ambient, y: r.energy })),
  };
}

/** Energy one start needs at an ambient temperature, J. */
export function requiredEnergyJ(p: EnergyProfile, tempK: number): number {
  return interpolateClamped(p.energyTable, tempK);
}

/**
 * Energy a case delivers at a morning (ambient = accumulator) temperature, J: at equilibrium when
 * dropK is 0, else charged dropK warmer, trapped and cooled to tempK.
 */
export function caseEnergyJ(p: EnergyProfile, c: EnergyCase, tempK: number, dropK = 0): number {
  const units = p.units[c.units];
  const n = p.amountMol[c.precharge];
  const sys = p.systemAbsPa[c.system];
  return dropK === 0
    ? equilibriumStartEnergyJ(p.model, units, n, tempK, sys)
    : trappedStartEnergyJ(p.model, units, p.fluid, n, tempK + dropK, tempK, sys);
}

/** Energies of every case at one temperature, in the order of `ENERGY_CASES`. */
export interface EnergyRow {
  tempK: number;
  requiredJ: number;
  energyJ: number[];
}

/**
 * Energy of every case against temperature (at equilibrium, or after a drop of dropK) and the
 * requirement, for the energy curves of the command line and the report.
 */
export function energyRows(p: EnergyProfile, tempsK: number[], dropK = 0): EnergyRow[] {
  return tempsK.map((tempK) => ({
    tempK,
    requiredJ: requiredEnergyJ(p, tempK),
    energyJ: ENERGY_CASES.map((c) => caseEnergyJ(p, c, tempK, dropK)),
  }));
}

/**
 * Bracket scan step, K. The delivered energy is smooth in temperature and the requirement linear
 * between its table's rows, which are scan points too, so no pair of crossings hides between two
 * neighbouring points at this spacing.
 */
const SCAN_STEP_K = 4;
/** Bisection stops when the bracket's half-width is below this, K. */
const TOLERANCE_K = 1e-4;
const MAX_ITERATIONS = 100;

/** Scan points: every SCAN_STEP_K from the range's start, its end, and the given kinks inside it. */
function scanPoints(range: TempRangeK, kinksK: number[]): number[] {
  const steps = Math.ceil((range.toK - range.fromK) / SCAN_STEP_K);
  const grid = Array.from({ length: steps }, (_, i) => range.fromK + i * SCAN_STEP_K);
  const inside = kinksK.filter((k) => k > range.fromK && k < range.toK);
  return [...new Set([...grid, ...inside, range.toK])].sort((a, b) => a - b);
}

/**
 * The ambient below which a margin (delivered − required, J) turns negative: a scan finds the warmest
 * bracket with a shortfall on its cold side and none on its warm side, and the bisection of
 * simple-statistics narrows it to TOLERANCE_K. Without such a bracket: "short everywhere" when the
 * coldest temperature of the range falls short, else "never short".
 *
 * @param margin delivered minus required energy at a temperature (K → J)
 * @param range temperature range, K (fromK < toK)
 * @param kinksK temperatures where the margin may bend (the requirement table's rows), K
 * @returns the break-even temperature (K) or null with the reason
 *
 * References: bisection method (simple-statistics `bisect`); docs/methods.md, "Break-even temperatures".
 *
 * @example
 * breakEvenK((t) => t - 250, { fromK: 220, toK: 300 }); // { tempK: ≈ 250, reason: null }
 */
export function breakEvenK(
  margin: (tempK: number) => number,
  range: TempRangeK,
  kinksK: number[] = [],
): { tempK: number | null; reason: BreakEvenReason | null } {
  if (!(range.toK > range.fromK)) throw new RangeError(`empty range ${range.fromK}–${range.toK} K`);
  const temps = scanPoints(range, kinksK);
  const values = temps.map(margin);
  for (let i = temps.length - 2; i >= 0; i--) {
    if (!(values[i]! < 0 && values[i + 1]! >= 0)) continue;
    // The bisection asks for f(start) again and again: remember the values it has seen.
    const seen = new Map<number, number>([
      [temps[i]!, values[i]!],
      [temps[i + 1]!, values[i + 1]!],
    ]);
    const f = (t: number) => {
      let v = seen.get(t);
      if (v === undefined) {
        v = margin(t);
        seen.set(t, v);
      }
      // Zero counts as enough: the root is where a shortfall begins.
      return v >= 0 ? Math.max(v, Number.MIN_VALUE) : v;
    };
    return { tempK: bisect(f, temps[i]!, temps[i + 1]!, MAX_ITERATIONS, TOLERANCE_K), reason: null };
  }
  return { tempK: null, reason: values[0]! < 0 ? "short everywhere" : "never short" };
}

/** A case's break-even row for a margin function. */
function row(p: EnergyProfile, c: EnergyCase, range: TempRangeK, dropK: number): BreakEvenRow {
  const found = breakEvenK(
    (t) => caseEnergyJ(p, c, t, dropK) - requiredEnergyJ(p, t),
    range,
    p.energyTable.map((r) => r.x),
  );
  return {
    units: c.units,
    count: p.units[c.units].count,
    precharge: c.precharge,
    system: c.system,
    ambientC: found.tempK === null ? null : kToC(found.tempK),
    reason: found.reason,
  };
}

/**
 * Break-even temperatures at thermal equilibrium (accumulator at the ambient, charged to the system
 * pressure) of every case of `ENERGY_CASES`.
 *
 * @param profile the plan's profile
 * @param atmPa atmospheric pressure its gauge values are relative to, Pa absolute
 * @param model gas model (the real gas of Span et al. 2000 for results; the ideal model to compare)
 * @param range temperature range searched, K
 * @returns one row per case, in the order of `ENERGY_CASES`
 *
 * References: Span, R. et al. (2000), J. Phys. Chem. Ref. Data 29(6); docs/methods.md, "Break-even
 * temperatures".
 *
 * @example
 * equilibriumBreakEven(plan.profiles[0], 101325, realGas, { fromK: 222.04, toK: 333.15 });
 * // [{ units: 1, count: 1, precharge: "low", system: "low", ambientC: …, reason: null }, …]
 */
export function equilibriumBreakEven(
  profile: ProfileInput,
  atmPa: number,
  model: GasModel,
  range: TempRangeK,
): BreakEvenRow[] {
  const p = energyProfile(profile, atmPa, model);
  return ENERGY_CASES.map((c) => row(p, c, range, 0));
}

/**
 * Break-even temperatures after an overnight drop (charged dropK warmer, trapped, cooled to the
 * morning's ambient) of every case, for one drop of a base.
 *
 * @param profile the plan's profile
 * @param atmPa the base's atmospheric pressure, Pa absolute
 * @param model gas model
 * @param range temperature range of the morning searched, K
 * @param drop which drop ("typical" or "p90") and its size, K
 * @returns one row per case, in the order of `ENERGY_CASES`, with the profile and the drop
 *
 * References: as `equilibriumBreakEven`; docs/methods.md §3, "Trapped charge".
 *
 * @example
 * afterDropBreakEven(profile, 99_500, realGas, range, { drop: "p90", dropK: 14.2 });
 */
export function afterDropBreakEven(
  profile: ProfileInput,
  atmPa: number,
  model: GasModel,
  range: TempRangeK,
  drop: { drop: DesignPointRow["drop"]; dropK: number },
): DesignPointRow[] {
  const p = energyProfile(profile, atmPa, model);
  return ENERGY_CASES.map((c) => ({
    profile: profile.name,
    ...row(p, c, range, drop.dropK),
    drop: drop.drop,
    dropC: drop.dropK,
  }));
}
