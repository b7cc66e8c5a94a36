/**
 * The air around a parked aircraft over one stay (docs/methods.md §3, "Hangars"): the outdoor air of
 * the hourly series (linear between grid hours; the last known value held over a data gap), or, during
 * a hangar's hours, the air inside it: a heated hangar at the warmer of the outdoor air and its set
 * point, an unheated shelter following the outdoor air through its own first-order lag (the exact
 * update of `lagTempK`) plus an offset. The shelter's air is simulated continuously from the start of
 * the stay's window, equal to the outdoor air there, also while the aircraft is out.
 *
 * `AirAround` is advanced step by step, in time order, with the accumulator; after each step it gives
 * the air at the step's two ends in either environment (the hangar's or the outdoor air), between
 * which the accumulator's lag takes it as linear.
 */
import { tempAtUtcMs } from "../climate/hourly.js";
import type { HourlySeries } from "../climate/types.js";
import { type AmbientStep, lagTempK } from "../physics/accumulator.js";
import { ZERO_CELSIUS_K as K0 } from "../units/index.js";
import type { DayPlan } from "./days.js";

/** The air inside a hangar during its hours, in SI. */
export type HangarAir =
  | { kind: "heated"; heatedToK: number }
  | { kind: "shelter"; timeConstantS: number; offsetK: number };

/** Is the instant inside one of the day's hangar intervals? */
export function inHangarAt(day: DayPlan, utcMs: number): boolean {
  for (const [a, b] of day.hangar) if (utcMs >= a && utcMs < b) return true;
  return false;
}

/** Outdoor temperature (K) at an instant, linear between grid hours (the climate module's rule); NaN where missing. */
export function outdoorK(series: HourlySeries, utcMs: number): number {
  return tempAtUtcMs(series, utcMs) + K0;
}

/** The outdoor and hangar air of one stay, advanced in time order. */
export class AirAround {
  /** Instant the air stands at, UTC ms. */
  private at: number;
  /** Outdoor air at `at` (the last known value through a gap), and at the start of the last step, K. */
  private outK: number;
  private outStartK: number;
  /** The series' own value at `at` (NaN in a gap). */
  private rawK: number;
  /** Shelter air before its offset at `at`, and at the start of the last step, K. */
  private shelterK: number;
  private shelterStartK: number;
  private readonly step: AmbientStep = { dtS: 0, startK: 0, endK: 0 };

  /**
   * The air from `fromUtcMs` on; a gap there takes the first known value of the next `searchHours`
   * hours, else `fallbackK`.
   */
  constructor(
    private readonly series: HourlySeries,
    private readonly hangar: HangarAir | null,
    fromUtcMs: number,
    searchHours: number,
    fallbackK: number,
  ) {
    let k = outdoorK(series, fromUtcMs);
    for (let h = 1; !Number.isFinite(k) && h < searchHours; h++)
      k = outdoorK(series, fromUtcMs + h * 3_600_000);
    this.at = fromUtcMs;
    this.rawK = outdoorK(series, fromUtcMs);
    this.outK = Number.isFinite(k) ? k : fallbackK;
    this.outStartK = this.outK;
    this.shelterK = this.outK;
    this.shelterStartK = this.outK;
  }

  /** Moves to a later instant `t`: the outdoor air there (held through a gap), the shelter's lag. */
  advance(t: number): void {
    const raw = outdoorK(this.series, t);
    this.outStartK = this.outK;
    const endK = Number.isFinite(raw) ? raw : this.outK;
    const h = this.hangar;
    this.shelterStartK = this.shelterK;
    if (h !== null && h.kind === "shelter") {
      this.step.dtS = Math.max(0, (t - this.at) / 1000);
      this.step.startK = this.outK;
      this.step.endK = endK;
      this.shelterK = lagTempK(this.shelterK, this.step, h.timeConstantS);
    }
    this.outK = endK;
    this.rawK = raw;
    this.at = t;
  }

  /**
   * Jumps to `t` without a step (a break in the calendar): the outdoor air there when known; the
   * shelter's air carries over.
   */
  jumpTo(t: number): void {
    const raw = outdoorK(this.series, t);
    if (Number.isFinite(raw)) this.outK = raw;
    this.outStartK = this.outK;
    this.shelterStartK = this.shelterK;
    this.rawK = raw;
    this.at = t;
  }

  /** The environment's air from the outdoor air `outK` and the shelter's `shelterK`. */
  private inside(inHangar: boolean, outK: number, shelterK: number): number {
    const h = this.hangar;
    if (!inHangar || h === null) return outK;
    return h.kind === "heated" ? Math.max(outK, h.heatedToK) : shelterK + h.offsetK;
  }

  /** Air at the start of the last step in the step's environment (hangar or outdoor), K. */
  stepStartK(inHangar: boolean): number {
    return this.inside(inHangar, this.outStartK, this.shelterStartK);
  }

  /** Air now (the end of the last step), the last known outdoor value held through a gap, K. */
  nowK(inHangar: boolean): number {
    return this.inside(inHangar, this.outK, this.shelterK);
  }

  /** The air a technician reads now: NaN where the outdoor record has no value. */
  readK(inHangar: boolean): number {
    return Number.isFinite(this.rawK) ? this.inside(inHangar, this.rawK, this.shelterK) : Number.NaN;
  }
}
