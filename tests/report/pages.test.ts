import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { runPlanCommand } from "../../src/cli/planRun.js";
import type { Results } from "../../src/plan/results.js";
import { renderReport } from "../../src/report/index.js";
import { writeReport } from "../../src/report/pages.js";
import {
  basePagePath,
  MAX_BASES_IN_ONE_FILE,
  MAX_LINE_ITEMS,
  MAX_LIST_ROWS,
} from "../../src/report/split.js";
import { planText, useClimateRoot } from "../cli/planCase.js";
import { type Element, elements, inner, nestingProblem, textOf, tokenize } from "./html.js";

// A split report built from the results of a small generated plan (one base on the synthetic climate
// of tests/cli/planCase.ts), its base copied under other names, hostile ones among them. Structure and
// links only: no figure is asserted.

const { writeCase } = useClimateRoot();

const HOSTILE = ["<script>alert(1)</script>", "../x", `"Quote" & 'apos'`];
/** More names than one file holds; distinct, none a part of another. */
const NAMES = [
  ...HOSTILE,
  ...Array.from({ length: MAX_BASES_IN_ONE_FILE - 1 }, (_, k) => `Field ${String.fromCharCode(65 + k)}q`),
];

let one: Results;
let many: Results;
let files: Map<string, string>;
let written: string[];

/** The one base of `results` copied under each name, with its stays and actions (aircraft renamed). */
function copiesOf(results: Results, names: string[]): Results {
  const src = results.bases[0]!;
  const tag = (aircraft: string, k: number) => `${aircraft}~${k + 1}~`;
  return {
    ...results,
    bases: names.map((name) => ({ ...structuredClone(src), name })),
    stays: names.flatMap((name, k) =>
      results.stays.map((s) => ({ ...s, base: name, aircraft: tag(s.aircraft, k) })),
    ),
    actions: names.flatMap((name, k) =>
      results.actions.map((a) => ({ ...a, base: name, aircraft: tag(a.aircraft, k) })),
    ),
  };
}

beforeAll(async () => {
  process.env.SOURCE_DATE_EPOCH = "1700000000";
  const c = await writeCase(planText());
  ({ results: one } = await runPlanCommand(c.plan, { out: c.out, cache: false }));
  many = copiesOf({ ...one, files: ["results.json", "aircraft_actions.csv", "assumptions.csv"] }, NAMES);
  files = new Map();
  written = await writeReport(many, async (name, text) => {
    files.set(name, text);
  });
}, 300_000);
afterAll(() => {
  delete process.env.SOURCE_DATE_EPOCH;
});

function parse(html: string): {
  els: Element[];
  text: (e: Element) => string;
  tokens: ReturnType<typeof tokenize>;
} {
  const tokens = tokenize(html);
  const els = elements(tokens);
  return { els, tokens, text: (e) => textOf(inner(tokens, e)).replace(/\s+/g, " ").trim() };
}

function hrefs(html: string): string[] {
  return parse(html)
    .els.filter((e) => e.name === "a")
    .map((e) => e.attrs["href"]!);
}

/** The ids of a page's elements. */
function ids(html: string): Set<string> {
  return new Set(
    parse(html)
      .els.map((e) => e.attrs["id"])
      .filter((id): id is string => id !== undefined),
  );
}

describe("report of many bases", () => {
  it("writes the overview, then one page per base named by its position", () => {
    expect(written).toEqual(["report.html", ...NAMES.map((_n, i) => basePagePath(i))]);
    expect([...files.keys()]).toEqual(written);
  });

  it("writes every page as one balanced, self-contained HTML document", () => {
    for (const [name, html] of files) {
      const tokens = tokenize(html);
      expect(nestingProblem(tokens), name).toBeNull();
      const els = elements(tokens);
      expect(
        els.filter((e) => e.name === "style"),
        name,
      ).toHaveLength(1);
      expect(
        els.filter((e) => ["script", "link", "img", "iframe", "object", "embed"].includes(e.name)),
      ).toEqual([]);
    }
  });

  it("links every base from the overview to a page that exists, and every link resolves", () => {
    const overview = files.get("report.html")!;
    const links = hrefs(overview);
    for (const [i] of NAMES.entries()) expect(links).toContain(basePagePath(i));
    const overviewIds = ids(overview);
    for (const href of links) {
      const [file, fragment] = href.split("#") as [string, string | undefined];
      if (file === "") {
        expect(overviewIds.has(fragment!), href).toBe(true);
        continue;
      }
      if (file.endsWith(".csv") || file === "results.json") continue; // written by the CLI beside it
      expect(file, href).toMatch(/^bases\/\d{3}\.html$/);
      expect(files.has(file), href).toBe(true);
      if (fragment !== undefined) expect(ids(files.get(file)!).has(fragment), href).toBe(true);
    }
  });

  it("links every base page back to the overview, its neighbours and the CSV of all actions", () => {
    for (const [i] of NAMES.entries()) {
      const page = files.get(basePagePath(i))!;
      const links = hrefs(page);
      expect(links).toContain("../report.html");
      for (const href of links) {
        const [file] = href.split("#") as [string];
        if (file === "" || file === "../report.html" || file === "../aircraft_actions.csv") continue;
        // previous / next page, beside this one
        expect(file).toMatch(/^\d{3}\.html$/);
        expect(files.has(`bases/${file}`), href).toBe(true);
      }
    }
  });

  it("puts a base's sections, and nothing of another base, on its page", () => {
    for (const [i, name] of NAMES.entries()) {
      const page = parse(files.get(basePagePath(i))!);
      const sections = page.els.filter((e) => e.name === "section" && e.attrs["class"] === "base");
      expect(sections).toHaveLength(1);
      expect(page.text(sections[0]!)).toContain(`Base ${name}`);
      expect(page.els.some((e) => e.attrs["data-section"] === "risk")).toBe(true);
      expect(page.els.some((e) => e.attrs["data-section"] === "nitrogen")).toBe(true);
      const text = page.text(page.els.find((e) => e.name === "body")!);
      for (const [j, other] of NAMES.entries()) {
        if (j === i) continue;
        expect(text, `${name} page`).not.toContain(other);
        expect(text).not.toContain(`~${j + 1}~`); // another copy's aircraft
      }
      expect(text).toContain(`~${i + 1}~`); // its own aircraft's actions
    }
  });

  it("keeps the caution block on every page", () => {
    const caution = (html: string) => {
      const p = parse(html);
      return p.text(p.els.find((e) => e.name === "aside" && e.attrs["class"] === "caution")!);
    };
    const expected = caution(files.get("report.html")!);
    expect(expected).toContain("Planning estimates, not maintenance data");
    for (const [i] of NAMES.entries()) expect(caution(files.get(basePagePath(i))!)).toBe(expected);
  });

  it("holds no base section in the overview, but the status grid and the index with each base's headline status", () => {
    const html = files.get("report.html")!;
    const overview = parse(html);
    expect(overview.els.filter((e) => e.name === "section" && e.attrs["class"] === "base")).toEqual([]);
    const grid = overview.els.find((e) => e.name === "table" && e.attrs["class"] === "grid")!;
    expect(elements(inner(overview.tokens, grid)).filter((e) => e.name === "tr")).toHaveLength(
      NAMES.length + 1,
    );
    const index = overview.els.find((e) => e.name === "table" && e.attrs["class"] === "base-index")!;
    const inIndex = elements(inner(overview.tokens, index));
    // One row per base, in plan order, each linking to its page.
    const links = inIndex.filter((e) => e.name === "a" && !/^\d/.test(overview.text(e)));
    expect(links.map((e) => overview.text(e))).toEqual(NAMES);
    expect(links.map((e) => e.attrs["href"])).toEqual(NAMES.map((_n, i) => basePagePath(i)));
    // The headline status is the base's most pressing month status, as results.json decides it.
    const statuses = new Set<string>(one.bases[0]!.months.map((m) => m.status));
    const headline = ["act", "watch", "no-data", "ok", "no-stay"].find((s) => statuses.has(s))!;
    const cells = inIndex.filter((e) => e.name === "td" && e.attrs["class"]?.startsWith("st "));
    expect(cells.map((e) => e.attrs["class"])).toEqual(NAMES.map(() => `st st-${headline}`));
  });

  it("escapes hostile base names in text, titles and links: no element or path comes from a name", () => {
    for (const [name, html] of files) {
      expect(html, name).not.toMatch(/<script/i);
      for (const e of parse(html).els)
        for (const [k, v] of Object.entries(e.attrs)) {
          expect(k.startsWith("on"), `${name}: ${k}`).toBe(false);
          if (k === "href") expect(v, name).not.toMatch(/\.\.\/x|script|Quote/);
        }
    }
    for (const [i, name] of NAMES.entries()) {
      const page = parse(files.get(basePagePath(i))!);
      expect(page.text(page.els.find((e) => e.name === "title")!)).toContain(name);
      expect(page.text(page.els.find((e) => e.name === "h1")!)).toContain(name);
    }
    expect(files.get(basePagePath(0))).toContain("&lt;script&gt;alert(1)&lt;/script&gt;");
  });

  it("is the same single file as before at or under the limit", async () => {
    const single = new Map<string, string>();
    const names = await writeReport(one, async (n, t) => {
      single.set(n, t);
    });
    expect(names).toEqual(["report.html"]);
    expect(single.get("report.html")).toBe(await renderReport(one));
    expect(single.get("report.html")).not.toContain("bases/");
  });

  it("shows the first rows of a long list of actions and points to the CSV for the rest", async () => {
    const rows = MAX_LIST_ROWS + 7;
    const copies = Math.ceil(rows / one.actions.length);
    const long = copiesOf(one, [one.bases[0]!.name]);
    // Every stay to be fitted, so that the engineer's line names more stays than it shows.
    long.actions = Array.from({ length: copies }, (_, k) =>
      one.actions.map((a) => ({ ...a, action: "fit" as const, aircraft: `${a.aircraft}~${k + 1}~` })),
    ).flat();
    long.stays = Array.from({ length: copies }, () => one.stays).flat();
    const html = await renderReport(long);
    const p = parse(html);
    const table = p.els.find((e) => e.name === "table" && e.attrs["class"] === "num actions")!;
    const body = tokenize(html).slice(table.index);
    const shown = elements(body).filter(
      (e) => e.name === "tr" && e.attrs["class"]?.startsWith("act-"),
    ).length;
    expect(shown).toBe(MAX_LIST_ROWS);
    expect(p.text(p.els.find((e) => e.attrs["class"] === "note more")!)).toContain(
      `${long.actions.length - MAX_LIST_ROWS} more rows in aircraft_actions.csv`,
    );
    const engineer = p.els.find((e) => e.name === "h3" && p.text(e).startsWith("Engineer"))!;
    const line = p.text(elements(tokenize(html).slice(engineer.index)).find((e) => e.name === "li")!);
    expect(line).toContain(
      `; and ${long.actions.length - MAX_LINE_ITEMS} more, all in aircraft_actions.csv.`,
    );
    expect(line.split("; ")).toHaveLength(MAX_LINE_ITEMS + 1);
  });
});
