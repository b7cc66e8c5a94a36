/**
 * Statistics of the planning results (docs/methods.md §6), through simple-statistics.
 * One quantile method everywhere: linear interpolation between order statistics, type 7 of
 * Hyndman & Fan (1996), "Sample quantiles in statistical packages" (simple-statistics `quantileSorted`).
 */
import { quantileSorted, sampleStandardDeviation, mean as ssMean } from "simple-statistics";

export const QUANTILE_METHOD =
  "linear interpolation between order statistics (Hyndman & Fan 1996, type 7; simple-statistics quantileSorted)";

/** Sorts a copy ascending (numbers, not strings; as 64-bit floats, in native code). */
export function sortedCopy(values: ArrayLike<number>): Float64Array {
  return Float64Array.from(values).sort();
}

/** Quantile p (0–1) of the values, or null for an empty sample. */
export function quantile(values: ArrayLike<number>, p: number): number | null {
  if (values.length === 0) return null;
  return quantileOfSorted(sortedCopy(values), p);
}

/** Quantile p (0–1) of values already sorted ascending, by the same method, or null for an empty sample. */
export function quantileOfSorted(sorted: ArrayLike<number>, p: number): number | null {
  if (sorted.length === 0) return null;
  return quantileSorted(sorted as number[], p);
}

export function mean(values: ArrayLike<number>): number | null {
  return values.length === 0 ? null : ssMean(Array.from(values));
}

/** Share in percent, or null when there is nothing to count. */
export function pct(count: number, total: number): number | null {
  return total === 0 ? null : (100 * count) / total;
}

/** Euler–Mascheroni constant. */
const EULER_GAMMA = 0.5772156649015329;

/**
 * Return level of the annual MINIMUM exceeded downward once in `returnPeriodYears` on average, from a
 * Gumbel (type I extreme value) distribution of the negated minima fitted by the method of moments:
 * β = s·√6/π, μ = mean − γ·β on the negated sample (s the sample standard deviation, γ Euler's
 * constant), x_T = −(μ + β·y_T) with the reduced variate y_T = −ln(−ln(1 − 1/T)). Reference: Gumbel (1958), "Statistics of Extremes";
 * method of moments as in Chow, Maidment & Mays (1988), "Applied Hydrology", §12.2.
 * Needs at least two years; null otherwise.
 */
export function gumbelMinimumReturnLevel(annualMinima: number[], returnPeriodYears: number): number | null {
  if (annualMinima.length < 2) return null;
  const neg = annualMinima.map((x) => -x);
  const s = sampleStandardDeviation(neg);
  const beta = (s * Math.sqrt(6)) / Math.PI;
  const mu = ssMean(neg) - EULER_GAMMA * beta;
  const yT = -Math.log(-Math.log(1 - 1 / returnPeriodYears));
  return -(mu + beta * yT);
}
