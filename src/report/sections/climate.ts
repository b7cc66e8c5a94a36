/**
 * Report section "Climate summary" of a base (partial `climate`): monthly air temperature chart and
 * table, the daily-swing histogram, and the coldest mornings with the 1-in-10 and 1-in-30-year values
 * and their 90 % intervals. Reads `BaseResult.climateMonths`, `dailyRangeHistogram`,
 * `coldestMorningC`, `coldest1in10C`, `coldest1in30C` (with `…Lo90`, `…Hi90`) and `coldestMorningByYear`.
 */
import type { ClimateMonthRow } from "../../plan/results.js";
import { show } from "../../units/index.js";
import { barChart, PALETTE, xyChart } from "../charts.js";
import { type BaseContext, type Figure, monthName, nullable, type TableRow } from "../shared.js";

export interface ClimateView {
  figures: Figure[];
  table: TableRow[];
  coldest: { morning: string; oneIn10: string; oneIn30: string; byYear: string };
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
  };
}
