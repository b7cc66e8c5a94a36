/**
 * The region screen at scale (README, "Region screen", scale figures): `coldsoak screen` as spawned
 * processes on generated station-years — copies of one whole station-year of the demo's seeded
 * generator (sample-data/climate/999702-99999-2011.gz, a cold continental invented station, full ISD
 * format; the real samples in ../shared/isd-samples hold January to April only, too little for a
 * usable year) with the station id moved to invented ids (ISD positions 5–15) and the year moved
 * (16–19).
 *
 * - Throughput: 10 stations × 10 years with `--workers 1` and `--workers 2`, in A/B pairs side by
 *   side (harness.ts); station-years per second of the whole command (start-up, naming the files and
 *   writing the page included), and the speed-up of each pair.
 * - Memory: peak RSS (COLDSOAK_RUN_STATS, all threads) of screens of 50 and of 200 station-years
 *   (10 and 40 stations of five years), two workers: flat when stations are streamed through the
 *   workers.
 */
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { gunzipSync, gzipSync } from "node:zlib";
import { parse } from "yaml";
import {
  type Command,
  type Figure,
  figureOf,
  paired,
  REPEATS,
  type RunResult,
  runOnce,
  showFigure,
} from "./harness.js";
import { DEMO_PLAN } from "./inputs.js";

const CLI = fileURLToPath(new URL("../cli/main.js", import.meta.url));
const SOURCE = "999702-99999-2011.gz";
const SOURCE_FILE = fileURLToPath(new URL(`../../sample-data/climate/${SOURCE}`, import.meta.url));

/** The first generated year. */
const FIRST_YEAR = 1990;
/** The throughput case: stations (an even number of equal units for two workers) and years each. */
const THROUGHPUT = { stations: 10, years: 10 };
/** Years per station in the memory cases. */
const MEMORY_YEARS = 5;
/** Station-years of the two memory cases. */
const MEMORY_STATION_YEARS = [50, 200] as const;
/** Runs of each memory case (peak memory varies little from run to run). */
const MEMORY_RUNS = 2;

/** The invented station id of generated station i (USAF 998000 + i, WBAN 99999). */
const stationId = (i: number) => ({ usaf: String(998_000 + i), wban: "99999" });

/**
 * Writes `stations` × `years` generated station-years (from FIRST_YEAR) into `dir`, one gzip file each,
 * named as ISD names them; returns the source's description.
 */
export function screenClimate(dir: string, stations: number, years: number): string {
  mkdirSync(dir, { recursive: true });
  const text = gunzipSync(readFileSync(SOURCE_FILE)).toString("latin1");
  const year = text.slice(15, 19);
  const at = new RegExp(`^(.{4}).{11}${year}`, "gm");
  for (let i = 0; i < stations; i++) {
    const { usaf, wban } = stationId(i);
    for (let y = FIRST_YEAR; y < FIRST_YEAR + years; y++) {
      const moved = text.replace(at, (_m, head: string) => `${head}${usaf}${wban}${y}`);
      writeFileSync(
        join(dir, `${usaf}-${wban}-${y}.gz`),
        gzipSync(Buffer.from(moved, "latin1"), { level: 1 }),
      );
    }
  }
  return `the demo's generated ${SOURCE}, copied to ${stations} invented station ids × ${FIRST_YEAR}–${FIRST_YEAR + years - 1}`;
}

/** The demo plan as a screen plan (no bases, schedule or nitrogen) on `years` generated years. */
export function screenBenchPlan(dir: string, years: number): string {
  const plan = parse(readFileSync(DEMO_PLAN, "utf8")) as Record<string, unknown> & {
    climate: Record<string, unknown>;
  };
  delete plan["bases"];
  delete plan["schedule"];
  delete plan["nitrogen"];
  delete plan.climate["stationHistory"];
  delete plan.climate["cacheDir"];
  plan["name"] = `bench-region-${years}`;
  plan.climate["paths"] = ["climate"]; // not read: the screen takes its climate from the command line
  plan.climate["years"] = { from: FIRST_YEAR, to: FIRST_YEAR + years - 1 };
  plan.climate["minYears"] = Math.min(years, 5);
  const file = join(dir, `region-${years}.yaml`);
  writeFileSync(file, JSON.stringify(plan)); // JSON is YAML
  return file;
}

function line(text: string): void {
  process.stdout.write(`${text}\n`);
}

const screen = (label: string, plan: string, climate: string, out: string, workers: number): Command => ({
  label,
  file: process.execPath,
  args: [CLI, "screen", plan, climate, "--out", out, "--workers", String(workers)],
});

const mib = (r: RunResult) => (r.stats["maxRssKiB"] ?? Number.NaN) / 1024;

/** The screen's figures; `pairs` of the throughput case (REPEATS in `npm run bench`). */
export async function benchScreen(pairs = REPEATS): Promise<Record<string, Figure>> {
  const dir = mkdtempSync(join(tmpdir(), "coldsoak-bench-screen-"));
  const stats = join(dir, "run-stats.json");
  const figures: Record<string, Figure> = {};
  try {
    const plan = screenBenchPlan(dir, THROUGHPUT.years);
    const climate = join(dir, "throughput");
    line(`screen inputs: ${screenClimate(climate, THROUGHPUT.stations, THROUGHPUT.years)}`);
    const stationYears = THROUGHPUT.stations * THROUGHPUT.years;
    const out = join(dir, "out");
    const r = await paired(
      screen("screen, 1 worker", plan, climate, out, 1),
      screen("screen, 2 workers", plan, climate, out, 2),
      { statsFile: stats, pairs },
    );
    figures["screenStationYearsPerSecond1Worker"] = figureOf(r.runsA.map((x) => stationYears / x.wallS));
    figures["screenStationYearsPerSecond2Workers"] = figureOf(r.runsB.map((x) => stationYears / x.wallS));
    figures["screenSpeedup2Workers"] = figureOf(r.runsA.map((x, i) => x.wallS / r.runsB[i]!.wallS));
    line(
      `screen of ${stationYears} station-years, station-years/s: 1 worker ${showFigure(figures["screenStationYearsPerSecond1Worker"]!)}, 2 workers ${showFigure(figures["screenStationYearsPerSecond2Workers"]!)}`,
    );
    line(`  2 workers / 1 worker (speed-up per pair)   ${showFigure(figures["screenSpeedup2Workers"]!)}`);

    const rss: Record<number, number[]> = {};
    const memoryPlan = screenBenchPlan(dir, MEMORY_YEARS);
    for (const n of MEMORY_STATION_YEARS) {
      const folder = join(dir, `memory-${n}`);
      screenClimate(folder, n / MEMORY_YEARS, MEMORY_YEARS);
      const runs: RunResult[] = [];
      for (let i = 0; i < MEMORY_RUNS; i++)
        runs.push(await runOnce(screen(`screen of ${n} station-years`, memoryPlan, folder, out, 2), stats));
      rss[n] = runs.map(mib);
      figures[`screen${n}StationYearsPeakRssMiB`] = figureOf(rss[n]!);
      rmSync(folder, { recursive: true, force: true });
    }
    const [small, large] = MEMORY_STATION_YEARS;
    figures["screenPeakRss200Over50"] = figureOf(rss[large]!.map((v, i) => v / rss[small]![i]!));
    line(
      `  peak RSS, 2 workers: ${small} station-years ${showFigure(figures[`screen${small}StationYearsPeakRssMiB`]!, 0)} MiB, ${large} ${showFigure(figures[`screen${large}StationYearsPeakRssMiB`]!, 0)} MiB; ratio ${showFigure(figures["screenPeakRss200Over50"]!)}`,
    );
    return figures;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
