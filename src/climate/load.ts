/**
 * The whole climate pipeline: files and folders in, one cleaned hourly series per station out
 * (read → quality control → second-site rule → hourly grid → duplicates across files → gap filling),
 * through the cache.
 */
import { readdir, realpath, stat } from "node:fs/promises";
import { availableParallelism } from "node:os";
import { basename, join, resolve } from "node:path";
import { inputError } from "../errors.js";
import { type FileKind, readFailure, specialFileKind } from "../fsutil.js";
import { cacheKey, fileHash, readCache, writeCache } from "./cache.js";
import { fillGapsInPlace, hourlyFromObservations } from "./hourly.js";
import { timeZoneFor } from "./localTime.js";
import { readFilesInWorkers, workersAvailable } from "./pool.js";
import { partsOfFile, qualityControl, type StationPart } from "./qc.js";
import { MISSING_ELEV, type ParsedFile } from "./records.js";
import { type ReadOptions, readClimateFile } from "./source.js";
import type { HistoryEntry } from "./stationHistory.js";
import {
  type ClimateOptions,
  DEFAULT_CACHE_DIR,
  DEFAULT_GAP_HOURS,
  DROP_REASONS,
  type StationClimate,
} from "./types.js";

/**
 * Whole files go to worker threads only on machines with at least this many cores and for at least
 * MIN_FILES_FOR_WORKERS files. On fewer cores the main thread parses while libuv's thread pool
 * decompresses the next files: both cores are busy without the start-up, module loading and compiler
 * warm-up a worker thread pays (about as much CPU as parsing twenty station-years).
 */
const MIN_CORES_FOR_WORKERS = 4;
const MIN_FILES_FOR_WORKERS = 4;

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

/**
 * Reads the files, results in the order given. Several files are in flight at once (one more than the
 * cores), so their decompression on libuv's thread pool runs ahead while this thread parses; on
 * machines with many cores, whole files go to worker threads instead (when the compiled worker exists).
 */
export async function readClimateFiles(
  files: string[],
  options: ReadOptions,
  onProgress?: (done: number, total: number) => void,
): Promise<ParsedFile[]> {
  const cores = availableParallelism();
  if (cores >= MIN_CORES_FOR_WORKERS && files.length >= MIN_FILES_FOR_WORKERS && workersAvailable())
    return readFilesInWorkers(files, options, cores, (d) => onProgress?.(d, files.length));
  const out: ParsedFile[] = new Array(files.length);
  // The first failing file in the given order is the one reported, as if read one after another.
  const failures: { index: number; err: unknown }[] = [];
  let next = 0;
  let done = 0;
  const reader = async () => {
    while (next < files.length && failures.length === 0) {
      const i = next++;
      try {
        out[i] = await readClimateFile(files[i]!, options);
        onProgress?.(++done, files.length);
      } catch (err) {
        failures.push({ index: i, err });
      }
    }
  };
  await Promise.all(Array.from({ length: Math.min(files.length, cores + 1) }, reader));
  if (failures.length > 0) throw failures.reduce((a, b) => (b.index < a.index ? b : a)).err;
  return out;
}

/** The stations built from a set of files, and the ids of the stations the files hold but were not asked for. */
export interface ClimateSelection {
  stations: StationClimate[];
  skipped: string[];
}

/**
 * Quality control, hourly grid and gap filling for every station found in the parsed files
 * (files in reading order; a station's records from all files are taken together), sorted by id.
 */
export function buildStations(
  files: ParsedFile[],
  gapHours: number,
  history: Map<string, HistoryEntry> | null = null,
): StationClimate[] {
  return buildSelection(files, gapHours, history, null).stations;
}

/** buildStations for the stations in `wanted` only (all when null): the others, read, are given no quality control or series. */
export function buildSelection(
  files: ParsedFile[],
  gapHours: number,
  history: Map<string, HistoryEntry> | null,
  wanted: ReadonlySet<string> | null,
): ClimateSelection {
  const typeCodes = new Map<string, number>();
  const typeCode = (t: string) => {
    const known = typeCodes.get(t);
    if (known !== undefined) return known;
    const c = typeCodes.size % 256;
    typeCodes.set(t, c);
    return c;
  };
  const parts = new Map<string, StationPart[]>();
  for (const file of files)
    for (const part of partsOfFile(file)) {
      const id = file.stations[part.station]!;
      const list = parts.get(id) ?? [];
      list.push(part);
      parts.set(id, list);
    }
  const ids = [...parts.keys()].sort();
  return {
    stations: ids
      .filter((id) => wanted === null || wanted.has(id))
      .map((id) => buildStation(id, parts.get(id)!, typeCode, gapHours, history?.get(id) ?? null)),
    skipped: wanted === null ? [] : ids.filter((id) => !wanted.has(id)),
  };
}

/** One station from its parts in every file: quality control, position, hourly grid, gap filling. */
function buildStation(
  id: string,
  stationParts: StationPart[],
  typeCode: (type: string) => number,
  gapHours: number,
  hist: HistoryEntry | null,
): StationClimate {
  const r = qualityControl(stationParts, typeCode);
  const where = stationParts[0]!.file.path;
  let lat = r.position ? r.position.latMilli / 1000 : (hist?.lat ?? null);
  let lon = r.position ? r.position.lonMilli / 1000 : (hist?.lon ?? null);
  let elevationM =
    r.position && r.position.elevM !== MISSING_ELEV ? r.position.elevM : (hist?.elevationM ?? null);
  if (lat === null || lon === null)
    throw inputError(
      where,
      undefined,
      "station",
      r.qc.dropped.malformed === r.qc.read
        ? `no coordinates for station ${id}: none of its ${r.qc.read} record(s) is readable (e.g. ${r.malformedExamples[0] ?? "—"}); give a station-history CSV that lists it`
        : `no coordinates for station ${id}: none of its records gives a position (ISD-Lite records never do); give a station-history CSV that lists it`,
    );
  if (elevationM === null)
    throw inputError(
      where,
      undefined,
      "elevation",
      `no elevation for station ${id}: none of its records gives one; give a station-history CSV that lists it`,
    );
  lat = Number(lat.toFixed(3));
  lon = Number(lon.toFixed(3));
  elevationM = Number(elevationM);
  const grid = hourlyFromObservations(r.keptTimeMin, r.keptTempTenths, r.keptSpecial);
  fillGapsInPlace(grid, gapHours);
  return {
    meta: {
      id,
      name: r.name ?? hist?.name ?? null,
      lat,
      lon,
      elevationM,
      timeZone: timeZoneFor(lat, lon),
      callLetters: r.callLetters ?? hist?.icao ?? null,
    },
    series: grid,
    qc: r.qc,
    extremes: r.extremes,
    meanStationPressureHpa: r.meanStationPressureHpa,
    malformedExamples: r.malformedExamples,
  };
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
    const parsed = await readClimateFiles(
      files,
      { stationIdOverride: options.stationIdOverride },
      options.onProgress,
    );
    selection = buildSelection(parsed, options.gapHours, history, wanted);
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
