/**
 * Chart worker thread: renders one spec per message (`{ id, spec }`) and answers `{ id, svg }` or
 * `{ id, error }`. Loading vega here, not in the main thread, is most of the point: a worker started
 * ahead of the report (`startChartWorkers`) loads it while the plan runs.
 *
 * It runs at a lower priority than the main thread, and its first act is to make one date format with
 * a time zone: that loads the ICU locale and time zone data, which belong to the whole process, so the
 * main thread's local-time work (luxon) finds them loaded instead of loading them on its own critical
 * path.
 */
import { readlinkSync } from "node:fs";
import { setPriority } from "node:os";
import { parentPort } from "node:worker_threads";
import type { Spec } from "./chartRender.js";

/**
 * Niceness of this thread (Linux, where a thread's priority is its own): it gives way to the main
 * thread's simulation when both want the same core, and uses a spare core fully. Elsewhere it keeps
 * the process's priority.
 */
const CHART_WORKER_NICENESS = 10;

try {
  const tid = Number(readlinkSync("/proc/thread-self").split("/").pop()); // "<pid>/task/<tid>"
  setPriority(tid, CHART_WORKER_NICENESS);
} catch {
  // no /proc/thread-self: not Linux
}

new Intl.DateTimeFormat("en-US", { timeZone: "UTC", hour12: false }).formatToParts(0);
const { specToSvg } = await import("./chartRender.js");

parentPort?.on("message", async ({ id, spec }: { id: number; spec: Spec }) => {
  try {
    parentPort!.postMessage({ id, svg: await specToSvg(spec) });
  } catch (err) {
    parentPort!.postMessage({ id, error: err instanceof Error ? err.message : String(err) });
  }
});
