/**
 * The work of `coldsoak screen <plan.yaml> <climate files or folders...> [--out dir] [--profile NAME] [--shard k/n]
 * [--workers N] [--cache-dir dir]`: every station of the climate files against one profile of the plan
 * (README, "Region screen"). Without `--shard` it writes `out/<plan name>-screen/` (screen.csv,
 * screen.json, screen.html), made visible in one step only after every file is written
 * (outputFolder.ts); with `--shard k/n` only the stations of shard k, as `<out>/screen-part-k-of-n.json`,
 * for `coldsoak screen-merge`.
 */
import { availableParallelism } from "node:os";
import { join, resolve } from "node:path";
import { inputError } from "../errors.js";
import { writeFileAtomic } from "../fsutil.js";
import { toCsv } from "../output/csv.js";
import { screenJson, screenTable } from "../output/screenTables.js";
import { SCREEN_SUFFIX } from "../plan/planFile.js";
import { partialName } from "../plan/screenMerge.js";
import type { ScreenResults } from "../plan/screenResults.js";
import { readScreenPlan, runScreen } from "../plan/screenRun.js";
import { parseShard } from "../plan/shard.js";
import { warmAtlas } from "../report/screenMap.js";
import { renderScreenPage } from "../report/screenPage.js";
import { profileOption } from "./options.js";
import { writeOutputFolder } from "./outputFolder.js";
import { loadBars, progressBar } from "./progress.js";

export interface ScreenCliOptions {
  out: string;
  profile?: string;
  shard?: string;
  workers?: string;
  cacheDir?: string;
}

/**
 * Writes `<outRoot>/<plan name>-screen/` from the results: screen.json first, then the CSV and the page
 * from that JSON text read back, so a merged screen gives the same files as an unsharded one.
 */
export async function writeScreenFolder(outRoot: string, results: ScreenResults): Promise<string> {
  const json = screenJson(results);
  const read = JSON.parse(json) as ScreenResults;
  const files = new Map<string, string>([
    ["screen.json", json],
    ["screen.csv", toCsv(screenTable(read))],
    ["screen.html", renderScreenPage(read)],
  ]);
  return writeOutputFolder(resolve(outRoot), `${results.plan}${SCREEN_SUFFIX}`, files);
}

/** "--workers 2": a whole number of worker threads, at least 1. */
function workersOption(text: string | undefined): number {
  if (text === undefined) return availableParallelism();
  const n = Number(text);
  if (!/^\d+$/.test(text.trim()) || !(n >= 1 && n <= 1024))
    throw inputError(
      "--workers",
      undefined,
      undefined,
      `"${text}"; expected a whole number of worker threads, 1–1024`,
    );
  return n;
}

/** The screen in one line for the terminal: stations, those needing the option, those with too few years. */
export function screenSummary(r: ScreenResults): string {
  const needing = r.stations.filter((s) => s.monthsNeedingOption.length > 0);
  const few = r.stations.filter((s) => s.tooFewYears).length;
  return `Screen "${r.plan}", profile ${r.profile}: ${r.stations.length} station(s), ${needing.length} needing the cold-start option in some month, ${few} with fewer than ${r.thresholds.minYears} usable climate years`;
}

/** Runs the screen end to end; returns the file or folder written and the results. */
export async function runScreenCommand(
  planFile: string,
  climate: string[],
  opts: ScreenCliOptions,
): Promise<{ written: string; results: ScreenResults; warnings: string[] }> {
  const shard = opts.shard === undefined ? null : parseShard(opts.shard);
  const input = await readScreenPlan(planFile);
  const profile = profileOption(input.plan, opts.profile).name;
  const bar = progressBar(await loadBars(), "stations", true);
  // The map's outlines are read while the files are named and the workers screen (not for a shard).
  const warm = shard === null ? setTimeout(warmAtlas, 0) : null;
  const run = await runScreen(input, profile, climate, {
    shard,
    workers: workersOption(opts.workers),
    cacheDir: opts.cacheDir === undefined ? null : resolve(opts.cacheDir),
    onProgress: bar.update,
  });
  bar.stop();
  if (warm !== null) clearTimeout(warm);
  if (shard === null)
    return {
      written: await writeScreenFolder(opts.out, run.results),
      results: run.results,
      warnings: run.warnings,
    };
  const file = join(resolve(opts.out), partialName(shard.index, shard.count));
  await writeFileAtomic(file, screenJson(run.results));
  return { written: file, results: run.results, warnings: run.warnings };
}

/** `coldsoak screen` once its options are parsed: runs the screen, prints its summary and the page's (or the partial's) path. */
export async function screenAction(
  planFile: string,
  climate: string[],
  opts: ScreenCliOptions,
): Promise<void> {
  const { written, results, warnings } = await runScreenCommand(planFile, climate, opts);
  for (const w of warnings) process.stderr.write(`warning: ${w}\n`);
  process.stdout.write(`${screenSummary(results)}\n`);
  process.stdout.write(`${opts.shard === undefined ? join(written, "screen.html") : written}\n`);
}
