/**
 * `coldsoak plan <plan.yaml> [--schedule file] [--out dir] [--json]`: runs the planning engine and
 * writes `out/<plan name>/` (results.json, one CSV per table, report.html), made visible in one step
 * only after every file is written (see outputFolder.ts).
 */
import { mkdir, open, writeFile } from "node:fs/promises";
import { dirname, join, resolve } from "node:path";
import { inputError } from "../errors.js";
import { resultsJson, resultsJsonPieces, resultTables, toCsv } from "../output/tables.js";
import { runPlan } from "../plan/engine.js";
import { loadPlan, type Plan } from "../plan/planFile.js";
import type { Results } from "../plan/results.js";
import { loadPlanClimate } from "../plan/run.js";
import { loadSchedule } from "../plan/schedule.js";
import { whatIfNames, withWhatIf } from "../plan/whatIfRun.js";
import { startChartWorkers, writePdf } from "../report/index.js";
import { writeReport } from "../report/pages.js";
import { isSplit, splitPdfNote } from "../report/split.js";
import { formatDisplay, pct, showWithUnit, unitSystem } from "../units/index.js";
import { writeOutputFolder } from "./outputFolder.js";
import { loadBars, progressBar } from "./progress.js";
import { noteRunStat } from "./runStats.js";

export interface PlanCliOptions {
  schedule?: string;
  out: string;
  json?: boolean;
  cache: boolean;
  cacheDir?: string;
  pdf?: boolean;
  whatIf?: boolean;
}

/**
 * Schedules of up to this many stays start the chart workers before the simulation (the demo's wall
 * time gains their loading); larger ones after it, so that the workers' memory (about 35 MiB on a
 * 2-core machine) does not add to the simulation's peak.
 */
export const EARLY_CHART_WORKERS_MAX_STAYS = 1000;

const MONTHS = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"];

/** Short terminal summary: the bases and months that need action. */
export function summaryText(r: Results): string {
  const lines: string[] = [
    `Plan "${r.plan}": ${r.bases.length} base(s), climate years ${r.climateYears.join(", ") || "none"}`,
  ];
  const u = unitSystem(r.units);
  for (const b of r.bases) {
    const items: string[] = [];
    for (const m of b.months) {
      if (m.preflights === 0) continue;
      const oob = (m.belowBandPct ?? 0) + (m.aboveBandPct ?? 0);
      const advice = b.advice.find((a) => a.month === m.month);
      const parts: string[] = [];
      if (oob > 0) parts.push(`${pct(oob)} % of preflights out of band`);
      if (advice?.fitColdStartOption) {
        parts.push(
          `${pct(advice.shortPctOne)} % of starts short → fit the cold-start option to ${advice.aircraft.join(", ")} (${pct(advice.shortPctTwo)} % with it)`,
        );
      }
      if (parts.length > 0) items.push(`    ${MONTHS[m.month - 1]}: ${parts.join("; ")}`);
    }
    if (b.yearsUsed.length === 0) {
      lines.push(
        `  ${b.name}: no usable climate years, so no results (see the warnings and the data coverage)`,
      );
      continue;
    }
    const cold = showWithUnit(u.temp, b.coldestMorningC);
    const cold10 = showWithUnit(u.temp, b.coldest1in10C);
    const n2 = b.nitrogen;
    const stockOut =
      n2.stock.stockOutP90 === null ? "" : `; stock runs out at P90 on ${n2.stock.stockOutP90}`;
    lines.push(
      `  ${b.name}: coldest preflight ${cold} (1-in-10-year ${cold10}); nitrogen P95 ${showWithUnit(u.mass, n2.kgP95)}, ${formatDisplay(n2.cylindersP95, 0)} cylinder(s), ${formatDisplay(n2.cartsP95, 0)} cart(s)${stockOut}`,
    );
    lines.push(...(items.length > 0 ? items : ["    no month needs action"]));
  }
  const f = r.nitrogenFleet;
  lines.push(
    `  Fleet nitrogen: P90 ${showWithUnit(u.mass, f.kgP90)} drawn (quantile of the fleet total); ${formatDisplay(f.cylindersP90, 0)} cylinder(s), ${formatDisplay(f.cartsP90, 0)} cart(s) at P90 (sum of the bases' own counts)`,
  );
  return lines.join("\n");
}

/**
 * The climate cache of a run: none with --no-cache; else --cache-dir, else the plan's
 * `climate.cacheDir` (undefined: the loader takes it from the plan), else `<out>/.cache/climate`,
 * a name no plan folder can take (plan names start with a letter or digit).
 */
function cacheDirOf(plan: Plan, opts: PlanCliOptions): string | null | undefined {
  if (!opts.cache) return null;
  if (opts.cacheDir !== undefined) return opts.cacheDir;
  return plan.climate.cacheDir !== undefined ? undefined : join(resolve(opts.out), ".cache", "climate");
}

/** What a plan run gives: the visible output folder, the results, warnings beyond the results' own, the PDF step's note. */
export interface PlanRun {
  folder: string;
  results: Results;
  climateWarnings: string[];
  pdf: { ok: boolean; message: string } | null;
}

/** Runs a plan file end to end; returns the output folder and the results. */
export async function runPlanCommand(planFile: string, opts: PlanCliOptions): Promise<PlanRun> {
  const plan: Plan = await loadPlan(planFile);
  const scheduleFile =
    opts.schedule !== undefined
      ? opts.schedule
      : plan.schedule !== undefined
        ? resolve(plan.dir, plan.schedule)
        : undefined;
  if (scheduleFile === undefined) {
    throw inputError(
      planFile,
      1,
      "schedule",
      "no schedule; expected a `schedule:` key in the plan or the --schedule option",
    );
  }
  const stays = await loadSchedule(
    scheduleFile,
    plan.bases.map((b) => b.name),
    plan.profiles.map((p) => p.name),
  );
  // The chart workers load the chart library while the climate is read and the plan simulated; the
  // simulation of a large schedule is long and needs the memory more, so there they start after it.
  const earlyCharts = stays.length <= EARLY_CHART_WORKERS_MAX_STAYS;
  if (earlyCharts) startChartWorkers();
  const bars = await loadBars();
  const files = progressBar(bars, "climate files");
  const climateWarnings: string[] = [];
  const cacheDir = cacheDirOf(plan, opts);
  const climate = await loadPlanClimate(plan, {
    ...(cacheDir !== undefined ? { cacheDir } : {}),
    onProgress: files.update,
    onWarning: (w) => climateWarnings.push(w),
  });
  files.stop();
  const sims = progressBar(bars, "stay-years");
  const { results: plain, stats } = runPlan(plan, stays, climate, { onProgress: sims.update });
  noteRunStat("simulationS", stats.simulationS);
  noteRunStat("accumulatorHours", stats.accumulatorHours);
  sims.stop();
  if (!earlyCharts) startChartWorkers();
  const variants = progressBar(bars, "what-if runs");
  const names = whatIfNames(plan, opts.whatIf === true);
  const results = await withWhatIf(plan, stays, climate, plain, names, { onProgress: variants.update });
  variants.stop();
  const tables = resultTables(results);
  const reported: Results = { ...results, files: ["results.json", ...tables.map((t) => `${t.name}.csv`)] };
  let pdf: PlanRun["pdf"] = null;
  const folder = await writeOutputFolder(resolve(opts.out), plan.name, new Map(), {
    // Every file is written inside the new folder before it is made visible: results.json in pieces,
    // then each CSV and each page of the report made, written and dropped in turn (memory holds one
    // of them at a time besides the results), then the PDF.
    beforeSwap: async (dir: string) => {
      const write = async (name: string, text: string) => {
        await mkdir(dirname(join(dir, name)), { recursive: true });
        await writeFile(join(dir, name), text);
      };
      await writeTextPieces(join(dir, "results.json"), resultsJsonPieces(results));
      for (const t of tables) await write(`${t.name}.csv`, toCsv(t));
      await writeReport(reported, write);
      if (opts.pdf) pdf = await writePdf(join(dir, "report.html"), join(dir, "report.pdf"));
    },
  });
  return { folder, results, climateWarnings, pdf: pdfNoted(pdf, results, folder) };
}

/** Writes a text given in pieces to a file, about a mebibyte at a time (never the whole text in memory). */
export async function writeTextPieces(file: string, pieces: Iterable<string>): Promise<void> {
  const handle = await open(file, "w");
  try {
    let pending: string[] = [];
    let length = 0;
    for (const piece of pieces) {
      pending.push(piece);
      length += piece.length;
      if (length >= 1 << 20) {
        await handle.write(pending.join(""));
        pending = [];
        length = 0;
      }
    }
    await handle.write(pending.join(""));
  } finally {
    await handle.close();
  }
}

/** The PDF step's note; of a split report it also says that the PDF holds the overview alone. */
function pdfNoted(pdf: PlanRun["pdf"], results: Results, folder: string): PlanRun["pdf"] {
  if (pdf === null || !pdf.ok || !isSplit(results.bases.length)) return pdf;
  return { ok: true, message: `${pdf.message}; ${splitPdfNote(results.bases.length, folder)}` };
}

/** `coldsoak plan` once its options are parsed: runs the plan, prints the summary (or results.json) and the report's path. */
export async function planAction(planFile: string, opts: PlanCliOptions): Promise<void> {
  const { folder, results, climateWarnings, pdf } = await runPlanCommand(planFile, opts);
  for (const w of [...climateWarnings, ...results.warnings]) process.stderr.write(`warning: ${w}\n`);
  if (pdf !== null) process.stderr.write(`${pdf.ok ? "pdf" : "pdf skipped"}: ${pdf.message}\n`);
  if (opts.json) {
    process.stdout.write(resultsJson(results));
  } else {
    process.stdout.write(`${summaryText(results)}\n`);
    process.stdout.write(`${join(folder, "report.html")}\n`);
  }
}
