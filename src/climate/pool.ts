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
  const workers = Array.from({ length: n }, () => new Worker(WORKER_URL));
  const results: ParsedFile[] = new Array(paths.length);
  let next = 0;
  let done = 0;
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
  } finally {
    await Promise.all(workers.map((w) => w.terminate()));
  }
  return results;
}
