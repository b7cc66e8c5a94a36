/**
 * Climate design temperatures of one station or base, from its hourly series in local time (filled
 * hours included), in the forms engineers already use (docs/methods.md, "Climate design
 * temperatures"): the annual 99.6 % and 99 % cold dry-bulb temperatures, each month's 1 % value and
 * the coldest month's, the coldest hour of each year, and the hours per year below chosen temperatures
 * with the longest spell below each.
 *
 * Years: the local calendar years of `years` (all years holding data when null). A year counts for
 * the annual values when at least `minYearShare` of its hours hold a value; a month of a year counts
 * for the monthly values when at least that share of the month's hours do. A value no year supports is
 * null with its reason. Quantiles are type 7 of Hyndman & Fan (1996), as everywhere in the project.
 */
import { DateTime } from "luxon";
import { mean, quantileSorted } from "simple-statistics";
import { localDays } from "./localTime.js";
import type { HourlySeries } from "./types.js";

/** Options of `designTemperatures`. */
export interface DesignTempOptions {
  /** Local calendar years to use (inclusive); null: every year holding data. */
  years: { from: number; to: number } | null;
  /** Share of a year's (a month's) hours that must hold a value for the year (month) to count, 0–1. */
  minYearShare: number;
  /** Temperatures the hours below are counted under, °C. */
  coldThresholdsC: number[];
}

/** One local calendar month pooled over the years whose month has enough hours. */
export interface MonthDesignTemperature {
  month: number; // 1–12, local
  /** Years whose month counts. */
  years: number[];
  meanC: number | null;
  /** The hourly temperature that 99 % of the month's hours are at or above (type-7 1 % quantile), °C. */
  p1C: number | null;
  reason: string | null;
}

/** Hours below a temperature in the years used. */
export interface HoursBelow {
  thresholdC: number;
  /** Hours with a value strictly below the threshold, per year used. */
  hoursPerYear: number | null;
  /** Longest run of consecutive hours below it (a missing hour ends a run). */
  longestSpellH: number | null;
}

export interface DesignTemperatures {
  /** Local calendar years used for the annual values (enough of their hours hold a value). */
  years: number[];
  /** Candidate years left out of the annual values, with the share of their hours present, %. */
  yearsSkipped: { year: number; completenessPct: number }[];
  /** The share a year or a month needs, 0–1. */
  minYearShare: number;
  /** Annual 99.6 % cold dry-bulb: 99.6 % of the hours are at or above it (type-7 0.4 % quantile), °C. */
  annual996C: number | null;
  /** Annual 99 % cold dry-bulb (type-7 1 % quantile), °C. */
  annual99C: number | null;
  /** Why the annual values, the coldest hours and the hours below are null; null when they are not. */
  reason: string | null;
  /** The month with the lowest mean temperature, with its 1 % value; null where no month counts. */
  coldestMonth: { month: number; p1C: number; meanC: number; years: number[] } | null;
  coldestMonthReason: string | null;
  months: MonthDesignTemperature[];
  /** The coldest hourly value of each year used, and their mean. */
  coldestHour: { meanC: number | null; byYear: { year: number; tempC: number }[] };
  hoursBelow: HoursBelow[];
}

/** The reason of a value no year supports. */
export const NO_YEAR_REASON = "no year with enough hours";

const DAY_MS = 86_400_000;

/** Local calendar year of every grid hour, from its local day number. */
function localYears(day: Int32Array): Int16Array {
  const out = new Int16Array(day.length);
  let cachedDay = Number.NaN;
  let cachedYear = 0;
  for (let i = 0; i < day.length; i++) {
    if (day[i] !== cachedDay) {
      cachedDay = day[i]!;
      cachedYear = new Date(cachedDay * DAY_MS).getUTCFullYear();
    }
    out[i] = cachedYear;
  }
  return out;
}

/** Hours from local midnight of the first of a month to the first of the next (daylight saving included). */
function hoursInMonth(zone: string, year: number, month: number): number {
  const start = DateTime.fromObject({ year, month, day: 1 }, { zone });
  return Math.round(start.plus({ months: 1 }).diff(start).as("hours"));
}

/** The candidate years: the option's range, else the local years from the first to the last value. */
function candidateYears(
  series: HourlySeries,
  years: Int16Array,
  range: DesignTempOptions["years"],
): number[] {
  if (range !== null) return Array.from({ length: range.to - range.from + 1 }, (_, i) => range.from + i);
  let first = -1;
  let last = -1;
  for (let i = 0; i < series.tempC.length; i++) {
    if (Number.isNaN(series.tempC[i]!)) continue;
    if (first < 0) first = i;
    last = i;
  }
  if (first < 0) return [];
  return Array.from({ length: years[last]! - years[first]! + 1 }, (_, i) => years[first]! + i);
}

/** The values in ascending order, sorted as 64-bit floats (much faster than a comparator on an array). */
function ascending(values: number[]): number[] {
  return Array.from(Float64Array.from(values).sort());
}

/** Type-7 quantile of values sorted ascending. */
function q7(sorted: number[], p: number): number {
  return quantileSorted(sorted, p);
}

/** Which years and months count: present and expected hours by year and month. */
interface Coverage {
  annual: Set<number>;
  monthly: Set<number>[]; // index 1–12
  skipped: { year: number; completenessPct: number }[];
}

function coverage(
  series: HourlySeries,
  timeZone: string,
  years: Int16Array,
  month: Uint8Array,
  candidates: number[],
  minShare: number,
): Coverage {
  const present = new Map<number, Int32Array>(candidates.map((y) => [y, new Int32Array(13)]));
  for (let i = 0; i < series.tempC.length; i++) {
    if (Number.isNaN(series.tempC[i]!)) continue;
    const row = present.get(years[i]!);
    if (row !== undefined) row[month[i]!]!++;
  }
  const out: Coverage = {
    annual: new Set(),
    monthly: Array.from({ length: 13 }, () => new Set<number>()),
    skipped: [],
  };
  for (const y of candidates) {
    const row = present.get(y)!;
    let have = 0;
    let expected = 0;
    for (let m = 1; m <= 12; m++) {
      const hours = hoursInMonth(timeZone, y, m);
      have += row[m]!;
      expected += hours;
      if (row[m]! > 0 && row[m]! >= minShare * hours) out.monthly[m]!.add(y);
    }
    if (have > 0 && have >= minShare * expected) out.annual.add(y);
    else out.skipped.push({ year: y, completenessPct: (100 * have) / expected });
  }
  return out;
}

/** Hours below a threshold in the hours that count, and the longest consecutive run of them. */
function hoursBelow(tempC: Float64Array, counts: Uint8Array, thresholdC: number, years: number): HoursBelow {
  if (years === 0) return { thresholdC, hoursPerYear: null, longestSpellH: null };
  let total = 0;
  let run = 0;
  let longest = 0;
  for (let i = 0; i < tempC.length; i++) {
    if (counts[i] === 1 && tempC[i]! < thresholdC) {
      total++;
      run++;
      if (run > longest) longest = run;
    } else run = 0;
  }
  return { thresholdC, hoursPerYear: total / years, longestSpellH: longest };
}

/**
 * Climate design temperatures of an hourly series in the local time of `timeZone`.
 *
 * @param series hourly air temperature on the UTC hour grid, °C (NaN where missing; filled hours count)
 * @param timeZone IANA zone of the station
 * @param options years (local calendar years, inclusive, or null for all), the share of a year's or
 *   a month's hours that must hold a value (0–1), and the temperatures the hours below count under (°C)
 * @returns annual 99.6 % and 99 % values, monthly and coldest-month 1 % values, the coldest hour of
 *   each year, hours below each threshold with the longest spell; null with the reason where no year
 *   has enough hours
 *
 * References: ASHRAE Handbook — Fundamentals, chapter "Climatic Design Information" (annual 99.6 %
 * and 99 % heating dry-bulb temperatures, the monthly 1 % values and the coldest month; from memory);
 * Hyndman, R. J. and Fan, Y. (1996), "Sample quantiles in statistical packages", type 7; NOAA ISD
 * format document (the hourly temperatures); docs/methods.md, "Climate design temperatures".
 *
 * @example
 * // Ten years of hourly values at a station in Chicago, the 80 % rule, −20/−30/−40 °F:
 * designTemperatures(series, "America/Chicago", { years: null, minYearShare: 0.8, coldThresholdsC: [-28.9, -34.4, -40] });
 * // { years: [2011, …], annual996C: -23.4, annual99C: -20.1, coldestMonth: { month: 1, p1C: -24.0, … }, … }
 */
export function designTemperatures(
  series: HourlySeries,
  timeZone: string,
  options: DesignTempOptions,
): DesignTemperatures {
  const { day, month } = localDays(series, timeZone);
  const years = localYears(day);
  const cover = coverage(
    series,
    timeZone,
    years,
    month,
    candidateYears(series, years, options.years),
    options.minYearShare,
  );
  const annual: number[] = [];
  const monthly = Array.from({ length: 13 }, () => [] as number[]);
  const minimum = new Map<number, number>();
  const counts = new Uint8Array(series.tempC.length);
  for (let i = 0; i < series.tempC.length; i++) {
    const v = series.tempC[i]!;
    if (Number.isNaN(v)) continue;
    const y = years[i]!;
    if (cover.monthly[month[i]!]!.has(y)) monthly[month[i]!]!.push(v);
    if (!cover.annual.has(y)) continue;
    counts[i] = 1;
    annual.push(v);
    const lowest = minimum.get(y);
    if (lowest === undefined || v < lowest) minimum.set(y, v);
  }
  const annualSorted = ascending(annual);
  const months: MonthDesignTemperature[] = monthly.slice(1).map((unsorted, i) => {
    const values = ascending(unsorted);
    const has = values.length > 0;
    return {
      month: i + 1,
      years: [...cover.monthly[i + 1]!].sort((a, b) => a - b),
      meanC: has ? mean(values) : null,
      p1C: has ? q7(values, 0.01) : null,
      reason: has ? null : NO_YEAR_REASON,
    };
  });
  const coldest = months
    .filter((m) => m.meanC !== null)
    .reduce<MonthDesignTemperature | null>((a, m) => (a === null || m.meanC! < a.meanC! ? m : a), null);
  const usedYears = [...cover.annual].sort((a, b) => a - b);
  const byYear = usedYears.map((year) => ({ year, tempC: minimum.get(year)! }));
  const has = annualSorted.length > 0;
  return {
    years: usedYears,
    yearsSkipped: cover.skipped,
    minYearShare: options.minYearShare,
    annual996C: has ? q7(annualSorted, 0.004) : null,
    annual99C: has ? q7(annualSorted, 0.01) : null,
    reason: has ? null : NO_YEAR_REASON,
    coldestMonth:
      coldest === null
        ? null
        : { month: coldest.month, p1C: coldest.p1C!, meanC: coldest.meanC!, years: coldest.years },
    coldestMonthReason: coldest === null ? NO_YEAR_REASON : null,
    months,
    coldestHour: { meanC: byYear.length > 0 ? mean(byYear.map((b) => b.tempC)) : null, byYear },
    hoursBelow: options.coldThresholdsC.map((t) => hoursBelow(series.tempC, counts, t, usedYears.length)),
  };
}
