import { readdirSync, readFileSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import type { Results } from "../../src/plan/results.js";
import { generationTime, renderReport } from "../../src/report/index.js";
import { makeResults } from "../fixtures/report/results.js";
import { type Element, elements, inner, nestingProblem, type Token, textOf, tokenize } from "./html.js";

// Structure only: the fixture's numbers are made up, so nothing here asserts a physics value.

const SECTIONS = [
  "climate",
  "precharge",
  "design-point",
  "overnight",
  "risk",
  "hours",
  "advice",
  "what-if",
  "nitrogen",
];

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
      "Fleet summary",
      "Nitrogen to ship",
      "Contents",
      "Aircraft actions",
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
        expect(text(c)).toMatch(/^(Act|Watch|OK|No stay|No data)( |$)/);
        expect(
          elements(inner(tokens, c)).some((e) => e.name === "svg" && e.attrs["class"]?.startsWith("mark")),
        ).toBe(true);
      }
    }
    // Fixture statuses (tests/fixtures/report/results.ts): July "no-stay", August "no-data", February
    // "part no data", October of low confidence on 3 years with an outlined mark.
    const cells = elements(inner(tokens, rows[1]!)).filter((e) => e.name === "td");
    expect(text(cells[6]!)).toBe("No stay");
    expect(text(cells[7]!)).toBe("No data");
    expect(text(cells[1]!)).toContain("part no data");
    expect(text(cells[9]!)).toContain("(3 yrs)");
    expect(elements(inner(tokens, cells[9]!)).some((e) => e.attrs["class"] === "mark mark-low")).toBe(true);
    // An "act" cell carries the share that set it with its interval.
    expect(text(cells[0]!)).toMatch(/^Act \d+\.\d % \(\d+\.\d–\d+\.\d\)$/);
  });

  it("rolls the nitrogen up near the top: a row per base and the fleet, labelled sums, causes, stock, cautions", () => {
    // Structure only: the fixture's nitrogen numbers are made up.
    const all = els.filter((e) => e.name === "section");
    const i = all.findIndex((e) => e.attrs["id"] === "fleet");
    expect(all[i + 1]!.attrs["id"]).toBe("nitrogen-fleet");
    const part = all[i + 1]!;
    const inside = elements(inner(tokens, part));
    const tables = inside.filter((e) => e.name === "table");
    const rowHeads = (t: Element) =>
      elements(inner(tokens, t))
        .filter((e) => e.name === "th" && e.attrs["scope"] === "row")
        .map(text);
    const names = results.bases.map((b) => b.name);
    expect(rowHeads(tables[0]!)).toEqual([...names, "Fleet total"]);
    expect(rowHeads(tables[1]!)).toEqual([...names, "Fleet total"]);
    expect(rowHeads(tables[2]!)).toEqual(names);
    const t = text(part);
    expect(t).toMatch(/not the sum of the bases' quantiles/);
    expect(t).toMatch(/sum of each base's own count/);
    expect(t).toMatch(
      /Added by servicing.*Added by unscheduled full recharges.*Vented from hoses.*Given to other uses.*Drawn from cylinders.*Released from accumulators/,
    );
    expect(t).toMatch(/runs out at P90 on 2027-02-20/);
    expect(t).toMatch(/Not included:/);
    expect(t).toMatch(/Asphyxiation/);
    expect(t).toMatch(/UN 1066/);
  });

  it("gives each base's nitrogen the flows in one vocabulary, the usable gas, a timeline and the stock status", () => {
    const sec = els.find((e) => e.name === "section" && e.attrs["id"] === "base-1")!;
    const n2 = elements(inner(tokens, sec)).find((e) => e.attrs["data-section"] === "nitrogen")!;
    const t = text(n2);
    expect(t).toMatch(
      /= Added by servicing.*\+ Added by unscheduled full recharges.*\+ Vented from hoses at disconnect.*\+ Given to other uses.*apart: Released from accumulators/,
    );
    expect(t).toMatch(/fill temperature.*mean site temperature.*coldest site temperature/);
    expect(t).toMatch(/runs out at P90 on 2027-02-20/);
    expect(t).toMatch(/UN 1066/);
    expect(elements(inner(tokens, n2)).filter((e) => e.name === "figure")).toHaveLength(1);
  });

  it("puts the three users' lines on the first screen, each linked to its section", () => {
    const fleet = els.find((e) => e.attrs["id"] === "fleet")!;
    const ids = new Set(els.map((e) => e.attrs["id"]));
    const blocks = elements(inner(tokens, fleet)).filter((e) => e.attrs["class"] === "glance-block");
    expect(blocks.map((b) => text(elements(inner(tokens, b)).find((e) => e.name === "h3")!))).toEqual([
      "Engineer: cold-start option by aircraft",
      "Planner: out-of-band first preflights",
      "Logistics: nitrogen to ship",
    ]);
    for (const b of blocks) {
      const links = elements(inner(tokens, b)).filter((e) => e.name === "a");
      expect(links.length).toBeGreaterThan(0);
      for (const a of links) expect(ids.has(a.attrs["href"]!.slice(1)), a.attrs["href"]).toBe(true);
    }
    // Fixture actions: XQ-101 without the option needs it, XQ-202 has it without needing it.
    expect(text(blocks[0]!)).toContain("Fit the cold-start option: XQ-101 at Northfield before 2027-01-05");
    expect(text(blocks[0]!)).toContain("Fitted, not needed by this estimate: XQ-202");
  });

  it("lists one aircraft action per stay, with the caution that it is a planning estimate", () => {
    const sec = els.find((e) => e.attrs["id"] === "actions")!;
    expect(text(sec)).toContain("A planning estimate, not an instruction");
    expect(text(sec)).toContain("fitting or removing equipment follows the approved data");
    const table = elements(inner(tokens, sec)).find((e) => e.name === "table")!;
    const rows = elements(inner(tokens, table))
      .filter((e) => e.name === "tr")
      .slice(1)
      .map(text);
    expect(rows).toHaveLength(results.actions.length);
    expect(rows[0]).toContain("Fit the option");
    expect(rows[1]).toContain("Fitted, not needed by this estimate");
    expect(rows[2]).toContain("No data");
    expect(rows[2]).toContain("lacks Jan, Feb");
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
      // The precharge curves are charts captioned as model estimates, never a printable table.
      expect(t).toContain("Model estimate — not servicing data.");
      const precharge = elements(inner(tokens, sec)).find((e) => e.attrs["data-section"] === "precharge")!;
      expect(elements(inner(tokens, precharge)).filter((e) => e.name === "table")).toEqual([]);
      expect(t).toContain("Typical overnight swing");
      expect(t).toContain("Worst overnight swing");
    }
  });

  it("renders every chart as a well-formed SVG with a <title> repeated in its caption and titled axes", () => {
    const figures = els.filter((e) => e.name === "figure");
    // Per base: climate 2, per profile 2 (base 1 flies "main"; base 2 flies "spare"), design point 1, traces 2,
    // risk 1, hours 1, what-if 1, nitrogen timeline 1.
    expect(figures).toHaveLength(results.bases.length * 11);
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

  it("shows the design point worksheet and break-even table, the design temperatures and the what-if table", () => {
    // Structure of the engineer's parts (README, report): the fixture's numbers are made up.
    const sec = els.find((e) => e.name === "section" && e.attrs["id"] === "base-2")!;
    const part = (name: string) =>
      elements(inner(tokens, sec)).find((e) => e.attrs["data-section"] === name)!;
    const design = text(part("design-point"));
    expect(design).toContain("Cold design point (1-in-10-year coldest morning)");
    expect(design).toContain("none: never short");
    expect(design).toContain("Model estimate — not servicing data.");
    const rows = elements(inner(tokens, part("design-point"))).filter((e) => e.name === "tr");
    // Worksheet lines, then the header and the twelve cases of the break-even table.
    expect(rows.length).toBeGreaterThan(13);
    const climate = text(part("climate"));
    expect(climate).toContain("Annual 99.6 % cold dry-bulb");
    expect(climate).toContain("Coldest morning: 1-in-10-year");
    const whatIf = text(part("what-if"));
    expect(whatIf).toContain("What if: Jan");
    expect(whatIf).toContain("As planned");
  });

  it("leaves the what-if section out when no variant was run", async () => {
    const plain = { ...results, whatIf: null, bases: results.bases.map((b) => ({ ...b, whatIf: null })) };
    const t = await renderReport(plain);
    expect(t).not.toContain('data-section="what-if"');
    expect(t).toContain('data-section="design-point"');
  });

  it("never places data with triple braces in the templates", () => {
    const dir = new URL("../../templates/", import.meta.url);
    const files = ["report.hbs", ...readdirSync(new URL("partials/", dir)).map((f) => `partials/${f}`)];
    for (const f of files) expect(readFileSync(new URL(f, dir), "utf8"), f).not.toContain("{{{");
  });
});
