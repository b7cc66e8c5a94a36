/**
 * Report section "Climate summary" of a base (partial `climate`): monthly air temperature chart and
 * table, the daily-swing histogram, and the coldest mornings. Reads `BaseResult.climateMonths`,
 * `dailyRangeHistogram`, `coldestMorningC`, `coldest1in10C` and `coldestMorningByYear`.
 */
import type { ClimateMonthRow } from "../../plan/results.js";
import { show } from "../../units/index.js";
import { barChart, PALETTE, xyChart } from "../charts.js";
import { type BaseContext, type Figure, monthName, nullable, type TableRow } from "../shared.js";

export interface ClimateView {
  figures: Figure[];
  table: TableRow[];
  coldest: { morning: string; oneIn10: string; byYear: string };
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
      oneIn10: degrees(base.coldest1in10C),
      byYear: base.coldestMorningByYear.map((y) => `${y.year}: ${degrees(y.tempC)}`).join(", ") || "none",
    },
  };
}
