/**
 * Fuzzing `coldsoak climate` with mutated real lines (fast-check): the Chicago sample of
 * ../shared/isd-samples (read in the setup hook, so the suite skips where it is absent), in the full
 * format and as global-hourly CSV, with year, station, position and byte mutations. For every mutated
 * file: exit 0 or 2; every line read lands in exactly one count (read = kept + Σ dropped, and read =
 * the records of the file); and the run takes at most 5 times as long as on the clean file (ratio of
 * the medians of 3 runs each, interleaved, so machine load affects both alike).
 */
import { writeFileSync } from "node:fs";
import { join } from "node:path";
import fc from "fast-check";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { CSV_HEADER, csvRow, droppedTotal, HAVE_SAMPLES, sampleLines, tempDir } from "../climate/helpers.js";
import { runCli } from "./runCli.js";

const tmp = tempDir();
afterAll(() => tmp.cleanup());

/** Most a mutated file may cost, as a multiple of the clean file's time (common practice, no source). */
const MAX_TIME_RATIO = 5;

type Layout = "isd" | "csv";

/** One mutation: of a line's year, station id, position, or of its bytes. */
const mutation = fc.oneof(
  fc.record({
    kind: fc.constant("year" as const),
    line: fc.nat(),
    year: fc.oneof(
      fc.integer({ min: 0, max: 9999 }),
      fc.constantFrom(1889, 1890, 2013, 2015, 2100, 2101, 6054),
    ),
  }),
  fc.record({ kind: fc.constant("station" as const), line: fc.nat(), digit: fc.nat(10), to: fc.nat(9) }),
  fc.record({
    kind: fc.constant("position" as const),
    line: fc.nat(),
    latMilli: fc.integer({ min: -99_999, max: 99_999 }),
    lonMilli: fc.integer({ min: -999_999, max: 999_999 }),
  }),
  fc.record({
    kind: fc.constantFrom("set" as const, "insert" as const, "delete" as const),
    line: fc.nat(),
    pos: fc.nat({ max: 300 }),
    text: fc.string({ unit: "binary-ascii", minLength: 1, maxLength: 4 }),
  }),
);
type Mutation = typeof mutation extends fc.Arbitrary<infer M> ? M : never;

const signed = (v: number, digits: number) => (v < 0 ? "-" : "+") + String(Math.abs(v)).padStart(digits, "0");
const replaceAt = (l: string, at: number, text: string) => l.slice(0, at) + text + l.slice(at + text.length);

/** A full-format line mutated (positions of the ISD format document, 0-based here). */
function mutateIsd(l: string, m: Mutation): string {
  switch (m.kind) {
    case "year":
      return replaceAt(l, 15, String(m.year).padStart(4, "0"));
    case "station":
      return replaceAt(l, 4 + m.digit, String(m.to));
    case "position":
      return replaceAt(replaceAt(l, 28, signed(m.latMilli, 5)), 34, signed(m.lonMilli, 6));
    default:
      return mutateBytes(l, m);
  }
}

/** A global-hourly CSV row mutated in its STATION, DATE or LATITUDE/LONGITUDE cells, or its bytes. */
function mutateCsv(l: string, m: Mutation): string {
  switch (m.kind) {
    case "year":
      return l.replace(/"\d{4}-/, `"${String(m.year).padStart(4, "0")}-`);
    case "station":
      return replaceAt(l, 1 + m.digit, String(m.to));
    case "position":
      return l.replace(/"(-?[\d.]+)","(-?[\d.]+)"/, `"${m.latMilli / 1000}","${m.lonMilli / 1000}"`);
    default:
      return mutateBytes(l, m);
  }
}

function mutateBytes(l: string, m: Mutation & { pos: number; text: string }): string {
  const p = Math.min(m.pos, l.length);
  if (m.kind === "set") return l.slice(0, p) + m.text + l.slice(p + m.text.length);
  if (m.kind === "insert") return l.slice(0, p) + m.text + l.slice(p);
  return l.slice(0, p) + l.slice(p + m.text.length);
}

/** Records in a file's text: its non-blank lines (a line of "\r" alone is blank), the CSV header aside. */
function recordsIn(text: string, layout: Layout): number {
  const lines = text.split("\n").filter((l) => l.replace(/\r$/, "") !== "").length;
  return layout === "csv" ? lines - 1 : lines;
}

/** Runs `coldsoak climate <file> --json --no-cache`; its exit code, stations and wall time. */
async function climate(path: string) {
  const t0 = performance.now();
  const r = await runCli(["climate", path, "--json", "--no-cache"]);
  const ms = performance.now() - t0;
  return { ...r, ms };
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;

describe.skipIf(!HAVE_SAMPLES)("coldsoak climate on mutated real lines (fast-check)", () => {
  const clean: Record<Layout, string[]> = { isd: [], csv: [] };
  beforeAll(() => {
    // The Chicago sample: 4,262 lines of January–April 2014 (real file).
    clean.isd = sampleLines("725300-94846-2014.gz");
    clean.csv = [CSV_HEADER, ...clean.isd.map(csvRow)];
  });

  it("exit 0 or 2, one count per record, and at most 5× the clean file's time", async () => {
    let run = 0;
    let malformedSeen = 0;
    await fc.assert(
      fc.asyncProperty(
        fc.constantFrom<Layout>("isd", "csv"),
        fc.boolean(),
        fc.array(mutation, { minLength: 1, maxLength: 25 }),
        async (layout, yearInName, mutations) => {
          const lines = [...clean[layout]];
          const first = layout === "csv" ? 1 : 0; // the CSV header stays as it is
          for (const m of mutations) {
            const i = first + (m.line % (lines.length - first));
            lines[i] = layout === "csv" ? mutateCsv(lines[i]!, m) : mutateIsd(lines[i]!, m);
          }
          // Half the files carry the station-year name (one UTC year), half a name without a year.
          const name = `${yearInName ? "725300-94846-2014" : "mutated"}-${run}.${layout === "csv" ? "csv" : "txt"}`;
          const cleanPath = join(tmp.dir, `clean-${run}.${layout}`);
          const path = join(tmp.dir, name);
          run++;
          const text = `${lines.join("\n")}\n`;
          writeFileSync(cleanPath, `${clean[layout].join("\n")}\n`, "latin1");
          writeFileSync(path, text, "latin1");

          const times = { clean: [] as number[], mutated: [] as number[] };
          let result: Awaited<ReturnType<typeof climate>> | null = null;
          for (let k = 0; k < 3; k++) {
            times.clean.push((await climate(cleanPath)).ms);
            result = await climate(path);
            times.mutated.push(result.ms);
          }
          const r = result!;
          expect([0, 2]).toContain(r.code);
          if (r.code === 2) {
            expect(r.err.trim().split("\n")).toHaveLength(1);
          } else {
            const stations = JSON.parse(r.out).stations as { qc: { read: number; kept: number } }[];
            let read = 0;
            for (const s of stations) {
              expect(s.qc.read).toBe(s.qc.kept + droppedTotal(s.qc as never));
              read += s.qc.read;
              malformedSeen += (s.qc as unknown as { dropped: { malformed: number } }).dropped.malformed;
            }
            expect(read).toBe(recordsIn(text, layout));
          }
          expect(median(times.mutated) / median(times.clean)).toBeLessThanOrEqual(MAX_TIME_RATIO);
        },
      ),
      { numRuns: 24, seed: 20140106 },
    );
    expect(malformedSeen).toBeGreaterThan(0); // the mutations did reach the readers' checks
  });
});
