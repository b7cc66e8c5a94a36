/**
 * Confidence of a base's figures over its climate years (docs/methods.md §6): for each stay, the
 * climate years usable for its window, the years left out with the share found, what it lacks when no
 * year covers it, and its own figures by local month with 90 % intervals; for each base-month, the
 * spread across years and the 90 % interval of every share that drives a status; and the bootstrap
 * intervals of the 1-in-10 and 1-in-30-year coldest mornings. Every interval comes from the seeded
 * bootstrap of `bootstrap.ts`, one stream per base, per group of identical stays and for the coldest
 * mornings.
 */
import { bootstrapResamples, statisticInterval } from "./bootstrap.js";
import { RETURN_PERIODS_YEARS } from "./monthStats.js";
import type { PlanCore } from "./planFile.js";
import type { BaseResult, MonthConfidence, StayMonthRow, StayResult } from "./results.js";
import type { BaseSamples } from "./samples.js";
import type { BaseOutcomes } from "./simulateSamples.js";
import { gumbelMinimumReturnLevel } from "./stats.js";
import {
  type CountTable,
  confidence,
  groupCounts,
  pooledShare,
  resamplesFor,
  sumCounts,
} from "./yearCounts.js";

/** What a stay's entry of `results.json` `stays[]` gains. */
export type StayFigures = Pick<StayResult, "yearsUsed" | "yearsSkipped" | "noData" | "months">;

export type ColdestConfidence = Pick<
  BaseResult,
  "coldest1in10CLo90" | "coldest1in10CHi90" | "coldest1in30CLo90" | "coldest1in30CHi90"
>;

export interface BaseConfidence {
  /** By local month, index month − 1. */
  months: MonthConfidence[];
  /** Base-month counts by year (each stay once), the source of the intervals. */
  counts: CountTable;
  coldest: ColdestConfidence;
  /** In the order of the base's stays. */
  stays: StayFigures[];
}

const BASE_SHARES = ["shortPctOne", "shortPctTwo", "belowBandPct", "aboveBandPct", "outOfBandPct"] as const;
const STAY_SHARES = ["shortPctOne", "shortPctTwo", "outOfBandPct"] as const;

/** The local months of a stay in its own order, each with the real month (YYYY-MM) it first falls in. */
function stayMonths(base: BaseSamples, gi: number): { month: number; realMonth: string }[] {
  const seen = new Set<number>();
  const out: { month: number; realMonth: string }[] = [];
  for (const d of base.groups[gi]!.realDays) {
    if (seen.has(d.month)) continue;
    seen.add(d.month);
    out.push({ month: d.month, realMonth: `${d.year}-${String(d.month).padStart(2, "0")}` });
  }
  return out;
}

/** The figures of one group of identical stays on its own usable years. */
function groupFigures(plan: PlanCore, base: BaseSamples, counts: CountTable, gi: number): StayFigures {
  const usable = base.years.flatMap((_y, yi) => (base.usable[yi]![gi] ? [yi] : []));
  const table = usable.map((yi) => counts[yi]!);
  const first = base.stays[base.groups[gi]!.stays[0]!]!;
  const resamples = resamplesFor(plan.seed, `${first.base}:${first.aircraft}:${first.arrive}`, table);
  const months: StayMonthRow[] = stayMonths(base, gi).map(({ month, realMonth }) => ({
    month,
    realMonth,
    preflights: table.reduce((n, y) => n + y[month]!.preflights, 0),
    starts: table.reduce((n, y) => n + y[month]!.starts, 0),
    shortPctOne: pooledShare(table, month, "shortPctOne"),
    shortPctTwo: pooledShare(table, month, "shortPctTwo"),
    outOfBandPct: pooledShare(table, month, "outOfBandPct"),
    ...confidence(table, month, STAY_SHARES, resamples),
  }));
  return {
    yearsUsed: usable.map((yi) => base.years[yi]!),
    yearsSkipped: base.windowSkips[gi]!.map((s) => ({ ...s })),
    noData: base.gaps[gi] ? { ...base.gaps[gi] } : null,
    months,
  };
}

/** Bootstrap intervals of the Gumbel return levels of the annual minima (°C). */
function coldestConfidence(plan: PlanCore, baseName: string, minimaC: number[]): ColdestConfidence {
  const resamples = bootstrapResamples(plan.seed, `bootstrap:${baseName}:coldest`, minimaC.length);
  const at = (years: number) =>
    statisticInterval(minimaC, resamples, (s) => gumbelMinimumReturnLevel(s, years));
  const ten = at(RETURN_PERIODS_YEARS.oneIn10);
  const thirty = at(RETURN_PERIODS_YEARS.oneIn30);
  return {
    coldest1in10CLo90: ten?.lo90 ?? null,
    coldest1in10CHi90: ten?.hi90 ?? null,
    coldest1in30CLo90: thirty?.lo90 ?? null,
    coldest1in30CHi90: thirty?.hi90 ?? null,
  };
}

/** The confidence of one base's figures; `minimaC` are the coldest mornings of its years. */
export function baseConfidence(
  plan: PlanCore,
  base: BaseSamples,
  outcomes: BaseOutcomes,
  minimaC: number[],
): BaseConfidence {
  const name = plan.bases[base.baseIndex]!.name;
  const byGroup = base.groups.map((_g, gi) => groupCounts(outcomes, gi));
  const counts = sumCounts(
    base.groupOfStay.map((gi) => byGroup[gi]!),
    base.years.length,
  );
  const resamples = resamplesFor(plan.seed, name, counts);
  const months: MonthConfidence[] = [];
  for (let m = 1; m <= 12; m++) months.push(confidence(counts, m, BASE_SHARES, resamples));
  const groups = base.groups.map((_g, gi) => groupFigures(plan, base, byGroup[gi]!, gi));
  return {
    months,
    counts,
    coldest: coldestConfidence(plan, name, minimaC),
    stays: base.groupOfStay.map((gi) => groups[gi]!),
  };
}
