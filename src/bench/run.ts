#!/usr/bin/env node
/**
 * `npm run bench`: runs every area's benchmark that exists (`benchClimate` from ./climate.js,
 * `benchPhysics` from ./physics.js, `benchPlan` from ./plan.js), measures the climate cache and the
 * whole demo run itself, prints the figures against the project's targets (README, Tests and benchmarks) and writes them,
 * with the machine they were measured on, to out/bench.json.
 *
 * Own figures:
 *   climateLoadColdSeconds / climateLoadWarmSeconds: loading the demo's climate files with an empty
 *     cache folder, then again with the cache filled (medians of three rounds); climateWarmOverCold is
 *     their ratio.
 *   demoColdSeconds / demoWarmSeconds: the whole demo (`coldsoak plan sample-data/demo-plan.yaml`, a
 *     child process of the built CLI) run in a fresh working folder (empty cache), then again there.
 */
import { execFile } from "node:child_process";
import { existsSync, mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import { join } from "node:path";
import { performance } from "node:perf_hooks";
import { fileURLToPath } from "node:url";
import { promisify } from "node:util";
import { loadClimate } from "../climate/index.js";
import { isMainModule } from "../entry.js";
import { writeFileAtomic } from "../fsutil.js";

const execFileAsync = promisify(execFile);

/** The project's targets (README); `atLeast` says which side of the limit is good. */
export const TARGETS = [
  { key: "readerVsDecompress", limit: 0.7, atLeast: true },
  { key: "simHoursPerSecond", limit: 500_000, atLeast: true },
  { key: "climateWarmOverCold", limit: 0.15, atLeast: false },
] as const;

type Figures = Record<string, number>;

interface AreaResult {
  area: string;
  status: "ok" | "missing" | "failed";
  message?: string;
  figures: Figures;
}

const DEMO_PLAN = fileURLToPath(new URL("../../sample-data/demo-plan.yaml", import.meta.url));
const DEMO_CLIMATE = fileURLToPath(new URL("../../sample-data/climate/", import.meta.url));
const CLI_MAIN = fileURLToPath(new URL("../cli/main.js", import.meta.url));

function line(text: string): void {
  process.stdout.write(`${text}\n`);
}

/** Imports `./<file>` and calls its `exportName`; a missing module or function is reported, not thrown. */
export async function runArea(area: string, file: string, exportName: string): Promise<AreaResult> {
  const url = new URL(file, import.meta.url);
  if (url.protocol === "file:" && !existsSync(fileURLToPath(url))) {
    return { area, status: "missing", message: `${file} not present`, figures: {} };
  }
  try {
    const mod = (await import(url.href)) as Record<string, unknown>;
    const fn = mod[exportName];
    if (typeof fn !== "function") {
      return { area, status: "missing", message: `${file} has no ${exportName}()`, figures: {} };
    }
    line(`\n== ${area} (${exportName}) ==`);
    const figures = (await (fn as () => Promise<Figures>)()) ?? {};
    return { area, status: "ok", figures };
  } catch (err) {
    return { area, status: "failed", message: err instanceof Error ? err.message : String(err), figures: {} };
  }
}

/** Seconds taken by `fn`. */
async function timed(fn: () => Promise<unknown>): Promise<number> {
  const t0 = performance.now();
  await fn();
  return (performance.now() - t0) / 1000;
}

/** Median of a few numbers. */
function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const mid = Math.floor(s.length / 2);
  return s.length % 2 === 1 ? s[mid]! : (s[mid - 1]! + s[mid]!) / 2;
}

/** Repetitions of each climate load; the medians are reported. */
const CLIMATE_LOAD_REPEATS = 3;

/**
 * Loads the demo's climate files into an empty cache folder, then again from the filled cache; each
 * `CLIMATE_LOAD_REPEATS` times (a fresh empty folder for every cold load), medians reported.
 */
export async function benchClimateCache(): Promise<Figures> {
  const colds: number[] = [];
  const warms: number[] = [];
  for (let i = 0; i < CLIMATE_LOAD_REPEATS; i++) {
    const cacheDir = mkdtempSync(join(os.tmpdir(), "coldsoak-bench-cache-"));
    try {
      const options = { gapHours: 3, cacheDir };
      colds.push(await timed(() => loadClimate([DEMO_CLIMATE], options)));
      warms.push(await timed(() => loadClimate([DEMO_CLIMATE], options)));
    } finally {
      rmSync(cacheDir, { recursive: true, force: true });
    }
  }
  const cold = median(colds);
  const warm = median(warms);
  line(
    `climate load, empty cache:  ${cold.toFixed(3)} s (40 demo station-years; median of ${CLIMATE_LOAD_REPEATS})`,
  );
  line(`climate load, filled cache: ${warm.toFixed(3)} s (median of ${CLIMATE_LOAD_REPEATS})`);
  return { climateLoadColdSeconds: cold, climateLoadWarmSeconds: warm, climateWarmOverCold: warm / cold };
}

/** Runs the whole demo through the built CLI twice in a fresh working folder: empty cache, then filled. */
export async function benchDemo(): Promise<Figures> {
  const cwd = mkdtempSync(join(os.tmpdir(), "coldsoak-bench-demo-"));
  try {
    const run = () =>
      execFileAsync(process.execPath, [CLI_MAIN, "plan", DEMO_PLAN], { cwd, maxBuffer: 64 << 20 });
    const cold = await timed(run);
    const warm = await timed(run);
    line(`demo run, empty cache:  ${cold.toFixed(2)} s`);
    line(`demo run, filled cache: ${warm.toFixed(2)} s`);
    return { demoColdSeconds: cold, demoWarmSeconds: warm };
  } finally {
    rmSync(cwd, { recursive: true, force: true });
  }
}

/** The machine the figures were measured on. */
export function machine(): Record<string, string | number> {
  const cpus = os.cpus();
  return {
    cpuModel: cpus[0]?.model.trim() ?? "unknown",
    cpuCount: cpus.length,
    availableParallelism: os.availableParallelism(),
    totalMemoryGiB: Math.round((os.totalmem() / 2 ** 30) * 10) / 10,
    platform: `${os.platform()} ${os.release()} ${os.arch()}`,
    node: process.version,
  };
}

function formatFigure(v: number): string {
  return Math.abs(v) >= 1000 ? Math.round(v).toLocaleString("en-US") : v.toPrecision(4);
}

export async function runBench(): Promise<number> {
  const areas: AreaResult[] = [
    await runArea("climate", "./climate.js", "benchClimate"),
    await runArea("physics", "./physics.js", "benchPhysics"),
    await runArea("plan", "./plan.js", "benchPlan"),
  ];
  for (const [area, fn] of [
    ["climate cache", benchClimateCache],
    ["demo end to end", benchDemo],
  ] as const) {
    line(`\n== ${area} ==`);
    try {
      areas.push({ area, status: "ok", figures: await fn() });
    } catch (err) {
      const msg = err instanceof Error ? err.message.split("\n")[0]! : String(err);
      areas.push({ area, status: "failed", message: msg, figures: {} });
    }
  }

  const figures: Figures = {};
  for (const a of areas) Object.assign(figures, a.figures);
  const report = {
    measuredAt: new Date().toISOString(),
    machine: machine(),
    ...Object.fromEntries(Object.entries(figures).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0))),
    areas: areas.map((a) => ({
      area: a.area,
      status: a.status,
      ...(a.message ? { message: a.message } : {}),
    })),
  };

  line("\n== summary ==");
  for (const a of areas) if (a.status !== "ok") line(`${a.area}: ${a.status} (${a.message})`);
  let allMet = true;
  for (const t of TARGETS) {
    const v = figures[t.key];
    const need = `${t.atLeast ? "≥" : "≤"} ${formatFigure(t.limit)}`;
    if (v === undefined || !Number.isFinite(v)) {
      allMet = false;
      line(`${t.key.padEnd(22)} not measured          (target ${need})`);
      continue;
    }
    const met = t.atLeast ? v >= t.limit : v <= t.limit;
    allMet &&= met;
    line(`${t.key.padEnd(22)} ${formatFigure(v).padEnd(14)} target ${need}: ${met ? "met" : "NOT met"}`);
  }
  for (const k of ["demoColdSeconds", "demoWarmSeconds"]) {
    const v = figures[k];
    line(`${k.padEnd(22)} ${v === undefined ? "not measured" : `${v.toFixed(2)} s`}`);
  }
  const m = report.machine;
  line(`machine: ${m.cpuModel}, ${m.cpuCount} CPUs, Node ${m.node}`);
  await writeFileAtomic("out/bench.json", `${JSON.stringify(report, null, 2)}\n`);
  line(`wrote out/bench.json${allMet ? "" : " (some targets not met or not measured)"}`);
  return 0;
}

if (isMainModule(import.meta.url)) {
  runBench().then(
    (code) => {
      process.exitCode = code;
    },
    (err: unknown) => {
      process.stderr.write(`bench: ${err instanceof Error ? err.message : String(err)}\n`);
      process.exitCode = 1;
    },
  );
}
