/**
 * Counts by climate year and local month (docs/methods.md §6): first preflights and those below and
 * above the band, starts and those short of energy with one and with two accumulators. Every share
 * that drives a status is events over counts of these; kept year by year, they give the share's
 * spread across years and its bootstrap interval (`bootstrap.ts`), for a base-month or a stay-month.
 */

import { ABOVE, BELOW, SHORT_ONE, SHORT_TWO } from "./baseOutcomes.js";
import { bootstrapResamples, pooledShareInterval, yearSpread } from "./bootstrap.js";
import type { Confidence } from "./results.js";
import type { BaseOutcomes } from "./simulateSamples.js";
import { pct } from "./stats.js";

/** What one climate year gives in one local month. */
export interface MonthCounts {
  preflights: number;
  below: number;
  above: number;
  starts: number;
  shortOne: number;
  shortTwo: number;
}

/** Counts by `[yearIndex][month]`, month 1–12 (index 0 unused). */
export type CountTable = MonthCounts[][];

/** A share that drives a status, by its results.json name. */
export type ShareName = "shortPctOne" | "shortPctTwo" | "belowBandPct" | "aboveBandPct" | "outOfBandPct";

/** Events and what they are counted against, of each share. */
const SHARES: Record<ShareName, { events: (c: MonthCounts) => number; counts: (c: MonthCounts) => number }> =
  {
    shortPctOne: { events: (c) => c.shortOne, counts: (c) => c.starts },
    shortPctTwo: { events: (c) => c.shortTwo, counts: (c) => c.starts },
    belowBandPct: { events: (c) => c.below, counts: (c) => c.preflights },
    aboveBandPct: { events: (c) => c.above, counts: (c) => c.preflights },
    outOfBandPct: { events: (c) => c.below + c.above, counts: (c) => c.preflights },
  };

function emptyCounts(): MonthCounts {
  return { preflights: 0, below: 0, above: 0, starts: 0, shortOne: 0, shortTwo: 0 };
}

function emptyYear(): MonthCounts[] {
  return Array.from({ length: 13 }, emptyCounts);
}

/** The counts of group `gi` on each of the base's years (an unusable year counts nothing). */
export function groupCounts(outcomes: BaseOutcomes, gi: number): CountTable {
  const { preflights: p, starts: s } = outcomes;
  return Array.from({ length: outcomes.years }, (_y, yi) => {
    const o = outcomes.slot(yi, gi);
    const year = emptyYear();
    for (let i = p.at[o]!; i < p.at[o + 1]!; i++) {
      const c = year[p.month[i]!]!;
      c.preflights++;
      if (p.flags[i]! & BELOW) c.below++;
      if (p.flags[i]! & ABOVE) c.above++;
    }
    for (let i = s.at[o]!; i < s.at[o + 1]!; i++) {
      const c = year[s.month[i]!]!;
      c.starts++;
      if (s.flags[i]! & SHORT_ONE) c.shortOne++;
      if (s.flags[i]! & SHORT_TWO) c.shortTwo++;
    }
    return year;
  });
}

/** Year by year and month by month, the sum of several tables over the same years. */
export function sumCounts(tables: CountTable[], years: number): CountTable {
  const out = Array.from({ length: years }, emptyYear);
  for (const t of tables) {
    for (let yi = 0; yi < years; yi++) {
      for (let m = 1; m <= 12; m++) {
        const a = out[yi]![m]!;
        const b = t[yi]![m]!;
        a.preflights += b.preflights;
        a.below += b.below;
        a.above += b.above;
        a.starts += b.starts;
        a.shortOne += b.shortOne;
        a.shortTwo += b.shortTwo;
      }
    }
  }
  return out;
}

/** Events and counts of a share in one month, year by year. */
function byYear(table: CountTable, month: number, name: ShareName): { events: number[]; counts: number[] } {
  const s = SHARES[name];
  return {
    events: table.map((y) => s.events(y[month]!)),
    counts: table.map((y) => s.counts(y[month]!)),
  };
}

/** A share pooled over all years of the table, %, or null when nothing is counted. */
export function pooledShare(table: CountTable, month: number, name: ShareName): number | null {
  const { events, counts } = byYear(table, month, name);
  return pct(
    events.reduce((a, b) => a + b, 0),
    counts.reduce((a, b) => a + b, 0),
  );
}

/** The resamples of a table's years for one bootstrap stream (`bootstrap.ts`). */
export function resamplesFor(seed: number, label: string, table: CountTable): Int32Array[] {
  return bootstrapResamples(seed, `bootstrap:${label}`, table.length);
}

/** Spread across years and 90 % bootstrap interval of the named shares in one month. */
export function confidence<N extends ShareName>(
  table: CountTable,
  month: number,
  names: readonly N[],
  resamples: Int32Array[],
): Confidence<N> {
  const out: Record<string, number | null> = {};
  for (const name of names) {
    const { events, counts } = byYear(table, month, name);
    const interval = pooledShareInterval(events, counts, resamples);
    const spread = yearSpread(events, counts);
    out[`${name}Lo90`] = interval?.lo90 ?? null;
    out[`${name}Hi90`] = interval?.hi90 ?? null;
    out[`${name}YearMin`] = spread?.min ?? null;
    out[`${name}YearMedian`] = spread?.median ?? null;
    out[`${name}YearMax`] = spread?.max ?? null;
  }
  return out as Confidence<N>;
}
