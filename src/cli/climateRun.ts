/**
 * `coldsoak climate <files or folders...>`: reads NOAA ISD climate files and prints, per station, the
 * period, hours, completeness, quality-control counts, monthly local-time climatology and extremes
 * (docs/methods.md, "Climate data"). `--json` prints the same as JSON on stdout.
 */
import type { SingleBar } from "cli-progress";
import { DateTime } from "luxon";
import { loadClimate } from "../climate/load.js";
import { type StationSummary, stationSummary } from "../climate/summary.js";
import { type ClimateOptions, DROP_REASONS, type StationClimate } from "../climate/types.js";
import { InputError } from "../errors.js";
import { writeFileAtomic } from "../fsutil.js";
import { toCsv } from "../output/csv.js";
import { formatDisplay, pct, show, type Units, unitSystem } from "../units/index.js";
import { designLines, parseMinYearShare, type StationDesign, stationDesign } from "./climateDesignText.js";

export interface ClimateCliOptions {
  units: Units;
  json?: boolean;
  csv?: string;
  gapHours: string;
  cacheDir: string;
  cache: boolean;
  stationHistory?: string;
  stationId?: string;
  minYearShare: string;
}

/** A progress bar is drawn on stderr from this many files on (and only on a terminal). */
const PROGRESS_MIN_FILES = 8;

const MONTHS = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"];

const count = (n: number) => formatDisplay(n, 0);

/** Temperature and temperature difference in the user's units. */
function temp(c: number, units: Units): number {
  return unitSystem(units).temp.convert(c);
}
function delta(c: number, units: Units): number {
  return unitSystem(units).tempDelta.convert(c);
}

function localTime(utcIso: string, zone: string): string {
  return DateTime.fromISO(utcIso, { zone: "utc" }).setZone(zone).toFormat("yyyy-MM-dd HH:mm ZZZZ");
}

function parseGapHours(text: string): number {
  const n = Number(text);
  if (!/^\d+$/.test(text.trim()) || !Number.isInteger(n) || n > 48)
    throw new InputError(`--gap-hours: "${text}" is not a whole number of hours 0–48, e.g. --gap-hours 3`);
  return n;
}

/** The per-station text block of the table output. */
export function formatStation(s: StationSummary, units: Units, design: StationDesign | null = null): string {
  const sys = unitSystem(units);
  const u = sys.temp.unit;
  const lines: string[] = [];
  lines.push(`${s.id}  ${s.name ?? "(name unknown: --station-history gives names)"}`);
  lines.push(
    `  position ${formatDisplay(s.lat, 3)}, ${formatDisplay(s.lon, 3)}, elevation ${show(sys.length, s.elevationM)} ${sys.length.unit}, time zone ${s.timeZone}`,
  );
  lines.push(
    `  period ${s.firstUtc ?? "–"} to ${s.lastUtc ?? "–"}: ${count(s.hours)} hours with a value (${count(s.filledHours)} filled), completeness ${pct(s.completeness * 100)} %`,
  );
  const dropped = DROP_REASONS.map((r) => `${r} ${count(s.qc.dropped[r])}`).join(", ");
  lines.push(`  records read ${count(s.qc.read)}, kept ${count(s.qc.kept)}; dropped: ${dropped}`);
  if (s.extremes) {
    const e = s.extremes;
    lines.push(
      `  coldest ${show(sys.temp, e.minC)} ${u} at ${e.minUtc} (${localTime(e.minUtc, s.timeZone)}); warmest ${show(sys.temp, e.maxC)} ${u} at ${e.maxUtc} (${localTime(e.maxUtc, s.timeZone)})`,
    );
  }
  lines.push(`  month      min     mean      max   mean range  P90 range   (${u}, local time)`);
  for (const m of s.months) {
    if (m.minC === null) continue;
    const cells = [
      show(sys.temp, m.minC),
      show(sys.temp, m.meanC),
      show(sys.temp, m.maxC),
      show(sys.tempDelta, m.meanDailyRangeC),
      show(sys.tempDelta, m.p90DailyRangeC),
    ];
    lines.push(
      `  ${MONTHS[m.month - 1]!.padEnd(5)}${cells[0]!.padStart(8)} ${cells[1]!.padStart(8)} ${cells[2]!.padStart(8)} ${cells[3]!.padStart(12)} ${cells[4]!.padStart(10)}`,
    );
  }
  if (design !== null) lines.push(...designLines(design, units));
  return lines.join("\n");
}

/** One row per station and local month, in the chosen units (unit in the column names). */
export function climateCsv(stations: StationSummary[], units: Units): string {
  const t = units === "us" ? "degF" : "degC";
  const columns = [
    "station",
    "name",
    "month",
    `min_${t}`,
    `mean_${t}`,
    `max_${t}`,
    `mean_daily_range_${t}`,
    `p90_daily_range_${t}`,
  ];
  const r2 = (v: number | null) => (v === null ? null : Math.round(v * 100) / 100);
  const rows = stations.flatMap((s) =>
    s.months.map((m) => [
      s.id,
      s.name,
      m.month,
      r2(m.minC === null ? null : temp(m.minC, units)),
      r2(m.meanC === null ? null : temp(m.meanC, units)),
      r2(m.maxC === null ? null : temp(m.maxC, units)),
      r2(m.meanDailyRangeC === null ? null : delta(m.meanDailyRangeC, units)),
      r2(m.p90DailyRangeC === null ? null : delta(m.p90DailyRangeC, units)),
    ]),
  );
  return toCsv({ name: "climate", columns, rows });
}

/**
 * The `--json` document of the stations and their summaries (in the same order), with their design
 * temperatures when given; temperatures always in °C.
 */
export function climateJson(
  stations: StationClimate[],
  summaries: StationSummary[],
  designs: StationDesign[] | null = null,
): unknown {
  return {
    stations: stations.map((s, i) => ({
      ...summaries[i]!,
      callLetters: s.meta.callLetters,
      meanStationPressureHpa:
        s.meanStationPressureHpa === null ? null : Math.round(s.meanStationPressureHpa * 10) / 10,
      ...(designs === null ? {} : { design: designs[i]! }),
    })),
  };
}

export async function runClimate(paths: string[], opts: ClimateCliOptions): Promise<void> {
  const gapHours = parseGapHours(opts.gapHours);
  const minYearShare = parseMinYearShare(opts.minYearShare);
  let bar: SingleBar | null = null;
  // The progress bar's library is loaded only where a bar can be drawn.
  const progress = process.stderr.isTTY ? await import("cli-progress") : null;
  const options: ClimateOptions = {
    gapHours,
    cacheDir: opts.cache ? opts.cacheDir : null,
    summarize: true,
    onWarning: (w) => process.stderr.write(`coldsoak: warning: ${w}\n`),
    onProgress: (done, total) => {
      if (total < PROGRESS_MIN_FILES || progress === null) return;
      if (bar === null) {
        bar = new progress.SingleBar({
          stream: process.stderr,
          format: "climate files [{bar}] {value}/{total}",
        });
        bar.start(total, 0);
      }
      bar.update(done);
      if (done === total) bar.stop();
    },
  };
  if (opts.stationHistory !== undefined) options.stationHistoryCsv = opts.stationHistory;
  if (opts.stationId !== undefined) {
    if (!/^[0-9A-Z]{6}-\d{5}$/.test(opts.stationId))
      throw new InputError(
        `--station-id: "${opts.stationId}" is not USAF-WBAN, e.g. --station-id 725300-94846`,
      );
    options.stationIdOverride = opts.stationId;
  }
  let stations: StationClimate[];
  try {
    stations = await loadClimate(paths, options);
  } finally {
    (bar as SingleBar | null)?.stop();
  }
  for (const s of stations) {
    const bad = s.qc.dropped.malformed;
    if (bad > 0)
      process.stderr.write(
        `coldsoak: warning: ${s.meta.id}: ${bad} malformed line(s) skipped, e.g.\n${s.malformedExamples.map((e) => `  ${e}`).join("\n")}\n`,
      );
  }
  const summaries = stations.map(stationSummary);
  if (opts.csv !== undefined) await writeFileAtomic(opts.csv, climateCsv(summaries, opts.units));
  const designs = stations.map((s) => stationDesign(s, opts.units, minYearShare));
  if (opts.json)
    process.stdout.write(`${JSON.stringify(climateJson(stations, summaries, designs), null, 2)}\n`);
  else
    process.stdout.write(
      `${summaries.map((s, i) => formatStation(s, opts.units, designs[i]!)).join("\n\n")}\n`,
    );
}
