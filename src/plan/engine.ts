/**
 * The planning engine: every stay over every usable climate year, hour by hour, then the statistics
 * per base and local month, the cold-start advice, the overnight traces and the nitrogen logistics,
 * gathered into the `results.json` contract (`results.ts`); docs/methods.md, "Simulation".
 *
 * `runPlan` is a short sequence of steps, each in its own module:
 * 1. prepare the samples (`samples.ts`): weekdays flown, groups of identical stays, usable climate
 *    years and the days of each group on each of them;
 * 2. simulate all samples of a base (`simulateSamples.ts`, around `simulate.ts`);
 * 3. aggregate the base (`baseResult.ts`: `monthStats.ts`, `confidence.ts`, `decisions.ts`,
 *    `traces.ts`, `supplyPlan.ts`);
 * 4. assemble the results (`assembleResults.ts`).
 * A new capability is a new step module here, not growth of this file.
 */

import { assembleResults } from "./assembleResults.js";
import { aggregateBase } from "./baseResult.js";
import type { Plan } from "./planFile.js";
import type { Results } from "./results.js";
import { type BaseClimate, flownWeekdays, prepareSamples, withDays } from "./samples.js";
import type { Stay } from "./schedule.js";
import { type RunOptions, type RunStats, simulateBase, simulator } from "./simulateSamples.js";

export type { BaseClimate } from "./samples.js";
export type { RunOptions, RunStats } from "./simulateSamples.js";

/** Runs the whole plan on loaded climate data. Pure: the same inputs give the same Results. */
export function runPlan(
  plan: Plan,
  stays: Stay[],
  climate: Map<string, BaseClimate>,
  opts: RunOptions = {},
): { results: Results; stats: RunStats } {
  const warnings: string[] = [];
  const weekdays = flownWeekdays(plan);
  const samples = prepareSamples(plan, stays, climate, weekdays, warnings);
  const sim = simulator(plan, samples, opts);
  // Base by base, so that only one base's days and outcomes are held at a time.
  const bases = samples.map((prepared) => {
    const base = withDays(prepared);
    return aggregateBase(sim, base, simulateBase(sim, base), warnings);
  });
  const results = assembleResults(plan, stays, weekdays, samples, bases, warnings);
  return { results, stats: sim.stats };
}
