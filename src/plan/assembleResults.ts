/**
 * The results.json contract (`results.ts`) assembled from the bases' results: the plan's settings, the
 * profiles' precharge lines and reading bands at the standard sea-level atmosphere (101.325 kPa; each
 * base has its own at its atmosphere), the stays, assumptions,
 * methods, the random inputs drawn from the seed, and the warnings of the run.
 */
import { STANDARD_ATMOSPHERE_PA } from "../units/index.js";
import { TOOL_VERSION } from "../version.js";
import { assumptionsOf } from "./assumptions.js";
import { profileCurves } from "./bandCurves.js";
import { METHODS } from "./methods.js";
import type { Plan } from "./planFile.js";
import type { BaseResult, Results } from "./results.js";
import { gasLossDraws } from "./samples.js";
import type { Stay } from "./schedule.js";
import { QUANTILE_METHOD } from "./stats.js";

const WEEKDAY_NAMES = ["Mon", "Tue", "Wed", "Thu", "Fri", "Sat", "Sun"];

/** What was drawn from the seed, said in words for the report's back matter. */
function randomInputs(plan: Plan, stays: Stay[], weekdays: number[]): Results["randomInputs"] {
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
  if (typeof plan.operations.weekdays === "number") {
    out.push({
      name: "weekdays flown",
      description: `${plan.operations.weekdays} of 7 weekdays drawn from the seed (Fisher–Yates shuffle): ${weekdays.map((d) => WEEKDAY_NAMES[d - 1]).join(", ")}`,
    });
  }
  return out;
}

/** The whole results of a run. */
export function assembleResults(
  plan: Plan,
  stays: Stay[],
  weekdays: number[],
  bases: BaseResult[],
  warnings: string[],
): Results {
  return {
    plan: plan.name,
    generatedBy: `coldsoak ${TOOL_VERSION}`,
    units: plan.units,
    seed: plan.seed,
    climateYears: [...new Set(bases.flatMap((b) => b.yearsUsed))].sort((a, b) => a - b),
    quantileMethod: QUANTILE_METHOD,
    thresholds: { shortPct: plan.thresholds.shortStartsPct },
    profiles: plan.profiles.map((p) => profileCurves(p, STANDARD_ATMOSPHERE_PA)),
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
    randomInputs: randomInputs(plan, stays, weekdays),
    warnings,
  };
}
