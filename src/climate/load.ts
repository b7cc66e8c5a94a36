/**
 * The whole climate pipeline: files and folders in, one cleaned hourly series per station out
 * (read → quality control → second-site rule → hourly grid → duplicates across files → gap filling),
 * through the cache.
 */
import { readdir, stat } from "node:fs/promises";
import { basename, join, resolve } from "node:path";
import { inputError } from "../errors.js";
import { cacheKey, fileHash, readCache, writeCache } from "./cache.js";
import { fillGapsInPlace, hourlyFromObservations } from "./hourly.js";
import { timeZoneFor } from "./localTime.js";
import { readFilesInWorkers, workersAvailable } from "./pool.js";
import { partsOfFile, qualityControl, type StationPart } from "./qc.js";
import { MISSING_ELEV, type ParsedFile } from "./records.js";
import { type ReadOptions, readClimateFile } from "./source.js";
import { type HistoryEntry, readStationHistory } from "./stationHistory.js";
import { type ClimateOptions, DEFAULT_CACHE_DIR, DEFAULT_GAP_HOURS, type StationClimate } from "./types.js";

/** Below this many files the worker threads cost more than they save. */
const MIN_FILES_FOR_WORKERS = 4;

/** Every regular file under the given files and folders (recursively, hidden files skipped), sorted. */
export async function listClimateFiles(paths: string[]): Promise<string[]> {
  const out = new Set<string>();
  for (const p of paths) {
    let st: Awaited<ReturnType<typeof stat>>;
    try {
      st = await stat(p);
    } catch {
      throw inputError(p, undefined, undefined, "no such file or folder; expected climate files or folders");
    }
    if (st.isDirectory()) {
      const before = out.size;
      const entries = await readdir(p, { recursive: true, withFileTypes: true });
      for (const e of entries) {
        const full = join(e.parentPath ?? (e as unknown as { path: string }).path, e.name);
        const rel = full.slice(p.length);
        if (!e.isFile() || rel.split(/[\\/]/).some((part) => part.startsWith("."))) continue;
        out.add(resolve(full));
      }
      if (out.size === before)
        throw inputError(
          p,
          undefined,
          undefined,
          "folder holds no climate files; expected NOAA ISD files (full, ISD-Lite or CSV layout, plain or .gz) in it or its sub-folders",
        );
    } else out.add(resolve(p));
  }
  return [...out].sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
}

/** Reads the files (on worker threads when there are several and the compiled worker exists). */
export async function readClimateFiles(
  files: string[],
  options: ReadOptions,
  onProgress?: (done: number, total: number) => void,
): Promise<ParsedFile[]> {
  if (files.length >= MIN_FILES_FOR_WORKERS && workersAvailable())
    return readFilesInWorkers(files, options, undefined, (d) => onProgress?.(d, files.length));
  const out: ParsedFile[] = [];
  for (const f of files) {
    out.push(await readClimateFile(f, options));
    onProgress?.(out.length, files.length);
  }
  return out;
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
  return ids.map((id) => {
    const stationParts = parts.get(id)!;
    const r = qualityControl(stationParts, typeCode);
    const hist = history?.get(id) ?? null;
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
        `no coordinates for station ${id}: its records carry none (ISD-Lite does not); give a station-history CSV that lists it`,
      );
    if (elevationM === null)
      throw inputError(
        where,
        undefined,
        "elevation",
        `no elevation for station ${id}; give a station-history CSV`,
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
  });
}

/** Options with the documented defaults filled in. */
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
  if (!Number.isInteger(options.gapHours) || options.gapHours < 0 || options.gapHours > 48)
    throw inputError(
      "options",
      undefined,
      "gapHours",
      `expected a whole number of hours 0–48, got ${options.gapHours}`,
    );
  const files = await listClimateFiles(paths);
  const historyPath = options.stationHistoryCsv;
  const key =
    options.cacheDir === null
      ? null
      : cacheKey({
          gapHours: options.gapHours,
          stationIdOverride: options.stationIdOverride ?? null,
          history: historyPath ? await fileHash(historyPath).catch(() => "unreadable") : null,
          files: await Promise.all(
            files.map(async (f) => ({ name: basename(f), sha256: await fileHash(f) })),
          ),
        });
  if (options.cacheDir !== null && key !== null) {
    const cached = await readCache(options.cacheDir, key);
    if (cached !== null) {
      options.onProgress?.(files.length, files.length);
      return cached;
    }
  }
  const history = historyPath ? await readStationHistory(historyPath) : null;
  const parsed = await readClimateFiles(
    files,
    { stationIdOverride: options.stationIdOverride },
    options.onProgress,
  );
  const stations = buildStations(parsed, options.gapHours, history);
  if (options.cacheDir !== null && key !== null) await writeCache(options.cacheDir, key, stations);
  return stations;
}
