/**
 * Local time of a station: its IANA zone from its coordinates (@photostructure/tz-lookup), offsets and
 * daylight saving from luxon (never by hand), and the local calendar day and month of every grid hour
 * (the climatology built on them is `climatology.ts`).
 */
import tzLookup from "@photostructure/tz-lookup";
import { IANAZone } from "luxon";
import { HOUR_MS, type HourlySeries } from "./types.js";

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
