import { describe, expect, it } from "vitest";
import { climateDate, isoWeekday, stayDays } from "../../src/plan/calendar.js";
import { buildDays } from "../../src/plan/days.js";
import { runPlan } from "../../src/plan/engine.js";
import { fixturePlan, HOUR_MS, syntheticClimate } from "./helpers.js";

const OPTS = {
  timeZone: "UTC",
  startMinutes: [390],
  flownWeekdays: new Set([1, 2, 3, 4, 5, 6, 7]),
  hangar: null,
};

describe("stay windows on climate years (docs/methods.md §5)", () => {
  it("a stay covers arrive up to, not including, depart", () => {
    expect(stayDays("2027-01-30", "2027-02-02").map((d) => `${d.month}-${d.day}`)).toEqual([
      "1-30",
      "1-31",
      "2-1",
    ]);
  });

  it("stays across a leap day and a year end keep every civil day once", () => {
    // Gregorian calendar: 2028 is a leap year, so 2027-12-30 … 2028-03-01 is 2 + 31 + 29 + 1 days.
    const days = stayDays("2027-12-30", "2028-03-02");
    expect(days).toHaveLength(63);
    expect(days.find((d) => d.month === 2 && d.day === 29)?.year).toBe(2028);
    expect(days.at(-1)).toEqual({ year: 2028, month: 3, day: 1 });
  });

  it("ISO weekdays, Monday 1 … Sunday 7", () => {
    // From memory: 2000-01-01 was a Saturday, 1969-07-20 a Sunday, 2024-02-29 a Thursday, 2027-11-15 a Monday.
    expect(isoWeekday({ year: 2000, month: 1, day: 1 })).toBe(6);
    expect(isoWeekday({ year: 1969, month: 7, day: 20 })).toBe(7);
    expect(isoWeekday({ year: 2024, month: 2, day: 29 })).toBe(4);
    expect(isoWeekday({ year: 2027, month: 11, day: 15 })).toBe(1);
  });

  it("a window across 31 December runs into the next climate year", () => {
    const days = buildDays(stayDays("2027-12-30", "2028-01-02"), 2014, OPTS);
    expect(days.map((d) => d.climateIso)).toEqual(["2014-12-30", "2014-12-31", "2015-01-01"]);
    // Real dates stay the schedule's own.
    expect(days.map((d) => d.realIso)).toEqual(["2027-12-30", "2027-12-31", "2028-01-01"]);
  });

  it("29 February folds onto 28 February in a year without it", () => {
    expect(climateDate({ year: 2028, month: 2, day: 29 }, 2028, 2014)).toEqual({
      year: 2014,
      month: 2,
      day: 28,
    });
    expect(climateDate({ year: 2028, month: 2, day: 29 }, 2028, 2016)).toEqual({
      year: 2016,
      month: 2,
      day: 29,
    });
    const days = buildDays(stayDays("2028-02-28", "2028-03-02"), 2014, OPTS);
    expect(days.map((d) => d.climateIso)).toEqual(["2014-02-28", "2014-02-28", "2014-03-01"]);
  });

  it("local days keep their true length across daylight saving (luxon)", () => {
    // America/Chicago: DST began 9 March 2014 (US rule, 2nd Sunday of March) — a 23-hour day.
    const days = buildDays(stayDays("2027-03-09", "2027-03-11"), 2014, {
      ...OPTS,
      timeZone: "America/Chicago",
    });
    expect((days[0]!.nextMidnightUtcMs - days[0]!.midnightUtcMs) / HOUR_MS).toBe(23);
    expect((days[1]!.nextMidnightUtcMs - days[1]!.midnightUtcMs) / HOUR_MS).toBe(24);
  });

  it("a year under the minimum share of hours is skipped and listed", () => {
    const plan = fixturePlan((t) => {
      t.climate.years = { from: 2013, to: 2015 };
      t.climate.minYearShare = 0.8;
    });
    // 2014 January is half missing; 2013 and 2015 are complete.
    const gapFrom = Date.UTC(2014, 0, 1);
    const gapTo = Date.UTC(2014, 0, 17);
    const climate = new Map([
      [
        "North Field",
        syntheticClimate(
          (ms) => (ms >= gapFrom && ms < gapTo ? Number.NaN : 0),
          Date.UTC(2013, 0, 1),
          Date.UTC(2016, 0, 1),
        ),
      ],
    ]);
    const stays = [
      {
        aircraft: "A1",
        base: "North Field",
        arrive: "2027-01-01",
        depart: "2027-02-01",
        coldStartOption: false,
        profile: "standard",
        line: 2,
      },
    ];
    const { results } = runPlan(plan, stays, climate);
    const b = results.bases[0]!;
    expect(b.yearsUsed).toEqual([2013, 2015]);
    expect(b.yearsSkipped).toHaveLength(1);
    expect(b.yearsSkipped[0]!.year).toBe(2014);
    // 16 of 31 days missing: 15/31 of the hours present.
    expect(b.yearsSkipped[0]!.completenessPct).toBeCloseTo((100 * 15) / 31, 9);
    expect(results.warnings.some((w) => w.includes("2014 (48.4 %)"))).toBe(true);
  });
});

describe("hangar months (docs/methods.md §3, Hangars)", () => {
  it("a hangar limited to some months: a night belongs to the month of its evening", () => {
    // Definition (docs/methods.md §3): `months` limits the hangar; the night of 31 October goes with
    // October, so an October-less hangar starts on the evening of 1 November.
    const days = buildDays(stayDays("2027-10-31", "2027-11-03"), 2014, {
      ...OPTS,
      hangar: { inMin: 20 * 60, outMin: 6 * 60, months: new Set([11, 12]) },
    });
    const hours = (d: (typeof days)[number]) =>
      d.hangar.map(([a, b]) => [(a - d.midnightUtcMs) / HOUR_MS, (b - d.midnightUtcMs) / HOUR_MS]);
    expect(hours(days[0]!)).toEqual([]); // 31 October: neither its morning nor its evening
    expect(hours(days[1]!)).toEqual([[20, 24]]); // 1 November: evening only (the night before was October's)
    expect(hours(days[2]!)).toEqual([
      [0, 6],
      [20, 24],
    ]);
    // All year without `months`.
    const all = buildDays(stayDays("2027-10-31", "2027-11-01"), 2014, {
      ...OPTS,
      hangar: { inMin: 20 * 60, outMin: 6 * 60 },
    });
    expect(hours(all[0]!)).toEqual([
      [0, 6],
      [20, 24],
    ]);
  });
});
