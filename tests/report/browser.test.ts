import { mkdirSync, readFileSync, statSync, writeFileSync } from "node:fs";
import { fileURLToPath, pathToFileURL } from "node:url";
import type { Page } from "puppeteer-core";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { main } from "../../src/cli/main.js";
import {
  chromiumAvailable,
  chromiumPath,
  type LaunchedBrowser,
  launchChromium,
} from "../../src/report/browser.js";
import { renderReport } from "../../src/report/index.js";
import { PDF_FOOTER_CAUTION, PDF_FOOTER_TEMPLATE, writePdf } from "../../src/report/pdf.js";
import { renderScreenPage } from "../../src/report/screenPage.js";
import { makeResults } from "../fixtures/report/results.js";
import { makeScreenResults } from "../fixtures/report/screenResults.js";
import { readPng } from "./png.js";

// Opens the report in the system Chromium (headless, no network). Where no browser exists this
// skips, saying why; in CI (env CI set) it runs regardless, so a missing browser fails the suite.
const HAVE_BROWSER = chromiumAvailable();
const IN_CI = Boolean(process.env["CI"]);
const SKIP = !HAVE_BROWSER && !IN_CI;
if (SKIP)
  console.warn(`report browser tests skipped: no Chromium at ${chromiumPath()} (set COLDSOAK_CHROMIUM)`);

const OUT = fileURLToPath(new URL("../../out/report/", import.meta.url));

interface Visit {
  page: Page;
  consoleErrors: string[];
  blocked: string[];
  dialogs: string[];
}

/** Width and height, px, of every chart's drawing on the page. */
async function chartSizes(page: Page): Promise<[number, number][]> {
  return (await page.evaluate(
    `[...document.querySelectorAll("figure.chart svg")].map((e) => { const r = e.getBoundingClientRect(); return [r.width, r.height]; })`,
  )) as [number, number][];
}

/** Opens a file with every request but the file itself blocked and recorded. */
async function visit(launched: LaunchedBrowser, file: string): Promise<Visit> {
  const page = await launched.browser.newPage();
  const url = pathToFileURL(file).href;
  const v: Visit = { page, consoleErrors: [], blocked: [], dialogs: [] };
  page.on("console", (msg) => {
    if (msg.type() === "error") v.consoleErrors.push(msg.text());
  });
  page.on("pageerror", (err) => v.consoleErrors.push(String(err)));
  page.on("dialog", (d) => {
    v.dialogs.push(d.message());
    void d.dismiss();
  });
  await page.setRequestInterception(true);
  page.on("request", (req) => {
    if (req.url() === url) void req.continue();
    else {
      v.blocked.push(req.url());
      void req.abort();
    }
  });
  await page.setViewport({ width: 1100, height: 900 });
  await page.goto(url, { waitUntil: "load" });
  return v;
}

describe.skipIf(SKIP)("report in a real browser", () => {
  let launched: LaunchedBrowser;
  let htmlUs: string;
  let htmlHostile: string;

  beforeAll(async () => {
    expect(HAVE_BROWSER, `CI needs Chromium at ${chromiumPath()}`).toBe(true);
    vi.stubEnv("SOURCE_DATE_EPOCH", "1700000000");
    mkdirSync(OUT, { recursive: true });
    htmlUs = `${OUT}report-us.html`;
    htmlHostile = `${OUT}report-hostile.html`;
    writeFileSync(htmlUs, await renderReport(makeResults({ units: "us" })));
    writeFileSync(htmlHostile, await renderReport(makeResults({ units: "si", hostile: true })));
    launched = await launchChromium();
  });
  afterAll(async () => {
    vi.unstubAllEnvs();
    await launched?.close();
  });

  it("opens without console errors or network requests, draws every chart, and saves a screenshot", async () => {
    const v = await visit(launched, htmlUs);
    expect(v.consoleErrors).toEqual([]);
    expect(v.blocked).toEqual([]);
    const sizes = await chartSizes(v.page);
    expect(sizes.length).toBe(22); // 11 charts per base in the fixture (see structure test)
    for (const [w, h] of sizes) {
      expect(w).toBeGreaterThan(100);
      expect(h).toBeGreaterThan(50);
    }
    await v.page.screenshot({ path: `${OUT}report-us.png`, fullPage: true });
    expect(statSync(`${OUT}report-us.png`).size).toBeGreaterThan(50_000);
    // In print layout every chart still has a size (no chart collapses on paper).
    await v.page.emulateMediaType("print");
    const printSizes = (await v.page.evaluate(
      `[...document.querySelectorAll("figure.chart svg")].map((e) => e.getBoundingClientRect().width)`,
    )) as number[];
    for (const w of printSizes) expect(w).toBeGreaterThan(100);
    await v.page.close();
  });

  it("draws each status mark in its own shape, still distinct in greyscale, and gives every status its word", async () => {
    // Use of colour (WCAG 2.1, success criterion 1.4.1): a status must not rest on colour alone. Every
    // distinct mark of the report (five statuses, and the outlined marks of low confidence) is drawn
    // 80 px wide in greyscale; each pair must differ in at least 5 % of its pixels' ink (threshold
    // and share: common practice, no source).
    const html = readFileSync(htmlUs, "utf8");
    const marks = [...new Set(html.match(/<svg class="mark[^"]*"[^>]*>.*?<\/svg>/g) ?? [])];
    const classes = marks.map((m) => /<path d="[^"]+" ([^/]+)\/>/.exec(m)![1]!);
    expect(marks.length).toBeGreaterThanOrEqual(7); // 5 statuses + outlined "act" (legend) + outlined "ok" (fixture October)
    expect(new Set(classes).size).toBe(marks.length);
    const page = await launched.browser.newPage();
    await page.setContent(
      `<!doctype html><html style="filter: grayscale(1)"><body style="margin:0;background:#fff">${marks
        .map(
          (m, i) =>
            `<div id="m${i}" style="width:80px;height:80px;display:inline-block;margin:4px">${m.replace('class="mark', 'style="width:80px;height:80px" class="mark')}</div>`,
        )
        .join("")}</body></html>`,
    );
    const inked: boolean[][] = [];
    for (let i = 0; i < marks.length; i++) {
      const shot = (await (await page.$(`#m${i}`))!.screenshot({ type: "png" })) as Uint8Array;
      const px = readPng(shot);
      inked.push(Array.from(px.luma, (l) => l < 230));
    }
    for (let a = 0; a < inked.length; a++) {
      for (let b = a + 1; b < inked.length; b++) {
        const differ = inked[a]!.filter((v, k) => v !== inked[b]![k]).length / inked[a]!.length;
        expect(differ, `${classes[a]} vs ${classes[b]}`).toBeGreaterThanOrEqual(0.05);
      }
    }
    await page.close();
    // Every status cell of the report shows its word as text, and all five words appear.
    const v = await visit(launched, htmlUs);
    const words = (await v.page.evaluate(
      `[...document.querySelectorAll("td.st")].map((td) => td.querySelector(".st-label")?.innerText ?? "")`,
    )) as string[];
    expect(words.length).toBeGreaterThan(24);
    for (const w of words) expect(w.trim().length).toBeGreaterThan(0);
    expect(new Set(words)).toEqual(new Set(["Act", "Watch", "OK", "No stay", "No data"]));
    await v.page.close();
  });

  it("parses the hostile report into no script or img element and fires no dialog", async () => {
    const v = await visit(launched, htmlHostile);
    const counts = (await v.page.evaluate(
      `[document.querySelectorAll("script").length, document.querySelectorAll("img").length, [...document.querySelectorAll("*")].filter((e) => [...e.attributes].some((a) => a.name.startsWith("on"))).length]`,
    )) as number[];
    expect(counts).toEqual([0, 0, 0]);
    expect(v.dialogs).toEqual([]);
    expect(v.blocked).toEqual([]);
    expect(v.consoleErrors).toEqual([]);
    const heading = (await v.page.evaluate(`document.querySelector("#base-1 h2").textContent`)) as string;
    expect(heading).toBe('Base North <script>alert(1)</script> "><img src=x onerror=alert(1)>');
    await v.page.close();
  });

  it("prints a non-empty PDF on A4, and on Letter through the pdf command", async () => {
    const a4 = `${OUT}report-us.pdf`;
    const r = await writePdf(htmlUs, a4);
    expect(r.ok, r.message).toBe(true);
    const bytes = readFileSync(a4);
    expect(bytes.subarray(0, 5).toString("latin1")).toBe("%PDF-");
    expect(bytes.length).toBeGreaterThan(20_000);
    const letter = `${OUT}report-us-letter.pdf`;
    const write = vi.spyOn(process.stdout, "write").mockImplementation(() => true);
    try {
      expect(await main(["pdf", htmlUs, "--out", letter, "--paper", "letter"])).toBe(0);
    } finally {
      write.mockRestore();
    }
    const lb = readFileSync(letter);
    expect(lb.subarray(0, 5).toString("latin1")).toBe("%PDF-");
    // Page boxes in PDF points: A4 is 595 × 842 pt and Letter 612 × 792 pt (ISO 216; ANSI/ASME Y14.1).
    const box = (b: Buffer) =>
      /\/MediaBox\s*\[\s*0\s+0\s+([\d.]+)\s+([\d.]+)\s*\]/.exec(b.toString("latin1"));
    const a4Box = box(bytes);
    const lBox = box(lb);
    // Chromium writes the page boxes uncompressed; a missing box is a failure, not a skip.
    expect(a4Box, "A4 MediaBox").not.toBeNull();
    expect(lBox, "Letter MediaBox").not.toBeNull();
    // Chromium rounds the page to whole CSS pixels, so allow 1.5 pt.
    expect(Math.abs(Number(a4Box![1]) - 595.3)).toBeLessThanOrEqual(1.5);
    expect(Math.abs(Number(a4Box![2]) - 841.9)).toBeLessThanOrEqual(1.5);
    expect(Math.abs(Number(lBox![1]) - 612)).toBeLessThanOrEqual(1.5);
    expect(Math.abs(Number(lBox![2]) - 792)).toBeLessThanOrEqual(1.5);
  });
});

describe("PDF without a browser, and pdf command errors", () => {
  it.runIf(IN_CI)("finds Chromium in CI (the browser tests must run there)", () => {
    expect(HAVE_BROWSER, `no Chromium at ${chromiumPath()}`).toBe(true);
  });

  it("returns ok: false with one line when no Chromium exists, writing nothing", async () => {
    vi.stubEnv("COLDSOAK_CHROMIUM", "/nonexistent/chromium");
    try {
      const r = await writePdf("out/report/none.html", "out/report/none.pdf");
      expect(r.ok).toBe(false);
      expect(r.message).toMatch(/no Chromium at \/nonexistent\/chromium/);
      expect(r.message).not.toContain("\n");
    } finally {
      vi.unstubAllEnvs();
    }
  });

  it("exits 2 for a missing report, a folder, a file that is not HTML, or an unknown paper size", async () => {
    // Exit codes as the README documents them (2 for input or usage errors), each with its own message.
    mkdirSync(OUT, { recursive: true });
    const html = `${OUT}paper-check.html`;
    writeFileSync(html, "<!doctype html><title>t</title>");
    let err = "";
    const spy = vi.spyOn(process.stderr, "write").mockImplementation((s: string | Uint8Array) => {
      err += String(s);
      return true;
    });
    const run = async (args: string[]) => {
      err = "";
      return { code: await main(["pdf", ...args]), err };
    };
    try {
      const missing = await run(["out/report/does-not-exist.html"]);
      expect(missing).toMatchObject({ code: 2 });
      expect(missing.err).toMatch(/does-not-exist\.html: no such file/);
      const folder = await run([OUT]);
      expect(folder).toMatchObject({ code: 2 });
      expect(folder.err).toMatch(/is a folder/);
      const notHtml = await run([fileURLToPath(import.meta.url)]);
      expect(notHtml).toMatchObject({ code: 2 });
      expect(notHtml.err).toMatch(/not an HTML file/);
      const paper = await run([html, "--paper", "tabloid"]);
      expect(paper).toMatchObject({ code: 2 });
      expect(paper.err).toMatch(/--paper: expected a4 or letter, got "tabloid"/);
    } finally {
      spy.mockRestore();
    }
  });

  it("repeats the one-line caution in every PDF page footer, beside the page number", () => {
    // The report's caution (README, Limits and cautions): planning estimates, not maintenance data.
    expect(PDF_FOOTER_CAUTION).toMatch(/^Planning estimates, not maintenance data/);
    expect(PDF_FOOTER_TEMPLATE).toContain(PDF_FOOTER_CAUTION);
    expect(PDF_FOOTER_TEMPLATE).toContain('class="pageNumber"');
  });

  it("treats a folder or a plain file as no browser", () => {
    // chromiumAvailable needs an executable file: a folder (or a non-executable file) is not a browser.
    expect(chromiumAvailable({ COLDSOAK_CHROMIUM: fileURLToPath(new URL(".", import.meta.url)) })).toBe(
      false,
    );
    expect(chromiumAvailable({ COLDSOAK_CHROMIUM: fileURLToPath(import.meta.url) })).toBe(false);
  });
});

describe.skipIf(SKIP)("screen page in a real browser", () => {
  let launched: LaunchedBrowser;
  let page = "";
  let hostile = "";

  beforeAll(async () => {
    expect(HAVE_BROWSER, `CI needs Chromium at ${chromiumPath()}`).toBe(true);
    vi.stubEnv("SOURCE_DATE_EPOCH", "1700000000");
    mkdirSync(OUT, { recursive: true });
    page = `${OUT}screen.html`;
    hostile = `${OUT}screen-hostile.html`;
    writeFileSync(page, renderScreenPage(makeScreenResults({ units: "us" })));
    writeFileSync(hostile, renderScreenPage(makeScreenResults({ hostile: true })));
    launched = await launchChromium();
  });
  afterAll(async () => {
    vi.unstubAllEnvs();
    await launched?.close();
  });

  it("opens without console errors or network requests, sizes the map and saves a screenshot", async () => {
    const v = await visit(launched, page);
    expect(v.consoleErrors).toEqual([]);
    expect(v.blocked).toEqual([]);
    const sizes = await chartSizes(v.page);
    expect(sizes.length).toBe(1); // the map
    for (const [w, h] of sizes) {
      expect(w).toBeGreaterThan(300);
      expect(h).toBeGreaterThan(150);
    }
    // One point per station, and one row per station in the table (sorted by risk: the coldest first).
    expect(await v.page.evaluate(`document.querySelectorAll("figure.chart svg g.pt").length`)).toBe(5);
    const rows = (await v.page.evaluate(
      `[...document.querySelectorAll("table.screen tbody th")].map((th) => th.firstChild.textContent)`,
    )) as string[];
    expect(rows).toEqual(["NORTH RIDGE", "LAKE PLAIN", "RIVER FORK", "COAST POINT", "DRY HILL"]);
    await v.page.screenshot({ path: `${OUT}screen.png`, fullPage: true });
    expect(statSync(`${OUT}screen.png`).size).toBeGreaterThan(50_000);
    await v.page.emulateMediaType("print");
    const printWidth = (await v.page.evaluate(
      `document.querySelector("figure.chart svg").getBoundingClientRect().width`,
    )) as number;
    expect(printWidth).toBeGreaterThan(300);
    await v.page.close();
  });

  it("parses the hostile page into no script or img element and fires no dialog", async () => {
    const v = await visit(launched, hostile);
    const counts = (await v.page.evaluate(
      `[document.querySelectorAll("script").length, document.querySelectorAll("img").length, [...document.querySelectorAll("*")].filter((e) => [...e.attributes].some((a) => a.name.startsWith("on"))).length]`,
    )) as number[];
    expect(counts).toEqual([0, 0, 0]);
    expect([v.dialogs, v.blocked, v.consoleErrors]).toEqual([[], [], []]);
    const tooltip = (await v.page.evaluate(
      `document.querySelector("g.pt[data-station='999901-99999'] title").textContent`,
    )) as string;
    expect(tooltip).toMatch(
      /^<script>alert\(1\)<\/script>"><img src=x onerror=alert\(1\)> \(999901-99999\): 5 months/,
    );
    await v.page.close();
  });
});
