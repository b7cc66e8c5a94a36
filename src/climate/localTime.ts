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
 * UTC offset in minutes of every grid hour, from the zone's clock (`zoneClockFor`: luxon asked at
 * probes OFFSET_PROBE_HOURS apart, and by bisection at each change): about one hour in ninety is
 * asked of luxon, instead of every hour.
 */
export function hourlyOffsetsMin(series: HourlySeries, timeZone: string): Int16Array {
  const clock = zoneClockFor(timeZone);
  const n = series.tempC.length;
  const out = new Int16Array(n);
  for (let i = 0; i < n; ) {
    const { offsetMin, untilUtcMs } = clock.segmentAt(series.startUtcMs + i * HOUR_MS);
    const end = Math.min(n, Math.ceil((untilUtcMs - series.startUtcMs) / HOUR_MS));
    out.fill(offsetMin, i, end);
    i = end;
  }
  return out;
}

/** A zone's UTC offsets at any instant and the UTC instant of any local clock time. */
export interface ZoneClock {
  readonly timeZone: string;
  /** UTC offset in minutes (local − UTC) at a UTC instant, ms. */
  offsetMinAt(utcMs: number): number;
  /** The offset at a UTC instant and the instant up to which it holds at least (exclusive), ms. */
  segmentAt(utcMs: number): { offsetMin: number; untilUtcMs: number };
  /**
   * The UTC instant (ms) of local clock time `minutes` after midnight of a local calendar date. A
   * clock time that occurs twice (a change back) is its earlier occurrence; one that does not occur
   * (a change forward) is moved forward by the change, as luxon does.
   */
  utcMsOfLocal(year: number, month: number, day: number, minutes: number): number;
}

const clocks = new Map<string, ZoneClock>();

/**
 * The clock of an IANA zone, shared by every caller. Luxon is the source of every offset: it is
 * asked at instants OFFSET_PROBE_HOURS apart (on a grid fixed from 1970), and where two neighbouring
 * probes differ, the instant of the change is found by bisection to the second, asking luxon again;
 * each answer is kept. A plan asks for the local midnights and start times of many thousand days:
 * this is the difference between about two luxon calls per four days and several per day.
 *
 * @example zoneClockFor("Europe/Berlin").utcMsOfLocal(2014, 7, 1, 0) // Date.parse("2014-06-30T22:00Z")
 */
export function zoneClockFor(timeZone: string): ZoneClock {
  let clock = clocks.get(timeZone);
  if (clock === undefined) {
    clock = makeZoneClock(timeZone);
    clocks.set(timeZone, clock);
  }
  return clock;
}

const PROBE_MS = OFFSET_PROBE_HOURS * HOUR_MS;

function makeZoneClock(timeZone: string): ZoneClock {
  const zone = IANAZone.create(timeZone);
  if (!zone.isValid) throw new Error(`unknown time zone ${timeZone}`);
  const probes = new Map<number, number>();
  /** Block k: its offset at the start, the offset after its change and the change's instant. */
  const blocks = new Map<number, { from: number; to: number; changeMs: number }>();
  const probe = (k: number): number => {
    let off = probes.get(k);
    if (off === undefined) {
      off = zone.offset(k * PROBE_MS);
      probes.set(k, off);
    }
    return off;
  };
  const block = (k: number) => {
    let b = blocks.get(k);
    if (b === undefined) {
      const from = probe(k);
      const to = probe(k + 1);
      let lo = k * PROBE_MS; // offset `from` here
      let hi = (k + 1) * PROBE_MS; // offset `to` here
      while (from !== to && hi - lo > 1000) {
        const mid = lo + Math.floor((hi - lo) / 2000) * 1000;
        if (zone.offset(mid) === from) lo = mid;
        else hi = mid;
      }
      b = { from, to, changeMs: from === to ? Number.POSITIVE_INFINITY : hi };
      blocks.set(k, b);
    }
    return b;
  };
  const offsetMinAt = (utcMs: number): number => {
    const b = block(Math.floor(utcMs / PROBE_MS));
    return utcMs < b.changeMs ? b.from : b.to;
  };
  const segmentAt = (utcMs: number) => {
    const k = Math.floor(utcMs / PROBE_MS);
    const b = block(k);
    const blockEnd = (k + 1) * PROBE_MS;
    return utcMs < b.changeMs
      ? { offsetMin: b.from, untilUtcMs: Math.min(b.changeMs, blockEnd) }
      : { offsetMin: b.to, untilUtcMs: blockEnd };
  };
  const utcMsOfLocal = (year: number, month: number, day: number, minutes: number): number => {
    const localAsUtc = Date.UTC(year, month - 1, day, 0, minutes);
    // The offsets a day either side: the time zone database has no two changes of a zone less than
    // 7 days apart, so the clock time is either side's offset, both (twice), or neither (skipped).
    const before = offsetMinAt(localAsUtc - DAY_MS);
    const after = offsetMinAt(localAsUtc + DAY_MS);
    const withBefore = localAsUtc - before * 60_000;
    const withAfter = localAsUtc - after * 60_000;
    const beforeHolds = offsetMinAt(withBefore) === before;
    const afterHolds = offsetMinAt(withAfter) === after;
    if (beforeHolds && afterHolds) return Math.min(withBefore, withAfter);
    if (beforeHolds) return withBefore;
    if (afterHolds) return withAfter;
    return localAsUtc - Math.min(before, after) * 60_000;
  };
  return { timeZone, offsetMinAt, segmentAt, utcMsOfLocal };
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
