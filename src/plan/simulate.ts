/**
 * The hour-by-hour simulation of one stay on one climate year (docs/methods.md §5).
 *
 * State: accumulator temperature (first-order lag behind ambient, `lagTempK` of the physics module:
 * exact update over each step for an ambient linear between its values at the step's two ends, so
 * τ = 0 gives the ambient itself; the ambient is the air around the aircraft of `air.ts`: the outdoor
 * air, linear between grid hours, or in a hangar's hours a heated hangar's or an unheated shelter's
 * air, docs/methods.md, "Hangars"), gas amount per unit
 * (falls continuously by the aircraft's gas-loss rate, the profile context's `gasLossMolS`), and the
 * charged state at the end of the last recharge (the fluid is trapped until the next start;
 * docs/methods.md, "Trapped charge"). The trapped charge is solved at the end of every step; where it
 * would exceed the profile's relief pressure the valve lets fluid out (`thermalRelief`) and the relief
 * state becomes the reference (docs/methods.md, "Thermal relief").
 *
 * The aircraft arrives serviced, gas amount on the precharge reference, in the plan's arrival state:
 * charged to nominal system pressure at the arrival-day midnight temperature and trapped (default), or
 * precharge only (fluid side empty: no trapped charge and no hourly reading until the hand pump charges
 * it to nominal system pressure at the first start, strokes counted). Then, on each flown day, at each
 * start time:
 * 1. first start of the day: preflight — the reading (physics at the lagged accumulator temperature)
 *    against the band for the AMBIENT temperature the technician reads; the precharge check when due
 *    (every `prechargeCheckDays` days since the last one); the out-of-band policy;
 * 2. servicing (check or policy): the fluid side is relieved (piston on its fluid-side stop, gas at V0),
 *    the gauge is compared with the precharge line for the ambient temperature and its tolerance lines,
 *    and the gas is set to the line at ambient (nitrogen added, or gas vented) — while the gas is at the
 *    lagged temperature; then the hand pump recharges to nominal system pressure;
 * 3. start discharge (energy against the requirement at ambient); n identical units in parallel
 *    deliver n times one unit's energy (docs/methods.md §3);
 * 4. recharge by the pump within its timer (the option's longer timer when fitted), then trapped.
 *
 * Energy "with one and with two accumulators" (README; docs/methods.md §5): both configurations are followed for
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
import type { HangarAir } from "./air.js";
import type { ProfileContext } from "./context.js";
import type { DayPlan } from "./days.js";
import type { TracePoint } from "./results.js";
import { emptyOutcome, StayRun } from "./stayRun.js";

export type OutOfBandPolicy = "log" | "adjust-precharge";
/**
 * The accumulator on arrival: `charged` to nominal system pressure at the local-midnight ambient of the
 * arrival day, then trapped; `precharge-only`: the fluid side empty until the hand pump charges it to
 * nominal system pressure at the first start (docs/methods.md §5, "Arrival").
 */
export type ArrivalState = "charged" | "precharge-only";

export interface SimInputs {
  ctx: ProfileContext;
  series: HourlySeries;
  timeZone: string;
  days: DayPlan[];
  /** Multiplier of the nominal gas-loss rate for this aircraft (seeded). */
  gasLossFactor: number;
  /** The air inside the base's hangar during its hours (`days[].hangar`), or null without one. */
  hangar: HangarAir | null;
  prechargeCheckDays: number;
  policy: OutOfBandPolicy;
  /** The accumulator's state on arrival (default: charged). */
  arrival?: ArrivalState;
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
  /** Drop in accumulator temperature, K (°C difference). */
  tempC: number;
  /** Drop in gas pressure, kPa. */
  gasKPa: number;
  /** Drop in the fill reading, percentage points. */
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

/** One opening of the thermal relief valve: the steps in a row at which it let fluid out. */
export interface ReliefRecord {
  /** Local month of the day the valve first opened. */
  month: number;
  /** Instant it first opened, UTC ms (climate time). */
  utcMs: number;
  /** Fluid relieved over the event, m³ (all units), each step's measured at its temperature and the relief pressure. */
  relievedM3: number;
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
  /** Thermal relief events of the configuration fitted (docs/methods.md §3, "Thermal relief"). */
  reliefs: ReliefRecord[];
  /** Highest trapped fluid pressure by local month (index 1–12), Pa absolute; NaN: no trapped step. */
  peakTrappedAbsPa: Float64Array;
  /** Accumulator-hours simulated (hours × units). */
  accumulatorHours: number;
  trace: TraceSample[];
}

/** Simulates one stay on one climate year (see the header for what happens when). */
export function simulateStayYear(inp: SimInputs): SimOutcome {
  if (inp.days.length === 0) return emptyOutcome();
  const run = new StayRun(inp);
  for (let di = 0; di < inp.days.length; di++) run.day(di);
  return run.out;
}
