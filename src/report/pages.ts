/**
 * Writing the report as files: `report.html` alone up to MAX_BASES_IN_ONE_FILE bases (`renderReport`,
 * unchanged), else the fleet overview `report.html` and one page per base, `bases/<nnn>.html` (see
 * `split.ts`). The base pages are built, rendered and written one at a time — a page's view, charts and
 * HTML are dropped before the next base's are built — so that memory holds one base's page at a time,
 * whatever the number of bases.
 */
import type { Results } from "../plan/results.js";
import { formatDisplay, unitSystem } from "../units/index.js";
import { withChartBatch } from "./chartBatch.js";
import { generationTime, pageTemplate, renderReport } from "./index.js";
import { type ActionRowView, actionsSection } from "./sections/actions.js";
import { baseCoverage, type CoverageView } from "./sections/coverage.js";
import { baseAnchor, FigureCounter } from "./shared.js";
import { basePageName, basePagePath, isSplit, type ListPart } from "./split.js";
import {
  type BaseView,
  buildBase,
  overviewView,
  type PageHeader,
  pageHeader,
  type ViewOptions,
} from "./view.js";

/**
 * Base pages built ahead of the one being written: memory holds at most PAGES_AHEAD + 1 pages' views
 * and charts, whatever the number of bases.
 */
export const PAGES_AHEAD = 1;

/** Writes one file of the report: `name` is relative to the report's folder ("report.html", "bases/001.html"). */
export type ReportFileWriter = (name: string, text: string) => Promise<void>;

/** The view of one base's page. */
export interface BasePageView extends PageHeader {
  base: BaseView;
  /** "3 of 500". */
  position: string;
  /** Relative links: the overview, and the previous and next base pages ("" at either end). */
  overview: string;
  previous: string;
  next: string;
  actions: ListPart<ActionRowView>;
  coverage: CoverageView;
}

/** The view of base `i`'s page, its charts rendered (figures numbered from 1 on each page). */
export async function basePageView(results: Results, i: number, options: ViewOptions): Promise<BasePageView> {
  const u = unitSystem(results.units);
  const base = results.bases[i]!;
  const ctx = { results, base, anchor: baseAnchor(i), u, figs: new FigureCounter() };
  const count = results.bases.length;
  return {
    ...pageHeader(results, options, u),
    base: await withChartBatch(() => buildBase(ctx)),
    position: `${formatDisplay(i + 1, 0)} of ${formatDisplay(count, 0)}`,
    overview: "../report.html",
    previous: i > 0 ? basePageName(i - 1) : "",
    next: i + 1 < count ? basePageName(i + 1) : "",
    actions: actionsSection(results, { base: base.name, csvHref: "../aircraft_actions.csv" }),
    coverage: baseCoverage(results, i, u),
  };
}

/**
 * Writes the report of `results` through `write`: `report.html` alone, or (more bases than
 * MAX_BASES_IN_ONE_FILE) the overview and each base's page, rendered and written one after the other.
 * Returns the names written, in order.
 */
export async function writeReport(results: Results, write: ReportFileWriter): Promise<string[]> {
  if (!isSplit(results.bases.length)) {
    await write("report.html", await renderReport(results));
    return ["report.html"];
  }
  const options = { generatedAt: generationTime() };
  const written: string[] = [];
  const put = async (name: string, text: string) => {
    await write(name, text);
    written.push(name);
  };
  await put("report.html", pageTemplate("report", true)(overviewView(results, options)));
  const page = pageTemplate("basePage", true);
  // The next PAGES_AHEAD pages are built (their charts queued to the chart workers) while a page is
  // awaited and written, so that the workers never wait for the next page's charts.
  const ahead: (Promise<BasePageView> | undefined)[] = [];
  const start = (i: number) => {
    if (i >= results.bases.length) return;
    const view = basePageView(results, i, options);
    view.catch(() => undefined); // awaited in order below; a failure is thrown there
    ahead[i] = view;
  };
  for (let i = 0; i <= PAGES_AHEAD; i++) start(i);
  for (let i = 0; i < results.bases.length; i++) {
    const view = await ahead[i]!;
    ahead[i] = undefined;
    start(i + PAGES_AHEAD + 1);
    await put(basePagePath(i), page(view));
  }
  return written;
}
