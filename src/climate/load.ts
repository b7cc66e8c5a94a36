/**
 * The whole climate pipeline: files and folders in, one cleaned hourly series per station out
 * (read → quality control → second-site rule → hourly grid → duplicates across files → gap filling),
 * through the cache.
 */
import { readdir, realpath, stat } from "node:fs/promises";
import { basename, join, resolve } from "node:path";
import { inputError } from "../errors.js";
import { type FileKind, readFailure, specialFileKind } from "../fsutil.js";
import type { ClimateSelection } from "./build.js";
import { cacheKey, fileHash, readCache, writeCache } from "./cache.js";
import {
  type ClimateOptions,
  DEFAULT_CACHE_DIR,
  DEFAULT_GAP_HOURS,
  DROP_REASONS,
  type StationClimate,
} from "./types.js";

/**
 * Every climate file under the given files and folders, sorted: folders are read recursively (hidden
 * files and folders skipped) and symbolic links to files followed; a file reached twice (through a
 * link, say) is listed once, under the first of its names. Named pipes, devices and sockets are
 * refused, given directly or found in a folder.
 */
export async function listClimateFiles(paths: string[]): Promise<string[]> {
  const found = new Set<string>();
  for (const p of paths) {
    let st: Awaited<ReturnType<typeof stat>>;
    try {
      st = await stat(p);
    } catch {
      throw inputError(p, undefined, undefined, "no such file or folder; expected climate files or folders");
    }
    if (st.isDirectory()) {
      const before = found.size;
      const entries = await readdir(p, { recursive: true, withFileTypes: true });
      for (const e of entries) {
        const full = join(e.parentPath ?? (e as unknown as { path: string }).path, e.name);
        const rel = full.slice(p.length);
        if (e.isDirectory() || rel.split(/[\\/]/).some((part) => part.startsWith("."))) continue;
        const target = e.isSymbolicLink() ? await stat(full).catch(() => null) : e;
        if (target === null || target.isDirectory()) continue; // a dangling link, or a link to a folder
        refuseSpecialFile(full, target);
        found.add(resolve(full));
      }
      if (found.size === before)
        throw inputError(
          p,
          undefined,
          undefined,
          "folder holds no climate files; expected NOAA ISD files (full, ISD-Lite or CSV layout, plain or .gz) in it or its sub-folders",
        );
    } else {
      refuseSpecialFile(p, st);
      found.add(resolve(p));
    }
  }
  const byTarget = new Map<string, string>();
  for (const f of [...found].sort((a, b) => (a < b ? -1 : a > b ? 1 : 0))) {
    const target = await realpath(f);
    if (!byTarget.has(target)) byTarget.set(target, f);
  }
  return [...byTarget.values()];
}

/** Throws an input error for a named pipe, device or socket (reading one would block or never end). */
function refuseSpecialFile(path: string, st: FileKind): void {
  const why = specialFileKind(st);
  if (why !== null)
    throw inputError(path, undefined, undefined, `is ${why}, not a regular file; expected a climate file`);
}

/** Options with the defaults filled in. */
export function climateOptions(partial: Partial<ClimateOptions> = {}): ClimateOptions {
  return { gapHours: DEFAULT_GAP_HOURS, cacheDir: DEFAULT_CACHE_DIR, ...partial };
}

/**
 * Reads files and folders (recursively), detects each file's layout from its content, applies quality
 * control, the second-site rule, the hourly grid, duplicates across files and gap filling; groups by
 * station id (all years together), sorted by id. Served from the cache when the same files are read
 * with the same options again.
 */
export async function loadClimate(paths: string[], options: ClimateOptions): Promise<StationClimate[]> {
  return (await loadClimateSelection(paths, options)).stations;
}

/**
 * loadClimate, also saying which stations the files hold beyond those asked for (`options.stations`).
 * A station asked for that no record of it is kept is warned of (`options.onWarning`); so is a cache
 * that cannot be written, once, and the run carries on without it.
 */
export async function loadClimateSelection(
  paths: string[],
  options: ClimateOptions,
): Promise<ClimateSelection> {
  if (!Number.isInteger(options.gapHours) || options.gapHours < 0 || options.gapHours > 48)
    throw inputError(
      "options",
      undefined,
      "gapHours",
      `expected a whole number of hours 0–48, got ${options.gapHours}`,
    );
  const files = await listClimateFiles(paths);
  const historyPath = options.stationHistoryCsv;
  const wanted = options.stations === undefined ? null : new Set(options.stations);
  const key =
    options.cacheDir === null
      ? null
      : cacheKey({
          gapHours: options.gapHours,
          stationIdOverride: options.stationIdOverride ?? null,
          stations: wanted === null ? null : [...wanted].sort(),
          history: historyPath ? await fileHash(historyPath).catch(() => "unreadable") : null,
          files: await Promise.all(
            files.map(async (f) => ({
              name: basename(f),
              sha256: await fileHash(f).catch((err: unknown) => {
                throw inputError(
                  f,
                  undefined,
                  undefined,
                  `cannot read the climate file: ${readFailure(err)}`,
                );
              }),
            })),
          ),
        });
  let selection = options.cacheDir !== null && key !== null ? await readCache(options.cacheDir, key) : null;
  if (selection !== null) options.onProgress?.(files.length, files.length);
  else {
    // The station list's CSV reader is loaded only when a station list is given.
    const history = historyPath
      ? await (await import("./stationHistory.js")).readStationHistory(historyPath)
      : null;
    // The readers and the building steps are loaded only now: a request the cache serves needs neither.
    const { readClimateFiles, buildSelection } = await import("./build.js");
    const parsed = await readClimateFiles(
      files,
      { stationIdOverride: options.stationIdOverride },
      options.onProgress,
    );
    selection = buildSelection(parsed, options.gapHours, history, wanted);
    if (options.summarize) {
      const { monthlyClimate } = await import("./climatology.js");
      for (const s of selection.stations) s.months = monthlyClimate(s.series, s.meta.timeZone);
    }
    if (options.cacheDir !== null && key !== null) {
      const failure = await writeCache(options.cacheDir, key, selection).catch((err: unknown) => err);
      if (failure !== undefined) options.onWarning?.(cacheWriteWarning(options.cacheDir, failure));
    }
  }
  for (const s of selection.stations) if (s.qc.kept === 0) options.onWarning?.(noneKeptWarning(s));
  return selection;
}

function cacheWriteWarning(cacheDir: string, err: unknown): string {
  const e = err as NodeJS.ErrnoException;
  const why =
    e.code === "EROFS" || e.code === "EACCES" || e.code === "EPERM"
      ? "not writable"
      : e.code === "ENOSPC" || e.code === "EDQUOT"
        ? "no space left"
        : e.code === "ENOTDIR" || e.code === "EEXIST"
          ? "a file stands where a folder should"
          : e.code === "EISDIR"
            ? "a folder stands where a file should"
            : (e.code ?? e.message);
  return `climate cache ${cacheDir} cannot be written (${why}); carrying on without it`;
}

function noneKeptWarning(s: StationClimate): string {
  const reasons = DROP_REASONS.filter((r) => s.qc.dropped[r] > 0)
    .map((r) => `${r} ${s.qc.dropped[r]}`)
    .join(", ");
  return `station ${s.meta.id}: none of its ${s.qc.read} record(s) is kept (${reasons}); its position comes from all its records`;
}
