import { readdirSync, readFileSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import type { Results } from "../../src/plan/results.js";
import { generationTime, renderReport } from "../../src/report/index.js";
import { makeResults } from "../fixtures/report/results.js";
import { type Element, elements, inner, nestingProblem, type Token, textOf, tokenize } from "./html.js";

// Structure only: the fixture's numbers are made up, so nothing here asserts a physics value.

const SECTIONS = ["climate", "precharge", "overnight", "risk", "hours", "advice", "nitrogen"];

let results: Results;
let html: string;
let tokens: Token[];
let els: Element[];

beforeAll(async () => {
  vi.stubEnv("SOURCE_DATE_EPOCH", "1700000000");
  results = makeResults({ units: "us" });
  html = await renderReport(results);
  tokens = tokenize(html);
  els = elements(tokens);
});
afterAll(() => {
  vi.unstubAllEnvs();
});

function text(el: Element): string {
  return textOf(inner(tokens, el)).replace(/\s+/g, " ").trim();
}

describe("report structure", () => {
  it("is one balanced HTML document with inline CSS and no script or outside resource", () => {
    expect(html.startsWith("<!doctype html>")).toBe(true);
    expect(nestingProblem(tokens)).toBeNull();
    expect(els.filter((e) => e.name === "style")).toHaveLength(1);
    expect(
      els.filter((e) => ["script", "link", "img", "iframe", "object", "embed"].includes(e.name)),
    ).toEqual([]);
    for (const e of els) {
      for (const [k, v] of Object.entries(e.attrs)) {
        expect(k.startsWith("on"), `event attribute ${k} on <${e.name}>`).toBe(false);
        if (k === "src" || k === "href" || k === "xlink:href") expect(v).not.toMatch(/^[a-z][a-z0-9+.-]*:/i);
      }
    }
    expect(html).not.toMatch(/url\((?!#)/); // CSS and SVG refer only to fragments in the page
    expect(html).not.toMatch(/@import/);
  });

  it("has the title block: plan name, generation time from SOURCE_DATE_EPOCH, tool version, climate years", () => {
    const header = els.find((e) => e.name === "header")!;
    const t = text(header);
    expect(t).toContain(results.plan);
    // 1700000000 s after 1970-01-01 UTC is 2023-11-14 22:13:20 UTC (checked with `date -u -d @1700000000`).
    expect(t).toContain("2023-11-14 22:13 UTC");
    expect(t).toContain(results.generatedBy);
    expect(t).toContain("2015–2017, 2019");
    expect(text(els.find((e) => e.name === "title")!)).toContain(results.plan);
  });

  it("takes the generation time from SOURCE_DATE_EPOCH, else the clock, and rejects a malformed value", () => {
    // 0 s is the epoch itself (POSIX definition of seconds since the epoch).
    expect(generationTime({ SOURCE_DATE_EPOCH: "0" })).toBe("1970-01-01 00:00 UTC");
    expect(generationTime({}, () => new Date(Date.UTC(2031, 1, 3, 4, 5, 6)))).toBe("2031-02-03 04:05 UTC");
    expect(() => generationTime({ SOURCE_DATE_EPOCH: "yesterday" })).toThrow(/SOURCE_DATE_EPOCH/);
  });

  it("gives byte-identical output for the same results and SOURCE_DATE_EPOCH", async () => {
    expect(await renderReport(results)).toBe(html);
  });

  it("puts the caution panel with its four points right after the title block", () => {
    const order = els.filter((e) => e.name === "header" || e.name === "aside" || e.name === "section");
    expect(order[0]!.name).toBe("header");
    expect(order[1]!.name).toBe("aside");
    const t = text(order[1]!);
    expect(t).toMatch(/planning estimates, not maintenance data/i);
    expect(t).toMatch(/approved maintenance data and the manufacturer's instructions/i);
    expect(t).toMatch(/local rules/i);
    expect(t).toMatch(/high-pressure gas/i);
  });

  it("has headings in order, without skipped levels, in the required section order", () => {
    const hs = els.filter((e) => /^h[1-6]$/.test(e.name));
    expect(hs[0]!.name).toBe("h1");
    let level = 1;
    for (const h of hs) {
      const l = Number(h.name[1]);
      expect(l - level, `heading "${text(h)}" jumps from h${level} to h${l}`).toBeLessThanOrEqual(1);
      level = l;
    }
    const h2 = hs.filter((h) => h.name === "h2").map(text);
    expect(h2).toEqual([
      "Caution: read before use",
      "Contents",
      "Fleet summary",
      ...results.bases.map((b) => `Base ${b.name}`),
      "Methods",
      "Assumptions",
      "Data coverage",
      "Exported tables",
    ]);
  });

  it("shows the fleet summary as bases × months with a status word and mark in every cell", () => {
    const fleet = els.find((e) => e.attrs["id"] === "fleet")!;
    const inside = elements(inner(tokens, fleet));
    const grid = inside.find((e) => e.name === "table" && e.attrs["class"] === "grid")!;
    const rows = elements(inner(tokens, grid)).filter((e) => e.name === "tr");
    expect(rows).toHaveLength(1 + results.bases.length);
    for (const row of rows.slice(1)) {
      const cells = elements(inner(tokens, row)).filter((e) => e.name === "td");
      expect(cells).toHaveLength(12);
      for (const c of cells) {
        expect(text(c)).toMatch(/^(Act|Watch|OK|No stay)$/);
        expect(elements(inner(tokens, c)).some((e) => e.name === "svg" && e.attrs["class"] === "mark")).toBe(
          true,
        );
      }
    }
    // Fixture: July has no preflights, so it reads "No stay"; January is cold enough to need the option.
    expect(text(rows[1]!)).toContain("No stay");
    expect(text(fleet)).toMatch(/Fit the cold-start option/);
  });

  it("quotes out-of-band readings in a cold-start action, without 'up to 0.0 %'", () => {
    const actions = els.find((e) => e.name === "table" && e.attrs["class"]?.includes("actions"))!;
    const rows = elements(inner(tokens, actions))
      .filter((e) => e.name === "tr")
      .slice(1)
      .map(text);
    // Fixture, base 1: January needs the option and also reads below band (belowBandPct > 0).
    const act = rows.find(
      (r) => r.startsWith(results.bases[0]!.name) && r.includes("Fit the cold-start option"),
    );
    expect(act).toBeDefined();
    expect(act).toMatch(/Also expect out-of-band fill readings/);
    for (const r of rows) expect(r).not.toMatch(/up to 0\.0 %/);
  });

  it("names the air around the aircraft in the overnight traces: hangar air where the plan has a hangar", () => {
    // Fixture: Southgate (base 2) has a hangar heated to 5 °C = 41.0 °F, 20:00–06:00 from November to
    // February; Northfield (base 1) has none.
    const captions = (i: number) => {
      const sec = els.find((e) => e.name === "section" && e.attrs["id"] === `base-${i}`)!;
      const over = elements(inner(tokens, sec)).find((e) => e.attrs["data-section"] === "overnight")!;
      return elements(inner(tokens, over))
        .filter((e) => e.name === "figcaption")
        .map(text);
    };
    const north = captions(1);
    const south = captions(2);
    expect(north).toHaveLength(2);
    expect(south).toHaveLength(2);
    for (const c of north) expect(c).toContain("temperature of the outside air");
    for (const c of south)
      expect(c).toContain(
        "heated hangar air, the outside air or 41.0 °F where colder, from 20:00 to 06:00 in Nov, Dec, Jan, Feb; outside air otherwise",
      );
    expect(html).not.toContain("evening recharge");
  });

  it("has every section, in order, for every base", () => {
    for (const [i, b] of results.bases.entries()) {
      const sec = els.find((e) => e.name === "section" && e.attrs["id"] === `base-${i + 1}`)!;
      expect(sec, b.name).toBeDefined();
      const subs = elements(inner(tokens, sec))
        .filter((e) => e.attrs["data-section"])
        .map((e) => e.attrs["data-section"]);
      expect(subs).toEqual(SECTIONS);
      const t = text(sec);
      expect(t).toContain("One accumulator and two in parallel read alike");
      expect(t).toContain("Typical overnight swing");
      expect(t).toContain("Worst overnight swing");
    }
  });

  it("renders every chart as a well-formed SVG with a <title> repeated in its caption and titled axes", () => {
    const figures = els.filter((e) => e.name === "figure");
    // Per base: climate 2, per profile 2 (base 1 flies "main"; base 2 flies "spare"), traces 2, risk 1, hours 1.
    expect(figures).toHaveLength(results.bases.length * 8);
    for (const fig of figures) {
      const content = inner(tokens, fig);
      const svgs = elements(content).filter((e) => e.name === "svg");
      expect(svgs).toHaveLength(1);
      const svgTokens = inner(tokens, svgs[0]!);
      expect(nestingProblem(svgTokens)).toBeNull();
      const first = svgTokens.find((t) => t.kind === "start");
      expect(first?.kind === "start" && first.el.name).toBe("title");
      const title = first?.kind === "start" ? text(first.el) : "";
      expect(title.length).toBeGreaterThan(5);
      expect(svgs[0]!.attrs["aria-labelledby"]).toBe(first?.kind === "start" ? first.el.attrs["id"] : "");
      const caption = text(elements(content).find((e) => e.name === "figcaption")!);
      expect(caption).toContain(title);
      const axisGroups = elements(svgTokens).filter((e) => e.attrs["class"]?.includes("role-axis-title"));
      expect(axisGroups.length, title).toBeGreaterThanOrEqual(2);
      for (const g of axisGroups) expect(text(g).length).toBeGreaterThan(0);
      expect(Number(svgs[0]!.attrs["width"])).toBeGreaterThan(0);
      expect(Number(svgs[0]!.attrs["height"])).toBeGreaterThan(0);
    }
  });

  it("keeps element ids unique across all the inline charts", () => {
    const ids = els.map((e) => e.attrs["id"]).filter((x): x is string => x !== undefined);
    expect(new Set(ids).size).toBe(ids.length);
    for (const m of html.matchAll(/url\(#([^)]+)\)/g)) expect(ids).toContain(m[1]);
  });

  it("marks every table header cell with a scope", () => {
    const ths = els.filter((e) => e.name === "th");
    expect(ths.length).toBeGreaterThan(50);
    for (const th of ths) expect(["col", "row"]).toContain(th.attrs["scope"]);
  });

  it("lists every assumption with its value as written (a default in the plan's units) and its origin", () => {
    const sec = els.find((e) => e.attrs["id"] === "assumptions")!;
    const rows = elements(inner(tokens, sec))
      .filter((e) => e.name === "tr")
      .slice(1);
    expect(rows).toHaveLength(results.assumptions.length);
    for (const [k, a] of results.assumptions.entries()) {
      const cells = elements(inner(tokens, rows[k]!)).filter((e) => e.name === "th" || e.name === "td");
      const shown =
        a.text ?? { "profiles.main.thermalTimeConstant": "2 h", "thresholds.shortStartsPct": "5 %" }[a.key];
      expect(cells.map(text)).toEqual([a.key, a.label, shown, a.origin]);
    }
  });

  it("lists methods with sources, the quantile method, random inputs, and QC counts per station", () => {
    const methods = text(els.find((e) => e.attrs["id"] === "methods")!);
    for (const m of results.methods) {
      expect(methods).toContain(m.name);
      expect(methods).toContain(m.source);
    }
    expect(methods).toContain(results.quantileMethod);
    expect(methods).toContain(results.randomInputs[0]!.name);
    expect(methods).toContain("NIST SP 811");
    const coverage = els.find((e) => e.attrs["id"] === "coverage")!;
    const qcTables = elements(inner(tokens, coverage)).filter(
      (e) => e.name === "table" && text(e).includes("Quality control"),
    );
    expect(qcTables).toHaveLength(results.bases.length);
    for (const [i, b] of results.bases.entries()) {
      const rows = elements(inner(tokens, qcTables[i]!))
        .filter((e) => e.name === "tr")
        .slice(1);
      expect(rows).toHaveLength(b.stations.length);
      const cells = elements(inner(tokens, rows[0]!))
        .filter((e) => e.name === "th" || e.name === "td")
        .map(text);
      const q = b.stations[0]!.qc;
      const expected = [q.read, q.kept, ...Object.values(q.dropped)].map((v) => v.toLocaleString("en-US"));
      expect(cells).toEqual([b.stations[0]!.id, ...expected]);
    }
    expect(text(coverage)).toContain(results.warnings[0]!);
  });

  it("links the results file beside the report, or the listed files when given, and never a URL", async () => {
    const links = els.filter((e) => e.name === "a" && !e.attrs["href"]!.startsWith("#"));
    expect(links.map((a) => a.attrs["href"])).toEqual(["results.json"]);
    const withFiles = { ...results, files: ["results.json", "months.csv", "javascript:alert(1)"] };
    const other = elements(tokenize(await renderReport(withFiles as Results)));
    const hrefs = other
      .filter((e) => e.name === "a" && !e.attrs["href"]!.startsWith("#"))
      .map((a) => a.attrs["href"]);
    expect(hrefs).toEqual(["results.json", "months.csv"]);
  });

  it("never places data with triple braces in the templates", () => {
    const dir = new URL("../../templates/", import.meta.url);
    const files = ["report.hbs", ...readdirSync(new URL("partials/", dir)).map((f) => `partials/${f}`)];
    for (const f of files) expect(readFileSync(new URL(f, dir), "utf8"), f).not.toContain("{{{");
  });
});
