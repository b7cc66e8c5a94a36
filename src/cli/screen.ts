/**
 * `coldsoak screen <plan.yaml> <climate files or folders...> [--out dir] [--profile NAME] [--shard k/n]
 * [--workers N] [--cache-dir dir]`: every station of the climate files against one profile of the plan
 * (README, "Region screen"). Without `--shard` it writes `out/<plan name>-screen/` (screen.csv,
 * screen.json, screen.html), made visible in one step only after every file is written
 * (outputFolder.ts); with `--shard k/n` only the stations of shard k, as `<out>/screen-part-k-of-n.json`,
 * for `coldsoak screen-merge`.
 */
import { availableParallelism } from "node:os";
import { join, resolve } from "node:path";
import type { Command } from "commander";
import { inputError } from "../errors.js";
import { writeFileAtomic } from "../fsutil.js";
import { screenJson, screenTable } from "../output/screenTables.js";
import { toCsv } from "../output/tables.js";
import { SCREEN_SUFFIX } from "../plan/planFile.js";
import { partialName } from "../plan/screenMerge.js";
import type { ScreenResults } from "../plan/screenResults.js";
import { readScreenPlan, runScreen } from "../plan/screenRun.js";
import { parseShard } from "../plan/shard.js";
import { renderScreenPage } from "../report/screenPage.js";
import { profileOption } from "./options.js";
import { writeOutputFolder } from "./outputFolder.js";
import { progressBar } from "./plan.js";

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
  const bar = progressBar("stations", true);
  const run = await runScreen(input, profile, climate, {
    shard,
    workers: workersOption(opts.workers),
    cacheDir: opts.cacheDir === undefined ? null : resolve(opts.cacheDir),
    onProgress: bar.update,
  });
  bar.stop();
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

export function registerScreen(program: Command): void {
  program
    .command("screen")
    .description(
      "screen every station of a climate archive against a profile: one aircraft parked outside all year, without and with the cold-start option; a map of where and when the option is needed",
    )
    .argument(
      "<plan.yaml>",
      "plan file: its profiles, operations, thresholds and climate settings (bases, schedule and nitrogen are not read)",
    )
    .argument("<climate...>", "climate files or folders (read recursively): every station found is screened")
    .option("--out <dir>", "output root folder; results go to <dir>/<plan name>-screen/", "out")
    .option("--profile <name>", "profile screened (default: the plan's first)")
    .option(
      "--shard <k/n>",
      "screen only the stations of shard k of n (k = 0 … n−1) and write <out>/screen-part-k-of-n.json for screen-merge",
    )
    .option("--workers <n>", "worker threads over stations (default: one per core)")
    .option("--cache-dir <dir>", "keep the read climate in this cache folder (default: no cache)")
    .addHelpText(
      "after",
      `
Output (in <out>/<plan name>-screen/, replaced only after a successful run):
  screen.json    every station's figures by local month (°C, %; README, "Region screen")
  screen.csv     one row per station and local month, with the station's QC counts
  screen.html    self-contained page: the map and the stations sorted by risk

Sharded (README, "Scale past one machine"): a station goes to shard FNV-1a-32(id) mod n; run
  coldsoak screen plan.yaml archive/ --shard k/n --out parts     for k = 0 … n−1, anywhere, then
  coldsoak screen-merge parts/screen-part-*-of-n.json             to write the folder above.

Examples:
  coldsoak screen region.yaml data/isd
  coldsoak screen sample-data/demo-plan.yaml sample-data/climate --workers 2
  coldsoak screen region.yaml /archive/isd --shard 3/50 --out /shared/parts

Planning estimates, not maintenance data: service from the approved maintenance data and the
manufacturer's instructions, follow local rules, and take high-pressure gas precautions.`,
    )
    .action(async (planFile: string, climate: string[], opts: ScreenCliOptions) => {
      const { written, results, warnings } = await runScreenCommand(planFile, climate, opts);
      for (const w of warnings) process.stderr.write(`warning: ${w}\n`);
      process.stdout.write(`${screenSummary(results)}\n`);
      process.stdout.write(`${opts.shard === undefined ? join(written, "screen.html") : written}\n`);
    });
}
