/**
 * The single-pass local climatology on small hand-made series (arithmetic checks: common practice,
 * no source, unless named).
 */
import { describe, expect, it } from "vitest";
import { localClimatology } from "../../src/climate/climatology.js";
import type { HourlySeries } from "../../src/climate/types.js";

function series(values: number[], startUtcMs: number): HourlySeries {
  return { startUtcMs, tempC: Float64Array.from(values), filled: new Uint8Array(values.length) };
}

/** One UTC day of 24 hours: 0 °C except `peakC` at 14:00. */
const day = (peakC: number) => Array.from({ length: 24 }, (_, h) => (h === 14 ? peakC : 0));

describe("local climatology", () => {
  it("gives the monthly values and the daily ranges of each local month in one pass", () => {
    // 22–31 January 2015 with daily ranges 1…10 °C, 1 February 2015 flat at 0 °C, then 19 hours of
    // 2 February (too few for a daily range, but counted in the month's hourly values).
    const values = [...[1, 2, 3, 4, 5, 6, 7, 8, 9, 10].flatMap(day), ...day(0), ...new Array(19).fill(-3)];
    const c = localClimatology(series(values, Date.UTC(2015, 0, 22)), "UTC");
    expect(c.dailyRanges.map((r) => [r.localDate, r.month, r.rangeC])).toEqual([
      ...[1, 2, 3, 4, 5, 6, 7, 8, 9, 10].map((k) => [`2015-01-${21 + k}`, 1, k]),
      ["2015-02-01", 2, 0],
    ]);
    const [jan, feb, mar] = c.months;
    expect(jan).toMatchObject({ month: 1, minC: 0, maxC: 10, meanDailyRangeC: 5.5 });
    expect(jan!.meanC).toBeCloseTo(55 / 240, 12);
    // P90 of 1…10, Hyndman & Fan (1996) type 7: h = (n − 1)·0.9 + 1 = 9.1 → 9 + 0.1·(10 − 9).
    expect(jan!.p90DailyRangeC).toBeCloseTo(9.1, 12);
    expect(feb).toMatchObject({ month: 2, minC: -3, maxC: 0, meanDailyRangeC: 0, p90DailyRangeC: 0 });
    expect(feb!.meanC).toBeCloseTo((19 * -3) / 43, 12);
    expect(mar).toEqual({
      month: 3,
      minC: null,
      meanC: null,
      maxC: null,
      meanDailyRangeC: null,
      p90DailyRangeC: null,
    });
  });

  it("assigns hours to the local day and month of the zone (IANA tz database)", () => {
    // 2015-02-01 00:00 to 05:00 UTC is still 31 January in America/Chicago (UTC−6 in winter).
    const c = localClimatology(series(new Array(6).fill(-1), Date.UTC(2015, 1, 1)), "America/Chicago");
    expect(c.months[0]).toMatchObject({ minC: -1, maxC: -1, meanC: -1 });
    expect(c.months[1]!.meanC).toBeNull();
    expect(c.dailyRanges).toEqual([]);
  });
});
