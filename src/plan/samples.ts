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
import { type CivilDate, civilIso, dayNumber, isoWeekday, MONTH_NAMES, stayDays } from "./calendar.js";
import { buildDays, type ClimateDay, climateDay, type DayOptions, type DayPlan, HOUR_MS } from "./days.js";
import type { PlanCore } from "./planFile.js";
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

/** A climate year left out for a base: no stay window there has enough of its hours with a value. */
export interface SkippedYear {
  year: number;
  /** Share of the hours present in the best-covered stay window of that year, %. */
  completenessPct: number;
}

/** A climate year left out for one stay window: the window on that year and the share of its hours found. */
export interface WindowSkip {
  year: number;
  /** First and last climate date of the window on that year (YYYY-MM-DD). */
  fromIso: string;
  toIso: string;
  completenessPct: number;
}

/** What a stay window lacks when no candidate year covers it. */
export interface WindowGap {
  /** Local months of the window that no candidate year fills to the plan's share, 1–12. */
  months: number[];
  /** ISD file names (`USAF-WBAN-YEAR.gz`, the base's first station) that would hold those months. */
  files: string[];
}

/** One base ready to simulate. */
export interface BaseSamples {
  baseIndex: number;
  climate: BaseClimate;
  /** The real year that maps onto each sample's climate year: the earliest arrival year at the base. */
  refYear: number;
  /** The schedule's stays at this base, in schedule order. */
  stays: Stay[];
  groups: StayGroup[];
  /** Group index of each stay. */
  groupOfStay: number[];
  /** Climate years usable for at least one stay window, ascending. */
  years: number[];
  /** Candidate years usable for no stay window. */
  skipped: SkippedYear[];
  /** Whether each group's window is usable on each year: `usable[yearIndex][groupIndex]`. */
  usable: boolean[][];
  /** Candidate years each group's window was left out of: `windowSkips[groupIndex]`. */
  windowSkips: WindowSkip[][];
  /** What each group's window lacks when no year covers it, else null: `gaps[groupIndex]`. */
  gaps: (WindowGap | null)[];
  /** Days of each group on each usable year (empty where the window is not usable): `days.get(yearIndex, groupIndex)`. */
  days: BaseDays;
  /** How the days are built (`withDays`). */
  dayOptions: DayOptions;
}

/**
 * A base as prepared, without its days: they are built (`withDays`) only while the base is simulated
 * and aggregated, and then one climate year at a time (`BaseDays`), so that a run never holds the days
 * of every stay on every year.
 */
export type PreparedBase = Omit<BaseSamples, "days">;

/**
 * The days of each group on each usable year of a base (empty where the window is not usable), the
 * same days `usableYears` counted: built anew each time they are asked for (each sample is simulated
 * once, so nothing is held between samples).
 */
export class BaseDays {
  constructor(
    private readonly base: Pick<BaseSamples, "years" | "usable" | "groups" | "dayOptions" | "refYear">,
    /** Local month (1–12) after whose last day each group's days are cut; null: not cut. */
    private readonly untilMonth: number | null = null,
  ) {}

  /** The same days cut after the last day of `month` in each group's window (no day there: none). */
  untilEndOf(month: number): BaseDays {
    return new BaseDays(this.base, month);
  }

  /** Days of group `gi` on usable year `yi`. */
  get(yi: number, gi: number): DayPlan[] {
    const b = this.base;
    if (!b.usable[yi]?.[gi]) return [];
    const days = buildDays(b.groups[gi]!.realDays, b.years[yi]!, b.dayOptions, b.refYear);
    return this.untilMonth === null ? days : days.slice(0, lastDayOf(days, this.untilMonth) + 1);
  }
}

/**
 * The climate day of each real day that a window usable on year `yi` covers, keyed by the real day's
 * number (`dayNumber`), each real day once however many windows cover it, in order of first window:
 * every stay at a base maps real dates onto a climate year alike, so this is all that counts a year's
 * window days or bounds them, without a `DayPlan` per group and day.
 */
export function usableClimateDays(
  base: Pick<BaseSamples, "years" | "usable" | "groups" | "dayOptions" | "refYear">,
  yi: number,
): Map<number, ClimateDay> {
  const onYear = climateDaysOn(base.refYear, base.years[yi]!, base.dayOptions.timeZone);
  base.groups.forEach((g, gi) => {
    if (base.usable[yi]?.[gi]) g.realDays.forEach(onYear.of);
  });
  return onYear.found;
}

/**
 * The climate days of real days on climate year `climateYear`, each real day's found once and shared
 * by every window that covers it (`found`, keyed by `dayNumber`, in the order first asked for).
 */
function climateDaysOn(
  referenceYear: number,
  climateYear: number,
  timeZone: string,
): { of: (real: CivilDate) => ClimateDay; found: Map<number, ClimateDay> } {
  const found = new Map<number, ClimateDay>();
  const of = (real: CivilDate): ClimateDay => {
    const n = dayNumber(real);
    let day = found.get(n);
    if (day === undefined) {
      day = climateDay(real, referenceYear, climateYear, timeZone);
      found.set(n, day);
    }
    return day;
  };
  return { of, found };
}

/** Index of the last day of local month `month` in `days`, −1 without one. */
function lastDayOf(days: DayPlan[], month: number): number {
  let last = -1;
  for (let i = 0; i < days.length; i++) if (days[i]!.month === month) last = i;
  return last;
}

/** The base with its days (`BaseDays`). */
export function withDays(base: PreparedBase): BaseSamples {
  return { ...base, days: new BaseDays(base) };
}

/** One aircraft's drawn gas-loss multiplier for one profile. */
export interface GasLossDraw {
  aircraft: string;
  profile: string;
  factor: number;
}

/** The weekdays flown (ISO, Monday 1): the plan's list, or a count drawn from the seed. */
export function flownWeekdays(plan: PlanCore): number[] {
  const w = plan.operations.weekdays;
  return typeof w === "number" ? drawWeekdays(plan.seed, w) : [...w].sort((a, b) => a - b);
}

function stayGasLossFactor(plan: PlanCore, stay: Stay): number {
  const profile = plan.profiles.find((p) => p.name === stay.profile)!;
  return gasLossFactor(plan.seed, stay.aircraft, profile.gasLoss.spread);
}

/** The gas-loss multiplier of every aircraft and profile of the schedule, in order of first stay. */
export function gasLossDraws(plan: PlanCore, stays: Stay[]): GasLossDraw[] {
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
  plan: PlanCore,
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

/** Grid hours of the days and those with a value, by local month (index 1–12). */
function hoursByMonth(
  series: HourlySeries,
  days: readonly ClimateDay[],
): { total: number[]; present: number[] } {
  const total = new Array<number>(13).fill(0);
  const present = new Array<number>(13).fill(0);
  for (const d of days) {
    const first = Math.ceil((d.midnightUtcMs - series.startUtcMs) / HOUR_MS);
    const last = Math.ceil((d.nextMidnightUtcMs - series.startUtcMs) / HOUR_MS);
    total[d.date.month]! += last - first;
    for (let i = Math.max(0, first); i < Math.min(series.tempC.length, last); i++) {
      if (!Number.isNaN(series.tempC[i]!)) present[d.date.month]!++;
    }
  }
  return { total, present };
}

const sum = (v: number[]): number => v.reduce((a, b) => a + b, 0);

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

type YearSamples = Pick<BaseSamples, "years" | "skipped" | "usable" | "windowSkips" | "gaps">;

/** Per group, per local month: the best share found over candidate years and the climate years visited. */
interface MonthCover {
  bestShare: number[][];
  calendarYears: Set<number>[][];
}

/** The months a never-covered window lacks and the files of the base's first station that would fill them. */
function windowGap(
  cover: MonthCover,
  gi: number,
  months: number[],
  minShare: number,
  station: string | null,
): WindowGap {
  const lacking = months.filter((m) => cover.bestShare[gi]![m]! < minShare || cover.bestShare[gi]![m]! === 0);
  const years = new Set<number>();
  for (const m of lacking) for (const y of cover.calendarYears[gi]![m]!) years.add(y);
  const files = station === null ? [] : [...years].sort((a, b) => a - b).map((y) => `${station}-${y}.gz`);
  return { months: lacking, files };
}

/**
 * Every candidate climate year (the plan's range, else the years the data covers) on which all groups'
 * windows fit; a year counts for a group's window when at least the plan's share of that window's hours
 * have a value (docs/methods.md §4), and it is a sample of the base when it counts for any window.
 */
function usableYears(
  plan: PlanCore,
  climate: BaseClimate,
  groups: StayGroup[],
  refYear: number,
  dayOptions: DayOptions,
): YearSamples {
  const out: YearSamples = {
    years: [],
    skipped: [],
    usable: [],
    windowSkips: groups.map(() => []),
    gaps: groups.map(() => null),
  };
  const minShare = plan.climate.minYearShare;
  const cover: MonthCover = {
    bestShare: groups.map(() => new Array<number>(13).fill(0)),
    calendarYears: groups.map(() => Array.from({ length: 13 }, () => new Set<number>())),
  };
  const range = plan.climate.years
    ? [plan.climate.years.from, plan.climate.years.to]
    : dataYears(climate.series);
  const span = Math.max(0, ...groups.map((g) => g.realDays[g.realDays.length - 1]!.year - refYear));
  for (let y = range?.[0] ?? 1; range !== null && y + span <= range[1]!; y++) {
    // Only the bounds of the days, each real day's once per year (groups share them): every group's
    // whole days of a year would be rows × days objects.
    const onYear = climateDaysOn(refYear, y, dayOptions.timeZone);
    const ok = groups.map((g, gi) => {
      const d = g.realDays.map(onYear.of);
      const hours = hoursByMonth(climate.series, d);
      for (let m = 1; m <= 12; m++) {
        if (hours.total[m] === 0) continue;
        const share = hours.present[m]! / hours.total[m]!;
        cover.bestShare[gi]![m] = Math.max(cover.bestShare[gi]![m]!, share);
        for (const day of d) if (day.date.month === m) cover.calendarYears[gi]![m]!.add(day.date.year);
      }
      const total = sum(hours.total);
      const share = total === 0 ? 0 : sum(hours.present) / total;
      const usable = share >= minShare && share > 0;
      if (!usable) {
        out.windowSkips[gi]!.push({
          year: y,
          fromIso: civilIso(d[0]!.date),
          toIso: civilIso(d[d.length - 1]!.date),
          completenessPct: 100 * share,
        });
      }
      return usable;
    });
    if (ok.some((u) => u)) {
      out.years.push(y);
      out.usable.push(ok);
    } else {
      const best = Math.max(...out.windowSkips.map((w) => w[w.length - 1]?.completenessPct ?? 0));
      out.skipped.push({ year: y, completenessPct: best });
    }
  }
  const station = climate.stations[0]?.meta.id ?? null;
  groups.forEach((g, gi) => {
    if (out.usable.some((row) => row[gi])) return;
    const months = [...new Set(g.realDays.map((d) => d.month))];
    out.gaps[gi] = windowGap(cover, gi, months, minShare, station);
  });
  return out;
}

/** "2027-11-15 to 2028-03-01 (AC01, AC02)": a group's stay dates (arrive, depart) and its aircraft. */
function windowLabel(stays: Stay[], g: StayGroup): string {
  const first = stays[g.stays[0]!]!;
  const aircraft = [...new Set(g.stays.map((si) => stays[si]!.aircraft))].join(", ");
  return `${first.arrive} to ${first.depart} (${aircraft})`;
}

function yearWarnings(
  plan: PlanCore,
  name: string,
  stays: Stay[],
  groups: StayGroup[],
  y: YearSamples,
): string[] {
  const out: string[] = [];
  const { years } = y;
  if (groups.length > 0 && years.length < plan.climate.minYears) {
    out.push(
      `base "${name}": ${years.length} usable climate year${years.length === 1 ? "" : "s"} (${years.join(", ") || "none"}), fewer than climate.minYears = ${plan.climate.minYears}`,
    );
  }
  const under = `under ${Math.round(plan.climate.minYearShare * 100)} % of the window's hours present`;
  groups.forEach((g, gi) => {
    const gap = y.gaps[gi];
    if (gap) {
      const files = gap.files.length > 0 ? `; files that would hold them: ${gap.files.join(", ")}` : "";
      out.push(
        `base "${name}": no usable climate year for the stay window ${windowLabel(stays, g)}: it lacks ${gap.months.map((m) => MONTH_NAMES[m - 1]).join(", ")}${files}`,
      );
      return;
    }
    const skips = y.windowSkips[gi]!;
    if (skips.length > 0) {
      out.push(
        `base "${name}": climate years skipped for the stay window ${windowLabel(stays, g)} (${under}): ${skips.map((s) => `${s.year} (${s.completenessPct.toFixed(1)} %)`).join(", ")}`,
      );
    }
  });
  return out;
}

/** The samples of every base of the plan; warnings about too few or skipped years go to `warnings`. */
export function prepareSamples(
  plan: PlanCore,
  stays: Stay[],
  climate: Map<string, BaseClimate>,
  weekdays: number[],
  warnings: string[],
): PreparedBase[] {
  return plan.bases.map((base, baseIndex) => {
    const clim = climate.get(base.name);
    if (clim === undefined) throw new Error(`no climate for base ${base.name}`);
    return prepareBase(plan, stays, clim, baseIndex, weekdays, warnings);
  });
}

/** The samples of the plan's base `baseIndex` on its climate (the schedule's stays there). */
export function prepareBase(
  plan: PlanCore,
  stays: Stay[],
  clim: BaseClimate,
  baseIndex: number,
  weekdays: number[],
  warnings: string[],
): PreparedBase {
  const flown = new Set(weekdays);
  const base = plan.bases[baseIndex]!;
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
  warnings.push(...yearWarnings(plan, base.name, here, groups, years));
  return { baseIndex, climate: clim, refYear, stays: here, groups, groupOfStay, dayOptions, ...years };
}
