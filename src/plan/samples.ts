/**
 * The climate samples of each base, before anything is simulated: which weekdays are flown, which
 * stays are identical (simulated once), which climate years are usable for them, and the days of
 * every group of stays on every usable year (docs/methods.md, "Simulation").
 *
 * Every stay at a base maps onto the climate years with one reference year (the earliest arrival
 * year at the base): in each sample, stays that overlap in real time see the same weather and draw on
 * the same nitrogen pool. Stays that share profile, option, window (month-days and year offset from the
 * reference year and, when not every weekday is flown, weekdays) and gas-loss rate form one group. With
 * a gas-loss spread above zero each aircraft has its own rate, so only stays of one aircraft with
 * equal windows share.
 */
import type { HourlySeries, StationClimate } from "../climate/types.js";
import { type CivilDate, isoWeekday, stayDays } from "./calendar.js";
import { buildDays, type DayOptions, type DayPlan, HOUR_MS } from "./days.js";
import type { Plan } from "./planFile.js";
import { drawWeekdays, gasLossFactor } from "./random.js";
import type { Stay } from "./schedule.js";

/** Climate of one base: its stations (priority order), the merged series, zone and atmosphere. */
export interface BaseClimate {
  stations: StationClimate[];
  series: HourlySeries;
  timeZone: string;
  /** Local atmospheric pressure, Pa absolute (docs/methods.md §1). */
  atmPa: number;
  /**
   * Where `atmPa` comes from: the mean station pressure the primary station's records report (ISD
   * `MA1`), or the ISO 2533 standard atmosphere at its elevation.
   */
  atmSource: AtmosphereSource;
}

export type AtmosphereSource = "station pressure" | "standard atmosphere";

/** Stays of one base simulated once and counted once per stay. */
export interface StayGroup {
  /** Indexes into the base's stays. */
  stays: number[];
  profileIndex: number;
  coldStartOption: boolean;
  /** Multiplier of the profile's nominal gas-loss rate (seeded, per aircraft). */
  gasLossFactor: number;
  /** Real calendar days of the group's window. */
  realDays: CivilDate[];
}

/** A climate year left out for a base: too few of its stay hours have a value. */
export interface SkippedYear {
  year: number;
  completenessPct: number;
}

/** One base ready to simulate. */
export interface BaseSamples {
  baseIndex: number;
  climate: BaseClimate;
  /** The schedule's stays at this base, in schedule order. */
  stays: Stay[];
  groups: StayGroup[];
  /** Group index of each stay. */
  groupOfStay: number[];
  /** Usable climate years, ascending. */
  years: number[];
  skipped: SkippedYear[];
  /** Days of each group on each usable year: `days[yearIndex][groupIndex]`. */
  days: DayPlan[][][];
}

/** One aircraft's drawn gas-loss multiplier for one profile. */
export interface GasLossDraw {
  aircraft: string;
  profile: string;
  factor: number;
}

/** The weekdays flown (ISO, Monday 1): the plan's list, or a count drawn from the seed. */
export function flownWeekdays(plan: Plan): number[] {
  const w = plan.operations.weekdays;
  return typeof w === "number" ? drawWeekdays(plan.seed, w) : [...w].sort((a, b) => a - b);
}

function stayGasLossFactor(plan: Plan, stay: Stay): number {
  const profile = plan.profiles.find((p) => p.name === stay.profile)!;
  return gasLossFactor(plan.seed, stay.aircraft, profile.gasLoss.spread);
}

/** The gas-loss multiplier of every aircraft and profile of the schedule, in order of first stay. */
export function gasLossDraws(plan: Plan, stays: Stay[]): GasLossDraw[] {
  const profilesOf = new Map<string, Set<string>>();
  const draws: GasLossDraw[] = [];
  for (const s of stays) {
    const seen = profilesOf.get(s.aircraft) ?? new Set<string>();
    profilesOf.set(s.aircraft, seen);
    if (seen.has(s.profile)) continue;
    seen.add(s.profile);
    draws.push({ aircraft: s.aircraft, profile: s.profile, factor: stayGasLossFactor(plan, s) });
  }
  return draws;
}

/**
 * The window of a stay as whole numbers: each day's year offset from the reference year, month and day,
 * and its weekday when not every weekday is flown. Equal signatures give equal days on every sample.
 */
function windowSignature(realDays: CivilDate[], refYear: number, withWeekday: boolean): string {
  return realDays
    .map((d) => `${d.year - refYear}-${d.month}-${d.day}${withWeekday ? `:${isoWeekday(d)}` : ""}`)
    .join(",");
}

/** Groups of identical stays, in order of their first stay. */
function groupStays(
  plan: Plan,
  stays: Stay[],
  refYear: number,
  allFlown: boolean,
): { groups: StayGroup[]; groupOfStay: number[] } {
  const groups: StayGroup[] = [];
  const groupOfStay: number[] = [];
  const bySignature = new Map<string, number[]>();
  for (const [si, s] of stays.entries()) {
    const realDays = stayDays(s.arrive, s.depart);
    const profileIndex = plan.profiles.findIndex((p) => p.name === s.profile);
    const factor = stayGasLossFactor(plan, s);
    const signature = windowSignature(realDays, refYear, !allFlown);
    const candidates = bySignature.get(signature) ?? [];
    bySignature.set(signature, candidates);
    let gi = candidates.find((c) => {
      const g = groups[c]!;
      return (
        g.profileIndex === profileIndex &&
        g.coldStartOption === s.coldStartOption &&
        g.gasLossFactor === factor
      );
    });
    if (gi === undefined) {
      gi = groups.length;
      candidates.push(gi);
      groups.push({
        stays: [],
        profileIndex,
        coldStartOption: s.coldStartOption,
        gasLossFactor: factor,
        realDays,
      });
    }
    groups[gi]!.stays.push(si);
    groupOfStay.push(gi);
  }
  return { groups, groupOfStay };
}

/** Share of the grid hours of the days that have a value. */
function windowShare(series: HourlySeries, days: DayPlan[]): number {
  let total = 0;
  let present = 0;
  for (const d of days) {
    const first = Math.ceil((d.midnightUtcMs - series.startUtcMs) / HOUR_MS);
    const last = Math.ceil((d.nextMidnightUtcMs - series.startUtcMs) / HOUR_MS);
    total += last - first;
    for (let i = Math.max(0, first); i < Math.min(series.tempC.length, last); i++) {
      if (!Number.isNaN(series.tempC[i]!)) present++;
    }
  }
  return total === 0 ? 0 : present / total;
}

/** Calendar years (UTC) that hold at least one value of the series. */
function dataYears(series: HourlySeries): [number, number] | null {
  let first = -1;
  let last = -1;
  for (let i = 0; i < series.tempC.length; i++) {
    if (!Number.isNaN(series.tempC[i]!)) {
      if (first < 0) first = i;
      last = i;
    }
  }
  if (first < 0) return null;
  return [
    new Date(series.startUtcMs + first * HOUR_MS).getUTCFullYear(),
    new Date(series.startUtcMs + last * HOUR_MS).getUTCFullYear(),
  ];
}

/**
 * Every candidate climate year (the plan's range, else the years the data covers) on which all groups'
 * windows fit; a year is usable when each group's window has at least the plan's share of its hours.
 */
function usableYears(
  plan: Plan,
  climate: BaseClimate,
  groups: StayGroup[],
  refYear: number,
  dayOptions: DayOptions,
): Pick<BaseSamples, "years" | "skipped" | "days"> {
  const out: Pick<BaseSamples, "years" | "skipped" | "days"> = { years: [], skipped: [], days: [] };
  const range = plan.climate.years
    ? [plan.climate.years.from, plan.climate.years.to]
    : dataYears(climate.series);
  if (range === null || groups.length === 0) return out;
  const span = Math.max(0, ...groups.map((g) => g.realDays[g.realDays.length - 1]!.year - refYear));
  for (let y = range[0]!; y + span <= range[1]!; y++) {
    const days = groups.map((g) => buildDays(g.realDays, y, dayOptions, refYear));
    const worst = Math.min(1, ...days.map((d) => windowShare(climate.series, d)));
    if (worst >= plan.climate.minYearShare && worst > 0) {
      out.years.push(y);
      out.days.push(days);
    } else {
      out.skipped.push({ year: y, completenessPct: 100 * worst });
    }
  }
  return out;
}

function yearWarnings(
  plan: Plan,
  name: string,
  b: Pick<BaseSamples, "groups" | "years" | "skipped">,
): string[] {
  const out: string[] = [];
  const { years, skipped } = b;
  if (b.groups.length > 0 && years.length < plan.climate.minYears) {
    out.push(
      `base "${name}": ${years.length} usable climate year${years.length === 1 ? "" : "s"} (${years.join(", ") || "none"}), fewer than climate.minYears = ${plan.climate.minYears}`,
    );
  }
  if (skipped.length > 0) {
    out.push(
      `base "${name}": climate years skipped (under ${Math.round(plan.climate.minYearShare * 100)} % of the stay hours present): ${skipped.map((s) => `${s.year} (${s.completenessPct.toFixed(1)} %)`).join(", ")}`,
    );
  }
  return out;
}

/** The samples of every base of the plan; warnings about too few or skipped years go to `warnings`. */
export function prepareSamples(
  plan: Plan,
  stays: Stay[],
  climate: Map<string, BaseClimate>,
  weekdays: number[],
  warnings: string[],
): BaseSamples[] {
  const flown = new Set(weekdays);
  return plan.bases.map((base, baseIndex) => {
    const clim = climate.get(base.name);
    if (clim === undefined) throw new Error(`no climate for base ${base.name}`);
    const here = stays.filter((s) => s.base === base.name);
    const refYear = Math.min(...here.map((s) => Number(s.arrive.slice(0, 4))));
    const { groups, groupOfStay } = groupStays(plan, here, refYear, weekdays.length === 7);
    const dayOptions: DayOptions = {
      timeZone: clim.timeZone,
      startMinutes: plan.operations.startTimes,
      flownWeekdays: flown,
      hangar: base.hangar
        ? {
            inMin: base.hangar.in,
            outMin: base.hangar.out,
            months: base.hangar.months === null ? null : new Set(base.hangar.months),
          }
        : null,
    };
    const years = usableYears(plan, clim, groups, refYear, dayOptions);
    warnings.push(...yearWarnings(plan, base.name, { groups, ...years }));
    return { baseIndex, climate: clim, stays: here, groups, groupOfStay, ...years };
  });
}
