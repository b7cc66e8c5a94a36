/**
 * Hourly grid, gap filling, priority merge, interpolation, daily ranges and completeness on small
 * hand-made series (arithmetic checks: common practice, no source) plus the real samples' local time.
 */
import { describe, expect, it } from "vitest";
import { hourlyFromObservations } from "../../src/climate/hourly.js";
import {
  dailyRanges,
  fillGaps,
  HOUR_MS,
  type HourlySeries,
  loadClimate,
  mergeByPriority,
  monthlyClimate,
  tempAtUtcMs,
  windowCompleteness,
  yearCompleteness,
} from "../../src/climate/index.js";
import { HAVE_SAMPLES, sample } from "./helpers.js";

const T0 = Date.UTC(2014, 0, 6, 0); // an arbitrary hour
const min = (ms: number) => ms / 60_000;

function series(values: number[], start = T0): HourlySeries {
  return { startUtcMs: start, tempC: Float64Array.from(values), filled: new Uint8Array(values.length) };
}

describe("hourly grid (docs/methods.md §4)", () => {
  it("takes the report nearest the hour within ±30 min, routine before special", () => {
    const t = Int32Array.from([
      min(T0) - 9, // 23:51 routine → hour 00
      min(T0) + 2, // 00:02 special, nearer but special
      min(T0) + 60 + 31, // 01:31: 31 min after 01 and 29 min before 02 → hour 02 only
      min(T0) + 180 - 30, // 02:30: exactly 30 min from 02 and 03
    ]);
    const temp = Int16Array.from([-111, -117, 50, 60]);
    const special = Uint8Array.from([0, 1, 0, 0]);
    const s = hourlyFromObservations(t, temp, special);
    expect(s.startUtcMs).toBe(T0);
    expect(Array.from(s.tempC)).toEqual([-11.1, Number.NaN, 5.0, 6.0]);
    // Hour 01 has no report within 30 min; hour 02: 02:30 (30 min) loses to 01:31 (29 min).
  });

  it("uses a special report where no routine one exists", () => {
    const s = hourlyFromObservations(
      Int32Array.from([min(T0) + 5]),
      Int16Array.from([12]),
      Uint8Array.from([1]),
    );
    expect(Array.from(s.tempC)).toEqual([1.2]);
  });

  it("fills gaps up to N hours linearly and counts them; longer gaps stay missing", () => {
    const nan = Number.NaN;
    const s = fillGaps(series([0, nan, nan, nan, 4, nan, nan, nan, nan, 9]), 3);
    expect(Array.from(s.tempC.slice(0, 5))).toEqual([0, 1, 2, 3, 4]);
    expect(Array.from(s.filled)).toEqual([0, 1, 1, 1, 0, 0, 0, 0, 0, 0]);
    expect(Number.isNaN(s.tempC[5]!)).toBe(true); // a 4-hour gap is longer than 3
  });

  it("merges stations by priority, hour by hour", () => {
    const nan = Number.NaN;
    const primary = series([1, nan, 3]);
    const second = series([10, 20, 30, 40], T0 - HOUR_MS);
    const m = mergeByPriority([{ series: primary }, { series: second }]);
    expect(m.startUtcMs).toBe(T0 - HOUR_MS);
    expect(Array.from(m.tempC)).toEqual([10, 1, 30, 3]);
  });

  it("interpolates between grid hours (zones at half hours)", () => {
    const s = series([0, 10, Number.NaN]);
    expect(tempAtUtcMs(s, T0 + HOUR_MS / 2)).toBe(5);
    expect(tempAtUtcMs(s, T0 + HOUR_MS)).toBe(10);
    expect(tempAtUtcMs(s, T0 + 1.5 * HOUR_MS)).toBeNaN();
    expect(tempAtUtcMs(s, T0 - 1)).toBeNaN();
  });

  it("completeness per UTC year over the whole year, and over a window", () => {
    const s = series(new Array(24).fill(1), Date.UTC(2015, 0, 1));
    expect(yearCompleteness(s).get(2015)).toBeCloseTo(24 / 8760, 12); // 2015 has 365 × 24 hours
    expect(windowCompleteness(s, Date.UTC(2015, 0, 1), Date.UTC(2015, 0, 2, 12))).toBeCloseTo(24 / 36, 12);
  });

  it("daily range needs 20 local hours; days follow the zone's offset (UTC−6 in January, IANA tz)", () => {
    // 2015-01-01 06:00 UTC = local midnight in America/Chicago; 24 hours of 0…23 °C, then 19 hours.
    const start = Date.UTC(2015, 0, 1, 6);
    const values = [...Array.from({ length: 24 }, (_, i) => i), ...Array.from({ length: 19 }, () => 5)];
    const r = dailyRanges(series(values, start), "America/Chicago");
    expect(r).toEqual([{ localDate: "2015-01-01", month: 1, rangeC: 23 }]);
    const months = monthlyClimate(series(values, start), "America/Chicago");
    expect(months[0]).toMatchObject({ month: 1, minC: 0, maxC: 23, meanDailyRangeC: 23, p90DailyRangeC: 23 });
    expect(months[1]!.meanC).toBeNull();
  });
});

describe.skipIf(!HAVE_SAMPLES)("local time on a real sample", () => {
  it("Chicago's coldest hour falls in local January and the daily ranges are plausible", async () => {
    const [s] = await loadClimate([sample("725300-94846-2014.gz")], { gapHours: 3, cacheDir: null });
    const months = monthlyClimate(s!.series, s!.meta.timeZone);
    // The hourly minimum is the −26.7 °C observation of 2014-01-06 (real file; NWS records, from memory).
    expect(months[0]!.minC).toBe(-26.7);
    const ranges = dailyRanges(s!.series, s!.meta.timeZone);
    // About 110 full local days from 1 January to 22 April 2014 (real file coverage).
    expect(ranges.length).toBeGreaterThan(100);
    for (const r of ranges) expect(r.rangeC).toBeGreaterThanOrEqual(0);
    expect(ranges.find((r) => r.localDate === "2014-01-06")).toBeDefined();
  });
});
