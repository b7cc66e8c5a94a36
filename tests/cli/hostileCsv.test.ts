/**
 * Spreadsheet formulas never pass through a CSV the tool writes: the whole plan is run with aircraft
 * ids and base names a spreadsheet would execute, and every CSV file found in the output folder is
 * checked, so tables added later are covered without changing this test. `coldsoak climate --csv`
 * gets a hostile station name from the station-history list.
 */
import { readdirSync, readFileSync } from "node:fs";
import { writeFile } from "node:fs/promises";
import { join } from "node:path";
import { parse } from "csv-parse/sync";
import { describe, expect, it } from "vitest";
import { planText, STATION, useClimateRoot } from "./planCase.js";
import { runCli } from "./runCli.js";

const { root: climateRoot, writeCase } = useClimateRoot();

// The payloads of OWASP, "CSV Injection": a leading = + - @ tab or carriage return starts a formula.
const HOSTILE = ["=cmd|' /C calc'!A0", "+SUM(1+1)", "-2+3", "@SUM(A1)", "\tTAB", "\rCR"];
const BASES = ["=cmd|' /C calc'!A0", "+SUM(1+1)", "\tTab base", "\rCR base"];

/** A CSV field: quoted (RFC 4180) when it holds a quote, a comma, a tab or a line break. */
const field = (s: string) => (/[",\t\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s);

/** A number as `formatMachine` writes it: a minus sign here is a negative number, not a formula. */
const NUMBER = /^-?\d+(\.\d+)?(e[-+]\d+)?$/;

/** Every cell of every CSV in a folder, with the file, row and column it is in. */
function csvCells(folder: string): { file: string; column: string; cell: string }[] {
  const out: { file: string; column: string; cell: string }[] = [];
  for (const file of readdirSync(folder).filter((f) => f.endsWith(".csv"))) {
    const [header, ...rows] = parse(readFileSync(join(folder, file), "utf8")) as string[][];
    for (const row of rows)
      for (const [i, cell] of row.entries()) out.push({ file, column: header![i]!, cell });
  }
  return out;
}

describe("CSV exports neutralise text a spreadsheet would run as a formula", () => {
  it("every CSV of a whole plan run with hostile aircraft ids and base names: text prefixed with ', numbers untouched", async () => {
    const plan = planText((t) => {
      const base = t.bases[0];
      t.bases = BASES.map((name) => ({ ...base, name }));
      delete t.nitrogen.stock;
    });
    const rows = HOSTILE.map(
      (id, i) => `${field(id)},${field(BASES[i % BASES.length]!)},2027-01-04,2027-02-01,no,standard`,
    );
    const c = await writeCase(
      plan,
      `aircraft,base,arrive,depart,cold_start_option,profile\n${rows.join("\n")}\n`,
    );
    const r = await runCli(["plan", c.plan, "--out", c.out, "--no-cache"]);
    expect(r.err.split("\n").filter((l) => !l.startsWith("warning:") && l !== "")).toEqual([]);
    expect(r.code).toBe(0);
    const cells = csvCells(join(c.out, "minimal"));
    const files = new Set(cells.map((x) => x.file));
    expect(files.size).toBeGreaterThanOrEqual(20);
    // No cell a spreadsheet would read as a formula, in any file: a leading - only on a number.
    const formulas = cells.filter((x) => /^[=+\-@\t\r]/.test(x.cell) && !NUMBER.test(x.cell));
    expect(formulas).toEqual([]);
    // The hostile texts are there, neutralised, wherever an aircraft id or a base name is written.
    for (const { file, column } of [
      { file: "stays.csv", column: "aircraft" },
      { file: "nitrogen_stays.csv", column: "aircraft" },
      { file: "aircraft_actions.csv", column: "aircraft" },
    ]) {
      const ids = cells.filter((x) => x.file === file && x.column === column).map((x) => x.cell);
      expect(ids.sort()).toEqual(HOSTILE.map((id) => `'${id}`).sort());
    }
    const bases = cells.filter((x) => x.file === "bases.csv" && x.column === "base").map((x) => x.cell);
    expect(bases).toEqual(BASES.map((b) => `'${b}`));
    // Every base column (the fleet row of nitrogen_fleet.csv has none) names a neutralised base.
    for (const x of cells.filter((x) => x.column === "base" && x.cell !== ""))
      expect(BASES.map((b) => `'${b}`)).toContain(x.cell);
    // Typed numbers stay numbers: the synthetic January mornings are below 0 °C (mean 2 °C, annual
    // half-swing 15 °C: the station's definition in planCase.ts).
    const cold = cells.filter(
      (x) => x.file === "coldest_mornings.csv" && x.column === "coldest_preflight_ambient_c",
    );
    expect(cold.length).toBeGreaterThan(0);
    for (const x of cold) expect(x.cell).toMatch(/^-\d/);
  }, 120_000);

  it("coldsoak climate --csv: a hostile station name from the station-history list is prefixed", async () => {
    const c = await writeCase(planText());
    const history = join(c.dir, "history.csv");
    await writeFile(
      history,
      `"USAF","WBAN","STATION NAME","CTRY","STATE","ICAO","LAT","LON","ELEV(M)","BEGIN","END"\n"${STATION.id.slice(0, 6)}","${STATION.id.slice(7)}","=HYPERLINK(""http://x"")","","","","61.200","-149.900","40.0","19000101","20991231"\n`,
    );
    const csv = join(c.dir, "climate.csv");
    const r = await runCli([
      "climate",
      join(climateRoot(), "climate"),
      "--station-history",
      history,
      "--no-cache",
      "--csv",
      csv,
    ]);
    expect(r.code).toBe(0);
    const [header, ...rows] = parse(readFileSync(csv, "utf8")) as string[][];
    const name = header!.indexOf("name");
    expect(rows.length).toBe(12);
    for (const row of rows) expect(row[name]).toBe('\'=HYPERLINK("http://x")');
  }, 60_000);
});
