/**
 * The allowed range of every value of the plan file, checked where the value is read: a value out of
 * range is refused with the text the user wrote and the range in the unit the user wrote it in
 * (`"-150 C" is below nitrogen's critical temperature, -146.958 C, …; expected a temperature above
 * -146.958 C and at most 726.85 C`). README, "Limits on inputs", lists them.
 *
 * Gas temperatures lie above nitrogen's critical temperature (below it the charge may liquefy) and
 * within the reference equation's range (Span et al. 2000, docs/methods.md §2). The other bounds keep
 * every figure finite and are far beyond any aircraft accumulator, hydraulic system or nitrogen cart
 * (common practice, no source): pressures up to 100 MPa (14,504 psi), volumes up to 1 m³.
 */
import { z } from "zod";
import { TEMP_MAX_TENTHS } from "../climate/qc.js";
import { InputError } from "../errors.js";
import { N2_CRITICAL_TEMP_K, N2_MAX_TEMP_K, realGas } from "../physics/nitrogen.js";
import {
  absPa,
  cToK,
  kToC,
  M3_PER_LITRE,
  PA_PER_GPA,
  PA_PER_MPA,
  type PointPressure,
  type PressureAt,
  parsePointPressure,
  parseTemperatureK,
  S_PER_DAY,
  S_PER_MIN,
  S_PER_YEAR,
  STANDARD_ATMOSPHERE_PA,
  showWithUnit,
  type Units,
  unitSystem,
  writtenUnit,
} from "../units/index.js";
import { q } from "./planQuantity.js";

/** An interval of SI values, what it holds, and what to say when a value lies below or above it. */
export interface Limit {
  min?: number;
  /** True: the minimum itself is outside (a value must lie above it). */
  minOpen?: boolean;
  max?: number;
  /** "a volume", "a temperature": what the expected value is. */
  what: string;
  /** Why a value below the minimum is refused, given the minimum as written in the user's unit. */
  below?: (bound: string) => string;
  /** Why a value above the maximum is refused. */
  above?: (bound: string) => string;
}

/** Highest pressure of any kind the plan may state, Pa (100 MPa = 14,504 psi). */
export const MAX_PRESSURE_PA = 100 * PA_PER_MPA;

/** Temperatures of the gas: above the critical point, within the equation of state (Span et al. 2000). */
export const GAS_TEMPERATURE: Limit = {
  min: N2_CRITICAL_TEMP_K,
  minOpen: true,
  max: N2_MAX_TEMP_K,
  what: "a temperature",
  below: (b) => `is below nitrogen's critical temperature, ${b}, where the charge may liquefy`,
  above: (b) => `is above ${b}, the upper limit of the nitrogen equation of state (Span et al. 2000)`,
};
export const VOLUME: Limit = { min: 0, minOpen: true, max: 1, what: "a volume" };
export const VOLUME_OR_NONE: Limit = { min: 0, max: 1, what: "a volume" };
export const EXPANSION: Limit = { min: 0, max: 0.01, what: "a volumetric expansion coefficient" };
export const BULK_MODULUS: Limit = { min: 0, minOpen: true, max: 1000 * PA_PER_GPA, what: "a bulk modulus" };
export const PRESSURE_DIFFERENCE: Limit = { min: 0, max: MAX_PRESSURE_PA, what: "a pressure difference" };
/** A lag behind the air (accumulator, shelter): hours in practice; 0 follows the air itself. */
export const TIME_CONSTANT: Limit = { min: 0, max: 30 * S_PER_DAY, what: "a time constant" };
/** A pump run timer. */
export const TIMER: Limit = { min: 0, minOpen: true, max: S_PER_DAY, what: "a timer" };
export const RESUPPLY_INTERVAL: Limit = { min: S_PER_DAY, max: 10 * S_PER_YEAR, what: "an interval" };
/** A shelter's air above (or below) the outdoor air it lags behind, K. */
export const TEMPERATURE_OFFSET: Limit = { min: -50, max: 50, what: "a temperature offset" };
export const ENERGY: Limit = { min: 0, minOpen: true, max: 10e6, what: "an energy" };
export const FLOW: Limit = { min: 0, max: (1000 * M3_PER_LITRE) / S_PER_MIN, what: "a flow" };
/** Nitrogen for other uses, per aircraft and flown day or week, kg. */
export const GAS_AMOUNT: Limit = { min: 0, max: 100, what: "an amount of nitrogen" };

/** A number as short text without float noise (six significant digits). */
export function shortNumber(x: number): string {
  const r = Number(x.toPrecision(6));
  return String(Object.is(r, -0) ? 0 : r);
}

/** A function writing SI values in the unit of `text` through its parser (affine: temperatures have an offset). */
export function unitOf(parse: (s: string) => number, text: string): (si: number) => string {
  const unit = writtenUnit(text);
  const one = parse(`1 ${unit}`);
  const per = parse(`2 ${unit}`) - one;
  return (si) => `${shortNumber((si - (one - per)) / per)} ${unit}`;
}

/** The range of a limit in words, its bounds in the user's unit: "from 0 L to 1000 L". */
function rangeText(l: Limit, u: (si: number) => string): string {
  const lo = l.min === undefined ? null : u(l.min);
  const hi = l.max === undefined ? null : u(l.max);
  if (lo !== null && hi !== null) return l.minOpen ? `above ${lo} and at most ${hi}` : `from ${lo} to ${hi}`;
  if (lo !== null) return l.minOpen ? `above ${lo}` : `of at least ${lo}`;
  return hi === null ? "" : `of at most ${hi}`;
}

/**
 * What is wrong with SI value `si` against a limit, its bounds in the user's unit — "is below …;
 * expected … from … to …" — or null when it lies within.
 */
export function rangeProblem(si: number, l: Limit, u: (si: number) => string): string | null {
  const low = l.min !== undefined && (l.minOpen ? !(si > l.min) : !(si >= l.min));
  const high = l.max !== undefined && !(si <= l.max);
  if (!low && !high) return null;
  const says = low
    ? (l.below?.(u(l.min!)) ?? `is ${l.minOpen && si === l.min ? "not above" : "below"} ${u(l.min!)}`)
    : (l.above?.(u(l.max!)) ?? `is above ${u(l.max!)}`);
  return `${says}; expected ${l.what} ${rangeText(l, u)}`;
}

/** A check of a scalar quantity read by `parse` against a limit, for `q(parse, within(limit, parse))`. */
export function within(l: Limit, parse: (s: string) => number): (si: number, text: string) => string | null {
  return (si, text) => {
    const p = rangeProblem(si, l, unitOf(parse, text));
    return p === null ? null : `"${text}" ${p}`;
  };
}

/** A quantity field read by `parse` and refused outside the limit. */
export function limited(parse: (s: string) => number, l: Limit) {
  return q(parse, within(l, parse));
}

/** The limit of a point pressure: 0 gauge (or above 0 absolute) up to 100 MPa. */
function pointLimit(p: PointPressure): Limit {
  return { min: 0, minOpen: !p.isGauge, max: MAX_PRESSURE_PA, what: "a pressure" };
}

const pointPa = (s: string) => parsePointPressure(s).pa;

/** A check of a point pressure ("3000 psig", "2000 kPaa"). */
export function pointWithin(p: PointPressure, text: string): string | null {
  const problem = rangeProblem(p.pa, pointLimit(p), unitOf(pointPa, text));
  return problem === null ? null : `"${text}" ${problem}`;
}

/** A check of a pressure at a gas temperature ("1450 psig @ 70 F"): each part against its limit. */
export function pressureAtWithin(v: PressureAt, text: string): string | null {
  const [pressureText = "", tempText = ""] = text.split("@").map((s) => s.trim());
  const pressure = rangeProblem(v.pressure.pa, pointLimit(v.pressure), unitOf(pointPa, pressureText));
  if (pressure !== null) return `"${text}": the pressure ${pressureText} ${pressure}`;
  const temp = rangeProblem(v.tempK, GAS_TEMPERATURE, unitOf(parseTemperatureK, tempText));
  return temp === null ? null : `"${text}": the temperature ${tempText} ${temp}`;
}

/** A plain number of the plan within [min, max] (whole with `int`), refused with the range. */
export function numberIn(min: number, max: number, opts: { int?: boolean; minOpen?: boolean } = {}) {
  const what = opts.int ? "a whole number" : "a number";
  const range = opts.minOpen ? `above ${min} and at most ${max}` : `from ${min} to ${max}`;
  return z
    .number()
    .refine((v) => (!opts.int || Number.isInteger(v)) && (opts.minOpen ? v > min : v >= min) && v <= max, {
      message: `expected ${what} ${range}`,
    });
}

/** The hangar of a base as far as the warmest air goes. */
type WarmHangar = { kind: "heated"; heatedTo: number } | { kind: "shelter"; offset: number };

/**
 * The warmest air an accumulator may meet at the plan's bases, K: the highest air temperature the ISD
 * format holds (+61.8 °C, the climate module's range check), a heated hangar's set point above it, or a
 * shelter's offset above it (its air is the lagged outdoor air plus the offset).
 */
export function warmestAirK(bases: { hangar?: WarmHangar | undefined }[]): number {
  const outdoorK = cToK(TEMP_MAX_TENTHS / 10);
  const hangarK = (h: WarmHangar) => (h.kind === "heated" ? h.heatedTo : outdoorK + Math.max(0, h.offset));
  return Math.max(outdoorK, ...bases.map((b) => (b.hangar ? hangarK(b.hangar) : outdoorK)));
}

/**
 * A precharge reference whose line (the gas amount it fixes, at V0) reaches the nominal system pressure
 * at the warmest air of the plan: the accumulator could not be charged there (the simulation needs the
 * gas below system pressure). Gauge pressures at the standard atmosphere; shown in the plan's units.
 */
export function warmPrechargeProblem(
  profile: { precharge: { reference: PressureAt }; system: { nominal: PointPressure } },
  bases: { hangar?: WarmHangar | undefined }[],
  units: Units,
): string | null {
  const atm = STANDARD_ATMOSPHERE_PA;
  const abs = (p: PointPressure) => absPa(p, atm);
  const ref = profile.precharge.reference;
  const warmK = warmestAirK(bases);
  let lineAbsPa: number;
  try {
    lineAbsPa = realGas.pressurePa(realGas.densityMolM3(abs(ref.pressure), ref.tempK), warmK);
  } catch (err) {
    if (err instanceof InputError) return null; // out of the equation's range: refused by its own check
    throw err;
  }
  const nominalAbsPa = abs(profile.system.nominal);
  if (lineAbsPa < nominalAbsPa) return null;
  const u = unitSystem(units);
  const kPaGauge = (absPa: number) => showWithUnit(u.pressure, (absPa - atm) / 1000);
  const temp = showWithUnit(u.temp, kToC(warmK));
  return `its precharge line reaches ${kPaGauge(lineAbsPa)} at ${temp}, above the nominal system pressure (${kPaGauge(nominalAbsPa)}); expected a reference whose line stays below system.nominal up to ${temp}, the warmest air an accumulator may meet here (the highest air temperature of the ISD format, +61.8 °C, or a heated hangar's set point or a shelter's offset above it)`;
}
