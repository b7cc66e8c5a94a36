/**
 * The hour-by-hour simulation of one stay on one climate year (product brief §5).
 *
 * State: accumulator temperature (first-order lag behind ambient, exact update over each step with
 * the ambient at the step's end, so τ = 0 gives the ambient itself), gas amount per unit (falls
 * continuously by the aircraft's gas-loss rate), and the charged state at the end of the last
 * recharge (the fluid is trapped until the next start, brief §3).
 *
 * The aircraft arrives serviced: gas amount on the precharge reference, charged to nominal system
 * pressure at the arrival-day midnight temperature. Then, on each flown day, at each start time:
 * 1. first start of the day: preflight — the reading (physics at the lagged accumulator temperature)
 *    against the band for the AMBIENT temperature the technician reads; the precharge check when due
 *    (every `prechargeCheckDays` days since the last one); the out-of-band policy;
 * 2. servicing (check or policy): the fluid side is relieved (piston on its fluid-side stop, gas at V0),
 *    the gauge is compared with the precharge line for the ambient temperature and its tolerance lines,
 *    and the gas is set to the line at ambient (nitrogen added, or gas vented) — while the gas is at the
 *    lagged temperature; then the hand pump recharges to nominal system pressure;
 * 3. start discharge (energy against the requirement at ambient); n identical units in parallel
 *    deliver n times one unit's energy (brief §3);
 * 4. recharge by the pump within its timer (the option's longer timer when fitted), then trapped.
 *
 * Energy "with one and with two accumulators" (brief §1, §5): both configurations are followed for
 * every stay — the one fitted, and the other one (one unit on the pump's timer, or the option's count
 * on the option's timer) as a shadow charge that shares the accumulator temperature, the gas amount
 * per unit and the servicing of the fitted one but has its own discharges and timer-limited
 * recharges. "One" is always the single unit on the pump's timer, "two" always the option's count on
 * its timer, whichever the stay has fitted; the two differ by more than the count only when a timer
 * stops a recharge short. The shadow is skipped while both charges are equal (both recharges reach
 * system pressure: the shadow's pump time is the fitted one's × its count ÷ the fitted count, since
 * the pump's flow is shared among the units along the same isothermal path).
 * At every grid hour a what-if reading is taken of the trapped charge against the band at ambient
 * (the out-of-band share by local hour of day).
 *
 * Missing ambient hours (gaps longer than the fill length): the last known ambient is held for the
 * physics, and starts without an ambient value are simulated but not counted in the statistics.
 */

import type { HourlySeries } from "../climate/types.js";
import {
  type ChargedState,
  chargedState,
  gasAmountMol,
  gasVolumeM3,
  handPumpStrokes,
  interpolateClamped,
  readingPct,
  recharge,
  startDischarge,
  trappedState,
} from "../physics/accumulator.js";
import { ZERO_CELSIUS_K as K0 } from "../units/index.js";
import { bandAt, type ProfileContext, prechargeLineAbsPa } from "./context.js";
import { type DayPlan, HOUR_MS, localHourOf } from "./days.js";
import type { TracePoint } from "./results.js";

export type OutOfBandPolicy = "log" | "adjust-precharge";

export interface SimInputs {
  ctx: ProfileContext;
  series: HourlySeries;
  timeZone: string;
  days: DayPlan[];
  /** Multiplier of the nominal gas-loss rate for this aircraft (seeded). */
  gasLossFactor: number;
  hangarTempK: number | null;
  prechargeCheckDays: number;
  policy: OutOfBandPolicy;
  /** Record an hourly trace of this many hours from this instant (UTC ms). */
  trace?: { fromUtcMs: number; hours: number };
}

export interface PreflightRecord {
  day: number;
  month: number;
  hour: number;
  ambientC: number;
  accumulatorC: number;
  gasKPaGauge: number;
  readingPct: number;
  below: boolean;
  above: boolean;
}

export interface StartRecord {
  month: number;
  ambientC: number;
  energyOneJ: number;
  energyTwoJ: number;
  requiredJ: number;
}

export interface DropRecord {
  month: number;
  /** Day index of the morning. */
  day: number;
  tempC: number;
  kPa: number;
  readingPct: number;
  /** Instant of the evening's last recharge (UTC ms, climate time). */
  rechargeUtcMs: number;
}

/** Nitrogen added to one unit at one servicing (per unit; `units` units alike). */
export interface NitrogenEvent {
  day: number;
  utcMs: number;
  fromMol: number;
  toMol: number;
  /** Site (ambient) temperature of the transfer, K. */
  tempK: number;
  units: number;
}

/** One hour of a trace as simulated (UTC instant); the engine adds the local time for the results. */
export type TraceSample = Omit<TracePoint, "hour" | "localTime"> & { utcMs: number };

export interface SimOutcome {
  preflights: PreflightRecord[];
  starts: StartRecord[];
  drops: DropRecord[];
  /** Hourly what-if readings per [month−1][hour]: counts and out-of-band counts. */
  hourlyReadings: Int32Array;
  hourlyOutOfBand: Int32Array;
  nitrogen: NitrogenEvent[];
  /** Gas vented from accumulators to lower a precharge, mol (all units). */
  ventedMol: number;
  servicings: number;
  checks: number;
  handPumpStrokes: number;
  startsWithoutAmbient: number;
  /** Accumulator-hours simulated (hours × units). */
  accumulatorHours: number;
  trace: TraceSample[];
}

function inHangarAt(day: DayPlan, utcMs: number): boolean {
  for (const [a, b] of day.hangar) if (utcMs >= a && utcMs < b) return true;
  return false;
}

/** Ambient temperature (K) at an instant: the series linearly between grid hours; hangar replaces it. */
function ambientK(inp: SimInputs, day: DayPlan, utcMs: number): number {
  if (inp.hangarTempK !== null && inHangarAt(day, utcMs)) return inp.hangarTempK;
  return seriesK(inp.series, utcMs);
}

/** Outdoor temperature (K) at an instant, linear between grid hours; NaN where missing. */
function seriesK(s: HourlySeries, utcMs: number): number {
  const x = (utcMs - s.startUtcMs) / HOUR_MS;
  const i = Math.floor(x);
  if (i < 0 || i >= s.tempC.length) return Number.NaN;
  const f = x - i;
  const a = s.tempC[i]!;
  if (f === 0) return a + K0;
  if (i + 1 >= s.tempC.length) return Number.NaN;
  return a + f * (s.tempC[i + 1]! - a) + K0;
}

export function simulateStayYear(inp: SimInputs): SimOutcome {
  const { ctx } = inp;
  const { model, geometry, fluid, atmPa, bandTable } = ctx;
  const out: SimOutcome = {
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
    accumulatorHours: 0,
    trace: [],
  };
  const days = inp.days;
  if (days.length === 0) return out;
  const lossMolS = ctx.gasLossMolS * inp.gasLossFactor;
  const grid = ctx.dischargeGrid;
  const dischargeOut = new Float64Array(2);
  const tau = ctx.tauS;
  const decayHour = tau > 0 ? Math.exp(-HOUR_MS / 1000 / tau) : 0;

  // Initial state: serviced on arrival, charged at nominal system pressure at the first known ambient.
  let cur = days[0]!.midnightUtcMs;
  let lastAmbK = ambientK(inp, days[0]!, cur);
  for (let k = 1; !Number.isFinite(lastAmbK) && k < 24 * days.length; k++) {
    lastAmbK = ambientK(inp, days[Math.min(days.length - 1, Math.floor(k / 24))]!, cur + k * HOUR_MS);
  }
  if (!Number.isFinite(lastAmbK)) lastAmbK = ctx.refTempK;
  let accK = lastAmbK;
  let amountMol = ctx.nominalMol;
  let charged: ChargedState = chargedState(model, geometry, fluid, amountMol, accK, ctx.systemNominalAbsPa);
  let lastCheckDay = 0;
  let lastRecharge: { day: number; accC: number; kPa: number; reading: number; utcMs: number } | null = null;
  const traceFrom = inp.trace?.fromUtcMs ?? Number.POSITIVE_INFINITY;
  const traceTo = inp.trace ? traceFrom + inp.trace.hours * HOUR_MS : Number.NEGATIVE_INFINITY;

  /**
   * Advances lag and gas loss from `cur` to `t` with the ambient at `t` (the hangar's when the step's
   * midpoint is in the hangar; steps never straddle a hangar boundary). Returns the ambient a
   * technician reads at `t` (NaN if missing).
   */
  const advance = (day: DayPlan, t: number): number => {
    const amb = ambientK(inp, day, t);
    const mid = (cur + t) / 2;
    const inHangar =
      inp.hangarTempK !== null && (inHangarAt(day, mid) || (prevDay !== null && inHangarAt(prevDay, mid)));
    const stepAmb = inHangar ? inp.hangarTempK! : seriesK(inp.series, t);
    if (Number.isFinite(stepAmb)) lastAmbK = stepAmb;
    const dtS = (t - cur) / 1000;
    if (dtS > 0) {
      const decay = tau <= 0 ? 0 : dtS === 3600 ? decayHour : Math.exp(-dtS / tau);
      accK = lastAmbK + (accK - lastAmbK) * decay;
      amountMol = Math.max(amountMol - lossMolS * dtS, 1e-9);
    } else if (tau <= 0) {
      accK = lastAmbK;
    }
    cur = t;
    return amb;
  };

  const service = (ambK: number, day: number, t: number) => {
    // Gas on the fluid-side stop at V0 and the lagged temperature, set to the line at ambient.
    const targetAbs = prechargeLineAbsPa(ctx, ambK);
    const targetMol = gasAmountMol(model, targetAbs, accK, geometry.v0M3);
    if (targetMol > amountMol) {
      out.nitrogen.push({
        day,
        utcMs: t,
        fromMol: amountMol,
        toMol: targetMol,
        tempK: ambK,
        units: ctx.count,
      });
    } else {
      out.ventedMol += (amountMol - targetMol) * ctx.count;
    }
    amountMol = targetMol;
    out.servicings++;
  };

  // The other configuration's charge (see the header); equal to `charged` while altSame.
  let chargedAlt: ChargedState = charged;
  let altSame = true;
  /** Per-unit discharge from the gas volume at the start: sets dischargeJ and dischargeEndM3. */
  let dischargeJ = 0;
  let dischargeEndM3 = 0;
  const discharge = (gasVolM3: number): void => {
    if (grid !== null) {
      grid.lookup(amountMol, accK, gasVolM3, dischargeOut);
      dischargeJ = dischargeOut[0]!;
      dischargeEndM3 = dischargeOut[1]!;
    } else {
      const d = startDischarge(model, geometry, 1, amountMol, accK, gasVolM3, ctx.starter);
      dischargeJ = d.hydraulicEnergyJ;
      dischargeEndM3 = d.end.gasVolumeM3;
    }
  };

  const handPumpToSystem = () => {
    const vGas = Math.max(geometry.vminM3, gasVolumeM3(model, amountMol, accK, ctx.systemNominalAbsPa));
    out.handPumpStrokes += handPumpStrokes(
      (geometry.v0M3 - Math.min(vGas, geometry.v0M3)) * ctx.count,
      ctx.handPump.displacementM3,
      ctx.handPump.efficiency,
    );
    charged = chargedState(model, geometry, fluid, amountMol, accK, ctx.systemNominalAbsPa);
    chargedAlt = charged;
    altSame = true;
  };

  let prevDay: DayPlan | null = null;
  for (let di = 0; di < days.length; di++) {
    const day = days[di]!;
    prevDay = di > 0 ? days[di - 1]! : null;
    // A 29 February fold or a skipped leap day breaks the calendar: the state carries over as it is.
    if (prevDay !== null && prevDay.nextMidnightUtcMs !== day.midnightUtcMs) cur = day.midnightUtcMs;
    const monthIdx = (day.month - 1) * 24;
    let si = 0;
    let g = Math.ceil(day.midnightUtcMs / HOUR_MS) * HOUR_MS;
    const breaks = day.hangar
      .flat()
      .filter((b) => b % HOUR_MS !== 0 && b > day.midnightUtcMs && b < day.nextMidnightUtcMs)
      .sort((a, b) => a - b);
    let hb = 0;
    for (;;) {
      const nextStart = si < day.startsUtcMs.length ? day.startsUtcMs[si]! : Number.POSITIVE_INFINITY;
      const nextGrid = g < day.nextMidnightUtcMs ? g : Number.POSITIVE_INFINITY;
      // A hangar boundary between grid hours ends a step there (no reading is taken).
      while (hb < breaks.length && breaks[hb]! <= cur) hb++;
      const nextBreak = hb < breaks.length ? breaks[hb]! : Number.POSITIVE_INFINITY;
      if (nextBreak < nextGrid && nextBreak < nextStart) {
        advance(day, nextBreak);
        hb++;
        continue;
      }
      if (nextStart === Number.POSITIVE_INFINITY && nextGrid === Number.POSITIVE_INFINITY) break;
      if (nextGrid <= nextStart) {
        // Grid hour: what-if reading of the trapped charge against the band at ambient.
        const amb = advance(day, nextGrid);
        out.accumulatorHours += ctx.count;
        const inTrace = nextGrid >= traceFrom && nextGrid <= traceTo;
        if (Number.isFinite(amb) || inTrace) {
          const st = trappedState(model, geometry, fluid, charged, accK, amountMol);
          const reading = readingPct(geometry, st.gasVolumeM3);
          const ambForBand = Number.isFinite(amb) ? amb : lastAmbK;
          const low = bandAt(bandTable, ambForBand, "low");
          const high = bandAt(bandTable, ambForBand, "high");
          if (Number.isFinite(amb)) {
            const idx = monthIdx + localHourOf(day, nextGrid, inp.timeZone);
            out.hourlyReadings[idx]!++;
            if (reading < low || reading > high) out.hourlyOutOfBand[idx]!++;
          }
          if (inTrace) {
            out.trace.push({
              utcMs: nextGrid,
              ambientC: ambForBand - K0,
              accumulatorC: accK - K0,
              gasKPaGauge: (st.gasPressureAbsPa - atmPa) / 1000,
              readingPct: reading,
              bandLowPct: low,
              bandHighPct: high,
            });
          }
        }
        g += HOUR_MS;
        continue;
      }
      // A start.
      const t = nextStart;
      const amb = advance(day, t);
      const ambK = Number.isFinite(amb) ? amb : lastAmbK;
      const counted = Number.isFinite(amb);
      if (!counted) out.startsWithoutAmbient++;
      let st = trappedState(model, geometry, fluid, charged, accK, amountMol);
      if (si === 0) {
        const reading = readingPct(geometry, st.gasVolumeM3);
        const low = bandAt(bandTable, ambK, "low");
        const high = bandAt(bandTable, ambK, "high");
        const below = reading < low;
        const above = reading > high;
        const gasKPa = (st.gasPressureAbsPa - atmPa) / 1000;
        if (counted) {
          out.preflights.push({
            day: di,
            month: day.month,
            hour: day.startHours[0]!,
            ambientC: ambK - K0,
            accumulatorC: accK - K0,
            gasKPaGauge: gasKPa,
            readingPct: reading,
            below,
            above,
          });
          if (lastRecharge !== null && lastRecharge.day === di - 1) {
            out.drops.push({
              month: day.month,
              day: di,
              tempC: lastRecharge.accC - (accK - K0),
              kPa: lastRecharge.kPa - gasKPa,
              readingPct: lastRecharge.reading - reading,
              rechargeUtcMs: lastRecharge.utcMs,
            });
          }
        }
        // Servicing: precharge check when due, and the out-of-band policy.
        const checkDue = di - lastCheckDay >= inp.prechargeCheckDays;
        const policyDue = inp.policy === "adjust-precharge" && (below || above);
        if (checkDue || policyDue) {
          if (checkDue) {
            out.checks++;
            lastCheckDay = di;
          }
          const gasAtV0AbsPa = model.pressurePa(amountMol / geometry.v0M3, accK);
          const outOfTolerance =
            gasAtV0AbsPa < prechargeLineAbsPa(ctx, ambK, ctx.lowMol) ||
            gasAtV0AbsPa > prechargeLineAbsPa(ctx, ambK, ctx.highMol);
          if (policyDue || outOfTolerance) service(ambK, di, t);
          handPumpToSystem();
          st = trappedState(model, geometry, fluid, charged, accK, amountMol);
        }
      }
      // Start discharge of one unit; n identical units deliver n times as much.
      discharge(st.gasVolumeM3);
      const energyJ = dischargeJ;
      const endVolumeM3 = dischargeEndM3;
      let energyAltJ = energyJ;
      let endAltM3 = endVolumeM3;
      if (!altSame) {
        const stAlt = trappedState(model, geometry, fluid, chargedAlt, accK, amountMol);
        discharge(stAlt.gasVolumeM3);
        energyAltJ = dischargeJ;
        endAltM3 = dischargeEndM3;
      }
      if (counted) {
        const oneJ = ctx.fitted ? energyAltJ : energyJ;
        const optionUnitJ = ctx.fitted ? energyJ : energyAltJ;
        out.starts.push({
          month: day.month,
          ambientC: ambK - K0,
          energyOneJ: oneJ,
          energyTwoJ: optionUnitJ * ctx.optionCount,
          requiredJ: interpolateClamped(ctx.energyTable, ambK),
        });
      }
      // Recharge within the timer, isothermal at the accumulator temperature; then trapped.
      const r = recharge(
        model,
        geometry,
        ctx.count,
        amountMol,
        accK,
        endVolumeM3,
        ctx.systemNominalAbsPa,
        ctx.pump,
      );
      charged = chargedState(model, geometry, fluid, amountMol, accK, r.gasPressureAbsPa);
      if (altSame && r.reachedSystem && (r.timeS * ctx.altCount) / ctx.count <= ctx.altPump.timerS) {
        chargedAlt = charged;
      } else {
        const rAlt = recharge(
          model,
          geometry,
          ctx.altCount,
          amountMol,
          accK,
          endAltM3,
          ctx.systemNominalAbsPa,
          ctx.altPump,
        );
        altSame = r.reachedSystem && rAlt.reachedSystem;
        chargedAlt = altSame
          ? charged
          : chargedState(model, geometry, fluid, amountMol, accK, rAlt.gasPressureAbsPa);
      }
      lastRecharge = {
        day: di,
        accC: accK - K0,
        kPa: (r.gasPressureAbsPa - atmPa) / 1000,
        reading: readingPct(geometry, r.gasVolumeM3),
        utcMs: t,
      };
      si++;
    }
  }
  return out;
}
