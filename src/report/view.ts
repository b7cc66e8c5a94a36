/**
 * Turns `Results` into the plain strings and pre-rendered charts the templates place. All formatting
 * and unit conversion happens in the view; the templates only lay out text (escaped by handlebars) and
 * the chart SVG (rendered by vega from data it escapes itself).
 *
 * This file builds the fleet summary and the report's frame, and fixes the order of each base's
 * sections (`BASE_SECTIONS`). Each section is one builder in `sections/<name>.ts` and one partial in
 * `templates/partials/<name>.hbs`; `shared.ts` holds what the sections share.
 */
import type { AdviceRow, BaseResult, MonthRow, Results, StationResult } from "../plan/results.js";
import { formatDisplay, pct, shownText, showWithUnit, type UnitSystem, unitSystem } from "../units/index.js";
import { climateSection } from "./sections/climate.js";
import { type CoverageView, coverageSection } from "./sections/coverage.js";
import { nitrogenSection } from "./sections/nitrogen.js";
import { overnightSection } from "./sections/overnight.js";
import { profileSection } from "./sections/profile.js";
import { riskSection } from "./sections/risk.js";
import {
  type BaseContext,
  baseAnchor,
  FigureCounter,
  MONTHS,
  monthName,
  STATUS_LABEL,
  type Status,
  yearsSkippedText,
  yearsText,
} from "./shared.js";

/**
 * The sections of each base, in report order. A section is a builder in `sections/<partial>.ts`
 * returning its view, laid out by `templates/partials/<partial>.hbs`; figures number in this order.
 */
const BASE_SECTIONS: { partial: string; build: (ctx: BaseContext) => Promise<object> }[] = [
  { partial: "climate", build: climateSection },
  { partial: "profile", build: profileSection },
  { partial: "overnight", build: overnightSection },
  { partial: "risk", build: riskSection },
  { partial: "nitrogen", build: nitrogenSection },
];

export interface Cell {
  status: Status;
  label: string;
  title: string;
}

export interface ActionRow {
  base: string;
  month: string;
  status: Status;
  label: string;
  text: string;
}

/** One section of a base: the partial that lays it out and the view it is given. */
export interface SectionView {
  partial: string;
  view: object;
}

export interface BaseView {
  anchor: string;
  name: string;
  timeZone: string;
  stationList: string;
  yearsUsed: string;
  yearsSkipped: string;
  /** The atmospheric pressure used at the base and where it comes from. */
  atmosphere: string;
  sections: SectionView[];
}

export interface AssumptionView {
  key: string;
  label: string;
  /** The value as the plan file wrote it, or a default in the plan's units. */
  shown: string;
  origin: string;
}

export interface ReportView {
  plan: string;
  generatedAt: string;
  toolVersion: string;
  climateYears: string;
  unitsName: string;
  seed: string;
  files: { name: string; linkable: boolean }[];
  thresholdText: string;
  fleet: { months: string[]; rows: { base: string; anchor: string; cells: Cell[] }[]; actions: ActionRow[] };
  bases: BaseView[];
  methods: { name: string; source: string; description: string }[];
  quantileMethod: string;
  randomInputs: { name: string; description: string }[];
  unitNotes: string[];
  assumptions: AssumptionView[];
  coverage: CoverageView[];
  warnings: string[];
  u: Record<string, string>;
}

/** Options of the view builder (the generation time is passed in so that tests can fix it). */
export interface ViewOptions {
  generatedAt: string;
}

/** Status of a month from its statistics and advice: act, watch, ok, or none (no preflights). */
export function monthStatus(
  m: MonthRow | undefined,
  advice: AdviceRow | undefined,
  shortPct: number,
): Status {
  if (!m || m.preflights === 0) return "none";
  if (advice?.fitColdStartOption || (m.shortPctOne ?? 0) > shortPct) return "act";
  if ((m.belowBandPct ?? 0) + (m.aboveBandPct ?? 0) > 0) return "watch";
  return "ok";
}

function maxOf(values: (number | null)[]): number | null {
  const v = values.filter((x): x is number => x !== null);
  return v.length === 0 ? null : Math.max(...v);
}

/** The action for a run of months with the same status, quoting the worst month of the run. */
function actionText(run: MonthRow[], status: Status, shortPct: number): string {
  const upTo = (v: number | null) => `${run.length > 1 && (v ?? 0) > 0 ? "up to " : ""}${pct(v)} %`;
  const below = maxOf(run.map((m) => m.belowBandPct));
  const above = maxOf(run.map((m) => m.aboveBandPct));
  const outOfBand = (below ?? 0) + (above ?? 0) > 0;
  const readings = `out-of-band fill readings at the first preflight (${upTo(below)} below band, ${upTo(above)} above)`;
  if (status === "act") {
    const one = maxOf(run.map((m) => m.shortPctOne));
    const two = maxOf(run.map((m) => m.shortPctTwo));
    let text = `Fit the cold-start option: ${upTo(one)} of starts short of energy with one accumulator, ${upTo(two)} with two.`;
    if ((two ?? 0) > shortPct)
      text += ` Still above the ${pct(shortPct)} % threshold with two: plan overnight hangar space or a later first start.`;
    if (outOfBand) text += ` Also expect ${readings}.`;
    return text;
  }
  return `Expect ${readings}. Allow servicing time and brief technicians on the overnight drop.`;
}

/** Action rows of one base: consecutive calendar months with the same status share one row. */
function groupActions(b: BaseResult, shortPct: number): ActionRow[] {
  const adv = new Map(b.advice.map((a) => [a.month, a]));
  const byMonth = new Map(b.months.map((m) => [m.month, m]));
  const rows: ActionRow[] = [];
  let run: MonthRow[] = [];
  let runStatus: Status = "none";
  const flush = () => {
    if (run.length > 0 && (runStatus === "act" || runStatus === "watch")) {
      const first = monthName(run[0]!.month);
      const last = monthName(run[run.length - 1]!.month);
      rows.push({
        base: b.name,
        month: run.length === 1 ? first : `${first}–${last}`,
        status: runStatus,
        label: STATUS_LABEL[runStatus],
        text: actionText(run, runStatus, shortPct),
      });
    }
    run = [];
  };
  for (let month = 1; month <= 12; month++) {
    const m = byMonth.get(month);
    const status = monthStatus(m, adv.get(month), shortPct);
    if (status !== runStatus) {
      flush();
      runStatus = status;
    }
    if (m) run.push(m);
  }
  flush();
  return rows;
}
/** Fleet summary grid: one row per base, one cell per calendar month with its status. */
function fleetRows(results: Results): ReportView["fleet"]["rows"] {
  const shortPct = results.thresholds.shortPct;
  return results.bases.map((b, i) => {
    const byMonth = new Map(b.months.map((m) => [m.month, m]));
    const adv = new Map(b.advice.map((a) => [a.month, a]));
    const cells = MONTHS.map((_name, k) => {
      const status = monthStatus(byMonth.get(k + 1), adv.get(k + 1), shortPct);
      return {
        status,
        label: STATUS_LABEL[status],
        title: `${b.name}, ${MONTHS[k]}: ${STATUS_LABEL[status]}`,
      };
    });
    return { base: b.name, anchor: baseAnchor(i), cells };
  });
}

/** "14.64 psia (100.9 kPa), the mean station pressure reported by 999701-99999" and the like. */
function atmosphereText(base: BaseResult, u: UnitSystem): string {
  const a = base.atmosphere;
  const kPa = `${formatDisplay(a.pressureKPaAbsolute, 1)} kPa absolute`;
  const value = u.id === "us" ? `${showWithUnit(u.pressureAbs, a.pressureKPaAbsolute)} (${kPa})` : kPa;
  const source =
    a.source === "station pressure"
      ? `the mean station pressure reported by ${a.station}`
      : `the ISO 2533 standard atmosphere at ${showWithUnit(u.length, a.elevationM)}, the elevation of ${a.station}`;
  return `${value}, ${source}; gauge pressures are relative to it`;
}

function stationLabel(s: StationResult): string {
  return s.name ? `${s.id} (${s.name})` : s.id;
}

/** One base: its header, then its sections in the order of `BASE_SECTIONS`. */
async function buildBase(ctx: BaseContext): Promise<BaseView> {
  const { base } = ctx;
  const sections: SectionView[] = [];
  for (const { partial, build } of BASE_SECTIONS) sections.push({ partial, view: await build(ctx) });
  return {
    anchor: ctx.anchor,
    name: base.name,
    timeZone: base.timeZone,
    stationList: base.stations.map(stationLabel).join("; ") || "none",
    yearsUsed: yearsText(base.yearsUsed),
    yearsSkipped: yearsSkippedText(base),
    atmosphere: atmosphereText(base, ctx.u),
    sections,
  };
}

/** The assumptions table of the back matter: every parameter of the run, as the results list it. */
function assumptionsTable(results: Results, u: UnitSystem): AssumptionView[] {
  return results.assumptions.map((a) => ({
    key: a.key,
    label: a.label,
    shown: shownText(a, u),
    origin: a.origin,
  }));
}

/** Only plain relative file names become links; anything else is shown as text. */
function linkable(name: string): boolean {
  return /^[A-Za-z0-9][A-Za-z0-9._-]*$/.test(name);
}

function unitsName(u: UnitSystem): string {
  return `${u.name} (${u.pressure.unit}, ${u.temp.unit}, ${u.volume.unit}, ${u.mass.unit}, ${u.gasVolume.unit})`;
}

/** Builds the whole view model (every chart rendered) from the results. */
export async function buildView(results: Results, options: ViewOptions): Promise<ReportView> {
  const u = unitSystem(results.units);
  const figs = new FigureCounter();
  const shortPct = results.thresholds.shortPct;
  const bases: BaseView[] = [];
  for (const [i, base] of results.bases.entries())
    bases.push(await buildBase({ results, base, anchor: baseAnchor(i), u, figs }));
  const files = results.files ?? ["results.json"];
  return {
    plan: results.plan,
    generatedAt: options.generatedAt,
    toolVersion: results.generatedBy,
    climateYears: yearsText(results.climateYears),
    unitsName: unitsName(u),
    seed: String(results.seed),
    files: files.map((name) => ({ name, linkable: linkable(name) })),
    thresholdText: pct(shortPct),
    fleet: {
      months: MONTHS,
      rows: fleetRows(results),
      actions: results.bases.flatMap((b) => groupActions(b, shortPct)),
    },
    bases,
    methods: results.methods,
    quantileMethod: results.quantileMethod,
    randomInputs: results.randomInputs,
    unitNotes: u.notes,
    assumptions: assumptionsTable(results, u),
    coverage: coverageSection(results, u),
    warnings: results.warnings,
    u: {
      pressure: u.pressure.unit,
      pressureDelta: u.pressureDelta.unit,
      temp: u.temp.unit,
      tempDelta: u.tempDelta.unit,
      mass: u.mass.unit,
      gasVolume: u.gasVolume.unit,
      volume: u.volume.unit,
      length: u.length.unit,
    },
  };
}
