/**
 * The thermal relief valve of one stay's trapped charge and its records (docs/methods.md §3, "Thermal
 * relief"): whether it opens at the end of a step, its openings (a run of steps with the valve open
 * counts once) with the fluid they let out, and the highest trapped pressure of each month.
 */
import {
  type ChargedState,
  type ReliefResult,
  type TrappedState,
  thermalRelief,
} from "../physics/accumulator.js";
import type { ProfileContext } from "./context.js";
import type { ReliefRecord, SimOutcome } from "./simulate.js";

export class ReliefValve {
  /** The opening under way (the valve let fluid out at the last step), or null. */
  private opening: ReliefRecord | null = null;

  constructor(
    private readonly ctx: ProfileContext,
    private readonly out: SimOutcome,
  ) {}

  /** The relief of a charge in its trapped state `st`, or null when the valve stays shut (or there is none). */
  relieve(charge: ChargedState, st: TrappedState, tempK: number, amountMol: number): ReliefResult | null {
    const { model, geometry, fluid, reliefAbsPa } = this.ctx;
    if (reliefAbsPa === null) return null;
    return thermalRelief(model, geometry, fluid, { c: charge, tempK, amountMol, trapped: st }, reliefAbsPa);
  }

  /**
   * Records a step of the configuration fitted: its relief (null: the valve stayed shut) and the
   * trapped fluid pressure after it, Pa absolute.
   */
  note(month: number, utcMs: number, opened: ReliefResult | null, fluidPressureAbsPa: number): void {
    const { out } = this;
    if (opened === null) {
      this.opening = null;
    } else {
      if (this.opening === null) {
        this.opening = { month, utcMs, relievedM3: 0 };
        out.reliefs.push(this.opening);
      }
      this.opening.relievedM3 += opened.relievedM3 * this.ctx.count;
    }
    const peak = out.peakTrappedAbsPa[month]!;
    if (fluidPressureAbsPa > peak || Number.isNaN(peak)) out.peakTrappedAbsPa[month] = fluidPressureAbsPa;
  }

  /** A recharge (or a hand-pump charge) closes the trapped system anew: the next opening is a new one. */
  recharged(): void {
    this.opening = null;
  }
}
