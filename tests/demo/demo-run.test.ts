/**
 * The demo scenario end to end, on a shortened year range: plan file and schedule as shipped, the
 * generated climate files, the real CLI entry point; checks that every report section is produced.
 */
import { copyFileSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { main } from "../../src/cli/main.js";
import { DEMO_STATIONS, stationId } from "../../src/demo/stations.js";
import type { Results } from "../../src/plan/results.js";

const SAMPLE = fileURLToPath(new URL("../../sample-data/", import.meta.url));

describe("demo scenario, end to end (years 2019–2020)", () => {
  let dir: string;
  let code: number;
  let html: string;
  let results: Results;
  beforeAll(async () => {
    dir = mkdtempSync(join(tmpdir(), "coldsoak-demo-"));
    // Only the two years used, to keep the test short.
    const climateFiles = DEMO_STATIONS.flatMap((st) =>
      [2019, 2020].map((y) => join(SAMPLE, "climate", `${stationId(st)}-${y}.gz`)),
    );
    const plan = readFileSync(join(SAMPLE, "demo-plan.yaml"), "utf8")
      .replace("paths: [climate]", `paths: ${JSON.stringify(climateFiles)}`)
      .replace("years: { from: 2011, to: 2020 }", "years: { from: 2019, to: 2020 }")
      .replace("minYears: 5", "minYears: 1");
    expect(plan).toContain("from: 2019");
    writeFileSync(join(dir, "demo-plan.yaml"), plan);
    copyFileSync(join(SAMPLE, "demo-schedule.csv"), join(dir, "demo-schedule.csv"));
    copyFileSync(join(SAMPLE, "station-history.csv"), join(dir, "station-history.csv"));
    vi.spyOn(process.stdout, "write").mockImplementation(() => true);
    vi.spyOn(process.stderr, "write").mockImplementation(() => true);
    try {
      code = await main(["plan", join(dir, "demo-plan.yaml"), "--out", join(dir, "out"), "--no-cache"]);
    } finally {
      vi.restoreAllMocks();
    }
    html = readFileSync(join(dir, "out", "demo", "report.html"), "utf8");
    results = JSON.parse(readFileSync(join(dir, "out", "demo", "results.json"), "utf8")) as Results;
  });
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it("exits 0 and writes out/demo/report.html and results.json", () => {
    expect(code).toBe(0);
    expect(results.plan).toBe("demo");
    expect(results.climateYears).toEqual([2019, 2020]); // the shortened range set above
  });

  it("covers the four invented bases with their generated stations", () => {
    // Invented base names of the demo (src/demo/stations.ts, sample-data/demo-plan.yaml).
    expect(results.bases.map((b) => b.name)).toEqual(["Veldmoor", "Korrash", "Iskarra", "Sabreth"]);
    expect(results.bases.map((b) => b.stations[0]!.id)).toEqual(DEMO_STATIONS.map(stationId));
    for (const b of results.bases) expect(b.months.some((m) => m.preflights > 0)).toBe(true);
  });

  it("marks every plan value as a demo assumption", () => {
    // The demo plan file sets several dozen values, each commented as a demo assumption (sample-data).
    expect(results.assumptions.length).toBeGreaterThan(10);
    for (const a of results.assumptions)
      expect(a.origin === "demo assumption" || a.origin === "default").toBe(true);
    expect(results.assumptions.some((a) => a.origin === "demo assumption")).toBe(true);
  });

  it("shows the atmosphere of each base, the peak trapped pressure and relief by month, and the hangar air", () => {
    // The demo's generated records carry station pressure (MA1, src/demo/isdRecord.ts), so each base
    // uses the mean station pressure of its station.
    for (const b of results.bases) expect(b.atmosphere.source).toBe("station pressure");
    expect(html.split("<dt>Atmosphere</dt>").length - 1).toBe(4);
    expect(html).toContain("the mean station pressure reported by 999701-99999");
    expect(html.split("Peak trapped pressure (psig)").length - 1).toBe(4);
    expect(html).toContain("Thermal relief: utility relieves at 3400 psig.");
    // The demo plan: a heated hangar at Veldmoor, an unheated shelter at Iskarra (sample-data).
    expect(html).toContain(
      "heated hangar air, the outside air or 59.0 °F where colder, from 19:00 to 06:30 in Oct",
    );
    expect(html).toContain(
      "unheated shelter air, the outside air 6 h behind and +4.0 °F, from 20:00 to 06:00",
    );
  });

  it("shows plan values as the user typed them", () => {
    // The demo plan writes the bulk modulus as "1.4 GPa" (sample-data/demo-plan.yaml); the report shows
    // that text, not a conversion (1.4 GPa = 203,053 psi, NIST SP 811).
    expect(html).toContain("1.4 GPa");
    expect(html).not.toContain("203,053");
    expect(html).not.toContain("203053");
  });

  it("produces every report section", () => {
    for (const id of ["caution-h", "fleet", "methods", "assumptions", "coverage", "tables"]) {
      expect(html, id).toContain(`id="${id}"`);
    }
    for (const section of ["climate", "precharge", "overnight", "risk", "hours", "advice", "nitrogen"]) {
      const count = html.split(`data-section="${section}"`).length - 1;
      expect(count, section).toBe(4); // one per base
    }
  });
});
