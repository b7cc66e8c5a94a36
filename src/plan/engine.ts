/**
 * The planning engine (product brief §5): every stay over every usable climate year, hour by hour,
 * then the statistics per base and local month, the cold-start advice, the overnight traces and the
 * nitrogen logistics, gathered into the `results.json` contract (`results.ts`).
 *
 * Every stay at a base maps onto the climate years with one reference year (the earliest arrival
 * year at the base): in each sample, stays that overlap in real time see the same weather and draw on
 * the same nitrogen pool. Stays that share base, profile, option, window (month-days and year offset
 * from the reference year and, when not every weekday is flown, weekdays) and gas-loss rate are
 * simulated once and counted once per stay. With a gas-loss spread
 * above zero each aircraft has its own rate, so only stays of one aircraft with equal windows share.
 */
import { DateTime } from "luxon";
import { stationCoverage } from "../climate/index.js";
import { localDays, MIN_HOURS_FOR_DAILY_RANGE } from "../climate/localTime.js";
import type { HourlySeries, StationClimate } from "../climate/types.js";
import { tabulatedGas } from "../physics/gasTable.js";
import { N2_MOLAR_MASS_KG_MOL, realGas } from "../physics/nitrogen.js";
import { ZERO_CELSIUS_K as K0, STANDARD_ATMOSPHERE_PA } from "../units/index.js";
import { TOOL_VERSION } from "../version.js";
import { assumptionsOf } from "./assumptions.js";
import { bandCurves } from "./bandCurves.js";
import { type CivilDate, isoWeekday, stayDays } from "./calendar.js";
import { absPa, type BandTable, type ProfileContext, profileContext } from "./context.js";
import { buildDays, type DayPlan, HOUR_MS } from "./days.js";
import type { DischargeGrid } from "./dischargeGrid.js";
import { METHODS } from "./methods.js";
import type { Plan } from "./planFile.js";
import { drawWeekdays, gasLossFactor } from "./random.js";
import type {
  AdviceRow,
  BaseResult,
  ClimateMonthRow,
  HourRow,
  MonthRow,
  NitrogenBase,
  NitrogenStay,
  Results,
  StationResult,
  Trace,
} from "./results.js";
import type { Stay } from "./schedule.js";
import { type DropRecord, type SimOutcome, simulateStayYear } from "./simulate.js";
import { gumbelMinimumReturnLevel, mean, pct, QUANTILE_METHOD, quantile, sortedCopy } from "./stats.js";
import { cascadeYear, type OrderedEvent } from "./supplyPlan.js";

/** Climate of one base: its stations (priority order), the merged series, zone and atmosphere. */
export interface BaseClimate {
  stations: StationClimate[];
  series: HourlySeries;
  timeZone: string;
  atmPa: number;
}

export interface RunOptions {
  /** Called after each simulated stay-year: done of total. */
  onProgress?: (done: number, total: number) => void;
}

/** Figures of a run for the benchmark and the terminal (not part of results.json). */
export interface RunStats {
  accumulatorHours: number;
  stayYearsSimulated: number;
  /** Seconds spent in the hour-by-hour loop (simulateStayYear) alone. */
  simulationS: number;
}

export const TRACE_HOURS = 36;
const RETURN_PERIOD_YEARS = 10;

/** The weekdays flown (ISO, Monday 1): the plan's list, or a count drawn from the seed. */
export function flownWeekdays(plan: Plan): number[] {
  const w = plan.operations.weekdays;
  return typeof w === "number" ? drawWeekdays(plan.seed, w) : [...w].sort((a, b) => a - b);
}

interface Group {
  key: string;
  stays: number[]; // indexes into the base's stays
  profileIndex: number;
  option: boolean;
  factor: number;
  realDays: CivilDate[];
}

/** Share of the grid hours of the days that have a value. */
function windowShare(series: HourlySeries, days: DayPlan[]): number {
  let total = 0;
  let present = 0;
  for (const d of days) {
    const first = Math.ceil((d.midnightUtcMs - series.startUtcMs) / HOUR_MS);
    const last = Math.ceil((d.nextMidnightUtcMs - series.startUtcMs) / HOUR_MS);
    total += last - first;
    for (let i = Math.max(0, first); i < Math.min(series.tempC.length, last); i++) {
      if (!Number.isNaN(series.tempC[i]!)) present++;
    }
  }
  return total === 0 ? 0 : present / total;
}

/** Calendar years (UTC) that hold at least one value of the series. */
function dataYears(series: HourlySeries): [number, number] | null {
  let first = -1;
  let last = -1;
  for (let i = 0; i < series.tempC.length; i++) {
    if (!Number.isNaN(series.tempC[i]!)) {
      if (first < 0) first = i;
      last = i;
    }
  }
  if (first < 0) return null;
  return [
    new Date(series.startUtcMs + first * HOUR_MS).getUTCFullYear(),
    new Date(series.startUtcMs + last * HOUR_MS).getUTCFullYear(),
  ];
}

function stationResult(s: StationClimate): StationResult {
  const c = stationCoverage(s);
  return { ...c, firstUtc: c.firstUtc ?? "", lastUtc: c.lastUtc ?? "" };
}

/**
 * Local-time climatology of the merged series in one pass (the climate module's rules, brief §4):
 * per local month the min, mean and max of the hourly values, and the daily ranges (local-day max −
 * min for days with at least 20 hours present), each range tagged with its local year and month.
 */
function localClimatology(series: HourlySeries, timeZone: string) {
  const { day, month } = localDays(series, timeZone);
  const lo = new Array<number>(13).fill(Number.POSITIVE_INFINITY);
  const hi = new Array<number>(13).fill(Number.NEGATIVE_INFINITY);
  const sum = new Array<number>(13).fill(0);
  const cnt = new Array<number>(13).fill(0);
  const ranges: { iso: string; month: number; rangeC: number }[] = [];
  const n = series.tempC.length;
  let i = 0;
  while (i < n) {
    const d = day[i]!;
    const m = month[i]!;
    let dlo = Number.POSITIVE_INFINITY;
    let dhi = Number.NEGATIVE_INFINITY;
    let count = 0;
    for (; i < n && day[i] === d; i++) {
      const v = series.tempC[i]!;
      if (Number.isNaN(v)) continue;
      count++;
      if (v < dlo) dlo = v;
      if (v > dhi) dhi = v;
      if (v < lo[m]!) lo[m] = v;
      if (v > hi[m]!) hi[m] = v;
      sum[m]! += v;
      cnt[m]!++;
    }
    if (count >= MIN_HOURS_FOR_DAILY_RANGE) {
      ranges.push({ iso: new Date(d * 86_400_000).toISOString().slice(0, 10), month: m, rangeC: dhi - dlo });
    }
  }
  return { lo, hi, sum, cnt, ranges };
}

/** Runs the whole plan on loaded climate data. Pure: the same inputs give the same Results. */
export function runPlan(
  plan: Plan,
  stays: Stay[],
  climate: Map<string, BaseClimate>,
  opts: RunOptions = {},
): { results: Results; stats: RunStats } {
  const model = tabulatedGas(realGas);
  const weekdays = flownWeekdays(plan);
  const weekdaySet = new Set(weekdays);
  const allFlown = weekdays.length === 7;
  const warnings: string[] = [];
  const stats: RunStats = { accumulatorHours: 0, stayYearsSimulated: 0, simulationS: 0 };
  const bandCache = new Map<string, BandTable>();
  const gridCache = new Map<string, DischargeGrid>();
  const factorOf = new Map<string, number>();
  for (const s of stays) {
    const profile = plan.profiles.find((p) => p.name === s.profile)!;
    if (!factorOf.has(`${s.aircraft}|${s.profile}`)) {
      factorOf.set(
        `${s.aircraft}|${s.profile}`,
        gasLossFactor(plan.seed, s.aircraft, profile.gasLoss.spread),
      );
    }
  }

  // Prepare every base: usable years and the groups of identical stays.
  const prepared: PreparedBase[] = [];
  let totalSims = 0;
  plan.bases.forEach((base, bi) => {
    const clim = climate.get(base.name);
    if (clim === undefined) throw new Error(`no climate for base ${base.name}`);
    const here = stays.filter((s) => s.base === base.name);
    // One reference year per base: real year refYear + k maps onto climate year y + k for every stay,
    // so stays that overlap in real time share the weather of each sample (and the nitrogen pool).
    const refYear = Math.min(...here.map((s) => Number(s.arrive.slice(0, 4))));
    const groups: Group[] = [];
    const groupOf: number[] = [];
    const byKey = new Map<string, number>();
    here.forEach((s, si) => {
      const realDays = stayDays(s.arrive, s.depart);
      const factor = factorOf.get(`${s.aircraft}|${s.profile}`)!;
      const pattern = realDays
        .map((d) => `${d.year - refYear}-${d.month}-${d.day}${allFlown ? "" : `:${isoWeekday(d)}`}`)
        .join(",");
      const key = `${s.profile}|${s.coldStartOption}|${factor}|${pattern}`;
      let gi = byKey.get(key);
      if (gi === undefined) {
        gi = groups.length;
        byKey.set(key, gi);
        groups.push({
          key,
          stays: [],
          profileIndex: plan.profiles.findIndex((p) => p.name === s.profile),
          option: s.coldStartOption,
          factor,
          realDays,
        });
      }
      groups[gi]!.stays.push(si);
      groupOf.push(gi);
    });
    const span = Math.max(0, ...groups.map((g) => g.realDays[g.realDays.length - 1]!.year - refYear));
    const range = plan.climate.years
      ? [plan.climate.years.from, plan.climate.years.to]
      : dataYears(clim.series);
    const years: number[] = [];
    const skipped: { year: number; completenessPct: number }[] = [];
    const daysOf = new Map<string, DayPlan[]>();
    if (range !== null && groups.length > 0) {
      for (let y = range[0]!; y + span <= range[1]!; y++) {
        let worst = 1;
        for (let gi = 0; gi < groups.length; gi++) {
          const days = buildDays(
            groups[gi]!.realDays,
            y,
            {
              timeZone: clim.timeZone,
              startMinutes: plan.operations.startTimes,
              flownWeekdays: weekdaySet,
              hangar: base.hangar ? { inMin: base.hangar.in, outMin: base.hangar.out } : null,
            },
            refYear,
          );
          daysOf.set(`${gi}|${y}`, days);
          worst = Math.min(worst, windowShare(clim.series, days));
        }
        if (worst >= plan.climate.minYearShare && worst > 0) years.push(y);
        else {
          skipped.push({ year: y, completenessPct: 100 * worst });
          for (let gi = 0; gi < groups.length; gi++) daysOf.delete(`${gi}|${y}`);
        }
      }
    }
    if (groups.length > 0 && years.length < plan.climate.minYears) {
      warnings.push(
        `base "${base.name}": ${years.length} usable climate year${years.length === 1 ? "" : "s"} (${years.join(", ") || "none"}), fewer than climate.minYears = ${plan.climate.minYears}`,
      );
    }
    if (skipped.length > 0) {
      warnings.push(
        `base "${base.name}": climate years skipped (under ${Math.round(plan.climate.minYearShare * 100)} % of the stay hours present): ${skipped.map((s) => `${s.year} (${s.completenessPct.toFixed(1)} %)`).join(", ")}`,
      );
    }
    totalSims += groups.length * years.length;
    prepared.push({ bi, clim, stays: here, groups, groupOf, years, skipped, daysOf });
  });

  // Simulate every group on every usable year.
  let done = 0;
  const contexts = new Map<string, ProfileContext>();
  const ctxFor = (pi: number, option: boolean, atmPa: number): ProfileContext => {
    const k = `${pi}|${option}|${atmPa}`;
    let c = contexts.get(k);
    if (c === undefined) {
      c = profileContext(plan.profiles[pi]!, model, atmPa, option, bandCache, { gridCache });
      contexts.set(k, c);
    }
    return c;
  };
  const bases: BaseResult[] = prepared.map((p) => {
    const base = plan.bases[p.bi]!;
    const hangarTempK = base.hangar ? base.hangar.temperature : null;
    const outcomes = new Map<string, SimOutcome>(); // `${group}|${year}`
    const simInputs = (gi: number, y: number) => {
      const g = p.groups[gi]!;
      return {
        ctx: ctxFor(g.profileIndex, g.option, p.clim.atmPa),
        series: p.clim.series,
        timeZone: p.clim.timeZone,
        days: p.daysOf.get(`${gi}|${y}`)!,
        gasLossFactor: g.factor,
        hangarTempK,
        prechargeCheckDays: plan.operations.prechargeCheckDays,
        policy: plan.operations.outOfBand,
      };
    };
    for (let gi = 0; gi < p.groups.length; gi++) {
      for (const y of p.years) {
        const inputs = simInputs(gi, y);
        const t0 = performance.now();
        const o = simulateStayYear(inputs);
        stats.simulationS += (performance.now() - t0) / 1000;
        outcomes.set(`${gi}|${y}`, o);
        stats.accumulatorHours += o.accumulatorHours;
        stats.stayYearsSimulated++;
        opts.onProgress?.(++done, totalSims);
      }
    }
    return aggregateBase(plan, p, outcomes, simInputs, model, warnings);
  });

  const stdAtm = STANDARD_ATMOSPHERE_PA;
  const bandTemps: number[] = [];
  for (let c = -50; c <= 60; c += 2) bandTemps.push(c + K0);
  const climateYears = [...new Set(bases.flatMap((b) => b.yearsUsed))].sort((a, b) => a - b);
  const randomInputs = [
    {
      name: "gas-loss rate per aircraft",
      description:
        "Log-normal multiplier of the profile's nominal rate, median 1, standard deviation of its logarithm = the profile's gas-loss spread; drawn per aircraft from the seed (SplitMix32 stream keyed by the aircraft id, Box–Muller normal). Drawn multipliers: " +
        ([...factorOf.entries()].map(([k, f]) => `${k.replace("|", " / ")} × ${f.toFixed(3)}`).join("; ") ||
          "none"),
    },
  ];
  if (typeof plan.operations.weekdays === "number") {
    randomInputs.push({
      name: "weekdays flown",
      description: `${plan.operations.weekdays} of 7 weekdays drawn from the seed (Fisher–Yates shuffle): ${weekdays.map((d) => ["Mon", "Tue", "Wed", "Thu", "Fri", "Sat", "Sun"][d - 1]).join(", ")}`,
    });
  }
  const results: Results = {
    plan: plan.name,
    generatedBy: `coldsoak ${TOOL_VERSION}`,
    units: plan.units,
    seed: plan.seed,
    climateYears,
    quantileMethod: QUANTILE_METHOD,
    thresholds: { shortPct: plan.thresholds.shortStartsPct },
    profiles: plan.profiles.map((pr) => {
      const rows = bandCurves(pr, bandTemps, stdAtm);
      return {
        name: pr.name,
        prechargeLine: rows.map((r) => ({
          tempC: r.tempC,
          prechargeKPaGauge: r.prechargeKPaGauge,
          prechargeLowKPaGauge: r.prechargeLowKPaGauge,
          prechargeHighKPaGauge: r.prechargeHighKPaGauge,
          idealPrechargeKPaGauge: r.idealPrechargeKPaGauge,
        })),
        band: rows.map((r) => ({
          tempC: r.tempC,
          readingLowPct: r.readingLowPct,
          readingNominalPct: r.readingNominalPct,
          readingHighPct: r.readingHighPct,
          idealReadingNominalPct: r.idealReadingNominalPct,
        })),
      };
    }),
    bases,
    stays: stays.map((s) => ({
      aircraft: s.aircraft,
      base: s.base,
      arrive: s.arrive,
      depart: s.depart,
      profile: s.profile,
      coldStartOption: s.coldStartOption,
    })),
    assumptions: assumptionsOf(plan, weekdays),
    methods: METHODS,
    randomInputs,
    warnings,
  };
  return { results, stats };
}

interface PreparedBase {
  bi: number;
  clim: BaseClimate;
  stays: Stay[];
  groups: Group[];
  groupOf: number[];
  years: number[];
  skipped: { year: number; completenessPct: number }[];
  daysOf: Map<string, DayPlan[]>;
}

function aggregateBase(
  plan: Plan,
  p: PreparedBase,
  outcomes: Map<string, SimOutcome>,
  simInputs: (gi: number, y: number) => Parameters<typeof simulateStayYear>[0],
  model: ReturnType<typeof tabulatedGas>,
  warnings: string[],
): BaseResult {
  const base = plan.bases[p.bi]!;
  const tz = p.clim.timeZone;
  const m = Array.from({ length: 13 }, () => ({
    preflights: 0,
    below: 0,
    above: 0,
    kPa: [] as number[],
    reading: [] as number[],
    starts: 0,
    shortOne: 0,
    shortTwo: 0,
    marginOne: [] as number[],
    marginTwo: [] as number[],
    dropT: [] as number[],
    dropK: [] as number[],
    dropR: [] as number[],
  }));
  const hourN = new Array<number>(24).fill(0);
  const hourOut = new Array<number>(24).fill(0);
  const coldestByYear = new Map<number, number>();
  const dropRefs: { gi: number; y: number; d: DropRecord }[] = [];
  let noAmbient = 0;
  p.stays.forEach((_s, si) => {
    const gi = p.groupOf[si]!;
    for (const y of p.years) {
      const o = outcomes.get(`${gi}|${y}`)!;
      noAmbient += o.startsWithoutAmbient;
      for (const r of o.preflights) {
        const a = m[r.month]!;
        a.preflights++;
        if (r.below) a.below++;
        if (r.above) a.above++;
        a.kPa.push(r.gasKPaGauge);
        a.reading.push(r.readingPct);
        const c = coldestByYear.get(y);
        if (c === undefined || r.ambientC < c) coldestByYear.set(y, r.ambientC);
      }
      for (const r of o.starts) {
        const a = m[r.month]!;
        a.starts++;
        if (r.energyOneJ < r.requiredJ) a.shortOne++;
        if (r.energyTwoJ < r.requiredJ) a.shortTwo++;
        a.marginOne.push((100 * (r.energyOneJ - r.requiredJ)) / r.requiredJ);
        a.marginTwo.push((100 * (r.energyTwoJ - r.requiredJ)) / r.requiredJ);
      }
      for (const d of o.drops) {
        const a = m[d.month]!;
        a.dropT.push(d.tempC);
        a.dropK.push(d.kPa);
        a.dropR.push(d.readingPct);
        if (p.groups[gi]!.stays[0] === si) dropRefs.push({ gi, y, d });
      }
      for (let i = 0; i < 12 * 24; i++) {
        hourN[i % 24]! += o.hourlyReadings[i]!;
        hourOut[i % 24]! += o.hourlyOutOfBand[i]!;
      }
    }
  });
  if (noAmbient > 0) {
    warnings.push(
      `base "${base.name}": ${noAmbient} starts fell in hours without temperature data and are not counted`,
    );
  }

  // Daily range by local month over the local days the stays' windows cover on the years used (each
  // climate day once), so it describes the same days as the preflights; monthly climate over all data.
  const windowDays = new Set<string>();
  for (const days of p.daysOf.values()) for (const d of days) windowDays.add(d.climateIso);
  const clim = localClimatology(p.clim.series, tz);
  const rangeByMonth = Array.from({ length: 13 }, () => [] as number[]);
  const rangeByMonthAll = Array.from({ length: 13 }, () => [] as number[]);
  const allRanges: number[] = [];
  for (const r of clim.ranges) {
    rangeByMonthAll[r.month]!.push(r.rangeC);
    if (!windowDays.has(r.iso)) continue;
    rangeByMonth[r.month]!.push(r.rangeC);
    allRanges.push(r.rangeC);
  }
  const climateMonths: ClimateMonthRow[] = [];
  for (let month = 1; month <= 12; month++) {
    const has = clim.cnt[month]! > 0;
    climateMonths.push({
      month,
      minC: has ? clim.lo[month]! : null,
      meanC: has ? clim.sum[month]! / clim.cnt[month]! : null,
      maxC: has ? clim.hi[month]! : null,
      meanDailyRangeC: mean(rangeByMonthAll[month]!),
      p90DailyRangeC: quantile(rangeByMonthAll[month]!, 0.9),
    });
  }
  const histogram: { lowC: number; highC: number; days: number }[] = [];
  if (allRanges.length > 0) {
    const top = Math.max(...allRanges);
    for (let lo = 0; lo <= top; lo += 2) {
      histogram.push({
        lowC: lo,
        highC: lo + 2,
        days: allRanges.filter((r) => r >= lo && r < lo + 2).length,
      });
    }
  }

  const months: MonthRow[] = [];
  const advice: AdviceRow[] = [];
  for (let month = 1; month <= 12; month++) {
    const a = m[month]!;
    const has = a.preflights > 0;
    const q = (v: number[], pq: number) => (v.length > 0 ? quantile(v, pq) : null);
    const shortPctOne = pct(a.shortOne, a.starts);
    const shortPctTwo = pct(a.shortTwo, a.starts);
    months.push({
      month,
      preflights: a.preflights,
      belowBandPct: has ? pct(a.below, a.preflights) : null,
      aboveBandPct: has ? pct(a.above, a.preflights) : null,
      shortPctOne,
      shortPctTwo,
      morningKPaGaugeP10: q(a.kPa, 0.1),
      morningKPaGaugeP50: q(a.kPa, 0.5),
      morningKPaGaugeP90: q(a.kPa, 0.9),
      morningReadingPctP10: q(a.reading, 0.1),
      morningReadingPctP50: q(a.reading, 0.5),
      morningReadingPctP90: q(a.reading, 0.9),
      overnightDropTempMeanC: mean(a.dropT),
      overnightDropTempP90C: q(a.dropT, 0.9),
      overnightDropKPaMean: mean(a.dropK),
      overnightDropKPaP90: q(a.dropK, 0.9),
      overnightDropReadingMeanPct: mean(a.dropR),
      overnightDropReadingP90Pct: q(a.dropR, 0.9),
      dailyRangeMeanC: has ? mean(rangeByMonth[month]!) : null,
      dailyRangeP90C: has ? q(rangeByMonth[month]!, 0.9) : null,
      starts: a.starts,
      energyMarginOneP10Pct: q(a.marginOne, 0.1),
      energyMarginOneP50Pct: q(a.marginOne, 0.5),
      energyMarginTwoP10Pct: q(a.marginTwo, 0.1),
      energyMarginTwoP50Pct: q(a.marginTwo, 0.5),
    });
    if (a.starts > 0) {
      advice.push({
        month,
        fitColdStartOption: shortPctOne! > plan.thresholds.shortStartsPct,
        shortPctOne,
        shortPctTwo,
        improvementPct: shortPctOne! - shortPctTwo!,
      });
    }
  }
  const outOfBandByHour: HourRow[] = hourN.map((n, hour) => ({
    hour,
    preflights: n,
    outOfBandPct: pct(hourOut[hour]!, n),
  }));
  const coldestMorningByYear = [...coldestByYear.entries()]
    .sort((a, b) => a[0] - b[0])
    .map(([year, tempC]) => ({ year, tempC }));
  const minima = coldestMorningByYear.map((c) => c.tempC);

  // Overnight traces: the median and the largest drop in reading.
  const traceOf = (
    ref: { gi: number; y: number; d: DropRecord } | undefined,
    label: string,
  ): Trace | null => {
    if (ref === undefined) return null;
    const from = Math.ceil(ref.d.rechargeUtcMs / HOUR_MS) * HOUR_MS;
    const o = simulateStayYear({
      ...simInputs(ref.gi, ref.y),
      trace: { fromUtcMs: from, hours: TRACE_HOURS },
    });
    const local = (ms: number) =>
      DateTime.fromMillis(ms, { zone: tz }).toISO({ suppressMilliseconds: true }) ?? "";
    return {
      label,
      year: ref.y,
      startLocal: local(from),
      points: o.trace.map((t) => ({
        hour: (t.utcMs - from) / HOUR_MS,
        localTime: local(t.utcMs),
        ambientC: t.ambientC,
        accumulatorC: t.accumulatorC,
        gasKPaGauge: t.gasKPaGauge,
        readingPct: t.readingPct,
        bandLowPct: t.bandLowPct,
        bandHighPct: t.bandHighPct,
      })),
    };
  };
  const sortedDrops = [...dropRefs].sort(
    (a, b) => a.d.readingPct - b.d.readingPct || a.y - b.y || a.gi - b.gi || a.d.day - b.d.day,
  );
  const traces = {
    typical: traceOf(
      sortedDrops[Math.floor((sortedDrops.length - 1) / 2)],
      "typical (median overnight drop in reading)",
    ),
    worst: traceOf(sortedDrops[sortedDrops.length - 1], "worst (largest overnight drop in reading)"),
  };

  return {
    name: base.name,
    stations: p.clim.stations.map(stationResult),
    timeZone: tz,
    yearsUsed: p.years,
    yearsSkipped: p.skipped,
    climateMonths,
    dailyRangeHistogram: histogram,
    months,
    outOfBandByHour,
    coldestMorningC: minima.length > 0 ? Math.min(...minima) : null,
    coldestMorningByYear,
    coldest1in10C: gumbelMinimumReturnLevel(minima, RETURN_PERIOD_YEARS),
    advice,
    traces,
    nitrogen: nitrogenOfBase(plan, p, outcomes, model, warnings),
  };
}

function nitrogenOfBase(
  plan: Plan,
  p: PreparedBase,
  outcomes: Map<string, SimOutcome>,
  model: ReturnType<typeof tabulatedGas>,
  warnings: string[],
): NitrogenBase {
  const n2 = plan.nitrogen;
  const spec = {
    cylinderWaterVolumeM3: n2.cylinder.waterVolume,
    fillAbsPa: absPa(n2.cylinder.fill.pressure, STANDARD_ATMOSPHERE_PA),
    fillTempK: n2.cylinder.fill.tempK,
    transferDifferentialPa: n2.transferDifferential,
    hoseVolumeM3: n2.hoseVolume,
  };
  const kg = (mol: number) => mol * N2_MOLAR_MASS_KG_MOL;
  const perStay = p.stays.map(() => ({
    kg: [] as number[],
    added: [] as number[],
    vented: [] as number[],
    servicings: [] as number[],
    checks: [] as number[],
    strokes: [] as number[],
  }));
  const baseKg: number[] = [];
  const baseAdded: number[] = [];
  const baseVented: number[] = [];
  const baseServicings: number[] = [];
  const baseCyl: number[] = [];
  let unreachable = 0;
  for (const y of p.years) {
    const events: OrderedEvent[] = [];
    p.stays.forEach((_s, si) => {
      const gi = p.groupOf[si]!;
      const o = outcomes.get(`${gi}|${y}`)!;
      const days = p.daysOf.get(`${gi}|${y}`)!;
      const v0M3 = plan.profiles[p.groups[gi]!.profileIndex]!.accumulator.gasVolumeEmpty;
      for (const e of o.nitrogen) {
        events.push({ realIso: days[e.day]!.realIso, utcMs: e.utcMs, stay: si, v0M3, event: e });
      }
    });
    const c = cascadeYear(model, spec, events);
    const cylinders = c.cylindersOpened;
    unreachable += c.unreachable;
    const added = c.addedMol;
    const hose = c.hoseMol;
    let total = 0;
    let totalAdded = 0;
    let totalVented = 0;
    let totalServicings = 0;
    p.stays.forEach((_s, si) => {
      const o = outcomes.get(`${p.groupOf[si]!}|${y}`)!;
      const a = added.get(si) ?? 0;
      const h = hose.get(si) ?? 0;
      const ps = perStay[si]!;
      ps.kg.push(kg(a + h));
      ps.added.push(kg(a));
      ps.vented.push(kg(o.ventedMol + h));
      ps.servicings.push(o.servicings);
      ps.checks.push(o.checks);
      ps.strokes.push(o.handPumpStrokes);
      total += kg(a + h);
      totalAdded += kg(a);
      totalVented += kg(o.ventedMol + h);
      totalServicings += o.servicings;
    });
    baseKg.push(total);
    baseAdded.push(totalAdded);
    baseVented.push(totalVented);
    baseServicings.push(totalServicings);
    baseCyl.push(cylinders);
  }
  if (unreachable > 0) {
    warnings.push(
      `base "${plan.bases[p.bi]!.name}": ${unreachable} servicings could not reach the precharge target from a full cylinder (fill pressure too low for the transfer differential)`,
    );
  }
  const q0 = (v: number[], pq: number) => quantile(v, pq) ?? 0;
  const stays: NitrogenStay[] = p.stays.map((s, si) => {
    const ps = perStay[si]!;
    return {
      aircraft: s.aircraft,
      arrive: s.arrive,
      depart: s.depart,
      profile: s.profile,
      coldStartOption: s.coldStartOption,
      servicingEventsP50: q0(ps.servicings, 0.5),
      kgAddedP50: q0(ps.added, 0.5),
      kgVentedP50: q0(ps.vented, 0.5),
      kgP50: q0(ps.kg, 0.5),
      kgP90: q0(ps.kg, 0.9),
      kgP95: q0(ps.kg, 0.95),
      prechargeChecksP50: q0(ps.checks, 0.5),
      handPumpStrokesP50: q0(ps.strokes, 0.5),
    };
  });
  const cylSorted = sortedCopy(baseCyl);
  const cylQ = (pq: number) => Math.ceil(quantile(cylSorted, pq) ?? 0);
  const carts = (cylinders: number) => Math.ceil(cylinders / plan.nitrogen.cylindersPerCart);
  return {
    kgP50: q0(baseKg, 0.5),
    kgP90: q0(baseKg, 0.9),
    kgP95: q0(baseKg, 0.95),
    kgAddedP50: q0(baseAdded, 0.5),
    kgVentedP50: q0(baseVented, 0.5),
    servicingEventsP50: q0(baseServicings, 0.5),
    cylindersP50: cylQ(0.5),
    cylindersP90: cylQ(0.9),
    cylindersP95: cylQ(0.95),
    cartsP50: carts(cylQ(0.5)),
    cartsP90: carts(cylQ(0.9)),
    cartsP95: carts(cylQ(0.95)),
    stays,
  };
}
