/**
 * One base's results from its simulated samples: the stations and years used, the statistics by
 * month and hour, the overnight traces and the nitrogen logistics, in the `BaseResult` shape of the
 * results.json contract.
 */
import { stationCoverage } from "../climate/index.js";
import type { StationClimate } from "../climate/types.js";
import { PA_PER_KPA } from "../units/index.js";
import { profileCurves } from "./bandCurves.js";
import { baseStatistics } from "./monthStats.js";
import type { AtmosphereResult, BaseResult, StationResult } from "./results.js";
import type { BaseSamples } from "./samples.js";
import type { BaseOutcomes, Simulator } from "./simulateSamples.js";
import { baseNitrogen } from "./supplyPlan.js";
import { overnightTraces } from "./traces.js";
import { trappedChargeMonths } from "./trappedStats.js";

function stationResult(s: StationClimate): StationResult {
  const c = stationCoverage(s);
  return { ...c, firstUtc: c.firstUtc ?? "", lastUtc: c.lastUtc ?? "" };
}

/** The atmospheric pressure used at a base, its source and the primary station it comes from. */
function atmosphereOf(base: BaseSamples): AtmosphereResult {
  const primary = base.climate.stations[0]?.meta;
  return {
    pressureKPaAbsolute: base.climate.atmPa / PA_PER_KPA,
    source: base.climate.atmSource,
    station: primary?.id ?? "",
    elevationM: primary?.elevationM ?? 0,
  };
}

/** Aggregates one base; warnings (starts without data, unreachable servicings) go to `warnings`. */
export function aggregateBase(
  sim: Simulator,
  base: BaseSamples,
  outcomes: BaseOutcomes,
  warnings: string[],
): BaseResult {
  const { plan } = sim;
  const statistics = baseStatistics(plan, base, outcomes, warnings);
  return {
    name: plan.bases[base.baseIndex]!.name,
    stations: base.climate.stations.map(stationResult),
    timeZone: base.climate.timeZone,
    yearsUsed: base.years,
    yearsSkipped: base.skipped,
    climateMonths: statistics.climateMonths,
    dailyRangeHistogram: statistics.dailyRangeHistogram,
    months: statistics.months,
    outOfBandByHour: statistics.outOfBandByHour,
    coldestMorningC: statistics.coldestMorningC,
    coldestMorningByYear: statistics.coldestMorningByYear,
    coldest1in10C: statistics.coldest1in10C,
    advice: statistics.advice,
    traces: overnightTraces(sim, base, outcomes),
    nitrogen: baseNitrogen(plan, sim.model, base, outcomes, warnings),
    trappedCharge: trappedChargeMonths(plan, base, outcomes, warnings),
    atmosphere: atmosphereOf(base),
    profileCurves: [...new Set(base.groups.map((g) => g.profileIndex))]
      .sort((a, b) => a - b)
      .map((i) => profileCurves(plan.profiles[i]!, base.climate.atmPa)),
  };
}
