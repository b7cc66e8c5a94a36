/**
 * Quality control of one station's records, across all the files that hold it (docs/methods.md, "Quality control"):
 * every record lands in exactly one count, tested in the order malformed, summary, otherSite, missing,
 * range, erroneous, suspect, duplicate; the rest are kept.
 */
import {
  KIND_MALFORMED,
  KIND_SPECIAL,
  KIND_SUMMARY,
  MISSING_ELEV,
  MISSING_LAT,
  MISSING_LON,
  MISSING_PRESSURE,
  MISSING_TEMP,
  type ParsedFile,
  yearCache,
  yearOfMinute,
} from "./records.js";
import type { Extremes, QcCounts } from "./types.js";

/** Air-temperature limits of the ISD format document (POS 88-92): −93.2 … +61.8 °C, in tenths. */
export const TEMP_MIN_TENTHS = -932;
export const TEMP_MAX_TENTHS = 618;
/** Second-site rule (docs/methods.md): records farther than this from the station-year's usual position. */
export const SITE_RADIUS_M = 5000;
export const SITE_ELEVATION_M = 30;

/** Quality codes dropped (ISD format document, POS 93): suspect 2 and 6, erroneous 3 and 7. */
const Q_SUSPECT_A = 50; // "2"
const Q_SUSPECT_B = 54; // "6"
const Q_ERRONEOUS_A = 51; // "3"
const Q_ERRONEOUS_B = 55; // "7"

/** The part of a parsed file that belongs to one station: the indices of its records, in file order. */
export interface StationPart {
  file: ParsedFile;
  station: number; // index in file.stations
  indices: Uint32Array;
}

/** Splits a file's records by station (one pass). */
export function partsOfFile(file: ParsedFile): StationPart[] {
  const c = file.records;
  const counts = new Uint32Array(file.stations.length);
  for (let i = 0; i < c.count; i++) counts[c.station[i]!]!++;
  const parts = file.stations.map((_, station) => ({
    file,
    station,
    indices: new Uint32Array(counts[station]!),
  }));
  const fill = new Uint32Array(file.stations.length);
  for (let i = 0; i < c.count; i++) {
    const st = c.station[i]!;
    parts[st]!.indices[fill[st]!++] = i;
  }
  return parts;
}

/** What quality control keeps of one station. */
export interface QcResult {
  qc: QcCounts;
  /** Kept observations, in time order: UTC minutes, tenths of °C, 1 for special reports. */
  keptTimeMin: Int32Array;
  keptTempTenths: Int16Array;
  keptSpecial: Uint8Array;
  extremes: Extremes | null;
  meanStationPressureHpa: number | null;
  /**
   * Most frequent position of the station's observations; of all its records when none is kept (null
   * when they carry none, as in ISD-Lite).
   */
  position: { latMilli: number; lonMilli: number; elevM: number } | null;
  callLetters: string | null;
  name: string | null;
  malformedExamples: string[];
}

export function emptyQc(): QcCounts {
  return {
    read: 0,
    kept: 0,
    dropped: {
      malformed: 0,
      summary: 0,
      otherSite: 0,
      missing: 0,
      range: 0,
      erroneous: 0,
      suspect: 0,
      duplicate: 0,
    },
  };
}

const EARTH_RADIUS_M = 6_371_008.8; // mean Earth radius (IUGG)

/** Great-circle distance in metres (haversine formula) between two points in thousandths of a degree. */
export function distanceM(lat1: number, lon1: number, lat2: number, lon2: number): number {
  const k = Math.PI / 180_000;
  const dLat = (lat2 - lat1) * k;
  const dLon = (lon2 - lon1) * k;
  const a = Math.sin(dLat / 2) ** 2 + Math.cos(lat1 * k) * Math.cos(lat2 * k) * Math.sin(dLon / 2) ** 2;
  return 2 * EARTH_RADIUS_M * Math.asin(Math.min(1, Math.sqrt(a)));
}

/** One number per (lat, lon, elevation) triple, for counting positions. */
function positionKey(lat: number, lon: number, elev: number): number {
  const e = Math.max(-10_000, Math.min(9_999, elev));
  return ((lat + 90_000) * 360_001 + (lon + 180_000)) * 20_000 + (e + 10_000);
}
function keyToPosition(key: number): Position {
  const elev = (key % 20_000) - 10_000;
  const ll = Math.floor(key / 20_000);
  return { latMilli: Math.floor(ll / 360_001) - 90_000, lonMilli: (ll % 360_001) - 180_000, elevM: elev };
}

/** Most frequent key of a count map (first seen wins a tie). */
function modeOf(counts: Map<number, number>): number | null {
  let best: number | null = null;
  let bestN = 0;
  for (const [k, n] of counts)
    if (n > bestN) {
      best = k;
      bestN = n;
    }
  return best;
}

function add(map: Map<number, number>, key: number, n: number): void {
  map.set(key, (map.get(key) ?? 0) + n);
}

function isoMinute(min: number): string {
  return new Date(min * 60_000).toISOString().replace(".000Z", "Z");
}

type Position = { latMilli: number; lonMilli: number; elevM: number };

/** How often each position occurs among a station's observations: per UTC year, and over all years. */
interface PositionCounts {
  byYear: Map<number, Map<number, number>>;
  all: Map<number, number>;
}

/**
 * Pass 1: counts positions per station-year among records that are observations (not malformed, not
 * summaries, with a position). Each distinct (year, position) gets a counter when first seen; the
 * counters of the last two are kept at hand (positions come in long runs, or two alternate).
 */
function countPositions(parts: StationPart[]): PositionCounts {
  const years = yearCache();
  // Distinct (year, position key) in order of first sight, their counts, and an index to find them.
  const pairYear: number[] = [];
  const pairKey: number[] = [];
  const pairN: number[] = [];
  const pairIndex = new Map<number, Map<number, number>>(); // year → key → pair
  let lastLat = Number.NaN;
  let lastLon = Number.NaN;
  let lastElev = Number.NaN;
  let lastYear = Number.NaN;
  let lastPair = -1;
  let prevLat = Number.NaN;
  let prevLon = Number.NaN;
  let prevElev = Number.NaN;
  let prevYear = Number.NaN;
  let prevPair = -1;
  for (const { file, indices } of parts) {
    const { kind, latMilli, lonMilli, elevM, timeMin } = file.records;
    for (let j = 0; j < indices.length; j++) {
      const i = indices[j]!;
      const k = kind[i]!;
      if (k === KIND_MALFORMED || k === KIND_SUMMARY) continue;
      const lat = latMilli[i]!;
      const lon = lonMilli[i]!;
      if (lat === MISSING_LAT || lon === MISSING_LON) continue;
      const elev = elevM[i]!;
      const y = yearOfMinute(years, timeMin[i]!);
      if (lat !== lastLat || lon !== lastLon || elev !== lastElev || y !== lastYear) {
        let pair: number;
        if (lat === prevLat && lon === prevLon && elev === prevElev && y === prevYear) pair = prevPair;
        else {
          const key = positionKey(lat, lon, elev);
          let ofYear = pairIndex.get(y);
          if (ofYear === undefined) {
            ofYear = new Map();
            pairIndex.set(y, ofYear);
          }
          let found = ofYear.get(key);
          if (found === undefined) {
            found = pairN.length;
            ofYear.set(key, found);
            pairYear.push(y);
            pairKey.push(key);
            pairN.push(0);
          }
          pair = found;
        }
        prevLat = lastLat;
        prevLon = lastLon;
        prevElev = lastElev;
        prevYear = lastYear;
        prevPair = lastPair;
        lastLat = lat;
        lastLon = lon;
        lastElev = elev;
        lastYear = y;
        lastPair = pair;
      }
      pairN[lastPair]!++;
    }
  }
  // The count maps, their keys in order of first sight (the first seen wins a tie in modeOf).
  const counts: PositionCounts = { byYear: new Map(), all: new Map() };
  for (let p = 0; p < pairN.length; p++) {
    let m = counts.byYear.get(pairYear[p]!);
    if (m === undefined) {
      m = new Map();
      counts.byYear.set(pairYear[p]!, m);
    }
    add(m, pairKey[p]!, pairN[p]!);
    add(counts.all, pairKey[p]!, pairN[p]!);
  }
  return counts;
}

/** How often each position occurs among all the readable records of a station (summaries included). */
function positionsOfAllRecords(parts: StationPart[]): Map<number, number> {
  const all = new Map<number, number>();
  for (const { file, indices } of parts) {
    const { kind, latMilli, lonMilli, elevM } = file.records;
    for (const i of indices)
      if (kind[i] !== KIND_MALFORMED && latMilli[i] !== MISSING_LAT && lonMilli[i] !== MISSING_LON)
        add(all, positionKey(latMilli[i]!, lonMilli[i]!, elevM[i]!), 1);
  }
  return all;
}

/** Records that pass every rule but the duplicate one, in reading order. */
interface Passing {
  time: Int32Array; // UTC minutes
  temp: Int16Array; // tenths of °C
  special: Uint8Array; // 1 for special reports
  type: Uint8Array; // report type code shared by all files
  pres: Int32Array; // station pressure ×10 hPa
  n: number;
}

/**
 * Pass 2 over one file's part: counts each record under the first rule that drops it (malformed,
 * summary, otherSite, missing, range, erroneous, suspect) and appends the others to `out`.
 * `types` maps the file's report type index to the shared code.
 */
function classifyPart(
  part: StationPart,
  types: Uint8Array,
  siteByYear: Map<number, Position>,
  dropped: QcCounts["dropped"],
  out: Passing,
): void {
  const {
    kind: kinds,
    timeMin,
    latMilli,
    lonMilli,
    elevM,
    tempTenths,
    tempQ,
    type,
    stationPresTenths,
  } = part.file.records;
  const indices = part.indices;
  const years = yearCache();
  // Site verdicts of the last two positions and years seen (positions come in long runs, or two
  // alternate, as when two report types give the position differently).
  let lastLat = Number.NaN;
  let lastLon = Number.NaN;
  let lastElev = Number.NaN;
  let lastYear = Number.NaN;
  let lastFar = false;
  let prevLat = Number.NaN;
  let prevLon = Number.NaN;
  let prevElev = Number.NaN;
  let prevYear = Number.NaN;
  let prevFar = false;
  let n = out.n;
  for (let j = 0; j < indices.length; j++) {
    const i = indices[j]!;
    const kind = kinds[i]!;
    if (kind === KIND_MALFORMED) {
      dropped.malformed++;
      continue;
    }
    if (kind === KIND_SUMMARY) {
      dropped.summary++;
      continue;
    }
    const t = timeMin[i]!;
    const lat = latMilli[i]!;
    const lon = lonMilli[i]!;
    const elev = elevM[i]!;
    if (lat !== MISSING_LAT && lon !== MISSING_LON) {
      const y = yearOfMinute(years, t);
      if (lat !== lastLat || lon !== lastLon || elev !== lastElev || y !== lastYear) {
        let far: boolean;
        if (lat === prevLat && lon === prevLon && elev === prevElev && y === prevYear) far = prevFar;
        else {
          const site = siteByYear.get(y)!;
          far =
            distanceM(site.latMilli, site.lonMilli, lat, lon) > SITE_RADIUS_M ||
            (elev !== MISSING_ELEV &&
              site.elevM !== MISSING_ELEV &&
              Math.abs(elev - site.elevM) > SITE_ELEVATION_M);
        }
        prevLat = lastLat;
        prevLon = lastLon;
        prevElev = lastElev;
        prevYear = lastYear;
        prevFar = lastFar;
        lastLat = lat;
        lastLon = lon;
        lastElev = elev;
        lastYear = y;
        lastFar = far;
      }
      if (lastFar) {
        dropped.otherSite++;
        continue;
      }
    }
    const temp = tempTenths[i]!;
    const q = tempQ[i]!;
    if (temp === MISSING_TEMP) dropped.missing++;
    else if (temp < TEMP_MIN_TENTHS || temp > TEMP_MAX_TENTHS) dropped.range++;
    else if (q === Q_ERRONEOUS_A || q === Q_ERRONEOUS_B) dropped.erroneous++;
    else if (q === Q_SUSPECT_A || q === Q_SUSPECT_B) dropped.suspect++;
    else {
      out.time[n] = t;
      out.temp[n] = temp;
      out.special[n] = kind === KIND_SPECIAL ? 1 : 0;
      out.type[n] = types[type[i]!]!;
      out.pres[n] = stationPresTenths[i]!;
      n++;
    }
  }
  out.n = n;
}

/** Kept observations in time order, after dropping duplicates; with the sum and count of their pressures. */
interface Kept {
  time: Int32Array;
  temp: Int16Array;
  special: Uint8Array;
  n: number;
  presSum: number;
  presN: number;
}

/**
 * Time order (reading order among equal times), then duplicates dropped: a record with the same time,
 * report type and value as one kept before it.
 */
function dropDuplicates(p: Passing, dropped: QcCounts["dropped"]): Kept {
  const nPass = p.n;
  const order = timeOrder(p.time, nPass);
  const keptTime = new Int32Array(nPass);
  const keptTemp = new Int16Array(nPass);
  const keptSpecial = new Uint8Array(nPass);
  const keptIndex = new Uint32Array(nPass);
  const { time: pTime, temp: pTemp, type: pType, special: pSpecial, pres: pPres } = p;
  let nKept = 0;
  let groupStart = 0; // first kept index with the current time
  let presSum = 0;
  let presN = 0;
  for (let j = 0; j < nPass; j++) {
    const k = order === null ? j : order[j]!;
    const t = pTime[k]!;
    if (nKept === 0 || keptTime[nKept - 1] !== t) groupStart = nKept;
    let dup = false;
    for (let g = groupStart; g < nKept && !dup; g++) {
      const kg = keptIndex[g]!;
      dup = pTemp[kg] === pTemp[k] && pType[kg] === pType[k];
    }
    if (dup) {
      dropped.duplicate++;
      continue;
    }
    keptIndex[nKept] = k;
    keptTime[nKept] = t;
    keptTemp[nKept] = pTemp[k]!;
    keptSpecial[nKept] = pSpecial[k]!;
    nKept++;
    if (pPres[k] !== MISSING_PRESSURE) {
      presSum += pPres[k]!;
      presN++;
    }
  }
  return { time: keptTime, temp: keptTemp, special: keptSpecial, n: nKept, presSum, presN };
}

/**
 * Applies the quality rules to one station's records from all its files (given in reading order).
 * `typeCode` maps a report type to a small number shared by all files, for the duplicate key.
 */
export function qualityControl(parts: StationPart[], typeCode: (type: string) => number): QcResult {
  const qc = emptyQc();
  const positions = countPositions(parts);
  const siteByYear = new Map<number, Position>();
  for (const [y, m] of positions.byYear) siteByYear.set(y, keyToPosition(modeOf(m)!));

  let total = 0;
  for (const { indices } of parts) total += indices.length;
  const passing: Passing = {
    time: new Int32Array(total),
    temp: new Int16Array(total),
    special: new Uint8Array(total),
    type: new Uint8Array(total),
    pres: new Int32Array(total),
    n: 0,
  };
  const calls = new Map<string, number>();
  let name: string | null = null;
  const examples: string[] = [];
  for (const part of parts) {
    const { file, station, indices } = part;
    for (const [k, n] of file.callLetters[station]!) calls.set(k, (calls.get(k) ?? 0) + n);
    name ??= file.stationNames[station] ?? null;
    for (const ex of file.malformedExamples) if (examples.length < 5) examples.push(ex);
    qc.read += indices.length;
    classifyPart(part, Uint8Array.from(file.reportTypes.map(typeCode)), siteByYear, qc.dropped, passing);
  }
  const {
    time: keptTime,
    temp: keptTemp,
    special: keptSpecial,
    n: nKept,
    presSum,
    presN,
  } = dropDuplicates(passing, qc.dropped);
  qc.kept = nKept;
  // A station without a kept record takes its position from all its records, summaries included.
  const posKey = nKept > 0 ? modeOf(positions.all) : modeOf(positionsOfAllRecords(parts));
  let callLetters: string | null = null;
  let callN = 0;
  for (const [k, n] of calls)
    if (k !== "" && k !== "99999" && n > callN) {
      callLetters = k;
      callN = n;
    }
  // Views of the used part (no copy: the arrays are this result's own).
  const outTime = keptTime.subarray(0, nKept);
  const outTemp = keptTemp.subarray(0, nKept);
  return {
    qc,
    keptTimeMin: outTime,
    keptTempTenths: outTemp,
    keptSpecial: keptSpecial.subarray(0, nKept),
    extremes: extremesOf(outTime, outTemp),
    meanStationPressureHpa: presN > 0 ? presSum / presN / 10 : null,
    position: posKey === null ? null : keyToPosition(posKey),
    callLetters,
    name,
    malformedExamples: examples,
  };
}

/**
 * Time order of the first n entries, stable (reading order among equal times), or null when they are
 * already in order. Records come in long runs that are in time order (a station-year each, say), so
 * the runs are found and merged pairwise, left run first among equal times (a natural merge sort):
 * a few linear passes. Many short runs (little order to use) are sorted instead.
 */
export function timeOrder(time: Int32Array, n: number): Uint32Array | null {
  let runs = runStarts(time, n);
  if (runs.length === 1) return null;
  if (runs.length > 1 + n / 16) return sortedOrder(time, n);
  runs.push(n);
  let src = new Uint32Array(n);
  for (let i = 0; i < n; i++) src[i] = i;
  let dst = new Uint32Array(n);
  // runs: start of each run, then n. Merge neighbours until one run is left.
  while (runs.length > 2) {
    const merged = [0];
    let r = 0;
    for (; r + 2 < runs.length; r += 2) {
      mergeRuns(time, src, dst, runs[r]!, runs[r + 1]!, runs[r + 2]!);
      merged.push(runs[r + 2]!);
    }
    if (r + 1 < runs.length) {
      dst.set(src.subarray(runs[r]!, runs[r + 1]!), runs[r]!); // odd run out: copied as it is
      merged.push(runs[r + 1]!);
    }
    [src, dst] = [dst, src];
    runs = merged;
  }
  return src;
}

/** Start of every run of entries in time order (equal times included) among the first n. */
function runStarts(time: Int32Array, n: number): number[] {
  const starts = [0];
  for (let i = 1; i < n; i++) if (time[i]! < time[i - 1]!) starts.push(i);
  return starts;
}

/**
 * Merges the index runs src[a..m) and src[m..z), each in time order, into dst[a..z); among equal
 * times the left run's entries come first (stable).
 */
function mergeRuns(
  time: Int32Array,
  src: Uint32Array,
  dst: Uint32Array,
  a: number,
  m: number,
  z: number,
): void {
  if (time[src[m - 1]!]! <= time[src[m]!]!) {
    dst.set(src.subarray(a, z), a); // already in order
    return;
  }
  if (time[src[z - 1]!]! < time[src[a]!]!) {
    dst.set(src.subarray(m, z), a); // the right run wholly before the left one
    dst.set(src.subarray(a, m), a + z - m);
    return;
  }
  let i = a;
  let j = m;
  let k = a;
  while (i < m && j < z) {
    if (time[src[j]!]! < time[src[i]!]!) dst[k++] = src[j++]!;
    else dst[k++] = src[i++]!;
  }
  while (i < m) dst[k++] = src[i++]!;
  while (j < z) dst[k++] = src[j++]!;
}

/** Stable time order of the first n entries by sorting: one Float64Array of time × 2^22 + index where that fits exactly. */
function sortedOrder(time: Int32Array, n: number): Uint32Array {
  const SHIFT = 2 ** 22;
  if (n < SHIFT) {
    const keys = new Float64Array(n);
    for (let i = 0; i < n; i++) keys[i] = time[i]! * SHIFT + i;
    keys.sort();
    const out = new Uint32Array(n);
    for (let i = 0; i < n; i++) {
      const key = keys[i]!;
      out[i] = key - Math.floor(key / SHIFT) * SHIFT;
    }
    return out;
  }
  const idx = Array.from({ length: n }, (_, i) => i);
  idx.sort((a, b) => time[a]! - time[b]! || a - b);
  return Uint32Array.from(idx);
}

/** Coldest and warmest kept observation; the earliest wins a tie. */
function extremesOf(time: Int32Array, temp: Int16Array): Extremes | null {
  if (time.length === 0) return null;
  let lo = 0;
  let hi = 0;
  for (let i = 1; i < time.length; i++) {
    if (temp[i]! < temp[lo]!) lo = i;
    if (temp[i]! > temp[hi]!) hi = i;
  }
  return {
    minC: temp[lo]! / 10,
    minUtc: isoMinute(time[lo]!),
    maxC: temp[hi]! / 10,
    maxUtc: isoMinute(time[hi]!),
  };
}
