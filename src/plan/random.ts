/**
 * The plan's random inputs, all drawn from its seed (docs/methods.md §5): the gas-loss rate of each
 * aircraft, when `operations.weekdays` is a count which weekdays are flown, and the unscheduled full
 * recharges of each stay (docs/methods.md §7). Each draw has its own stream keyed by a label (FNV-1a
 * hash of the label mixed with the seed), so adding an aircraft never changes another aircraft's draw.
 *
 * Generator: SplitMix32 (a 32-bit variant of Steele, Lea & Flood 2014, "Fast splittable pseudorandom
 * number generators"); normal deviates by the Box–Muller transform (Box & Muller 1958); Poisson counts
 * by inversion (Devroye 1986).
 */

import { S_PER_DAY, S_PER_MONTH } from "../units/index.js";

/** Days in the month of rates given per month (365.2425/12). */
const DAYS_PER_MONTH = S_PER_MONTH / S_PER_DAY;

/** FNV-1a 32-bit hash of a string. */
export function fnv1a(text: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) {
    h ^= text.charCodeAt(i);
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return h >>> 0;
}

/** A uniform generator on (0, 1) for one labelled stream. */
export function stream(seed: number, label: string): () => number {
  let state = (fnv1a(label) ^ Math.imul(seed >>> 0, 0x9e3779b9)) >>> 0;
  return () => {
    state = (state + 0x9e3779b9) >>> 0;
    let z = state;
    z = Math.imul(z ^ (z >>> 16), 0x85ebca6b) >>> 0;
    z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35) >>> 0;
    z = (z ^ (z >>> 16)) >>> 0;
    return (z + 0.5) / 4294967296;
  };
}

/** Standard normal deviate from a uniform stream (Box–Muller, cosine branch). */
export function normalDeviate(u: () => number): number {
  const u1 = u();
  const u2 = u();
  return Math.sqrt(-2 * Math.log(u1)) * Math.cos(2 * Math.PI * u2);
}

/**
 * Gas-loss multiplier of one aircraft: log-normal with median 1 and σ of ln = `spread`
 * (the rate is the profile's nominal times this factor). spread 0 gives exactly 1.
 */
export function gasLossFactor(seed: number, aircraft: string, spread: number): number {
  if (spread === 0) return 1;
  return Math.exp(spread * normalDeviate(stream(seed, `gas-loss:${aircraft}`)));
}

/** `count` distinct ISO weekdays (1 = Monday) drawn from the seed, ascending (Fisher–Yates shuffle). */
export function drawWeekdays(seed: number, count: number): number[] {
  const days = [1, 2, 3, 4, 5, 6, 7];
  const u = stream(seed, "weekdays");
  for (let i = days.length - 1; i > 0; i--) {
    const j = Math.floor(u() * (i + 1));
    [days[i], days[j]] = [days[j]!, days[i]!];
  }
  return days.slice(0, count).sort((a, b) => a - b);
}

/** Largest Poisson mean drawn in one piece: exp(−100) is far from underflow. */
const POISSON_CHUNK = 100;

/**
 * A Poisson count of mean `mean` from a uniform stream, by inversion: sequential search of the
 * cumulative distribution, P(k) = P(k − 1)·mean/k (Devroye 1986, Non-Uniform Random Variate Generation,
 * ch. X, inversion by sequential search). A mean above 100 is drawn as a sum of Poisson counts of at
 * most 100 each (a sum of independent Poisson counts is Poisson with the summed mean), so exp(−mean)
 * never underflows.
 *
 * @param u uniform stream on (0, 1)
 * @param mean expected count, ≥ 0
 * @returns a count ≥ 0
 *
 * References: Devroye, L. (1986), Non-Uniform Random Variate Generation, Springer, ch. X.
 *
 * @example
 * poissonCount(stream(1, "x"), 0.4); // 0 most often (probability e^−0.4 ≈ 0.67)
 */
export function poissonCount(u: () => number, mean: number): number {
  if (!(mean >= 0 && Number.isFinite(mean)))
    throw new RangeError(`Poisson mean ${mean} must be finite and ≥ 0`);
  let count = 0;
  for (let left = mean; left > 0; left -= POISSON_CHUNK) {
    const m = Math.min(left, POISSON_CHUNK);
    let k = 0;
    let p = Math.exp(-m);
    let cdf = p;
    const x = u();
    while (x > cdf && p > 0) {
      k++;
      p *= m / k;
      cdf += p;
    }
    count += k;
  }
  return count;
}

/**
 * The days of one stay's unscheduled full recharges in one sample (docs/methods.md §7): a Poisson count
 * of mean rate × the stay's length in months (a month = 365.2425/12 days), each on a day drawn
 * uniformly from the stay's days, from the stream labelled `unscheduled-recharges:<key>`. Ascending.
 *
 * @param seed the plan's seed
 * @param key what names the stay and the sample (base, aircraft, arrival, climate year, draw)
 * @param ratePerMonth full recharges per aircraft-month
 * @param days the stay's number of days
 * @returns day indexes 0…days − 1, ascending, repeated where two events fall on one day
 */
export function unscheduledRechargeDays(
  seed: number,
  key: string,
  ratePerMonth: number,
  days: number,
): number[] {
  if (ratePerMonth === 0 || days === 0) return [];
  const u = stream(seed, `unscheduled-recharges:${key}`);
  const n = poissonCount(u, (ratePerMonth * days) / DAYS_PER_MONTH);
  const out: number[] = [];
  for (let i = 0; i < n; i++) out.push(Math.min(days - 1, Math.floor(u() * days)));
  return out.sort((a, b) => a - b);
}
