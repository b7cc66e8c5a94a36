/**
 * Units of a screen run on worker threads, one unit at a time per worker (default: one worker per
 * core), each worker reading and screening its unit's stations; only the screened figures come back,
 * so memory holds a few stations' climate at a time however many stations there are. Where the compiled
 * worker script is absent (running from the TypeScript sources, as under the test runner), units run
 * one by one on this thread through the same code.
 */
import { existsSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { Worker } from "node:worker_threads";
import { InputError } from "../errors.js";
import { type ScreenJob, screenContext, screenFiles, type UnitResult } from "./screenUnit.js";

const WORKER_URL = new URL("./screenWorker.js", import.meta.url);

/** True when the compiled worker script exists next to this module. */
export function screenWorkersAvailable(): boolean {
  return import.meta.url.endsWith(".js") && existsSync(fileURLToPath(WORKER_URL));
}

type Reply = { id: number; result?: UnitResult; error?: { message: string; input: boolean } };

/** Posts one unit to a worker and waits for its answer (an InputError stays an InputError). */
function ask(w: Worker, id: number, files: string[]): Promise<UnitResult> {
  return new Promise((resolve, reject) => {
    const onExit = (code: number) => reject(new Error(`screen worker stopped (exit code ${code})`));
    w.once("error", reject);
    w.once("exit", onExit);
    w.once("message", (r: Reply) => {
      w.off("error", reject);
      w.off("exit", onExit);
      if (r.error) reject(r.error.input ? new InputError(r.error.message) : new Error(r.error.message));
      else resolve(r.result!);
    });
    w.postMessage({ kind: "unit", id, files });
  });
}

/**
 * Screens every unit (a list of files each) on up to `workers` threads; results come back in the order
 * of `units`. The first failing unit rejects the whole call.
 */
export async function screenUnits(
  job: ScreenJob,
  units: string[][],
  workers: number,
  onDone?: (done: number) => void,
): Promise<UnitResult[]> {
  const results: UnitResult[] = new Array(units.length);
  let next = 0;
  let done = 0;
  if (!screenWorkersAvailable()) {
    const ctx = screenContext(job);
    for (; next < units.length; next++) {
      results[next] = await screenFiles(ctx, units[next]!);
      onDone?.(++done);
    }
    return results;
  }
  const threads = Array.from(
    { length: Math.max(1, Math.min(workers, units.length)) },
    () => new Worker(WORKER_URL),
  );
  try {
    await Promise.all(
      threads.map(async (w) => {
        w.postMessage({ kind: "job", job });
        while (next < units.length) {
          const id = next++;
          results[id] = await ask(w, id, units[id]!);
          onDone?.(++done);
        }
      }),
    );
  } finally {
    await Promise.all(threads.map((w) => w.terminate()));
  }
  return results;
}
