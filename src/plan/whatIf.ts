/**
 * What-if sensitivity (docs/methods.md, "What-if variants"): each variant of `whatIfVariants.ts` is the
 * plan simulated again over the same climate years, and judged on each base's worst month (the month
 * with the highest short share with one accumulator in the plan as it stands; the first on ties). Only
 * what that month needs is simulated: the groups of stays whose window reaches it, up to its last day
 * (the state of a day depends on the days before it only, so the month's records are those of the
 * whole run). The energy variants change no state: they are the baseline's starts against the scaled
 * requirement. Pure: the same inputs give the same figures, on a worker thread or not.
 */

import { ABOVE, BELOW } from "./baseOutcomes.js";
import type { ProfileContext } from "./context.js";
import { ProfileContexts } from "./context.js";
import type { Plan } from "./planFile.js";
import type { BaseResult, WhatIfBase, WhatIfShares, WhatIfVariantRow } from "./results.js";
import { type BaseClimate, type BaseSamples, flownWeekdays, prepareBase, withDays } from "./samples.js";
import type { Stay } from "./schedule.js";
import { type BaseOutcomes, simulateBase, simulator } from "./simulateSamples.js";
import { pct } from "./stats.js";
import { ENERGY_FACTORS, type VariantEdit, variantEdit, type WhatIfName } from "./whatIfVariants.js";

/** What one run gives for a month: preflights and those out of band, starts and those short. */
export interface MonthTally {
  preflights: number;
  outOfBand: number;
  starts: number;
  shortOne: number;
  shortTwo: number;
}

/** The month a base's variants are judged on: the highest short share with one; null without starts. */
export function worstMonth(base: BaseResult): number | null {
  let best: { month: number; pct: number } | null = null;
  for (const m of base.months) {
    if (m.shortPctOne === null) continue;
    if (best === null || m.shortPctOne > best.pct) best = { month: m.month, pct: m.shortPctOne };
  }
  return best?.month ?? null;
}

/** The samples cut after the last day of `month` in each group's window (no day there: nothing to run). */
export function untilEndOf(base: BaseSamples, month: number): BaseSamples {
  return { ...base, days: base.days.untilEndOf(month) };
}

/** The profile contexts with the gas amount serviced to (and arrived with) on a tolerance line. */
class ServicedTo extends ProfileContexts {
  private readonly edited = new Map<ProfileContext, ProfileContext>();

  constructor(
    private readonly inner: ProfileContexts,
    private readonly line: "low" | "high",
  ) {
    super(inner.model);
  }

  override get(...args: Parameters<ProfileContexts["get"]>): ProfileContext {
    const ctx = this.inner.get(...args);
    let e = this.edited.get(ctx);
    if (e === undefined) {
      // The simulation arrives with, and services to, `nominalMol` (simulate.ts).
      e = { ...ctx, nominalMol: this.line === "low" ? ctx.lowMol : ctx.highMol };
      this.edited.set(ctx, e);
    }
    return e;
  }
}

/** Every stay's records of `month` on every year, counted against the requirement × each factor. */
function tally(
  base: BaseSamples,
  outcomes: ReturnType<typeof simulateBase>,
  month: number,
  factors: number[],
) {
  const out: MonthTally[] = factors.map(() => ({
    preflights: 0,
    outOfBand: 0,
    starts: 0,
    shortOne: 0,
    shortTwo: 0,
  }));
  const { preflights: p, starts: s } = outcomes;
  for (const gi of base.groupOfStay) {
    for (let yi = 0; yi < base.years.length; yi++) {
      const o = outcomes.slot(yi, gi);
      for (let i = p.at[o]!; i < p.at[o + 1]!; i++) {
        if (p.month[i] !== month) continue;
        for (const t of out) {
          t.preflights++;
          if (p.flags[i]! & (BELOW | ABOVE)) t.outOfBand++;
        }
      }
      for (let i = s.at[o]!; i < s.at[o + 1]!; i++) {
        if (s.month[i] !== month) continue;
        const requiredJ = s.requiredJ[i]!;
        factors.forEach((f, k) => {
          const t = out[k]!;
          t.starts++;
          if (s.energyOneJ[i]! < requiredJ * f) t.shortOne++;
          if (s.energyTwoJ[i]! < requiredJ * f) t.shortTwo++;
        });
      }
    }
  }
  return out;
}

/** What a what-if run shares between its tasks: the plan, the stays, each base's climate. */
export interface WhatIfInputs {
  plan: Plan;
  stays: Stay[];
  /** Climate of each base, in the order of `plan.bases`. */
  climates: BaseClimate[];
}

/** One run: a base, its month, and a variant (null: the plan as it stands). */
export interface WhatIfTask {
  baseIndex: number;
  month: number;
  variant: WhatIfName | null;
}

/** Reused between the tasks of one thread: the contexts of the plan's own profiles. */
const shared = new WeakMap<Plan, ProfileContexts>();

/** One task simulated: the base's samples up to the end of the month and their outcomes, and the edit. */
export function simulateTask(
  inp: WhatIfInputs,
  task: WhatIfTask,
): { base: BaseSamples; outcomes: BaseOutcomes; edit: VariantEdit } {
  const edit = variantEdit(task.variant, inp.plan, inp.stays, task.baseIndex);
  const plan: Plan = { ...inp.plan, ...edit.plan };
  const base = untilEndOf(
    withDays(
      prepareBase(plan, edit.stays, inp.climates[task.baseIndex]!, task.baseIndex, flownWeekdays(plan), []),
    ),
    task.month,
  );
  const sim = simulator(plan, [base], {});
  if (edit.plan.profiles === inp.plan.profiles) {
    const contexts = shared.get(inp.plan) ?? sim.contexts;
    shared.set(inp.plan, contexts);
    sim.contexts = edit.servicedTo === "nominal" ? contexts : new ServicedTo(contexts, edit.servicedTo);
  }
  return { base, outcomes: simulateBase(sim, base), edit };
}

/**
 * The tallies of one task: for the baseline, at the requirement × 1 and × each energy variant's factor
 * (in the order of `ENERGY_FACTORS`); for a variant, at its own requirement.
 */
export function runTask(inp: WhatIfInputs, task: WhatIfTask): MonthTally[] {
  const { base, outcomes, edit } = simulateTask(inp, task);
  const factors = task.variant === null ? [1, ...Object.values(ENERGY_FACTORS)] : [edit.energyFactor];
  return tally(base, outcomes, task.month, factors);
}

/** Shares of a tally, % (null where nothing is counted). */
export function shares(t: MonthTally): WhatIfShares {
  return {
    shortPctOne: pct(t.shortOne, t.starts),
    shortPctTwo: pct(t.shortTwo, t.starts),
    outOfBandPct: pct(t.outOfBand, t.preflights),
  };
}

const diff = (a: number | null, b: number | null) => (a === null || b === null ? null : a - b);

/** A base's what-if figures from the tallies of its baseline and of each variant named. */
export function whatIfBase(
  month: number | null,
  baseline: MonthTally | null,
  variants: { name: WhatIfName; label: string; tally: MonthTally }[],
): WhatIfBase {
  const none = { shortPctOne: null, shortPctTwo: null, outOfBandPct: null, starts: 0, preflights: 0 };
  if (month === null || baseline === null) {
    return { month: null, reason: "no start at the base in any month", baseline: none, variants: [] };
  }
  const b = shares(baseline);
  return {
    month,
    reason: null,
    baseline: { ...b, starts: baseline.starts, preflights: baseline.preflights },
    variants: variants.map(({ name, label, tally: t }): WhatIfVariantRow => {
      const s = shares(t);
      return {
        name,
        label,
        ...s,
        shortPctOneChange: diff(s.shortPctOne, b.shortPctOne),
        shortPctTwoChange: diff(s.shortPctTwo, b.shortPctTwo),
        outOfBandPctChange: diff(s.outOfBandPct, b.outOfBandPct),
      };
    }),
  };
}

/** The variants that need a simulation of their own (the energy variants reuse the baseline's). */
export function simulatedVariants(names: readonly WhatIfName[]): WhatIfName[] {
  return names.filter((n) => !(n in ENERGY_FACTORS));
}
