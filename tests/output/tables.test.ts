import { parse } from "csv-parse/sync";
import { describe, expect, it } from "vitest";
import { resultsJson, resultTables, toCsv } from "../../src/output/tables.js";
import { makeResults, SCRIPT_PAYLOAD } from "../fixtures/report/results.js";

// Structure of the exported files; the fixture's numbers are made up, so no physics value is asserted.

describe("CSV text", () => {
  it("quotes fields with commas, quotes, line breaks or outer spaces and ends every record with CRLF", () => {
    const csv = toCsv({
      name: "t",
      columns: ["a", "b", "c", "d", "e"],
      rows: [['say "hi"', "x,y", "two\nlines", " padded", "plain"]],
    });
    // RFC 4180, section 2, rules 1, 6 and 7: CRLF line breaks; fields holding commas, quotes or line
    // breaks are enclosed in double quotes, and a double quote inside is written twice.
    expect(csv).toBe('a,b,c,d,e\r\n"say ""hi""","x,y","two\nlines"," padded",plain\r\n');
  });

  it("writes no value as an empty cell, booleans as yes/no, and numbers with at most 6 decimals", () => {
    const csv = toCsv({
      name: "t",
      columns: ["a", "b", "c", "d", "e"],
      rows: [[null, true, false, 1 / 3, -1e-9]],
    });
    // 1/3 = 0.333333… and −1e−9 rounds to 0 at 6 decimals (arithmetic, no outside source).
    expect(csv).toBe("a,b,c,d,e\r\n,yes,no,0.333333,0\r\n");
    expect(toCsv({ name: "t", columns: ["a"], rows: [[Number.NaN]] })).toBe("a\r\n\r\n");
  });
});

describe("CSV text neutralised for spreadsheets", () => {
  it("prefixes a text cell starting with = + - @ tab or carriage return with an apostrophe", () => {
    // OWASP, "CSV Injection": cells starting with these characters are read as formulas.
    const cells = ["=SUM(A1)", "+1", "-40 F", "@cmd", "\tx", "\rx", "ok", "a=b"];
    const csv = toCsv({ name: "t", columns: cells.map((_c, i) => `c${i}`), rows: [cells] });
    const [, record] = parse(csv, { relax_quotes: true }) as string[][];
    expect(record).toEqual(["'=SUM(A1)", "'+1", "'-40 F", "'@cmd", "'\tx", "'\rx", "ok", "a=b"]);
  });

  it("neutralises hostile text in the aircraft actions", () => {
    const results = makeResults({ units: "si" });
    results.actions[0]!.aircraft = "=HYPERLINK(1)";
    results.actions[0]!.text = "@SUM(1)";
    const t = resultTables(results).find((x) => x.name === "aircraft_actions")!;
    const [header, first] = parse(toCsv(t)) as string[][];
    expect(first![header!.indexOf("aircraft")]).toBe("'=HYPERLINK(1)");
    expect(first![header!.indexOf("text")]).toBe("'@SUM(1)");
  });
});

describe("result tables", () => {
  const results = makeResults({ units: "si", hostile: true });
  const tables = resultTables(results);

  it("names every table and column once, in snake_case, with as many cells per row as columns", () => {
    const names = tables.map((t) => t.name);
    expect(new Set(names).size).toBe(names.length);
    for (const t of tables) {
      expect(t.name).toMatch(/^[a-z][a-z0-9_]*$/);
      expect(new Set(t.columns).size, t.name).toBe(t.columns.length);
      for (const c of t.columns) expect(c, t.name).toMatch(/^[a-z][a-z0-9_]*$/);
      for (const row of t.rows) expect(row, t.name).toHaveLength(t.columns.length);
    }
  });

  it("has one row per item of the results it lists", () => {
    const rows = (name: string) => tables.find((t) => t.name === name)!.rows.length;
    const perBase = (items: (b: (typeof results.bases)[number]) => unknown[]) =>
      results.bases.reduce((n, b) => n + items(b).length, 0);
    expect(rows("bases")).toBe(results.bases.length);
    expect(rows("months")).toBe(perBase((b) => b.months));
    expect(rows("trapped_charge")).toBe(perBase((b) => b.trappedCharge));
    expect(rows("atmosphere")).toBe(results.bases.length);
    expect(rows("base_curves")).toBe(perBase((b) => b.profileCurves.flatMap((p) => p.prechargeLine)));
    expect(rows("nitrogen_stays")).toBe(perBase((b) => b.nitrogen.stays));
    expect(rows("nitrogen_fleet")).toBe(results.bases.length + 1);
    expect(rows("nitrogen_timeline")).toBe(perBase((b) => b.nitrogen.timeline));
    expect(rows("nitrogen_cylinder_gas")).toBe(perBase((b) => b.nitrogen.usableGas));
    expect(rows("stations")).toBe(perBase((b) => b.stations));
    expect(rows("stays")).toBe(results.stays.length);
    expect(rows("aircraft_actions")).toBe(results.actions.length);
    expect(rows("stay_months")).toBe(results.stays.reduce((n, s) => n + s.months.length, 0));
    expect(rows("advice")).toBe(perBase((b) => b.advice));
    expect(rows("assumptions")).toBe(results.assumptions.length);
    const breakEven =
      results.profiles.reduce((n, p) => n + p.breakEven.length, 0) +
      perBase((b) => [...b.profileCurves.flatMap((p) => p.breakEven), ...b.designPoint]);
    expect(rows("break_even")).toBe(breakEven);
    expect(rows("design_point")).toBe(perBase((b) => b.designWorksheets));
    expect(rows("energy_curve")).toBe(perBase((b) => b.designWorksheets.flatMap((w) => w.curve)));
    expect(rows("design_temperatures")).toBe(results.bases.length);
    expect(rows("design_months")).toBe(perBase((b) => b.designTemperatures.months));
    expect(rows("hours_below")).toBe(perBase((b) => b.designTemperatures.hoursBelow));
    // One row per variant and base, and the baseline ("as planned") of each base.
    expect(rows("what_if")).toBe(perBase((b) => [null, ...(b.whatIf?.variants ?? [])]));
  });

  it("writes what_if.csv only when variants were run", () => {
    const plain = { ...results, whatIf: null, bases: results.bases.map((b) => ({ ...b, whatIf: null })) };
    expect(resultTables(plain).some((t) => t.name === "what_if")).toBe(false);
  });

  it("names the nitrogen flows in one vocabulary: drawn = added + hose vented + other uses, released apart", () => {
    // The identity of docs/methods.md §7, carried by the fixture's means (structure, not physics).
    for (const name of ["nitrogen_stays", "nitrogen_fleet"]) {
      const t = tables.find((x) => x.name === name)!;
      const col = (c: string) => t.columns.indexOf(c);
      for (const c of [
        "drawn",
        "added",
        "added_servicing",
        "added_unscheduled",
        "hose_vented",
        "other_use",
        "released",
      ]) {
        expect(col(`${c}_kg_mean`), `${name}: ${c}_kg_mean`).toBeGreaterThanOrEqual(0);
      }
      for (const row of t.rows) {
        const v = (c: string) => row[col(`${c}_kg_mean`)] as number;
        expect(v("drawn")).toBeCloseTo(v("added") + v("hose_vented") + v("other_use"), 6);
        expect(v("added")).toBeCloseTo(v("added_servicing") + v("added_unscheduled"), 6);
      }
    }
    const fleet = tables.find((x) => x.name === "nitrogen_fleet")!;
    expect(fleet.rows.map((r) => r[0])).toEqual([...results.bases.map(() => "base"), "fleet"]);
  });

  it("reads back through a CSV parser to the same cells, hostile text included", () => {
    for (const t of tables) {
      const [header, ...records] = parse(toCsv(t), { relax_column_count: false }) as string[][];
      expect(header).toEqual(t.columns);
      expect(records).toHaveLength(t.rows.length);
    }
    const stays = tables.find((t) => t.name === "stays")!;
    const parsed = parse(toCsv(stays)) as string[][];
    expect(parsed.flat().some((cell) => cell.includes(SCRIPT_PAYLOAD))).toBe(true);
  });
});

describe("results.json text", () => {
  it("parses back to the results with numbers kept to 6 decimals and a final newline", () => {
    const results = makeResults({ units: "us" });
    const text = resultsJson(results);
    expect(text.endsWith("}\n")).toBe(true);
    const back = JSON.parse(text) as typeof results;
    expect(back.plan).toBe(results.plan);
    expect(back.bases.map((b) => b.name)).toEqual(results.bases.map((b) => b.name));
    const decimals = text.match(/\d+\.(\d+)/g) ?? [];
    for (const d of decimals) expect(d.split(".")[1]!.length).toBeLessThanOrEqual(6);
  });
});
