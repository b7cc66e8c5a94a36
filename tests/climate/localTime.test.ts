/**
 * Local time (docs/methods.md, "Local time"): the hourly UTC offsets found from a few probes of luxon
 * equal luxon's own offset asked hour by hour, on real zones chosen for their changes in the IANA time
 * zone database: daylight saving rules that changed year to year, half-hour and 45-minute zones, double
 * summer time, a daylight saving period revoked after a week, suspensions for Ramadan, a skipped
 * calendar day. Luxon (the IANA database) is the reference here, not a number of ours.
 */
import { DateTime, IANAZone } from "luxon";
import { describe, expect, it } from "vitest";
import {
  hourlyOffsetsMin,
  localDays,
  OFFSET_PROBE_HOURS,
  zoneClockFor,
} from "../../src/climate/localTime.js";
import { HOUR_MS, type HourlySeries } from "../../src/climate/types.js";

/** An empty series over [from, to) UTC, starting `skewHours` after `from` (so probes fall off midnight). */
function grid(from: string, to: string, skewHours = 0): HourlySeries {
  const start = Date.parse(from) + skewHours * HOUR_MS;
  const n = (Date.parse(to) - start) / HOUR_MS;
  return { startUtcMs: start, tempC: new Float64Array(n), filled: new Uint8Array(n) };
}

/** Luxon's offset of every grid hour, one call per hour, as an Int16Array like the code's. */
function offsetsHourByHour(series: HourlySeries, timeZone: string): Int16Array {
  const zone = IANAZone.create(timeZone);
  const out = new Int16Array(series.tempC.length);
  for (let i = 0; i < out.length; i++) out[i] = zone.offset(series.startUtcMs + i * HOUR_MS);
  return out;
}

/** Index and both offsets of the first hour where two offset arrays differ, or null. */
function firstDifference(a: Int16Array, b: Int16Array): [number, number, number] | null {
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return [i, a[i]!, b[i]!];
  return null;
}

// Periods of the IANA time zone database with offset changes of the kinds named (tz database
// "northamerica", "southamerica", "asia", "australasia", "europe", "africa" files; from memory).
const CASES: { zone: string; from: string; to: string; why: string }[] = [
  {
    zone: "America/Chicago",
    from: "1966-01-01",
    to: "1976-01-01",
    why: "US rules by year, 1974–75 emergency DST",
  },
  {
    zone: "America/Recife",
    from: "2000-01-01",
    to: "2001-01-01",
    why: "DST of October 2000 revoked after a week",
  },
  { zone: "Asia/Kolkata", from: "1941-06-01", to: "1946-01-01", why: "half-hour zone, wartime +06:30" },
  { zone: "Asia/Kathmandu", from: "1985-01-01", to: "1987-01-01", why: "+05:30 to +05:45 in 1986" },
  { zone: "Australia/Lord_Howe", from: "2011-01-01", to: "2014-01-01", why: "half-hour daylight saving" },
  {
    zone: "America/St_Johns",
    from: "2009-01-01",
    to: "2012-01-01",
    why: "−03:30 with DST, change times moved 2011",
  },
  { zone: "Europe/London", from: "1941-01-01", to: "1948-01-01", why: "double summer time" },
  { zone: "Africa/Casablanca", from: "2012-01-01", to: "2016-01-01", why: "DST suspended for Ramadan" },
  { zone: "Pacific/Apia", from: "2011-06-01", to: "2012-06-01", why: "30 December 2011 skipped" },
  { zone: "Asia/Tehran", from: "2021-01-01", to: "2024-01-01", why: "+03:30 with DST until 2022" },
];

describe("hourly UTC offsets from probes of luxon", () => {
  for (const c of CASES) {
    it(`${c.zone} ${c.from.slice(0, 4)}–${c.to.slice(0, 4)} (${c.why}): equal to luxon hour by hour`, () => {
      // Seven hours after midnight UTC, so that the probes fall at odd local times.
      const series = grid(`${c.from}T00:00:00Z`, `${c.to}T00:00:00Z`, 7);
      const expected = offsetsHourByHour(series, c.zone);
      expect(firstDifference(hourlyOffsetsMin(series, c.zone), expected)).toBeNull();
      // Each case has offset changes to find (else it would test nothing).
      expect(new Set(expected).size).toBeGreaterThan(1);
    });
  }

  it("short and one-hour series, a change in the last probe step", () => {
    // 2014-03-09 08:00 UTC: Chicago springs forward (US rule since 2007, tz database "northamerica").
    for (const hours of [1, 2, 5, OFFSET_PROBE_HOURS, OFFSET_PROBE_HOURS + 1, OFFSET_PROBE_HOURS + 2]) {
      const start = Date.parse("2014-03-09T08:00:00Z") - (hours - 1) * HOUR_MS;
      const series = { startUtcMs: start, tempC: new Float64Array(hours), filled: new Uint8Array(hours) };
      expect(
        firstDifference(
          hourlyOffsetsMin(series, "America/Chicago"),
          offsetsHourByHour(series, "America/Chicago"),
        ),
      ).toBeNull();
    }
    expect(hourlyOffsetsMin(grid("2014-01-01T00:00:00Z", "2014-01-01T00:00:00Z"), "UTC")).toHaveLength(0);
  });

  it("local days follow the offsets: Chicago's first local day of 2014 starts at 06:00 UTC", () => {
    // Central Standard Time is UTC−06:00 in January (tz database "northamerica").
    const series = grid("2014-01-01T00:00:00Z", "2014-01-02T00:00:00Z");
    const { day, month } = localDays(series, "America/Chicago");
    const jan1 = Date.UTC(2014, 0, 1) / 86_400_000;
    expect(Array.from(day.slice(0, 6))).toEqual(Array(6).fill(jan1 - 1));
    expect(Array.from(day.slice(6))).toEqual(Array(18).fill(jan1));
    expect(month[0]).toBe(12);
    expect(month[6]).toBe(1);
  });
});

describe("a zone's clock: offsets at any instant and the instant of a local clock time", () => {
  /** Local wall clock of an instant in a zone, by luxon, as "YYYY-MM-DD HH:mm". */
  const wall = (utcMs: number, zone: string) =>
    DateTime.fromMillis(utcMs, { zone }).toFormat("yyyy-MM-dd HH:mm");

  for (const c of CASES) {
    it(`${c.zone} ${c.from.slice(0, 4)}–${c.to.slice(0, 4)}: offsets equal luxon's; local times map back`, () => {
      const clock = zoneClockFor(c.zone);
      const zone = IANAZone.create(c.zone);
      const from = Date.parse(`${c.from}T00:00:00Z`);
      const to = Math.min(Date.parse(`${c.to}T00:00:00Z`), from + 2 * 366 * 86_400_000);
      // Every 25 minutes: off the probe grid and off the hour.
      for (let t = from; t < to; t += 25 * 60_000) expect(clock.offsetMinAt(t)).toBe(zone.offset(t));
      for (let day = from; day < to; day += 86_400_000) {
        const d = new Date(day);
        const [y, m, dd] = [d.getUTCFullYear(), d.getUTCMonth() + 1, d.getUTCDate()];
        for (const minutes of [0, 90, 150]) {
          const asked = `${d.toISOString().slice(0, 10)} ${String(Math.floor(minutes / 60)).padStart(2, "0")}:${String(minutes % 60).padStart(2, "0")}`;
          const got = clock.utcMsOfLocal(y, m, dd, minutes);
          const byLuxon = DateTime.fromObject(
            { year: y, month: m, day: dd, hour: Math.floor(minutes / 60), minute: minutes % 60 },
            { zone: c.zone },
          ).toMillis();
          if (wall(got, c.zone) === asked) {
            // The clock time exists: no earlier instant within a change's size (at most 2 h in
            // these zones) shows it, and luxon's answer, where luxon finds it, is not earlier.
            for (const back of [30, 60, 120]) expect(wall(got - back * 60_000, c.zone)).not.toBe(asked);
            if (wall(byLuxon, c.zone) === asked) expect(got).toBeLessThanOrEqual(byLuxon);
          } else {
            // Skipped by a change forward: moved forward by the change, as luxon moves it.
            expect(got).toBe(byLuxon);
          }
        }
      }
    });
  }

  it("a clock time that occurs twice is its earlier occurrence; a skipped one moves forward", () => {
    // Europe/Berlin, 2014-10-26: 03:00 CEST became 02:00 CET, so 02:30 occurred at 00:30 and at
    // 01:30 UTC; 2014-03-30: 02:00 CET became 03:00 CEST, so 02:30 did not occur (tz database "europe").
    const berlin = zoneClockFor("Europe/Berlin");
    expect(berlin.utcMsOfLocal(2014, 10, 26, 150)).toBe(Date.parse("2014-10-26T00:30:00Z"));
    expect(berlin.utcMsOfLocal(2014, 3, 30, 150)).toBe(Date.parse("2014-03-30T01:30:00Z"));
    expect(berlin.utcMsOfLocal(2014, 7, 1, 0)).toBe(Date.parse("2014-06-30T22:00:00Z"));
  });
});
