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
import { z } from "zod";
import { writeFileAtomic } from "../fsutil.js";
import { DROP_REASONS, type StationClimate } from "./types.js";

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

const qcSchema = z.object({
  read: z.number().int().nonnegative(),
  kept: z.number().int().nonnegative(),
  dropped: z.object(Object.fromEntries(DROP_REASONS.map((r) => [r, z.number().int().nonnegative()]))),
});
const stationSchema = z.object({
  meta: z.object({
    id: z.string(),
    name: z.string().nullable(),
    lat: z.number(),
    lon: z.number(),
    elevationM: z.number(),
    timeZone: z.string(),
    callLetters: z.string().nullable(),
  }),
  startUtcMs: z.number(),
  hours: z.number().int().nonnegative(),
  /** Byte offset of the station's Float64 values in the binary file (a multiple of 8). */
  tempOffset: z.number().int().nonnegative(),
  /** Byte offset of its `filled` flags (one byte per hour). */
  filledOffset: z.number().int().nonnegative(),
  qc: qcSchema,
  extremes: z
    .object({ minC: z.number(), minUtc: z.string(), maxC: z.number(), maxUtc: z.string() })
    .nullable(),
  meanStationPressureHpa: z.number().nullable(),
  malformedExamples: z.array(z.string()),
});
const bodySchema = z.object({
  dataBytes: z.number().int().nonnegative(),
  dataSha256: z.string(),
  stations: z.array(stationSchema),
  skipped: z.array(z.string()),
});
const entrySchema = z.object({
  kind: z.literal("coldsoak-climate-cache"),
  key: z.string(),
  checksum: z.string(),
  body: z.string(),
});

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
    })),
    skipped,
  });
  return { body, data };
}

/** The stations of an entry, or null when the binary file does not match the body. */
function decode(body: string, data: Buffer): CachedSelection | null {
  const parsed = bodySchema.safeParse(JSON.parse(body));
  if (!parsed.success) return null;
  const { dataBytes, dataSha256, stations, skipped } = parsed.data;
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
      qc: s.qc as StationClimate["qc"],
      extremes: s.extremes,
      meanStationPressureHpa: s.meanStationPressureHpa,
      malformedExamples: s.malformedExamples,
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
    const entry = entrySchema.parse(JSON.parse(text));
    const stations =
      entry.key === key && sha256(entry.body) === entry.checksum ? decode(entry.body, data) : null;
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
