/**
 * Cache of finished station series. One entry per set of input files; the
 * key hashes every file's content, the reader version, the quality rules and every option that changes
 * the series. An entry that cannot be read, fails its checksum or its schema is ignored and rebuilt.
 *
 * An entry is two files: `<key>.json`, a small JSON envelope whose body holds each station's metadata,
 * counts and where its hourly values lie, and `<key>.bin`, those values as raw bytes (Float64 values
 * then flag bytes per station, native byte order, which is part of the key). The body's checksum
 * covers the body, and the body names the SHA-256 of the binary file, so a change to either is caught.
 * A warm read is two file reads, one small JSON parse and typed-array views on the binary bytes.
 */
import { createHash } from "node:crypto";
import { createReadStream } from "node:fs";
import { readFile, stat } from "node:fs/promises";
import { endianness } from "node:os";
import { join } from "node:path";
import { writeFileAtomic } from "../fsutil.js";
import { DROP_REASONS, type MonthClimate, type StationClimate } from "./types.js";

/** Bump whenever a reader or a rule changes what a file turns into. */
export const READER_VERSION = "climate-reader-2";

/** The quality rules in force, spelled out so that a change of rules changes the cache key. */
export const QUALITY_RULES =
  "keep TMP q 0,1,4,5,9,A,C,I,M,P,R,U; suspect 2,6; erroneous 3,7; missing +9999; range -93.2..61.8 C; " +
  "summary SOD,SOM,COOPD; site 5 km / 30 m of the station-year mode; hour window 30 min; special FM-16,SAOSP; " +
  "duplicate = same time, type, value; order malformed,summary,otherSite,missing,range,erroneous,suspect,duplicate; " +
  "years 1890..2100; USAF-WBAN-YEAR file: that UTC year only; stray years < 100 records and < 5 % with empty neighbours";

let hits = 0;
let misses = 0;
let rebuilt = 0;

/** Counters since start (or the last reset): entries served, entries computed, corrupt entries rebuilt. */
export function cacheStats(): { hits: number; misses: number; rebuilt: number } {
  return { hits, misses, rebuilt };
}
export function resetCacheStats(): void {
  hits = 0;
  misses = 0;
  rebuilt = 0;
}

/** Files up to this size are hashed from one read; larger ones are streamed. */
const HASH_WHOLE_BYTES = 64 * 1024 * 1024;

/**
 * SHA-256 of a file's bytes (one read for files of usual size, streamed for larger ones). Throws for
 * what is not a regular file (a device or pipe could block or never end).
 */
export async function fileHash(path: string): Promise<string> {
  const h = createHash("sha256");
  const st = await stat(path);
  if (!st.isFile()) throw new Error(`${path}: not a regular file`);
  if (st.size <= HASH_WHOLE_BYTES) return h.update(await readFile(path)).digest("hex");
  for await (const chunk of createReadStream(path, { highWaterMark: 1 << 20 })) h.update(chunk as Buffer);
  return h.digest("hex");
}

export function cacheKey(parts: unknown): string {
  return createHash("sha256")
    .update(
      JSON.stringify({ readerVersion: READER_VERSION, rules: QUALITY_RULES, endian: endianness(), parts }),
    )
    .digest("hex");
}

/** What the body of an entry says of one station (see `encode`). */
interface CachedStation {
  meta: StationClimate["meta"];
  startUtcMs: number;
  hours: number;
  /** Byte offset of the station's Float64 values in the binary file (a multiple of 8). */
  tempOffset: number;
  /** Byte offset of its `filled` flags (one byte per hour). */
  filledOffset: number;
  qc: StationClimate["qc"];
  extremes: StationClimate["extremes"];
  meanStationPressureHpa: number | null;
  malformedExamples: string[];
  /** The monthly climatology, when it was computed before the entry was written. */
  months?: MonthClimate[];
}

interface CacheBody {
  dataBytes: number;
  dataSha256: string;
  stations: CachedStation[];
  skipped: string[];
}

/*
 * The shape of an entry is checked by hand, field by field, rather than through the plan file's schema
 * library: that library takes longer to load than a warm read takes in all. An entry is only read once
 * its key and the checksum of its body match, so the check guards against a body written by another
 * version of this code, not against damage.
 */
type Fields = Record<string, unknown>;
const isObject = (v: unknown): v is Fields => typeof v === "object" && v !== null && !Array.isArray(v);
const isNumber = (v: unknown): v is number => typeof v === "number" && Number.isFinite(v);
const isCount = (v: unknown): v is number => Number.isInteger(v) && (v as number) >= 0;
const isString = (v: unknown): v is string => typeof v === "string";
const isStringOrNull = (v: unknown): v is string | null => v === null || typeof v === "string";
const isStrings = (v: unknown): v is string[] => Array.isArray(v) && v.every(isString);

function asMeta(v: unknown): CachedStation["meta"] | null {
  if (!isObject(v)) return null;
  const { id, name, lat, lon, elevationM, timeZone, callLetters } = v;
  if (!isString(id) || !isStringOrNull(name) || !isNumber(lat) || !isNumber(lon) || !isNumber(elevationM))
    return null;
  if (!isString(timeZone) || !isStringOrNull(callLetters)) return null;
  return { id, name, lat, lon, elevationM, timeZone, callLetters };
}

function asQc(v: unknown): CachedStation["qc"] | null {
  if (!isObject(v) || !isCount(v["read"]) || !isCount(v["kept"]) || !isObject(v["dropped"])) return null;
  const from = v["dropped"];
  const dropped = {} as CachedStation["qc"]["dropped"];
  for (const r of DROP_REASONS) {
    const n = from[r];
    if (!isCount(n)) return null;
    dropped[r] = n;
  }
  return { read: v["read"], kept: v["kept"], dropped };
}

function asExtremes(v: unknown): CachedStation["extremes"] | undefined {
  if (v === null) return null;
  if (!isObject(v)) return undefined;
  const { minC, minUtc, maxC, maxUtc } = v;
  if (!isNumber(minC) || !isString(minUtc) || !isNumber(maxC) || !isString(maxUtc)) return undefined;
  return { minC, minUtc, maxC, maxUtc };
}

/** Twelve months 1–12, each figure a number or null; undefined when absent or of another shape. */
function asMonths(v: unknown): MonthClimate[] | undefined {
  if (!Array.isArray(v) || v.length !== 12) return undefined;
  const figure = (x: unknown) => x === null || isNumber(x);
  const months: MonthClimate[] = [];
  for (const [i, m] of v.entries()) {
    if (!isObject(m) || m["month"] !== i + 1) return undefined;
    const { minC, meanC, maxC, meanDailyRangeC, p90DailyRangeC } = m;
    if (![minC, meanC, maxC, meanDailyRangeC, p90DailyRangeC].every(figure)) return undefined;
    months.push({ month: i + 1, minC, meanC, maxC, meanDailyRangeC, p90DailyRangeC } as MonthClimate);
  }
  return months;
}

function asStation(v: unknown): CachedStation | null {
  if (!isObject(v)) return null;
  const meta = asMeta(v["meta"]);
  const qc = asQc(v["qc"]);
  const extremes = asExtremes(v["extremes"]);
  const { startUtcMs, hours, tempOffset, filledOffset, meanStationPressureHpa, malformedExamples } = v;
  if (meta === null || qc === null || extremes === undefined || !isNumber(startUtcMs)) return null;
  if (!isCount(hours) || !isCount(tempOffset) || !isCount(filledOffset)) return null;
  if (!(meanStationPressureHpa === null || isNumber(meanStationPressureHpa)) || !isStrings(malformedExamples))
    return null;
  const months = asMonths(v["months"]);
  if (v["months"] !== undefined && months === undefined) return null;
  return {
    ...(months ? { months } : {}),
    meta,
    startUtcMs,
    hours,
    tempOffset,
    filledOffset,
    qc,
    extremes,
    meanStationPressureHpa,
    malformedExamples,
  };
}

/** The body of an entry with every field checked and no other field kept, or null. */
function asBody(v: unknown): CacheBody | null {
  if (!isObject(v) || !isCount(v["dataBytes"]) || !isString(v["dataSha256"])) return null;
  if (!Array.isArray(v["stations"]) || !isStrings(v["skipped"])) return null;
  const stations: CachedStation[] = [];
  for (const s of v["stations"]) {
    const station = asStation(s);
    if (station === null) return null;
    stations.push(station);
  }
  return { dataBytes: v["dataBytes"], dataSha256: v["dataSha256"], stations, skipped: v["skipped"] };
}

/** The envelope of an entry: its kind, key, the body's checksum and the body text; or null. */
function asEnvelope(v: unknown): { key: string; checksum: string; body: string } | null {
  if (!isObject(v) || v["kind"] !== "coldsoak-climate-cache") return null;
  const { key, checksum, body } = v;
  return isString(key) && isString(checksum) && isString(body) ? { key, checksum, body } : null;
}

function sha256(data: string | Uint8Array): string {
  return createHash("sha256").update(data).digest("hex");
}

/** Rounds up to a multiple of 8 (Float64 alignment). */
function align8(n: number): number {
  return Math.ceil(n / 8) * 8;
}

/** The body text and the binary file of an entry. */
function encode({ stations, skipped }: CachedSelection): { body: string; data: Buffer } {
  let size = 0;
  const layout = stations.map((s) => {
    const hours = s.series.tempC.length;
    const tempOffset = size;
    const filledOffset = tempOffset + hours * 8;
    size = align8(filledOffset + hours);
    return { tempOffset, filledOffset, hours };
  });
  const data = Buffer.alloc(size);
  stations.forEach((s, i) => {
    const { tempOffset, filledOffset } = layout[i]!;
    const t = s.series.tempC;
    data.set(new Uint8Array(t.buffer, t.byteOffset, t.byteLength), tempOffset);
    data.set(s.series.filled, filledOffset);
  });
  const body = JSON.stringify({
    dataBytes: size,
    dataSha256: sha256(data),
    stations: stations.map((s, i) => ({
      meta: s.meta,
      startUtcMs: s.series.startUtcMs,
      ...layout[i],
      qc: s.qc,
      extremes: s.extremes,
      meanStationPressureHpa: s.meanStationPressureHpa,
      malformedExamples: s.malformedExamples,
      ...(s.months ? { months: s.months } : {}),
    })),
    skipped,
  });
  return { body, data };
}

/** The stations of an entry, or null when the binary file does not match the body. */
function decode(body: string, data: Buffer): CachedSelection | null {
  const parsed = asBody(JSON.parse(body));
  if (parsed === null) return null;
  const { dataBytes, dataSha256, stations, skipped } = parsed;
  if (data.length !== dataBytes || sha256(data) !== dataSha256) return null;
  // Float64 views need an 8-byte aligned start; a read buffer normally has one, else copy.
  const bytes =
    data.byteOffset % 8 === 0
      ? data
      : new Uint8Array(data.buffer.slice(data.byteOffset, data.byteOffset + data.length));
  const out: StationClimate[] = [];
  for (const s of stations) {
    if (
      s.tempOffset % 8 !== 0 ||
      s.tempOffset + s.hours * 8 > dataBytes ||
      s.filledOffset + s.hours > dataBytes
    )
      return null;
    out.push({
      meta: s.meta,
      series: {
        startUtcMs: s.startUtcMs,
        tempC: new Float64Array(bytes.buffer, bytes.byteOffset + s.tempOffset, s.hours),
        filled: new Uint8Array(bytes.buffer, bytes.byteOffset + s.filledOffset, s.hours),
      },
      qc: s.qc,
      extremes: s.extremes,
      meanStationPressureHpa: s.meanStationPressureHpa,
      malformedExamples: s.malformedExamples,
      ...(s.months ? { months: s.months } : {}),
    });
  }
  return { stations: out, skipped };
}

/** The JSON envelope of the entry for `key`. */
export function cachePath(cacheDir: string, key: string): string {
  return join(cacheDir, `${key}.json`);
}

/** The binary file of the entry for `key`. */
export function cacheDataPath(cacheDir: string, key: string): string {
  return join(cacheDir, `${key}.bin`);
}

/** The stations built and the ids skipped, as an entry holds them. */
export interface CachedSelection {
  stations: StationClimate[];
  skipped: string[];
}

/** The cached stations for `key`, or null (absent, unreadable, corrupt: the caller rebuilds). */
export async function readCache(cacheDir: string, key: string): Promise<CachedSelection | null> {
  let text: string;
  let data: Buffer;
  try {
    [text, data] = await Promise.all([
      readFile(cachePath(cacheDir, key), "utf8"),
      readFile(cacheDataPath(cacheDir, key)),
    ]);
  } catch {
    misses++;
    return null;
  }
  try {
    const entry = asEnvelope(JSON.parse(text));
    const stations =
      entry !== null && entry.key === key && sha256(entry.body) === entry.checksum
        ? decode(entry.body, data)
        : null;
    if (stations !== null) {
      hits++;
      return stations;
    }
  } catch {
    // fall through: corrupt entry
  }
  misses++;
  rebuilt++;
  return null;
}

/** Writes the binary file first, then the envelope: an envelope is only ever seen with its data. */
export async function writeCache(cacheDir: string, key: string, selection: CachedSelection): Promise<void> {
  const { body, data } = encode(selection);
  const entry = { kind: "coldsoak-climate-cache", key, checksum: sha256(body), body };
  await writeFileAtomic(cacheDataPath(cacheDir, key), data);
  await writeFileAtomic(cachePath(cacheDir, key), JSON.stringify(entry));
}
