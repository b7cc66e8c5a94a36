/**
 * Statuses per base-month and aircraft actions (docs/methods.md §6) on constructed schedules and
 * climates: the rules are the definitions of the methods; every schedule, climate and figure below is
 * constructed.
 */
import { describe, expect, it } from "vitest";
import {
  aircraftAction,
  type DecisionThresholds,
  monthStatus,
  needSeason,
} from "../../src/plan/decisions.js";
import { runPlan } from "../../src/plan/engine.js";
import type { StayMonthRow } from "../../src/plan/results.js";
import type { Stay } from "../../src/plan/schedule.js";
import { yearsSkippedText } from "../../src/report/shared.js";
import { fixturePlan, oneLitreUnit, syntheticClimate, type Tree } from "./helpers.js";

const T: DecisionThresholds = { shortStartsPct: 1, outOfBandPct: 2, minYears: 5 };

function stay(aircraft: string, arrive: string, depart: string, coldStartOption = false): Stay {
  return { aircraft, base: "North Field", arrive, depart, coldStartOption, profile: "standard", line: 2 };
}

/**
 * The 1 L unit of the engine tests with a 2 s pump timer: one accumulator cannot refill after a start
 * (2 s at 1 L/min is 33 mL of about half a litre drawn), so every start after the first of a stay is
 * short with one; the option's 10 min timer refills two units, so none is short with two
 * (tests/plan/engine.test.ts shows both from the physics). The requirement, 3 kJ at every
 * temperature, lies between what a depleted unit delivers (under 1.6 kJ) and a full one (about 4.6 kJ,
 * twice that for two: the physics module's discharge of this unit at 5 °C); `pumpTimer` "10 min"
 * refills one unit, so one is enough.
 */
function plan(edit: (t: Tree) => void = () => {}, pumpTimer = "2 s") {
  return fixturePlan((t) => {
    oneLitreUnit(t);
    const p = t.profiles[0];
    p.pump = {
      curve: [
        { pressure: "0 psig", flow: "1 L/min" },
        { pressure: "3000 psig", flow: "1 L/min" },
      ],
      timer: pumpTimer,
    };
    p.coldStartOption = { count: 2, timer: "10 min" };
    p.startEnergy = [
      { ambient: "-40 F", energy: "3 kJ" },
      { ambient: "70 F", energy: "3 kJ" },
    ];
    t.operations.startTimes = ["07:00", "12:00", "17:00"];
    t.operations.prechargeCheckDays = 30;
    t.operations.outOfBand = "log";
    t.climate.years = { from: 2014, to: 2015 };
    t.climate.minYears = 1;
    t.thresholds = { shortStartsPct: 1, outOfBandPct: 2 };
    edit(t);
  });
}

/** 5 °C every hour of 2014–2015. */
const mild = new Map([
  ["North Field", syntheticClimate(() => 5, Date.UTC(2014, 0, 1), Date.UTC(2016, 0, 1))],
]);

describe("aircraft actions and statuses on constructed schedules", () => {
  it("every aircraft fitted and short with two under the threshold: no 'fit' action and no 'act'", () => {
    const stays = [
      stay("A1", "2027-01-05", "2027-01-20", true),
      stay("B1", "2027-01-10", "2027-02-10", true),
    ];
    const r = runPlan(plan(), stays, mild).results;
    expect(r.actions.map((a) => a.action)).toEqual(["fitted-needed", "fitted-needed"]);
    const b = r.bases[0]!;
    for (const m of b.months) expect(m.status).not.toBe("act");
    expect(b.months[0]!.status).toBe("ok");
    for (const a of b.advice) {
      expect(a.fitColdStartOption).toBe(false);
      expect(a.aircraft).toEqual([]);
    }
    expect(r.actions[0]!.text).toMatch(/^Fitted, needed from 2027-01-05/);
  });

  it("a mixed fleet names exactly the aircraft without the option", () => {
    const stays = [
      stay("A1", "2027-01-05", "2027-01-20", true),
      stay("B1", "2027-01-05", "2027-01-20"),
      stay("C1", "2027-01-12", "2027-01-30"),
    ];
    const r = runPlan(plan(), stays, mild).results;
    expect(r.actions.filter((a) => a.action === "fit").map((a) => a.aircraft)).toEqual(["B1", "C1"]);
    const jan = r.bases[0]!.months[0]!;
    expect(jan.status).toBe("act");
    expect(jan.statusAircraft).toEqual(["B1", "C1"]);
    expect(r.bases[0]!.advice[0]!.aircraft).toEqual(["B1", "C1"]);
    // The figure of the status is the larger of the two aircraft's own shares with one accumulator.
    const own = r.stays.slice(1).map((s) => s.months[0]!.shortPctOne!);
    expect(jan.statusPct).toBe(Math.max(...own));
    expect(r.actions[1]!.text).toMatch(
      /^Fit the cold-start option before 2027-01-05 \(needed from 2027-01-05\)/,
    );
  });

  it("an aircraft fitted where one accumulator is enough: 'fitted, not needed'; without it: 'keep as is'", () => {
    const stays = [stay("A1", "2027-01-05", "2027-01-20", true), stay("B1", "2027-01-05", "2027-01-20")];
    const r = runPlan(
      plan(() => {}, "10 min"),
      stays,
      mild,
    ).results;
    expect(r.stays[0]!.months[0]!.shortPctOne).toBe(0);
    expect(r.actions.map((a) => a.action)).toEqual(["fitted-not-needed", "keep"]);
    expect(r.actions[0]!.text).toMatch(/^Fitted, not needed by this estimate/);
    expect(r.bases[0]!.months[0]!.status).toBe("ok");
  });

  it("a stay across 31 December keeps its months in order: needed from arrival, to the end of the stay", () => {
    const r = runPlan(plan(), [stay("A1", "2027-12-20", "2028-01-10")], mild).results;
    expect(r.stays[0]!.months.map((m) => [m.month, m.realMonth])).toEqual([
      [12, "2027-12"],
      [1, "2028-01"],
    ]);
    expect(r.actions[0]).toMatchObject({ action: "fit", neededFrom: "2027-12-20", notNeededFrom: null });
  });

  it("the plan's thresholds set the statuses: shortStartsPct decides 'act', outOfBandPct 'watch'", () => {
    // B1 without the option: short with one and, its trapped charge never refilled, out of band at
    // most preflights; the plan's thresholds are echoed in results.json.
    const stays = [stay("B1", "2027-01-05", "2027-01-20")];
    const run = (shortStartsPct: number, outOfBandPct: number) =>
      runPlan(
        plan((t) => {
          t.thresholds = { shortStartsPct, outOfBandPct };
        }),
        stays,
        mild,
      ).results;
    const base = run(1, 2);
    const jan = base.bases[0]!.months[0]!;
    expect(jan.status).toBe("act");
    expect(jan.outOfBandPct).toBeGreaterThan(50);
    const noAct = run(100, 2);
    expect(noAct.thresholds).toEqual({ shortPct: 100, outOfBandPct: 2, minYears: 1 });
    expect(noAct.actions[0]!.action).toBe("keep");
    expect(noAct.bases[0]!.months[0]!.status).toBe("watch");
    expect(run(100, 100).bases[0]!.months[0]!.status).toBe("ok");
  });
});

/** A stay month with the shares given (constructed), no interval. */
function month(m: number, realMonth: string, one: number, two = 0): StayMonthRow {
  const none = { Lo90: null, Hi90: null, YearMin: null, YearMedian: null, YearMax: null };
  const conf = (name: string) => Object.fromEntries(Object.entries(none).map(([k, v]) => [`${name}${k}`, v]));
  return {
    month: m,
    realMonth,
    preflights: 30,
    starts: 90,
    shortPctOne: one,
    shortPctTwo: two,
    outOfBandPct: 0,
    ...conf("shortPctOne"),
    ...conf("shortPctTwo"),
    ...conf("outOfBandPct"),
  } as StayMonthRow;
}

describe("dates of an action (docs/methods.md §6)", () => {
  const facts = { aircraft: "A1", base: "North Field", years: 9, noData: null };
  const winter = [
    month(11, "2027-11", 0.5),
    month(12, "2027-12", 4),
    month(1, "2028-01", 6),
    month(2, "2028-02", 0.2),
  ];

  it("fit before arrival, needed from the first month above, not needed from the month after the last", () => {
    const a = aircraftAction(
      { ...facts, arrive: "2027-11-20", depart: "2028-02-25", coldStartOption: false },
      winter,
      T,
    );
    expect(a).toMatchObject({
      action: "fit",
      neededFrom: "2027-12-01",
      notNeededFrom: "2028-02-01",
      monthsAbove: [12, 1],
      worstMonth: 1,
      shortPctOne: 6,
    });
    expect(a.text).toMatch(
      /^Fit the cold-start option before 2027-11-20 \(needed from 2027-12-01; not needed from 2028-02-01\)/,
    );
  });

  it("fitted and needed: the same dates; fitted and still short with two: hangar or a later first start", () => {
    const fitted = { ...facts, arrive: "2027-11-20", depart: "2028-02-25", coldStartOption: true };
    expect(aircraftAction(fitted, winter, T)).toMatchObject({
      action: "fitted-needed",
      neededFrom: "2027-12-01",
      notNeededFrom: "2028-02-01",
    });
    const short = aircraftAction(fitted, [month(12, "2027-12", 30, 3), month(1, "2028-01", 40, 1.5)], T);
    expect(short).toMatchObject({ action: "fitted-still-short", stillShortWithOption: true, worstMonth: 12 });
    expect(short.text).toMatch(/^Option fitted but still short: hangar or later first start/);
  });

  it("a stay without data gets 'no data' with what it lacks; few years mark the action as low confidence", () => {
    const noData = aircraftAction(
      {
        ...facts,
        years: 0,
        noData: { months: [1], files: ["999999-99999-2016.gz"] },
        arrive: "2027-01-20",
        depart: "2027-02-05",
        coldStartOption: false,
      },
      [],
      T,
    );
    expect(noData).toMatchObject({ action: "no-data", neededFrom: null, lowConfidence: false });
    expect(noData.text).toBe(
      "No data: no usable climate year covers this stay (it lacks Jan; it would need 999999-99999-2016.gz).",
    );
    const few = aircraftAction(
      { ...facts, years: 3, arrive: "2027-11-20", depart: "2028-02-25", coldStartOption: false },
      winter,
      T,
    );
    expect(few.lowConfidence).toBe(true);
    expect(few.text).toMatch(/Low confidence: 3 usable climate years, fewer than 5\.$/);
  });
});

describe("status of a place and month (docs/methods.md §6)", () => {
  const a = (coldStartOption: boolean, one: number, two: number, years = 9) => ({
    coldStartOption,
    shortPctOne: one,
    shortPctTwo: two,
    years,
  });

  it("act: without the option above the threshold with one, or with it still above with two; act before watch", () => {
    expect(monthStatus({ aircraft: [a(false, 1.5, 0)], withoutData: 0, outOfBandPct: 0 }, T).status).toBe(
      "act",
    );
    expect(monthStatus({ aircraft: [a(true, 40, 0.5)], withoutData: 0, outOfBandPct: 0 }, T).status).toBe(
      "ok",
    );
    expect(monthStatus({ aircraft: [a(true, 40, 1.5)], withoutData: 0, outOfBandPct: 0 }, T).status).toBe(
      "act",
    );
    const both = monthStatus(
      { aircraft: [a(true, 40, 0), a(false, 3, 0)], withoutData: 0, outOfBandPct: 9 },
      T,
    );
    expect(both).toMatchObject({ status: "act", short: [1] });
  });

  it("watch compares below + above band with thresholds.outOfBandPct, as the plan sets it", () => {
    const inputs = { aircraft: [a(false, 0, 0)], withoutData: 0, outOfBandPct: 1.5 };
    expect(monthStatus(inputs, T).status).toBe("ok");
    expect(monthStatus(inputs, { ...T, outOfBandPct: 1 }).status).toBe("watch");
    expect(monthStatus({ ...inputs, outOfBandPct: 2.5 }, T).status).toBe("watch");
    // One out-of-band preflight in 225 (0.4 %) is no watch at the default 2 %.
    expect(monthStatus({ ...inputs, outOfBandPct: 100 / 225 }, T).status).toBe("ok");
  });

  it("no stay, no data, part no data and low confidence (the fewest years among the aircraft there)", () => {
    expect(monthStatus({ aircraft: [], withoutData: 0, outOfBandPct: null }, T).status).toBe("no-stay");
    expect(monthStatus({ aircraft: [], withoutData: 2, outOfBandPct: null }, T).status).toBe("no-data");
    const part = monthStatus(
      { aircraft: [a(false, 0, 0, 9), a(false, 0, 0, 3)], withoutData: 1, outOfBandPct: 0 },
      T,
    );
    expect(part).toMatchObject({ status: "ok", partNoData: true, years: 3, lowConfidence: true });
  });
});

describe("a base with covered and uncovered stays (docs/methods.md §4, §6)", () => {
  // Constructed climate, 2014–2015: January 2014 missing, and all of March in both years.
  const gaps = new Map([
    [
      "North Field",
      syntheticClimate(
        (ms) => {
          const d = new Date(ms);
          if (d.getUTCMonth() === 2) return Number.NaN;
          if (d.getUTCFullYear() === 2014 && d.getUTCMonth() === 0) return Number.NaN;
          return 5;
        },
        Date.UTC(2014, 0, 1),
        Date.UTC(2016, 0, 1),
      ),
    ],
  ]);
  const stays = [
    stay("A1", "2027-02-03", "2027-02-20"), // covered on 2014 and 2015
    stay("B1", "2027-01-06", "2027-01-25"), // covered on 2015 only (January 2014 missing)
    stay("C1", "2027-03-02", "2027-03-20"), // no year covers March
    stay("D1", "2027-02-20", "2027-03-10"), // 9 of 18 days present: 50 % on both years
  ];
  const r = runPlan(
    plan((t) => {
      t.climate.minYears = 2;
    }),
    stays,
    gaps,
  ).results;
  const b = r.bases[0]!;

  it("the covered stays keep their results; months with only uncovered stays read 'no data'", () => {
    expect(b.yearsUsed).toEqual([2014, 2015]);
    expect(r.stays.map((s) => s.yearsUsed)).toEqual([[2014, 2015], [2015], [], []]);
    // February: A1 (covered) and D1 (uncovered); A1 alone gives the month's figures.
    const feb = b.months[1]!;
    expect(feb.preflights).toBe(2 * 17); // A1's 17 days on 2 years
    expect(feb).toMatchObject({ status: "act", partNoData: true, statusAircraft: ["A1"], statusYears: 2 });
    expect(b.months[2]).toMatchObject({ status: "no-data", preflights: 0, partNoData: false });
    // January: B1 on its one covered year, fewer than minYears = 2.
    expect(b.months[0]).toMatchObject({ status: "act", lowConfidence: true, statusYears: 1 });
    expect(b.months[3]!.status).toBe("no-stay");
    expect(r.actions.map((a) => a.action)).toEqual(["fit", "fit", "no-data", "no-data"]);
  });

  it("uncovered stays list the months they lack and the files that would hold them", () => {
    expect(r.stays[2]!.noData).toEqual({
      months: [3],
      files: ["999999-99999-2014.gz", "999999-99999-2015.gz"],
    });
    expect(r.stays[3]!.noData!.months).toEqual([3]);
  });

  it("the skipped-year line shows each window and the share of its hours found", () => {
    const line = yearsSkippedText(r, b);
    // B1 on 2014: 6–24 January, none of its hours present.
    expect(line).toContain("2014: window 2014-01-06 to 2014-01-24, 0.0 % of hours present (B1)");
    // D1: 20 February – 9 March, 9 of 18 days present on each year: 50 %.
    expect(line).toContain("2015: window 2015-02-20 to 2015-03-09, 50.0 % of hours present (D1)");
    expect(line).toContain("no year covers C1 2027-03-02 to 2027-03-20: lacks Mar");
  });
});

describe("season of a need over the calendar (docs/methods.md §8)", () => {
  // Definitions: the season is the cycle of months outside the longest run without the need.
  it("reads a winter across the new year as one season", () => {
    expect(needSeason([1, 2, 3, 11, 12])).toEqual({ fitBy: 11, notNeededAfter: 3 });
    expect(needSeason([12, 1])).toEqual({ fitBy: 12, notNeededAfter: 1 });
    expect(needSeason([2])).toEqual({ fitBy: 2, notNeededAfter: 2 });
  });

  it("keeps a short break inside the season and takes the first of equal breaks", () => {
    expect(needSeason([1, 3, 11, 12])).toEqual({ fitBy: 11, notNeededAfter: 3 });
    expect(needSeason([1, 7])).toEqual({ fitBy: 7, notNeededAfter: 1 });
  });

  it("gives none without a month and the calendar year with all twelve", () => {
    expect(needSeason([])).toBeNull();
    expect(needSeason([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12])).toEqual({ fitBy: 1, notNeededAfter: 12 });
  });
});
