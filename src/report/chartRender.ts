/**
 * One chart spec to SVG markup: the vega-lite spec compiled to vega and rendered through
 * `View.toSVG()` with the headless renderer ("none"): no canvas, no network, no script in the page.
 * Vega escapes every text and attribute it writes. Runs on the chart worker threads (`chartWorker.ts`)
 * or, where they are not available, in the calling thread; the markup is the same either way.
 */
import * as vega from "vega";
import * as vl from "vega-lite";

/** A vega-lite spec as the chart builders write it (plain data: it may cross to a worker thread). */
export type Spec = Record<string, unknown>;

/** The SVG markup of a spec, its long decimals rounded (ids and title are added by the caller). */
export async function specToSvg(spec: Spec): Promise<string> {
  // Only errors are reported: legend-merging notices from vega-lite would be noise on the CLI's stderr.
  const quiet = vega.logger(vega.Error);
  const compiled = vl.compile(spec as unknown as vl.TopLevelSpec, { logger: quiet }).spec;
  const view = new vega.View(vega.parse(compiled), { renderer: "none", logLevel: vega.Error });
  try {
    return roundCoordinates(await view.toSVG());
  } finally {
    view.finalize();
  }
}

/**
 * Rounds long decimals inside tags (path data, transforms, positions) to 0.01 px, which no screen or
 * printer resolves; text content is left alone. Keeps the inline SVG small.
 */
function roundCoordinates(svg: string): string {
  return svg.replace(/<[^>]+>/g, (tag) =>
    tag.replace(/-?\d+\.\d{3,}/g, (n) => {
      const r = Math.round(Number(n) * 100) / 100;
      return String(Object.is(r, -0) ? 0 : r);
    }),
  );
}
