/**
 * Report section "Base pages" (a split report's overview only, after the aircraft actions): one row per
 * base linking to its page, with its headline status — the most pressing status of its months (Act,
 * then Watch, then No data, then OK, then No stay) — and the months of each status that needs
 * attention. Reads `BaseResult.months` (status, low confidence) as the results decide them.
 */
import type { BaseResult, Results } from "../../plan/results.js";
import { formatDisplay } from "../../units/index.js";
import { monthName, STATUS_LABEL, type Status } from "../shared.js";
import { BASE_PAGE_DIR, basePageName, basePagePath, MAX_BASES_IN_ONE_FILE } from "../split.js";

/** Statuses from the most to the least pressing. */
const PRECEDENCE: Status[] = ["act", "watch", "no-data", "ok", "no-stay"];

export interface BaseIndexRow {
  name: string;
  href: string;
  file: string;
  status: Status;
  label: string;
  /** Outlined mark: some month at the headline status has fewer usable years than the plan's minimum. */
  lowConfidence: boolean;
  title: string;
  /** The months at Act, Watch and No data ("Dec, Jan"), or "–". */
  act: string;
  watch: string;
  noData: string;
}

export interface BaseIndexView {
  /** The number of bases, plain digits (the overview's split marker). */
  count: string;
  countText: string;
  limitText: string;
  folder: string;
  rows: BaseIndexRow[];
}

/** The headline status of a base: its most pressing month status, outlined if any such month is of low confidence. */
export function headlineStatus(base: BaseResult): { status: Status; lowConfidence: boolean } {
  for (const status of PRECEDENCE) {
    const months = base.months.filter((m) => m.status === status);
    if (months.length > 0) return { status, lowConfidence: months.some((m) => m.lowConfidence) };
  }
  return { status: "no-stay", lowConfidence: false };
}

function monthsAt(base: BaseResult, status: Status): string {
  const months = base.months.filter((m) => m.status === status).map((m) => monthName(m.month));
  return months.length > 0 ? months.join(", ") : "–";
}

function indexRow(base: BaseResult, i: number): BaseIndexRow {
  const { status, lowConfidence } = headlineStatus(base);
  const label = STATUS_LABEL[status];
  return {
    name: base.name,
    href: basePagePath(i),
    file: basePageName(i),
    status,
    label,
    lowConfidence,
    title: `${base.name}: ${label}${lowConfidence ? ", low confidence" : ""}`,
    act: monthsAt(base, "act"),
    watch: monthsAt(base, "watch"),
    noData: monthsAt(base, "no-data"),
  };
}

export function baseIndexSection(results: Results): BaseIndexView {
  return {
    count: String(results.bases.length),
    countText: formatDisplay(results.bases.length, 0),
    limitText: formatDisplay(MAX_BASES_IN_ONE_FILE, 0),
    folder: `${BASE_PAGE_DIR}/`,
    rows: results.bases.map(indexRow),
  };
}
