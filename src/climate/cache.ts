/**
 * Cache of finished station series (product brief, section 4). One entry per set of input files; the
 * key hashes every file's content, the reader version, the quality rules and every option that changes
 * the series. An entry that cannot be read, fails its checksum or its schema is ignored and rebuilt.
 */
import { createHash } from "node:crypto";
import { createReadStream } from "node:fs";
import { readFile } from "node:fs/promises";
import { endianness } from "node:os";
import { join } from "node:path";
import { z } from "zod";
import { writeFileAtomic } from "../fsutil.js";
import { DROP_REASONS, type StationClimate } from "./types.js";

/** Bump whenever a reader or a rule changes what a file turns into. */
export const READER_VERSION = "climate-reader-1";

/** The quality rules in force, spelled out so that a change of rules changes the cache key. */
export const QUALITY_RULES =
  "keep TMP q 0,1,4,5,9,A,C,I,M,P,R,U; suspect 2,6; erroneous 3,7; missing +9999; range -93.2..61.8 C; " +
  "summary SOD,SOM,COOPD; site 5 km / 30 m of the station-year mode; hour window 30 min; special FM-16,SAOSP; " +
  "duplicate = same time, type, value; order malformed,summary,otherSite,missing,range,erroneous,suspect,duplicate";

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

/** SHA-256 of a file's bytes, streamed. */
export async function fileHash(path: string): Promise<string> {
  const h = createHash("sha256");
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
  tempC: z.string(), // base64 of Float64 values
  filled: z.string(), // base64 of bytes
  qc: qcSchema,
  extremes: z
    .object({ minC: z.number(), minUtc: z.string(), maxC: z.number(), maxUtc: z.string() })
    .nullable(),
  meanStationPressureHpa: z.number().nullable(),
  malformedExamples: z.array(z.string()),
});
const entrySchema = z.object({
  kind: z.literal("coldsoak-climate-cache"),
  key: z.string(),
  checksum: z.string(),
  body: z.string(),
});

function sha256(text: string): string {
  return createHash("sha256").update(text).digest("hex");
}

function encode(stations: StationClimate[]): string {
  return JSON.stringify(
    stations.map((s) => ({
      meta: s.meta,
      startUtcMs: s.series.startUtcMs,
      hours: s.series.tempC.length,
      tempC: Buffer.from(
        s.series.tempC.buffer,
        s.series.tempC.byteOffset,
        s.series.tempC.byteLength,
      ).toString("base64"),
      filled: Buffer.from(s.series.filled).toString("base64"),
      qc: s.qc,
      extremes: s.extremes,
      meanStationPressureHpa: s.meanStationPressureHpa,
      malformedExamples: s.malformedExamples,
    })),
  );
}

function decode(body: string): StationClimate[] | null {
  const parsed = z.array(stationSchema).safeParse(JSON.parse(body));
  if (!parsed.success) return null;
  const out: StationClimate[] = [];
  for (const s of parsed.data) {
    const tBytes = Buffer.from(s.tempC, "base64");
    const filled = new Uint8Array(Buffer.from(s.filled, "base64"));
    if (tBytes.length !== s.hours * 8 || filled.length !== s.hours) return null;
    const tempC = new Float64Array(s.hours);
    new Uint8Array(tempC.buffer).set(tBytes);
    out.push({
      meta: s.meta,
      series: { startUtcMs: s.startUtcMs, tempC, filled },
      qc: s.qc as StationClimate["qc"],
      extremes: s.extremes,
      meanStationPressureHpa: s.meanStationPressureHpa,
      malformedExamples: s.malformedExamples,
    });
  }
  return out;
}

export function cachePath(cacheDir: string, key: string): string {
  return join(cacheDir, `${key}.json`);
}

/** The cached stations for `key`, or null (absent, unreadable, corrupt: the caller rebuilds). */
export async function readCache(cacheDir: string, key: string): Promise<StationClimate[] | null> {
  let text: string;
  try {
    text = await readFile(cachePath(cacheDir, key), "utf8");
  } catch {
    misses++;
    return null;
  }
  try {
    const entry = entrySchema.parse(JSON.parse(text));
    const stations = entry.key === key && sha256(entry.body) === entry.checksum ? decode(entry.body) : null;
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

export async function writeCache(cacheDir: string, key: string, stations: StationClimate[]): Promise<void> {
  const body = encode(stations);
  const entry = { kind: "coldsoak-climate-cache", key, checksum: sha256(body), body };
  await writeFileAtomic(cachePath(cacheDir, key), JSON.stringify(entry));
}
