/**
 * Parsing on a worker thread while the main thread decompresses (large files): the same records as
 * parsing in-thread, and input errors still input errors. The compiled worker is needed, so these
 * tests use the build (`npm run build`, which `npm test` runs first) and skip, saying so, without it.
 */
import { existsSync, readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { afterAll, describe, expect, it } from "vitest";
import type * as Build from "../../src/climate/build.js";
import type { ParsedFile } from "../../src/climate/records.js";
import type * as Source from "../../src/climate/source.js";
import { HAVE_SAMPLES, sample, tempDir } from "./helpers.js";

const DIST = fileURLToPath(new URL("../../dist/", import.meta.url));
const HAVE_BUILD = existsSync(join(DIST, "climate", "worker.js"));
if (!HAVE_BUILD) console.warn(`parse-worker tests skipped: ${DIST} holds no build (run npm run build)`);

const tmp = tempDir();
afterAll(() => tmp.cleanup());

/** Everything a parsed file holds, its columns cut to the records read. */
function content(f: ParsedFile) {
  const c = f.records;
  const columns = Object.fromEntries(
    Object.entries(c)
      .filter(([k]) => k !== "count")
      .map(([k, v]) => [k, Array.from((v as Uint8Array).subarray(0, c.count))]),
  );
  return { ...f, path: undefined, records: { count: c.count, ...columns } };
}

describe.skipIf(!HAVE_SAMPLES || !HAVE_BUILD)("parsing on a worker thread", () => {
  const load = async () => ({
    source: (await import(join(DIST, "climate", "source.js"))) as typeof Source,
    build: (await import(join(DIST, "climate", "build.js"))) as typeof Build,
    errors: (await import(join(DIST, "errors.js"))) as typeof import("../../src/errors.js"),
  });

  it("gives the same records and series as parsing in-thread, on real files", async () => {
    const { source, build } = await load();
    for (const name of ["725300-94846-2014.gz", "finland-6-stations-1901.gz"]) {
      const onWorker = await source.readClimateFile(sample(name), { parseOnWorkerFromRecords: 0 });
      const inThread = await source.readClimateFile(sample(name), { parseOnWorkerFromRecords: Infinity });
      expect(onWorker.records.count).toBeGreaterThan(1000);
      expect(content(onWorker)).toEqual(content(inThread));
      const a = build.buildStations([onWorker], 3);
      const b = build.buildStations([inThread], 3);
      expect(a.map((s) => [s.qc, Array.from(s.series.tempC)])).toEqual(
        b.map((s) => [s.qc, Array.from(s.series.tempC)]),
      );
    }
  });

  it("a gzip file cut short is still an input error naming the file", async () => {
    const { source, errors } = await load();
    const whole = readFileSync(sample("725300-94846-2014.gz"));
    const cut = join(tmp.dir, "cut.gz");
    writeFileSync(cut, whole.subarray(0, Math.floor(whole.length * 0.6)));
    const read = source.readClimateFile(cut, { parseOnWorkerFromRecords: 0 });
    await expect(read).rejects.toBeInstanceOf(errors.InputError);
    await expect(read).rejects.toThrow(/cut\.gz.*gzip/);
    // The worker pool is still usable afterwards.
    const again = await source.readClimateFile(sample("726430-14920-2015.gz"), {
      parseOnWorkerFromRecords: 0,
    });
    expect(again.records.count).toBeGreaterThan(0);
  });

  it("an ISD-Lite file without a station id in its name is an input error", async () => {
    const { source, errors } = await load();
    const path = join(tmp.dir, "lite-no-id.txt");
    writeFileSync(path, "2014 01 01 00   -50  -100 10200   270    46     8     0     0\n".repeat(50));
    const read = source.readClimateFile(path, { parseOnWorkerFromRecords: 0 });
    await expect(read).rejects.toBeInstanceOf(errors.InputError);
    await expect(read).rejects.toThrow(/station id/);
  });
});
