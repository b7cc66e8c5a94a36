/**
 * The bootstrap over climate years (docs/methods.md §6; Efron & Tibshirani 1993, ch. 6 and 13): the
 * percentile interval of a pooled share, checked against an interval computed here from the same
 * resample indices, against the exact bootstrap distribution enumerated over all 27 resamples of 3
 * years, and on constructed climates. Every count below is constructed.
 */
import { describe, expect, it } from "vitest";
import {
  BOOTSTRAP_RESAMPLES,
  bootstrapResamples,
  pooledShareInterval,
  statisticInterval,
  yearSpread,
} from "../../src/plan/bootstrap.js";
import { runPlan } from "../../src/plan/engine.js";
import { gumbelMinimumReturnLevel } from "../../src/plan/stats.js";
import { fixturePlan, syntheticClimate } from "./helpers.js";

/** Type-7 quantile written out (Hyndman & Fan 1996, definition 7: h = (n − 1)p, linear between order statistics). */
function type7(values: number[], p: number): number {
  const x = [...values].sort((a, b) => a - b);
  const h = (x.length - 1) * p;
  const lo = Math.floor(h);
  return x[lo]! + (h - lo) * ((x[Math.min(lo + 1, x.length - 1)] ?? x[lo]!) - x[lo]!);
}

describe("bootstrap resamples", () => {
  it("draws at least 1,000 resamples of n years, each index in 0…n−1, the same for the same seed and label", () => {
    // Resample count: common practice for percentile intervals (Efron & Tibshirani 1993, §13.3: 1,000 or more).
    expect(BOOTSTRAP_RESAMPLES).toBeGreaterThanOrEqual(1000);
    const a = bootstrapResamples(7, "bootstrap:North", 5);
    expect(a).toHaveLength(BOOTSTRAP_RESAMPLES);
    for (const idx of a) {
      expect(idx).toHaveLength(5);
      for (const i of idx) expect(i >= 0 && i < 5).toBe(true);
    }
    expect(bootstrapResamples(7, "bootstrap:North", 5)).toEqual(a);
    expect(bootstrapResamples(8, "bootstrap:North", 5)).not.toEqual(a);
    expect(bootstrapResamples(7, "bootstrap:South", 5)).not.toEqual(a);
    // With replacement and uniform: each year is drawn about 1/5 of the time (constructed; tolerance
    // 5 standard errors of a share of 10,000 draws, √(0.2·0.8/10000) = 0.004).
    const counts = new Array<number>(5).fill(0);
    for (const idx of a) for (const i of idx) counts[i]!++;
    for (const c of counts) expect(Math.abs(c / (5 * BOOTSTRAP_RESAMPLES) - 0.2)).toBeLessThan(0.02);
  });
});

describe("percentile interval of a pooled share", () => {
  it("collapses to the share when every year gives the same share", () => {
    // Constructed: 3 of 60 starts short in each of 6 years, 5 % every year.
    const events = [3, 3, 3, 3, 3, 3];
    const counts = [60, 60, 60, 60, 60, 60];
    const i = pooledShareInterval(events, counts, bootstrapResamples(1, "bootstrap:x", 6))!;
    expect(i.lo90).toBeCloseTo(5, 12);
    expect(i.hi90).toBeCloseTo(5, 12);
    expect(yearSpread(events, counts)).toEqual({ min: 5, median: 5, max: 5 });
  });

  it("equals the interval computed here from the same resample indices (same generator and seed)", () => {
    // Constructed yearly counts: events over starts, with unequal starts per year.
    const events = [0, 12, 3, 30, 7, 1, 0, 22];
    const counts = [90, 100, 80, 120, 95, 60, 70, 110];
    const resamples = bootstrapResamples(2027, "bootstrap:Korrash", events.length);
    const values = resamples.map((idx) => {
      let e = 0;
      let n = 0;
      for (const k of idx) {
        e += events[k]!;
        n += counts[k]!;
      }
      return (100 * e) / n;
    });
    const i = pooledShareInterval(events, counts, resamples)!;
    expect(i.lo90).toBeCloseTo(type7(values, 0.05), 12);
    expect(i.hi90).toBeCloseTo(type7(values, 0.95), 12);
    // The spread across years: min 0 %, max 30/120 = 25 %, median of the 8 shares (type 7).
    const shares = events.map((e, k) => (100 * e) / counts[k]!);
    expect(yearSpread(events, counts)).toEqual({ min: 0, median: type7(shares, 0.5), max: 25 });
  });

  it("agrees with the exact bootstrap over all 27 resamples of 3 years, within the Monte Carlo tolerance", () => {
    // Constructed: 3 years with 1, 4 and 10 short starts of 50, 40 and 50.
    const events = [1, 4, 10];
    const counts = [50, 40, 50];
    // Exact bootstrap distribution: the 3³ = 27 ordered resamples, each of probability 1/27.
    const exact: number[] = [];
    for (let a = 0; a < 3; a++)
      for (let b = 0; b < 3; b++)
        for (let c = 0; c < 3; c++)
          exact.push((100 * (events[a]! + events[b]! + events[c]!)) / (counts[a]! + counts[b]! + counts[c]!));
    exact.sort((x, y) => x - y);
    /** Quantile function of the exact distribution: the smallest value whose cumulative probability reaches p. */
    const exactQuantile = (p: number) => exact[Math.max(0, Math.ceil(p * 27) - 1)]!;
    // A Monte Carlo p-quantile of B draws lies, with overwhelming probability, between the exact
    // quantiles at p ± 4·√(p(1 − p)/B) (binomial standard error of the empirical CDF at the quantile;
    // 4 standard errors).
    const i = pooledShareInterval(events, counts, bootstrapResamples(11, "bootstrap:three", 3))!;
    const tol = (p: number) => 4 * Math.sqrt((p * (1 - p)) / BOOTSTRAP_RESAMPLES);
    expect(i.lo90).toBeGreaterThanOrEqual(exactQuantile(0.05 - tol(0.05)));
    expect(i.lo90).toBeLessThanOrEqual(exactQuantile(0.05 + tol(0.05)));
    expect(i.hi90).toBeGreaterThanOrEqual(exactQuantile(0.95 - tol(0.95)));
    expect(i.hi90).toBeLessThanOrEqual(exactQuantile(0.95 + tol(0.95)));
    // The constructed years make the exact 5 % and 95 % points distinct from the extremes, so the
    // check is not met trivially: the lowest resample (year 1 three times, 2 %) has probability 1/27.
    expect(exactQuantile(0.05)).toBeGreaterThan(exact[0]!);
  });

  it("leaves out resamples that count nothing and gives null when none counts anything", () => {
    // Constructed: the month has starts in one year of two.
    const r = bootstrapResamples(3, "bootstrap:y", 2);
    const i = pooledShareInterval([2, 0], [20, 0], r)!;
    expect(i).toEqual({ lo90: 10, hi90: 10 });
    expect(pooledShareInterval([0, 0], [0, 0], r)).toBeNull();
  });

  it("gives an interval of a return level that brackets nothing when the minima are all equal", () => {
    // Constructed: equal annual minima have zero spread, so the Gumbel fit returns that value
    // (β = 0, Chow, Maidment & Mays 1988, §12.2) on every resample.
    const minima = [-31, -31, -31, -31];
    const r = bootstrapResamples(5, "bootstrap:coldest", minima.length);
    expect(statisticInterval(minima, r, (s) => gumbelMinimumReturnLevel(s, 30))).toEqual({
      lo90: -31,
      hi90: -31,
    });
  });
});

describe("on the engine", () => {
  it("a climate where every year gives the same monthly share has a collapsed interval, byte-identical between runs", () => {
    // Constructed: −5 °C every hour of 2014–2016, so every climate year gives the same January.
    const plan = fixturePlan((t) => {
      t.climate.years = { from: 2014, to: 2016 };
      t.climate.minYears = 1;
      t.operations.weekdays = ["Mon", "Tue", "Wed", "Thu", "Fri", "Sat", "Sun"];
      t.profiles[0].gasLoss = { rate: "0 psi/month", spread: 0 };
      delete t.bases[0].hangar;
    });
    const climate = new Map([
      ["North Field", syntheticClimate(() => -5, Date.UTC(2014, 0, 1), Date.UTC(2017, 0, 1))],
    ]);
    const stays = [
      {
        aircraft: "A1",
        base: "North Field",
        arrive: "2027-01-04",
        depart: "2027-01-25",
        coldStartOption: false,
        profile: "standard",
        line: 2,
      },
    ];
    const run = () => runPlan(plan, stays, climate).results;
    const r = run();
    const jan = r.bases[0]!.months[0]!;
    expect(jan.preflights).toBe(3 * 21); // 3 years × 21 days, every day flown
    for (const name of [
      "shortPctOne",
      "shortPctTwo",
      "belowBandPct",
      "aboveBandPct",
      "outOfBandPct",
    ] as const) {
      expect(jan[`${name}Lo90`], name).toBeCloseTo(jan[name]!, 9);
      expect(jan[`${name}Hi90`], name).toBeCloseTo(jan[name]!, 9);
      expect(jan[`${name}YearMin`], name).toBeCloseTo(jan[name]!, 9);
      expect(jan[`${name}YearMax`], name).toBeCloseTo(jan[name]!, 9);
    }
    const stayJan = r.stays[0]!.months[0]!;
    expect(stayJan.shortPctOneLo90).toBeCloseTo(stayJan.shortPctOne!, 9);
    expect(JSON.stringify(run())).toBe(JSON.stringify(r));
    expect(r.randomInputs.map((x) => x.name)).toContain("bootstrap over climate years");
  });
});
