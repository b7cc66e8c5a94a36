/**
 * Report section "Aircraft actions" (after the first screen): one row per aircraft and stay with the
 * action the plan suggests, its dates and the figures that drive it, each share with its 90 %
 * interval, the usable climate years and a note. Reads `Results.actions` and `Results.stays` (`noData`);
 * the full sentence of each action is in aircraft_actions.csv and results.json.
 */
import type { ActionName, AircraftAction, Results, StayResult } from "../../plan/results.js";
import { filesText, monthName, pctInterval, yearsShort } from "../shared.js";
import { type ListPart, listPart } from "../split.js";

/** How each action reads in the table. */
export const ACTION_LABEL: Record<ActionName, string> = {
  fit: "Fit the option",
  "fitted-needed": "Fitted, needed",
  "fitted-not-needed": "Fitted, not needed by this estimate",
  "fitted-still-short": "Fitted, still short",
  keep: "Keep as is",
  "no-data": "No data",
};

export interface ActionRowView {
  aircraft: string;
  base: string;
  arrive: string;
  depart: string;
  option: string;
  action: ActionName;
  label: string;
  /** "2027-12-01 to 2028-03-01", "from 2027-12-01" (to departure), or "–". */
  needed: string;
  month: string;
  one: string;
  two: string;
  years: string;
  /** What the columns do not say: a shortfall the option does not cure, what a stay without data lacks. */
  note: string;
}

/** The note of an action: a shortfall with the option, what is lacking without data, low confidence. */
function note(a: AircraftAction, noData: StayResult["noData"]): string {
  const parts: string[] = [];
  if (a.stillShortWithOption)
    parts.push("still short with the option: plan hangar space or a later first start");
  if (noData)
    parts.push(
      `lacks ${noData.months.map(monthName).join(", ")}${noData.files.length > 0 ? `; files: ${filesText(noData.files)}` : ""}`,
    );
  if (a.lowConfidence) parts.push("low confidence");
  return parts.join("; ") || "–";
}

function row(a: AircraftAction, noData: StayResult["noData"]): ActionRowView {
  return {
    aircraft: a.aircraft,
    base: a.base,
    arrive: a.arrive,
    depart: a.depart,
    option: a.coldStartOption ? "yes" : "no",
    action: a.action,
    label: ACTION_LABEL[a.action],
    needed:
      a.neededFrom === null
        ? "–"
        : a.notNeededFrom === null
          ? `from ${a.neededFrom}`
          : `${a.neededFrom} to ${a.notNeededFrom}`,
    month: a.worstMonth === null ? "–" : monthName(a.worstMonth),
    one: pctInterval(a.shortPctOne, a.shortPctOneLo90, a.shortPctOneHi90) || "–",
    two: pctInterval(a.shortPctTwo, a.shortPctTwoLo90, a.shortPctTwoHi90) || "–",
    years: a.action === "no-data" ? "none" : yearsShort(a.years),
    note: note(a, noData),
  };
}

/** The file that holds every action, whatever a page shows of them. */
export const ACTIONS_FILE = "aircraft_actions.csv";

/**
 * One row per action, in schedule order (the actions and the stays share it), or only those at the
 * base named `base`; at most MAX_LIST_ROWS of them, then the count of the rest, all in ACTIONS_FILE
 * (`csvHref`: that file relative to the page).
 */
export function actionsSection(
  results: Results,
  options: { base?: string; csvHref?: string } = {},
): ListPart<ActionRowView> {
  const picked: number[] = [];
  results.actions.forEach((a, i) => {
    if (options.base === undefined || a.base === options.base) picked.push(i);
  });
  const part = listPart(picked, ACTIONS_FILE, options.csvHref);
  return {
    rows: part.rows.map((i) => row(results.actions[i]!, results.stays[i]?.noData ?? null)),
    more: part.more,
  };
}
