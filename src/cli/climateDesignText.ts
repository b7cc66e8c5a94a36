/**
 * The climate design temperatures of `coldsoak climate` (docs/methods.md, "Climate design
 * temperatures"): per station over every local year holding data, the annual 99.6 % and 99 % cold
 * dry-bulb values, the coldest month's 1 % value, the coldest hour of each year with its 1-in-10 and
 * 1-in-30-year values, and the hours a year below −20, −30 and −40 in the chosen units with the longest
 * spell below each: the `design` field of `--json` (°C) and a block of the table.
 */
import { designTemperatures } from "../climate/designTemps.js";
import type { StationClimate } from "../climate/types.js";
import { InputError } from "../errors.js";
import { coldestHourReturnLevels } from "../plan/climateDesign.js";
import type { ColdestHourResult } from "../plan/results.js";
import { cToK, formatDisplay, fToK, kToC, show, type Units, unitSystem } from "../units/index.js";

/** Seed of the bootstrap intervals of the coldest hour (the command has no plan to take one from). */
const BOOTSTRAP_SEED = 1;

const MONTHS = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"];

export type StationDesign = Omit<ReturnType<typeof designTemperatures>, "coldestHour"> & {
  coldestHour: ColdestHourResult;
};

/** `--min-year-share`: a share 0–1 of a year's (a month's) hours that must hold a value. */
export function parseMinYearShare(text: string): number {
  const v = Number(text);
  if (text.trim() === "" || !Number.isFinite(v) || v < 0 || v > 1)
    throw new InputError(`--min-year-share: "${text}" is not a share 0–1, e.g. --min-year-share 0.8`);
  return v;
}

/** A station's design temperatures over every year holding data; thresholds −20, −30, −40 in `units`. */
export function stationDesign(s: StationClimate, units: Units, minYearShare: number): StationDesign {
  const toK = units === "us" ? fToK : cToK;
  const d = designTemperatures(s.series, s.meta.timeZone, {
    years: null,
    minYearShare,
    coldThresholdsC: [-20, -30, -40].map((t) => kToC(toK(t))),
  });
  return {
    ...d,
    coldestHour: coldestHourReturnLevels(d.coldestHour, BOOTSTRAP_SEED, `bootstrap:${s.meta.id}:coldestHour`),
  };
}

/** The design block of a station in the table, in the chosen units. */
export function designLines(d: StationDesign, units: Units): string[] {
  const sys = unitSystem(units);
  const u = sys.temp.unit;
  const t = (c: number | null, why: string | null = null) =>
    c === null ? `–${why ? ` (${why})` : ""}` : `${show(sys.temp, c)} ${u}`;
  const level = (v: number | null, lo: number | null, hi: number | null) =>
    lo === null || hi === null ? t(v) : `${t(v)} (90 % ${show(sys.temp, lo)} to ${show(sys.temp, hi)})`;
  const h = d.coldestHour;
  const years =
    d.years.length > 0 ? `${d.years[0]}–${d.years[d.years.length - 1]} (${d.years.length})` : "none";
  const month =
    d.coldestMonth === null
      ? `– (${d.coldestMonthReason})`
      : `${MONTHS[d.coldestMonth.month - 1]} ${t(d.coldestMonth.p1C)}`;
  const below = d.hoursBelow.map((b) =>
    b.hoursPerYear === null
      ? `below ${t(b.thresholdC)} –`
      : `below ${t(b.thresholdC)} ${formatDisplay(b.hoursPerYear, 1)} h/yr (longest ${formatDisplay(b.longestSpellH ?? 0, 0)} h)`,
  );
  return [
    `  design temperatures, years with ${formatDisplay(d.minYearShare * 100, 0)} % of their hours: ${years}`,
    `    annual 99.6 % ${t(d.annual996C, d.reason)}; 99 % ${t(d.annual99C, d.reason)}; coldest month's 1 % ${month}`,
    `    coldest hour of the year: mean ${t(h.meanC, d.reason)}; 1-in-10 ${level(h.oneIn10C, h.oneIn10CLo90, h.oneIn10CHi90)}; 1-in-30 ${level(h.oneIn30C, h.oneIn30CLo90, h.oneIn30CHi90)}`,
    `    hours ${below.join("; ")}`,
  ];
}
