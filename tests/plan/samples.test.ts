/**
 * Preparing the samples: groups of identical stays, usable climate years and the days of each group
 * on each year (definitions of docs/methods.md, "Simulation"; counts follow from the inputs built here).
 */
import { describe, expect, it } from "vitest";
import { gasLossDraws, prepareSamples, usableClimateDays, withDays } from "../../src/plan/samples.js";
import { fixturePlan, stayAt, syntheticClimate, type Tree } from "./helpers.js";

const ALL_DAYS = ["Mon", "Tue", "Wed", "Thu", "Fri", "Sat", "Sun"];

const stay = stayAt;

/** Two profiles alike but for their names, every weekday flown, years 2014–2016. */
function twoProfiles(spread: number) {
  return fixturePlan((t: Tree) => {
    t.profiles[0].gasLoss = { rate: "5 psi/month", spread };
    t.profiles.push({ ...t.profiles[0], name: "spare" });
    t.operations.weekdays = ALL_DAYS;
    t.climate.years = { from: 2014, to: 2016 };
  });
}

/** 0 °C every hour of 2014–2016, except that all of January 2016 is missing. */
const climate = new Map([
  [
    "North Field",
    syntheticClimate(
      (ms) => (ms >= Date.UTC(2016, 0, 1) && ms < Date.UTC(2016, 1, 1) ? Number.NaN : 0),
      Date.UTC(2014, 0, 1),
      Date.UTC(2017, 0, 1),
    ),
  ],
]);

describe("groups of identical stays", () => {
  it("share profile, option, window and gas-loss rate; each stay counts in exactly one group", () => {
    const plan = twoProfiles(0); // spread 0: every aircraft has the nominal rate
    const stays = [
      stay("A1", "2027-01-05", "2027-01-10"),
      stay("A2", "2027-01-05", "2027-01-10"), // same as A1: one simulation for both
      stay("A3", "2027-01-05", "2027-01-10", { coldStartOption: true }),
      stay("A4", "2027-01-05", "2027-01-10", { profile: "spare" }),
      stay("A5", "2027-01-06", "2027-01-10"), // another window
    ];
    const [base] = prepareSamples(plan, stays, climate, [1, 2, 3, 4, 5, 6, 7], []);
    expect(base!.groupOfStay).toEqual([0, 0, 1, 2, 3]);
    expect(base!.groups.map((g) => g.stays)).toEqual([[0, 1], [2], [3], [4]]);
    expect(base!.groups.map((g) => g.profileIndex)).toEqual([0, 0, 1, 0]);
    expect(base!.groups.every((g) => g.gasLossFactor === 1)).toBe(true);
  });

  it("with a gas-loss spread, two aircraft on the same window are simulated apart", () => {
    const plan = twoProfiles(0.3);
    const stays = [stay("A1", "2027-01-05", "2027-01-10"), stay("A2", "2027-01-05", "2027-01-10")];
    const [base] = prepareSamples(plan, stays, climate, [1, 2, 3, 4, 5, 6, 7], []);
    expect(base!.groupOfStay).toEqual([0, 1]);
  });
});

describe("usable climate years, window by window (docs/methods.md §4)", () => {
  it("holds no days once prepared: a base's days are built anew each time they are asked for", () => {
    const plan = twoProfiles(0);
    const stays = [stay("A1", "2027-01-05", "2027-01-10"), stay("A2", "2027-02-01", "2027-02-03")];
    const [prepared] = prepareSamples(plan, stays, climate, [1, 2, 3, 4, 5, 6, 7], []);
    // Memory grows with what is kept: the days of every stay on every year are not part of it.
    expect("days" in prepared!).toBe(false);
    const { days } = withDays(prepared!);
    const first = days.get(0, 0);
    const again = days.get(0, 0);
    expect(again).not.toBe(first); // nothing is held between samples
    expect(again).toEqual(first);
    expect(first.map((d) => d.climateIso)).toEqual([
      "2014-01-05",
      "2014-01-06",
      "2014-01-07",
      "2014-01-08",
      "2014-01-09",
    ]);
  });

  it("bounds each real day of the windows usable on a year once, as the days of the groups do", () => {
    const plan = twoProfiles(0);
    const stays = [
      stay("A1", "2027-01-05", "2027-01-10"),
      stay("A3", "2027-01-07", "2027-01-12"), // overlaps A1 on 7–9 January: those days once
      stay("A2", "2027-02-01", "2027-02-03"),
    ];
    const [prepared] = prepareSamples(plan, stays, climate, [1, 2, 3, 4, 5, 6, 7], []);
    const base = withDays(prepared!);
    const onYear = (yi: number) => [...usableClimateDays(base, yi).values()];
    // 2014 (index 0): 5–11 January and 1–2 February; UTC, so each day runs midnight to midnight.
    const days2014 = onYear(0);
    expect(days2014.map((d) => `${d.date.month}-${d.date.day}`)).toEqual([
      "1-5",
      "1-6",
      "1-7",
      "1-8",
      "1-9",
      "1-10",
      "1-11",
      "2-1",
      "2-2",
    ]);
    expect(days2014[0]!.midnightUtcMs).toBe(Date.UTC(2014, 0, 5));
    expect(days2014[0]!.nextMidnightUtcMs).toBe(Date.UTC(2014, 0, 6));
    // 2016 (index 2): the January windows are not usable (no January data), February's is.
    expect(onYear(2).map((d) => `${d.date.year}-${d.date.month}-${d.date.day}`)).toEqual([
      "2016-2-1",
      "2016-2-2",
    ]);
    // The same bounds as the days built for each group.
    for (let yi = 0; yi < base.years.length; yi++) {
      const bounds = new Map([...usableClimateDays(base, yi).values()].map((d) => [d.midnightUtcMs, d]));
      for (let gi = 0; gi < base.groups.length; gi++) {
        for (const d of base.days.get(yi, gi)) {
          expect(bounds.get(d.midnightUtcMs)?.nextMidnightUtcMs).toBe(d.nextMidnightUtcMs);
        }
      }
    }
  });

  it("skips a year only for the window that lacks data, says which window and the share found", () => {
    const plan = twoProfiles(0);
    const stays = [stay("A1", "2027-01-05", "2027-01-10"), stay("A2", "2027-02-01", "2027-02-03")];
    const warnings: string[] = [];
    const [base] = prepareSamples(plan, stays, climate, [1, 2, 3, 4, 5, 6, 7], warnings);
    // January 2016 has no value at all (the climate above): A1's window is skipped on 2016 with 0 %,
    // while A2's February window of 2016 is complete, so 2016 is still a sample of the base.
    expect(base!.years).toEqual([2014, 2015, 2016]);
    expect(base!.skipped).toEqual([]);
    expect(base!.usable).toEqual([
      [true, true],
      [true, true],
      [false, true],
    ]);
    expect(base!.windowSkips).toEqual([
      [{ year: 2016, fromIso: "2016-01-05", toIso: "2016-01-09", completenessPct: 0 }],
      [],
    ]);
    expect(base!.gaps).toEqual([null, null]);
    expect(warnings).toEqual([
      'base "North Field": climate years skipped for the stay window 2027-01-05 to 2027-01-10 (A1) (under 80 % of the window\'s hours present): 2016 (0.0 %)',
    ]);
    const { days } = withDays(base!);
    expect(base!.years).toHaveLength(3);
    expect(days.get(2, 0)).toEqual([]); // not simulated where not usable
    for (const yi of [0, 1]) {
      expect(days.get(yi, 0).map((d) => d.climateIso)).toEqual(
        [5, 6, 7, 8, 9].map((d) => `${base!.years[yi]}-01-0${d}`),
      );
      expect(days.get(yi, 1).map((d) => d.climateIso)).toEqual(
        [1, 2].map((d) => `${base!.years[yi]}-02-0${d}`),
      );
    }
  });

  it("a window no year covers is listed with the months it lacks and the files that would hold them", () => {
    const plan = twoProfiles(0);
    // A3 stays over January only; with climate years 2016 only, January has no value at all.
    const only2016 = fixturePlan((t: Tree) => {
      t.operations.weekdays = ALL_DAYS;
      t.climate.years = { from: 2016, to: 2016 };
    });
    const stays = [stay("A3", "2027-01-20", "2027-02-05"), stay("A4", "2027-02-10", "2027-02-12")];
    const warnings: string[] = [];
    const [base] = prepareSamples(only2016, stays, climate, [1, 2, 3, 4, 5, 6, 7], warnings);
    expect(plan.climate.minYearShare).toBe(0.8);
    expect(base!.years).toEqual([2016]);
    // A3: 20–31 January missing (12 of 16 days) is 25 % present; the station id is the climate's own
    // (tests/plan/helpers.ts), the file name pattern USAF-WBAN-YEAR.gz that of NOAA's ISD archive.
    expect(base!.windowSkips[0]).toEqual([
      { year: 2016, fromIso: "2016-01-20", toIso: "2016-02-04", completenessPct: 25 },
    ]);
    expect(base!.gaps[0]).toEqual({ months: [1], files: ["999999-99999-2016.gz"] });
    expect(base!.gaps[1]).toBeNull();
    expect(warnings).toContain(
      'base "North Field": no usable climate year for the stay window 2027-01-20 to 2027-02-05 (A3): it lacks Jan; files that would hold them: 999999-99999-2016.gz',
    );
  });
});

describe("gas-loss draws", () => {
  it("one per aircraft and profile, in order of first stay", () => {
    const plan = twoProfiles(0);
    const stays = [
      stay("A1", "2027-01-05", "2027-01-10"),
      stay("A2", "2027-01-05", "2027-01-10"),
      stay("A1", "2027-02-05", "2027-02-10"),
      stay("A1", "2027-03-05", "2027-03-10", { profile: "spare" }),
    ];
    // Spread 0: the log-normal multiplier is exactly its median, 1 (definition).
    expect(gasLossDraws(plan, stays)).toEqual([
      { aircraft: "A1", profile: "standard", factor: 1 },
      { aircraft: "A2", profile: "standard", factor: 1 },
      { aircraft: "A1", profile: "spare", factor: 1 },
    ]);
  });
});
