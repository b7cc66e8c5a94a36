/**
 * One unit of a screen's work: a set of climate files (those of one station, as their first records
 * name it) read through the climate pipeline, then every station they hold screened (`screen.ts`).
 * The same code runs on a worker thread (`screenWorker.ts`) and, where no compiled worker exists, on
 * this thread; what it needs travels as a plain `ScreenJob` (the plan as text, not as an object).
 */
import { resolve } from "node:path";
import { climateOptions, loadClimateSelection } from "../climate/index.js";
import { type PlanFile, parsePlanFileText } from "./planFile.js";
import { type ScreenExtras, screenStation } from "./screen.js";
import { screenExtras } from "./screenExtras.js";
import type { ScreenStation } from "./screenResults.js";

/** What every unit of one screen shares, as plain data (posted to the workers once). */
export interface ScreenJob {
  planText: string;
  planFile: string;
  profile: string;
  /** Climate cache folder, or null for none. */
  cacheDir: string | null;
}

/** A job made ready to run units: the plan parsed and the extras built once. */
export interface ScreenContext {
  job: ScreenJob;
  plan: PlanFile;
  extras: ScreenExtras;
}

export function screenContext(job: ScreenJob): ScreenContext {
  const plan = parsePlanFileText(job.planText, job.planFile);
  return { job, plan, extras: screenExtras(plan, job.profile) };
}

/** What a unit gives: its stations screened (sorted by id) and the climate's warnings. */
export interface UnitResult {
  stations: ScreenStation[];
  warnings: string[];
}

/** Reads the unit's files (the plan's gap length and station history) and screens every station in them. */
export async function screenFiles(ctx: ScreenContext, files: string[]): Promise<UnitResult> {
  const { plan, job } = ctx;
  const warnings: string[] = [];
  const { stations } = await loadClimateSelection(
    files,
    climateOptions({
      gapHours: plan.climate.gapHours,
      cacheDir: job.cacheDir,
      ...(plan.climate.stationHistory !== undefined
        ? { stationHistoryCsv: resolve(plan.dir, plan.climate.stationHistory) }
        : {}),
      onWarning: (w) => warnings.push(w),
    }),
  );
  return { stations: stations.map((s) => screenStation(plan, job.profile, s, ctx.extras)), warnings };
}
