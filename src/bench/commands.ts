/**
 * Whole commands as a user waits for them: the built CLI as spawned processes, each measured in A/B
 * pairs against a reference run side by side (harness.ts): `node -e 0` for start-up, `gzip -dc` of the
 * same files for reading climate, the same command with an empty cache for a warm one; the demo
 * plan against the time its own hour-by-hour simulation took, and with its what-if variants against
 * the plain run. Peak memory comes from what each run
 * reports of itself (COLDSOAK_RUN_STATS).
 */
import { mkdtempSync, readdirSync, rmSync, statSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { BASE_PAGE_DIR, MAX_BASES_IN_ONE_FILE } from "../report/split.js";
import {
  type Command,
  type Figure,
  figureOf,
  paired,
  type RunResult,
  runOnce,
  showFigure,
} from "./harness.js";
import {
  COPIED_BASE,
  climateInputs,
  copiedBasePlan,
  DEMO_PLAN,
  generatedSchedulePlan,
  plainDemoPlanFile,
} from "./inputs.js";

const CLI = fileURLToPath(new URL("../cli/main.js", import.meta.url));
const NODE = process.execPath;

function line(text: string): void {
  process.stdout.write(`${text}\n`);
}

const cli = (label: string, args: string[], prepare?: () => void): Command => ({
  label,
  file: NODE,
  args: [CLI, ...args],
  ...(prepare ? { prepare } : {}),
});

const emptied = (dir: string) => () => rmSync(dir, { recursive: true, force: true });

/** A figure from one number each run wrote of itself. */
function statFigure(runs: RunResult[], of: (stats: Record<string, number>, wallS: number) => number): Figure {
  return figureOf(runs.map((r) => of(r.stats, r.wallS)).filter((v) => Number.isFinite(v)));
}

/** A benchmark that failed part-way: the figures measured before the failure are kept. */
export class PartialBenchError extends Error {
  constructor(
    message: string,
    readonly figures: Record<string, Figure>,
  ) {
    super(message);
  }
}

const mib = (s: Record<string, number>) => (s["maxRssKiB"] ?? Number.NaN) / 1024;

export async function benchCommands(): Promise<Record<string, Figure>> {
  const dir = mkdtempSync(join(tmpdir(), "coldsoak-bench-commands-"));
  const stats = join(dir, "run-stats.json");
  const figures: Record<string, Figure> = {};
  try {
    const node0: Command = { label: "node -e 0", file: NODE, args: ["-e", "0"] };
    const help = await paired(node0, cli("coldsoak --help", ["--help"]));
    figures["helpOverNode"] = help.ratio;
    line(
      `coldsoak --help / node -e 0                  ${showFigure(help.ratio)}  (node -e 0 ${showFigure(help.a, 3)} s)`,
    );
    const precharge = await paired(
      node0,
      cli("precharge", ["precharge", "--ref", "1450psig@70F", "--at", "50F"]),
    );
    figures["prechargeOverNode"] = precharge.ratio;
    line(`coldsoak precharge / node -e 0               ${showFigure(precharge.ratio)}`);

    const inputs = climateInputs(join(dir, "climate"));
    line(`climate inputs: ${inputs.source}; ${(inputs.textBytes / 1e6).toFixed(1)} MB of text`);
    const gzipOne: Command = { label: "gzip -dc (one file)", file: "gzip", args: ["-dc", inputs.oneFile] };
    const cacheOne = join(dir, "cache-one");
    const one = await paired(
      gzipOne,
      cli("climate, one file", ["climate", inputs.oneFile, "--cache-dir", cacheOne], emptied(cacheOne)),
      { statsFile: stats },
    );
    figures["climateOneFileOverGzip"] = one.ratio;
    line(
      `climate one file, empty cache / gzip -dc     ${showFigure(one.ratio)}  (gzip -dc ${showFigure(one.a, 3)} s)`,
    );

    const gzipTwenty: Command = {
      label: "gzip -dc (20 files)",
      file: "gzip",
      args: ["-dc", ...inputs.twentyFiles],
    };
    const cache = join(dir, "cache-twenty");
    const cold = cli(
      "climate, 20 files, empty cache",
      ["climate", inputs.twentyDir, "--cache-dir", cache],
      emptied(cache),
    );
    const twenty = await paired(gzipTwenty, cold, { statsFile: stats });
    figures["climateTwentyFilesOverGzip"] = twenty.ratio;
    figures["climateTwentyFilesPeakRssMiB"] = statFigure(twenty.runsB, mib);
    line(
      `climate 20 files, empty cache / gzip -dc     ${showFigure(twenty.ratio)}  (gzip -dc ${showFigure(twenty.a, 3)} s)`,
    );
    const warm = await paired(
      cold,
      cli("climate, 20 files, filled cache", ["climate", inputs.twentyDir, "--cache-dir", cache]),
      { statsFile: stats },
    );
    figures["climateWarmOverColdCommand"] = warm.ratio;
    line(`climate 20 files, filled / empty cache       ${showFigure(warm.ratio)}`);
    line(
      `  peak RSS of climate on 20 files            ${showFigure(figures["climateTwentyFilesPeakRssMiB"], 0)} MiB`,
    );

    const failures: string[] = [];
    for (const [name, step] of [
      ["demo plan", () => benchDemoPlan(dir, stats)],
      ["demo plan with what-if variants", () => benchWhatIf(dir, stats)],
      ["copies of a demo base", () => benchBaseCopies(dir, stats)],
      ["a large generated schedule", () => benchLargeSchedule(dir, stats)],
      ["a report split by base", () => benchSplitReport(dir, stats)],
    ] as const) {
      try {
        Object.assign(figures, await step());
      } catch (err) {
        const message = err instanceof Error ? err.message : String(err);
        line(`${name}: failed: ${message}`);
        failures.push(`${name}: ${message}`);
      }
    }
    if (failures.length > 0) throw new PartialBenchError(failures.join("; "), figures);
    return figures;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/**
 * The demo plan without its what-if variants, in pairs of an empty-cache run and a filled-cache run:
 * wall time over the run's own simulation seconds (filled cache), the simulation's accumulator-hours
 * per second, peak memory.
 */
async function benchDemoPlan(dir: string, stats: string): Promise<Record<string, Figure>> {
  const out = join(dir, "out");
  const cache = join(dir, "plan-cache");
  const args = ["plan", plainDemoPlanFile(join(dir, "plain-demo")), "--out", out, "--cache-dir", cache];
  const r = await paired(
    cli("demo plan, empty cache", args, emptied(cache)),
    cli("demo plan, filled cache", args),
    { statsFile: stats },
  );
  const figures: Record<string, Figure> = {
    planColdSeconds: r.a,
    planWarmSeconds: r.b,
    planWallOverSimulation: statFigure(r.runsB, (s, wallS) => wallS / (s["simulationS"] ?? Number.NaN)),
    planSimulationSeconds: statFigure(r.runsB, (s) => s["simulationS"] ?? Number.NaN),
    planAccumulatorHoursPerSecond: statFigure(
      r.runsB,
      (s) => (s["accumulatorHours"] ?? Number.NaN) / (s["simulationS"] ?? Number.NaN),
    ),
    planWarmPeakRssMiB: statFigure(r.runsB, mib),
    planColdPeakRssMiB: statFigure(r.runsA, mib),
  };
  line(
    `demo plan, filled cache: wall / simulation   ${showFigure(figures["planWallOverSimulation"]!)}  (wall ${showFigure(r.b)} s, simulation ${showFigure(figures["planSimulationSeconds"]!)} s)`,
  );
  line(
    `  simulation accumulator-hours per second    ${showFigure(figures["planAccumulatorHoursPerSecond"]!, 0)}`,
  );
  line(
    `  peak RSS, filled / empty cache             ${showFigure(figures["planWarmPeakRssMiB"]!, 0)} / ${showFigure(figures["planColdPeakRssMiB"]!, 0)} MiB`,
  );
  return figures;
}

/**
 * The demo plan with its what-if variants (the plan's `whatIf:` list, every variant) against the same
 * plan without them, both on a filled cache: the wall-time ratio of each pair, and peak memory.
 */
async function benchWhatIf(dir: string, stats: string): Promise<Record<string, Figure>> {
  const cache = join(dir, "plan-cache");
  const plain = plainDemoPlanFile(join(dir, "plain-demo"));
  const out = (name: string) => ["--out", join(dir, name), "--cache-dir", cache];
  const r = await paired(
    cli("demo plan, plain", ["plan", plain, ...out("out-plain")]),
    cli("demo plan, what-if", ["plan", DEMO_PLAN, ...out("out-what-if")]),
    { statsFile: stats },
  );
  const figures: Record<string, Figure> = {
    whatIfOverPlain: r.ratio,
    whatIfSeconds: r.b,
    whatIfPeakRssMiB: statFigure(r.runsB, mib),
  };
  line(
    `demo plan, what-if variants / plain run     ${showFigure(r.ratio)}  (plain ${showFigure(r.a)} s, what-if ${showFigure(r.b)} s)`,
  );
  line(`  peak RSS with the variants                 ${showFigure(figures["whatIfPeakRssMiB"]!, 0)} MiB`);
  return figures;
}

/** Copies of one demo base in one plan. */
const COPIES = [1, 4, 8];
/** Runs per plan size for the memory figures (peak memory varies little from run to run). */
const MEMORY_RUNS = 3;

/**
 * Peak memory of plans with 1, 4 and 8 copies of one demo base (filled cache; and an empty cache for
 * the largest), and the growth per base between the sizes.
 */
async function benchBaseCopies(dir: string, stats: string): Promise<Record<string, Figure>> {
  const figures: Record<string, Figure> = {};
  const warm: Record<number, number> = {};
  for (const n of COPIES) {
    const plan = copiedBasePlan(join(dir, `copies-${n}`), n);
    const cache = join(dir, `copies-${n}`, "cache");
    const args = ["plan", plan, "--out", join(dir, `copies-${n}`, "out"), "--cache-dir", cache];
    const colds: RunResult[] = [];
    const warms: RunResult[] = [];
    for (let i = 0; i < (n === 8 ? MEMORY_RUNS : 1); i++)
      colds.push(await runOnce(cli("plan, empty cache", args, emptied(cache)), stats));
    for (let i = 0; i < MEMORY_RUNS; i++) warms.push(await runOnce(cli("plan, filled cache", args), stats));
    figures[`plan${n}BasesWarmPeakRssMiB`] = statFigure(warms, mib);
    warm[n] = figures[`plan${n}BasesWarmPeakRssMiB`]!.median;
    if (n === 8) figures["plan8BasesColdPeakRssMiB"] = statFigure(colds, mib);
    line(
      `plan of ${n} × ${COPIED_BASE}: peak RSS, filled cache ${showFigure(figures[`plan${n}BasesWarmPeakRssMiB`]!, 0)} MiB`,
    );
  }
  const perBase = (a: number, b: number) => (warm[b]! - warm[a]!) / (b - a);
  figures["rssPerBaseMiB1to4"] = figureOf([perBase(1, 4)]);
  figures["rssPerBaseMiB4to8"] = figureOf([perBase(4, 8)]);
  line(
    `  plan of 8 copies, empty cache: peak RSS    ${showFigure(figures["plan8BasesColdPeakRssMiB"]!, 0)} MiB`,
  );
  line(`  growth per base: 1→4 ${perBase(1, 4).toFixed(1)} MiB, 4→8 ${perBase(4, 8).toFixed(1)} MiB`);
  return figures;
}

/** Rows of the generated schedule of the large-schedule case (COLDSOAK_BENCH_SCHEDULE_ROWS overrides it). */
export const LARGE_SCHEDULE_ROWS = 10_000;

/**
 * A plan of a generated schedule of LARGE_SCHEDULE_ROWS stays (invented aircraft, seeded) on the demo's
 * climate, filled cache: peak memory and wall time per schedule row of one run (a run of this size
 * takes minutes; its peak memory varies little from run to run).
 */
async function benchLargeSchedule(dir: string, stats: string): Promise<Record<string, Figure>> {
  const rows = Number(process.env["COLDSOAK_BENCH_SCHEDULE_ROWS"] ?? LARGE_SCHEDULE_ROWS);
  const plan = generatedSchedulePlan(join(dir, "schedule-large"), rows);
  const cache = join(dir, "schedule-large", "cache");
  const out = join(dir, "schedule-large", "out");
  // The cache is filled by the demo's climate alone: fill it with a plan of a few rows first.
  const small = generatedSchedulePlan(join(dir, "schedule-small"), 20);
  await runOnce(cli("plan, 20 rows", ["plan", small, "--out", out, "--cache-dir", cache]));
  const run = await runOnce(
    cli(`plan, ${rows} rows`, ["plan", plan, "--out", out, "--cache-dir", cache]),
    stats,
  );
  const figures: Record<string, Figure> = {
    largeSchedulePeakRssMiB: statFigure([run], mib),
    largeScheduleMsPerRow: figureOf([(1000 * run.wallS) / rows]),
  };
  line(
    `plan of a ${rows}-row schedule: peak RSS ${showFigure(figures["largeSchedulePeakRssMiB"]!, 0)} MiB, ${showFigure(figures["largeScheduleMsPerRow"]!, 1)} ms per row (wall ${run.wallS.toFixed(0)} s)`,
  );
  return figures;
}

/** Copies of a demo base in the split-report case: beyond MAX_BASES_IN_ONE_FILE, a run of about a minute. */
export const SPLIT_REPORT_COPIES = 30;

/**
 * A plan of SPLIT_REPORT_COPIES copies of a demo base (filled cache, one run), whose report is split
 * by base: peak memory, wall time, the size of the overview `report.html` and of the largest base page.
 * (README, "Tests and benchmarks", has the same figures for 100, 200 and 500 copies.)
 */
export async function benchSplitReport(dir: string, stats: string): Promise<Record<string, Figure>> {
  const n = Number(process.env["COLDSOAK_BENCH_SPLIT_COPIES"] ?? SPLIT_REPORT_COPIES);
  if (n <= MAX_BASES_IN_ONE_FILE) throw new Error(`${n} copies: the report would not be split`);
  const plan = copiedBasePlan(join(dir, `split-${n}`), n);
  const cache = join(dir, `split-${n}`, "cache");
  const out = join(dir, `split-${n}`, "out");
  // The cache holds the demo's climate whatever the copies: fill it with a plan of one copy first.
  const small = copiedBasePlan(join(dir, "split-1"), 1);
  await runOnce(cli("plan, 1 copy", ["plan", small, "--out", out, "--cache-dir", cache]));
  const run = await runOnce(
    cli(`plan, ${n} copies`, ["plan", plan, "--out", out, "--cache-dir", cache]),
    stats,
  );
  const folder = join(out, `bench-${n}`);
  const pages = readdirSync(join(folder, BASE_PAGE_DIR)).map(
    (f) => statSync(join(folder, BASE_PAGE_DIR, f)).size,
  );
  const figures: Record<string, Figure> = {
    splitReportPeakRssMiB: statFigure([run], mib),
    splitReportWallS: figureOf([run.wallS]),
    splitReportOverviewKB: figureOf([statSync(join(folder, "report.html")).size / 1000]),
    splitReportLargestPageKB: figureOf([Math.max(...pages) / 1000]),
  };
  line(
    `plan of ${n} × ${COPIED_BASE}, report split by base: peak RSS ${showFigure(figures["splitReportPeakRssMiB"]!, 0)} MiB, wall ${run.wallS.toFixed(0)} s; report.html ${showFigure(figures["splitReportOverviewKB"]!, 0)} kB, largest of ${pages.length} base pages ${showFigure(figures["splitReportLargestPageKB"]!, 0)} kB`,
  );
  return figures;
}
