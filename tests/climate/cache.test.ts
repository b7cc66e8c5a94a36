/**
 * Cache of parsed series (docs/methods.md §4): a second read is served from the cache, a changed file or
 * a changed gap length is read again, a corrupt entry is ignored and rebuilt.
 */
import { copyFileSync, readdirSync, readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { cacheStats, loadClimate, monthlyClimate, resetCacheStats } from "../../src/climate/index.js";
import { HAVE_SAMPLES, sample, sampleLines, tempDir, writeLines } from "./helpers.js";

const tmp = tempDir();
afterAll(() => tmp.cleanup());
beforeEach(() => resetCacheStats());

describe.skipIf(!HAVE_SAMPLES)("climate cache", () => {
  const cacheDir = join(tmp.dir, "cache");
  const file = join(tmp.dir, "726430-14920-2015.gz");
  beforeAll(() => copyFileSync(sample("726430-14920-2015.gz"), file));

  it("serves a second read of the same files from the cache, with the same result", async () => {
    const first = await loadClimate([file], { gapHours: 3, cacheDir });
    expect(cacheStats()).toEqual({ hits: 0, misses: 1, rebuilt: 0 });
    const second = await loadClimate([file], { gapHours: 3, cacheDir });
    expect(cacheStats().hits).toBe(1);
    expect(second[0]!.qc).toEqual(first[0]!.qc);
    expect(second[0]!.meta).toEqual(first[0]!.meta);
    expect(Array.from(second[0]!.series.tempC)).toEqual(Array.from(first[0]!.series.tempC));
    expect(Array.from(second[0]!.series.filled)).toEqual(Array.from(first[0]!.series.filled));
  });

  it("keeps the monthly climatology asked for with the series, equal to one computed from it", async () => {
    const dir = join(tmp.dir, "cache-months");
    const [built] = await loadClimate([file], { gapHours: 3, cacheDir: dir, summarize: true });
    const [served] = await loadClimate([file], { gapHours: 3, cacheDir: dir, summarize: true });
    expect(cacheStats().hits).toBe(1);
    const computed = monthlyClimate(served!.series, served!.meta.timeZone);
    expect(built!.months).toEqual(computed);
    expect(served!.months).toEqual(computed);
  });

  it("reads again when the gap length changes", async () => {
    await loadClimate([file], { gapHours: 3, cacheDir });
    await loadClimate([file], { gapHours: 1, cacheDir });
    expect(cacheStats()).toMatchObject({ hits: 1, misses: 1 });
  });

  it("reads again when a file's content changes", async () => {
    const changing = join(tmp.dir, "changing.txt");
    const lines = sampleLines("726430-14920-2015.gz");
    writeLines(changing, lines.slice(0, 50));
    const a = await loadClimate([changing], { gapHours: 3, cacheDir });
    writeLines(changing, lines.slice(0, 60));
    const b = await loadClimate([changing], { gapHours: 3, cacheDir });
    expect(cacheStats()).toMatchObject({ hits: 0, misses: 2 });
    expect(b[0]!.qc.read).toBe(60);
    expect(a[0]!.qc.read).toBe(50);
  });

  it("ignores and rebuilds a corrupt entry", async () => {
    const dir = join(tmp.dir, "cache-corrupt");
    const good = await loadClimate([file], { gapHours: 3, cacheDir: dir });
    const [entry] = readdirSync(dir).filter((n) => n.endsWith(".json"));
    writeFileSync(join(dir, entry!), '{"kind":"coldsoak-climate-cache","key":"x", "body": tru');
    resetCacheStats();
    const rebuilt = await loadClimate([file], { gapHours: 3, cacheDir: dir });
    expect(cacheStats()).toEqual({ hits: 0, misses: 1, rebuilt: 1 });
    expect(rebuilt[0]!.qc).toEqual(good[0]!.qc);
    // The rebuilt entry is good again.
    await loadClimate([file], { gapHours: 3, cacheDir: dir });
    expect(cacheStats().hits).toBe(1);
  });

  it("a cache entry whose body was altered fails its checksum and is rebuilt", async () => {
    const dir = join(tmp.dir, "cache-altered");
    await loadClimate([file], { gapHours: 3, cacheDir: dir });
    const [entry] = readdirSync(dir).filter((n) => n.endsWith(".json"));
    const path = join(dir, entry!);
    const json = JSON.parse(readFileSync(path, "utf8"));
    const altered = json.body.replace(/"kept":(\d+)/, (_: string, n: string) => `"kept":${Number(n) + 1}`);
    expect(altered).not.toBe(json.body);
    writeFileSync(path, JSON.stringify({ ...json, body: altered }));
    resetCacheStats();
    const again = await loadClimate([file], { gapHours: 3, cacheDir: dir });
    expect(cacheStats().rebuilt).toBe(1);
    const fresh = await loadClimate([file], { gapHours: 3, cacheDir: null });
    expect(again[0]!.qc).toEqual(fresh[0]!.qc);
  });
});
