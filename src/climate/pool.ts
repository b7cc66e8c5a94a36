/**
 * Reads many climate files on worker threads (one per core, at most `threads`), when the compiled worker
 * script is present (it is not when running from TypeScript sources, e.g. under the test runner).
 */
import { existsSync } from "node:fs";
import { availableParallelism } from "node:os";
import { fileURLToPath } from "node:url";
import { Worker } from "node:worker_threads";
import { InputError } from "../errors.js";
import type { ParsedFile } from "./records.js";
import type { ReadOptions } from "./source.js";

const WORKER_URL = new URL("./worker.js", import.meta.url);

export function workersAvailable(): boolean {
  return import.meta.url.endsWith(".js") && existsSync(fileURLToPath(WORKER_URL));
}

type Reply = { id: number; file?: ParsedFile; error?: { message: string; input: boolean } };

/**
 * Workers are kept between calls (started once, then reused): a worker costs tens of milliseconds to
 * start. They are unreferenced between calls so that they never keep the process alive.
 */
const idle: Worker[] = [];

function takeWorkers(n: number): Worker[] {
  const out = idle.splice(0, n);
  while (out.length < n) out.push(new Worker(WORKER_URL));
  for (const w of out) w.ref();
  return out;
}

function returnWorkers(workers: Worker[], healthy: boolean): void {
  for (const w of workers) {
    w.removeAllListeners("message");
    w.removeAllListeners("error");
    if (healthy) {
      w.unref();
      idle.push(w);
    } else void w.terminate();
  }
}

/**
 * Parses `paths` on up to `threads` workers; results come back in the order of `paths`. The first
 * failing file rejects the whole call (an InputError stays an InputError).
 */
export async function readFilesInWorkers(
  paths: string[],
  options: ReadOptions,
  threads = availableParallelism(),
  onDone?: (done: number) => void,
): Promise<ParsedFile[]> {
  const n = Math.max(1, Math.min(threads, paths.length));
  const workers = takeWorkers(n);
  const results: ParsedFile[] = new Array(paths.length);
  let next = 0;
  let done = 0;
  let healthy = false;
  try {
    await Promise.all(
      workers.map(
        (w) =>
          new Promise<void>((resolve, reject) => {
            const send = () => {
              if (next >= paths.length) return resolve();
              const id = next++;
              w.postMessage({ id, path: paths[id], options });
            };
            w.on("message", (r: Reply) => {
              if (r.error) {
                reject(r.error.input ? new InputError(r.error.message) : new Error(r.error.message));
                return;
              }
              results[r.id] = r.file!;
              onDone?.(++done);
              send();
            });
            w.on("error", reject);
            send();
          }),
      ),
    );
    healthy = true;
  } finally {
    // After a failure other workers may still be busy: do not reuse them.
    returnWorkers(workers, healthy);
  }
  return results;
}
