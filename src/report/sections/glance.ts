/**
 * The report's first screen, "Fleet summary", directly after the caution: the status grid of bases and
 * local months, then a few lines for each user, each linked to its section — the engineer's aircraft
 * actions, the planner's months with out-of-band first preflights and their worst hours of day, and the
 * logistics officer's nitrogen to ship. Reads `BaseResult.months` (status, figures, intervals, worst
 * hours), `Results.actions`, `Results.thresholds`, `Results.nitrogenFleet` and each base's stock.
 */
import type { AircraftAction, Results } from "../../plan/results.js";
import { formatDisplay, pct, show, type UnitSystem } from "../../units/index.js";
import {
  type BaseHref,
  baseAnchor,
  MONTHS,
  monthName,
  pctInterval,
  type StatusCell,
  samePage,
  statusCell,
} from "../shared.js";
import { listPart, MAX_LINE_ITEMS } from "../split.js";
import { ACTIONS_FILE } from "./actions.js";

export interface GlanceLine {
  text: string;
  href: string;
  link: string;
}

export interface GlanceView {
  months: string[];
  /** Each base's row; `href` links to its part of the report (a fragment, or its page in a split report). */
  rows: { base: string; anchor: string; href: string; cells: StatusCell[] }[];
  engineer: GlanceLine[];
  planner: GlanceLine[];
  logistics: GlanceLine[];
}

/** Fragment ids of a base's sections the first screen links to. */
export function sectionId(anchor: string, section: "advice" | "hours" | "nitrogen"): string {
  return `${anchor}-sec-${section}`;
}

/** "AC01 at Korrash (needed 2027-12-01 to 2028-03-01)". */
function needPhrase(a: AircraftAction): string {
  const until = a.notNeededFrom ?? `departure ${a.depart}`;
  return `${a.aircraft} at ${a.base} (needed ${a.neededFrom} to ${until})`;
}

/** "AC01 at Korrash 2027-11-15 to 2028-03-01". */
function stayPhrase(a: AircraftAction): string {
  return `${a.aircraft} at ${a.base} ${a.arrive} to ${a.depart}`;
}

/**
 * The stays named in one line, the first MAX_LINE_ITEMS of them, then how many more there are (every
 * one is in the aircraft actions table and its CSV).
 */
function listed(actions: AircraftAction[], phrase: (a: AircraftAction) => string): string {
  const part = listPart(actions, ACTIONS_FILE, ACTIONS_FILE, MAX_LINE_ITEMS);
  const more = part.more ? `; and ${part.more.count} more, all in ${part.more.file}` : "";
  return `${part.rows.map(phrase).join("; ")}${more}`;
}

/** The engineer's lines: which aircraft to fit, which have the option and need it or not, and the rest. */
function engineerLines(actions: AircraftAction[]): GlanceLine[] {
  const of = (kind: AircraftAction["action"]) => actions.filter((a) => a.action === kind);
  const line = (text: string): GlanceLine => ({ text, href: "#actions", link: "Aircraft actions" });
  const out: GlanceLine[] = [];
  const fit = of("fit");
  if (fit.length > 0)
    out.push(
      line(
        `Fit the cold-start option: ${listed(fit, (a) => `${a.aircraft} at ${a.base} before ${a.arrive} (needed ${a.neededFrom} to ${a.notNeededFrom ?? `departure ${a.depart}`}${a.stillShortWithOption ? "; still short with it" : ""})`)}.`,
      ),
    );
  const stillShort = of("fitted-still-short");
  if (stillShort.length > 0)
    out.push(
      line(`Option fitted but still short (hangar or later first start): ${listed(stillShort, stayPhrase)}.`),
    );
  const needed = of("fitted-needed");
  if (needed.length > 0) out.push(line(`Fitted, needed: ${listed(needed, needPhrase)}.`));
  const notNeeded = of("fitted-not-needed");
  if (notNeeded.length > 0)
    out.push(line(`Fitted, not needed by this estimate: ${listed(notNeeded, stayPhrase)}.`));
  const noData = of("no-data");
  if (noData.length > 0) out.push(line(`No data for: ${listed(noData, stayPhrase)}.`));
  const keep = of("keep").length;
  if (keep > 0)
    out.push(line(`Keep as is: ${keep} stay${keep === 1 ? "" : "s"} without the option that need none.`));
  return out;
}

/** "06, 07, 05 h (local)". */
function hoursText(hours: number[]): string {
  return `${hours.map((h) => String(h).padStart(2, "0")).join(", ")} h local`;
}

/** The planner's lines: per base, the months above the out-of-band threshold and their worst hours of day. */
function plannerLines(results: Results, href: BaseHref): GlanceLine[] {
  const limit = results.thresholds.outOfBandPct;
  const out: GlanceLine[] = [];
  for (const [i, b] of results.bases.entries()) {
    const months = b.months.filter((m) => (m.outOfBandPct ?? 0) > limit);
    if (months.length === 0) continue;
    const items = months.map(
      (m) =>
        `${monthName(m.month)} ${pctInterval(m.outOfBandPct, m.outOfBandPctLo90, m.outOfBandPctHi90)}${m.outOfBandWorstHours.length > 0 ? `, worst at ${hoursText(m.outOfBandWorstHours)}` : ""}`,
    );
    out.push({
      text: `${b.name}: first preflights out of band in ${items.join("; ")} — allow servicing time and brief technicians on the overnight drop.`,
      href: href(i, sectionId(baseAnchor(i), "hours")),
      link: `${b.name}, out of band by hour`,
    });
  }
  if (out.length === 0)
    out.push({
      text: `No base and month has more than ${pct(limit)} % of first preflights out of band.`,
      href: "#fleet",
      link: "Status grid",
    });
  return out;
}

/**
 * The logistics line, from the fleet roll-up: the fleet's demand at P50 and P90 (quantiles of the fleet
 * sum), cylinders and carts (each base's own count, summed), and the bases whose stock runs out.
 */
function logisticsLines(results: Results, u: UnitSystem): GlanceLine[] {
  const f = results.nitrogenFleet;
  const m = (kg: number) => `${show(u.mass, kg)} ${u.mass.unit}`;
  const plural = (n: number, word: string) => `${formatDisplay(n, 0)} ${word}${n === 1 ? "" : "s"}`;
  const out = results.bases.filter((b) => b.nitrogen.stock.stockOutP90 !== null);
  const stock =
    out.length === 0
      ? "No stated stock runs out at P90."
      : `Stock runs out at P90: ${out.map((b) => `${b.name} on ${b.nitrogen.stock.stockOutP90}`).join(", ")}.`;
  return [
    {
      text: `Fleet nitrogen drawn: ${m(f.kgP50)} at P50, ${m(f.kgP90)} at P90; ${plural(f.cylindersP90, "cylinder")} on ${plural(f.cartsP90, "cart")} at P90 (each base's own count, summed). ${stock}`,
      href: "#nitrogen-fleet",
      link: "Nitrogen to ship",
    },
  ];
}

/** The first screen; `href` places each base's part (the same page by default). */
export function glanceSection(results: Results, u: UnitSystem, href: BaseHref = samePage): GlanceView {
  return {
    months: MONTHS,
    rows: results.bases.map((b, i) => {
      const byMonth = new Map(b.months.map((m) => [m.month, m]));
      return {
        base: b.name,
        anchor: baseAnchor(i),
        href: href(i),
        cells: MONTHS.map((_n, k) => {
          const m = byMonth.get(k + 1);
          return m
            ? statusCell(b.name, m)
            : {
                status: "no-stay" as const,
                label: "No stay",
                lowConfidence: false,
                years: "",
                part: "",
                figure: "",
                title: `${b.name}, ${MONTHS[k]}: No stay`,
              };
        }),
      };
    }),
    engineer: engineerLines(results.actions),
    planner: plannerLines(results, href),
    logistics: logisticsLines(results, u),
  };
}
