/**
 * A region screen from files to results (README, "Region screen"): the climate files are listed, each
 * named by the station of its first record (read from its first bytes only), and grouped into units of
 * one station's files; the units of this shard (all without `--shard`) are screened on worker threads
 * (`screenPool.ts`), and the stations gathered, sorted by id, under the screen's settings.
 *
 * A file of several stations joins the unit of its first station, and so do its other stations. When a
 * station turns up in two units (its records spread over files whose first records name different
 * stations), those units are screened again as one, so that every station is built from all its files.
 */
import { createHash } from "node:crypto";
import { basename, resolve } from "node:path";
import { firstStation, listClimateFiles } from "../climate/index.js";
import { readInputText } from "../fsutil.js";
import { TOOL_VERSION } from "../version.js";
import { type PlanFile, parsePlanFileText } from "./planFile.js";
import { SCREEN_REFERENCE_YEAR } from "./screen.js";
import { screenUnits } from "./screenPool.js";
import type { ScreenPartial, ScreenResults, ScreenSettings, ScreenStation } from "./screenResults.js";
import type { ScreenJob, UnitResult } from "./screenUnit.js";
import { type Shard, shardOf } from "./shard.js";

/** The plan of a screen: its file, its text (hashed into the results) and the plan read from it. */
export interface ScreenPlan {
  planFile: string;
  planText: string;
  plan: PlanFile;
}

/** Reads a screen's plan file (bases, schedule and nitrogen may be absent). */
export async function readScreenPlan(planFile: string): Promise<ScreenPlan> {
  const planText = await readInputText(planFile, "the plan file");
  return { planFile, planText, plan: parsePlanFileText(planText, planFile) };
}

export interface ScreenRunOptions {
  /** Only the units of this shard; null for all. */
  shard: Shard | null;
  workers: number;
  /** Climate cache folder, or null for none. */
  cacheDir: string | null;
  /** Called after each unit (one station's files) is screened. */
  onProgress?: (done: number, total: number) => void;
}

/** What a screen run gives: the results (a partial with `--shard`) and the climate's warnings. */
export interface ScreenRun {
  results: ScreenResults | ScreenPartial;
  warnings: string[];
}

/** The files of one station, as their first records name it. */
interface Unit {
  key: string;
  files: string[];
}

/** Heads read at once while naming the files. */
const HEADS_IN_FLIGHT = 8;

/**
 * Groups the files by the station of their first record (a file whose first bytes name none is a unit
 * of its own, keyed by its name), units sorted by key, files in the order given.
 */
async function stationUnits(files: string[]): Promise<Unit[]> {
  const keys: string[] = new Array(files.length);
  let next = 0;
  await Promise.all(
    Array.from({ length: Math.min(HEADS_IN_FLIGHT, files.length) }, async () => {
      while (next < files.length) {
        const i = next++;
        keys[i] = (await firstStation(files[i]!)) ?? `file ${basename(files[i]!)}`;
      }
    }),
  );
  const byKey = new Map<string, string[]>();
  files.forEach((f, i) => {
    const list = byKey.get(keys[i]!) ?? [];
    list.push(f);
    byKey.set(keys[i]!, list);
  });
  return [...byKey.keys()].sort().map((key) => ({ key, files: byKey.get(key)! }));
}

/** The settings every partial of one screen shares. */
export function screenSettings(plan: PlanFile, planText: string, profile: string): ScreenSettings {
  return {
    format: "coldsoak screen 1",
    generatedBy: `coldsoak ${TOOL_VERSION}`,
    plan: plan.name,
    planSha256: createHash("sha256").update(planText).digest("hex"),
    profile,
    units: plan.units,
    seed: plan.seed,
    thresholds: {
      shortPct: plan.thresholds.shortStartsPct,
      outOfBandPct: plan.thresholds.outOfBandPct,
      minYears: plan.climate.minYears,
    },
    climate: {
      years: plan.climate.years ?? null,
      minYearShare: plan.climate.minYearShare,
      gapHours: plan.climate.gapHours,
    },
    referenceYear: SCREEN_REFERENCE_YEAR,
  };
}

/** Groups of units that share a station (union of their indexes), each of two units or more. */
function sharedStationGroups(results: UnitResult[]): number[][] {
  const parent = results.map((_r, i) => i);
  const root = (i: number): number => {
    while (parent[i] !== i) i = parent[i]!;
    return i;
  };
  const unitOf = new Map<string, number>();
  results.forEach((r, ui) => {
    for (const s of r.stations) {
      const seen = unitOf.get(s.station.id);
      if (seen === undefined) unitOf.set(s.station.id, ui);
      else parent[root(ui)] = root(seen);
    }
  });
  const groups = new Map<number, number[]>();
  results.forEach((_r, ui) => {
    const g = groups.get(root(ui)) ?? [];
    g.push(ui);
    groups.set(root(ui), g);
  });
  return [...groups.values()].filter((g) => g.length > 1);
}

/** Screens the units, then again as one each group of units that share a station. */
async function screenAll(
  job: ScreenJob,
  units: Unit[],
  allFiles: string[],
  opts: ScreenRunOptions,
): Promise<UnitResult[]> {
  const results = await screenUnits(
    job,
    units.map((u) => u.files),
    opts.workers,
    (done) => opts.onProgress?.(done, units.length),
  );
  const groups = sharedStationGroups(results);
  if (groups.length === 0) return results;
  const order = new Map(allFiles.map((f, i) => [f, i]));
  const merged = groups.map((g) =>
    g.flatMap((ui) => units[ui]!.files).sort((a, b) => order.get(a)! - order.get(b)!),
  );
  const again = await screenUnits(job, merged, opts.workers);
  const inGroup = new Set(groups.flat());
  return [...results.filter((_r, ui) => !inGroup.has(ui)), ...again];
}

/**
 * Screens every station in the climate files (those of one shard with `opts.shard`) against profile
 * `profile` of the plan.
 */
export async function runScreen(
  input: ScreenPlan,
  profile: string,
  paths: string[],
  opts: ScreenRunOptions,
): Promise<ScreenRun> {
  const { plan, planFile, planText } = input;
  const files = await listClimateFiles(paths.map((p) => resolve(p)));
  const all = await stationUnits(files);
  const shard = opts.shard;
  const units = shard === null ? all : all.filter((u) => shardOf(u.key, shard.count) === shard.index);
  const job: ScreenJob = { planText, planFile, profile, cacheDir: opts.cacheDir };
  const results = await screenAll(job, units, files, opts);
  const stations: ScreenStation[] = results
    .flatMap((r) => r.stations)
    .sort((a, b) => (a.station.id < b.station.id ? -1 : a.station.id > b.station.id ? 1 : 0));
  const settings = screenSettings(plan, planText, profile);
  const warnings = [...new Set(results.flatMap((r) => r.warnings))];
  return {
    results: shard === null ? { ...settings, stations } : { ...settings, shard: { ...shard }, stations },
    warnings,
  };
}
