/**
 * Charts as static inline SVG: the report's sections describe each chart as a vega-lite spec
 * (`xyChart`, `stackedChart`, `barChart`); `renderChart` (chartBatch.ts) turns it into SVG on the
 * server with vega's headless renderer: no canvas, no network, no script in the page.
 * Colours are the Okabe–Ito colour-blind-safe palette (Okabe and Ito, "Color Universal Design", 2008);
 * every series also differs by dash pattern or point shape, so the charts read in greyscale.
 */
import { type Chart, renderChart } from "./chartBatch.js";
import type { Spec } from "./chartRender.js";

export { renderChart } from "./chartBatch.js";

/** Okabe–Ito palette. */
export const PALETTE = {
  black: "#000000",
  orange: "#E69F00",
  sky: "#56B4E9",
  green: "#009E73",
  yellow: "#F0E442",
  blue: "#0072B2",
  vermillion: "#D55E00",
  purple: "#CC79A7",
} as const;

/** System font keywords only (CSS Fonts Level 4 generic families): the reader's own sans-serif face. */
const FONT = "system-ui, sans-serif";

export type { Chart } from "./chartBatch.js";

export interface LineSeries {
  name: string;
  color: string;
  /** Dash pattern; empty or absent = solid. */
  dash?: number[];
  /** Point shape (vega symbol name); absent = no points. */
  shape?: string;
  points: { x: number | string; y: number | null }[];
}

export interface BandSeries {
  name: string;
  color: string;
  points: { x: number | string; y: number | null; y2: number | null }[];
}

export interface RuleLine {
  y: number;
  label: string;
  color: string;
}

export interface XYChartOptions {
  id: string;
  title: string;
  xTitle: string;
  yTitle: string;
  /**
   * "quantitative" for numbers, "ordinal" for categories such as month names (in the given order),
   * "temporal" for dates given as "YYYY-MM-DD" (read and labelled in UTC, so the machine's zone never
   * shifts a day).
   */
  xType?: "quantitative" | "ordinal" | "temporal";
  xOrder?: string[];
  xDomain?: [number, number];
  yDomain?: [number, number];
  yZero?: boolean;
  width?: number;
  height?: number;
  lines: LineSeries[];
  bands?: BandSeries[];
  rules?: RuleLine[];
}

const BASE_CONFIG = {
  font: FONT,
  background: "white",
  view: { stroke: "#bbb" },
  axis: {
    labelFontSize: 10,
    titleFontSize: 11,
    titleFontWeight: "normal",
    titleColor: "#222",
    labelColor: "#333",
    gridColor: "#e4e4e4",
    domainColor: "#888",
    tickColor: "#888",
  },
  legend: {
    orient: "bottom",
    direction: "horizontal",
    labelFontSize: 10,
    titleFontSize: 10,
    symbolStrokeWidth: 2,
    labelLimit: 220,
    columns: 2,
  },
} as const;

function finite(v: number | null): v is number {
  return v !== null && Number.isFinite(v);
}

/** Layers of one x–y panel (bands, lines with optional points, horizontal rules). */
function xyLayers(o: XYChartOptions): { layers: Spec[]; domain: string[]; colors: string[] } {
  const xType = o.xType ?? "quantitative";
  const xEnc: Spec = {
    field: "x",
    type: xType,
    title: o.xTitle,
    ...(xType === "ordinal" && o.xOrder ? { sort: o.xOrder, scale: { domain: o.xOrder } } : {}),
    ...(xType === "quantitative" && o.xDomain ? { scale: { domain: o.xDomain, nice: false } } : {}),
    ...(xType === "temporal" ? { scale: { type: "utc" } } : {}),
    axis:
      xType === "ordinal"
        ? { labelAngle: 0 }
        : xType === "temporal"
          ? { format: "%b %Y", labelAngle: 0, tickCount: 6 }
          : { tickCount: 8 },
  };
  const yScale: Spec = { zero: o.yZero ?? false };
  if (o.yDomain) yScale["domain"] = o.yDomain;
  const yEnc: Spec = { field: "y", type: "quantitative", title: o.yTitle, scale: yScale };
  const bands = o.bands ?? [];
  const domain = [...bands.map((b) => b.name), ...o.lines.map((l) => l.name)];
  const colors = [...bands.map((b) => b.color), ...o.lines.map((l) => l.color)];
  // Bands use the fill channel (square legend symbols), lines the stroke and dash channels (one merged
  // legend with stroke symbols); points share the stroke scale and add a shape.
  const lineDomain = o.lines.map((l) => l.name);
  const strokeScale = { domain: lineDomain, range: o.lines.map((l) => l.color) };
  const dashScale = { domain: lineDomain, range: o.lines.map((l) => (l.dash?.length ? l.dash : [1, 0])) };
  // With a band legend beside it, the line legend takes one column so the two fit the chart's width.
  const lineLegend = { title: null, symbolType: "stroke", ...(bands.length > 0 ? { columns: 1 } : {}) };
  const layers: Spec[] = [];
  if (bands.length > 0) {
    layers.push({
      data: {
        values: bands.flatMap((b) =>
          b.points
            .filter((p) => finite(p.y) && finite(p.y2))
            .map((p) => ({ x: p.x, y: p.y, y2: p.y2, band: b.name })),
        ),
      },
      mark: { type: "area", fillOpacity: 0.3 },
      encoding: {
        x: xEnc,
        y: yEnc,
        y2: { field: "y2" },
        fill: {
          field: "band",
          type: "nominal",
          scale: { domain: bands.map((b) => b.name), range: bands.map((b) => b.color) },
          legend: { title: null, symbolType: "square", symbolOpacity: 0.45, columns: 1 },
        },
      },
    });
  }
  const lineValues = o.lines.flatMap((l) =>
    l.points.filter((p) => finite(p.y)).map((p) => ({ x: p.x, y: p.y, series: l.name })),
  );
  layers.push({
    data: { values: lineValues },
    mark: { type: "line", strokeWidth: 2 },
    encoding: {
      x: xEnc,
      y: yEnc,
      stroke: { field: "series", type: "nominal", scale: strokeScale, legend: lineLegend },
      strokeDash: { field: "series", type: "nominal", scale: dashScale, legend: lineLegend },
    },
  });
  const pointed = o.lines.filter((l) => l.shape);
  if (pointed.length > 0) {
    layers.push({
      data: {
        values: pointed.flatMap((l) =>
          l.points.filter((p) => finite(p.y)).map((p) => ({ x: p.x, y: p.y, series: l.name })),
        ),
      },
      mark: { type: "point", filled: false, size: 40, strokeWidth: 1.6 },
      encoding: {
        x: xEnc,
        y: yEnc,
        stroke: { field: "series", type: "nominal", scale: strokeScale, legend: lineLegend },
        shape: {
          field: "series",
          type: "nominal",
          scale: { domain: pointed.map((l) => l.name), range: pointed.map((l) => l.shape) },
          legend: null,
        },
      },
    });
  }
  for (const r of o.rules ?? []) {
    layers.push({
      data: { values: [{ y: r.y, label: r.label }] },
      layer: [
        {
          mark: { type: "rule", strokeDash: [2, 2], color: r.color, strokeWidth: 1.5 },
          encoding: { y: { field: "y", type: "quantitative" } },
        },
        {
          mark: { type: "text", align: "right", baseline: "bottom", dy: -2, fontSize: 10, color: r.color },
          encoding: {
            y: { field: "y", type: "quantitative" },
            x: { value: o.width ?? 290 },
            text: { field: "label" },
          },
        },
      ],
    });
  }
  return { layers, domain, colors };
}

/** The spec of a single x–y chart with lines, optional shaded bands and horizontal rules. */
function xySpec(o: XYChartOptions): Spec {
  return {
    $schema: "https://vega.github.io/schema/vega-lite/v5.json",
    width: o.width ?? 290,
    height: o.height ?? 170,
    config: BASE_CONFIG,
    layer: xyLayers(o).layers,
  };
}

/** A single x–y chart with lines, optional shaded bands and horizontal rules. */
export async function xyChart(o: XYChartOptions): Promise<Chart> {
  return renderChart(o.id, o.title, xySpec(o), [o.xTitle, o.yTitle]);
}

/** The spec of panels stacked vertically over a shared x axis title. */
function stackedSpec(panels: XYChartOptions[]): Spec {
  return {
    $schema: "https://vega.github.io/schema/vega-lite/v5.json",
    config: {
      ...BASE_CONFIG,
      legend: { ...BASE_CONFIG.legend, orient: "right", direction: "vertical", columns: 1 },
    },
    spacing: 12,
    vconcat: panels.map((p) => ({
      width: p.width ?? 560,
      height: p.height ?? 110,
      layer: xyLayers(p).layers,
    })),
    resolve: {
      scale: { stroke: "independent", strokeDash: "independent", fill: "independent", shape: "independent" },
      legend: { stroke: "independent", strokeDash: "independent", fill: "independent" },
    },
  };
}

/** Panels stacked vertically over a shared x axis title (the overnight traces). */
export async function stackedChart(id: string, title: string, panels: XYChartOptions[]): Promise<Chart> {
  return renderChart(
    id,
    title,
    stackedSpec(panels),
    panels.flatMap((p) => [p.xTitle, p.yTitle]),
  );
}

export interface BarOptions {
  id: string;
  title: string;
  xTitle: string;
  yTitle: string;
  color: string;
  /** Bars at categories (ordinal) or over [x, x2) bins (quantitative). */
  bars: { x: number | string; x2?: number; y: number | null; label?: string }[];
  xOrder?: string[];
  yDomain?: [number, number];
  width?: number;
  height?: number;
}

/** The spec of a bar chart: categories, or contiguous bins when every bar has `x2`. */
function barSpec(o: BarOptions): Spec {
  const binned = o.bars.length > 0 && o.bars.every((b) => b.x2 !== undefined);
  const values = o.bars.filter((b) => finite(b.y)).map((b) => ({ x: b.x, x2: b.x2, y: b.y }));
  const x: Spec = binned
    ? { field: "x", type: "quantitative", bin: { binned: true }, title: o.xTitle }
    : {
        field: "x",
        type: "ordinal",
        title: o.xTitle,
        axis: { labelAngle: 0 },
        ...(o.xOrder ? { sort: o.xOrder, scale: { domain: o.xOrder } } : {}),
      };
  return {
    $schema: "https://vega.github.io/schema/vega-lite/v5.json",
    width: o.width ?? 290,
    height: o.height ?? 170,
    config: BASE_CONFIG,
    data: { values },
    mark: { type: "bar", color: o.color, stroke: "#333", strokeWidth: 0.5, ...(binned ? {} : {}) },
    encoding: {
      x,
      ...(binned ? { x2: { field: "x2" } } : {}),
      y: {
        field: "y",
        type: "quantitative",
        title: o.yTitle,
        ...(o.yDomain ? { scale: { domain: o.yDomain } } : {}),
      },
    },
  };
}

/** A bar chart: categories, or contiguous bins when every bar has `x2`. */
export async function barChart(o: BarOptions): Promise<Chart> {
  return renderChart(o.id, o.title, barSpec(o), [o.xTitle, o.yTitle]);
}

export interface TornadoOptions {
  id: string;
  title: string;
  xTitle: string;
  /** Categories from top to bottom (the variants, largest change first). */
  categories: string[];
  /** Title of the category axis. */
  yTitle: string;
  /** One bar per category for each series (a change; null: no bar), told apart by colour and outline. */
  series: { name: string; color: string; dash: number[]; values: (number | null)[] }[];
  width?: number;
}

/**
 * A tornado chart: horizontal bars of a change from a baseline (x, zero at the centre line), one row
 * per category and one bar per series within a row.
 */
export async function tornadoChart(o: TornadoOptions): Promise<Chart> {
  const values = o.series.flatMap((s) =>
    s.values.flatMap((v, i) => (finite(v) ? [{ category: o.categories[i], series: s.name, x: v }] : [])),
  );
  const names = o.series.map((s) => s.name);
  const spec: Spec = {
    $schema: "https://vega.github.io/schema/vega-lite/v5.json",
    width: o.width ?? 420,
    // With an offset channel the step is that of one bar within a row (vega-lite 5: step "for" offset).
    height: { step: 11 },
    config: { ...BASE_CONFIG, legend: { ...BASE_CONFIG.legend, columns: 3 } },
    layer: [
      {
        data: { values },
        mark: { type: "bar", strokeWidth: 1, stroke: "#222", height: { band: 0.9 } },
        encoding: {
          y: {
            field: "category",
            type: "nominal",
            title: o.yTitle,
            sort: o.categories,
            scale: { domain: o.categories },
            // Headless text measuring estimates widths generously: room for the longest variant label.
            axis: { labelLimit: 330 },
          },
          yOffset: { field: "series", type: "nominal", sort: names, scale: { domain: names } },
          x: { field: "x", type: "quantitative", title: o.xTitle, axis: { tickCount: 6 } },
          fill: {
            field: "series",
            type: "nominal",
            scale: { domain: names, range: o.series.map((s) => s.color) },
            legend: { title: null, symbolType: "square" },
          },
          strokeDash: {
            field: "series",
            type: "nominal",
            scale: { domain: names, range: o.series.map((s) => (s.dash.length ? s.dash : [1, 0])) },
            legend: null,
          },
        },
      },
      {
        data: { values: [{ x: 0 }] },
        mark: { type: "rule", color: "#000", strokeWidth: 1 },
        encoding: { x: { field: "x", type: "quantitative" } },
      },
    ],
  };
  return renderChart(o.id, o.title, spec, [o.xTitle, o.yTitle]);
}

/**
 * Specs of every kind the builders above make (lines with points, bands and a rule; stacked panels;
 * bars by category and by bin), on invented numbers: rendered once by a chart worker while the plan
 * runs, they get vega's code compiled before the report's own charts arrive. Never shown.
 */
export function warmUpSpecs(): Spec[] {
  const xs = Array.from({ length: 25 }, (_, i) => i * 2 - 20);
  const wave = (k: number) => xs.map((x) => ({ x, y: k * Math.sin(x / 7) + x / 3 }));
  const panel: XYChartOptions = {
    id: "",
    title: "",
    xTitle: "x",
    yTitle: "y",
    lines: [
      { name: "a", color: PALETTE.blue, points: wave(5) },
      { name: "b", color: PALETTE.orange, dash: [6, 3], shape: "square", points: wave(3) },
    ],
    bands: [{ name: "c", color: PALETTE.green, points: xs.map((x) => ({ x, y: x / 3 - 4, y2: x / 3 + 4 })) }],
    rules: [{ y: 2, label: "r", color: PALETTE.vermillion }],
  };
  const months = ["Jan", "Feb", "Mar", "Apr", "May", "Jun"];
  return [
    xySpec(panel),
    xySpec({
      ...panel,
      xType: "ordinal",
      xOrder: months,
      lines: [{ ...panel.lines[0]!, points: months.map((x, i) => ({ x, y: i })) }],
      bands: [],
      rules: [],
    }),
    stackedSpec([panel, { ...panel, bands: [] }, { ...panel, rules: [] }]),
    barSpec({ ...panel, color: PALETTE.sky, bars: months.map((x, i) => ({ x, y: i + 1 })), xOrder: months }),
    barSpec({ ...panel, color: PALETTE.sky, bars: xs.map((x) => ({ x, x2: x + 2, y: Math.abs(x) })) }),
  ];
}
