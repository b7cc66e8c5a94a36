/**
 * Small pieces shared by the report's sections and by `view.ts`: the context a base's section is
 * built from, the figure counter, table rows, the status cells of base-months, and the text helpers
 * for months, years, intervals and local times. Reads only the `Results` types.
 */
import type { BaseResult, MonthRow, Results, StatusName } from "../plan/results.js";
import { pct, shownText, showWithUnit, type UnitSystem, unitSystem } from "../units/index.js";
import type { Chart } from "./charts.js";

export const MONTHS = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"];

export function monthName(month: number): string {
  return MONTHS[month - 1] ?? String(month);
}

/** Status of one base and month, as the results decide it (`MonthRow.status`). */
export type Status = StatusName;

export const STATUS_LABEL: Record<Status, string> = {
  act: "Act",
  watch: "Watch",
  ok: "OK",
  "no-stay": "No stay",
  "no-data": "No data",
};

/** One status as a cell shows it: mark (outlined at low confidence), word, years, figure with its interval. */
export interface StatusCell {
  status: Status;
  label: string;
  /** Outlined mark and "(n yrs)": fewer usable years than the plan's minimum. */
  lowConfidence: boolean;
  years: string;
  /** "part no data" where some stays there have no data. */
  part: string;
  /** The figure that set the status with its 90 % interval, or "". */
  figure: string;
  title: string;
}

/** "12.3 % (9.5–15.1)": a share with its 90 % interval ("" without a value). */
export function pctInterval(v: number | null, lo: number | null, hi: number | null): string {
  if (v === null) return "";
  return lo === null || hi === null ? `${pct(v)} %` : `${pct(v)} % (${pct(lo)}–${pct(hi)})`;
}

/** "9 yrs" / "1 yr". */
export function yearsShort(n: number): string {
  return `${n} yr${n === 1 ? "" : "s"}`;
}

/** The status cell of a base-month. */
export function statusCell(base: string, m: MonthRow): StatusCell {
  const label = STATUS_LABEL[m.status];
  const figure = pctInterval(m.statusPct, m.statusPctLo90, m.statusPctHi90);
  const why =
    m.status === "act"
      ? `: ${m.statusAircraft.join(", ")} short of energy, up to ${figure} of starts (90 % interval)`
      : m.status === "watch"
        ? `: ${figure} of first preflights out of band (90 % interval)`
        : "";
  const years =
    m.status === "no-stay" || m.status === "no-data" ? "" : `; ${yearsShort(m.statusYears)} of climate data`;
  return {
    status: m.status,
    label,
    lowConfidence: m.lowConfidence,
    years: m.lowConfidence ? `(${yearsShort(m.statusYears)})` : "",
    part: m.partNoData ? "part no data" : "",
    figure,
    title: `${base}, ${monthName(m.month)}: ${label}${why}${years}${m.lowConfidence ? ", low confidence" : ""}${m.partNoData ? "; part no data" : ""}`,
  };
}

export interface Figure {
  chart: Chart;
  number: number;
  caption: string;
}

/** One table row of display strings; the first cell is the row header. */
export interface TableRow {
  cells: string[];
}

/** Counts figures across the whole report so captions read "Figure 1", "Figure 2", … in order. */
export class FigureCounter {
  n = 0;
  next(chart: Chart, caption: string): Figure {
    this.n += 1;
    return { chart, number: this.n, caption };
  }
}

/** What a base's section is built from. Sections are built in report order, so figures number in order. */
export interface BaseContext {
  results: Results;
  base: BaseResult;
  /** Fragment id of the base's part of the report ("base-1", …), also the prefix of its chart ids. */
  anchor: string;
  u: UnitSystem;
  figs: FigureCounter;
}

/** Fragment id of the i-th base (0-based) in the report. */
export function baseAnchor(index: number): string {
  return `base-${index + 1}`;
}

/**
 * Where the fleet-wide parts of the report link to a base's part: its fragment in the same file, or
 * (split report) its own page. `fragment` is an id inside the base's part; without it, the part itself.
 */
export type BaseHref = (index: number, fragment?: string) => string;

/** The links of a report in one file: fragments of the same page. */
export const samePage: BaseHref = (index, fragment) => `#${fragment ?? baseAnchor(index)}`;

/**
 * Which air surrounds the aircraft in a base's hangar hours, from the plan's hangar assumptions of the
 * base (keys `bases.<name>.hangar.{kind,heatedTo,timeConstant,offset,in,out,months}`), in the plan's
 * units: "heated hangar air, the outside air or 59.0 °F where colder, from 19:00 to 06:30", "unheated
 * shelter air, the outside air 6 h behind and +3.6 °F, from 20:00 to 06:00 in Nov, Dec"; null without one.
 */
export function hangarText(results: Results, baseName: string): string | null {
  const get = (k: string) => results.assumptions.find((a) => a.key === `bases.${baseName}.hangar.${k}`);
  const kind = get("kind")?.value;
  const from = get("in");
  const to = get("out");
  if (!from || !to || (kind !== "heated" && kind !== "shelter")) return null;
  const u = unitSystem(results.units);
  let air: string;
  if (kind === "heated") {
    const setPoint = get("heatedTo")?.value;
    const t = typeof setPoint === "number" ? showWithUnit(u.temp, setPoint) : "its set point";
    air = `heated hangar air, the outside air or ${t} where colder,`;
  } else {
    const lag = get("timeConstant");
    const offset = get("offset")?.value;
    const off =
      typeof offset === "number" && offset !== 0
        ? ` and ${offset > 0 ? "+" : ""}${showWithUnit(u.tempDelta, offset)}`
        : "";
    air = `unheated shelter air, the outside air ${lag ? shownText(lag, u) : "some hours"} behind${off},`;
  }
  const months = get("months")?.value;
  const when = Array.isArray(months) ? ` in ${months.join(", ")}` : "";
  return `${air} from ${from.value} to ${to.value}${when}`;
}

/** "2015–2017, 2019 (4 years)": runs of consecutive years joined, then the count; "none" when empty. */
export function yearsText(years: number[]): string {
  if (years.length === 0) return "none";
  const sorted = [...years].sort((a, b) => a - b);
  const parts: string[] = [];
  let start = sorted[0]!;
  let prev = start;
  for (const y of [...sorted.slice(1), Number.NaN]) {
    if (y === prev + 1) {
      prev = y;
      continue;
    }
    parts.push(start === prev ? String(start) : `${start}–${prev}`);
    start = y;
    prev = y;
  }
  return `${parts.join(", ")} (${sorted.length} year${sorted.length === 1 ? "" : "s"})`;
}

/**
 * The climate years skipped at a base, window by window: "2014: window 2013-11-15 to 2014-02-29
 * (AC01, AC02) 0.0 % of hours present; …", the stays no year covers with the months they lack and the
 * files that would hold them; "none" when every year counts for every stay.
 */
export function yearsSkippedText(results: Results, base: BaseResult): string {
  const here = results.stays.filter((s) => s.base === base.name);
  const parts: string[] = [];
  const seen = new Map<string, string[]>();
  for (const s of here) {
    for (const y of s.yearsSkipped) {
      const key = `${y.year}: window ${y.fromIso} to ${y.toIso}, ${pct(y.completenessPct)} % of hours present`;
      const list = seen.get(key) ?? [];
      if (!list.includes(s.aircraft)) list.push(s.aircraft);
      seen.set(key, list);
    }
  }
  const sorted = [...seen.entries()].sort((a, b) => (a[0] < b[0] ? -1 : a[0] > b[0] ? 1 : 0));
  for (const [key, aircraft] of sorted) parts.push(`${key} (${aircraft.join(", ")})`);
  for (const s of here) {
    if (s.noData === null) continue;
    const files =
      s.noData.files.length > 0 ? `; files that would hold them: ${filesText(s.noData.files)}` : "";
    parts.push(
      `no year covers ${s.aircraft} ${s.arrive} to ${s.depart}: lacks ${s.noData.months.map(monthName).join(", ")}${files}`,
    );
  }
  return parts.length === 0 ? "none" : parts.join("; ");
}

/** A list of file names, shortened to the first two, "…" and the last when long, with the count. */
export function filesText(files: string[]): string {
  if (files.length <= 4) return files.join(", ");
  return `${files[0]}, ${files[1]}, …, ${files[files.length - 1]} (${files.length} files)`;
}

/** "2018-12-01T15:00:00-06:00" → "2018-12-01 15:00 (UTC−06:00)"; anything else is shown as given. */
export function localTimeText(iso: string): string {
  const m = /^(\d{4}-\d{2}-\d{2})T(\d{2}:\d{2})(?::\d{2}(?:\.\d+)?)?(Z|[+-]\d{2}:\d{2})?$/.exec(iso);
  if (!m) return iso;
  const zone = m[3] === undefined ? "" : m[3] === "Z" ? " (UTC)" : ` (UTC${m[3].replace("-", "\u2212")})`;
  return `${m[1]} ${m[2]}${zone}`;
}

/** Applies a conversion to a value that may be missing. */
export function nullable(f: (v: number) => number, v: number | null): number | null {
  return v === null ? null : f(v);
}
