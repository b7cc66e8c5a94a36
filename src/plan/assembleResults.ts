/**
 * The results.json contract (`results.ts`) assembled from the bases' results: the plan's settings, the
 * profiles' precharge lines and reading bands at the standard sea-level atmosphere (101.325 kPa; each
 * base has its own at its atmosphere), the stays, assumptions,
 * methods, the random inputs drawn from the seed, and the warnings of the run.
 */
import { S_PER_MONTH, STANDARD_ATMOSPHERE_PA } from "../units/index.js";
import { TOOL_VERSION } from "../version.js";
import { assumptionsOf } from "./assumptions.js";
import { profileCurves } from "./bandCurves.js";
import type { AggregatedBase } from "./baseResult.js";
import { BOOTSTRAP_RESAMPLES } from "./bootstrap.js";
import type { StayFigures } from "./confidence.js";
import { METHODS } from "./methods.js";
import { EVENT_DRAWS } from "./nitrogenDemand.js";
import { nitrogenFleet } from "./nitrogenFleet.js";
import type { Plan } from "./planFile.js";
import type { AircraftAction, BaseResult, Results } from "./results.js";
import { gasLossDraws, type PreparedBase } from "./samples.js";
import type { Stay } from "./schedule.js";
import { QUANTILE_METHOD } from "./stats.js";
import { eventDraws } from "./supplyPlan.js";

const WEEKDAY_NAMES = ["Mon", "Tue", "Wed", "Thu", "Fri", "Sat", "Sun"];

/** The unscheduled full recharges drawn from the seed, in words: rate, draws, counts drawn against expected. */
function unscheduledText(plan: Plan, stays: Stay[], bases: BaseResult[]): string {
  const rate = plan.nitrogen.unscheduledRechargesPerAircraftMonth;
  const months = stays.reduce(
    (a, s) => a + (Date.parse(s.depart) - Date.parse(s.arrive)) / S_PER_MONTH / 1000,
    0,
  );
  const drawn = bases.reduce((a, b) => a + b.nitrogen.unscheduledRechargesMean, 0);
  return (
    `Poisson count per stay of mean ${rate} per aircraft-month × the stay's months (a month = 365.2425/12 days), ` +
    `each on a day drawn uniformly from the stay's days; ${EVENT_DRAWS} draws per climate year, each stay, climate year and draw ` +
    `with its own SplitMix32 stream keyed by base, aircraft, arrival date, climate year and draw; counts by inversion (Devroye 1986). ` +
    `Mean count drawn over the samples, all stays: ${drawn.toFixed(2)} (expected ${(rate * months).toFixed(2)} over ${months.toFixed(1)} aircraft-months).`
  );
}

/** What was drawn from the seed, said in words for the report's back matter. */
function randomInputs(
  plan: Plan,
  stays: Stay[],
  weekdays: number[],
  bases: BaseResult[],
): Results["randomInputs"] {
  const drawn = gasLossDraws(plan, stays)
    .map((d) => `${d.aircraft} / ${d.profile} × ${d.factor.toFixed(3)}`)
    .join("; ");
  const out = [
    {
      name: "gas-loss rate per aircraft",
      description:
        "Log-normal multiplier of the profile's nominal rate, median 1, standard deviation of its logarithm = the profile's gas-loss spread; drawn per aircraft from the seed (SplitMix32 stream keyed by the aircraft id, Box–Muller normal). Drawn multipliers: " +
        (drawn || "none"),
    },
  ];
  out.push({
    name: "bootstrap over climate years",
    description: `${BOOTSTRAP_RESAMPLES} resamples of the climate years, drawn with replacement for each 90 % interval from streams of their own (SplitMix32 keyed "bootstrap:" with the base, the stay group or "coldest"), so the other random inputs do not change; the interval is the 5 % and 95 % type-7 quantiles of the figure recomputed on each resample.`,
  });
  if (typeof plan.operations.weekdays === "number") {
    out.push({
      name: "weekdays flown",
      description: `${plan.operations.weekdays} of 7 weekdays drawn from the seed (Fisher–Yates shuffle): ${weekdays.map((d) => WEEKDAY_NAMES[d - 1]).join(", ")}`,
    });
  }
  if (plan.nitrogen.unscheduledRechargesPerAircraftMonth > 0) {
    out.push({ name: "unscheduled full recharges", description: unscheduledText(plan, stays, bases) });
  }
  return out;
}

/** Each stay's own figures and action, found through the base it belongs to. */
function perStay(stays: Stay[], samples: PreparedBase[], bases: AggregatedBase[]) {
  const found = new Map<Stay, { figures: StayFigures; action: AircraftAction }>();
  for (const [i, b] of samples.entries()) {
    for (const [si, s] of b.stays.entries()) {
      found.set(s, { figures: bases[i]!.stays[si]!, action: bases[i]!.actions[si]! });
    }
  }
  return stays.map((s) => found.get(s)!);
}

/** The whole results of a run. */
export function assembleResults(
  plan: Plan,
  stays: Stay[],
  weekdays: number[],
  samples: PreparedBase[],
  aggregated: AggregatedBase[],
  warnings: string[],
): Results {
  const bases = aggregated.map((a) => a.result);
  const own = perStay(stays, samples, aggregated);
  return {
    plan: plan.name,
    generatedBy: `coldsoak ${TOOL_VERSION}`,
    units: plan.units,
    seed: plan.seed,
    climateYears: [...new Set(bases.flatMap((b) => b.yearsUsed))].sort((a, b) => a - b),
    quantileMethod: QUANTILE_METHOD,
    thresholds: {
      shortPct: plan.thresholds.shortStartsPct,
      outOfBandPct: plan.thresholds.outOfBandPct,
      minYears: plan.climate.minYears,
    },
    profiles: plan.profiles.map((p) => profileCurves(p, STANDARD_ATMOSPHERE_PA, plan.units)),
    bases,
    nitrogenFleet: nitrogenFleet(bases, eventDraws(plan)),
    stays: stays.map((s, i) => ({
      aircraft: s.aircraft,
      base: s.base,
      arrive: s.arrive,
      depart: s.depart,
      profile: s.profile,
      coldStartOption: s.coldStartOption,
      ...own[i]!.figures,
    })),
    actions: own.map((o) => o.action),
    assumptions: assumptionsOf(plan, weekdays),
    methods: METHODS,
    randomInputs: randomInputs(plan, stays, weekdays, bases),
    warnings,
    whatIf: null,
  };
}
