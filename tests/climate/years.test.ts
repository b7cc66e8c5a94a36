/**
 * The year rules of docs/methods.md ("Quality control") on real lines: a year outside 1890…2100 is
 * malformed in every layout; in a file named USAF-WBAN-YEAR a record of another UTC year is malformed;
 * elsewhere a stray run of years is malformed while files of many years keep them all. The hour grid
 * never spans a refused year, so one damaged year digit costs no more than the line it is on.
 */
import { writeFileSync } from "node:fs";
import { join } from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { HOUR_MS, loadClimate, type StationClimate } from "../../src/climate/index.js";
import {
  CHICAGO_HISTORY,
  CSV_HEADER,
  csvRow,
  droppedTotal,
  HAVE_SAMPLES,
  noCache,
  sampleLines,
  scratchDir,
  setAt,
  writeLines,
} from "./helpers.js";

const tmp = scratchDir();

const UTC_2014 = Date.UTC(2014, 0, 1);
const UTC_2015 = Date.UTC(2015, 0, 1);

/** The one station of a file, with the invariant read = kept + Σ dropped checked. */
async function only(path: string, options: object = {}): Promise<StationClimate> {
  const stations = await loadClimate([path], { ...noCache, ...options });
  expect(stations).toHaveLength(1);
  const s = stations[0]!;
  expect(s.qc.read).toBe(s.qc.kept + droppedTotal(s.qc));
  return s;
}

/** True when every grid hour lies in 2014 (the UTC year of the Chicago sample's records). */
function gridWithin2014(s: StationClimate): boolean {
  return s.series.startUtcMs >= UTC_2014 && s.series.startUtcMs + s.series.tempC.length * HOUR_MS <= UTC_2015;
}

describe.skipIf(!HAVE_SAMPLES)("year rules", () => {
  // The Chicago sample: 4,262 records, all of January–April 2014 (real file).
  let lines: string[] = [];
  beforeAll(() => {
    lines = sampleLines("725300-94846-2014.gz");
  });
  /** Line i of the sample with its year (positions 16-19 of the ISD format document) replaced. */
  const withYear = (i: number, year: string) => setAt(lines[i]!, 16, year);

  it("a year outside 1890…2100 is malformed in the full format, one count per line", async () => {
    const edited = lines.slice(0, 40);
    edited[4] = withYear(4, "2914");
    edited[9] = withYear(9, "0014");
    edited[14] = withYear(14, "6054"); // past the year where a 32-bit minute count since 1970 wraps
    edited[19] = withYear(19, "1889");
    const s = await only(writeLines(join(tmp.dir, "bound.txt"), edited));
    expect(s.qc.read).toBe(40);
    expect(s.qc.dropped.malformed).toBe(4);
    expect(s.malformedExamples[0]).toMatch(
      /bound\.txt:5:date: year 2914 at positions 16-19 outside 1890–2100/,
    );
    expect(gridWithin2014(s)).toBe(true);
  });

  it("a year outside 1890…2100 is malformed in the global-hourly CSV layout", async () => {
    const rows = lines.slice(0, 40).map(csvRow);
    rows[4] = rows[4]!.replace('"2014-', '"2914-');
    rows[9] = rows[9]!.replace('"2014-', '"0014-');
    const s = await only(writeLines(join(tmp.dir, "bound.csv"), [CSV_HEADER, ...rows]));
    expect(s.qc.read).toBe(40);
    expect(s.qc.dropped.malformed).toBe(2);
    expect(s.malformedExamples[0]).toMatch(/bound\.csv:6:DATE: year 2914 outside 1890–2100/);
    expect(gridWithin2014(s)).toBe(true);
  });

  it("a year outside 1890…2100 is malformed in ISD-Lite, negative years included", async () => {
    // ISD-Lite: year month day hour temperature ×10 °C … (NOAA NCEI ISD-Lite format); values invented.
    const lite = Array.from(
      { length: 40 },
      (_, h) =>
        `2014 01 ${String(1 + Math.floor(h / 24)).padStart(2, "0")} ${String(h % 24).padStart(2, "0")}   -83  -156 10227   260    46     0     0 -9999`,
    );
    lite[4] = lite[4]!.replace(/^2014/, "2914");
    lite[9] = lite[9]!.replace(/^2014/, "-1485");
    const history = join(tmp.dir, "history.csv");
    writeFileSync(history, CHICAGO_HISTORY);
    const s = await only(writeLines(join(tmp.dir, "lite.txt"), lite), {
      stationIdOverride: "725300-94846",
      stationHistoryCsv: history,
    });
    expect(s.qc.read).toBe(40);
    expect(s.qc.dropped.malformed).toBe(2);
    expect(s.malformedExamples[1]).toMatch(/lite\.txt:10:date: year -1485 outside 1890–2100/);
    expect(gridWithin2014(s)).toBe(true);
  });

  it("in a file named USAF-WBAN-YEAR, a record of another UTC year is malformed", async () => {
    const edited = lines.slice(0, 40);
    edited[6] = withYear(6, "2015");
    edited[7] = withYear(7, "2013");
    const named = await only(writeLines(join(tmp.dir, "725300-94846-2014"), edited));
    expect(named.qc.dropped.malformed).toBe(2);
    expect(named.malformedExamples[0]).toMatch(
      /725300-94846-2014:7:date: year 2015 outside 2014, the UTC year the file name gives/,
    );
    expect(gridWithin2014(named)).toBe(true);
    // The same lines in a file named otherwise: 2013 and 2015 border 2014's records, so they stay.
    const other = await only(writeLines(join(tmp.dir, "chicago-near.txt"), edited));
    expect(other.qc.dropped.malformed).toBe(0);
  });

  it("in other files a stray run of years is malformed and the grid does not span it", async () => {
    const clean = await only(writeLines(join(tmp.dir, "chicago-clean.txt"), lines));
    const edited = [...lines];
    edited[100] = withYear(100, "2019"); // one record alone in its year
    edited[200] = withYear(200, "2030"); // a run of two years: 2030 and 2031
    edited[201] = withYear(201, "2031");
    const s = await only(writeLines(join(tmp.dir, "chicago-stray.txt"), edited));
    expect(s.qc.read).toBe(lines.length);
    expect(s.qc.dropped.malformed).toBe(clean.qc.dropped.malformed + 3);
    expect(s.malformedExamples.join("\n")).toMatch(/chicago-stray\.txt:101:date: year 2019 stray/);
    expect(gridWithin2014(s)).toBe(true);
    expect(s.series.tempC.length).toBeLessThanOrEqual(clean.series.tempC.length);
  });

  it("files holding many years keep them all, the smaller years too", async () => {
    // 2014 from the sample plus a second, smaller year (2016) made of the sample's first lines
    // re-dated: 2015 holds nothing, so 2016 is a run of its own.
    const year2016 = (n: number) => lines.slice(0, n).map((l) => setAt(l, 16, "2016"));
    // 100 records: not fewer than 100, so not stray (rule of docs/methods.md).
    const kept = await only(writeLines(join(tmp.dir, "two-years.txt"), [...lines, ...year2016(100)]));
    const cleanMalformed = (await only(writeLines(join(tmp.dir, "one-year.txt"), lines))).qc.dropped
      .malformed;
    expect(kept.qc.dropped.malformed).toBe(cleanMalformed);
    expect(kept.series.startUtcMs + kept.series.tempC.length * HOUR_MS).toBeGreaterThan(Date.UTC(2016, 0, 1));
    // 99 records, 2.3 % of the file's 4,361: fewer than 100 and under 5 %, so stray.
    const stray = await only(writeLines(join(tmp.dir, "two-years-99.txt"), [...lines, ...year2016(99)]));
    expect(stray.qc.dropped.malformed).toBe(cleanMalformed + 99);
    expect(gridWithin2014(stray)).toBe(true);
  });

  it("the share bound: a lone year in a small file is stray only below 5 % of its records", async () => {
    // 40 lines, one moved to 2019: 1 record = 2.5 % < 5 %, stray.
    const forty = lines.slice(0, 40);
    forty[3] = withYear(3, "2019");
    expect((await only(writeLines(join(tmp.dir, "forty.txt"), forty))).qc.dropped.malformed).toBe(1);
    // 10 lines, one moved to 2019: 1 record = 10 % ≥ 5 %, kept as a year of its own.
    const ten = lines.slice(0, 10);
    ten[3] = withYear(3, "2019");
    const s = await only(writeLines(join(tmp.dir, "ten.txt"), ten));
    expect(s.qc.dropped.malformed).toBe(0);
  });
});
