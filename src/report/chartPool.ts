/**
 * Worker threads that render charts (`chartWorker.ts`), one per core, when the
 * compiled worker script is present (it is not when running from TypeScript sources, e.g. under the
 * test runner: the caller then renders in its own thread). Started once and kept; unreferenced while
 * idle, so they never keep the process alive. Specs wait in one queue; each worker takes the next when
 * it answers.
 */
import { existsSync } from "node:fs";
import { availableParallelism } from "node:os";
import { fileURLToPath } from "node:url";
import { Worker } from "node:worker_threads";
import type { Spec } from "./chartRender.js";

const WORKER_URL = new URL("./chartWorker.js", import.meta.url);

/** More chart workers than this do not pay for the memory each holds (vega and its caches). */
export const MAX_CHART_WORKERS = 4;

/**
 * One worker per core (at least one, at most MAX_CHART_WORKERS). While the plan simulates, the workers
 * load and warm up vega at a lower priority than the simulation (chartWorker.ts); once the report is
 * built the main thread only waits for its charts, so every core renders them. Measured on a 2-core
 * machine under load from other work, demo plan, paired runs against one worker: wall 0.85× (median of 5), no more
 * peak memory (each worker's heap is bounded below).
 */
export function chartWorkerCount(): number {
  return Math.max(1, Math.min(MAX_CHART_WORKERS, availableParallelism()));
}

export function chartWorkersAvailable(): boolean {
  return import.meta.url.endsWith(".js") && existsSync(fileURLToPath(WORKER_URL));
}

interface Job {
  id: number;
  spec: Spec;
  resolve: (svg: string) => void;
  reject: (err: Error) => void;
}

interface Slot {
  worker: Worker;
  job: Job | null;
}

let slots: Slot[] = [];
const queue: Job[] = [];
/** Job ids from 1; id 0 marks warm-up renderings, whose answers are dropped. */
let nextJob = 1;

/** Gives idle workers the next jobs; a worker is referenced (keeps the process alive) only while busy. */
function dispatch(): void {
  for (const slot of slots) {
    if (slot.job !== null) continue;
    const job = queue.shift();
    if (job === undefined) break;
    slot.job = job;
    slot.worker.ref();
    slot.worker.postMessage({ id: job.id, spec: job.spec });
  }
}

/**
 * Heap limits of a chart worker, MB: a chart's own data is small and vega's code and caches stay well
 * inside them, while V8's default limits let a worker's heap grow to about twice the memory it needs
 * before collecting. A worker that still runs out fails alone: its charts are drawn in the main thread
 * (chartBatch.ts).
 */
const CHART_WORKER_LIMITS = { maxYoungGenerationSizeMb: 8, maxOldGenerationSizeMb: 48 };

function spawn(): Slot {
  const slot: Slot = { worker: new Worker(WORKER_URL, { resourceLimits: CHART_WORKER_LIMITS }), job: null };
  slot.worker.on("message", (r: { id: number; svg?: string; error?: string }) => {
    const job = slot.job;
    if (job === null || job.id !== r.id) return;
    slot.job = null;
    slot.worker.unref();
    if (r.error !== undefined) job.reject(new Error(r.error));
    else job.resolve(r.svg!);
    dispatch();
  });
  slot.worker.on("error", (err) => {
    slots = slots.filter((s) => s !== slot); // a worker that failed is not used again
    slot.job?.reject(err);
    slot.job = null;
    if (slots.length === 0) for (const job of queue.splice(0)) job.reject(err);
    dispatch();
  });
  slot.worker.unref();
  return slot;
}

/**
 * Starts the chart workers (if not started yet), so that they load vega while the caller does other
 * work, and has each render `warmUp` (answers dropped) so that vega's code is compiled by the time the
 * real charts come. Does nothing where the compiled worker is absent.
 */
export function startChartWorkers(warmUp: Spec[] = []): void {
  if (!chartWorkersAvailable()) return;
  while (slots.length < chartWorkerCount()) {
    const slot = spawn();
    for (const spec of warmUp) slot.worker.postMessage({ id: 0, spec });
    slots.push(slot);
  }
}

/** The SVG markup of a spec, rendered on a chart worker (started if need be). */
export function renderOnWorker(spec: Spec): Promise<string> {
  startChartWorkers();
  return new Promise((resolve, reject) => {
    if (slots.length === 0) {
      reject(new Error("no chart worker could be started"));
      return;
    }
    queue.push({ id: nextJob++, spec, resolve, reject });
    dispatch();
  });
}
