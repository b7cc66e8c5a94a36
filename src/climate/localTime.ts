/**
 * Local time of a station: its IANA zone from its coordinates (@photostructure/tz-lookup), offsets and
 * daylight saving from luxon (never by hand), and the local calendar day and month of every grid hour
 * (the climatology built on them is `climatology.ts`).
 */
import { createRequire } from "node:module";
import { IANAZone } from "luxon";
import { HOUR_MS, type HourlySeries } from "./types.js";

let tzLookup: ((lat: number, lon: number) => string) | null = null;

/**
 * IANA time zone at a point (degrees); throws on coordinates outside ±90°/±180°. The zone map is
 * loaded on the first call (a station read from the cache already has its zone).
 */
export function timeZoneFor(lat: number, lon: number): string {
  tzLookup ??= createRequire(import.meta.url)("@photostructure/tz-lookup") as (
    lat: number,
    lon: number,
  ) => string;
  return tzLookup(lat, lon);
}

const DAY_MS = 86_400_000;

/**
 * Grid hours between two probes of a zone's offset. The time zone database, read through luxon, has
 * no two offset changes of one zone less than 7 days apart from 1900 to 2040 (the closest: daylight
 * saving begun and revoked a week later in north-east Brazil, October 2000), so two probes 4 days apart
 * never have a pair of changes between them that would cancel out unseen.
 */
export const OFFSET_PROBE_HOURS = 96;

/**
 * UTC offset in minutes of every grid hour. Luxon (the IANA time zone database) is the source of every
 * offset: it is asked at every OFFSET_PROBE_HOURS-th hour, and between two probes that differ the hour
 * of each change is found by bisection, asking luxon again; the hours between are filled from the
 * answers: about one hour in ninety is asked, instead of every hour.
 */
export function hourlyOffsetsMin(series: HourlySeries, timeZone: string): Int16Array {
  const zone = IANAZone.create(timeZone);
  if (!zone.isValid) throw new Error(`unknown time zone ${timeZone}`);
  const n = series.tempC.length;
  const out = new Int16Array(n);
  if (n === 0) return out;
  const offsetAt = (i: number) => zone.offset(series.startUtcMs + i * HOUR_MS);
  /** Fills hours [lo, hi) knowing the offsets at lo and hi (at most one change in a probe step). */
  const fill = (lo: number, offLo: number, hi: number, offHi: number): void => {
    while (offLo !== offHi && hi - lo > 1) {
      const mid = lo + ((hi - lo) >> 1);
      const offMid = offsetAt(mid);
      fill(lo, offLo, mid, offMid);
      lo = mid;
      offLo = offMid;
    }
    if (offLo === offHi) out.fill(offLo, lo, hi);
    else out[lo] = offLo;
  };
  let lo = 0;
  let offLo = offsetAt(0);
  while (lo < n - 1) {
    const hi = Math.min(n - 1, lo + OFFSET_PROBE_HOURS);
    const offHi = offsetAt(hi);
    fill(lo, offLo, hi, offHi);
    lo = hi;
    offLo = offHi;
  }
  out[n - 1] = offLo;
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
