/**
 * Report sections "Risk by month", "Out of band by hour of day" and "Cold-start advice" of a base
 * (partial `risk`): fill readings and overnight drop at the first preflight, start energy with one and
 * two accumulators, the risk chart, the out-of-band share by local hour, and the cold-start advice by
 * month; the trapped charge by month (peak trapped pressure, thermal relief). Reads `BaseResult.months`,
 * `outOfBandByHour`, `advice`, `trappedCharge`, `Results.thresholds.shortPct`, the base's hangar
 * assumptions and the profiles' relief pressures (`Results.assumptions`).
 */
import type { BaseResult, HourRow, MonthRow, Results, TrappedMonthRow } from "../../plan/results.js";
import { formatDisplay, pct, show, shownText, type UnitSystem } from "../../units/index.js";
import { barChart, PALETTE, xyChart } from "../charts.js";
import {
  type BaseContext,
  type Figure,
  hangarText,
  monthName,
  STATUS_LABEL,
  type Status,
  type TableRow,
} from "../shared.js";

export interface AdviceView {
  month: string;
  marginOne: string;
  marginTwo: string;
  status: Status;
  label: string;
  one: string;
  two: string;
  gain: string;
  text: string;
}

export interface RiskView {
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
    pct(m.belowBandPct),
    pct(m.aboveBandPct),
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
    pct(m.shortPctOne),
    pct(m.shortPctTwo),
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

/** Cold-start advice rows by month, with the P10 energy margins of the month beside them. */
function adviceRows(base: BaseResult, shortPct: number): AdviceView[] {
  const monthByNumber = new Map(base.months.map((m) => [m.month, m]));
  return [...base.advice]
    .sort((a, b) => a.month - b.month)
    .map((a) => {
      const m = monthByNumber.get(a.month);
      const noPreflights = !m || m.preflights === 0;
      const status: Status = noPreflights ? "none" : a.fitColdStartOption ? "act" : "ok";
      let text = a.fitColdStartOption ? "Fit the cold-start option." : "One accumulator is enough.";
      if (a.fitColdStartOption && (a.shortPctTwo ?? 0) > shortPct)
        text += " Still short with two: plan hangar space or a later first start.";
      if (noPreflights) text = "No preflights in this month.";
      return {
        month: monthName(a.month),
        marginOne: m ? pct(m.energyMarginOneP10Pct) : "–",
        marginTwo: m ? pct(m.energyMarginTwoP10Pct) : "–",
        status,
        label: STATUS_LABEL[status],
        one: pct(a.shortPctOne),
        two: pct(a.shortPctTwo),
        gain: pct(a.improvementPct),
        text,
      };
    });
}

export async function riskSection(ctx: BaseContext): Promise<RiskView> {
  const { base, u } = ctx;
  const shortPct = ctx.results.thresholds.shortPct;
  const months = [...base.months].sort((a, b) => a.month - b.month);
  const figure = await riskFigure(ctx, months, shortPct);
  const hours = [...base.outOfBandByHour].sort((a, b) => a.hour - b.hour).filter((h) => h.preflights > 0);
  return {
    figure,
    readingTable: months.map((m) => readingRow(m, u)),
    energyTable: months.map((m) => energyRow(m, u)),
    hourFigure: await hourFigure(ctx, hours),
    hourNote:
      hours.length > 0 ? "" : "No preflights with a reading in the years used, so no hourly breakdown.",
    advice: adviceRows(base, shortPct),
    trappedTable: [...base.trappedCharge]
      .sort((a, b) => a.month - b.month)
      .filter((r) => r.peakTrappedKPaGauge !== null)
      .map((r) => trappedRow(r, u)),
    trappedNote: reliefNote(ctx.results, base, u),
  };
}
