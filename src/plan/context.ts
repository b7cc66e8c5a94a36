/**
 * Everything the hour-by-hour simulation needs about one accumulator profile at one base, in SI
 * absolute units: the plan's gauge pressures become absolute with the base's atmospheric pressure
 * (docs/methods.md §3: gauge = absolute − local atmospheric pressure).
 */
import {
  type AccumulatorGeometry,
  type BandInputs,
  type FluidProps,
  gasAmountMol,
  gasLossMolPerS,
  type PumpSpec,
  prechargePressureAbsPa,
  readingBand,
  type StarterSpec,
} from "../physics/accumulator.js";
import type { GasModel } from "../physics/nitrogen.js";
import { absPa, gaugePa, S_PER_MONTH } from "../units/index.js";
import { type DischargeGrid, dischargeGrid } from "./dischargeGrid.js";
import type { ProfileInput } from "./planFile.js";

/** Reading band tabulated against temperature and interpolated linearly (it is smooth in T). */
export interface BandTable {
  minK: number;
  stepK: number;
  low: Float64Array;
  nominal: Float64Array;
  high: Float64Array;
}

export interface ProfileContext {
  name: string;
  model: GasModel;
  geometry: AccumulatorGeometry;
  fluid: FluidProps;
  atmPa: number;
  /** Gas amount per unit fixed by the precharge reference (piston on the fluid-side stop, V0). */
  nominalMol: number;
  /** Amounts through the tolerance lines (reference ± tolerance at the reference temperature). */
  lowMol: number;
  highMol: number;
  refTempK: number;
  systemNominalAbsPa: number;
  /** Thermal relief valve of the trapped charge, Pa absolute; null: none (docs/methods.md §3). */
  reliefAbsPa: number | null;
  band: BandInputs;
  bandTable: BandTable;
  starter: StarterSpec;
  energyTable: { x: number; y: number }[];
  /** True when the cold-start option is fitted in this configuration. */
  fitted: boolean;
  /** Units fitted in this configuration (1, or the option's count) and their pump timer. */
  count: number;
  optionCount: number;
  pump: PumpSpec;
  /**
   * The other configuration, followed alongside for the energy "with one and with two accumulators"
   * (README; docs/methods.md §5): one unit on the pump's own timer when the option is fitted, else the option's
   * count on the option's timer.
   */
  altCount: number;
  altPump: PumpSpec;
  handPump: { displacementM3: number; efficiency: number };
  tauS: number;
  /** Nominal gas loss per unit, mol/s (the profile's monthly pressure drop at the reference and V0). */
  gasLossMolS: number;
  /** Interpolated start discharges (null: exact physics at every start). */
  dischargeGrid: DischargeGrid | null;
}

const BAND_MIN_K = 203.15;
const BAND_MAX_K = 373.15;
const BAND_STEP_K = 0.5;

export function buildBandTable(model: GasModel, geometry: AccumulatorGeometry, band: BandInputs): BandTable {
  const n = Math.round((BAND_MAX_K - BAND_MIN_K) / BAND_STEP_K) + 1;
  const t: BandTable = {
    minK: BAND_MIN_K,
    stepK: BAND_STEP_K,
    low: new Float64Array(n),
    nominal: new Float64Array(n),
    high: new Float64Array(n),
  };
  for (let i = 0; i < n; i++) {
    const b = readingBand(model, geometry, band, BAND_MIN_K + i * BAND_STEP_K);
    t.low[i] = b.lowPct;
    t.nominal[i] = b.nominalPct;
    t.high[i] = b.highPct;
  }
  return t;
}

/** Band at tempK by linear interpolation in the table (held at its ends). */
export function bandAt(t: BandTable, tempK: number, which: "low" | "nominal" | "high"): number {
  const arr = t[which];
  const x = (tempK - t.minK) / t.stepK;
  if (!(x > 0)) return arr[0]!;
  const i = Math.floor(x);
  if (i >= arr.length - 1) return arr[arr.length - 1]!;
  const f = x - i;
  return arr[i]! + f * (arr[i + 1]! - arr[i]!);
}

/** Precharge line of the nominal amount at tempK (absolute). */
export function prechargeLineAbsPa(ctx: ProfileContext, tempK: number, amountMol = ctx.nominalMol): number {
  return prechargePressureAbsPa(ctx.model, amountMol, tempK, ctx.geometry.v0M3);
}

/** The physics's band inputs (precharge reference, tolerance, system pressures) of a profile at atmPa. */
export function bandInputsOf(profile: ProfileInput, atmPa: number): BandInputs {
  const ref = profile.precharge.reference;
  return {
    refGaugePa: gaugePa(ref.pressure, atmPa),
    refTempK: ref.tempK,
    tolerancePa: profile.precharge.tolerance,
    systemLowGaugePa: gaugePa(profile.system.low, atmPa),
    systemNominalGaugePa: gaugePa(profile.system.nominal, atmPa),
    systemHighGaugePa: gaugePa(profile.system.high, atmPa),
    atmPa,
  };
}

/** V0 and Vmin of a profile, m³. */
export function geometryOf(profile: ProfileInput): AccumulatorGeometry {
  return { v0M3: profile.accumulator.gasVolumeEmpty, vminM3: profile.accumulator.gasVolumeFull };
}

/** The trapped fluid of a profile: expansion (1/K), bulk modulus (Pa), line volume (m³). */
export function fluidOf(profile: ProfileInput): FluidProps {
  return {
    alphaPerK: profile.fluid.expansionPerK,
    bulkModulusPa: profile.fluid.bulkModulus,
    lineVolumeM3: profile.fluid.lineVolume,
  };
}

/** The starter of a profile at atmPa: minimum useful and return pressures, Pa absolute. */
export function starterOf(profile: ProfileInput, atmPa: number): StarterSpec {
  return {
    minUsefulAbsPa: absPa(profile.starter.minUsefulPressure, atmPa),
    returnAbsPa: absPa(profile.starter.returnPressure, atmPa),
    isothermal: profile.starter.expansion === "isothermal",
  };
}

/** The pump of a profile at atmPa with a run timer (s): flow against gauge pressure. */
export function pumpOf(profile: ProfileInput, atmPa: number, timerS: number): PumpSpec {
  const curve = profile.pump.curve.map((r) => ({ gaugePa: gaugePa(r.pressure, atmPa), flowM3S: r.flow }));
  return { curve, timerS, atmPa };
}

/**
 * Gas amounts per unit (mol) at atmPa: nominal through the precharge reference, low and high through
 * the reference ∓ its tolerance, all at the reference temperature with the piston on the V0 stop.
 */
export function prechargeAmountsMol(
  profile: ProfileInput,
  model: GasModel,
  atmPa: number,
): { nominalMol: number; lowMol: number; highMol: number } {
  const v0M3 = profile.accumulator.gasVolumeEmpty;
  const ref = profile.precharge.reference;
  const refAbs = absPa(ref.pressure, atmPa);
  const tol = profile.precharge.tolerance;
  return {
    nominalMol: gasAmountMol(model, refAbs, ref.tempK, v0M3),
    lowMol: gasAmountMol(model, Math.max(refAbs - tol, 1), ref.tempK, v0M3),
    highMol: gasAmountMol(model, refAbs + tol, ref.tempK, v0M3),
  };
}

/** Options of `profileContext`. */
export interface ContextOptions {
  /** Exact physics at every start instead of the interpolated discharge grid. */
  exactDischarge?: boolean;
  /** A context of the same profile, gas model and atmospheric pressure whose tables are reused. */
  tablesOf?: ProfileContext;
}

/** Builds the context of one profile at a base whose atmospheric pressure is atmPa. */
export function profileContext(
  profile: ProfileInput,
  model: GasModel,
  atmPa: number,
  coldStartOption: boolean,
  options: ContextOptions = {},
): ProfileContext {
  const geometry = geometryOf(profile);
  const ref = profile.precharge.reference;
  const refAbs = absPa(ref.pressure, atmPa);
  const { nominalMol, lowMol, highMol } = prechargeAmountsMol(profile, model, atmPa);
  const band = bandInputsOf(profile, atmPa);
  const bandTable = options.tablesOf?.bandTable ?? buildBandTable(model, geometry, band);
  const count = coldStartOption ? profile.coldStartOption.count : 1;
  const starter = starterOf(profile, atmPa);
  const pumpOne = pumpOf(profile, atmPa, profile.pump.timer);
  const pumpOption = pumpOf(profile, atmPa, profile.coldStartOption.timer);
  const grid = options.exactDischarge
    ? null
    : (options.tablesOf?.dischargeGrid ?? dischargeGrid(model, geometry, starter, nominalMol));
  return {
    name: profile.name,
    model,
    geometry,
    fluid: fluidOf(profile),
    atmPa,
    nominalMol,
    lowMol,
    highMol,
    refTempK: ref.tempK,
    systemNominalAbsPa: absPa(profile.system.nominal, atmPa),
    reliefAbsPa: profile.reliefPressure === undefined ? null : absPa(profile.reliefPressure, atmPa),
    band,
    bandTable,
    starter,
    energyTable: profile.startEnergy.map((r) => ({ x: r.ambient, y: r.energy })),
    fitted: coldStartOption,
    count,
    optionCount: profile.coldStartOption.count,
    pump: coldStartOption ? pumpOption : pumpOne,
    altCount: coldStartOption ? 1 : profile.coldStartOption.count,
    altPump: coldStartOption ? pumpOne : pumpOption,
    handPump: { displacementM3: profile.handPump.displacement, efficiency: profile.handPump.efficiency },
    tauS: profile.thermalTimeConstant,
    // The plan's rate is a pressure per second; the physics takes the month's drop at the reference.
    gasLossMolS: gasLossMolPerS(model, refAbs, ref.tempK, geometry.v0M3, profile.gasLoss.rate * S_PER_MONTH),
    dischargeGrid: grid,
  };
}

/**
 * The contexts of one run, each built once per profile, atmospheric pressure and cold-start option;
 * the two option variants of a profile at one pressure share their band table and discharge grid.
 */
export class ProfileContexts {
  private readonly built = new Map<
    ProfileInput,
    Map<number, [ProfileContext | null, ProfileContext | null]>
  >();

  constructor(readonly model: GasModel) {}

  get(profile: ProfileInput, atmPa: number, coldStartOption: boolean): ProfileContext {
    const byAtm =
      this.built.get(profile) ?? new Map<number, [ProfileContext | null, ProfileContext | null]>();
    this.built.set(profile, byAtm);
    const pair = byAtm.get(atmPa) ?? [null, null];
    byAtm.set(atmPa, pair);
    const slot = coldStartOption ? 1 : 0;
    let ctx = pair[slot];
    if (ctx === null) {
      const other = pair[1 - slot];
      ctx = profileContext(profile, this.model, atmPa, coldStartOption, other ? { tablesOf: other } : {});
      pair[slot] = ctx;
    }
    return ctx;
  }
}
