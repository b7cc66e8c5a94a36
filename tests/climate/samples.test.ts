/**
 * The climate pipeline on the real NOAA ISD samples in ../shared/isd-samples (public-domain data).
 * Skipped, with a message, where that folder is absent.
 */
import { IANAZone } from "luxon";
import { describe, expect, it } from "vitest";
import {
  HOUR_MS,
  loadClimate,
  readClimateFile,
  type StationClimate,
  stationSummary,
  timeZoneFor,
  valueAtHour,
} from "../../src/climate/index.js";
import { droppedTotal, HAVE_SAMPLES, noCache, sample, sampleLines } from "./helpers.js";

async function one(name: string): Promise<StationClimate> {
  const stations = await loadClimate([sample(name)], noCache);
  expect(stations).toHaveLength(1);
  return stations[0]!;
}

describe.skipIf(!HAVE_SAMPLES)("real ISD samples", () => {
  it("finland-6-stations-1901: six stations, highest good-quality temperature 31.7 °C", async () => {
    const stations = await loadClimate([sample("finland-6-stations-1901.gz")], noCache);
    // Six stations: the file's USAF+WBAN ids (real data file).
    expect(stations.map((s) => s.meta.id)).toEqual([
      "029070-99999",
      "029500-99999",
      "029600-99999",
      "029720-99999",
      "029810-99999",
      "227070-99999",
    ]);
    // 31.7 °C = 317 tenths: the worked maximum over the NCDC 1901 files with quality 0,1,4,5,9
    // (T. White, "Hadoop: The Definitive Guide", chapter 2; from memory).
    const max = Math.max(...stations.map((s) => s.extremes!.maxC));
    expect(max).toBe(31.7);
  });

  it("725300-94846 (Chicago O'Hare): coldest kept value −26.7 °C at 2014-01-06T13:51Z, one site", async () => {
    const s = await one("725300-94846-2014.gz");
    // −16 °F (−26.7 °C) that morning at 07:51 local (National Weather Service climate records; from memory).
    expect(s.extremes!.minC).toBe(-26.7);
    expect(s.extremes!.minUtc).toBe("2014-01-06T13:51:00Z");
    // Two positions 3 km apart are one site (docs/methods.md, "Second site").
    expect(s.qc.dropped.otherSite).toBe(0);
    expect(s.meta.timeZone).toBe("America/Chicago");
  });

  it("722540-13904 (Austin): the 474 synoptic reports of the second site are otherSite", async () => {
    const s = await one("722540-13904-2014.gz");
    // 474 FM-12 lines at +30300-097700, 189 m, about 13 km from the main site (count from the real file;
    // docs/methods.md, "Second site").
    const lines = sampleLines("722540-13904-2014.gz");
    expect(lines.filter((l) => l.slice(28, 51) === "+30300-097700FM-12+0189")).toHaveLength(474);
    expect(s.qc.dropped.otherSite).toBe(474);
    // 2014-01-02 12 UTC: the second site's FM-12 at 12:00 reads +3.3 °C, the main site's routine FM-15 at
    // 11:53 reads +2.8 °C (real file); the hour takes the main site's report.
    expect(valueAtHour(s.series, Date.UTC(2014, 0, 2, 12))).toBe(2.8);
  });

  it("Chicago: routine reports beat a special report that is nearer the hour", async () => {
    const s = await one("725300-94846-2014.gz");
    // Real file: 2014-01-01 02:51 FM-15 −11.1 °C, 03:00 FM-16 −11.7 °C; hour 03 UTC takes the FM-15.
    expect(valueAtHour(s.series, Date.UTC(2014, 0, 1, 3))).toBe(-11.1);
  });

  it("time zones from the records' coordinates", async () => {
    for (const name of ["725300-94846-2014.gz", "722540-13904-2014.gz", "726430-14920-2015.gz"]) {
      const s = await one(name);
      expect(s.meta.timeZone).toBe("America/Chicago"); // US Central time (IANA tz database)
    }
    const svalbard = await one("010060-99999-2014.gz");
    // Svalbard keeps Central European Time, UTC+1 in January (IANA tz database).
    expect(IANAZone.create(svalbard.meta.timeZone).offset(Date.UTC(2014, 0, 15))).toBe(60);
    expect(timeZoneFor(78.25, 22.817)).toBe(svalbard.meta.timeZone);
  });

  it("field positions of the first record of 010060-99999-2014 (ISD format document)", async () => {
    const f = await readClimateFile(sample("010060-99999-2014.gz"));
    const r = f.records;
    expect(f.format).toBe("isd");
    expect(f.stations[r.station[0]!]).toBe("010060-99999");
    expect(r.latMilli[0]).toBe(78250); // +78.250 (POS 29-34)
    expect(r.lonMilli[0]).toBe(22817); // +22.817 (POS 35-41)
    expect(r.elevM[0]).toBe(14); // 14 m (POS 47-51)
    expect(f.reportTypes[r.type[0]!]).toBe("FM-12"); // POS 42-46
    expect(r.tempTenths[0]).toBe(-136); // −13.6 °C (POS 88-92)
    expect(String.fromCharCode(r.tempQ[0]!)).toBe("1"); // quality code 1 (POS 93)
    expect(r.dewTenths[0]).toBe(-159); // −15.9 °C (POS 94-98)
    expect(r.timeMin[0]! * 60_000).toBe(Date.UTC(2014, 0, 1, 1, 0)); // 2014-01-01 01:00 UTC (POS 16-27)
    expect(r.slpTenths[0]).toBe(10239); // 1023.9 hPa (POS 100-104)
  });

  it("station pressure from the MA1 group (ISD format document, additional data)", async () => {
    const f = await readClimateFile(sample("725300-94846-2014.gz"));
    // Third line of the real file: ...MA1102575100115... → altimeter 1025.7 hPa, station pressure 1001.1 hPa.
    expect(f.records.stationPresTenths[2]).toBe(10011);
  });

  it.each([
    "010060-99999-2014.gz",
    "722540-13904-2014.gz",
    "725300-94846-2014.gz",
    "726430-14920-2015.gz",
    "finland-6-stations-1901.gz",
  ])("%s: read = kept + Σ dropped, every line read, summaries counted", async (name) => {
    const stations = await loadClimate([sample(name)], noCache);
    const lines = sampleLines(name);
    let read = 0;
    for (const s of stations) {
      expect(s.qc.read).toBe(s.qc.kept + droppedTotal(s.qc)); // invariant of docs/methods.md
      read += s.qc.read;
    }
    expect(read).toBe(lines.length); // every line of the real file lands in one count
    // Summary-of-day and -month records (report type SOD / SOM, POS 42-46) are counted as summary.
    const summaries = lines.filter((l) => /^(SOD|SOM) /.test(l.slice(41, 46))).length;
    expect(stations.reduce((a, s) => a + s.qc.dropped.summary, 0)).toBe(summaries);
  });

  it("at most one value per UTC hour, each an observation of the file within ±30 min", async () => {
    const name = "725300-94846-2014.gz";
    const s = await one(name);
    expect(s.series.startUtcMs % HOUR_MS).toBe(0);
    // Index the real file's temperatures by minute (independent of the reader's code).
    const byMinute = new Map<number, Set<number>>();
    for (const l of sampleLines(name)) {
      const t = Date.UTC(
        +l.slice(15, 19),
        +l.slice(19, 21) - 1,
        +l.slice(21, 23),
        +l.slice(23, 25),
        +l.slice(25, 27),
      );
      const set = byMinute.get(t) ?? new Set();
      set.add(Number(l.slice(87, 92)) / 10);
      byMinute.set(t, set);
    }
    let checked = 0;
    for (let i = 0; i < s.series.tempC.length; i++) {
      if (s.series.filled[i] || Number.isNaN(s.series.tempC[i]!)) continue;
      const h = s.series.startUtcMs + i * HOUR_MS;
      let found = false;
      for (let m = -30; m <= 30 && !found; m++)
        found = byMinute.get(h + m * 60_000)?.has(s.series.tempC[i]!) ?? false;
      expect(found).toBe(true);
      checked++;
    }
    // The real file runs from 2014-01-01 00:00 to 2014-04-23 05:51 UTC (about 2695 hours) and holds
    // 2688 routine FM-15 lines, all but a few of good quality; the bound leaves room for hours without one.
    expect(checked).toBeGreaterThan(2500);
    const sum = stationSummary(s);
    expect(sum.hours).toBeLessThanOrEqual(s.series.tempC.length);
  });
});
