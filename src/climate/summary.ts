/**
 * Per-station figures of `coldsoak climate --json` (README, Outputs): period, hours with a
 * value, filled hours, completeness, QC counts, extremes and the monthly local-time climatology.
 */

import { monthlyClimate } from "./climatology.js";
import { filledHours, presentHours } from "./hourly.js";
import { type Extremes, HOUR_MS, type MonthClimate, type QcCounts, type StationClimate } from "./types.js";

export interface StationSummary {
  id: string;
  name: string | null;
  lat: number;
  lon: number;
  elevationM: number;
  timeZone: string;
  firstUtc: string | null; // first grid hour with a value
  lastUtc: string | null;
  hours: number; // grid hours with a value, filled included
  filledHours: number;
  completeness: number; // hours / grid hours from first to last, 0–1
  qc: QcCounts;
  extremes: Extremes | null;
  months: MonthClimate[];
}

/** ISO UTC time without milliseconds, e.g. 2014-01-06T13:00:00Z. */
export function isoUtc(ms: number): string {
  return new Date(ms).toISOString().replace(".000Z", "Z");
}

/** Identity and coverage of a station's series: the part of the summary the planning report shows. */
export function stationCoverage(s: StationClimate): Omit<StationSummary, "extremes" | "months"> {
  const n = s.series.tempC.length;
  const hours = presentHours(s.series);
  return {
    id: s.meta.id,
    name: s.meta.name,
    lat: s.meta.lat,
    lon: s.meta.lon,
    elevationM: s.meta.elevationM,
    timeZone: s.meta.timeZone,
    firstUtc: n > 0 ? isoUtc(s.series.startUtcMs) : null,
    lastUtc: n > 0 ? isoUtc(s.series.startUtcMs + (n - 1) * HOUR_MS) : null,
    hours,
    filledHours: filledHours(s.series),
    completeness: n > 0 ? hours / n : 0,
    qc: s.qc,
  };
}

export function stationSummary(s: StationClimate): StationSummary {
  return {
    ...stationCoverage(s),
    extremes: s.extremes,
    months: s.months ?? monthlyClimate(s.series, s.meta.timeZone),
  };
}
