/**
 * The hourly series on the UTC hour grid (docs/methods.md §4): for each hour the kept observation
 * nearest the top of the hour within ±30 min, routine reports before special ones; short gaps filled
 * linearly; stations merged by priority; values between grid hours interpolated.
 */
import { HOUR_MS, type HourlySeries } from "./types.js";

/** Observations farther than this from the top of the hour are not used for it (docs/methods.md §4). */
export const HOUR_WINDOW_MIN = 30;

export function emptySeries(): HourlySeries {
  return { startUtcMs: 0, tempC: new Float64Array(0), filled: new Uint8Array(0) };
}

/**
 * Builds the grid from kept observations sorted by time (UTC minutes, tenths of °C, 1 = special report).
 * Among the candidates of an hour a routine report beats a special one; then the nearer one wins;
 * then the earlier one (the input order).
 */
export function hourlyFromObservations(
  timeMin: Int32Array,
  tempTenths: Int16Array,
  special: Uint8Array,
): HourlySeries {
  const n = timeMin.length;
  if (n === 0) return emptySeries();
  // First hour the earliest observation serves, last hour the latest one serves.
  const firstHour = Math.floor((timeMin[0]! + 60 - HOUR_WINDOW_MIN - 1) / 60);
  const lastHour = Math.floor((timeMin[n - 1]! + HOUR_WINDOW_MIN) / 60);
  const hours = lastHour - firstHour + 1;
  const tempC = new Float64Array(hours).fill(Number.NaN);
  // Rank of the chosen candidate: class * 64 + distance in minutes (lower is better); 255 = none.
  const rank = new Uint8Array(hours).fill(255);
  for (let i = 0; i < n; i++) {
    const t = timeMin[i]!;
    const cls = special[i]! * 64;
    const h0 = Math.floor(t / 60);
    const past = t - h0 * 60; // minutes after h0
    if (past <= HOUR_WINDOW_MIN) consider(rank, tempC, h0 - firstHour, cls + past, tempTenths[i]!);
    if (60 - past <= HOUR_WINDOW_MIN)
      consider(rank, tempC, h0 + 1 - firstHour, cls + 60 - past, tempTenths[i]!);
  }
  return { startUtcMs: firstHour * HOUR_MS, tempC, filled: new Uint8Array(hours) };
}

/** Takes value v (tenths of °C) for grid hour h when its rank r beats the hour's candidate so far. */
function consider(rank: Uint8Array, tempC: Float64Array, h: number, r: number, v: number): void {
  if (h < 0 || h >= rank.length) return;
  if (r < rank[h]!) {
    rank[h] = r;
    tempC[h] = v / 10;
  }
}

/**
 * Fills runs of at most `gapHours` missing hours that have a value on both sides, linearly in time;
 * longer gaps stay missing. Returns a new series (the input is not changed).
 */
export function fillGaps(series: HourlySeries, gapHours: number): HourlySeries {
  const copy = { startUtcMs: series.startUtcMs, tempC: series.tempC.slice(), filled: series.filled.slice() };
  fillGapsInPlace(copy, gapHours);
  return copy;
}

/** fillGaps on the series itself (for a grid just built, that nothing else holds). */
export function fillGapsInPlace(series: HourlySeries, gapHours: number): void {
  const { tempC, filled } = series;
  let last = -1; // index of the last hour with a value
  for (let i = 0; i < tempC.length; i++) {
    if (Number.isNaN(tempC[i]!)) continue;
    const gap = i - last - 1;
    if (last >= 0 && gap > 0 && gap <= gapHours) {
      const a = tempC[last]!;
      const b = tempC[i]!;
      for (let k = last + 1; k < i; k++) {
        tempC[k] = a + ((b - a) * (k - last)) / (i - last);
        filled[k] = 1;
      }
    }
    last = i;
  }
}

/** Hours with a value (filled ones included). */
export function presentHours(series: HourlySeries): number {
  const t = series.tempC;
  let n = 0;
  for (let i = 0; i < t.length; i++) if (!Number.isNaN(t[i]!)) n++;
  return n;
}

export function filledHours(series: HourlySeries): number {
  const f = series.filled;
  let n = 0;
  for (let i = 0; i < f.length; i++) n += f[i]!;
  return n;
}

/**
 * The primary station's series (first) with each missing hour taken, hour by hour, from the first
 * lower-priority station that has it (docs/methods.md §4). The grid spans all stations; a value taken from
 * another station keeps that station's `filled` flag.
 */
export function mergeByPriority(stations: { series: HourlySeries }[]): HourlySeries {
  const withData = stations.map((s) => s.series).filter((s) => s.tempC.length > 0);
  if (withData.length === 0) return emptySeries();
  const start = Math.min(...withData.map((s) => s.startUtcMs));
  const end = Math.max(...withData.map((s) => s.startUtcMs + s.tempC.length * HOUR_MS));
  const hours = (end - start) / HOUR_MS;
  const tempC = new Float64Array(hours).fill(Number.NaN);
  const filled = new Uint8Array(hours);
  for (const s of withData) {
    const offset = (s.startUtcMs - start) / HOUR_MS;
    for (let i = 0; i < s.tempC.length; i++) {
      const h = offset + i;
      if (Number.isNaN(tempC[h]!) && !Number.isNaN(s.tempC[i]!)) {
        tempC[h] = s.tempC[i]!;
        filled[h] = s.filled[i]!;
      }
    }
  }
  return { startUtcMs: start, tempC, filled };
}

/** Value of the grid hour at `utcMs` (on the hour), NaN outside the grid or where missing. */
export function valueAtHour(series: HourlySeries, utcMs: number): number {
  const i = (utcMs - series.startUtcMs) / HOUR_MS;
  if (!Number.isInteger(i) || i < 0 || i >= series.tempC.length) return Number.NaN;
  return series.tempC[i]!;
}

/**
 * Temperature at any instant: linear between the two grid hours around it (docs/methods.md §4, for start times
 * between grid hours); NaN if either is missing or outside the grid.
 */
export function tempAtUtcMs(series: HourlySeries, utcMs: number): number {
  const x = (utcMs - series.startUtcMs) / HOUR_MS;
  const i = Math.floor(x);
  if (i < 0 || i >= series.tempC.length) return Number.NaN;
  const f = x - i;
  const a = series.tempC[i]!;
  if (f === 0) return a;
  if (i + 1 >= series.tempC.length) return Number.NaN;
  const b = series.tempC[i + 1]!;
  return a + (b - a) * f;
}

/**
 * Share of the hours of each calendar year (UTC) that have a value after gap filling, 0–1; the
 * denominator is the whole year (8760 or 8784 hours), so a file covering part of a year scores low.
 */
export function yearCompleteness(series: HourlySeries): Map<number, number> {
  const present = new Map<number, number>();
  const n = series.tempC.length;
  if (n === 0) return present;
  let i = 0;
  while (i < n) {
    const y = new Date(series.startUtcMs + i * HOUR_MS).getUTCFullYear();
    const yearEndHour = (Date.UTC(y + 1, 0, 1) - series.startUtcMs) / HOUR_MS;
    const stop = Math.min(n, yearEndHour);
    let count = 0;
    for (; i < stop; i++) if (!Number.isNaN(series.tempC[i]!)) count++;
    const yearHours = (Date.UTC(y + 1, 0, 1) - Date.UTC(y, 0, 1)) / HOUR_MS;
    present.set(y, count / yearHours);
  }
  return present;
}

/** Share of the grid hours in [fromUtcMs, toUtcMs) that have a value (hours outside the grid count as missing). */
export function windowCompleteness(series: HourlySeries, fromUtcMs: number, toUtcMs: number): number {
  const first = Math.ceil((fromUtcMs - series.startUtcMs) / HOUR_MS);
  const last = Math.ceil((toUtcMs - series.startUtcMs) / HOUR_MS); // exclusive
  const total = last - first;
  if (total <= 0) return 0;
  let count = 0;
  for (let i = Math.max(0, first); i < Math.min(series.tempC.length, last); i++)
    if (!Number.isNaN(series.tempC[i]!)) count++;
  return count / total;
}
