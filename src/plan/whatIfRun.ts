/**
 * Runs the what-if variants of a plan (docs/methods.md, "What-if variants") on the climate already
 * loaded: one task per base and variant (plus the baseline of each base), spread over worker threads
 * when the compiled worker is present (it is not when running from the TypeScript sources, e.g. under
 * the test runner), else one after another here; when a worker fails, every task runs here again. The
 * figures are the same either way.
 */
import { existsSync } from "node:fs";
import { availableParallelism } from "node:os";
import { fileURLToPath } from "node:url";
import { Worker } from "node:worker_threads";
import type { Plan } from "./planFile.js";
import type { Results } from "./results.js";
import type { BaseClimate } from "./samples.js";
import type { Stay } from "./schedule.js";
import {
  type MonthTally,
  runTask,
  simulatedVariants,
  type WhatIfInputs,
  type WhatIfTask,
  whatIfBase,
  worstMonth,
} from "./whatIf.js";
import {
  ENERGY_FACTORS,
  VARIANT_DESCRIPTIONS,
  variantLabel,
  WHAT_IF_NAMES,
  type WhatIfName,
} from "./whatIfVariants.js";

const WORKER_URL = new URL("./whatIfWorker.js", import.meta.url);

/** More workers than this do not pay for the memory each holds (a copy of every base's climate). */
export const MAX_WHAT_IF_WORKERS = 4;

/** True when the compiled worker script exists beside this module. */
export function whatIfWorkersAvailable(): boolean {
  return import.meta.url.endsWith(".js") && existsSync(fileURLToPath(WORKER_URL));
}

/** The variants a run asks for: the plan's `whatIf:` list, else every variant when `--what-if` is given. */
export function whatIfNames(plan: Plan, option: boolean): WhatIfName[] {
  if (plan.whatIf !== undefined) return [...plan.whatIf];
  return option ? [...WHAT_IF_NAMES] : [];
}

/** The plan's data without its methods (lineOf, has, written), as a worker receives it. */
export type PlanData = Omit<Plan, "lineOf" | "has" | "written">;

export function planData(plan: Plan): PlanData {
  const { lineOf: _l, has: _h, written: _w, ...data } = plan;
  return data;
}

/** A plan again from its data (the file's lines are not needed to simulate). */
export function planFromData(data: PlanData): Plan {
  return { ...data, lineOf: () => 1, has: () => false, written: () => null };
}

export interface WhatIfOptions {
  /**
   * Worker threads (default: the machine's parallelism, at most MAX_WHAT_IF_WORKERS); 0 runs every
   * task on this thread.
   */
  threads?: number;
  onProgress?: (done: number, total: number) => void;
}

/** Runs the tasks on `threads` workers; results in the order of the tasks. */
async function runOnWorkers(
  inputs: WhatIfInputs,
  tasks: WhatIfTask[],
  threads: number,
  onDone: () => void,
): Promise<MonthTally[][]> {
  const out: MonthTally[][] = new Array(tasks.length);
  const workers = Array.from({ length: Math.min(threads, tasks.length) }, () => new Worker(WORKER_URL));
  let next = 0;
  try {
    const init = { plan: planData(inputs.plan), stays: inputs.stays, climates: inputs.climates };
    await Promise.all(
      workers.map(
        (w) =>
          new Promise<void>((resolve, reject) => {
            const send = () => {
              if (next >= tasks.length) return resolve();
              const id = next++;
              w.postMessage({ id, task: tasks[id] });
            };
            w.on("message", (r: { id: number; tallies?: MonthTally[]; error?: string }) => {
              if (r.error !== undefined) return reject(new Error(r.error));
              out[r.id] = r.tallies!;
              onDone();
              send();
            });
            w.on("error", reject);
            w.postMessage({ init });
            send();
          }),
      ),
    );
  } finally {
    await Promise.all(workers.map((w) => w.terminate()));
  }
  return out;
}

/**
 * The results with the what-if figures of every base (`bases[].whatIf`) and the variants run
 * (`whatIf`); the results are not otherwise changed.
 */
export async function withWhatIf(
  plan: Plan,
  stays: Stay[],
  climate: Map<string, BaseClimate>,
  results: Results,
  names: readonly WhatIfName[],
  opts: WhatIfOptions = {},
): Promise<Results> {
  if (names.length === 0) return results;
  const inputs: WhatIfInputs = { plan, stays, climates: plan.bases.map((b) => climate.get(b.name)!) };
  const months = results.bases.map(worstMonth);
  const simulated = simulatedVariants(names);
  const tasks: WhatIfTask[] = months.flatMap((month, baseIndex) =>
    month === null ? [] : [null, ...simulated].map((variant) => ({ baseIndex, month, variant })),
  );
  let done = 0;
  const onDone = () => opts.onProgress?.(++done, tasks.length);
  const threads =
    opts.threads ?? (whatIfWorkersAvailable() ? Math.min(MAX_WHAT_IF_WORKERS, availableParallelism()) : 0);
  const here = () => {
    done = 0;
    return tasks.map((t) => {
      const r = runTask(inputs, t);
      onDone();
      return r;
    });
  };
  const tallies =
    threads > 0 && whatIfWorkersAvailable()
      ? await runOnWorkers(inputs, tasks, threads, onDone).catch(here)
      : here();
  const energyNames = Object.keys(ENERGY_FACTORS) as WhatIfName[];
  const bases = results.bases.map((b, baseIndex) => {
    const mine = tasks.flatMap((t, i) => (t.baseIndex === baseIndex ? [{ t, tally: tallies[i]! }] : []));
    const baseline = mine.find((x) => x.t.variant === null)?.tally ?? null;
    const variants = names.map((name) => {
      const k = energyNames.indexOf(name);
      const tally = k >= 0 ? baseline?.[k + 1] : mine.find((x) => x.t.variant === name)?.tally[0];
      return { name, label: variantLabel(name, plan.bases[baseIndex]!), tally: tally! };
    });
    return { ...b, whatIf: whatIfBase(months[baseIndex]!, baseline?.[0] ?? null, baseline ? variants : []) };
  });
  const variants = VARIANT_DESCRIPTIONS.filter((v) => names.includes(v.name)).map((v) => ({ ...v }));
  return { ...results, bases, whatIf: { variants } };
}
