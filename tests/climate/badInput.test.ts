/**
 * Bad input: malformed lines are counted and reported with file:line; files that are not climate
 * files, empty files and gzip files cut short give clear input errors naming them; nothing crashes.
 * A property-based test mutates real lines and checks that nothing crashes and nothing out of range
 * is kept.
 */
import { readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import fc from "fast-check";
import { beforeAll, describe, expect, it } from "vitest";
import { loadClimate, TEMP_MAX_TENTHS, TEMP_MIN_TENTHS } from "../../src/climate/index.js";
import { InputError } from "../../src/errors.js";
import {
  CSV_HEADER,
  csvRow,
  droppedTotal,
  HAVE_SAMPLES,
  noCache,
  sample,
  sampleLines,
  scratchDir,
  setAt,
  writeLines,
} from "./helpers.js";

const tmp = scratchDir();

describe.skipIf(!HAVE_SAMPLES)("malformed lines in real files", () => {
  it("counts truncated lines, non-digits and binary garbage as malformed, with file:line examples", async () => {
    const lines = sampleLines("725300-94846-2014.gz").slice(0, 40);
    const edited = [...lines];
    edited[4] = lines[4]!.slice(0, 80); // truncated inside the fixed part (line 5)
    edited[9] = lines[9]!.slice(0, lines[9]!.length - 7); // truncated in the additional section (line 10)
    edited[14] = setAt(lines[14]!, 89, "0A1"); // non-digits in the temperature (line 15)
    edited[19] = setAt(lines[19]!, 20, "13"); // month 13 (line 20)
    edited[24] = "\u0000\u00ff\u0013garbage\u0001\u0002".repeat(20); // binary garbage (line 25)
    const path = writeLines(join(tmp.dir, "bad.txt"), edited);
    const [s] = await loadClimate([path], noCache);
    expect(s!.qc.dropped.malformed).toBe(5);
    expect(s!.qc.read).toBe(40);
    expect(s!.qc.read).toBe(s!.qc.kept + droppedTotal(s!.qc));
    expect(s!.malformedExamples).toHaveLength(5);
    expect(s!.malformedExamples[0]).toMatch(/bad\.txt:5:length: /);
    expect(s!.malformedExamples[1]).toMatch(/bad\.txt:10:length: /);
    expect(s!.malformedExamples[2]).toMatch(/bad\.txt:15:TMP: /);
    expect(s!.malformedExamples[3]).toMatch(/bad\.txt:20:date: /);
    expect(s!.malformedExamples[4]).toMatch(/bad\.txt:25:/);
  });

  it("a gzip file cut short is an input error naming the file", async () => {
    const whole = readFileSync(sample("725300-94846-2014.gz"));
    const cut = join(tmp.dir, "cut.gz");
    writeFileSync(cut, whole.subarray(0, Math.floor(whole.length / 2)));
    const err = await loadClimate([cut], noCache).catch((e) => e);
    expect(err).toBeInstanceOf(InputError);
    expect(err.message).toMatch(/cut\.gz:gzip: gzip data ends early/);
  });
});

describe.skipIf(!HAVE_SAMPLES)("global-hourly CSV: every line one record", () => {
  it("counts each bad line once as malformed, however many faults it has; a stray quote swallows nothing", async () => {
    const rows = sampleLines("725300-94846-2014.gz").slice(0, 30).map(csvRow);
    rows[4] = rows[4]!.replace('"KORD "', '"KO"R"D"x" "'); // several stray quotes in one record (line 6)
    rows[9] = rows[9]!.replace('"KORD ",', '"KORD ,'); // a quoted field left open (line 11)
    rows[14] = `${rows[14]},"extra"`; // one column too many (line 16)
    const path = writeLines(join(tmp.dir, "quotes.csv"), [CSV_HEADER, ...rows]);
    const [s] = await loadClimate([path], noCache);
    expect(s!.qc.read).toBe(30);
    expect(s!.qc.read).toBe(s!.qc.kept + droppedTotal(s!.qc));
    expect(s!.qc.dropped.malformed).toBe(3);
    expect(s!.malformedExamples.map((e) => e.replace(/:[^:]*$/, ""))).toEqual([
      `${path}:6:CSV`,
      `${path}:11:CSV`,
      `${path}:16:columns`,
    ]);
  });
});

describe("files that are not climate files", () => {
  it("an empty file", async () => {
    const p = join(tmp.dir, "empty.gz");
    writeFileSync(p, "");
    const err = await loadClimate([p], noCache).catch((e) => e);
    expect(err).toBeInstanceOf(InputError);
    expect(err.message).toMatch(/empty\.gz: file is empty/);
  });

  it("a text file in no climate layout", async () => {
    const p = join(tmp.dir, "notes.txt");
    writeFileSync(p, "Station visits\n2014-01-06 checked the sensor\n");
    const err = await loadClimate([p], noCache).catch((e) => e);
    expect(err).toBeInstanceOf(InputError);
    expect(err.message).toMatch(/notes\.txt:1: not a climate file: expected the ISD full format/);
  });

  it("a binary file without line breaks", async () => {
    const p = join(tmp.dir, "blob.bin");
    writeFileSync(p, Buffer.from(Array.from({ length: 100_000 }, (_, i) => (i * 7919) % 251)));
    await expect(loadClimate([p], noCache)).rejects.toBeInstanceOf(InputError);
  });

  it("a path that does not exist", async () => {
    await expect(loadClimate([join(tmp.dir, "nope")], noCache)).rejects.toThrow(
      /nope: no such file or folder/,
    );
  });
});

describe.skipIf(!HAVE_SAMPLES)("property: mutated real lines", () => {
  // Real lines from four samples (full format), mutated at random; read in the setup hook so that the
  // suite skips cleanly where the samples are absent.
  let pool: string[] = [];
  beforeAll(() => {
    pool = [
      ...sampleLines("725300-94846-2014.gz").slice(0, 30),
      ...sampleLines("722540-13904-2014.gz").slice(0, 30),
      ...sampleLines("010060-99999-2014.gz").slice(0, 20),
      ...sampleLines("finland-6-stations-1901.gz").slice(0, 20),
    ];
  });
  const POOL_LINES = 100; // 30 + 30 + 20 + 20 lines above
  const mutation = fc.record({
    line: fc.nat({ max: POOL_LINES - 1 }),
    kind: fc.constantFrom("set", "cut", "insert", "delete"),
    pos: fc.nat({ max: 400 }),
    text: fc.string({ unit: "binary-ascii", minLength: 1, maxLength: 6 }),
  });

  it("never crashes, never keeps a value outside −93.2…+61.8 °C, counts every line", async () => {
    let run = 0;
    let malformedSeen = 0;
    await fc.assert(
      fc.asyncProperty(fc.array(mutation, { minLength: 1, maxLength: 25 }), async (mutations) => {
        expect(pool).toHaveLength(POOL_LINES);
        const lines = [...pool];
        for (const m of mutations) {
          const l = lines[m.line]!;
          const p = Math.min(m.pos, l.length);
          if (m.kind === "set") lines[m.line] = l.slice(0, p) + m.text + l.slice(p + m.text.length);
          else if (m.kind === "cut") lines[m.line] = l.slice(0, p);
          else if (m.kind === "insert") lines[m.line] = l.slice(0, p) + m.text + l.slice(p);
          else lines[m.line] = l.slice(0, p) + l.slice(p + m.text.length);
        }
        const path = join(tmp.dir, `prop-${run++}.txt`);
        writeFileSync(path, `${lines.join("\n")}\n`, "latin1");
        // Count what the reader should see as lines: mutations may add or remove line breaks.
        const expectedLines = lines
          .join("\n")
          .split("\n")
          .filter((l) => l.replace(/\r$/, "") !== "").length;
        let stations: Awaited<ReturnType<typeof loadClimate>>;
        try {
          stations = await loadClimate([path], noCache);
        } catch (err) {
          // Only a clean input error is acceptable (e.g. no readable record left).
          expect(err).toBeInstanceOf(InputError);
          return;
        }
        let read = 0;
        for (const s of stations) {
          read += s.qc.read;
          malformedSeen += s.qc.dropped.malformed;
          expect(s.qc.read).toBe(s.qc.kept + droppedTotal(s.qc));
          for (const v of s.series.tempC) {
            if (Number.isNaN(v)) continue;
            // Limits of the ISD format document (POS 88-92).
            expect(v).toBeGreaterThanOrEqual(TEMP_MIN_TENTHS / 10);
            expect(v).toBeLessThanOrEqual(TEMP_MAX_TENTHS / 10);
          }
          if (s.extremes) {
            expect(s.extremes.minC).toBeGreaterThanOrEqual(-93.2);
            expect(s.extremes.maxC).toBeLessThanOrEqual(61.8);
          }
        }
        expect(read).toBe(expectedLines);
      }),
      { numRuns: 60, seed: 20140106 },
    );
    expect(malformedSeen).toBeGreaterThan(0); // the mutations did reach the reader's checks
  });
});
