/**
 * Quality codes, the order of reasons and duplicates, on real lines of the NOAA samples edited inside
 * the test (positions as the ISD format document counts them).
 */
import { describe, expect, it } from "vitest";
import { loadClimate } from "../../src/climate/index.js";
import {
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

describe.skipIf(!HAVE_SAMPLES)("quality control on real lines", () => {
  // First six routine FM-15 lines of the Chicago sample, all with quality code 5 (real file).
  const routine = () =>
    sampleLines("725300-94846-2014.gz")
      .filter((l) => l.slice(41, 46) === "FM-15" && l[92] === "5")
      .slice(0, 6);

  it("temperature quality 2 and 6 are suspect, 3 and 7 erroneous (ISD format document, POS 93)", async () => {
    const lines = routine();
    const edited = [
      setAt(lines[0]!, 93, "2"),
      setAt(lines[1]!, 93, "3"),
      setAt(lines[2]!, 93, "6"),
      setAt(lines[3]!, 93, "7"),
      lines[4]!,
      setAt(lines[5]!, 93, "A"), // A: flagged suspect but accepted as good (kept, docs/methods.md)
    ];
    const [s] = await loadClimate([writeLines(`${tmp.dir}/q.txt`, edited)], noCache);
    expect(s!.qc.dropped.suspect).toBe(2);
    expect(s!.qc.dropped.erroneous).toBe(2);
    expect(s!.qc.kept).toBe(2);
    expect(s!.qc.read).toBe(6);
  });

  it.each([
    ["2", "suspect"],
    ["3", "erroneous"],
    ["6", "suspect"],
    ["7", "erroneous"],
  ] as const)(
    "temperature quality %s alone is counted as %s (ISD format document, POS 93; docs/methods.md)",
    async (code, reason) => {
      // One edited line among five untouched ones, so a code filed under the wrong reason shows.
      const lines = routine();
      const [s] = await loadClimate(
        [writeLines(`${tmp.dir}/q${code}.txt`, [setAt(lines[0]!, 93, code), ...lines.slice(1)])],
        noCache,
      );
      expect(s!.qc.dropped[reason]).toBe(1);
      expect(droppedTotal(s!.qc)).toBe(1);
      expect(s!.qc.kept).toBe(5);
    },
  );

  it("second site: 5 km and 30 m from the most frequent position are the limits (docs/methods.md)", async () => {
    // The Chicago sample's main position is +41.995 −087.934, 205 m (real file). One degree of latitude
    // is 111.2 km (spherical Earth, mean radius 6371 km; from memory): +0.040° = 4.45 km, +0.050° = 5.56 km.
    const lines = routine();
    const edited = [
      setAt(lines[0]!, 29, "+42035"), // 4.45 km north: same site
      setAt(lines[1]!, 29, "+42045"), // 5.56 km north: other site
      setAt(lines[2]!, 47, "+0234"), // 29 m higher: same site
      setAt(lines[3]!, 47, "+0236"), // 31 m higher: other site
      lines[4]!,
      lines[5]!,
    ];
    const [s] = await loadClimate([writeLines(`${tmp.dir}/site.txt`, edited)], noCache);
    expect(s!.qc.dropped.otherSite).toBe(2);
    expect(s!.qc.kept).toBe(4);
  });

  it("missing (+9999) and out-of-range values (limits −93.2…+61.8 °C, format document POS 88-92)", async () => {
    const lines = routine();
    const edited = [
      setAt(lines[0]!, 88, "+9999"),
      setAt(lines[1]!, 88, "+0619"), // 61.9 °C: above the limit
      setAt(lines[2]!, 88, "-0933"), // −93.3 °C: below the limit
      setAt(lines[3]!, 88, "+0618"), // 61.8 °C: the limit itself is kept
      setAt(lines[4]!, 88, "-0932"),
      lines[5]!,
    ];
    const [s] = await loadClimate([writeLines(`${tmp.dir}/r.txt`, edited)], noCache);
    expect(s!.qc.dropped.missing).toBe(1);
    expect(s!.qc.dropped.range).toBe(2);
    expect(s!.qc.kept).toBe(3);
    expect(s!.extremes!.maxC).toBe(61.8);
    expect(s!.extremes!.minC).toBe(-93.2);
  });

  it("the first reason that applies wins, in the order of docs/methods.md", async () => {
    const lines = routine();
    const otherSite = (l: string) => setAt(setAt(l, 29, "+30300"), 35, "-097700"); // Austin's second site
    const edited = [
      setAt(setAt(lines[0]!, 42, "SOD  "), 88, "+9999"), // summary before missing
      setAt(otherSite(lines[1]!), 88, "+9999"), // otherSite before missing
      setAt(setAt(lines[2]!, 88, "+9999"), 93, "3"), // missing before erroneous
      setAt(setAt(lines[3]!, 88, "+0700"), 93, "7"), // range before erroneous
      setAt(lines[4]!, 93, "2"),
      lines[5]!,
      lines[5]!, // the same record twice: duplicate
    ];
    const [s] = await loadClimate([writeLines(`${tmp.dir}/o.txt`, edited)], noCache);
    expect(s!.qc.dropped).toEqual({
      malformed: 0,
      summary: 1,
      otherSite: 1,
      missing: 1,
      range: 1,
      erroneous: 0,
      suspect: 1,
      duplicate: 1,
    });
    expect(s!.qc.kept).toBe(1);
    expect(s!.qc.read).toBe(7);
  });

  it("equal records in overlapping files are duplicates; the series does not change", async () => {
    const all = sampleLines("725300-94846-2014.gz");
    const [alone] = await loadClimate([sample("725300-94846-2014.gz")], noCache);
    const overlap = writeLines(`${tmp.dir}/overlap.txt`, all.slice(0, 300));
    const [both] = await loadClimate([sample("725300-94846-2014.gz"), overlap], noCache);
    expect(both!.qc.read).toBe(alone!.qc.read + 300);
    expect(both!.qc.kept).toBe(alone!.qc.kept);
    expect(both!.qc.read).toBe(both!.qc.kept + droppedTotal(both!.qc));
    // Every overlapping line that was not dropped for another reason is a duplicate.
    const [part] = await loadClimate([overlap], noCache);
    expect(both!.qc.dropped.duplicate).toBe(part!.qc.kept);
    expect(Array.from(both!.series.tempC)).toEqual(Array.from(alone!.series.tempC));
  });
});
