/**
 * The decisions the plan draws from its figures (docs/methods.md §6), as small pure functions of plain
 * inputs: the status of a base and month (also usable for a station and month on its own), the action
 * for an aircraft on a stay, with its dates, and the cold-start advice of a base-month. Each aircraft is
 * judged with its own configuration. Planning estimates, never instructions: fitting or removing
 * equipment follows the approved data.
 */
import { pct as shown } from "../units/index.js";
import { MONTH_NAMES } from "./calendar.js";
import type {
  ActionName,
  AdviceRow,
  AircraftAction,
  MonthConfidence,
  MonthDecision,
  MonthRow,
  StatusName,
  StayMonthRow,
} from "./results.js";

/** The thresholds of the plan that decide statuses and actions. */
export interface DecisionThresholds {
  /** Share of starts short of energy above which the option is needed, %. */
  shortStartsPct: number;
  /** Share of first preflights out of band (below + above) above which a month is watched, %. */
  outOfBandPct: number;
  /** Usable climate years below which a status is of low confidence. */
  minYears: number;
}

/** One aircraft present in a month, with data: its configuration, its own figures and its usable years. */
export interface AircraftInMonth {
  coldStartOption: boolean;
  /** Share of its starts short of energy with one accumulator and with two, %; null without starts. */
  shortPctOne: number | null;
  shortPctTwo: number | null;
  years: number;
}

/** What the status of one place and month is decided from. */
export interface StatusInputs {
  /** The aircraft present with data. */
  aircraft: AircraftInMonth[];
  /** Aircraft present that no usable climate year covers. */
  withoutData: number;
  /** Share of first preflights below or above the band, %; null without preflights. */
  outOfBandPct: number | null;
}

export interface StatusOutcome {
  status: StatusName;
  /** Fewest usable years among the aircraft with data (0 without any). */
  years: number;
  lowConfidence: boolean;
  partNoData: boolean;
  /** Indexes (into `aircraft`) of those whose own short share sets "act". */
  short: number[];
}

/** The short share of an aircraft in its own configuration: with two when it has the option, else with one. */
export function ownShortPct(a: Pick<AircraftInMonth, "coldStartOption" | "shortPctOne" | "shortPctTwo">) {
  return a.coldStartOption ? a.shortPctTwo : a.shortPctOne;
}

/**
 * Status of a place and month: "act" when an aircraft present is short of energy above the threshold
 * in its own configuration (without the option: with one accumulator; with it: still with two);
 * otherwise "watch" when the out-of-band share is above its threshold; otherwise "ok". Without
 * aircraft with data: "no-data" when aircraft are there, else "no-stay". Low confidence below the
 * minimum of usable years.
 */
export function monthStatus(inputs: StatusInputs, t: DecisionThresholds): StatusOutcome {
  const { aircraft, withoutData } = inputs;
  if (aircraft.length === 0) {
    return {
      status: withoutData > 0 ? "no-data" : "no-stay",
      years: 0,
      lowConfidence: false,
      partNoData: false,
      short: [],
    };
  }
  const short = aircraft.flatMap((a, i) => ((ownShortPct(a) ?? 0) > t.shortStartsPct ? [i] : []));
  const years = Math.min(...aircraft.map((a) => a.years));
  const status: StatusName =
    short.length > 0 ? "act" : (inputs.outOfBandPct ?? 0) > t.outOfBandPct ? "watch" : "ok";
  return { status, years, lowConfidence: years < t.minYears, partNoData: withoutData > 0, short };
}

/** A stay as the actions see it. */
export interface StayFacts {
  aircraft: string;
  base: string;
  arrive: string;
  depart: string;
  coldStartOption: boolean;
  /** Usable climate years of its window. */
  years: number;
  /** The months and files it lacks when no year covers it, else null. */
  noData: { months: number[]; files: string[] } | null;
}

/** "2028-03" → "2028-04-01": first day of the month after. */
function nextMonthStart(realMonth: string): string {
  const [y, m] = realMonth.split("-").map(Number) as [number, number];
  return m === 12 ? `${y + 1}-01-01` : `${y}-${String(m + 1).padStart(2, "0")}-01`;
}

/** The dates of a need over the months above the threshold: from its first month, to the month after its last. */
function needDates(
  stay: StayFacts,
  above: StayMonthRow[],
): { neededFrom: string | null; notNeededFrom: string | null } {
  if (above.length === 0) return { neededFrom: null, notNeededFrom: null };
  const first = `${above[0]!.realMonth}-01`;
  const after = nextMonthStart(above[above.length - 1]!.realMonth);
  return {
    neededFrom: first < stay.arrive ? stay.arrive : first,
    notNeededFrom: after < stay.depart ? after : null,
  };
}

/** The month with the largest share (first of equals, in the stay's order), or undefined. */
function worst(months: StayMonthRow[], share: (m: StayMonthRow) => number | null): StayMonthRow | undefined {
  let best: StayMonthRow | undefined;
  for (const m of months) if (share(m) !== null && (best === undefined || share(m)! > share(best)!)) best = m;
  return best;
}

const pctText = (v: number | null) => `${shown(v)} %`;

/** "11.7 % (90 % interval 8.1–15.2 %)". */
function withInterval(v: number | null, lo: number | null, hi: number | null): string {
  return lo === null || hi === null
    ? pctText(v)
    : `${pctText(v)} (90 % interval ${shown(lo)}–${shown(hi)} %)`;
}

/** The sentence of an action, with the figures that drive it. */
function actionText(
  kind: ActionName,
  stay: StayFacts,
  dates: { neededFrom: string | null; notNeededFrom: string | null },
  m: StayMonthRow | undefined,
  stillShort: boolean,
): string {
  const month = m ? MONTH_NAMES[m.month - 1] : "";
  const one = m ? withInterval(m.shortPctOne, m.shortPctOneLo90, m.shortPctOneHi90) : "";
  const two = m ? withInterval(m.shortPctTwo, m.shortPctTwoLo90, m.shortPctTwoHi90) : "";
  const until = dates.notNeededFrom ? `; not needed from ${dates.notNeededFrom}` : "";
  const hangar = "plan hangar space or a later first start";
  switch (kind) {
    case "no-data": {
      const gap = stay.noData!;
      const files = gap.files.length > 0 ? `; it would need ${gap.files.join(", ")}` : "";
      return `No data: no usable climate year covers this stay (it lacks ${gap.months.map((k) => MONTH_NAMES[k - 1]).join(", ")}${files}).`;
    }
    case "fit":
      return stillShort
        ? `Fit the cold-start option before ${stay.arrive} (needed from ${dates.neededFrom}${until}); still short with it: ${two} of starts short with two accumulators in ${month} — ${hangar}.`
        : `Fit the cold-start option before ${stay.arrive} (needed from ${dates.neededFrom}${until}): ${one} of starts short with one accumulator in ${month}, ${pctText(m?.shortPctTwo ?? null)} with two.`;
    case "fitted-needed":
      return `Fitted, needed from ${dates.neededFrom}${until}: ${one} of starts short with one accumulator in ${month}, ${pctText(m?.shortPctTwo ?? null)} with the option.`;
    case "fitted-still-short":
      return `Option fitted but still short: hangar or later first start. ${two} of starts short with two accumulators in ${month}.`;
    case "fitted-not-needed":
      return m
        ? `Fitted, not needed by this estimate: at most ${one} of starts short with one accumulator (${month}).`
        : "Fitted, not needed by this estimate: no starts counted.";
    case "keep":
      return m
        ? `Keep as is: at most ${one} of starts short with one accumulator (${month}).`
        : "Keep as is: no starts counted.";
  }
}

/**
 * The action for one aircraft on one stay, judged on the stay's own short share per month: with one
 * accumulator for the need of the option, with two for a shortfall the option does not cure.
 *
 * @param stay - the stay, its configuration, usable years and what it lacks
 * @param months - the stay's months in its own order (`StayMonthRow`, shares in %)
 * @param t - the plan's thresholds
 */
export function aircraftAction(
  stay: StayFacts,
  months: StayMonthRow[],
  t: DecisionThresholds,
): AircraftAction {
  const aboveOne = months.filter((m) => (m.shortPctOne ?? 0) > t.shortStartsPct);
  const stillShort = months.some((m) => (m.shortPctTwo ?? 0) > t.shortStartsPct);
  const kind: ActionName =
    stay.noData !== null
      ? "no-data"
      : stay.coldStartOption
        ? stillShort
          ? "fitted-still-short"
          : aboveOne.length > 0
            ? "fitted-needed"
            : "fitted-not-needed"
        : aboveOne.length > 0
          ? "fit"
          : "keep";
  const dates = kind === "no-data" ? { neededFrom: null, notNeededFrom: null } : needDates(stay, aboveOne);
  const m = stillShort ? worst(months, (x) => x.shortPctTwo) : worst(months, (x) => x.shortPctOne);
  const lowConfidence = stay.noData === null && stay.years < t.minYears;
  let text = actionText(kind, stay, dates, m, stillShort);
  if (lowConfidence)
    text += ` Low confidence: ${stay.years} usable climate year${stay.years === 1 ? "" : "s"}, fewer than ${t.minYears}.`;
  return {
    aircraft: stay.aircraft,
    base: stay.base,
    arrive: stay.arrive,
    depart: stay.depart,
    coldStartOption: stay.coldStartOption,
    action: kind,
    ...dates,
    stillShortWithOption: stillShort,
    monthsAbove: aboveOne.map((x) => x.month),
    worstMonth: m?.month ?? null,
    shortPctOne: m?.shortPctOne ?? null,
    shortPctOneLo90: m?.shortPctOneLo90 ?? null,
    shortPctOneHi90: m?.shortPctOneHi90 ?? null,
    shortPctTwo: m?.shortPctTwo ?? null,
    shortPctTwoLo90: m?.shortPctTwoLo90 ?? null,
    shortPctTwoHi90: m?.shortPctTwoHi90 ?? null,
    years: stay.years,
    lowConfidence,
    text,
  };
}

/** A stay of a base with its own months (`StayMonthRow`, in the stay's order). */
export interface StayInBase extends StayFacts {
  months: StayMonthRow[];
}

/** The base-month shares a status reads: pooled over the aircraft there, with the out-of-band interval. */
export type BaseMonthShares = Pick<
  MonthRow,
  "month" | "starts" | "shortPctOne" | "shortPctTwo" | "outOfBandPct"
> &
  Pick<MonthConfidence, "outOfBandPctLo90" | "outOfBandPctHi90">;

/** The status of one base-month from the stays there, with the aircraft and the figure that set it. */
function baseMonthDecision(stays: StayInBase[], m: BaseMonthShares, t: DecisionThresholds): MonthDecision {
  const present = stays.flatMap((s) => {
    const row = s.months.find((r) => r.month === m.month);
    return row ? [{ s, row }] : [];
  });
  const withData = present.filter((p) => p.s.noData === null);
  const st = monthStatus(
    {
      aircraft: withData.map(({ s, row }) => ({
        coldStartOption: s.coldStartOption,
        shortPctOne: row.shortPctOne,
        shortPctTwo: row.shortPctTwo,
        years: s.years,
      })),
      withoutData: present.length - withData.length,
      outOfBandPct: m.outOfBandPct,
    },
    t,
  );
  let figure: [number | null, number | null, number | null] = [null, null, null];
  if (st.status === "act") {
    const own = st.short.map((i) => {
      const { s, row } = withData[i]!;
      return s.coldStartOption
        ? ([row.shortPctTwo, row.shortPctTwoLo90, row.shortPctTwoHi90] as const)
        : ([row.shortPctOne, row.shortPctOneLo90, row.shortPctOneHi90] as const);
    });
    figure = [...own.reduce((a, b) => ((b[0] ?? 0) > (a[0] ?? 0) ? b : a))];
  } else if (st.status === "watch") {
    figure = [m.outOfBandPct, m.outOfBandPctLo90, m.outOfBandPctHi90];
  }
  return {
    status: st.status,
    statusYears: st.years,
    lowConfidence: st.lowConfidence,
    partNoData: st.partNoData,
    statusAircraft: [...new Set(st.short.map((i) => withData[i]!.s.aircraft))],
    statusPct: figure[0],
    statusPctLo90: figure[1],
    statusPctHi90: figure[2],
  };
}

/** The cold-start advice of a base-month with starts: the aircraft there without the option that need it. */
function adviceRow(stays: StayInBase[], m: BaseMonthShares, t: DecisionThresholds): AdviceRow {
  const toFit = stays.filter((s) => {
    const row = s.months.find((r) => r.month === m.month);
    return s.noData === null && !s.coldStartOption && (row?.shortPctOne ?? 0) > t.shortStartsPct;
  });
  return {
    month: m.month,
    fitColdStartOption: toFit.length > 0,
    shortPctOne: m.shortPctOne,
    shortPctTwo: m.shortPctTwo,
    improvementPct: m.shortPctOne === null || m.shortPctTwo === null ? null : m.shortPctOne - m.shortPctTwo,
    aircraft: [...new Set(toFit.map((s) => s.aircraft))],
  };
}

/**
 * The decisions of one base: the status of each of its twelve local months, the advice of the months
 * with starts, and the action of each stay (in the base's order).
 */
export function baseDecisions(
  stays: StayInBase[],
  months: BaseMonthShares[],
  t: DecisionThresholds,
): { months: MonthDecision[]; advice: AdviceRow[]; actions: AircraftAction[] } {
  return {
    months: months.map((m) => baseMonthDecision(stays, m, t)),
    advice: months.filter((m) => m.starts > 0).map((m) => adviceRow(stays, m, t)),
    actions: stays.map((s) => aircraftAction(s, s.months, t)),
  };
}

/**
 * The season of a need over the calendar's twelve months, read as a cycle: it begins after the longest
 * run of months without the need and ends before it (the first such run in calendar order when runs tie),
 * so that a winter need of November to March gives "fit by November, not needed after March". Null
 * without any month; all twelve give January to December.
 *
 * @param months - local months (1–12) in which the need holds
 * @example needSeason([1, 2, 3, 11, 12]) // { fitBy: 11, notNeededAfter: 3 }
 */
export function needSeason(months: readonly number[]): { fitBy: number; notNeededAfter: number } | null {
  const needed = new Set(months);
  if (needed.size === 0) return null;
  if (needed.size === 12) return { fitBy: 1, notNeededAfter: 12 };
  let gapStart = 0;
  let gapLength = 0;
  for (let m = 1; m <= 12; m++) {
    if (needed.has(m) || !needed.has(m === 1 ? 12 : m - 1)) continue; // a run of free months starts here
    let n = 0;
    while (!needed.has(((m - 1 + n) % 12) + 1)) n++;
    if (n > gapLength) [gapStart, gapLength] = [m, n];
  }
  return {
    fitBy: ((gapStart - 1 + gapLength) % 12) + 1,
    notNeededAfter: gapStart === 1 ? 12 : gapStart - 1,
  };
}
