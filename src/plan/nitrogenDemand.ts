/**
 * The nitrogen demand of a base, event by event, for the cylinder cascade (docs/methods.md §7):
 * - servicing by the operations policy, as the hour-by-hour simulation recorded it (precharge checks,
 *   out-of-band adjustments and gas-loss top-ups, each to the precharge line at the preflight ambient);
 * - unscheduled full recharges (an accumulator, valve or seal change empties the gas side): a seeded
 *   Poisson count per stay and sample, each a charge from vented (local atmospheric pressure) to the
 *   precharge line at the day's site temperature, one accumulator each;
 * - other uses of the same carts (struts, tyres), per aircraft, per flown day or per week.
 * The two new items are built here from the stays' days and the climate, not inside the hour-by-hour
 * simulation, and do not feed back into it (docs/methods.md §7 says why that is enough). Also the base's calendar of real days and each day's site temperature, the day's mean
 * outdoor temperature.
 */

import { N2_MOLAR_MASS_KG_MOL } from "../physics/nitrogen.js";
import { ZERO_CELSIUS_K as K0, S_PER_DAY } from "../units/index.js";
import { dayNumber, isoWeekday } from "./calendar.js";
import { type ProfileContext, prechargeLineAbsPa } from "./context.js";
import { HOUR_MS } from "./days.js";
import type { Plan } from "./planFile.js";
import { unscheduledRechargeDays } from "./random.js";
import { type BaseSamples, usableClimateDays } from "./samples.js";
import type { BaseOutcomes, Simulator } from "./simulateSamples.js";

/** Draws of the seeded events per climate year when unscheduled recharges are in the plan (else 1). */
export const EVENT_DRAWS = 20;

/** What every supply event has: when, for which stay, at which site temperature. */
interface EventCommon {
  /** Real day, counted from the base's first day. */
  realDay: number;
  /** Instant (climate time, UTC ms): orders the events within a day. */
  utcMs: number;
  /** Index of the stay among the base's stays. */
  stay: number;
  /** Site temperature of the transfer, K. */
  tempK: number;
}

/** A charge of accumulators through the cascade: each of `units` units from fromMol to toMol. */
export interface FillEvent extends EventCommon {
  cause: "servicing" | "unscheduled";
  /** Gas volume on the fluid-side stop (where the gas goes), m³. */
  v0M3: number;
  fromMol: number;
  toMol: number;
  units: number;
}

/** Gas for another use of the same cylinders, taken down to no lower than the spent pressure. */
export interface DrawEvent extends EventCommon {
  cause: "otherUse";
  amountMol: number;
  floorAbsPa: number;
}

export type SupplyEvent = FillEvent | DrawEvent;

/** The real days of a base's deployment and each day's site temperature on each usable year. */
export interface BaseCalendar {
  /** First real day of the base's stays, days since 1970-01-01. */
  startDay: number;
  /** Days from the first arrival up to, not including, the last departure. */
  nDays: number;
  /** Real day index of each day of each group: `realDay[groupIndex][dayIndex]`. */
  realDay: number[][];
  /** 1 on the real days at least one stay covers, 0 on the days between stays. */
  covered: Uint8Array;
  /** 1 on the real days whose weekday is flown, else 0 (0 on the days between stays). */
  flown: Uint8Array;
  /**
   * The local midnights (UTC ms) that bound each real day's climate day on each usable year:
   * `midnightUtcMs[yearIndex][realDay]` up to `nextMidnightUtcMs[yearIndex][realDay]` (NaN on a day
   * no window usable that year covers).
   */
  midnightUtcMs: Float64Array[];
  nextMidnightUtcMs: Float64Array[];
  /**
   * Each real day's mean outdoor temperature on each usable year, K: `dayTempK[yearIndex][realDay]`
   * (a day without a value, or without a stay, takes the nearest earlier day's, else the nearest later).
   */
  dayTempK: Float64Array[];
}

/** The date `n` days after the day number `start`, YYYY-MM-DD. */
export function isoOfDay(start: number, n: number): string {
  return new Date((start + n) * S_PER_DAY * 1000).toISOString().slice(0, 10);
}

/** Mean of the hourly series over [fromUtcMs, toUtcMs), K; NaN without a value. */
function meanTempK(base: BaseSamples, fromUtcMs: number, toUtcMs: number): number {
  const s = base.climate.series;
  const first = Math.max(0, Math.ceil((fromUtcMs - s.startUtcMs) / HOUR_MS));
  const last = Math.min(s.tempC.length, Math.ceil((toUtcMs - s.startUtcMs) / HOUR_MS));
  let sum = 0;
  let n = 0;
  for (let i = first; i < last; i++) {
    const t = s.tempC[i]!;
    if (!Number.isNaN(t)) {
      sum += t;
      n++;
    }
  }
  return n === 0 ? Number.NaN : sum / n + K0;
}

/** Fills NaN entries from the nearest earlier value, else the nearest later one. */
function fillGaps(a: Float64Array): void {
  let last = Number.NaN;
  for (let i = 0; i < a.length; i++) {
    if (Number.isNaN(a[i]!)) a[i] = last;
    else last = a[i]!;
  }
  last = Number.NaN;
  for (let i = a.length - 1; i >= 0; i--) {
    if (Number.isNaN(a[i]!)) a[i] = last;
    else last = a[i]!;
  }
}

/** The base's real days, their bounds and the site temperature of each on each usable year. */
export function baseCalendar(base: BaseSamples): BaseCalendar {
  const firsts = base.groups.map((g) => dayNumber(g.realDays[0]!));
  const lasts = base.groups.map((g) => dayNumber(g.realDays[g.realDays.length - 1]!));
  const start = firsts.length === 0 ? 0 : Math.min(...firsts);
  const nDays = lasts.length === 0 ? 0 : Math.max(...lasts) + 1 - start;
  const realDay = base.groups.map((g) => g.realDays.map((d) => dayNumber(d) - start));
  const covered = new Uint8Array(nDays);
  const flown = new Uint8Array(nDays);
  base.groups.forEach((g, gi) => {
    g.realDays.forEach((real, di) => {
      const d = realDay[gi]![di]!;
      if (covered[d] === 1) return;
      covered[d] = 1;
      flown[d] = base.dayOptions.flownWeekdays.has(isoWeekday(real)) ? 1 : 0;
    });
  });
  const midnightUtcMs: Float64Array[] = [];
  const nextMidnightUtcMs: Float64Array[] = [];
  const dayTempK = base.years.map((_y, yi) => {
    const temps = new Float64Array(nDays).fill(Number.NaN);
    const from = new Float64Array(nDays).fill(Number.NaN);
    const to = new Float64Array(nDays).fill(Number.NaN);
    for (const [n, day] of usableClimateDays(base, yi)) {
      from[n - start] = day.midnightUtcMs;
      to[n - start] = day.nextMidnightUtcMs;
      temps[n - start] = meanTempK(base, day.midnightUtcMs, day.nextMidnightUtcMs);
    }
    fillGaps(temps);
    midnightUtcMs.push(from);
    nextMidnightUtcMs.push(to);
    return temps;
  });
  return { startDay: start, nDays, realDay, covered, flown, midnightUtcMs, nextMidnightUtcMs, dayTempK };
}

/** The profile context of each group of a base (precharge line, V0, nominal amount, atmosphere). */
export function groupContexts(sim: Simulator, base: BaseSamples): ProfileContext[] {
  return base.groups.map((g) =>
    sim.contexts.get(sim.plan.profiles[g.profileIndex]!, base.climate.atmPa, g.coldStartOption),
  );
}

/** The distinct contexts of a list (groups of one profile and option share one context). */
export function distinctContexts(contexts: readonly ProfileContext[]): ProfileContext[] {
  return [...new Set(contexts)];
}

/**
 * The lowest precharge target any accumulator at the base is raised to at tempK: the lowest of its
 * profiles' precharge lines there, Pa absolute (a cylinder is spent below it plus the differential).
 * Its cost grows with the list: give it `distinctContexts` of the groups' contexts.
 */
export function lowestTargetAbsPa(contexts: ProfileContext[], tempK: number): number {
  let low = Number.POSITIVE_INFINITY;
  for (const ctx of contexts) low = Math.min(low, prechargeLineAbsPa(ctx, tempK));
  return low;
}

/** The servicings the simulation recorded for every stay of a base on its usable year `yi`. */
export function servicingEvents(
  plan: Plan,
  base: BaseSamples,
  outcomes: BaseOutcomes,
  cal: BaseCalendar,
  yi: number,
): FillEvent[] {
  const events: FillEvent[] = [];
  for (const [si, gi] of base.groupOfStay.entries()) {
    const v0M3 = plan.profiles[base.groups[gi]!.profileIndex]!.accumulator.gasVolumeEmpty;
    for (const e of outcomes.nitrogen(outcomes.slot(yi, gi))) {
      events.push({
        cause: "servicing",
        realDay: cal.realDay[gi]![e.day]!,
        utcMs: e.utcMs,
        stay: si,
        tempK: e.tempK,
        v0M3,
        fromMol: e.fromMol,
        toMol: e.toMol,
        units: e.units,
      });
    }
  }
  return events;
}

/**
 * Midday of real day `d` on usable year `yi` (UTC ms): when unscheduled work and other uses draw their
 * gas within the day.
 */
const middayUtcMs = (cal: BaseCalendar, yi: number, d: number) =>
  (cal.midnightUtcMs[yi]![d]! + cal.nextMidnightUtcMs[yi]![d]!) / 2;

/** Days of group `gi`'s window on usable year `yi`: all of them where the window is usable, else none. */
const windowLength = (base: BaseSamples, yi: number, gi: number) =>
  base.usable[yi]?.[gi] ? base.groups[gi]!.realDays.length : 0;

/**
 * Other uses of every stay of a base on its usable year `yi`: the plan's amount on each flown day, or
 * once a week from the arrival day (the last, shorter week in proportion to its days).
 */
export function otherUseEvents(
  plan: Plan,
  base: BaseSamples,
  contexts: ProfileContext[],
  cal: BaseCalendar,
  yi: number,
): DrawEvent[] {
  const use = plan.nitrogen.otherUse;
  if (use === undefined || use.amount === 0) return [];
  const amountMol = use.amount / N2_MOLAR_MASS_KG_MOL;
  const targets = distinctContexts(contexts);
  const floor = (tempK: number) => lowestTargetAbsPa(targets, tempK) + plan.nitrogen.transferDifferential;
  const events: DrawEvent[] = [];
  for (const [si, gi] of base.groupOfStay.entries()) {
    const n = windowLength(base, yi, gi);
    for (let di = 0; di < n; di++) {
      const realDay = cal.realDay[gi]![di]!;
      const share = use.per === "week" ? (di % 7 === 0 ? Math.min(7, n - di) / 7 : 0) : cal.flown[realDay]!;
      if (share === 0) continue;
      const tempK = cal.dayTempK[yi]![realDay]!;
      events.push({
        cause: "otherUse",
        realDay,
        utcMs: middayUtcMs(cal, yi, realDay),
        stay: si,
        tempK,
        amountMol: amountMol * share,
        floorAbsPa: floor(tempK),
      });
    }
  }
  return events;
}

/**
 * The unscheduled full recharges of every stay of a base on its usable year `yi` in draw `draw`: one
 * accumulator each, from vented (ρ(local atmosphere, T)·V0) to the precharge reference's amount, which
 * is the precharge line at the day's site temperature T with gas and site at T.
 */
export function unscheduledEvents(
  plan: Plan,
  base: BaseSamples,
  contexts: ProfileContext[],
  cal: BaseCalendar,
  yi: number,
  draw: number,
): FillEvent[] {
  const rate = plan.nitrogen.unscheduledRechargesPerAircraftMonth;
  if (rate === 0) return [];
  const baseName = plan.bases[base.baseIndex]!.name;
  const events: FillEvent[] = [];
  for (const [si, gi] of base.groupOfStay.entries()) {
    const stay = base.stays[si]!;
    const ctx = contexts[gi]!;
    const key = `${baseName}|${stay.aircraft}|${stay.arrive}|${base.years[yi]}|${draw}`;
    for (const di of unscheduledRechargeDays(plan.seed, key, rate, windowLength(base, yi, gi))) {
      const realDay = cal.realDay[gi]![di]!;
      const tempK = cal.dayTempK[yi]![realDay]!;
      const v0M3 = ctx.geometry.v0M3;
      events.push({
        cause: "unscheduled",
        realDay,
        utcMs: middayUtcMs(cal, yi, realDay),
        stay: si,
        tempK,
        v0M3,
        fromMol: ctx.model.densityMolM3(ctx.atmPa, tempK) * v0M3,
        toMol: ctx.nominalMol,
        units: 1,
      });
    }
  }
  return events;
}

/** Events in the order they happen: real day, instant, stay; ties keep their given order. */
export function inTimeOrder(events: SupplyEvent[]): SupplyEvent[] {
  return [...events].sort((a, b) => a.realDay - b.realDay || a.utcMs - b.utcMs || a.stay - b.stay);
}
