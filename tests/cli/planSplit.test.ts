/**
 * `coldsoak plan` with more bases than one report file holds: the overview and the base pages are
 * written inside the output swap (src/cli/outputFolder.ts), so the visible folder always holds one
 * run's complete report; `coldsoak pdf` prints the overview alone and says so.
 */
import { existsSync, readdirSync, readFileSync, readlinkSync, realpathSync, statSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { chromiumAvailable, chromiumPath } from "../../src/report/browser.js";
import { basePageName, MAX_BASES_IN_ONE_FILE } from "../../src/report/split.js";
import { planText, STATION, useClimateRoot, visibleEntries } from "./planCase.js";
import { runCli } from "./runCli.js";

const { writeCase } = useClimateRoot();

const COUNT = MAX_BASES_IN_ONE_FILE + 1;
const NAMES = [
  "<script>x</script>",
  "../x",
  ...Array.from({ length: COUNT - 2 }, (_, k) => `Field ${k + 1}`),
];

/** A plan of `names.length` bases on the synthetic station, one stay at each. */
function manyBasesCase(names: string[]) {
  const plan = planText((t) => {
    const base = t.bases[0];
    t.bases = names.map((name) => ({ ...base, name, stations: [STATION.id] }));
  });
  const rows = names.map((n, k) => `A${k + 1},${n},2027-01-04,2027-02-01,no,standard`);
  return writeCase(plan, `aircraft,base,arrive,depart,cold_start_option,profile\n${rows.join("\n")}\n`);
}

const HAVE_BROWSER = chromiumAvailable();
const RUN_PDF = HAVE_BROWSER || Boolean(process.env["CI"]);
if (!RUN_PDF) console.warn(`split-report PDF test skipped: no Chromium at ${chromiumPath()}`);

describe("coldsoak plan, more bases than one report file holds", () => {
  let out = "";
  let dir = "";
  /** What the split run printed on stderr (with --pdf where the PDF test runs). */
  let planErr = "";

  it("writes the overview and one page per base, named by position, inside the swapped folder", async () => {
    const c = await manyBasesCase(NAMES);
    out = c.out;
    dir = c.dir;
    const r = await runCli(["plan", c.plan, "--out", c.out, "--no-cache", ...(RUN_PDF ? ["--pdf"] : [])]);
    expect(r.code, r.err).toBe(0);
    planErr = r.err;
    const folder = join(c.out, "minimal");
    expect(visibleEntries(c.out)).toEqual(["minimal"]); // nothing else left behind
    expect(readdirSync(join(folder, "bases"))).toEqual(NAMES.map((_n, i) => basePageName(i)));
    // The pages live in the hidden version folder the visible link points at: made visible in one step.
    const version = realpathSync(join(c.out, readlinkSync(folder)));
    expect(realpathSync(join(folder, "bases"))).toBe(join(version, "bases"));
    const overview = readFileSync(join(folder, "report.html"), "utf8");
    expect(overview).toContain('href="bases/001.html"');
    expect(overview).not.toMatch(/<script/i);
    for (const [i] of NAMES.entries()) {
      const page = readFileSync(join(folder, "bases", basePageName(i)), "utf8");
      expect(page).toContain('href="../report.html"');
      expect(page).not.toMatch(/<script/i);
    }
  }, 300_000);

  it.runIf(RUN_PDF)(
    "prints a split report's overview to PDF and says the base pages are not in it",
    async () => {
      expect(HAVE_BROWSER, `CI needs Chromium at ${chromiumPath()}`).toBe(true);
      const folder = join(out, "minimal");
      expect(statSync(join(folder, "report.pdf")).size).toBeGreaterThan(0);
      expect(planErr).toContain(
        `the PDF holds the fleet overview only; the ${COUNT} base pages in bases/ are not in it`,
      );
      const p = await runCli(["pdf", join(folder, "report.html"), "--out", join(dir, "overview.pdf")]);
      expect(p.code, p.err).toBe(0);
      expect(p.err).toContain(`note: the PDF holds the fleet overview only`);
      expect(p.err).toContain(join(folder, "bases", "001.html"));
      // A base page prints as it is, without the note.
      const b = await runCli(["pdf", join(folder, "bases", "001.html"), "--out", join(dir, "base.pdf")]);
      expect(b.code, b.err).toBe(0);
      expect(b.err).toBe("");
      expect(statSync(join(dir, "base.pdf")).size).toBeGreaterThan(0);
    },
    300_000,
  );

  it("replaces the whole folder: a later run in one file leaves no base page of the earlier one", async () => {
    const c = await manyBasesCase(NAMES.slice(2, 4));
    const r = await runCli(["plan", c.plan, "--out", out, "--no-cache"]);
    expect(r.code, r.err).toBe(0);
    expect(visibleEntries(out)).toEqual(["minimal"]);
    expect(existsSync(join(out, "minimal", "report.html"))).toBe(true);
    expect(existsSync(join(out, "minimal", "bases"))).toBe(false);
  }, 300_000);
});
