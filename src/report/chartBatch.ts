/**
 * Rendering the charts the report's sections describe. Inside `withChartBatch` (the whole report) a
 * chart is only noted when a section asks for it; the batch then renders every distinct spec once (a
 * chart that several bases share, such as a profile's precharge line, is drawn once), on worker
 * threads where the compiled worker exists (`chartPool.ts`), and fills in each chart's SVG before the
 * page is laid out. Outside a batch a chart is rendered at once. The SVG is the same either way: vega
 * escapes every text and attribute it writes; the chart's own `<title>` is escaped here.
 */
import { AsyncLocalStorage } from "node:async_hooks";
import { chartWorkersAvailable, renderOnWorker } from "./chartPool.js";
import type { Spec } from "./chartRender.js";

/** A rendered chart: escaped-by-construction SVG markup and its plain-text title. */
export interface Chart {
  id: string;
  title: string;
  svg: string;
  /** Axis titles as written in the spec (for the caption and for tests). */
  axisTitles: string[];
}

/** Escapes text for XML content and attribute values. */
export function escapeXml(text: string): string {
  return text
    .replace(/&/g, "&amp;")
    .replace(/</g, "&lt;")
    .replace(/>/g, "&gt;")
    .replace(/"/g, "&quot;")
    .replace(/'/g, "&#39;");
}

/**
 * Charts asked for inside one batch: each distinct spec is sent to be rendered as soon as a section asks
 * for it (so rendering runs while the other sections are built), and every chart waits for its spec.
 */
class ChartBatch {
  readonly svgBySpec = new Map<string, Promise<string>>();
  readonly charts: { chart: Chart; svg: Promise<string> }[] = [];

  add(chart: Chart, spec: Spec): void {
    const key = JSON.stringify(spec);
    let svg = this.svgBySpec.get(key) ?? recentSvg(key);
    if (svg === undefined) {
      svg = renderSpec(spec);
      svg.catch(() => undefined); // reported when the batch ends
      keepRecent(key, svg);
    }
    this.svgBySpec.set(key, svg);
    this.charts.push({ chart, svg });
  }
}

/**
 * The renderings of the last RECENT_SPECS distinct specs, across batches: a chart that the pages of a
 * report split by base share (a profile's curves at one atmosphere, say) is rendered once, while memory
 * holds a bounded number of them whatever the number of pages.
 */
export const RECENT_SPECS = 64;
const recent = new Map<string, Promise<string>>();

function recentSvg(key: string): Promise<string> | undefined {
  const svg = recent.get(key);
  if (svg !== undefined) {
    recent.delete(key); // most recently used last
    recent.set(key, svg);
  }
  return svg;
}

function keepRecent(key: string, svg: Promise<string>): void {
  recent.set(key, svg);
  // A failed rendering is not kept: the next batch asks again.
  svg.catch(() => recent.get(key) === svg && recent.delete(key));
  if (recent.size > RECENT_SPECS) recent.delete(recent.keys().next().value as string);
}

const batches = new AsyncLocalStorage<ChartBatch>();

/**
 * Runs `build` with every chart it asks for noted and sent to be rendered (each distinct spec once, on
 * worker threads where available) instead of rendered on the spot; fills in their SVG once `build` has
 * returned and the renderings have come, then returns `build`'s result.
 */
export async function withChartBatch<T>(build: () => Promise<T>): Promise<T> {
  const batch = new ChartBatch();
  const result = await batches.run(batch, build);
  const svgs = await Promise.all(batch.charts.map((c) => c.svg));
  batch.charts.forEach(({ chart }, i) => {
    chart.svg = finishSvg(svgs[i]!, chart.id, chart.title);
  });
  return result;
}

/** Renderings in this thread, one after the other (each waits for the one before). */
let inThread: Promise<unknown> = Promise.resolve();

/**
 * The SVG markup of a spec: on a chart worker where they exist, else (or when the worker fails, e.g. out
 * of its memory) in this thread.
 */
function renderSpec(spec: Spec): Promise<string> {
  if (chartWorkersAvailable()) return renderOnWorker(spec).catch(() => renderInThread(spec));
  return renderInThread(spec);
}

function renderInThread(spec: Spec): Promise<string> {
  const svg = inThread.then(async () => (await import("./chartRender.js")).specToSvg(spec));
  inThread = svg.catch(() => undefined);
  return svg;
}

/**
 * A chart from its vega-lite spec: rendered at once, or (inside `withChartBatch`) noted and given its
 * SVG when the batch renders.
 */
export async function renderChart(
  id: string,
  title: string,
  spec: Spec,
  axisTitles: string[],
): Promise<Chart> {
  const chart: Chart = { id, title, svg: "", axisTitles };
  const batch = batches.getStore();
  if (batch !== undefined) batch.add(chart, spec);
  else chart.svg = finishSvg(await renderSpec(spec), id, title);
  return chart;
}

/**
 * Makes rendered SVG safe to inline next to other charts: element ids (clip paths) get the chart's
 * prefix, numbered in order of appearance so the output is the same on every run, and an escaped
 * `<title>` becomes the first child of the root element.
 */
function finishSvg(svg: string, id: string, title: string): string {
  const titleId = `${id}-title`;
  return prefixIds(svg, id).replace(
    /^<svg\b([^>]*)>/,
    (_m, attrs: string) =>
      `<svg${attrs} role="img" aria-labelledby="${titleId}" id="${id}"><title id="${titleId}">${escapeXml(title)}</title>`,
  );
}

/** Renames every `id="…"` in one SVG to `<prefix>-<n>` and rewrites its `url(#…)` and `href="#…"` uses. */
function prefixIds(svg: string, prefix: string): string {
  const map = new Map<string, string>();
  for (const m of svg.matchAll(/\sid="([^"]+)"/g)) {
    const old = m[1]!;
    if (!map.has(old)) map.set(old, `${prefix}-d${map.size + 1}`);
  }
  if (map.size === 0) return svg;
  return svg
    .replace(
      /(\sid=")([^"]+)(")/g,
      (_m, a: string, old: string, b: string) => `${a}${map.get(old) ?? old}${b}`,
    )
    .replace(/url\(#([^)]+)\)/g, (_m, old: string) => `url(#${map.get(old) ?? old})`)
    .replace(
      /(href=")#([^"]+)(")/g,
      (_m, a: string, old: string, b: string) => `${a}#${map.get(old) ?? old}${b}`,
    );
}
