/**
 * Report section "Climate summary" of a base (partial `climate`): monthly air temperature chart and
 * table, the daily-swing histogram, and the coldest mornings with the 1-in-10 and 1-in-30-year values
 * and their 90 % intervals; the climate design temperatures (annual 99.6 % and 99 %, the coldest
 * month's 1 % value, the coldest hour and the coldest morning with their 1-in-10 and 1-in-30-year
 * values, hours below the plan's cold thresholds with the longest spell). Reads
 * `BaseResult.climateMonths`, `dailyRangeHistogram`, `coldestMorningC`, `coldest1in10C`,
 * `coldest1in30C` (with `…Lo90`, `…Hi90`), `coldestMorningByYear` and `designTemperatures`.
 */
import type { BaseResult, ClimateMonthRow } from "../../plan/results.js";
import { formatDisplay, show, type UnitSystem } from "../../units/index.js";
import { barChart, PALETTE, xyChart } from "../charts.js";
import { type BaseContext, type Figure, monthName, nullable, type TableRow, yearsText } from "../shared.js";

export interface ClimateView {
  figures: Figure[];
  table: TableRow[];
  coldest: { morning: string; oneIn10: string; oneIn30: string; byYear: string };
  design: TableRow[];
}

/** The climate design temperatures of a base, one line each; a missing value says why. */
function designRows(base: BaseResult, u: UnitSystem): TableRow[] {
  const d = base.designTemperatures;
  const T = u.temp.unit;
  const degrees = (c: number | null, why: string | null = null) =>
    c === null ? `–${why ? ` (${why})` : ""}` : `${show(u.temp, c)} ${T}`;
  const interval = (v: number | null, lo: number | null, hi: number | null) =>
    v === null || lo === null || hi === null
      ? degrees(v)
      : `${degrees(v)} (90 % interval ${show(u.temp, lo)} to ${show(u.temp, hi)})`;
  const h = d.coldestHour;
  const hours = (n: number | null) => (n === null ? "–" : `${formatDisplay(n, 1)} h`);
  const rows: [string, string][] = [
    [
      "Years used (enough of their hours present)",
      d.years.length > 0 ? yearsText(d.years) : `none (${d.reason})`,
    ],
    ["Annual 99.6 % cold dry-bulb", degrees(d.annual996C, d.reason)],
    ["Annual 99 % cold dry-bulb", degrees(d.annual99C, d.reason)],
    [
      "Coldest month (lowest mean) and its 1 % value",
      d.coldestMonth === null
        ? `– (${d.coldestMonthReason})`
        : `${monthName(d.coldestMonth.month)}: ${degrees(d.coldestMonth.p1C)}`,
    ],
    ["Coldest hour of the year: mean of the years", degrees(h.meanC, d.reason)],
    ["Coldest hour: 1-in-10-year (Gumbel fit)", interval(h.oneIn10C, h.oneIn10CLo90, h.oneIn10CHi90)],
    ["Coldest hour: 1-in-30-year (same fit)", interval(h.oneIn30C, h.oneIn30CLo90, h.oneIn30CHi90)],
    ["Coldest morning (first start): mean of the years", degrees(d.coldestMorningMeanC)],
    [
      "Coldest morning: 1-in-10-year (Gumbel fit)",
      interval(base.coldest1in10C, base.coldest1in10CLo90, base.coldest1in10CHi90),
    ],
    [
      "Coldest morning: 1-in-30-year (same fit)",
      interval(base.coldest1in30C, base.coldest1in30CLo90, base.coldest1in30CHi90),
    ],
    ...d.hoursBelow.map((b): [string, string] => [
      `Hours a year below ${degrees(b.thresholdC)} (longest spell)`,
      b.hoursPerYear === null ? `– (${d.reason})` : `${hours(b.hoursPerYear)} (${hours(b.longestSpellH)})`,
    ]),
  ];
  return rows.map(([label, value]) => ({ cells: [label, value] }));
}

export async function climateSection({ base, anchor, u, figs }: BaseContext): Promise<ClimateView> {
  const T = u.temp.unit;
  const months = [...base.climateMonths].sort((a, b) => a.month - b.month);
  const series = (
    name: string,
    color: string,
    shape: string,
    tempC: (m: ClimateMonthRow) => number | null,
    dash?: number[],
  ) => ({
    name,
    color,
    ...(dash ? { dash } : {}),
    shape,
    points: months.map((m) => ({ x: monthName(m.month), y: nullable(u.temp.convert, tempC(m)) })),
  });
  const figures: Figure[] = [
    figs.next(
      await xyChart({
        id: `${anchor}-climate`,
        title: `${base.name}: monthly temperature (local months, all years pooled)`,
        xTitle: "Month (local)",
        yTitle: `Air temperature (${T})`,
        xType: "ordinal",
        xOrder: months.map((m) => monthName(m.month)),
        lines: [
          series("Maximum", PALETTE.vermillion, "triangle-up", (m) => m.maxC, [6, 3]),
          series("Mean", PALETTE.black, "circle", (m) => m.meanC),
          series("Minimum", PALETTE.blue, "triangle-down", (m) => m.minC, [2, 2]),
        ],
      }),
      `Monthly minimum, mean and maximum of the hourly air temperature at ${base.name}, in ${T}.`,
    ),
  ];
  if (base.dailyRangeHistogram.length > 0) {
    figures.push(
      figs.next(
        await barChart({
          id: `${anchor}-swing`,
          title: `${base.name}: distribution of the daily temperature swing`,
          xTitle: `Daily swing, maximum − minimum (${u.tempDelta.unit})`,
          yTitle: "Days (count)",
          color: PALETTE.sky,
          bars: base.dailyRangeHistogram.map((b) => ({
            x: u.tempDelta.convert(b.lowC),
            x2: u.tempDelta.convert(b.highC),
            y: b.days,
          })),
        }),
        `Distribution of the local-day temperature swing (days with at least 20 hours of data) at ${base.name}, in ${u.tempDelta.unit}.`,
      ),
    );
  }
  const degrees = (tempC: number | null) => (tempC === null ? "–" : `${show(u.temp, tempC)} ${T}`);
  /** "−47.3 °F (90 % interval −51.2 to −43.0 °F)". */
  const withInterval = (v: number | null, lo: number | null, hi: number | null) =>
    v === null || lo === null || hi === null
      ? degrees(v)
      : `${degrees(v)} (90 % interval ${show(u.temp, lo)} to ${show(u.temp, hi)} ${T})`;
  const n = base.coldestMorningByYear.length;
  return {
    figures,
    table: months.map((m) => ({
      cells: [
        monthName(m.month),
        show(u.temp, m.minC),
        show(u.temp, m.meanC),
        show(u.temp, m.maxC),
        show(u.tempDelta, m.meanDailyRangeC),
        show(u.tempDelta, m.p90DailyRangeC),
      ],
    })),
    coldest: {
      morning: degrees(base.coldestMorningC),
      oneIn10: withInterval(base.coldest1in10C, base.coldest1in10CLo90, base.coldest1in10CHi90),
      oneIn30: `${withInterval(base.coldest1in30C, base.coldest1in30CLo90, base.coldest1in30CHi90)}${base.coldest1in30C !== null && n < 30 ? `, from ${n} year${n === 1 ? "" : "s"} of minima` : ""}`,
      byYear: base.coldestMorningByYear.map((y) => `${y.year}: ${degrees(y.tempC)}`).join(", ") || "none",
    },
    design: designRows(base, u),
  };
}
