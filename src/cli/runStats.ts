/**
 * Figures of a run for the benchmark (`npm run bench`): when the environment variable
 * COLDSOAK_RUN_STATS names a file, the process writes there, as it exits, a JSON object with its peak
 * resident set size (`maxRssKiB`, all threads) and whatever the command noted (`plan`: the seconds
 * spent in the hour-by-hour simulation and the accumulator-hours simulated). Nothing is written
 * otherwise; results, reports and exit codes never depend on it.
 */
import { readFileSync, writeFileSync } from "node:fs";

const noted: Record<string, number> = {};

/** Notes a figure of this run (written at exit when COLDSOAK_RUN_STATS is set). */
export function noteRunStat(name: string, value: number): void {
  noted[name] = value;
}

/** Arranges for the figures to be written at exit, when COLDSOAK_RUN_STATS is set. */
export function writeRunStatsAtExit(env: NodeJS.ProcessEnv = process.env): void {
  const file = env["COLDSOAK_RUN_STATS"];
  if (file === undefined || file === "") return;
  process.on("exit", () => {
    try {
      writeFileSync(file, JSON.stringify({ ...noted, maxRssKiB: peakRssKiB() }));
    } catch {
      // a benchmark aid only: never turns a run into a failure
    }
  });
}

/**
 * Peak resident set size of this process, KiB. On Linux the high-water mark of its own memory
 * (`VmHWM` of /proc/self/status, proc(5)): `getrusage`'s `ru_maxrss` keeps, across exec, the peak of
 * the process that forked it, so a run spawned by a large benchmark process would report the
 * benchmark's memory. Elsewhere `process.resourceUsage().maxRSS`.
 */
function peakRssKiB(): number {
  try {
    const hwm = /^VmHWM:\s+(\d+)\s+kB$/m.exec(readFileSync("/proc/self/status", "utf8"));
    if (hwm) return Number(hwm[1]);
  } catch {
    // not Linux: fall through
  }
  return process.resourceUsage().maxRSS;
}
