/**
 * Reading and building: climate files parsed (readers in `source.ts`), then per station quality
 * control, the second-site rule, the hourly grid and gap filling. Loaded only when the cache cannot
 * serve a request (`load.ts`).
 */
import { availableParallelism } from "node:os";
import { inputError } from "../errors.js";
import { fillGapsInPlace, hourlyFromObservations } from "./hourly.js";
import { timeZoneFor } from "./localTime.js";
import { readFilesInWorkers, workersAvailable } from "./pool.js";
import { partsOfFile, qualityControl, type StationPart } from "./qc.js";
import { MISSING_ELEV, type ParsedFile } from "./records.js";
import { type ReadOptions, readClimateFile } from "./source.js";
import type { HistoryEntry } from "./stationHistory.js";
import type { StationClimate } from "./types.js";

/**
 * Whole files go to worker threads only on machines with at least this many cores and for at least
 * MIN_FILES_FOR_WORKERS files. On fewer cores the main thread parses while libuv's thread pool
 * decompresses the next files: both cores are busy without the start-up, module loading and compiler
 * warm-up a worker thread pays (about as much CPU as parsing twenty station-years).
 */
const MIN_CORES_FOR_WORKERS = 4;
const MIN_FILES_FOR_WORKERS = 4;

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
