import { beforeAll, describe, expect, it } from "vitest";
import { xyChart } from "../../src/report/charts.js";
import { renderReport } from "../../src/report/index.js";
import { IMG_PAYLOAD, makeResults, SCRIPT_PAYLOAD } from "../fixtures/report/results.js";
import { type Element, elements, inner, type Token, textOf, tokenize } from "./html.js";

// Data-derived text must arrive as text: an aircraft id, a base name and a station name carrying
// markup must not add a single element or attribute to the page, in the HTML or in the chart SVG.

let html: string;
let tokens: Token[];
let els: Element[];
let clean: Element[];

beforeAll(async () => {
  html = await renderReport(makeResults({ units: "us", hostile: true }));
  tokens = tokenize(html);
  els = elements(tokens);
  clean = elements(tokenize(await renderReport(makeResults({ units: "us", hostile: false }))));
});

function count(list: Element[], name: string): number {
  return list.filter((e) => e.name === name).length;
}

describe("report escaping", () => {
  it("injects no element: the same tags as the clean report, and no script or img at all", () => {
    expect(count(els, "script")).toBe(0);
    expect(count(els, "img")).toBe(0);
    const tally = (list: Element[]) => {
      const m = new Map<string, number>();
      for (const e of list) m.set(e.name, (m.get(e.name) ?? 0) + 1);
      return Object.fromEntries([...m].sort());
    };
    expect(tally(els)).toEqual(tally(clean));
  });

  it("injects no attribute: no event handler, no src, and the same attribute names as the clean report", () => {
    const names = (list: Element[]) => new Set(list.flatMap((e) => Object.keys(e.attrs)));
    for (const e of els) for (const k of Object.keys(e.attrs)) expect(k.startsWith("on"), k).toBe(false);
    expect(names(els).has("src")).toBe(false);
    expect([...names(els)].sort()).toEqual([...names(clean)].sort());
  });

  it("shows the hostile base name, station name and aircraft id as text", () => {
    const body = textOf(tokens);
    expect(body).toContain(`North ${SCRIPT_PAYLOAD} ${IMG_PAYLOAD}`);
    expect(body).toContain(`Field ${IMG_PAYLOAD} ${SCRIPT_PAYLOAD}`);
    expect(body).toContain(`XQ-101${SCRIPT_PAYLOAD}${IMG_PAYLOAD}`);
    const h2 = els.filter((e) => e.name === "h2").map((e) => textOf(inner(tokens, e)));
    expect(h2).toContain(`Base North ${SCRIPT_PAYLOAD} ${IMG_PAYLOAD}`);
    // Attribute values keep the text too, escaped (fleet-summary cell titles).
    const titles = els.map((e) => e.attrs["title"]).filter((t): t is string => t !== undefined);
    expect(titles.some((t) => t.startsWith(`North ${SCRIPT_PAYLOAD} ${IMG_PAYLOAD}, Jan`))).toBe(true);
  });

  it("escapes the hostile base name inside the chart SVG titles", () => {
    const svgTitles = els
      .filter((e) => e.name === "title" && e.attrs["id"]?.startsWith("base-1-"))
      .map((e) => textOf(inner(tokens, e)));
    expect(svgTitles.length).toBeGreaterThan(3);
    for (const t of svgTitles.filter((x) => x.startsWith("North"))) expect(t).toContain(SCRIPT_PAYLOAD);
    expect(html).toContain("&lt;script&gt;alert(1)&lt;/script&gt;");
    expect(html).not.toContain(SCRIPT_PAYLOAD);
    expect(html).not.toContain(IMG_PAYLOAD);
  });

  it("escapes data that vega writes into the SVG (series names, axis titles) and our own <title>", async () => {
    const chart = await xyChart({
      id: "hostile",
      title: `T ${IMG_PAYLOAD}`,
      xTitle: `X ${SCRIPT_PAYLOAD}`,
      yTitle: `Y ${IMG_PAYLOAD}`,
      lines: [
        {
          name: `S ${SCRIPT_PAYLOAD}`,
          color: "#000",
          points: [
            { x: 1, y: 1 },
            { x: 2, y: 3 },
          ],
        },
      ],
    });
    const t = tokenize(chart.svg);
    const e = elements(t);
    expect(count(e, "script")).toBe(0);
    expect(count(e, "img")).toBe(0);
    for (const el of e) for (const k of Object.keys(el.attrs)) expect(k.startsWith("on"), k).toBe(false);
    const text = textOf(t);
    expect(text).toContain(`T ${IMG_PAYLOAD}`);
    expect(text).toContain(`X ${SCRIPT_PAYLOAD}`);
    expect(text).toContain(`Y ${IMG_PAYLOAD}`);
    expect(text).toContain("S <script>"); // legend labels are shortened by vega, but escaped
  });
});
