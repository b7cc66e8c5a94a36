/**
 * Reads many climate files on worker threads (one per core, at most `threads`), when the compiled worker
 * script is present (it is not when running from TypeScript sources, e.g. under the test runner).
 */
import { existsSync } from "node:fs";
import { availableParallelism } from "node:os";
import { fileURLToPath } from "node:url";
import { isMainThread, Worker } from "node:worker_threads";
import { InputError } from "../errors.js";
import type { ParsedFile } from "./records.js";
import type { ReadOptions } from "./source.js";

const WORKER_URL = new URL("./worker.js", import.meta.url);

/** True on the main thread when the compiled worker exists (a worker thread reads its files itself). */
export function workersAvailable(): boolean {
  return isMainThread && import.meta.url.endsWith(".js") && existsSync(fileURLToPath(WORKER_URL));
}

type Reply = {
  id: number;
  file?: ParsedFile;
  acked?: number;
  error?: { message: string; input: boolean };
};

function replyError(r: Reply): Error {
  return r.error!.input ? new InputError(r.error!.message) : new Error(r.error!.message);
}

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
                reject(replyError(r));
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

/** Chunks handed to a parse session and not yet parsed, at most (about 4 MB of text at 256 kB each). */
const MAX_CHUNKS_IN_FLIGHT = 16;

/**
 * The lines of one file parsed on a worker thread while this thread decompresses it: decompression
 * (libuv's thread pool, driven from this thread) and parsing then run side by side. `send` hands over
 * the next chunk (its memory is moved, not copied, when the chunk owns all of it) and waits while the
 * worker is too far behind; `finish` returns the parsed file; `abort` gives up.
 */
export interface ParseSession {
  send(chunk: Buffer): Promise<void>;
  finish(): Promise<ParsedFile>;
  abort(): void;
}

/** True when a parse session can be started: the compiled worker exists and this is the main thread. */
export function parseSessionsAvailable(): boolean {
  return isMainThread && workersAvailable();
}

let nextSessionId = 1;

export function startParseSession(
  path: string,
  format: ParsedFile["format"],
  options: ReadOptions,
  capacity: number,
): ParseSession {
  const [w] = takeWorkers(1) as [Worker];
  const id = nextSessionId++;
  let inFlight = 0;
  let failure: Error | null = null;
  let wake: (() => void) | null = null;
  let settle: { resolve: (f: ParsedFile) => void; reject: (e: Error) => void } | null = null;
  const done = new Promise<ParsedFile>((resolve, reject) => {
    settle = { resolve, reject };
  });
  done.catch(() => undefined); // reported through send() or finish()
  const fail = (err: Error) => {
    failure ??= err;
    settle!.reject(err);
    wake?.();
  };
  w.on("message", (r: Reply) => {
    if (r.id !== id) return;
    if (r.error) fail(replyError(r));
    else if (r.acked !== undefined) {
      inFlight -= r.acked;
      wake?.();
    } else settle!.resolve(r.file!);
  });
  w.on("error", fail);
  w.postMessage({ kind: "begin", id, path, format, options, capacity });
  let open = true;
  const close = (healthy: boolean) => {
    if (open) returnWorkers([w], healthy);
    open = false;
  };
  return {
    async send(chunk: Buffer): Promise<void> {
      if (failure) throw failure;
      const ownsMemory = chunk.byteOffset === 0 && chunk.buffer.byteLength === chunk.length;
      w.postMessage({ kind: "chunk", id, bytes: chunk }, ownsMemory ? [chunk.buffer as ArrayBuffer] : []);
      inFlight++;
      while (inFlight >= MAX_CHUNKS_IN_FLIGHT && failure === null)
        await new Promise<void>((resolve) => {
          wake = resolve;
        });
      wake = null;
      if (failure) throw failure;
    },
    async finish(): Promise<ParsedFile> {
      w.postMessage({ kind: "end", id });
      try {
        const file = await done;
        close(true);
        return file;
      } catch (err) {
        close(false);
        throw err;
      }
    },
    abort(): void {
      close(false); // the worker may hold a half-read file: not reused
    },
  };
}
