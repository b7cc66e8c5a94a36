/**
 * `coldsoak climate`: the `--json` contract and exit codes of the README (Outputs, exit codes).
 */
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { HAVE_SAMPLES, sample } from "../climate/helpers.js";
import { runCli } from "./runCli.js";

const dir = mkdtempSync(join(tmpdir(), "coldsoak-cli-climate-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const run = runCli;

describe.skipIf(!HAVE_SAMPLES)("coldsoak climate on a real sample", () => {
  it("--json gives the contract's fields, extremes in °C whatever the units", async () => {
    const r = await run(["climate", sample("725300-94846-2014.gz"), "--json", "--no-cache", "--units", "us"]);
    expect(r.code).toBe(0);
    const doc = JSON.parse(r.out);
    expect(doc.stations).toHaveLength(1);
    const s = doc.stations[0];
    for (const key of [
      "id",
      "name",
      "lat",
      "lon",
      "elevationM",
      "timeZone",
      "firstUtc",
      "lastUtc",
      "hours",
      "filledHours",
      "completeness",
      "qc",
      "extremes",
      "months",
    ])
      expect(s).toHaveProperty(key);
    expect(s.id).toBe("725300-94846");
    // −26.7 °C at 13:51 UTC on 2014-01-06 (real file; NWS records give −16 °F, from memory).
    expect(s.extremes).toMatchObject({ minC: -26.7, minUtc: "2014-01-06T13:51:00Z" });
    expect(s.qc.read).toBe(
      s.qc.kept + Object.values(s.qc.dropped as Record<string, number>).reduce((a, b) => a + b),
    );
    expect(s.months).toHaveLength(12);
    expect(Object.keys(s.months[0]).sort()).toEqual(
      ["maxC", "meanC", "meanDailyRangeC", "minC", "month", "p90DailyRangeC"].sort(),
    );
    expect(s.completeness).toBeGreaterThan(0);
    expect(s.completeness).toBeLessThanOrEqual(1);
  });

  it("--json and the table give the design temperatures: no annual values for a partial year", async () => {
    const r = await run(["climate", sample("725300-94846-2014.gz"), "--json", "--no-cache"]);
    expect(r.code).toBe(0);
    const d = JSON.parse(r.out).stations[0].design;
    // The file covers 1 January to 23 April 2014 (real data file): no year has 80 % of its hours.
    expect(d).toMatchObject({ annual996C: null, annual99C: null, reason: "no year with enough hours" });
    expect(d.coldestHour).toMatchObject({ meanC: null, oneIn10C: null, byYear: [] });
    // January is the coldest month; its 744 local hours' 8th and 9th coldest are −25.0 and −24.4 °C
    // (from the data), and the type-7 1 % value lies between them (h = 743 × 0.01 + 1 = 8.43).
    expect(d.coldestMonth.month).toBe(1);
    expect(d.coldestMonth.p1C).toBeGreaterThanOrEqual(-25);
    expect(d.coldestMonth.p1C).toBeLessThanOrEqual(-24.4);
    // The thresholds are −20, −30, −40 °F in the default units (F = C × 1.8 + 32, exact by definition).
    expect(d.hoursBelow.map((h: { thresholdC: number }) => h.thresholdC)).toEqual([
      expect.closeTo(-28.889, 3),
      expect.closeTo(-34.444, 3),
      -40,
    ]);
    const table = await run(["climate", sample("725300-94846-2014.gz"), "--no-cache", "--units", "si"]);
    expect(table.out).toContain("annual 99.6 % – (no year with enough hours)");
    expect(table.out).toContain("coldest month's 1 % Jan \u221224.7 °C");
  });

  it("prints a table in °F by default and writes the CSV", async () => {
    const csv = join(dir, "climate.csv");
    const r = await run(["climate", sample("725300-94846-2014.gz"), "--no-cache", "--csv", csv]);
    expect(r.code).toBe(0);
    // −26.7 °C = −16.06 °F (conversion F = C × 1.8 + 32, exact by definition); shown with a true minus.
    expect(r.out).toContain("coldest \u221216.1 °F at 2014-01-06T13:51:00Z (2014-01-06 07:51 CST)");
    const text = readFileSync(csv, "utf8");
    expect(text.split("\r\n")[0]).toBe(
      "station,name,month,min_degF,mean_degF,max_degF,mean_daily_range_degF,p90_daily_range_degF",
    );
    expect(text.split("\r\n")[1]).toMatch(/^725300-94846,,1,-16\.06,/);
  });

  it("exit code 2 and a one-line message naming the file for a gzip file cut short", async () => {
    const whole = readFileSync(sample("726430-14920-2015.gz"));
    const cut = join(dir, "cut.gz");
    writeFileSync(cut, whole.subarray(0, 3000));
    const r = await run(["climate", cut, "--no-cache"]);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/cut\.gz:gzip: gzip data ends early/);
    expect(r.err.trim().split("\n")).toHaveLength(1);
    expect(r.out).toBe("");
  });
});

describe("coldsoak climate usage and input errors", () => {
  it("exit code 2 for a file that is not a climate file", async () => {
    const p = join(dir, "notes.txt");
    writeFileSync(p, "hello\n");
    const r = await run(["climate", p, "--no-cache"]);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/notes\.txt:1: not a climate file/);
  });

  it("exit code 2 for bad options", async () => {
    expect((await run(["climate", dir, "--units", "metric"])).code).toBe(2);
    const r = await run(["climate", dir, "--gap-hours", "two"]);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/--gap-hours: "two" is not a whole number/);
    expect((await run(["climate", dir, "--min-year-share", "80"])).err).toMatch(/--min-year-share: "80"/);
    expect((await run(["climate"])).code).toBe(2);
  });
});
