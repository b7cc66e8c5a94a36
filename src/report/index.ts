/**
 * The self-contained HTML planning report, rendered from `results.json` alone. Templates,
 * CSS and partials are read at run time from `templates/` at the package root, which sits two folders
 * above this file both in `src/report/` (tests) and in `dist/report/` (built tool).
 */
import { readdirSync, readFileSync } from "node:fs";
import Handlebars from "handlebars";
import { InputError } from "../errors.js";
import type { Results } from "../plan/results.js";
import { type Chart, withChartBatch } from "./chartBatch.js";
import { startChartWorkers as startChartPool } from "./chartPool.js";
import { warmUpSpecs } from "./charts.js";
import type { Status } from "./shared.js";
import { buildView } from "./view.js";

const TEMPLATE_DIR = new URL("../../templates/", import.meta.url);

/**
 * Status marks: a distinct shape per status (square, triangle, circle, dash, cross) as well as a colour
 * from the Okabe–Ito palette, so the fleet summary reads in greyscale and for colour-blind readers; at
 * low confidence the same shape is drawn outlined (hollow). Constant markup only: no data goes into
 * these.
 */
const SHAPES: Record<Status, { d: string; color: string }> = {
  act: { d: "M1 1 H9 V9 H1 Z", color: "#D55E00" },
  watch: { d: "M5 0.8 L9.4 9 L0.6 9 Z", color: "#E69F00" },
  ok: { d: "M1 5 A4 4 0 1 0 9 5 A4 4 0 1 0 1 5 Z", color: "#0072B2" },
  "no-stay": { d: "M1.5 4.2 H8.5 V5.8 H1.5 Z", color: "#8a929b" },
  "no-data": {
    d: "M1.5 0.5 L5 4 L8.5 0.5 L9.5 1.5 L6 5 L9.5 8.5 L8.5 9.5 L5 6 L1.5 9.5 L0.5 8.5 L4 5 L0.5 1.5 Z",
    color: "#CC79A7",
  },
};

function markSvg(status: Status, outlined: boolean): string {
  const { d, color } = SHAPES[status];
  const paint =
    status === "no-stay"
      ? `fill="${color}"`
      : outlined
        ? `fill="#fff" stroke="${color}" stroke-width="1.6"`
        : `fill="${color}" stroke="#000" stroke-width="0.8"`;
  return `<svg class="mark${outlined ? " mark-low" : ""}" viewBox="0 0 10 10" aria-hidden="true"><path d="${d}" ${paint}/></svg>`;
}

const STATUSES = Object.keys(SHAPES) as Status[];
const MARKS = new Map(
  STATUSES.flatMap((st) => [
    [`${st}`, markSvg(st, false)],
    [`${st}-low`, markSvg(st, true)],
  ]),
);

/** Generation time: `SOURCE_DATE_EPOCH` (whole seconds since 1970, UTC) when set, else now. */
export function generationTime(
  env: NodeJS.ProcessEnv = process.env,
  now: () => Date = () => new Date(),
): string {
  const raw = env["SOURCE_DATE_EPOCH"];
  let date: Date;
  if (raw !== undefined && raw !== "") {
    if (!/^\d{1,12}$/.test(raw.trim()))
      throw new InputError(`SOURCE_DATE_EPOCH: expected whole seconds since 1970-01-01 UTC, got "${raw}"`);
    date = new Date(Number(raw.trim()) * 1000);
  } else {
    date = now();
  }
  return `${date.toISOString().slice(0, 16).replace("T", " ")} UTC`;
}

/** The status mark of a status (outlined at low confidence) as inline SVG: constant markup only. */
export function statusMark(status: Status, lowConfidence = false): string {
  return MARKS.get(lowConfidence ? `${status}-low` : status) ?? MARKS.get("no-stay")!;
}

/** The text of a file of `templates/` (CSS, a page template). */
export function templateText(name: string): string {
  return readFileSync(new URL(name, TEMPLATE_DIR), "utf8");
}

let environment: typeof Handlebars | null = null;

/**
 * The isolated handlebars environment of the pages (built once per process): every partial of
 * `templates/partials/` and the helpers `chartSvg` and `mark`.
 */
export function pageEnvironment(): typeof Handlebars {
  if (environment) return environment;
  const hb = Handlebars.create();
  const partials = new URL("partials/", TEMPLATE_DIR);
  for (const file of readdirSync(partials).sort()) {
    if (!file.endsWith(".hbs")) continue;
    hb.registerPartial(file.slice(0, -4), readFileSync(new URL(file, partials), "utf8"));
  }
  // The chart SVG is rendered by vega from data it escapes, with our escaped <title>: placed as is.
  hb.registerHelper("chartSvg", (chart: Pick<Chart, "svg">) => new hb.SafeString(chart.svg));
  // {{mark status}} or {{mark status lowConfidence}}: the last argument of a helper is handlebars' options.
  hb.registerHelper("mark", (status: Status, ...rest: unknown[]) => {
    const low = rest.length > 1 && rest[0] === true;
    return new hb.SafeString(statusMark(status, low));
  });
  environment = hb;
  return hb;
}

const compiled = new Map<string, Handlebars.TemplateDelegate>();

/** Compiles a page template of `templates/` (`<name>.hbs`) once per process. */
function compiledTemplate(name: string): Handlebars.TemplateDelegate {
  let t = compiled.get(name);
  if (t === undefined) {
    t = pageEnvironment().compile(templateText(`${name}.hbs`), { strict: true, noEscape: false });
    compiled.set(name, t);
  }
  return t;
}

/**
 * A page of the report: the template `<name>.hbs` given a view and the inline CSS (`report.css`; with
 * `pages.css` after it on the pages of a split report).
 */
export function pageTemplate(name: "report" | "basePage", split: boolean): (view: object) => string {
  const render = compiledTemplate(name);
  const css = new Handlebars.SafeString(
    split ? `${templateText("report.css")}${templateText("pages.css")}` : templateText("report.css"),
  );
  return (view) => render({ ...view, css });
}

/**
 * Starts the chart worker threads ahead of a report (where the compiled worker exists): they load the
 * chart library and compile it on a few invented charts while the caller runs the plan.
 */
export function startChartWorkers(): void {
  startChartPool(warmUpSpecs());
}

/**
 * Prints a written report to PDF (`pdf.ts`); the browser driver is loaded on the first call only, so
 * rendering the HTML never loads it.
 */
export async function writePdf(...args: Parameters<typeof import("./pdf.js").writePdf>) {
  const pdf = await import("./pdf.js");
  return pdf.writePdf(...args);
}

/** Renders the self-contained HTML planning report from the results alone. */
export async function renderReport(results: Results): Promise<string> {
  // Every chart of the report is rendered in one batch (each distinct chart once, on worker threads
  // where available) once all the sections have described theirs.
  const generatedAt = generationTime();
  const view = await withChartBatch(() => buildView(results, { generatedAt }));
  return pageTemplate("report", false)(view);
}
