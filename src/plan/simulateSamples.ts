/**
 * Simulating the samples: every group of identical stays of a base on every usable climate year, hour
 * by hour (`simulate.ts`), with one gas table and one set of profile contexts for the whole run, and
 * the run's counters for the benchmark and the progress bar.
 */
import { InputError, inputError } from "../errors.js";
import { tabulatedGas } from "../physics/gasTable.js";
import type { GasModel } from "../physics/nitrogen.js";
import { realGas } from "../physics/nitrogen.js";
import type { HangarAir } from "./air.js";
import { type BaseOutcomes, OutcomesBuilder } from "./baseOutcomes.js";
import { ProfileContexts } from "./context.js";
import type { HangarInput, Plan, PlanCore } from "./planFile.js";
import type { BaseSamples, PreparedBase } from "./samples.js";
import { type SimInputs, type SimOutcome, simulateStayYear } from "./simulate.js";
import { emptyOutcome } from "./stayRun.js";

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

/** What every simulation of one run shares (the nitrogen steps read a whole `Plan`, the screen a `PlanCore`). */
export interface Simulator<P extends PlanCore = Plan> {
  plan: P;
  /** The interpolation table of the reference nitrogen equation used in the hot loop. */
  model: GasModel;
  contexts: ProfileContexts;
  stats: RunStats;
  /** Stay-years to simulate in the whole run, for the progress callback. */
  total: number;
  onProgress: RunOptions["onProgress"];
}

export type { BaseOutcomes } from "./baseOutcomes.js";

export function simulator<P extends PlanCore>(
  plan: P,
  samples: PreparedBase[],
  opts: RunOptions,
): Simulator<P> {
  const model = tabulatedGas(realGas);
  return {
    plan,
    model,
    contexts: new ProfileContexts(model),
    stats: { accumulatorHours: 0, stayYearsSimulated: 0, simulationS: 0 },
    total: samples.reduce((n, b) => n + b.usable.flat().filter((u) => u).length, 0),
    onProgress: opts.onProgress,
  };
}

/** The air inside a plan's hangar, in SI, for the simulation. */
export function hangarAir(h: HangarInput): HangarAir {
  return h.kind === "heated"
    ? { kind: "heated", heatedToK: h.heatedTo }
    : { kind: "shelter", timeConstantS: h.timeConstant, offsetK: h.offset };
}

/** Inputs of the simulation of group `gi` of a base on its usable year `yi`. */
export function sampleInputs(sim: Simulator<PlanCore>, base: BaseSamples, gi: number, yi: number): SimInputs {
  const { plan } = sim;
  const g = base.groups[gi]!;
  const hangar = plan.bases[base.baseIndex]!.hangar;
  return {
    ctx: sim.contexts.get(plan.profiles[g.profileIndex]!, base.climate.atmPa, g.coldStartOption),
    series: base.climate.series,
    timeZone: base.climate.timeZone,
    days: base.days.get(yi, gi),
    gasLossFactor: g.gasLossFactor,
    hangar: hangar ? hangarAir(hangar) : null,
    prechargeCheckDays: plan.operations.prechargeCheckDays,
    policy: plan.operations.outOfBand,
    arrival: plan.operations.arrival,
  };
}

/**
 * A refusal of the physics during the simulation (a state the plan's own checks did not foresee, at the
 * base's atmosphere or weather), located at the profile it came from, with the stay and climate year.
 */
function locatedPhysicsError(
  sim: Simulator<PlanCore>,
  base: BaseSamples,
  gi: number,
  yi: number,
  err: unknown,
): unknown {
  const { plan } = sim;
  if (!(err instanceof InputError) || err.message.startsWith(`${plan.file}:`)) return err;
  const g = base.groups[gi]!;
  const stay = base.stays[g.stays[0]!]!;
  return inputError(
    plan.file,
    plan.lineOf(["profiles", g.profileIndex]),
    `profiles[${g.profileIndex}]`,
    `${err.message} (profile "${stay.profile}" for aircraft ${stay.aircraft} at base "${stay.base}" on climate year ${base.years[yi]}); expected a profile the accumulator physics can follow there`,
  );
}

/**
 * Simulates every group of a base on every year usable for its window, year by year (the days of one
 * year are held at a time); a window not usable on a year gets an empty outcome (no records).
 */
export function simulateBase(sim: Simulator<PlanCore>, base: BaseSamples): BaseOutcomes {
  const outcomes = new OutcomesBuilder(base.years.length, base.groups.length);
  for (let yi = 0; yi < base.years.length; yi++) {
    for (let gi = 0; gi < base.groups.length; gi++) {
      if (!base.usable[yi]![gi]) {
        outcomes.add(yi, gi, emptyOutcome());
        continue;
      }
      const t0 = performance.now();
      let o: SimOutcome;
      try {
        o = simulateStayYear(sampleInputs(sim, base, gi, yi));
      } catch (err) {
        throw locatedPhysicsError(sim, base, gi, yi, err);
      }
      sim.stats.simulationS += (performance.now() - t0) / 1000;
      outcomes.add(yi, gi, o);
      sim.stats.accumulatorHours += o.accumulatorHours;
      sim.stats.stayYearsSimulated++;
      sim.onProgress?.(sim.stats.stayYearsSimulated, sim.total);
    }
  }
  return outcomes.done();
}
