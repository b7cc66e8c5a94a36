/**
 * Turns the demo weather model (climateModel.ts) into ISD full-format station-year files, with the
 * blemishes real files have so that quality control has work to do:
 *   - the odd hour with no report at all, and a couple of multi-hour outages a year;
 *   - routine reports whose temperature is missing (+9999), flagged suspect (quality 2) or, rarely,
 *     erroneous (quality 3, value off by 40 °C, still inside the format's limits);
 *   - special reports (FM-16) between routine ones, more often under low cloud.
 * Every blemish is counted per station-year (`YearStats`) so tests can compare the reader's counts.
 */
import { gunzipSync, gzipSync } from "node:zlib";
import { type ModelHour, simulateHours, stationStream } from "./climateModel.js";
import { formatIsdLine, type IsdObservation } from "./isdRecord.js";
import { type Uniform, uniformInt } from "./prng.js";
import type { DemoStation } from "./stations.js";

const HOUR_MS = 3_600_000;
const MINUTE_MS = 60_000;
/** One knot in m/s (1852 m per hour). */
const KNOT_MPS = 1852 / 3600;

/** Per-hour probabilities of the injected blemishes (invented, demo only). */
export const BLEMISH_RATES = {
  absentHour: 0.003,
  outageStart: 2 / 8760,
  missingValue: 0.0005,
  erroneous: 0.00012,
  suspect: 0.0012,
  specialBase: 0.015,
  specialOvercast: 0.06,
} as const;
export const OUTAGE_MIN_H = 4;
export const OUTAGE_MAX_H = 30;
/** Size of the deliberate error in an erroneous record, °C. */
export const ERRONEOUS_OFFSET_C = 40;

/** What was written to one station-year file. */
export interface YearStats {
  year: number;
  /** Lines in the file (every line is one record). */
  records: number;
  routine: number;
  specials: number;
  /** Routine reports with temperature +9999. */
  missingValue: number;
  /** Routine reports with temperature quality 2. */
  suspect: number;
  /** Routine reports with temperature quality 3. */
  erroneous: number;
  /** Grid hours of the year without a routine report (absent hours and outages). */
  absentHours: number;
}

export interface StationYearFile {
  station: DemoStation;
  year: number;
  /** File name in NOAA's convention: USAF-WBAN-YEAR.gz */
  fileName: string;
  text: string;
  stats: YearStats;
}

/** Observation time of the routine report that stands for grid hour `hourMs`. */
export function routineTimeMs(hourMs: number, routineMinute: number): number {
  return routineMinute < 31 ? hourMs + routineMinute * MINUTE_MS : hourMs - (60 - routineMinute) * MINUTE_MS;
}

function observation(
  station: DemoStation,
  hour: ModelHour,
  utcMs: number,
  reportType: "FM-15" | "FM-16",
  tempC: number | null,
  tempQuality: string,
): IsdObservation {
  const overcast = hour.cloud > 0.625; // 5/8 or more: a ceiling exists
  const tempTenths = tempC === null ? null : Math.round(tempC * 10) / 10;
  // Dew point never above the written temperature.
  const dewPointC =
    tempTenths === null ? hour.dewPointC : Math.min(Math.round(hour.dewPointC * 10) / 10, tempTenths);
  return {
    usaf: station.usaf,
    wban: station.wban,
    utcMs,
    reportType,
    latDeg: station.latDeg,
    lonDeg: station.lonDeg,
    elevationM: station.elevationM,
    // Wind as a routine aviation report gives it: direction to 10°, speed in whole knots.
    windDeg: hour.windDeg === 0 ? 0 : Math.round(hour.windDeg / 10) * 10 || 360,
    windMps: Math.round(hour.windMps / KNOT_MPS) * KNOT_MPS,
    ceilingM: overcast ? Math.round((200 + (2800 * (1 - hour.cloud)) / 0.375) / 30) * 30 : null,
    visibilityM: hour.cloud > 0.85 ? 8000 : 16000,
    tempC: tempTenths,
    tempQuality,
    dewPointC: Math.max(-98.2, dewPointC),
    seaLevelHpa: hour.seaLevelHpa,
    altimeterHpa: hour.seaLevelHpa,
    stationHpa: hour.stationHpa,
    quality: station.goodQualityCode,
  };
}

interface TimedLine {
  utcMs: number;
  line: string;
  kind: "routine" | "special";
  flag: "good" | "missing" | "suspect" | "erroneous";
}

/**
 * Writes the records for every hour of the simulation. The blemish draws come from the same stream
 * right after the weather, in a fixed order per hour, so the files are reproducible.
 */
function recordsForHours(station: DemoStation, hours: ModelHour[], uniform: Uniform): TimedLine[] {
  const out: TimedLine[] = [];
  let outageLeft = 0;
  for (let i = 0; i < hours.length; i++) {
    const hour = hours[i]!;
    const uAbsent = uniform();
    const uOutage = uniform();
    const outageLength = uniformInt(uniform, OUTAGE_MIN_H, OUTAGE_MAX_H);
    const uFlag = uniform();
    const uSpecial = uniform();
    const specialMinute = uniformInt(uniform, 10, 40);

    if (outageLeft === 0 && uOutage < BLEMISH_RATES.outageStart) outageLeft = outageLength;
    const absent = outageLeft > 0 || uAbsent < BLEMISH_RATES.absentHour;
    if (outageLeft > 0) outageLeft--;

    if (!absent) {
      const r = BLEMISH_RATES;
      let flag: TimedLine["flag"] = "good";
      if (uFlag < r.missingValue) flag = "missing";
      else if (uFlag < r.missingValue + r.erroneous) flag = "erroneous";
      else if (uFlag < r.missingValue + r.erroneous + r.suspect) flag = "suspect";
      const t = hour.tempC;
      const written =
        flag === "missing"
          ? null
          : flag === "erroneous"
            ? t < 5
              ? t + ERRONEOUS_OFFSET_C
              : t - ERRONEOUS_OFFSET_C
            : t;
      const quality = flag === "suspect" ? "2" : flag === "erroneous" ? "3" : station.goodQualityCode;
      const utcMs = routineTimeMs(hour.utcMs, station.routineMinute);
      out.push({
        utcMs,
        kind: "routine",
        flag,
        line: formatIsdLine(observation(station, hour, utcMs, "FM-15", written, quality)),
      });
    } else {
      out.push({
        utcMs: routineTimeMs(hour.utcMs, station.routineMinute),
        kind: "routine",
        flag: "good",
        line: "",
      });
    }

    const next = hours[i + 1];
    const specialRate = BLEMISH_RATES.specialBase + (hour.cloud > 0.625 ? BLEMISH_RATES.specialOvercast : 0);
    if (next !== undefined && uSpecial < specialRate) {
      const f = specialMinute / 60;
      const tempC = hour.tempC + (next.tempC - hour.tempC) * f;
      const utcMs = hour.utcMs + specialMinute * MINUTE_MS;
      out.push({
        utcMs,
        kind: "special",
        flag: "good",
        line: formatIsdLine(observation(station, hour, utcMs, "FM-16", tempC, station.goodQualityCode)),
      });
    }
  }
  return out;
}

/**
 * Generates all station-year files of one station for [firstYear, lastYear]. The simulation runs
 * continuously from a day before the first year, so anomalies carry across New Year.
 */
export function generateStationYears(
  station: DemoStation,
  seed: number,
  firstYear: number,
  lastYear: number,
): StationYearFile[] {
  const uniform = stationStream(station, seed);
  const start = Date.UTC(firstYear, 0, 1) - 24 * HOUR_MS;
  const end = Date.UTC(lastYear + 1, 0, 1) + 2 * HOUR_MS;
  const hours = simulateHours(station, uniform, start, end);
  const lines = recordsForHours(station, hours, uniform);
  const files: StationYearFile[] = [];
  for (let year = firstYear; year <= lastYear; year++) {
    const y0 = Date.UTC(year, 0, 1);
    const y1 = Date.UTC(year + 1, 0, 1);
    const inYear = lines.filter((l) => l.utcMs >= y0 && l.utcMs < y1);
    const written = inYear.filter((l) => l.line !== "");
    const routine = inYear.filter((l) => l.kind === "routine");
    const stats: YearStats = {
      year,
      records: written.length,
      routine: written.filter((l) => l.kind === "routine").length,
      specials: written.filter((l) => l.kind === "special").length,
      missingValue: written.filter((l) => l.flag === "missing").length,
      suspect: written.filter((l) => l.flag === "suspect").length,
      erroneous: written.filter((l) => l.flag === "erroneous").length,
      absentHours: routine.filter((l) => l.line === "").length,
    };
    files.push({
      station,
      year,
      fileName: `${station.usaf}-${station.wban}-${year}.gz`,
      text: `${written.map((l) => l.line).join("\n")}\n`,
      stats,
    });
  }
  return files;
}

/** gzip at level 9. Node writes a zero modification time, so equal text gives equal bytes on one zlib. */
export function gzipText(text: string): Buffer {
  return gzipSync(Buffer.from(text, "latin1"), { level: 9 });
}

/** True when `existing` (gzip bytes) decompresses to exactly `text`. */
export function gzipHoldsText(existing: Uint8Array, text: string): boolean {
  try {
    return gunzipSync(existing).toString("latin1") === text;
  } catch {
    return false;
  }
}
