/**
 * The region screen of one station (README, "Region screen"): one aircraft parked outside (no hangar)
 * present all year at the station, each usable climate year a stay from 1 January to 1 January,
 * without and with the cold-start option, through the planning engine's own steps — the samples of
 * `samples.ts`, the simulation of `simulateSamples.ts`, the statistics of `monthStats.ts` and
 * `confidence.ts`, the status rule `monthStatus` of `decisions.ts` — so that a screen of a station gives
 * what a plan with those two stays there gives (docs/methods.md §8).
 */

import type { DesignTemperatures } from "../climate/index.js";
import type { HourlySeries, StationClimate } from "../climate/types.js";
import { atmosphereOf, decisionThresholds, returnLevels, stationResult } from "./baseResult.js";
import type { BreakEvenRow } from "./breakEven.js";
import { baseConfidence } from "./confidence.js";
import { type DecisionThresholds, monthStatus, needSeason, type StatusOutcome } from "./decisions.js";
import { baseStatistics, monthlyColdestMornings } from "./monthStats.js";
import type { PlanCore, PlanFile } from "./planFile.js";
import type { StayMonthRow } from "./results.js";
import { baseClimate } from "./run.js";
import { flownWeekdays, prepareSamples, withDays } from "./samples.js";
import type { Stay } from "./schedule.js";
import { nominalBreakEven } from "./screenExtras.js";
import type { BreakEvenMargin, ScreenMonth, ScreenStation, ShareWithInterval } from "./screenResults.js";
import { simulateBase, simulator } from "./simulateSamples.js";

/**
 * The real year the whole-year stay is written in: a common year (365 days, so no climate day is
 * visited twice) that begins on a Monday; its weekdays decide the days flown when the plan flies on
 * some weekdays only.
 */
export const SCREEN_REFERENCE_YEAR = 2001;

/** The two aircraft of the screen, as a plan with the same stays would name them. */
export const SCREEN_AIRCRAFT = { without: "without-option", with: "with-option" } as const;

/**
 * What the screen takes from beside the engine, per station (`screenExtras.ts` provides them): the
 * profile's equilibrium break-even temperatures at the station's atmosphere, and the design
 * temperatures of its series (with the hours below those break-even temperatures).
 */
export interface ScreenExtras {
  /** Break-even rows of the profile at atmospheric pressure `atmPa` (Pa absolute). */
  breakEvenRows(atmPa: number): BreakEvenRow[];
  /** Design temperatures of a station's series. */
  design(series: HourlySeries, timeZone: string, breakEven: BreakEvenRow[]): DesignTemperatures;
}

export type { BreakEvenRow };

/**
 * The margins of a station's 1-in-10-year coldest morning over the break-even temperature with one
 * and with two accumulators, nominal precharge and nominal system pressure: coldest − break-even, K
 * (negative: mornings colder than the break-even come once in ten years or more often).
 *
 * @param coldest1in10C - the station's 1-in-10-year coldest morning, °C (null without one)
 * @param rows - the profile's break-even rows at the station's atmosphere (`equilibriumBreakEven`)
 * @example breakEvenMargins(-30, rows) // [{ units: 1, breakEvenC: -25, marginC: -5, reason: null }, …]
 */
export function breakEvenMargins(coldest1in10C: number | null, rows: BreakEvenRow[]): BreakEvenMargin[] {
  return nominalBreakEven(rows).map((r) => {
    const reason =
      r.ambientC === null
        ? `no break-even in the range searched (${r.reason})`
        : coldest1in10C === null
          ? "no 1-in-10-year coldest morning"
          : null;
    return {
      units: r.units,
      breakEvenC: r.ambientC,
      marginC: reason === null ? coldest1in10C! - r.ambientC! : null,
      reason,
    };
  });
}

/** The two whole-year stays of a station: without the option, then with it. */
export function screenStays(stationId: string, profile: string): Stay[] {
  const stay = (aircraft: string, coldStartOption: boolean): Stay => ({
    aircraft,
    base: stationId,
    arrive: `${SCREEN_REFERENCE_YEAR}-01-01`,
    depart: `${SCREEN_REFERENCE_YEAR + 1}-01-01`,
    coldStartOption,
    profile,
    line: 0,
  });
  return [stay(SCREEN_AIRCRAFT.without, false), stay(SCREEN_AIRCRAFT.with, true)];
}

/** The plan as the engine reads it for one station: the station as the only base, no hangar. */
export function screenPlan(plan: PlanFile, stationId: string): PlanCore {
  return { ...plan, bases: [{ name: stationId, stations: [stationId] }] };
}

/** A share of a stay's month with its 90 % interval, nulls where the stay has no such month. */
function share<N extends "shortPctOne" | "shortPctTwo" | "outOfBandPct">(
  row: StayMonthRow | undefined,
  name: N,
): ShareWithInterval<N> {
  const out: Record<string, number | null> = {};
  for (const key of [name, `${name}Lo90`, `${name}Hi90`] as const) out[key] = row?.[key] ?? null;
  return out as ShareWithInterval<N>;
}

/** The status of one month for one of the two aircraft, from its own figures (as `baseDecisions` reads them). */
function statusOf(
  row: StayMonthRow | undefined,
  coldStartOption: boolean,
  years: number,
  noData: boolean,
  t: DecisionThresholds,
): StatusOutcome {
  const present = row !== undefined;
  return monthStatus(
    {
      aircraft:
        present && !noData
          ? [{ coldStartOption, shortPctOne: row.shortPctOne, shortPctTwo: row.shortPctTwo, years }]
          : [],
      withoutData: present && noData ? 1 : 0,
      outOfBandPct: row?.outOfBandPct ?? null,
    },
    t,
  );
}

/**
 * Screens one station: its figures by local month without and with the option, the statuses, the
 * months needing the option and their season, the coldest mornings; `extras` adds the design
 * temperatures and break-even margins computed beside the engine.
 */
export function screenStation(
  plan: PlanFile,
  profile: string,
  station: StationClimate,
  extras: ScreenExtras,
): ScreenStation {
  const id = station.meta.id;
  const core = screenPlan(plan, id);
  const warnings: string[] = [];
  const [prepared] = prepareSamples(
    core,
    screenStays(id, profile),
    new Map([[id, baseClimate([station])]]),
    flownWeekdays(core),
    warnings,
  );
  const base = withDays(prepared!);
  const sim = simulator(core, [base!], {});
  const outcomes = simulateBase(sim, base!);
  const statistics = baseStatistics(core, base!, outcomes, warnings);
  const conf = baseConfidence(
    core,
    base!,
    outcomes,
    statistics.coldestMorningByYear.map((c) => c.tempC),
  );
  const [without, withOption] = conf.stays as [(typeof conf.stays)[0], (typeof conf.stays)[0]];
  const t = decisionThresholds(core);
  const coldest = monthlyColdestMornings(base!, outcomes);
  const months: ScreenMonth[] = coldest.map(({ month, coldestMorningC, coldest1in10C }) => {
    const one = without.months.find((r) => r.month === month);
    const two = withOption.months.find((r) => r.month === month);
    const st = statusOf(one, false, without.yearsUsed.length, without.noData !== null, t);
    const stWith = statusOf(two, true, withOption.yearsUsed.length, withOption.noData !== null, t);
    return {
      month,
      preflights: one?.preflights ?? 0,
      starts: one?.starts ?? 0,
      ...share(one, "shortPctOne"),
      ...share(two, "shortPctTwo"),
      ...share(one, "outOfBandPct"),
      outOfBandPctWithOption: two?.outOfBandPct ?? null,
      status: st.status,
      statusWithOption: stWith.status,
      lowConfidence: st.lowConfidence,
      needsOption: st.short.length > 0,
      coldestMorningC,
      coldest1in10C,
    };
  });
  const rows = extras.breakEvenRows(base!.climate.atmPa);
  const needing = months.filter((m) => m.needsOption).map((m) => m.month);
  const season = needSeason(needing);
  return {
    station: stationResult(station),
    atmosphere: atmosphereOf(base!),
    yearsUsed: base!.years,
    yearsSkipped: base!.skipped.map((s) => ({ ...s })),
    tooFewYears: base!.years.length < t.minYears,
    noData: without.noData,
    coldestMorningC: statistics.coldestMorningC,
    ...returnLevels(statistics, conf),
    monthsNeedingOption: needing,
    fitBy: season?.fitBy ?? null,
    notNeededAfter: season?.notNeededAfter ?? null,
    monthsStillShort: months.filter((m) => m.statusWithOption === "act").map((m) => m.month),
    breakEven: breakEvenMargins(statistics.coldest1in10C, rows),
    design: extras.design(base!.climate.series, base!.climate.timeZone, rows),
    months,
    warnings,
  };
}
