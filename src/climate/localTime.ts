/**
 * Local time of a station: its IANA zone from its coordinates (@photostructure/tz-lookup), offsets and
 * daylight saving from luxon (never by hand); daily ranges and the monthly climatology in local time
 * (product brief, section 4).
 */
import tzLookup from "@photostructure/tz-lookup";
import { IANAZone } from "luxon";
import { mean, quantileSorted } from "simple-statistics";
import { HOUR_MS, type HourlySeries, type MonthClimate } from "./types.js";

/** IANA time zone at a point (degrees); throws on coordinates outside ±90°/±180°. */
export function timeZoneFor(lat: number, lon: number): string {
  return tzLookup(lat, lon);
}

const DAY_MS = 86_400_000;

/**
 * UTC offset in minutes of every grid hour. Offsets are asked of luxon once a day and hour by hour
 * only on days where they change (zone offsets never change twice within 24 hours).
 */
export function hourlyOffsetsMin(series: HourlySeries, timeZone: string): Int16Array {
  const zone = IANAZone.create(timeZone);
  if (!zone.isValid) throw new Error(`unknown time zone ${timeZone}`);
  const n = series.tempC.length;
  const out = new Int16Array(n);
  let i = 0;
  let prev = zone.offset(series.startUtcMs);
  while (i < n) {
    const j = Math.min(n - 1, i + 24);
    const next = zone.offset(series.startUtcMs + j * HOUR_MS);
    if (next === prev) out.fill(prev, i, j + 1);
    else for (let k = i; k <= j; k++) out[k] = zone.offset(series.startUtcMs + k * HOUR_MS);
    prev = next;
    i = j + 1;
  }
  return out;
}

/** Local calendar day (days since 1970-01-01 in local time) and month (1–12) of every grid hour. */
export function localDays(series: HourlySeries, timeZone: string): { day: Int32Array; month: Uint8Array } {
  const offsets = hourlyOffsetsMin(series, timeZone);
  const n = series.tempC.length;
  const day = new Int32Array(n);
  const month = new Uint8Array(n);
  let cachedDay = Number.NaN;
  let cachedMonth = 0;
  for (let i = 0; i < n; i++) {
    const localMs = series.startUtcMs + i * HOUR_MS + offsets[i]! * 60_000;
    const d = Math.floor(localMs / DAY_MS);
    if (d !== cachedDay) {
      cachedDay = d;
      cachedMonth = new Date(d * DAY_MS).getUTCMonth() + 1;
    }
    day[i] = d;
    month[i] = cachedMonth;
  }
  return { day, month };
}

/** Days with at least this many hours present count for the daily range (brief §4). */
export const MIN_HOURS_FOR_DAILY_RANGE = 20;

/**
 * Local-day maximum − minimum of the hourly series (filled hours included) for local days with at
 * least 20 hours present.
 */
export function dailyRanges(series: HourlySeries, timeZone: string): { localDate: string; rangeC: number }[] {
  const { day } = localDays(series, timeZone);
  const out: { localDate: string; rangeC: number }[] = [];
  const n = series.tempC.length;
  let i = 0;
  while (i < n) {
    const d = day[i]!;
    let lo = Number.POSITIVE_INFINITY;
    let hi = Number.NEGATIVE_INFINITY;
    let count = 0;
    for (; i < n && day[i] === d; i++) {
      const v = series.tempC[i]!;
      if (Number.isNaN(v)) continue;
      count++;
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
    if (count >= MIN_HOURS_FOR_DAILY_RANGE)
      out.push({ localDate: new Date(d * DAY_MS).toISOString().slice(0, 10), rangeC: hi - lo });
  }
  return out;
}

/**
 * Monthly climatology in local time, pooled over years: min, mean and max of the hourly values, and the
 * mean and 90th percentile (linear interpolation, R type 7, simple-statistics) of the daily ranges of
 * the local days of that month. Months without data give nulls.
 */
export function monthlyClimate(series: HourlySeries, timeZone: string): MonthClimate[] {
  const { month } = localDays(series, timeZone);
  const lo = new Array<number>(13).fill(Number.POSITIVE_INFINITY);
  const hi = new Array<number>(13).fill(Number.NEGATIVE_INFINITY);
  const sum = new Array<number>(13).fill(0);
  const cnt = new Array<number>(13).fill(0);
  for (let i = 0; i < series.tempC.length; i++) {
    const v = series.tempC[i]!;
    if (Number.isNaN(v)) continue;
    const m = month[i]!;
    if (v < lo[m]!) lo[m] = v;
    if (v > hi[m]!) hi[m] = v;
    sum[m]! += v;
    cnt[m]!++;
  }
  const ranges: number[][] = Array.from({ length: 13 }, () => []);
  for (const r of dailyRanges(series, timeZone)) ranges[Number(r.localDate.slice(5, 7))]!.push(r.rangeC);
  const out: MonthClimate[] = [];
  for (let m = 1; m <= 12; m++) {
    const rs = ranges[m]!.sort((a, b) => a - b);
    out.push({
      month: m,
      minC: cnt[m]! > 0 ? lo[m]! : null,
      meanC: cnt[m]! > 0 ? sum[m]! / cnt[m]! : null,
      maxC: cnt[m]! > 0 ? hi[m]! : null,
      meanDailyRangeC: rs.length > 0 ? mean(rs) : null,
      p90DailyRangeC: rs.length > 0 ? quantileSorted(rs, 0.9) : null,
    });
  }
  return out;
}
