/**
 * From files to results: reads the plan's climate files (through the climate cache), assembles each
 * base's stations in priority order, and runs the engine.
 */
import { existsSync } from "node:fs";
import { resolve } from "node:path";
import {
  climateOptions,
  loadClimateSelection,
  mergeByPriority,
  type StationClimate,
} from "../climate/index.js";
import { inputError } from "../errors.js";
import { standardAtmospherePa } from "../physics/atmosphere.js";
import type { BaseClimate } from "./engine.js";
import type { Plan } from "./planFile.js";
import type { AtmosphereSource } from "./samples.js";

export interface ClimateLoadOptions {
  /** Cache folder; null disables; undefined: the plan's `climate.cacheDir` or the climate default. */
  cacheDir?: string | null;
  onProgress?: (done: number, total: number) => void;
  onWarning?: (message: string) => void;
}

/**
 * Local atmospheric pressure of a station (Pa absolute) and where it comes from: its mean reported
 * station pressure, else the ISO 2533 standard atmosphere at its elevation (docs/methods.md §1).
 */
export function stationAtmosphere(s: StationClimate): { atmPa: number; atmSource: AtmosphereSource } {
  if (s.meanStationPressureHpa !== null && s.meanStationPressureHpa > 300)
    return { atmPa: s.meanStationPressureHpa * 100, atmSource: "station pressure" };
  const elevationM = Number.isFinite(s.meta.elevationM) ? s.meta.elevationM : 0;
  return { atmPa: standardAtmospherePa(elevationM), atmSource: "standard atmosphere" };
}

/** Loads the climate of every base of the plan. Errors name the plan file line of the missing item. */
export async function loadPlanClimate(
  plan: Plan,
  opts: ClimateLoadOptions = {},
): Promise<Map<string, BaseClimate>> {
  const paths = plan.climate.paths.map((p, i) => {
    const full = resolve(plan.dir, p);
    if (!existsSync(full)) {
      throw inputError(
        plan.file,
        plan.lineOf(["climate", "paths", i]),
        `climate.paths[${i}]`,
        `"${p}" does not exist (relative to the plan file); expected a climate file or folder`,
      );
    }
    return full;
  });
  const cacheDir =
    opts.cacheDir !== undefined
      ? opts.cacheDir
      : plan.climate.cacheDir !== undefined
        ? resolve(plan.dir, plan.climate.cacheDir)
        : undefined;
  // Only the stations the bases name are built: the others in the files are skipped.
  const { stations, skipped } = await loadClimateSelection(
    paths,
    climateOptions({
      stations: plan.bases.flatMap((b) => b.stations),
      gapHours: plan.climate.gapHours,
      ...(cacheDir !== undefined ? { cacheDir } : {}),
      ...(plan.climate.stationHistory !== undefined
        ? { stationHistoryCsv: resolve(plan.dir, plan.climate.stationHistory) }
        : {}),
      ...(opts.onProgress ? { onProgress: opts.onProgress } : {}),
      ...(opts.onWarning ? { onWarning: opts.onWarning } : {}),
    }),
  );
  const byId = new Map(stations.map((s) => [s.meta.id, s]));
  const inData = [...byId.keys(), ...skipped].sort();
  const out = new Map<string, BaseClimate>();
  plan.bases.forEach((base, bi) => {
    const list = base.stations.map((id, si) => {
      const s = byId.get(id);
      if (s === undefined) {
        const found = inData.slice(0, 8).join(", ");
        throw inputError(
          plan.file,
          plan.lineOf(["bases", bi, "stations", si]),
          `bases[${bi}].stations[${si}]`,
          `station "${id}" is not in the climate data (found: ${found || "none"}${inData.length > 8 ? ", …" : ""})`,
        );
      }
      return s;
    });
    out.set(base.name, baseClimate(list));
  });
  return out;
}

/**
 * The climate of a base from its stations in priority order: the series merged by priority, the
 * primary station's zone and atmosphere.
 */
export function baseClimate(stations: StationClimate[]): BaseClimate {
  const primary = stations[0]!;
  return {
    stations,
    series: mergeByPriority(stations),
    timeZone: primary.meta.timeZone,
    ...stationAtmosphere(primary),
  };
}
