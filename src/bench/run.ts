#!/usr/bin/env node
/**
 * `npm run bench`: runs every area's benchmark that exists (`benchClimate` from ./climate.js,
 * `benchPhysics` from ./physics.js, `benchPlan` from ./plan.js), the climate cache, the whole
 * commands (`benchCommands`, ./commands.js: spawned processes in A/B pairs against a reference run
 * side by side) and the region screen (`benchScreen`, ./screen.js: one and two workers side by side,
 * peak memory as stations grow), prints every figure as its median and range against the project's targets (README,
 * Tests and benchmarks) and writes them, with the machine and its load average at the start, to
 * out/bench.json as { median, min, max, n }.
 *
 * Own figure: climateLoadColdSeconds / climateLoadWarmSeconds, loading the demo's climate files in
 * this process with an empty cache folder, then again with the cache filled (a warm-up, then 5 of
 * each); climateWarmOverCold is the ratio of each pair.
 */
import { mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { loadClimate } from "../climate/index.js";
import { isMainModule } from "../entry.js";
import { writeFileAtomic } from "../fsutil.js";
import { type Figure, figureOf, REPEATS, showFigure } from "./harness.js";

/** MB (10^6 bytes, as the targets are written) in MiB, the unit peak memory is reported in. */
const MB_IN_MIB = 1e6 / 2 ** 20;

/** The project's targets (README); `atLeast` says which side of the limit is good. */
export const TARGETS = [
  { key: "readerVsDecompress", limit: 0.7, atLeast: true },
  { key: "simHoursPerSecond", limit: 500_000, atLeast: true },
  { key: "climateWarmOverCold", limit: 0.15, atLeast: false },
  { key: "helpOverNode", limit: 2.5, atLeast: false },
  { key: "prechargeOverNode", limit: 3, atLeast: false },
  { key: "climateOneFileOverGzip", limit: 2.0, atLeast: false },
  { key: "climateTwentyFilesOverGzip", limit: 1.5, atLeast: false },
  { key: "climateWarmOverColdCommand", limit: 0.35, atLeast: false },
  { key: "planWallOverSimulation", limit: 2.5, atLeast: false },
  { key: "whatIfOverPlain", limit: 4, atLeast: false },
  { key: "planWarmPeakRssMiB", limit: 300 * MB_IN_MIB, atLeast: false },
  { key: "planColdPeakRssMiB", limit: 400 * MB_IN_MIB, atLeast: false },
  { key: "plan8BasesWarmPeakRssMiB", limit: 300 * MB_IN_MIB, atLeast: false },
  { key: "plan8BasesColdPeakRssMiB", limit: 400 * MB_IN_MIB, atLeast: false },
  { key: "climateTwentyFilesPeakRssMiB", limit: 200 * MB_IN_MIB, atLeast: false },
  { key: "screenSpeedup2Workers", limit: 1.7, atLeast: true },
  { key: "screenPeakRss200Over50", limit: 1.2, atLeast: false },
  { key: "largeSchedulePeakRssMiB", limit: 600 * MB_IN_MIB, atLeast: false },
] as const;

type Figures = Record<string, Figure>;

interface AreaResult {
  area: string;
  status: "ok" | "missing" | "failed";
  message?: string;
  figures: Figures;
}

const DEMO_CLIMATE = fileURLToPath(new URL("../../sample-data/climate/", import.meta.url));

function line(text: string): void {
  process.stdout.write(`${text}\n`);
}

/** Imports `./<file>` and calls its `exportName`; a missing module or function is reported, not thrown. */
export async function runArea(area: string, file: string, exportName: string): Promise<AreaResult> {
  const url = new URL(file, import.meta.url);
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
    const code = (err as NodeJS.ErrnoException).code;
    if (code === "ERR_MODULE_NOT_FOUND")
      return { area, status: "missing", message: `${file} not present`, figures: {} };
    const kept = (err as { figures?: Figures }).figures ?? {};
    return {
      area,
      status: "failed",
      message: err instanceof Error ? err.message : String(err),
      figures: kept,
    };
  }
}

async function seconds(fn: () => Promise<unknown>): Promise<number> {
  const t0 = performance.now();
  await fn();
  return (performance.now() - t0) / 1000;
}

/**
 * Loads the demo's climate files into an empty cache folder, then again from the filled cache: a
 * warm-up pair, then REPEATS pairs (a fresh empty folder for every cold load).
 */
export async function benchClimateCache(): Promise<Figures> {
  const colds: number[] = [];
  const warms: number[] = [];
  for (let i = 0; i <= REPEATS; i++) {
    const cacheDir = mkdtempSync(join(os.tmpdir(), "coldsoak-bench-cache-"));
    try {
      const options = { gapHours: 3, cacheDir };
      const cold = await seconds(() => loadClimate([DEMO_CLIMATE], options));
      const warm = await seconds(() => loadClimate([DEMO_CLIMATE], options));
      if (i > 0) {
        colds.push(cold);
        warms.push(warm);
      }
    } finally {
      rmSync(cacheDir, { recursive: true, force: true });
    }
  }
  const figures = {
    climateLoadColdSeconds: figureOf(colds),
    climateLoadWarmSeconds: figureOf(warms),
    climateWarmOverCold: figureOf(warms.map((w, i) => w / colds[i]!)),
  };
  line(
    `climate load (40 demo station-years), empty cache:  ${showFigure(figures.climateLoadColdSeconds, 3)} s`,
  );
  line(
    `climate load, filled cache:                         ${showFigure(figures.climateLoadWarmSeconds, 3)} s`,
  );
  line(`filled / empty:                                     ${showFigure(figures.climateWarmOverCold, 3)}`);
  return figures;
}

/** The machine the figures were measured on, and its load average (1, 5, 15 min) now. */
export function machine(): Record<string, string | number | number[]> {
  const cpus = os.cpus();
  return {
    cpuModel: cpus[0]?.model.trim() ?? "unknown",
    cpuCount: cpus.length,
    availableParallelism: os.availableParallelism(),
    loadAverage: os.loadavg().map((x) => Math.round(x * 100) / 100),
    totalMemoryGiB: Math.round((os.totalmem() / 2 ** 30) * 10) / 10,
    platform: `${os.platform()} ${os.release()} ${os.arch()}`,
    node: process.version,
  };
}

export async function runBench(): Promise<number> {
  const atStart = machine();
  line(
    `machine: ${atStart["cpuModel"]}, ${atStart["cpuCount"]} CPUs, load average ${(atStart["loadAverage"] as number[]).join(" ")} at the start`,
  );
  line("Timings on a shared machine vary with its load: every ratio is taken in pairs run side by side.");
  const areas: AreaResult[] = [
    await runArea("climate", "./climate.js", "benchClimate"),
    await runArea("physics", "./physics.js", "benchPhysics"),
    await runArea("plan", "./plan.js", "benchPlan"),
  ];
  line("\n== climate cache ==");
  try {
    areas.push({ area: "climate cache", status: "ok", figures: await benchClimateCache() });
  } catch (err) {
    areas.push({ area: "climate cache", status: "failed", message: String(err), figures: {} });
  }
  areas.push(await runArea("whole commands", "./commands.js", "benchCommands"));
  areas.push(await runArea("region screen", "./screen.js", "benchScreen"));

  const figures: Figures = {};
  for (const a of areas) Object.assign(figures, a.figures);
  const atEnd = os.loadavg().map((x) => Math.round(x * 100) / 100);
  const report = {
    measuredAt: new Date().toISOString(),
    machine: { ...atStart, loadAverageAtStart: atStart["loadAverage"], loadAverageAtEnd: atEnd },
    figures: Object.fromEntries(Object.entries(figures).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0))),
    targets: TARGETS.map((t) => {
      const f = figures[t.key];
      const met =
        f === undefined || !Number.isFinite(f.median)
          ? null
          : t.atLeast
            ? f.median >= t.limit
            : f.median <= t.limit;
      return { key: t.key, limit: t.limit, atLeast: t.atLeast, met };
    }),
    areas: areas.map((a) => ({
      area: a.area,
      status: a.status,
      ...(a.message ? { message: a.message } : {}),
    })),
  };

  line("\n== summary (median and range) ==");
  for (const a of areas) if (a.status !== "ok") line(`${a.area}: ${a.status} (${a.message})`);
  for (const t of report.targets) {
    const f = figures[t.key];
    const need = `${t.atLeast ? "≥" : "≤"} ${t.limit >= 1000 ? Math.round(t.limit).toLocaleString("en-US") : Number(t.limit.toFixed(2))}`;
    const shown = f === undefined ? "not measured" : showFigure(f);
    line(
      `${t.key.padEnd(30)} ${shown.padEnd(34)} target ${need}: ${t.met === null ? "not measured" : t.met ? "met" : "NOT met"}`,
    );
  }
  line(
    `load average at the start ${(atStart["loadAverage"] as number[]).join(" ")}, at the end ${atEnd.join(" ")}`,
  );
  await writeFileAtomic("out/bench.json", `${JSON.stringify(report, null, 2)}\n`);
  line("wrote out/bench.json");
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
