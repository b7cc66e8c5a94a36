/**
 * Climate design temperatures (docs/methods.md, "Climate design temperatures"): a constructed series
 * whose every quantile is known by hand, and the real O'Hare 2014 sample (NOAA ISD, public domain).
 */
import { DateTime } from "luxon";
import { beforeAll, describe, expect, it } from "vitest";
import {
  designTemperatures,
  HOUR_MS,
  type HourlySeries,
  loadClimate,
  NO_YEAR_REASON,
  type StationClimate,
} from "../../src/climate/index.js";
import { HAVE_SAMPLES, noCache, sample } from "./helpers.js";

/** Hours of the months of 2021 (not a leap year). */
const HOURS_2021 = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31].map((d) => d * 24);

/**
 * The hours of 2021 (UTC) hold a permutation of 0.0, 0.1, …, 875.9 °C: each month a block of
 * consecutive tenths (January 0.0–74.3, February 74.4–141.5, …), shuffled within the month by the
 * stride 11 (position i of a month of h hours holds the month's offset + ((11·i) mod h) tenths; 11 shares
 * no factor with 744, 720 or 672, so every tenth appears once).
 */
function permutationSeries(): HourlySeries {
  const n = 8760;
  const tempC = new Float64Array(n);
  let offset = 0;
  let at = 0;
  for (const h of HOURS_2021) {
    for (let i = 0; i < h; i++) tempC[at + i] = (offset + ((11 * i) % h)) / 10;
    offset += h;
    at += h;
  }
  return { startUtcMs: Date.UTC(2021, 0, 1), tempC, filled: new Uint8Array(n) };
}

const OPTIONS = { years: null, minYearShare: 0.8, coldThresholdsC: [1, 74.4] };

describe("design temperatures of a constructed series", () => {
  const series = permutationSeries();
  const d = designTemperatures(series, "UTC", OPTIONS);

  it("annual 99.6 % and 99 %: the type-7 0.4 % and 1 % quantiles of 0.0 … 875.9", () => {
    // By hand (Hyndman & Fan 1996, type 7: h = (n − 1)·p on the 0-based sorted values, n = 8760):
    // 0.4 %: h = 8759 × 0.004 = 35.036 → 3.5 + 0.036 × 0.1 = 3.5036; 1 %: h = 87.59 → 8.7 + 0.059 = 8.759.
    expect(d.years).toEqual([2021]);
    expect(d.reason).toBeNull();
    expect(d.annual996C).toBeCloseTo(3.5036, 9);
    expect(d.annual99C).toBeCloseTo(8.759, 9);
  });

  it("every month's 1 % value and the coldest month", () => {
    // By hand: a month of h hours holds its block from its offset, so its 1 % value is
    // offset + (h − 1) × 0.01 tenths: January (744 h) 0.743, February (672 h, from 74.4) 75.071, …
    let offset = 0;
    for (const [i, h] of HOURS_2021.entries()) {
      const m = d.months[i]!;
      expect(m.month).toBe(i + 1);
      expect(m.p1C).toBeCloseTo((offset + (h - 1) * 0.01) / 10, 9);
      // The mean of a block of consecutive tenths is its middle value.
      expect(m.meanC).toBeCloseTo((offset + (h - 1) / 2) / 10, 9);
      expect(m.years).toEqual([2021]);
      offset += h;
    }
    expect(d.months[0]!.p1C).toBeCloseTo(0.743, 9);
    expect(d.months[1]!.p1C).toBeCloseTo(75.071, 9);
    // January holds the lowest block: the coldest month, mean 37.15 °C.
    expect(d.coldestMonth).toEqual({
      month: 1,
      p1C: d.months[0]!.p1C,
      meanC: d.months[0]!.meanC,
      years: [2021],
    });
    expect(d.coldestMonth!.meanC).toBeCloseTo(37.15, 9);
  });

  it("hours below and the longest spell; the coldest hour", () => {
    // By hand: below 1.0 °C are the ten values 0.0 … 0.9, all in January; adjacent January hours differ by
    // 1.1 °C modulo 74.4 °C, so no two of them are adjacent: longest spell 1 h. Below 74.4 °C is all of
    // January: 744 hours in one spell. The coldest hour of 2021 is 0.0 °C.
    expect(d.hoursBelow).toEqual([
      { thresholdC: 1, hoursPerYear: 10, longestSpellH: 1 },
      { thresholdC: 74.4, hoursPerYear: 744, longestSpellH: 744 },
    ]);
    expect(d.coldestHour).toEqual({ meanC: 0, byYear: [{ year: 2021, tempC: 0 }] });
  });

  it("a year without enough hours leaves the annual values null with the reason", () => {
    // Definition (docs/methods.md): 2020 holds no hour, 2021 all of its hours.
    const two = designTemperatures(series, "UTC", { ...OPTIONS, years: { from: 2020, to: 2021 } });
    expect(two.years).toEqual([2021]);
    expect(two.yearsSkipped).toEqual([{ year: 2020, completenessPct: 0 }]);
    const none = designTemperatures(series, "UTC", { ...OPTIONS, years: { from: 2019, to: 2020 } });
    expect(none.annual996C).toBeNull();
    expect(none.annual99C).toBeNull();
    expect(none.reason).toBe(NO_YEAR_REASON);
    expect(none.coldestMonth).toBeNull();
    expect(none.hoursBelow[0]).toEqual({ thresholdC: 1, hoursPerYear: null, longestSpellH: null });
  });

  it("a missing hour ends a cold spell", () => {
    // Definition: consecutive hours below the threshold; a gap is not below it.
    const cold = permutationSeries();
    cold.tempC.fill(-30, 0, 100);
    cold.tempC[50] = Number.NaN;
    const d2 = designTemperatures(cold, "UTC", { ...OPTIONS, coldThresholdsC: [-20] });
    expect(d2.hoursBelow[0]).toEqual({ thresholdC: -20, hoursPerYear: 99, longestSpellH: 50 });
  });
});

describe.skipIf(!HAVE_SAMPLES)("design temperatures of 725300-94846 (Chicago O'Hare), 2014", () => {
  let station: StationClimate;
  beforeAll(async () => {
    [station] = (await loadClimate([sample("725300-94846-2014.gz")], noCache)) as [StationClimate];
  });

  it("1 Jan – 23 Apr only: no annual values; January's 1 % value between its 8th and 9th coldest hours", () => {
    const d = designTemperatures(station.series, station.meta.timeZone, {
      years: { from: 2014, to: 2014 },
      minYearShare: 0.8,
      coldThresholdsC: [-20],
    });
    // The file covers 1 January to 23 April 2014 (real data file): far below 80 % of the year.
    expect(d.annual996C).toBeNull();
    expect(d.annual99C).toBeNull();
    expect(d.reason).toBe("no year with enough hours");
    // January's local hourly values (America/Chicago), read here with luxon: all 744 hours hold a value
    // (from the data). Type 7: h = 743 × 0.01 + 1 = 8.43, between the 8th and 9th coldest, inclusive.
    const { startUtcMs, tempC } = station.series;
    const january: number[] = [];
    for (let i = 0; i < tempC.length; i++) {
      const local = DateTime.fromMillis(startUtcMs + i * HOUR_MS, { zone: "America/Chicago" });
      if (local.year === 2014 && local.month === 1 && !Number.isNaN(tempC[i]!)) january.push(tempC[i]!);
    }
    expect(january).toHaveLength(744);
    january.sort((a, b) => a - b);
    const p1 = d.months[0]!.p1C!;
    expect(p1).toBeGreaterThanOrEqual(january[7]!);
    expect(p1).toBeLessThanOrEqual(january[8]!);
    expect(d.months[0]!.years).toEqual([2014]);
  });
});
