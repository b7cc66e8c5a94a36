/**
 * Confidence over climate years (docs/methods.md §6): the nonparametric bootstrap of Efron (1979),
 * resampling whole climate years with replacement, and the spread of a figure across years.
 *
 * Each figure is recomputed on every resample exactly as the report computes it from all years (a
 * pooled share is the events of the resampled years over their counts, a year drawn twice counting
 * twice), and its 90 % interval is the 5 % and 95 % quantiles of the resampled values, type 7 of
 * Hyndman & Fan (1996) — the percentile interval of Efron & Tibshirani (1993), ch. 13. The resamples
 * come from their own seeded stream (`random.ts` `stream`, label "bootstrap:…"), so the plan's other
 * random inputs never change.
 *
 * References: Efron, B. (1979), "Bootstrap methods: another look at the jackknife", Annals of
 * Statistics 7(1):1–26; Efron, B. & Tibshirani, R. J. (1993), "An Introduction to the Bootstrap",
 * Chapman & Hall; Hyndman, R. J. & Fan, Y. (1996), The American Statistician 50(4):361–365.
 */
import { stream } from "./random.js";
import { quantile } from "./stats.js";

/** Resamples of climate years drawn for every interval. */
export const BOOTSTRAP_RESAMPLES = 2000;

/** Probabilities of the 90 % percentile interval. */
const LOWER = 0.05;
const UPPER = 0.95;

/** A 90 % interval, in the figure's own unit. */
export interface Interval {
  lo90: number;
  hi90: number;
}

/** Spread of a figure across climate years. */
export interface YearSpread {
  min: number;
  median: number;
  max: number;
}

/**
 * Indices of `count` bootstrap resamples of `years` climate years, each `years` draws with
 * replacement, from the stream `label` of `seed`.
 *
 * @param seed - the plan's seed
 * @param label - the stream's label, "bootstrap:…" (one stream per base or stay group)
 * @param years - number of climate years to resample (n)
 * @param count - number of resamples (B)
 * @returns B arrays of n year indices in 0…n−1 (none when n = 0)
 * @example
 * bootstrapResamples(42, "bootstrap:North", 3, 2)  // e.g. [Int32Array [2, 0, 2], Int32Array [1, 1, 0]]
 */
export function bootstrapResamples(
  seed: number,
  label: string,
  years: number,
  count = BOOTSTRAP_RESAMPLES,
): Int32Array[] {
  if (years === 0) return [];
  const u = stream(seed, label);
  return Array.from({ length: count }, () => {
    const idx = new Int32Array(years);
    for (let i = 0; i < years; i++) idx[i] = Math.min(years - 1, Math.floor(u() * years));
    return idx;
  });
}

/**
 * The 90 % percentile interval of values from the resamples: their 5 % and 95 % type-7 quantiles.
 *
 * @param values - the figure on each resample (resamples where it is undefined left out)
 * @returns the interval, or null without any value
 * @example
 * percentileInterval([1, 2, 3, 4, 5])  // { lo90: 1.2, hi90: 4.8 }
 */
export function percentileInterval(values: number[]): Interval | null {
  if (values.length === 0) return null;
  return { lo90: quantile(values, LOWER)!, hi90: quantile(values, UPPER)! };
}

/**
 * 90 % bootstrap interval of a pooled share, 100 · Σ events / Σ counts over the resampled years.
 * Resamples whose years count nothing are left out (the share is undefined there).
 *
 * @param events - events of each climate year (e.g. starts short of energy)
 * @param counts - what they are counted against in each year (e.g. starts)
 * @param resamples - year indices from `bootstrapResamples`
 * @returns the interval in %, or null when no resample counts anything
 * @example
 * pooledShareInterval([1, 1], [10, 10], bootstrapResamples(1, "bootstrap:x", 2))  // { lo90: 10, hi90: 10 }
 */
export function pooledShareInterval(
  events: ArrayLike<number>,
  counts: ArrayLike<number>,
  resamples: Int32Array[],
): Interval | null {
  const values: number[] = [];
  for (const idx of resamples) {
    let e = 0;
    let n = 0;
    for (const i of idx) {
      e += events[i]!;
      n += counts[i]!;
    }
    if (n > 0) values.push((100 * e) / n);
  }
  return percentileInterval(values);
}

/**
 * 90 % bootstrap interval of a statistic of per-year values (e.g. a return level of annual minima).
 *
 * @param values - one value per climate year
 * @param resamples - year indices from `bootstrapResamples` (over these values)
 * @param statistic - the statistic, null where undefined on a resample
 * @returns the interval in the values' unit, or null when the statistic is never defined
 * @example
 * statisticInterval([-30, -30, -30], bootstrapResamples(1, "bootstrap:x", 3), (s) => Math.min(...s))  // { lo90: -30, hi90: -30 }
 */
export function statisticInterval(
  values: number[],
  resamples: Int32Array[],
  statistic: (sample: number[]) => number | null,
): Interval | null {
  const out: number[] = [];
  for (const idx of resamples) {
    const v = statistic(Array.from(idx, (i) => values[i]!));
    if (v !== null) out.push(v);
  }
  return percentileInterval(out);
}

/**
 * Spread of a share across climate years: the share within each year that counts something, then
 * its minimum, type-7 median and maximum.
 *
 * @param events - events of each climate year
 * @param counts - what they are counted against in each year
 * @returns min / median / max in %, or null when no year counts anything
 * @example
 * yearSpread([1, 0, 3], [10, 10, 10])  // { min: 0, median: 10, max: 30 }
 */
export function yearSpread(events: ArrayLike<number>, counts: ArrayLike<number>): YearSpread | null {
  const shares: number[] = [];
  for (let i = 0; i < counts.length; i++) if (counts[i]! > 0) shares.push((100 * events[i]!) / counts[i]!);
  if (shares.length === 0) return null;
  return { min: Math.min(...shares), median: quantile(shares, 0.5)!, max: Math.max(...shares) };
}
