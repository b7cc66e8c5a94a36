/**
 * Report sections "Risk by month", "Out of band by hour of day" and "Cold-start advice" of a base
 * (partial `risk`): fill readings and overnight drop at the first preflight, start energy with one and
 * two accumulators, the risk chart, the out-of-band share by local hour, and the status and cold-start
 * advice by month, every share that drives a status with its 90 % interval and its spread across
 * climate years; the trapped charge by month (peak trapped pressure, thermal relief). Reads
 * `BaseResult.months` (figures, confidence, status), `outOfBandByHour`, `advice`, `trappedCharge`,
 * `Results.thresholds`, the base's hangar assumptions and the profiles' relief pressures
 * (`Results.assumptions`).
 */
import type {
  AdviceRow,
  BaseResult,
  HourRow,
  MonthRow,
  Results,
  TrappedMonthRow,
} from "../../plan/results.js";
import { formatDisplay, pct, show, shownText, type UnitSystem } from "../../units/index.js";
import { barChart, PALETTE, xyChart } from "../charts.js";
import {
  type BaseContext,
  type Figure,
  hangarText,
  monthName,
  pctInterval,
  type StatusCell,
  statusCell,
  type TableRow,
  yearsShort,
} from "../shared.js";
import { sectionId } from "./glance.js";

export interface AdviceView {
  month: string;
  cell: StatusCell;
  /** Usable climate years behind the status (the fewest among the stays there). */
  years: string;
  toFit: string;
  one: string;
  oneByYear: string;
  two: string;
  twoByYear: string;
  outOfBand: string;
  outOfBandByYear: string;
  text: string;
}

export interface RiskView {
  /** Fragment ids of the hours and advice sections, linked from the first screen. */
  hoursId: string;
  adviceId: string;
  figure: Figure | null;
  readingTable: TableRow[];
  energyTable: TableRow[];
  hourFigure: Figure | null;
  hourNote: string;
  advice: AdviceView[];
  trappedTable: TableRow[];
  trappedNote: string;
}

/** A row of a table by month: the month, a count, then the month's values. */
function monthRow(m: MonthRow, count: number, ...values: string[]): TableRow {
  return { cells: [monthName(m.month), formatDisplay(count, 0), ...values] };
}

/** Several statistics of one quantity in one cell: "P10 / P50 / P90", "mean / P90". */
function stats(...values: string[]): string {
  return values.join(" / ");
}

function readingRow(m: MonthRow, u: UnitSystem): TableRow {
  const p = (kPa: number | null) => show(u.pressure, kPa);
  return monthRow(
    m,
    m.preflights,
    pctInterval(m.belowBandPct, m.belowBandPctLo90, m.belowBandPctHi90) || "–",
    pctInterval(m.aboveBandPct, m.aboveBandPctLo90, m.aboveBandPctHi90) || "–",
    stats(p(m.morningKPaGaugeP10), p(m.morningKPaGaugeP50), p(m.morningKPaGaugeP90)),
    stats(pct(m.morningReadingPctP10), pct(m.morningReadingPctP50), pct(m.morningReadingPctP90)),
    stats(show(u.tempDelta, m.overnightDropTempMeanC), show(u.tempDelta, m.overnightDropTempP90C)),
    stats(show(u.pressureDelta, m.overnightDropKPaMean), show(u.pressureDelta, m.overnightDropKPaP90)),
    stats(pct(m.overnightDropReadingMeanPct), pct(m.overnightDropReadingP90Pct)),
  );
}

function energyRow(m: MonthRow, u: UnitSystem): TableRow {
  return monthRow(
    m,
    m.starts,
    pctInterval(m.shortPctOne, m.shortPctOneLo90, m.shortPctOneHi90) || "–",
    pctInterval(m.shortPctTwo, m.shortPctTwoLo90, m.shortPctTwoHi90) || "–",
    stats(pct(m.energyMarginOneP10Pct), pct(m.energyMarginOneP50Pct)),
    stats(pct(m.energyMarginTwoP10Pct), pct(m.energyMarginTwoP50Pct)),
    stats(show(u.tempDelta, m.dailyRangeMeanC), show(u.tempDelta, m.dailyRangeP90C)),
  );
}

function trappedRow(r: TrappedMonthRow, u: UnitSystem): TableRow {
  return {
    cells: [
      monthName(r.month),
      show(u.pressure, r.peakTrappedKPaGauge),
      formatDisplay(r.reliefEventsPerYear, 1),
      show(u.volume, r.relievedLPerYear),
      formatDisplay(r.reliefEvents, 0),
    ],
  };
}

/** Which profiles flown at the base have a thermal relief valve, and at what pressure (as written). */
function reliefNote(results: Results, base: BaseResult, u: UnitSystem): string {
  const profiles = [...new Set(results.stays.filter((s) => s.base === base.name).map((s) => s.profile))];
  const parts = profiles.map((name) => {
    const a = results.assumptions.find((x) => x.key === `profiles.${name}.reliefPressure`);
    return a && a.kind !== "text" ? `${name} relieves at ${shownText(a, u)}` : `${name} has no relief valve`;
  });
  return parts.length > 0 ? `Thermal relief: ${parts.join("; ")}.` : "";
}

/** Risk chart by month: out-of-band shares and short-start shares, with the threshold; null without preflights. */
async function riskFigure(
  { base, anchor, figs }: BaseContext,
  months: MonthRow[],
  shortPct: number,
): Promise<Figure | null> {
  if (!months.some((m) => m.preflights > 0)) return null;
  const share = (y: (m: MonthRow) => number | null) =>
    months.map((m) => ({ x: monthName(m.month), y: y(m) }));
  return figs.next(
    await xyChart({
      id: `${anchor}-risk`,
      title: `${base.name}: risk by month`,
      xTitle: "Month (local)",
      yTitle: "Share (%)",
      xType: "ordinal",
      xOrder: months.map((m) => monthName(m.month)),
      yZero: true,
      width: 560,
      height: 200,
      lines: [
        { name: "Below band", color: PALETTE.blue, shape: "circle", points: share((m) => m.belowBandPct) },
        {
          name: "Above band",
          color: PALETTE.orange,
          dash: [4, 2],
          shape: "diamond",
          points: share((m) => m.aboveBandPct),
        },
        {
          name: "Short, one accumulator",
          color: PALETTE.vermillion,
          dash: [6, 3],
          shape: "square",
          points: share((m) => m.shortPctOne),
        },
        {
          name: "Short, two accumulators",
          color: PALETTE.purple,
          dash: [2, 2],
          shape: "triangle-up",
          points: share((m) => m.shortPctTwo),
        },
      ],
      rules: [{ y: shortPct, label: `threshold ${pct(shortPct)} %`, color: PALETTE.vermillion }],
    }),
    `Share of first preflights reading below or above the band, and share of starts short of energy with one and with two accumulators, by local month, at ${base.name}. The dotted line is the plan's short-start threshold.`,
  );
}

/** Out-of-band share by local hour of day; null when no hour has a reading. */
async function hourFigure(
  { results, base, anchor, figs }: BaseContext,
  hours: HourRow[],
): Promise<Figure | null> {
  if (hours.length === 0) return null;
  const hangar = hangarText(results, base.name);
  const hourLabel = (hour: number) => String(hour).padStart(2, "0");
  return figs.next(
    await barChart({
      id: `${anchor}-hours`,
      title: `${base.name}: share out of band by local hour of day`,
      xTitle: "Hour of day (local)",
      yTitle: "Out of band (%)",
      color: PALETTE.orange,
      bars: hours.map((h) => ({ x: hourLabel(h.hour), y: h.outOfBandPct })),
      xOrder: hours.map((h) => hourLabel(h.hour)),
      width: 560,
      height: 170,
    }),
    `Share of hours at which a check would read out of band if made at that hour (the trapped charge against the band for the air temperature around the aircraft${hangar ? `: ${hangar}` : ""}), by local hour of day, at ${base.name}, all stay months pooled. The preflight itself is the first start of the day.`,
  );
}

/** "0.0 / 4.1 / 9.8": a share's minimum, median and maximum across climate years. */
function byYear(min: number | null, median: number | null, max: number | null): string {
  return min === null ? "–" : stats(pct(min), pct(median), pct(max));
}

/** Why a month has its status, in words. */
function statusText(m: MonthRow, advice: AdviceRow | undefined, thresholds: ThresholdsView): string {
  const part = m.partNoData ? " Some stays here have no climate data; the status comes from the others." : "";
  switch (m.status) {
    case "act":
      return `${m.statusAircraft.join(", ")} short of energy above ${thresholds.short} % in their own configuration${advice?.fitColdStartOption ? `; fit the cold-start option to ${advice.aircraft.join(", ")}` : "; the option is fitted: plan hangar space or a later first start"}.${part}`;
    case "watch":
      return `First preflights out of band above ${thresholds.outOfBand} %: allow servicing time and brief technicians on the overnight drop.${part}`;
    case "ok":
      return `No action expected.${part}`;
    case "no-data":
      return "Aircraft are here, but no usable climate year covers their stays.";
    default:
      return "No aircraft here this month.";
  }
}

interface ThresholdsView {
  short: string;
  outOfBand: string;
}

/** Status and cold-start advice by month, with each driving share's interval and spread across years. */
function adviceRows(base: BaseResult, thresholds: ThresholdsView): AdviceView[] {
  const adviceByMonth = new Map(base.advice.map((a) => [a.month, a]));
  return [...base.months]
    .sort((a, b) => a.month - b.month)
    .filter((m) => m.status !== "no-stay")
    .map((m) => {
      const a = adviceByMonth.get(m.month);
      return {
        month: monthName(m.month),
        cell: statusCell(base.name, m),
        years: m.status === "no-data" ? "none" : yearsShort(m.statusYears),
        toFit: a && a.aircraft.length > 0 ? a.aircraft.join(", ") : "–",
        one: pctInterval(m.shortPctOne, m.shortPctOneLo90, m.shortPctOneHi90) || "–",
        oneByYear: byYear(m.shortPctOneYearMin, m.shortPctOneYearMedian, m.shortPctOneYearMax),
        two: pctInterval(m.shortPctTwo, m.shortPctTwoLo90, m.shortPctTwoHi90) || "–",
        twoByYear: byYear(m.shortPctTwoYearMin, m.shortPctTwoYearMedian, m.shortPctTwoYearMax),
        outOfBand: pctInterval(m.outOfBandPct, m.outOfBandPctLo90, m.outOfBandPctHi90) || "–",
        outOfBandByYear: byYear(m.outOfBandPctYearMin, m.outOfBandPctYearMedian, m.outOfBandPctYearMax),
        text: statusText(m, a, thresholds),
      };
    });
}

export async function riskSection(ctx: BaseContext): Promise<RiskView> {
  const { base, u, anchor } = ctx;
  const shortPct = ctx.results.thresholds.shortPct;
  const thresholds = { short: pct(shortPct), outOfBand: pct(ctx.results.thresholds.outOfBandPct) };
  const months = [...base.months].sort((a, b) => a.month - b.month);
  const figure = await riskFigure(ctx, months, shortPct);
  const hours = [...base.outOfBandByHour].sort((a, b) => a.hour - b.hour).filter((h) => h.preflights > 0);
  return {
    hoursId: sectionId(anchor, "hours"),
    adviceId: sectionId(anchor, "advice"),
    figure,
    readingTable: months.map((m) => readingRow(m, u)),
    energyTable: months.map((m) => energyRow(m, u)),
    hourFigure: await hourFigure(ctx, hours),
    hourNote:
      hours.length > 0 ? "" : "No preflights with a reading in the years used, so no hourly breakdown.",
    advice: adviceRows(base, thresholds),
    trappedTable: [...base.trappedCharge]
      .sort((a, b) => a.month - b.month)
      .filter((r) => r.peakTrappedKPaGauge !== null)
      .map((r) => trappedRow(r, u)),
    trappedNote: reliefNote(ctx.results, base, u),
  };
}
