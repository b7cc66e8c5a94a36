/**
 * Report section "Overnight swing" of a base (partial `overnight`): the typical and the worst overnight
 * trace, each a three-panel chart (air and accumulator temperature, gas pressure, fill reading against
 * the band). Reads `BaseResult.traces` and the base's hangar assumptions (`Results.assumptions`).
 */
import type { Trace } from "../../plan/results.js";
import { PALETTE, stackedChart } from "../charts.js";
import { type BaseContext, type Figure, hangarText, localTimeText } from "../shared.js";

export interface TraceView {
  label: string;
  detail: string;
  figure: Figure | null;
}

export interface OvernightView {
  traces: TraceView[];
}

type TraceKind = "typical" | "worst";

async function traceFigure(
  { base, anchor, u, figs }: BaseContext,
  kind: TraceKind,
  trace: Trace,
  hangar: string | null,
): Promise<Figure> {
  const pts = trace.points;
  // The trace starts at the day's last start and its recharge (not necessarily in the evening).
  const xTitle = "Hours after the day's last start and recharge";
  const xDomain: [number, number] = [0, Math.max(36, ...pts.map((p) => p.hour))];
  const title = `${base.name}: ${trace.label}, ${trace.year}, starting ${localTimeText(trace.startLocal)}`;
  const panel = { id: "", title: "", xTitle, xDomain };
  const chart = await stackedChart(`${anchor}-trace-${kind}`, title, [
    {
      ...panel,
      yTitle: `Temperature (${u.temp.unit})`,
      lines: [
        {
          name: hangar ? "Air around the aircraft (outside, or hangar)" : "Outside air",
          color: PALETTE.sky,
          dash: [6, 3],
          points: pts.map((p) => ({ x: p.hour, y: u.temp.convert(p.ambientC) })),
        },
        {
          name: "Accumulator",
          color: PALETTE.vermillion,
          points: pts.map((p) => ({ x: p.hour, y: u.temp.convert(p.accumulatorC) })),
        },
      ],
    },
    {
      ...panel,
      yTitle: `Gas pressure (${u.pressure.unit})`,
      lines: [
        {
          name: "Gas pressure",
          color: PALETTE.blue,
          points: pts.map((p) => ({ x: p.hour, y: u.pressure.convert(p.gasKPaGauge) })),
        },
      ],
    },
    {
      ...panel,
      yTitle: "Fill reading (%)",
      bands: [
        {
          name: "Band at air temperature",
          color: PALETTE.green,
          points: pts.map((p) => ({ x: p.hour, y: p.bandLowPct, y2: p.bandHighPct })),
        },
      ],
      lines: [
        { name: "Reading", color: PALETTE.black, points: pts.map((p) => ({ x: p.hour, y: p.readingPct })) },
      ],
    },
  ]);
  const air = hangar ? `the air around the aircraft (${hangar}; outside air otherwise)` : "the outside air";
  return figs.next(
    chart,
    `Top: temperature of ${air} and of the accumulator. Middle: trapped gas pressure. Bottom: fill reading against the band a technician would use at that air temperature.`,
  );
}

export async function overnightSection(ctx: BaseContext): Promise<OvernightView> {
  const hangar = hangarText(ctx.results, ctx.base.name);
  const traces: TraceView[] = [];
  for (const kind of ["typical", "worst"] as const) {
    const t = ctx.base.traces[kind];
    const label = kind === "typical" ? "Typical overnight swing" : "Worst overnight swing";
    if (!t || t.points.length === 0) {
      traces.push({ label, detail: "No trace: no overnight stay in the years used.", figure: null });
      continue;
    }
    traces.push({
      label,
      detail: `${t.label}; year ${t.year}; starting ${localTimeText(t.startLocal)} local time.`,
      figure: await traceFigure(ctx, kind, t, hangar),
    });
  }
  return { traces };
}
