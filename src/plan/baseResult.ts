/**
 * One base's results from its simulated samples: the stations and years used, the statistics by
 * month and hour with their confidence, the statuses, advice and aircraft actions, the overnight
 * traces and the nitrogen logistics, in the `BaseResult` shape of the results.json contract, with the
 * figures of each of its stays for `results.json` `stays[]` and `actions[]`.
 */
import { stationCoverage } from "../climate/index.js";
import type { StationClimate } from "../climate/types.js";
import { PA_PER_KPA } from "../units/index.js";
import { profileCurves } from "./bandCurves.js";
import { baseDesignTemperatures } from "./climateDesign.js";
import { type BaseConfidence, baseConfidence, type StayFigures } from "./confidence.js";
import { baseDecisions, type DecisionThresholds } from "./decisions.js";
import { baseDesignPoint } from "./designPoint.js";
import { type BaseStatistics, baseStatistics } from "./monthStats.js";
import type { PlanCore } from "./planFile.js";
import type {
  AircraftAction,
  AtmosphereResult,
  BaseResult,
  ColdestReturnLevels,
  StationResult,
} from "./results.js";
import { type BaseSamples, withDays } from "./samples.js";
import type { BaseOutcomes, Simulator } from "./simulateSamples.js";
import { baseNitrogen } from "./supplyPlan.js";
import { overnightTraces } from "./traces.js";
import { trappedChargeMonths } from "./trappedStats.js";

/** A station's identity and coverage as results.json gives it. */
export function stationResult(s: StationClimate): StationResult {
  const c = stationCoverage(s);
  return { ...c, firstUtc: c.firstUtc ?? "", lastUtc: c.lastUtc ?? "" };
}

/**
 * The samples the nitrogen cascade replays: the stays some year covers, on the years that cover all of
 * them (one pool per year needs every stay's servicings of that year). The demo and any complete
 * record keep every stay and year.
 */
function nitrogenSamples(
  base: BaseSamples,
  outcomes: BaseOutcomes,
): { base: BaseSamples; outcomes: BaseOutcomes } {
  const covered = base.groupOfStay.map((gi) => base.gaps[gi] === null);
  if (covered.every((c) => c) && base.usable.every((row) => row.every((u) => u))) return { base, outcomes };
  const keepStay = base.stays.flatMap((_s, si) => (covered[si] ? [si] : []));
  const keepYear = base.years.flatMap((_y, yi) =>
    keepStay.every((si) => base.usable[yi]![base.groupOfStay[si]!]) ? [yi] : [],
  );
  const kept = {
    ...base,
    stays: keepStay.map((si) => base.stays[si]!),
    groupOfStay: keepStay.map((si) => base.groupOfStay[si]!),
    years: keepYear.map((yi) => base.years[yi]!),
    usable: keepYear.map((yi) => base.usable[yi]!),
  };
  return {
    base: withDays(kept),
    outcomes: outcomes.onYears(keepYear),
  };
}

/** The base's nitrogen over the samples that cover every covered stay; a warning when stays or years drop out. */
function nitrogenOf(sim: Simulator, base: BaseSamples, outcomes: BaseOutcomes, warnings: string[]) {
  const n = nitrogenSamples(base, outcomes);
  if (n.base !== base) {
    warnings.push(
      `base "${sim.plan.bases[base.baseIndex]!.name}": nitrogen from the ${n.base.years.length} climate year${n.base.years.length === 1 ? " that covers" : "s that cover"} every stay with data (${n.base.stays.length} of ${base.stays.length} stays)`,
    );
  }
  return baseNitrogen(sim, n.base, n.outcomes, warnings);
}

/** A base's results with the figures and actions of its stays, in the order of the base's stays. */
export interface AggregatedBase {
  result: BaseResult;
  stays: StayFigures[];
  actions: AircraftAction[];
}

/** The plan's thresholds that decide statuses and actions. */
export function decisionThresholds(plan: PlanCore): DecisionThresholds {
  return {
    shortStartsPct: plan.thresholds.shortStartsPct,
    outOfBandPct: plan.thresholds.outOfBandPct,
    minYears: plan.climate.minYears,
  };
}

/** The atmospheric pressure used at a base, its source and the primary station it comes from. */
export function atmosphereOf(base: BaseSamples): AtmosphereResult {
  const primary = base.climate.stations[0]?.meta;
  return {
    pressureKPaAbsolute: base.climate.atmPa / PA_PER_KPA,
    source: base.climate.atmSource,
    station: primary?.id ?? "",
    elevationM: primary?.elevationM ?? 0,
  };
}

/** The 1-in-10 and 1-in-30-year coldest mornings of a base with their intervals. */
export function returnLevels(statistics: BaseStatistics, conf: BaseConfidence): ColdestReturnLevels {
  return {
    coldest1in10C: statistics.coldest1in10C,
    coldest1in10CLo90: conf.coldest.coldest1in10CLo90,
    coldest1in10CHi90: conf.coldest.coldest1in10CHi90,
    coldest1in30C: statistics.coldest1in30C,
    coldest1in30CLo90: conf.coldest.coldest1in30CLo90,
    coldest1in30CHi90: conf.coldest.coldest1in30CHi90,
  };
}

/** Aggregates one base; warnings (starts without data, unreachable servicings) go to `warnings`. */
export function aggregateBase(
  sim: Simulator,
  base: BaseSamples,
  outcomes: BaseOutcomes,
  warnings: string[],
): AggregatedBase {
  const { plan } = sim;
  const statistics = baseStatistics(plan, base, outcomes, warnings);
  const conf = baseConfidence(
    plan,
    base,
    outcomes,
    statistics.coldestMorningByYear.map((c) => c.tempC),
  );
  const decided = baseDecisions(
    base.stays.map((s, si) => ({
      aircraft: s.aircraft,
      base: s.base,
      arrive: s.arrive,
      depart: s.depart,
      coldStartOption: s.coldStartOption,
      years: conf.stays[si]!.yearsUsed.length,
      noData: conf.stays[si]!.noData,
      months: conf.stays[si]!.months,
    })),
    statistics.months.map((m, i) => ({ ...m, ...conf.months[i]! })),
    decisionThresholds(plan),
  );
  // In this order: each may add warnings.
  const traces = overnightTraces(sim, base, outcomes);
  const nitrogen = nitrogenOf(sim, base, outcomes, warnings);
  const trappedCharge = trappedChargeMonths(plan, base, outcomes, warnings);
  const result: BaseResult = {
    name: plan.bases[base.baseIndex]!.name,
    stations: base.climate.stations.map(stationResult),
    timeZone: base.climate.timeZone,
    yearsUsed: base.years,
    yearsSkipped: base.skipped,
    climateMonths: statistics.climateMonths,
    dailyRangeHistogram: statistics.dailyRangeHistogram,
    months: statistics.months.map((m, i) => ({ ...m, ...conf.months[i]!, ...decided.months[i]! })),
    outOfBandByHour: statistics.outOfBandByHour,
    coldestMorningC: statistics.coldestMorningC,
    coldestMorningByYear: statistics.coldestMorningByYear,
    ...returnLevels(statistics, conf),
    advice: decided.advice,
    traces,
    nitrogen,
    trappedCharge,
    atmosphere: atmosphereOf(base),
    profileCurves: [...new Set(base.groups.map((g) => g.profileIndex))]
      .sort((a, b) => a - b)
      .map((i) => profileCurves(plan.profiles[i]!, base.climate.atmPa, plan.units)),
    designTemperatures: baseDesignTemperatures(plan, base, statistics.coldestMorningByYear),
    ...baseDesignPoint(plan, base, outcomes, statistics.coldest1in10C, trappedCharge),
    whatIf: null,
  };
  return { result, stays: conf.stays, actions: decided.actions };
}
