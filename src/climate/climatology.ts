/**
 * Local-time climatology of an hourly series, in one pass over it: per local calendar month the
 * minimum, mean and maximum of the hourly values, and the daily range (local-day maximum − minimum,
 * filled hours included) of every local day with at least 20 hours present, with each month's mean
 * and 90th percentile of those ranges. The station summary (`coldsoak climate`) and the planning
 * engine both read it, so the two always agree. Method: docs/methods.md, "Daily range and
 * completeness"; quantile: Hyndman & Fan (1996), type 7.
 */
import { mean, quantileSorted } from "simple-statistics";
import { localDays } from "./localTime.js";
import type { HourlySeries, MonthClimate } from "./types.js";

/** Days with at least this many hours present count for the daily range. */
export const MIN_HOURS_FOR_DAILY_RANGE = 20;

const DAY_MS = 86_400_000;

/** The range of one local day. */
export interface DailyRange {
  /** Local calendar date, YYYY-MM-DD. */
  localDate: string;
  /** Local calendar month, 1–12. */
  month: number;
  rangeC: number;
}

export interface LocalClimatology {
  /** Months 1–12 pooled over years; months without data give nulls. */
  months: MonthClimate[];
  /** Every local day with at least MIN_HOURS_FOR_DAILY_RANGE hours present, in time order. */
  dailyRanges: DailyRange[];
}

/**
 * Monthly climatology and daily ranges of an hourly series in the local time of `timeZone`.
 *
 * @param series hourly temperatures, °C (NaN where missing)
 * @param timeZone IANA zone of the station
 * @returns the twelve months (min, mean, max of the hourly values; mean and P90 of the daily ranges)
 *   and the daily ranges themselves
 *
 * References: NOAA ISD format document (the hourly temperatures); Hyndman, R. J. and Fan, Y. (1996),
 * "Sample quantiles in statistical packages", type 7 (the P90); docs/methods.md, "Daily range and
 * completeness".
 *
 * @example
 * // 24 local hours of 0…23 °C in Chicago on 2015-01-01 (local midnight is 06:00 UTC):
 * localClimatology(series, "America/Chicago").dailyRanges; // [{ localDate: "2015-01-01", month: 1, rangeC: 23 }]
 */
export function localClimatology(series: HourlySeries, timeZone: string): LocalClimatology {
  const { day, month } = localDays(series, timeZone);
  const lo = new Array<number>(13).fill(Number.POSITIVE_INFINITY);
  const hi = new Array<number>(13).fill(Number.NEGATIVE_INFINITY);
  const sum = new Array<number>(13).fill(0);
  const cnt = new Array<number>(13).fill(0);
  const rangesByMonth = Array.from({ length: 13 }, () => [] as number[]);
  const dailyRanges: DailyRange[] = [];
  const n = series.tempC.length;
  let i = 0;
  while (i < n) {
    const d = day[i]!;
    const m = month[i]!;
    let dayLo = Number.POSITIVE_INFINITY;
    let dayHi = Number.NEGATIVE_INFINITY;
    let count = 0;
    for (; i < n && day[i] === d; i++) {
      const v = series.tempC[i]!;
      if (Number.isNaN(v)) continue;
      count++;
      if (v < dayLo) dayLo = v;
      if (v > dayHi) dayHi = v;
      if (v < lo[m]!) lo[m] = v;
      if (v > hi[m]!) hi[m] = v;
      sum[m]! += v;
      cnt[m]!++;
    }
    if (count >= MIN_HOURS_FOR_DAILY_RANGE) {
      const rangeC = dayHi - dayLo;
      dailyRanges.push({ localDate: new Date(d * DAY_MS).toISOString().slice(0, 10), month: m, rangeC });
      rangesByMonth[m]!.push(rangeC);
    }
  }
  const months: MonthClimate[] = [];
  for (let m = 1; m <= 12; m++) {
    const has = cnt[m]! > 0;
    const ranges = rangesByMonth[m]!.sort((a, b) => a - b);
    months.push({
      month: m,
      minC: has ? lo[m]! : null,
      meanC: has ? sum[m]! / cnt[m]! : null,
      maxC: has ? hi[m]! : null,
      meanDailyRangeC: ranges.length > 0 ? mean(ranges) : null,
      p90DailyRangeC: ranges.length > 0 ? quantileSorted(ranges, 0.9) : null,
    });
  }
  return { months, dailyRanges };
}

/** The monthly climatology alone (see `localClimatology`). */
export function monthlyClimate(series: HourlySeries, timeZone: string): MonthClimate[] {
  return localClimatology(series, timeZone).months;
}

/** The daily ranges alone (see `localClimatology`). */
export function dailyRanges(series: HourlySeries, timeZone: string): DailyRange[] {
  return localClimatology(series, timeZone).dailyRanges;
}
