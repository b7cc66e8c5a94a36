/**
 * One real day of the Chicago sample written out, inside the test, in the ISD-Lite and global-hourly CSV
 * layouts (NOAA NCEI ISD-Lite and global-hourly CSV) gives the same hourly series as the full format; plain and gzip alike.
 */
import { writeFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { HOUR_MS, loadClimate, readClimateFile } from "../../src/climate/index.js";
import {
  CHICAGO_HISTORY,
  CSV_HEADER,
  csvRow,
  HAVE_SAMPLES,
  noCache,
  sampleLines,
  scratchDir,
  writeLines,
} from "./helpers.js";

const tmp = scratchDir();

/** 2014-01-06 (the cold day) of the Chicago sample, plus the evening before for the first hour's window. */
function realDay(): string[] {
  return sampleLines("725300-94846-2014.gz").filter((l) => {
    const d = l.slice(15, 23);
    return d === "20140106" || (d === "20140105" && l.slice(23, 25) === "23");
  });
}

describe.skipIf(!HAVE_SAMPLES)("ISD-Lite and CSV layouts", () => {
  it("the CSV layout gives the full format's series, QC counts and extremes", async () => {
    const day = realDay();
    const full = writeLines(`${tmp.dir}/full.txt`, day);
    const csv = writeLines(`${tmp.dir}/day.csv`, [CSV_HEADER, ...day.map(csvRow)], true);
    expect((await readClimateFile(csv)).format).toBe("csv");
    const [a] = await loadClimate([full], noCache);
    const [b] = await loadClimate([csv], noCache);
    expect(b!.meta.id).toBe("725300-94846");
    expect(b!.meta.name).toBe("CHICAGO O'HARE INTERNATIONAL AIRPORT, IL US");
    expect(b!.series.startUtcMs).toBe(a!.series.startUtcMs);
    expect(Array.from(b!.series.tempC)).toEqual(Array.from(a!.series.tempC));
    expect(b!.qc).toEqual(a!.qc);
    expect(b!.extremes).toEqual(a!.extremes);
    // −26.7 °C at 13:51 UTC that day (real file; see samples.test.ts).
    expect(b!.extremes!.minC).toBe(-26.7);
    expect(b!.meanStationPressureHpa).toBeCloseTo(a!.meanStationPressureHpa!, 9);
  });

  it("the ISD-Lite layout (station from the file name, position from the station history) matches", async () => {
    const [a] = await loadClimate([writeLines(`${tmp.dir}/full2.txt`, realDay())], noCache);
    // One Lite line per grid hour of the full-format series: year month day hour temp dew slp ... (−9999 missing).
    const lite: string[] = [];
    for (let i = 0; i < a!.series.tempC.length; i++) {
      if (a!.series.filled[i]) continue; // Lite holds observations only
      const d = new Date(a!.series.startUtcMs + i * HOUR_MS);
      const v = a!.series.tempC[i]!;
      const t = Number.isNaN(v) ? -9999 : Math.round(v * 10);
      const cells = [
        d.getUTCFullYear(),
        d.getUTCMonth() + 1,
        d.getUTCDate(),
        d.getUTCHours(),
        t,
        -9999,
        -9999,
        250,
        31,
        4,
        0,
        -9999,
      ];
      lite.push(cells.map((c, k) => String(c).padStart(k === 0 ? 4 : k < 4 ? 2 : 5)).join(" "));
    }
    const litePath = writeLines(`${tmp.dir}/725300-94846-2014`, lite, true);
    expect((await readClimateFile(litePath)).format).toBe("isd-lite");
    const history = `${tmp.dir}/history.csv`;
    writeFileSync(history, CHICAGO_HISTORY);
    const [b] = await loadClimate([litePath], { ...noCache, stationHistoryCsv: history });
    expect(b!.meta).toMatchObject({ id: "725300-94846", lat: 41.995, lon: -87.934, elevationM: 205 });
    expect(b!.meta.timeZone).toBe("America/Chicago");
    expect(b!.series.startUtcMs).toBe(a!.series.startUtcMs);
    expect(Array.from(b!.series.tempC)).toEqual(Array.from(a!.series.tempC));
    expect(Array.from(b!.series.filled)).toEqual(Array.from(a!.series.filled));
  });

  it("an ISD-Lite file without coordinates anywhere is an input error naming the file", async () => {
    const p = writeLines(`${tmp.dir}/725300-94846-2015`, [
      "2015  1  1  0   -83  -156 10227   260    46     0     0 -9999",
    ]);
    await expect(loadClimate([p], noCache)).rejects.toThrow(/725300-94846-2015.*station-history/);
  });

  it("plain and gzip copies of a real file read the same (gzip told by its magic bytes)", async () => {
    const day = realDay();
    const [plain] = await loadClimate([writeLines(`${tmp.dir}/p.dat`, day)], noCache);
    const [gz] = await loadClimate([writeLines(`${tmp.dir}/g.dat`, day, true)], noCache);
    expect(gz!.qc).toEqual(plain!.qc);
    expect(Array.from(gz!.series.tempC)).toEqual(Array.from(plain!.series.tempC));
  });
});
