/**
 * Turns `Results` into the plain strings and pre-rendered charts the templates place. All formatting
 * and unit conversion happens in the view; the templates only lay out text (escaped by handlebars) and
 * the chart SVG (rendered by vega from data it escapes itself).
 *
 * This file builds the report's frame (the first screen from `sections/glance.ts`, the aircraft
 * actions from `sections/actions.ts`) and fixes the order of each base's sections (`BASE_SECTIONS`). Each section is one builder in `sections/<name>.ts` and one partial in
 * `templates/partials/<name>.hbs`; `shared.ts` holds what the sections share.
 */
import type { BaseResult, Results, StationResult } from "../plan/results.js";
import { formatDisplay, pct, shownText, showWithUnit, type UnitSystem, unitSystem } from "../units/index.js";
import { type ActionRowView, actionsSection } from "./sections/actions.js";
import { type BaseIndexView, baseIndexSection } from "./sections/baseIndex.js";
import { climateSection } from "./sections/climate.js";
import { type CoverageView, coverageSection } from "./sections/coverage.js";
import { designPointSection } from "./sections/designPoint.js";
import { type GlanceView, glanceSection } from "./sections/glance.js";
import { nitrogenSection } from "./sections/nitrogen.js";
import { type NitrogenFleetView, nitrogenFleetSection } from "./sections/nitrogenFleet.js";
import { overnightSection } from "./sections/overnight.js";
import { profileSection } from "./sections/profile.js";
import { riskSection } from "./sections/risk.js";
import { whatIfSection } from "./sections/whatIf.js";
import {
  type BaseContext,
  type BaseHref,
  baseAnchor,
  FigureCounter,
  samePage,
  yearsSkippedText,
  yearsText,
} from "./shared.js";
import { basePagePath, type ListPart, listPart } from "./split.js";

/**
 * The sections of each base, in report order. A section is a builder in `sections/<partial>.ts`
 * returning its view, laid out by `templates/partials/<partial>.hbs`; figures number in this order.
 */
const BASE_SECTIONS: { partial: string; build: (ctx: BaseContext) => Promise<object> }[] = [
  { partial: "climate", build: climateSection },
  { partial: "profile", build: profileSection },
  { partial: "designPoint", build: designPointSection },
  { partial: "overnight", build: overnightSection },
  { partial: "risk", build: riskSection },
  { partial: "whatIf", build: whatIfSection },
  { partial: "nitrogen", build: nitrogenSection },
];

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
  outOfBandThresholdText: string;
  minYears: string;
  fleet: GlanceView;
  /** The aircraft actions, the first MAX_LIST_ROWS of them with the count of the rest. */
  actions: ListPart<ActionRowView>;
  /** The fleet's nitrogen roll-up, its own part near the top (partial `nitrogenFleet`). */
  nitrogenFleet: NitrogenFleetView;
  /** Every base's sections (one file), or none (split report: they are on the base pages). */
  bases: BaseView[];
  /** The base pages of a split report; null for a report in one file. */
  index: BaseIndexView | null;
  methods: { name: string; source: string; description: string }[];
  quantileMethod: string;
  randomInputs: { name: string; description: string }[];
  unitNotes: string[];
  assumptions: ListPart<AssumptionView>;
  /** Every base's data coverage (one file), or none (split report: each is on its base's page). */
  coverage: CoverageView[];
  warnings: string[];
  u: Record<string, string>;
}

/** Options of the view builder (the generation time is passed in so that tests can fix it). */
export interface ViewOptions {
  generatedAt: string;
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
export async function buildBase(ctx: BaseContext): Promise<BaseView> {
  const { base, results } = ctx;
  const sections: SectionView[] = [];
  for (const { partial, build } of BASE_SECTIONS) sections.push({ partial, view: await build(ctx) });
  return {
    anchor: ctx.anchor,
    name: base.name,
    timeZone: base.timeZone,
    stationList: base.stations.map(stationLabel).join("; ") || "none",
    yearsUsed: yearsText(base.yearsUsed),
    yearsSkipped: yearsSkippedText(results, base),
    atmosphere: atmosphereText(base, ctx.u),
    sections,
  };
}

/**
 * The assumptions table of the back matter: every parameter of the run, as the results list it, the
 * first MAX_LIST_ROWS of them with the count of the rest (all in assumptions.csv).
 */
function assumptionsTable(results: Results, u: UnitSystem): ListPart<AssumptionView> {
  const part = listPart(results.assumptions, "assumptions.csv");
  return {
    rows: part.rows.map((a) => ({ key: a.key, label: a.label, shown: shownText(a, u), origin: a.origin })),
    more: part.more,
  };
}

/** Only plain relative file names become links; anything else is shown as text. */
function linkable(name: string): boolean {
  return /^[A-Za-z0-9][A-Za-z0-9._-]*$/.test(name);
}

function unitsName(u: UnitSystem): string {
  return `${u.name} (${u.pressure.unit}, ${u.temp.unit}, ${u.volume.unit}, ${u.mass.unit}, ${u.gasVolume.unit})`;
}

/** Builds the whole view model of a report in one file (every base, every chart rendered) from the results. */
export async function buildView(results: Results, options: ViewOptions): Promise<ReportView> {
  const u = unitSystem(results.units);
  const figs = new FigureCounter();
  const bases: BaseView[] = [];
  for (const [i, base] of results.bases.entries())
    bases.push(await buildBase({ results, base, anchor: baseAnchor(i), u, figs }));
  return {
    ...fleetView(results, options, samePage),
    bases,
    coverage: coverageSection(results, u),
    index: null,
  };
}

/** The view of a split report's overview: everything fleet-wide and the index of the base pages. */
export function overviewView(results: Results, options: ViewOptions): ReportView {
  const toPage: BaseHref = (i, fragment) => `${basePagePath(i)}${fragment ? `#${fragment}` : ""}`;
  return {
    ...fleetView(results, options, toPage),
    bases: [],
    coverage: [],
    index: baseIndexSection(results),
  };
}

/** What the report shows before and after the bases' own parts; `href` places each base's part. */
function fleetView(
  results: Results,
  options: ViewOptions,
  href: BaseHref,
): Omit<ReportView, "bases" | "coverage" | "index"> {
  const u = unitSystem(results.units);
  const files = results.files ?? ["results.json"];
  return {
    ...pageHeader(results, options, u),
    files: files.map((name) => ({ name, linkable: linkable(name) })),
    fleet: glanceSection(results, u, href),
    actions: actionsSection(results),
    nitrogenFleet: nitrogenFleetSection(results, u),
    methods: results.methods,
    quantileMethod: results.quantileMethod,
    randomInputs: results.randomInputs,
    unitNotes: u.notes,
    assumptions: assumptionsTable(results, u),
    warnings: results.warnings,
  };
}

/** The fields every page of a report shows or its sections read: the title block, thresholds and units. */
export type PageHeader = Pick<
  ReportView,
  | "plan"
  | "generatedAt"
  | "toolVersion"
  | "climateYears"
  | "unitsName"
  | "seed"
  | "thresholdText"
  | "outOfBandThresholdText"
  | "minYears"
  | "u"
>;

export function pageHeader(results: Results, options: ViewOptions, u: UnitSystem): PageHeader {
  return {
    plan: results.plan,
    generatedAt: options.generatedAt,
    toolVersion: results.generatedBy,
    climateYears: yearsText(results.climateYears),
    unitsName: unitsName(u),
    seed: String(results.seed),
    thresholdText: pct(results.thresholds.shortPct),
    outOfBandThresholdText: pct(results.thresholds.outOfBandPct),
    minYears: String(results.thresholds.minYears),
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
