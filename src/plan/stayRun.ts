/**
 * One stay on one climate year as a small state object: accumulator temperature, gas amount, the
 * trapped charge of both configurations, and the steps that advance them (advance with the air around
 * the aircraft, settle the trapped charge and its thermal relief, grid hour, start, preflight, service,
 * discharge, recharge). What happens when is described in `simulate.ts`.
 */
import {
  type AmbientStep,
  type ChargedState,
  chargedState,
  gasAmountMol,
  gasVolumeM3,
  handPumpStrokes,
  interpolateClamped,
  lagTempK,
  readingPct,
  recharge,
  startDischarge,
  type TrappedState,
  trappedState,
} from "../physics/accumulator.js";
import { ZERO_CELSIUS_K as K0 } from "../units/index.js";
import { AirAround, inHangarAt } from "./air.js";
import { bandAt, type ProfileContext, prechargeLineAbsPa } from "./context.js";
import { type DayPlan, HOUR_MS, hangarBreaks, localHourOf } from "./days.js";
import { ReliefValve } from "./reliefValve.js";
import type { SimInputs, SimOutcome } from "./simulate.js";

/** The last recharge of a day: what the next morning's overnight drop is measured from. */
interface RechargeMark {
  day: number;
  accumulatorC: number;
  gasKPaGauge: number;
  readingPct: number;
  utcMs: number;
}

/** An outcome with nothing recorded yet. */
export function emptyOutcome(): SimOutcome {
  return {
    preflights: [],
    starts: [],
    drops: [],
    hourlyReadings: new Int32Array(12 * 24),
    hourlyOutOfBand: new Int32Array(12 * 24),
    nitrogen: [],
    ventedMol: 0,
    servicings: 0,
    checks: 0,
    handPumpStrokes: 0,
    startsWithoutAmbient: 0,
    reliefs: [],
    peakTrappedAbsPa: new Float64Array(13).fill(Number.NaN),
    accumulatorHours: 0,
    trace: [],
  };
}

/** The state of one stay on one climate year, advanced event by event through its days. */
export class StayRun {
  readonly out = emptyOutcome();
  private readonly ctx: ProfileContext;
  /** Gas loss of this aircraft, mol/s per unit. */
  private readonly lossMolS: number;
  /** The step the lag advances over (one object reused in the hot loop). */
  private readonly step: AmbientStep = { dtS: 0, startK: 0, endK: 0 };
  private readonly dischargeOut = new Float64Array(2);
  private readonly traceFrom: number;
  private readonly traceTo: number;
  /** Instant the state stands at, UTC ms. */
  private cur: number;
  /** The outdoor and hangar air around the aircraft. */
  private readonly air: AirAround;
  /** The air a technician would read now, the last known value held through missing hours, K. */
  private heldAmbK: number;
  /** Accumulator (lagged) temperature, K. */
  private accK: number;
  /** Gas amount per unit, mol. */
  private amountMol: number;
  private charged: ChargedState;
  /** The other configuration's charge (see the header); equal to `charged` while altSame. */
  private chargedAlt: ChargedState;
  private altSame = true;
  /** Arrived with the fluid side empty and not yet charged by the hand pump (no trapped charge). */
  private uncharged: boolean;
  /** The trapped state of `charged` at `cur`, settled after each step (relieved where the valve opens). */
  private st: TrappedState = { gasPressureAbsPa: 0, gasVolumeM3: 0, fluidPressureAbsPa: 0 };
  /** The thermal relief valve and its records. */
  private readonly valve: ReliefValve;
  private lastCheckDay = 0;
  private lastRecharge: RechargeMark | null = null;
  private prevDay: DayPlan | null = null;
  /** Per-unit discharge of the last `discharge` call: energy, J, and end gas volume, m³. */
  private dischargeJ = 0;
  private dischargeEndM3 = 0;

  constructor(private readonly inp: SimInputs) {
    const ctx = inp.ctx;
    const days = inp.days;
    this.ctx = ctx;
    this.valve = new ReliefValve(ctx, this.out);
    this.lossMolS = ctx.gasLossMolS * inp.gasLossFactor;
    this.traceFrom = inp.trace?.fromUtcMs ?? Number.POSITIVE_INFINITY;
    this.traceTo = inp.trace ? this.traceFrom + inp.trace.hours * HOUR_MS : Number.NEGATIVE_INFINITY;
    // Initial state: serviced on arrival, charged at nominal system pressure at the first known ambient.
    this.cur = days[0]!.midnightUtcMs;
    this.air = new AirAround(inp.series, inp.hangar, this.cur, 24 * days.length, ctx.refTempK);
    this.heldAmbK = this.air.nowK(inp.hangar !== null && inHangarAt(days[0]!, this.cur));
    this.accK = this.heldAmbK;
    this.amountMol = ctx.nominalMol;
    this.charged = this.chargedAt(ctx.systemNominalAbsPa);
    this.chargedAlt = this.charged;
    this.uncharged = inp.arrival === "precharge-only";
  }

  /** The charged state of the current gas amount and temperature at a gas pressure. */
  private chargedAt(gasPressureAbsPa: number): ChargedState {
    const { model, geometry, fluid } = this.ctx;
    return chargedState(model, geometry, fluid, this.amountMol, this.accK, gasPressureAbsPa);
  }

  /** The trapped state of a charge now. */
  private trapped(charge: ChargedState): TrappedState {
    const { model, geometry, fluid } = this.ctx;
    return trappedState(model, geometry, fluid, charge, this.accK, this.amountMol);
  }

  /** Day `di`: its grid hours, hangar boundaries and starts in time order. */
  day(di: number): void {
    const day = this.inp.days[di]!;
    this.prevDay = di > 0 ? this.inp.days[di - 1]! : null;
    // A 29 February fold or a skipped leap day breaks the calendar: the state carries over as it is.
    if (this.prevDay !== null && this.prevDay.nextMidnightUtcMs !== day.midnightUtcMs) {
      this.cur = day.midnightUtcMs;
      this.air.jumpTo(this.cur);
    }
    let si = 0;
    let g = Math.ceil(day.midnightUtcMs / HOUR_MS) * HOUR_MS;
    const breaks = hangarBreaks(day);
    let hb = 0;
    for (;;) {
      const nextStart = si < day.startsUtcMs.length ? day.startsUtcMs[si]! : Number.POSITIVE_INFINITY;
      const nextGrid = g < day.nextMidnightUtcMs ? g : Number.POSITIVE_INFINITY;
      // A hangar boundary between grid hours ends a step there (no reading is taken).
      while (hb < breaks.length && breaks[hb]! <= this.cur) hb++;
      const nextBreak = hb < breaks.length ? breaks[hb]! : Number.POSITIVE_INFINITY;
      if (nextBreak < nextGrid && nextBreak < nextStart) {
        this.advance(day, nextBreak);
        hb++;
      } else if (nextStart === Number.POSITIVE_INFINITY && nextGrid === Number.POSITIVE_INFINITY) {
        break;
      } else if (nextGrid <= nextStart) {
        this.gridHour(day, nextGrid);
        g += HOUR_MS;
      } else {
        this.start(day, di, si, nextStart);
        si++;
      }
    }
  }

  /**
   * Advances the air, the lag and the gas loss from `cur` to `t`, the air linear between its values at
   * both ends of the step in the step's environment (the hangar's when the step's midpoint is in the
   * hangar; steps never straddle a hangar boundary; `AirAround` holds the last known value through a
   * gap). Returns the air a technician reads at `t` (NaN if missing).
   */
  private advance(day: DayPlan, t: number): number {
    const { inp, prevDay, air } = this;
    const hangar = inp.hangar !== null;
    const mid = (this.cur + t) / 2;
    const stepInHangar = hangar && (inHangarAt(day, mid) || (prevDay !== null && inHangarAt(prevDay, mid)));
    air.advance(t);
    const nowInHangar = hangar && inHangarAt(day, t);
    const amb = air.readK(nowInHangar);
    this.heldAmbK = air.nowK(nowInHangar);
    const dtS = (t - this.cur) / 1000;
    const tauS = this.ctx.tauS;
    if (dtS > 0 || tauS === 0) {
      this.step.dtS = Math.max(dtS, 0);
      this.step.startK = air.stepStartK(stepInHangar);
      this.step.endK = air.nowK(stepInHangar);
      this.accK = lagTempK(this.accK, this.step, tauS);
    }
    if (dtS > 0) this.amountMol = Math.max(this.amountMol - this.lossMolS * dtS, 1e-9);
    this.cur = t;
    this.settle(day);
    return amb;
  }

  /**
   * The trapped charge at the end of a step: solved once; where the fluid pressure exceeds the relief
   * valve's, the valve lets fluid out and the relief state becomes the fluid's reference (both
   * configurations; openings, fluid and the month's peak pressure recorded for the one fitted).
   */
  private settle(day: DayPlan): void {
    if (this.uncharged) return;
    const { model, geometry, fluid } = this.ctx;
    const st = trappedState(model, geometry, fluid, this.charged, this.accK, this.amountMol, this.st);
    const opened = this.valve.relieve(this.charged, st, this.accK, this.amountMol);
    if (opened !== null) {
      this.charged = opened.charge;
      if (this.altSame) this.chargedAlt = opened.charge;
      st.gasPressureAbsPa = opened.charge.gasPressureAbsPa;
      st.gasVolumeM3 = opened.charge.gasVolumeM3;
      st.fluidPressureAbsPa = opened.charge.fluidPressureAbsPa;
    }
    this.valve.note(day.month, this.cur, opened, st.fluidPressureAbsPa);
    if (!this.altSame && this.ctx.reliefAbsPa !== null) {
      const alt = this.valve.relieve(
        this.chargedAlt,
        this.trapped(this.chargedAlt),
        this.accK,
        this.amountMol,
      );
      if (alt !== null) this.chargedAlt = alt.charge;
    }
  }

  /** Grid hour: what-if reading of the trapped charge against the band at ambient; the trace. */
  private gridHour(day: DayPlan, g: number): void {
    const { ctx, out } = this;
    const amb = this.advance(day, g);
    out.accumulatorHours += ctx.count;
    const inTrace = g > this.traceFrom && g <= this.traceTo;
    if (this.uncharged || !(Number.isFinite(amb) || inTrace)) return;
    const { st } = this;
    const reading = readingPct(ctx.geometry, st.gasVolumeM3);
    const ambForBand = Number.isFinite(amb) ? amb : this.heldAmbK;
    const low = bandAt(ctx.bandTable, ambForBand, "low");
    const high = bandAt(ctx.bandTable, ambForBand, "high");
    if (Number.isFinite(amb)) {
      const idx = (day.month - 1) * 24 + localHourOf(day, g, this.inp.timeZone);
      out.hourlyReadings[idx]!++;
      if (reading < low || reading > high) out.hourlyOutOfBand[idx]!++;
    }
    if (inTrace) this.tracePoint(g, ambForBand, st.gasPressureAbsPa, reading);
  }

  /** One point of the hourly trace: the air, the accumulator and its charge against the band at the air. */
  private tracePoint(utcMs: number, ambK: number, gasPressureAbsPa: number, reading: number): void {
    const { ctx } = this;
    this.out.trace.push({
      utcMs,
      ambientC: ambK - K0,
      accumulatorC: this.accK - K0,
      gasKPaGauge: (gasPressureAbsPa - ctx.atmPa) / 1000,
      readingPct: reading,
      bandLowPct: bandAt(ctx.bandTable, ambK, "low"),
      bandHighPct: bandAt(ctx.bandTable, ambK, "high"),
    });
  }

  /** Start `si` of day `di` at `t`: the preflight first in the day, then discharge and recharge. */
  private start(day: DayPlan, di: number, si: number, t: number): void {
    const amb = this.advance(day, t);
    const ambK = Number.isFinite(amb) ? amb : this.heldAmbK;
    const counted = Number.isFinite(amb);
    if (!counted) this.out.startsWithoutAmbient++;
    if (this.uncharged) {
      // Arrived with the fluid side empty: the hand pump charges it before the first start.
      this.uncharged = false;
      this.handPumpToSystem();
      const { model, geometry, fluid } = this.ctx;
      trappedState(model, geometry, fluid, this.charged, this.accK, this.amountMol, this.st);
    }
    const st = si === 0 ? this.preflight(day, di, t, ambK, counted) : this.st;
    const { endM3, endAltM3 } = this.discharge(day, ambK, counted, st);
    this.recharge(di, t, endM3, endAltM3);
    // The overnight trace starts with the state just after the recharge it is measured from.
    if (t === this.traceFrom) {
      const c = this.charged;
      this.tracePoint(t, ambK, c.gasPressureAbsPa, readingPct(this.ctx.geometry, c.gasVolumeM3));
    }
  }

  /**
   * The first start of a day: the reading against the band at ambient, the overnight drop since the
   * last evening's recharge, and servicing (precharge check when due, out-of-band policy). Returns the
   * trapped state the start discharges from.
   */
  private preflight(day: DayPlan, di: number, t: number, ambK: number, counted: boolean): TrappedState {
    const { ctx, inp, out, st } = this;
    const reading = readingPct(ctx.geometry, st.gasVolumeM3);
    const below = reading < bandAt(ctx.bandTable, ambK, "low");
    const above = reading > bandAt(ctx.bandTable, ambK, "high");
    const gasKPaGauge = (st.gasPressureAbsPa - ctx.atmPa) / 1000;
    if (counted) {
      const accumulatorC = this.accK - K0;
      const [hour] = day.startHours;
      out.preflights.push({
        day: di,
        month: day.month,
        hour: hour!,
        ambientC: ambK - K0,
        accumulatorC,
        gasKPaGauge,
        readingPct: reading,
        below,
        above,
      });
      const last = this.lastRecharge;
      if (last !== null && last.day === di - 1) {
        out.drops.push({
          month: day.month,
          day: di,
          tempC: last.accumulatorC - accumulatorC,
          gasKPa: last.gasKPaGauge - gasKPaGauge,
          readingPct: last.readingPct - reading,
          rechargeUtcMs: last.utcMs,
        });
      }
    }
    const checkDue = di - this.lastCheckDay >= inp.prechargeCheckDays;
    const policyDue = inp.policy === "adjust-precharge" && (below || above);
    if (!(checkDue || policyDue)) return st;
    if (checkDue) {
      out.checks++;
      this.lastCheckDay = di;
    }
    const gasAtV0AbsPa = ctx.model.pressurePa(this.amountMol / ctx.geometry.v0M3, this.accK);
    const outOfTolerance =
      gasAtV0AbsPa < prechargeLineAbsPa(ctx, ambK, ctx.lowMol) ||
      gasAtV0AbsPa > prechargeLineAbsPa(ctx, ambK, ctx.highMol);
    if (policyDue || outOfTolerance) this.service(ambK, di, t);
    this.handPumpToSystem();
    return this.trapped(this.charged);
  }

  /** Gas on the fluid-side stop at V0 and the lagged temperature, set to the precharge line at ambient. */
  private service(ambK: number, day: number, t: number): void {
    const { ctx, out } = this;
    const targetAbs = prechargeLineAbsPa(ctx, ambK);
    const targetMol = gasAmountMol(ctx.model, targetAbs, this.accK, ctx.geometry.v0M3);
    if (targetMol > this.amountMol) {
      out.nitrogen.push({
        day,
        utcMs: t,
        fromMol: this.amountMol,
        toMol: targetMol,
        tempK: ambK,
        units: ctx.count,
      });
    } else {
      out.ventedMol += (this.amountMol - targetMol) * ctx.count;
    }
    this.amountMol = targetMol;
    out.servicings++;
  }

  /** After servicing, the hand pump brings the fluid side to nominal system pressure (both configurations). */
  private handPumpToSystem(): void {
    const { ctx } = this;
    const { geometry } = ctx;
    const vGas = Math.max(
      geometry.vminM3,
      gasVolumeM3(ctx.model, this.amountMol, this.accK, ctx.systemNominalAbsPa),
    );
    this.out.handPumpStrokes += handPumpStrokes(
      (geometry.v0M3 - Math.min(vGas, geometry.v0M3)) * ctx.count,
      ctx.handPump.displacementM3,
      ctx.handPump.efficiency,
    );
    this.charged = this.chargedAt(ctx.systemNominalAbsPa);
    this.chargedAlt = this.charged;
    this.altSame = true;
    this.valve.recharged();
  }

  /** Per-unit discharge from a gas volume at the start: sets dischargeJ and dischargeEndM3. */
  private dischargeUnit(gasVolM3: number): void {
    const { ctx } = this;
    const grid = ctx.dischargeGrid;
    if (grid !== null) {
      grid.lookup(this.amountMol, this.accK, gasVolM3, this.dischargeOut);
      this.dischargeJ = this.dischargeOut[0]!;
      this.dischargeEndM3 = this.dischargeOut[1]!;
    } else {
      const d = startDischarge(ctx.model, ctx.geometry, 1, this.amountMol, this.accK, gasVolM3, ctx.starter);
      this.dischargeJ = d.hydraulicEnergyJ;
      this.dischargeEndM3 = d.end.gasVolumeM3;
    }
  }

  /**
   * The start discharge of both configurations (n identical units deliver n times one unit's energy),
   * recorded against the requirement at ambient when counted. Returns each one's end gas volume.
   */
  private discharge(
    day: DayPlan,
    ambK: number,
    counted: boolean,
    st: TrappedState,
  ): { endM3: number; endAltM3: number } {
    const { ctx } = this;
    this.dischargeUnit(st.gasVolumeM3);
    const energyJ = this.dischargeJ;
    const endM3 = this.dischargeEndM3;
    let energyAltJ = energyJ;
    let endAltM3 = endM3;
    if (!this.altSame) {
      this.dischargeUnit(this.trapped(this.chargedAlt).gasVolumeM3);
      energyAltJ = this.dischargeJ;
      endAltM3 = this.dischargeEndM3;
    }
    if (counted) {
      const oneJ = ctx.fitted ? energyAltJ : energyJ;
      const optionUnitJ = ctx.fitted ? energyJ : energyAltJ;
      this.out.starts.push({
        month: day.month,
        ambientC: ambK - K0,
        energyOneJ: oneJ,
        energyTwoJ: optionUnitJ * ctx.optionCount,
        requiredJ: interpolateClamped(ctx.energyTable, ambK),
      });
    }
    return { endM3, endAltM3 };
  }

  /** Recharge of both configurations within their timers, isothermal at the accumulator temperature; then trapped. */
  private recharge(di: number, t: number, endM3: number, endAltM3: number): void {
    const { ctx } = this;
    const { model, geometry } = ctx;
    const p = ctx.systemNominalAbsPa;
    const r = recharge(model, geometry, ctx.count, this.amountMol, this.accK, endM3, p, ctx.pump);
    this.charged = this.chargedAt(r.gasPressureAbsPa);
    this.valve.recharged();
    if (this.altSame && r.reachedSystem && (r.timeS * ctx.altCount) / ctx.count <= ctx.altPump.timerS) {
      this.chargedAlt = this.charged;
    } else {
      const rAlt = recharge(
        model,
        geometry,
        ctx.altCount,
        this.amountMol,
        this.accK,
        endAltM3,
        p,
        ctx.altPump,
      );
      this.altSame = r.reachedSystem && rAlt.reachedSystem;
      this.chargedAlt = this.altSame ? this.charged : this.chargedAt(rAlt.gasPressureAbsPa);
    }
    this.lastRecharge = {
      day: di,
      accumulatorC: this.accK - K0,
      gasKPaGauge: (r.gasPressureAbsPa - ctx.atmPa) / 1000,
      readingPct: readingPct(geometry, r.gasVolumeM3),
      utcMs: t,
    };
  }
}
