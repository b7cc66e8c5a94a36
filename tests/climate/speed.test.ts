/**
 * The reader's fast paths give exactly what the plain ways give: the time order of runs merged
 * against a stable sort, the MA1 search against a left-to-right scan, an out-of-order file against
 * the same file in order, a gzip file whose size trailer understates its text (columns sized too
 * small must grow), and the cache's binary part (a damaged one is rebuilt).
 */
import { readdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { gzipSync } from "node:zlib";
import fc from "fast-check";
import { beforeAll, beforeEach, describe, expect, it } from "vitest";
import { cacheStats, loadClimate, resetCacheStats } from "../../src/climate/index.js";
import { stationPressure } from "../../src/climate/isdFull.js";
import { timeOrder } from "../../src/climate/qc.js";
import { MISSING_PRESSURE } from "../../src/climate/records.js";
import { readClimateFile } from "../../src/climate/source.js";
import type { StationClimate } from "../../src/climate/types.js";
import { HAVE_SAMPLES, noCache, sample, sampleLines, scratchDir, setAt, writeLines } from "./helpers.js";

const tmp = scratchDir();
beforeEach(() => resetCacheStats());

/** Stable order by time, the plain way: indices sorted by (time, index). */
function stableOrder(time: Int32Array, n: number): number[] {
  return Array.from({ length: n }, (_, i) => i).sort((a, b) => time[a]! - time[b]! || a - b);
}

describe("time order of records", () => {
  it("equals a stable sort for runs in order, runs out of order and ties across runs (fast-check)", () => {
    // Times drawn from a small range so that equal times across runs are common.
    const run = fc
      .array(fc.integer({ min: 0, max: 40 }), { minLength: 1, maxLength: 30 })
      .map((a) => a.sort((x, y) => x - y));
    fc.assert(
      fc.property(fc.array(run, { minLength: 1, maxLength: 12 }), fc.boolean(), (runs, shuffle) => {
        const flat = runs.flat();
        if (shuffle) flat.reverse(); // many short runs: the sorting branch
        const time = Int32Array.from(flat);
        const expected = stableOrder(time, time.length);
        const got = timeOrder(time, time.length);
        if (got === null) expect(expected).toEqual(expected.map((_, i) => i));
        else expect(Array.from(got)).toEqual(expected);
      }),
      { numRuns: 300 },
    );
  });

  it("is null when the times are already in order, equal times included", () => {
    expect(timeOrder(Int32Array.from([1, 1, 2, 5, 5, 9]), 6)).toBeNull();
  });
});

/** The MA1 search as a plain scan of every position (what the fast search must equal). */
function plainStationPressure(b: Uint8Array, s: number, e: number): number {
  const text = Buffer.from(b.subarray(s, e)).toString("latin1");
  if (!text.startsWith("ADD")) return MISSING_PRESSURE;
  for (let i = 3; i + 15 <= text.length; i++) {
    if (text.startsWith("REM", i)) return MISSING_PRESSURE;
    if (!text.startsWith("MA1", i)) continue;
    const alt = text.slice(i + 3, i + 8);
    const p = text.slice(i + 9, i + 14);
    if (!/^\d{5}$/.test(alt) || !/^\d{5}$/.test(p)) continue;
    const v = Number(p);
    if (v === MISSING_PRESSURE || !"01459M".includes(text[i + 14]!)) return MISSING_PRESSURE;
    return v < 4500 || v > 10900 ? MISSING_PRESSURE : v;
  }
  return MISSING_PRESSURE;
}

describe.skipIf(!HAVE_SAMPLES)("station pressure search on real lines", () => {
  let lines: string[] = [];
  beforeAll(() => {
    lines = sampleLines("725300-94846-2014.gz").filter((l) => l.length > 105);
  });

  it("finds what a plain scan finds on every line of a real file", () => {
    let found = 0;
    for (const line of lines) {
      const b = Buffer.from(line, "latin1");
      const p = stationPressure(b, 105, b.length);
      expect(p).toBe(plainStationPressure(b, 105, b.length));
      if (p !== MISSING_PRESSURE) found++;
    }
    expect(found).toBeGreaterThan(0);
  });

  it("finds what a plain scan finds on real lines with group names and digits spliced in (fast-check)", () => {
    const pieces = fc.constantFrom(
      "MA1",
      "REM",
      "M",
      "A1",
      "RE",
      "MA",
      "1",
      "E",
      "R",
      "99999",
      "10123",
      "5",
      "2",
    );
    fc.assert(
      fc.property(
        fc.nat({ max: lines.length - 1 }),
        fc.array(fc.tuple(fc.nat({ max: 300 }), pieces), { minLength: 1, maxLength: 8 }),
        (k, edits) => {
          let line = lines[k]!;
          for (const [pos, text] of edits) {
            const at = 106 + (pos % Math.max(1, line.length - 106));
            line = setAt(line, at, text);
          }
          const b = Buffer.from(line, "latin1");
          expect(stationPressure(b, 105, b.length)).toBe(plainStationPressure(b, 105, b.length));
        },
      ),
      { numRuns: 500 },
    );
  });
});

/** The parts of a station that must not depend on the order of the file's lines. */
function essence(s: StationClimate) {
  return {
    meta: s.meta,
    qc: s.qc,
    extremes: s.extremes,
    pressure: s.meanStationPressureHpa,
    start: s.series.startUtcMs,
    tempC: Array.from(s.series.tempC),
    filled: Array.from(s.series.filled),
  };
}

describe.skipIf(!HAVE_SAMPLES)("files out of time order", () => {
  it("a real file with its months in reverse order gives the same series and counts", async () => {
    // Real lines of 725300-94846-2014, regrouped by month (POS 20-21), December first.
    const lines = sampleLines("725300-94846-2014.gz");
    const byMonth = new Map<string, string[]>();
    for (const l of lines) byMonth.set(l.slice(19, 21), [...(byMonth.get(l.slice(19, 21)) ?? []), l]);
    const reversed = [...byMonth.keys()]
      .sort()
      .reverse()
      .flatMap((m) => byMonth.get(m)!);
    expect(reversed).toHaveLength(lines.length);
    const [inOrder] = await loadClimate([sample("725300-94846-2014.gz")], noCache);
    const [outOfOrder] = await loadClimate([writeLines(join(tmp.dir, "reversed.txt"), reversed)], noCache);
    expect(essence(outOfOrder!)).toEqual(essence(inOrder!));
  });

  it("two files holding interleaved halves of the same station-year give the series of the whole file", async () => {
    const lines = sampleLines("726430-14920-2015.gz");
    const even = lines.filter((_, i) => i % 2 === 0);
    const odd = lines.filter((_, i) => i % 2 === 1);
    const [whole] = await loadClimate([sample("726430-14920-2015.gz")], noCache);
    const [split] = await loadClimate(
      [writeLines(join(tmp.dir, "half-a.txt"), even), writeLines(join(tmp.dir, "half-b.txt"), odd)],
      noCache,
    );
    expect(essence(split!)).toEqual(essence(whole!));
  });
});

describe.skipIf(!HAVE_SAMPLES)("record columns sized from the gzip trailer", () => {
  it("a two-member gzip file whose trailer gives only the small last member is read whole", async () => {
    // RFC 1952: the trailer's ISIZE is that of the last member only; the columns must grow past it.
    const lines = sampleLines("725300-94846-2014.gz");
    const path = join(tmp.dir, "two-members.gz");
    const big = gzipSync(`${lines.slice(0, -1).join("\n")}\n`);
    const small = gzipSync(`${lines.at(-1)}\n`);
    writeFileSync(path, Buffer.concat([big, small]));
    const file = await readClimateFile(path);
    expect(file.records.count).toBe(lines.length);
    expect(file.lines).toBe(lines.length);
    const [whole] = await loadClimate([sample("725300-94846-2014.gz")], noCache);
    const [twoMembers] = await loadClimate([path], noCache);
    expect(essence(twoMembers!)).toEqual(essence(whole!));
  });
});

describe.skipIf(!HAVE_SAMPLES)("cache entry's binary part", () => {
  it("a damaged binary part fails its checksum and the entry is rebuilt with the right values", async () => {
    const dir = join(tmp.dir, "cache-bin");
    const file = sample("726430-14920-2015.gz");
    const [good] = await loadClimate([file], { gapHours: 3, cacheDir: dir });
    const [bin] = readdirSync(dir).filter((n) => n.endsWith(".bin"));
    const path = join(dir, bin!);
    const bytes = readFileSync(path);
    bytes[8] = bytes[8]! ^ 0xff; // one byte of the first hourly value
    writeFileSync(path, bytes);
    resetCacheStats();
    const [again] = await loadClimate([file], { gapHours: 3, cacheDir: dir });
    expect(cacheStats()).toEqual({ hits: 0, misses: 1, rebuilt: 1 });
    expect(essence(again!)).toEqual(essence(good!));
  });

  it("a missing binary part is a miss, and the entry is written again", async () => {
    const dir = join(tmp.dir, "cache-nobin");
    const file = sample("726430-14920-2015.gz");
    await loadClimate([file], { gapHours: 3, cacheDir: dir });
    const [bin] = readdirSync(dir).filter((n) => n.endsWith(".bin"));
    rmSync(join(dir, bin!));
    resetCacheStats();
    await loadClimate([file], { gapHours: 3, cacheDir: dir });
    await loadClimate([file], { gapHours: 3, cacheDir: dir });
    expect(cacheStats()).toEqual({ hits: 1, misses: 1, rebuilt: 0 });
  });

  it("an emptied binary part is a corrupt entry, rebuilt", async () => {
    const dir = join(tmp.dir, "cache-emptybin");
    const file = sample("726430-14920-2015.gz");
    await loadClimate([file], { gapHours: 3, cacheDir: dir });
    const [bin] = readdirSync(dir).filter((n) => n.endsWith(".bin"));
    writeFileSync(join(dir, bin!), Buffer.alloc(0));
    resetCacheStats();
    await loadClimate([file], { gapHours: 3, cacheDir: dir });
    await loadClimate([file], { gapHours: 3, cacheDir: dir });
    expect(cacheStats()).toEqual({ hits: 1, misses: 1, rebuilt: 1 });
  });

  it("values served from the cache equal freshly read ones, hour by hour", async () => {
    const dir = join(tmp.dir, "cache-values");
    const files = [sample("725300-94846-2014.gz"), sample("722540-13904-2014.gz")];
    await loadClimate(files, { gapHours: 3, cacheDir: dir });
    const cached = await loadClimate(files, { gapHours: 3, cacheDir: dir });
    expect(cacheStats().hits).toBe(1);
    const fresh = await loadClimate(files, noCache);
    expect(cached.map(essence)).toEqual(fresh.map(essence));
  });
});
