/**
 * The demo climate generator: its small functions, the committed files (format, reproducibility) and
 * what the project's own climate reader makes of them (counts and monthly statistics).
 */
import { readdirSync, readFileSync } from "node:fs";
import { gunzipSync } from "node:zlib";
import { beforeAll, describe, expect, it } from "vitest";
import {
  hourlyOffsetsMin,
  loadClimate,
  monthlyClimate,
  type StationClimate,
} from "../../src/climate/index.js";
import { generateStationYears, type StationYearFile } from "../../src/demo/climateFiles.js";
import {
  ar1Phi,
  cloudOffsetFor,
  diurnalShape,
  interpolateMonthly,
  monthlyAnchors,
  normalCdf,
  outbreakExpectedDepthC,
  outbreakMeanDegreeHours,
  simulateHours,
  stationStream,
} from "../../src/demo/climateModel.js";
import { mulberry32, standardNormal } from "../../src/demo/prng.js";
import {
  DEMO_FIRST_YEAR,
  DEMO_LAST_YEAR,
  DEMO_SEED,
  DEMO_STATIONS,
  type DemoStation,
  KORRASH,
  type Monthly,
  stationId,
} from "../../src/demo/stations.js";

const CLIMATE_DIR = new URL("../../sample-data/climate/", import.meta.url);
const YEARS = DEMO_LAST_YEAR - DEMO_FIRST_YEAR + 1;

/** Every station-year as the generator writes it today (computed once, shared by the tests). */
let generatedOnce: StationYearFile[] | null = null;
function generatedFiles(): StationYearFile[] {
  generatedOnce ??= DEMO_STATIONS.flatMap((st) =>
    generateStationYears(st, DEMO_SEED, DEMO_FIRST_YEAR, DEMO_LAST_YEAR),
  );
  return generatedOnce;
}

describe("small functions of the weather model", () => {
  it("solves mid-month anchors whose piecewise-linear curve averages to each month's target", () => {
    // Target values invented (demo); the property is exact algebra, checked by numeric integration.
    const target: Monthly = [-20, -18, -10, 0, 8, 15, 18, 16, 9, 1, -9, -17];
    const anchors = monthlyAnchors(target);
    for (let m = 0; m < 12; m++) {
      let sum = 0;
      const steps = 1000;
      for (let k = 0; k < steps; k++) sum += interpolateMonthly(anchors, m + (k + 0.5) / steps);
      expect(sum / steps).toBeCloseTo(target[m]!, 6);
    }
  });

  it("gives a diurnal shape with its minimum at 06 h, maximum at 15 h, unit range and zero daily mean", () => {
    // Shape defined in climateModel.ts (common practice, no source: minimum near sunrise, maximum mid-afternoon).
    expect(diurnalShape(6)).toBeCloseTo(-0.5, 12);
    expect(diurnalShape(15)).toBeCloseTo(0.5, 12);
    let sum = 0;
    for (let k = 0; k < 2400; k++) sum += diurnalShape(k / 100);
    expect(sum / 2400).toBeCloseTo(0, 6);
  });

  it("computes the standard normal distribution function", () => {
    // Φ(1.96) = 0.9750, Φ(−1) = 0.1587, Φ(0) = 0.5: standard normal table (Abramowitz and Stegun, table 26.1).
    expect(normalCdf(1.96)).toBeCloseTo(0.975, 4);
    expect(normalCdf(-1)).toBeCloseTo(0.1587, 4);
    expect(normalCdf(0)).toBeCloseTo(0.5, 7);
  });

  it("finds the cloud offset whose mean cloud fraction is the target", () => {
    // E[Φ(Z + b)] = Φ(b/√2) for standard normal Z (convolution of normals), checked by sampling.
    const uniform = mulberry32(42);
    const b = cloudOffsetFor(0.7);
    let sum = 0;
    const n = 20000;
    for (let i = 0; i < n; i++) sum += normalCdf(standardNormal(uniform) + b);
    // Cloud fraction sd < 0.5, so the sample mean's SE < 0.0036; 4 SE.
    expect(Math.abs(sum / n - 0.7)).toBeLessThan(0.015);
  });

  it("draws uniform and normal numbers with the right first two moments", () => {
    // Moments of U(0,1) (1/2, 1/12) and N(0,1); tolerances are 5 standard errors for n = 50 000.
    const uniform = mulberry32(7);
    const n = 50000;
    let su = 0;
    let sz = 0;
    let szz = 0;
    for (let i = 0; i < n; i++) {
      su += uniform();
      const z = standardNormal(uniform);
      sz += z;
      szz += z * z;
    }
    expect(Math.abs(su / n - 0.5)).toBeLessThan(5 * Math.sqrt(1 / 12 / n));
    expect(Math.abs(sz / n)).toBeLessThan(5 / Math.sqrt(n));
    expect(Math.abs(szz / n - 1)).toBeLessThan(5 * Math.sqrt(2 / n));
  });

  it("is unbiased over a long run: 60 simulated years match the monthly targets", () => {
    // The cold continental station has the largest synoptic and outbreak variance of the four.
    const st = KORRASH;
    const hours = simulateHours(st, stationStream(st, 99), Date.UTC(1900, 0, 1), Date.UTC(1960, 0, 1));
    const sum = new Array<number>(12).fill(0);
    const n = new Array<number>(12).fill(0);
    for (const h of hours) {
      const m = new Date(h.utcMs + (st.lonDeg / 15) * 3_600_000).getUTCMonth();
      sum[m]! += h.tempC;
      n[m]!++;
    }
    for (let m = 0; m < 12; m++) {
      expect(Math.abs(sum[m]! / n[m]! - st.monthlyMeanC[m]!)).toBeLessThan(monthlyMeanTolerance(st, m, 60));
    }
    // Averaged over the twelve months the random parts shrink, so a small bias common to every month
    // shows: four standard errors of the mean of twelve monthly deviations, taking months as independent
    // (the synoptic correlation time, days, is short against a month; outbreak bound as below). The
    // month-edge effects of the per-month allowance cancel over a year.
    let meanDeviation = 0;
    let variance = 0;
    for (let m = 0; m < 12; m++) {
      meanDeviation += (sum[m]! / n[m]! - st.monthlyMeanC[m]!) / 12;
      variance += monthlyMeanVariance(st, m, 60) / 144;
    }
    expect(Math.abs(meanDeviation)).toBeLessThan(4 * Math.sqrt(variance));
  });
});

/**
 * Allowed difference between a month's mean over `years` years and its target: four standard errors of
 * the two random parts plus 0.3 °C for what the error model leaves out (local versus solar month
 * edges, rounding to 0.1 °C, gap filling, the cloud-dependent terms).
 *  - AR(1) synoptic anomaly: var(mean) = σ²(1 + φ)/((1 − φ)n) for n hourly values (variance of the mean
 *    of an AR(1) series; von Storch and Zwiers, Statistical Analysis in Climate Research, ch. 17, from memory).
 *  - Cold outbreaks, a compound Poisson sum: var = λ·E[(depth·duration)²]/n², bounded here with
 *    E[(DA)²] ≤ (2·E[D]·E[A])² since depth is capped at twice its nominal mean and the hold at 4 days.
 */
function monthlyMeanTolerance(st: DemoStation, month: number, years: number): number {
  return 4 * Math.sqrt(monthlyMeanVariance(st, month, years)) + 0.3;
}

/** Variance of a month's mean over `years` years from the two random parts (see above), °C². */
function monthlyMeanVariance(st: DemoStation, month: number, years: number): number {
  const n = 30.44 * 24 * years;
  const phi = ar1Phi(st.synopticTauHours);
  const sd = st.monthlySynopticSdC[month]!;
  const synVar = (sd * sd * (1 + phi)) / ((1 - phi) * n);
  const degreeHours = outbreakMeanDegreeHours(outbreakExpectedDepthC(st.outbreakDepthMeanC));
  const outVar = (st.monthlyOutbreaks[month]! * years * (2 * degreeHours) ** 2) / (n * n);
  return synVar + outVar;
}

describe("committed demo climate files", () => {
  const files = readdirSync(CLIMATE_DIR).filter((f) => f.endsWith(".gz"));
  let generated: StationYearFile[];
  beforeAll(() => {
    generated = generatedFiles();
  });

  it("holds one file per station and year, named USAF-WBAN-YEAR.gz", () => {
    // File naming: ISD format document, control section note 1 (e.g. 723150-03812-2006).
    const expected = DEMO_STATIONS.flatMap((st) =>
      Array.from({ length: YEARS }, (_, i) => `${stationId(st)}-${DEMO_FIRST_YEAR + i}.gz`),
    ).sort();
    expect(files.sort()).toEqual(expected);
    expect(YEARS).toBeGreaterThanOrEqual(10); // the demo's design: at least 10 years per station (sample-data/README.md)
  });

  it("are what the generator writes today (regeneration is byte-identical in content)", () => {
    for (const g of generated) {
      const committed = gunzipSync(readFileSync(new URL(g.fileName, CLIMATE_DIR))).toString("latin1");
      expect(committed === g.text, g.fileName).toBe(true);
    }
  });

  it("follow the fixed-position layout of the format document", () => {
    // 999703-99999: the invented id of ISKARRA (demo); 2016, a leap year, as an example year.
    const g = generated.find((f) => f.fileName === "999703-99999-2016.gz")!;
    const lines = g.text.trimEnd().split("\n");
    expect(lines.length).toBe(g.stats.records);
    for (const line of lines) {
      // ISD format document, control data section: POS 1-4 total variable characters; record length = 105 + it.
      expect(line.length).toBe(105 + Number(line.slice(0, 4)));
      expect(line.slice(4, 10)).toBe("999703"); // POS 5-10 USAF id
      expect(line.slice(10, 15)).toBe("99999"); // POS 11-15 WBAN id
      expect(line.slice(15, 19)).toBe("2016"); // POS 16-23 date YYYYMMDD
      expect(["FM-15", "FM-16"]).toContain(line.slice(41, 46)); // POS 42-46 report type
      // Position of the invented station ISKARRA (src/demo/stations.ts: 70.612, −153.284; invented, demo).
      expect(line.slice(28, 34)).toBe("+70612"); // POS 29-34 latitude ×1000
      expect(line.slice(34, 41)).toBe("-153284"); // POS 35-41 longitude ×1000
      const temp = line.slice(87, 92); // POS 88-92 air temperature ×10, MIN −0932 MAX +0618, +9999 missing
      expect(temp === "+9999" || (Number(temp) >= -932 && Number(temp) <= 618)).toBe(true);
      const dew = Number(line.slice(93, 98)); // POS 94-98 dew point, MIN −0982 MAX +0368
      expect(dew >= -982 && dew <= 368).toBe(true);
      if (temp !== "+9999" && line[92] !== "3") expect(dew).toBeLessThanOrEqual(Number(temp));
      const slp = Number(line.slice(99, 104)); // POS 100-104 sea-level pressure ×10, MIN 08600 MAX 10900
      expect(slp >= 8600 && slp <= 10900).toBe(true);
      expect(line.slice(105, 111)).toBe("ADDMA1"); // additional data section, MA1 group
    }
  });
});

describe("the project's climate reader on the demo files", () => {
  let stations: StationClimate[];
  let generated: StationYearFile[];
  beforeAll(async () => {
    stations = await loadClimate([CLIMATE_DIR.pathname], { gapHours: 3, cacheDir: null });
    generated = generatedFiles();
  });

  it("finds the four invented stations with their positions and sensible time zones", () => {
    expect(stations.map((s) => s.meta.id)).toEqual(DEMO_STATIONS.map(stationId));
    // Zones expected for these coordinates (IANA tz database boundaries, from memory).
    const zones = ["America/Los_Angeles", "America/Regina", "America/Anchorage", "America/Phoenix"];
    stations.forEach((s, i) => {
      const st = DEMO_STATIONS[i]!;
      expect(s.meta.lat).toBe(st.latDeg);
      expect(s.meta.lon).toBe(st.lonDeg);
      expect(s.meta.elevationM).toBe(st.elevationM);
      expect(s.meta.timeZone).toBe(zones[i]);
    });
  });

  it("counts every record once: read = kept + dropped, with the injected blemishes as dropped", () => {
    // QC rules: docs/methods.md §4 (quality 2 suspect, 3 erroneous, +9999 missing).
    for (const [i, s] of stations.entries()) {
      const st = DEMO_STATIONS[i]!;
      const mine = generated.filter((g) => g.station === st).map((g) => g.stats);
      const total = (k: "records" | "suspect" | "erroneous" | "missingValue") =>
        mine.reduce((sum, y) => sum + y[k], 0);
      const d = s.qc.dropped;
      const droppedSum = Object.values(d).reduce((a, b) => a + b, 0);
      expect(s.qc.read).toBe(total("records"));
      expect(s.qc.read).toBe(s.qc.kept + droppedSum);
      expect(d.suspect).toBe(total("suspect"));
      expect(d.erroneous).toBe(total("erroneous"));
      expect(d.missing).toBe(total("missingValue"));
      expect(d.suspect).toBeGreaterThan(0);
      expect(d.erroneous).toBeGreaterThan(0);
      expect(d.malformed + d.summary + d.otherSite + d.range + d.duplicate).toBe(0);
    }
  });

  it("has nearly every hour present after gap filling", () => {
    for (const s of stations) {
      const present = s.series.tempC.filter((v) => !Number.isNaN(v)).length;
      // ~0.3 % absent hours and two outages a year are injected; ≥ 98 % must survive (invented demo rates).
      // 8766 = mean hours in a year (365.25 × 24); the series may not exceed every hour of the period.
      expect(present / (YEARS * 8766)).toBeGreaterThan(0.98);
      expect(present / (YEARS * 8766)).toBeLessThan(1.0001);
    }
  });

  it("gives monthly mean temperatures that match the generator's targets", () => {
    for (const [i, s] of stations.entries()) {
      const st = DEMO_STATIONS[i]!;
      const months = monthlyClimate(s.series, s.meta.timeZone);
      for (const m of months) {
        const target = st.monthlyMeanC[m.month - 1]!;
        const tol = monthlyMeanTolerance(st, m.month - 1, YEARS);
        expect(Math.abs(m.meanC! - target), `${st.name} month ${m.month}`).toBeLessThan(tol);
      }
    }
  });

  it("gives a mean diurnal cycle whose amplitude matches the generator's monthly target", () => {
    // Averaging by local hour removes the synoptic and outbreak terms (not tied to the hour), leaving the
    // diurnal cycle with its mean amplitude. Tolerance: 10 % (cloud-factor sampling over ~300 days,
    // hourly sampling of the peaks, daylight-saving changes within a month) plus 0.5 °C (common practice,
    // no source).
    for (const [i, s] of stations.entries()) {
      const st = DEMO_STATIONS[i]!;
      const offsets = hourlyOffsetsMin(s.series, s.meta.timeZone);
      const sum = Array.from({ length: 12 }, () => new Array<number>(24).fill(0));
      const cnt = Array.from({ length: 12 }, () => new Array<number>(24).fill(0));
      for (let k = 0; k < s.series.tempC.length; k++) {
        const v = s.series.tempC[k]!;
        if (Number.isNaN(v)) continue;
        const local = new Date(s.series.startUtcMs + k * 3_600_000 + offsets[k]! * 60_000);
        sum[local.getUTCMonth()]![local.getUTCHours()]! += v;
        cnt[local.getUTCMonth()]![local.getUTCHours()]!++;
      }
      for (let m = 0; m < 12; m++) {
        const cycle = sum[m]!.map((v, h) => v / cnt[m]![h]!);
        const amplitude = Math.max(...cycle) - Math.min(...cycle);
        const target = st.monthlyDiurnalRangeC[m]!;
        expect(Math.abs(amplitude - target), `${st.name} month ${m + 1}`).toBeLessThan(0.1 * target + 0.5);
      }
    }
  });
});
