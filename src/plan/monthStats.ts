/**
 * Statistics of one base, pooled over its climate years (docs/methods.md, "Statistics"): by local
 * month the preflight shares below and above band, the morning gauge pressure and reading, the starts
 * short of energy with one and with two accumulators and their energy margins, the overnight drops
 * and the daily range over the days the stays cover, and the month's worst hours of day out of band;
 * the out-of-band share by local hour of day; the coldest morning of each year and its 1-in-10 and
 * 1-in-30-year values (Gumbel, method of moments); the monthly climate of the whole record.
 */
import { localClimatology } from "../climate/index.js";
import { ABOVE, BELOW, marginPct, SHORT_ONE, SHORT_TWO } from "./baseOutcomes.js";
import { civilIso } from "./calendar.js";
import type { PlanCore } from "./planFile.js";
import type { BaseResult, HourRow, MonthStatistics } from "./results.js";
import { type BaseSamples, usableClimateDays } from "./samples.js";
import type { BaseOutcomes } from "./simulateSamples.js";
import { gumbelMinimumReturnLevel, mean, pct, quantileOfSorted, sortedCopy } from "./stats.js";

/** Return periods of the coldest-morning values, years. */
export const RETURN_PERIODS_YEARS = { oneIn10: 10, oneIn30: 30 } as const;
/** Hours of day named as a month's worst out of band. */
const WORST_HOURS = 3;
/** Width of a bin of the daily-range histogram, °C. */
const HISTOGRAM_BIN_C = 2;

/** What one local month of a base gathers over its stays and years (values in the order gathered). */
interface MonthTally {
  preflights: number;
  below: number;
  above: number;
  gasKPaGauge: Float64Array;
  readingPct: Float64Array;
  starts: number;
  shortOne: number;
  shortTwo: number;
  marginOnePct: Float64Array;
  marginTwoPct: Float64Array;
  drops: number;
  dropTempC: Float64Array;
  dropKPa: Float64Array;
  dropReadingPct: Float64Array;
}

interface BaseTally {
  /** Index 1–12: local month. */
  months: MonthTally[];
  /** Hourly what-if readings and those out of band, by local hour of day. */
  hourReadings: number[];
  hourOutOfBand: number[];
  /** The same by `[month−1][hour]`, flattened (index (month − 1)·24 + hour). */
  monthHourReadings: number[];
  monthHourOutOfBand: number[];
  /** Coldest preflight ambient of each usable year (index as the base's years), °C. */
  coldestC: (number | undefined)[];
  startsWithoutAmbient: number;
}

const NO_VALUES = new Float64Array(0);

function emptyMonth(): MonthTally {
  return {
    preflights: 0,
    below: 0,
    above: 0,
    gasKPaGauge: NO_VALUES,
    readingPct: NO_VALUES,
    starts: 0,
    shortOne: 0,
    shortTwo: 0,
    marginOnePct: NO_VALUES,
    marginTwoPct: NO_VALUES,
    drops: 0,
    dropTempC: NO_VALUES,
    dropKPa: NO_VALUES,
    dropReadingPct: NO_VALUES,
  };
}

/** Calls `visit` with the sample of every stay on every year, stay by stay in schedule order (each stay counts once). */
function eachStaySample(
  base: BaseSamples,
  outcomes: BaseOutcomes,
  visit: (sample: number, yi: number) => void,
): void {
  for (const gi of base.groupOfStay)
    for (let yi = 0; yi < base.years.length; yi++) visit(outcomes.slot(yi, gi), yi);
}

/** The counts of every month and hour, the coldest morning of each year: the first pass over the records. */
function countOutcomes(base: BaseSamples, outcomes: BaseOutcomes): BaseTally {
  const t: BaseTally = {
    months: Array.from({ length: 13 }, emptyMonth),
    hourReadings: new Array<number>(24).fill(0),
    hourOutOfBand: new Array<number>(24).fill(0),
    monthHourReadings: new Array<number>(12 * 24).fill(0),
    monthHourOutOfBand: new Array<number>(12 * 24).fill(0),
    coldestC: base.years.map(() => undefined),
    startsWithoutAmbient: 0,
  };
  const { preflights: p, starts: s, drops: d, hourly: h } = outcomes;
  eachStaySample(base, outcomes, (o, yi) => {
    t.startsWithoutAmbient += outcomes.startsWithoutAmbient(o);
    for (let i = p.at[o]!; i < p.at[o + 1]!; i++) {
      const a = t.months[p.month[i]!]!;
      a.preflights++;
      if (p.flags[i]! & BELOW) a.below++;
      if (p.flags[i]! & ABOVE) a.above++;
    }
    const coldest = outcomes.coldestAmbientC(o);
    const c = t.coldestC[yi];
    if (coldest < Number.POSITIVE_INFINITY && (c === undefined || coldest < c)) t.coldestC[yi] = coldest;
    for (let i = s.at[o]!; i < s.at[o + 1]!; i++) {
      const a = t.months[s.month[i]!]!;
      a.starts++;
      if (s.flags[i]! & SHORT_ONE) a.shortOne++;
      if (s.flags[i]! & SHORT_TWO) a.shortTwo++;
    }
    for (let i = d.at[o]!; i < d.at[o + 1]!; i++) t.months[d.month[i]!]!.drops++;
    for (let k = h.at[o]!; k < h.at[o + 1]!; k++) {
      const i = h.cell[k]!;
      t.hourReadings[i % 24]! += h.readings[k]!;
      t.hourOutOfBand[i % 24]! += h.outOfBand[k]!;
      t.monthHourReadings[i]! += h.readings[k]!;
      t.monthHourOutOfBand[i]! += h.outOfBand[k]!;
    }
  });
  return t;
}

/**
 * Every stay's records on every year, stay by stay in schedule order (each stay counts once): counted
 * first, then each month's values gathered into arrays of their exact length (a base's values are
 * the largest thing its statistics hold).
 */
function tallyOutcomes(base: BaseSamples, outcomes: BaseOutcomes): BaseTally {
  const t = countOutcomes(base, outcomes);
  for (const a of t.months) {
    a.gasKPaGauge = new Float64Array(a.preflights);
    a.readingPct = new Float64Array(a.preflights);
    a.marginOnePct = new Float64Array(a.starts);
    a.marginTwoPct = new Float64Array(a.starts);
    a.dropTempC = new Float64Array(a.drops);
    a.dropKPa = new Float64Array(a.drops);
    a.dropReadingPct = new Float64Array(a.drops);
  }
  const next = t.months.map(() => ({ preflight: 0, start: 0, drop: 0 }));
  const { preflights: p, starts: s, drops: d } = outcomes;
  eachStaySample(base, outcomes, (o) => {
    for (let i = p.at[o]!; i < p.at[o + 1]!; i++) {
      const m = p.month[i]!;
      const k = next[m]!.preflight++;
      t.months[m]!.gasKPaGauge[k] = p.gasKPaGauge[i]!;
      t.months[m]!.readingPct[k] = p.readingPct[i]!;
    }
    for (let i = s.at[o]!; i < s.at[o + 1]!; i++) {
      const m = s.month[i]!;
      const k = next[m]!.start++;
      t.months[m]!.marginOnePct[k] = marginPct(s.energyOneJ[i]!, s.requiredJ[i]!);
      t.months[m]!.marginTwoPct[k] = marginPct(s.energyTwoJ[i]!, s.requiredJ[i]!);
    }
    for (let i = d.at[o]!; i < d.at[o + 1]!; i++) {
      const m = d.month[i]!;
      const k = next[m]!.drop++;
      t.months[m]!.dropTempC[k] = d.tempC[i]!;
      t.months[m]!.dropKPa[k] = d.gasKPa[i]!;
      t.months[m]!.dropReadingPct[k] = d.readingPct[i]!;
    }
  });
  return t;
}

/** The values sorted in place (ascending, as numbers), for several quantiles of them. */
const sorted = (v: Float64Array) => v.sort();
const q = quantileOfSorted;

/**
 * The local hours of day of a month whose hourly what-if readings are most often out of band (worst
 * first, ties by hour, only hours with a share above zero), from `[month−1][hour]` counts.
 */
function worstHours(readings: number[], outOfBand: number[], month: number): number[] {
  const hours: { hour: number; share: number }[] = [];
  for (let h = 0; h < 24; h++) {
    const n = readings[(month - 1) * 24 + h]!;
    const k = outOfBand[(month - 1) * 24 + h]!;
    if (n > 0 && k > 0) hours.push({ hour: h, share: k / n });
  }
  return hours
    .sort((a, b) => b.share - a.share || a.hour - b.hour)
    .slice(0, WORST_HOURS)
    .map((h) => h.hour);
}

/** One month's row; the daily range only in months with preflights. */
function monthRow(month: number, a: MonthTally, dailyRangesC: number[], t: BaseTally): MonthStatistics {
  const has = a.preflights > 0;
  // Means first, in the order gathered: the quantiles below sort the month's values in place.
  const dropTempMean = mean(a.dropTempC);
  const dropKPaMean = mean(a.dropKPa);
  const dropReadingMean = mean(a.dropReadingPct);
  const gas = sorted(a.gasKPaGauge);
  const reading = sorted(a.readingPct);
  const dropTemp = sorted(a.dropTempC);
  const dropKPa = sorted(a.dropKPa);
  const dropReading = sorted(a.dropReadingPct);
  const marginOne = sorted(a.marginOnePct);
  const marginTwo = sorted(a.marginTwoPct);
  return {
    month,
    preflights: a.preflights,
    belowBandPct: has ? pct(a.below, a.preflights) : null,
    aboveBandPct: has ? pct(a.above, a.preflights) : null,
    outOfBandPct: has ? pct(a.below + a.above, a.preflights) : null,
    shortPctOne: pct(a.shortOne, a.starts),
    shortPctTwo: pct(a.shortTwo, a.starts),
    morningKPaGaugeP10: q(gas, 0.1),
    morningKPaGaugeP50: q(gas, 0.5),
    morningKPaGaugeP90: q(gas, 0.9),
    morningReadingPctP10: q(reading, 0.1),
    morningReadingPctP50: q(reading, 0.5),
    morningReadingPctP90: q(reading, 0.9),
    overnightDropTempMeanC: dropTempMean,
    overnightDropTempP90C: q(dropTemp, 0.9),
    overnightDropKPaMean: dropKPaMean,
    overnightDropKPaP90: q(dropKPa, 0.9),
    overnightDropReadingMeanPct: dropReadingMean,
    overnightDropReadingP90Pct: q(dropReading, 0.9),
    dailyRangeMeanC: has ? mean(dailyRangesC) : null,
    dailyRangeP90C: has ? q(sortedCopy(dailyRangesC), 0.9) : null,
    starts: a.starts,
    energyMarginOneP10Pct: q(marginOne, 0.1),
    energyMarginOneP50Pct: q(marginOne, 0.5),
    energyMarginTwoP10Pct: q(marginTwo, 0.1),
    energyMarginTwoP50Pct: q(marginTwo, 0.5),
    outOfBandWorstHours: worstHours(t.monthHourReadings, t.monthHourOutOfBand, month),
  };
}

/**
 * Daily ranges of the local days the stays' windows cover on the years used (each climate day once),
 * so they describe the same days as the preflights: by local month (index 1–12) and all together.
 */
function windowDailyRanges(
  base: BaseSamples,
  ranges: { localDate: string; month: number; rangeC: number }[],
): { byMonth: number[][]; all: number[] } {
  const windowDays = new Set<string>();
  for (let yi = 0; yi < base.years.length; yi++)
    for (const d of usableClimateDays(base, yi).values()) windowDays.add(civilIso(d.date));
  const byMonth = Array.from({ length: 13 }, () => [] as number[]);
  const all: number[] = [];
  for (const r of ranges) {
    if (!windowDays.has(r.localDate)) continue;
    byMonth[r.month]!.push(r.rangeC);
    all.push(r.rangeC);
  }
  return { byMonth, all };
}

function histogram(rangesC: number[]): BaseResult["dailyRangeHistogram"] {
  const out: BaseResult["dailyRangeHistogram"] = [];
  if (rangesC.length === 0) return out;
  const top = Math.max(...rangesC);
  for (let lo = 0; lo <= top; lo += HISTOGRAM_BIN_C) {
    const hi = lo + HISTOGRAM_BIN_C;
    out.push({ lowC: lo, highC: hi, days: rangesC.filter((r) => r >= lo && r < hi).length });
  }
  return out;
}

export type BaseStatistics = Pick<
  BaseResult,
  | "climateMonths"
  | "dailyRangeHistogram"
  | "outOfBandByHour"
  | "coldestMorningC"
  | "coldestMorningByYear"
  | "coldest1in10C"
  | "coldest1in30C"
> & { months: MonthStatistics[] };

/** The statistics of one base from its outcomes; a warning counts starts without temperature data. */
export function baseStatistics(
  plan: PlanCore,
  base: BaseSamples,
  outcomes: BaseOutcomes,
  warnings: string[],
): BaseStatistics {
  const t = tallyOutcomes(base, outcomes);
  if (t.startsWithoutAmbient > 0) {
    warnings.push(
      `base "${plan.bases[base.baseIndex]!.name}": ${t.startsWithoutAmbient} starts fell in hours without temperature data and are not counted`,
    );
  }
  const climatology = localClimatology(base.climate.series, base.climate.timeZone);
  const ranges = windowDailyRanges(base, climatology.dailyRanges);
  const months: MonthStatistics[] = [];
  for (let m = 1; m <= 12; m++) months.push(monthRow(m, t.months[m]!, ranges.byMonth[m]!, t));
  const outOfBandByHour: HourRow[] = t.hourReadings.map((n, hour) => ({
    hour,
    preflights: n,
    outOfBandPct: pct(t.hourOutOfBand[hour]!, n),
  }));
  const coldestMorningByYear = base.years.flatMap((year, yi) => {
    const tempC = t.coldestC[yi];
    return tempC === undefined ? [] : [{ year, tempC }];
  });
  const minima = coldestMorningByYear.map((c) => c.tempC);
  return {
    climateMonths: climatology.months,
    dailyRangeHistogram: histogram(ranges.all),
    months,
    outOfBandByHour,
    coldestMorningC: minima.length > 0 ? Math.min(...minima) : null,
    coldestMorningByYear,
    coldest1in10C: gumbelMinimumReturnLevel(minima, RETURN_PERIODS_YEARS.oneIn10),
    coldest1in30C: gumbelMinimumReturnLevel(minima, RETURN_PERIODS_YEARS.oneIn30),
  };
}

/** The coldest morning of one local month over a base's years and its 1-in-10-year value. */
export interface MonthColdest {
  month: number;
  /** Coldest preflight ambient of the month over every usable year, °C; null without preflights. */
  coldestMorningC: number | null;
  /** 1-in-10-year coldest morning of the month (Gumbel on each year's coldest morning of it), °C. */
  coldest1in10C: number | null;
}

/**
 * The coldest morning of each local month (1–12) and its 1-in-10-year value: each year's coldest
 * preflight ambient in that month, then their minimum and the same Gumbel return level as the year's
 * (`gumbelMinimumReturnLevel`, docs/methods.md §6). Every group's preflights count (they share the
 * weather of a year).
 */
export function monthlyColdestMornings(base: BaseSamples, outcomes: BaseOutcomes): MonthColdest[] {
  const byMonth = Array.from({ length: 13 }, () => [] as number[]);
  for (let yi = 0; yi < base.years.length; yi++) {
    const coldest = new Array<number>(13).fill(Number.POSITIVE_INFINITY);
    for (let gi = 0; gi < outcomes.groups; gi++)
      for (let m = 1; m <= 12; m++)
        coldest[m] = Math.min(coldest[m]!, outcomes.coldestAmbientInMonthC(outcomes.slot(yi, gi), m));
    for (let m = 1; m <= 12; m++) if (Number.isFinite(coldest[m]!)) byMonth[m]!.push(coldest[m]!);
  }
  return byMonth.slice(1).map((minima, i) => ({
    month: i + 1,
    coldestMorningC: minima.length > 0 ? Math.min(...minima) : null,
    coldest1in10C: gumbelMinimumReturnLevel(minima, RETURN_PERIODS_YEARS.oneIn10),
  }));
}
