import { describe, expect, it } from "vitest";
import { resultTables, toCsv } from "../../src/output/tables.js";
import { assumptionsOf } from "../../src/plan/assumptions.js";
import { shownText, US_UNITS } from "../../src/units/index.js";
import { makeResults } from "../fixtures/report/results.js";
import { fixturePlan } from "./helpers.js";

const emptyResults = makeResults({ units: "us" });

describe("assumptions as data", () => {
  const plan = fixturePlan((t) => {
    delete t.profiles[0].starter.returnPressure; // left to its default, "0 psig"
    t.profiles[0].fluid.bulkModulus = "1.4 GPa";
  });
  const list = assumptionsOf(plan, [1, 2, 3, 4, 5]);
  const get = (key: string) => list.find((a) => a.key === key)!;

  it("keeps the text as written and the value in the JSON units", () => {
    // 1 GPa = 10⁶ kPa (SI prefixes); 1 psi = 6.894757293168 kPa (NIST SP 811, Appendix B.8);
    // 70 °F = 21.111 °C (NIST SP 811, °F definition).
    const k = get("profiles.standard.fluid.bulkModulus");
    expect(k).toMatchObject({ kind: "pressureDifference", value: 1.4e6, unit: "kPa", text: "1.4 GPa" });
    const ref = get("profiles.standard.precharge.reference");
    expect(ref).toMatchObject({ kind: "pressureGauge", unit: "kPa gauge", text: "1450 psig @ 70 F" });
    expect(ref.value as number).toBeCloseTo(1450 * 6.894757293168, 6);
    expect(ref.atTempC).toBeCloseTo(21.1111, 4);
    // 300 in³ = 4.916 L (1 in³ = 16.387064 cm³, NIST SP 811).
    const v0 = get("profiles.standard.accumulator.gasVolumeEmpty");
    expect(v0).toMatchObject({ kind: "volume", unit: "L", text: "300 in3" });
    expect(v0.value as number).toBeCloseTo(4.916119, 6);
    // Plain numbers as they are; lists as lists.
    expect(get("climate.minYearShare")).toMatchObject({ kind: "fraction", value: 0.8, text: "0.8" });
    expect(get("operations.startTimes")).toMatchObject({ value: ["06:30", "13:00"], text: "06:30, 13:00" });
  });

  it("marks a default by a null text and shows it in the plan's units", () => {
    // 0 kPa gauge is 0 psig (definition).
    const r = get("profiles.standard.starter.returnPressure");
    expect(r).toMatchObject({ kind: "pressureGauge", value: 0, text: null, origin: "default" });
    expect(shownText(r, US_UNITS)).toBe("0 psig");
  });

  it("shows the text as written in the report's units whatever they are, in assumptions.csv too", () => {
    // Written text is shown unchanged (no conversion: 1.4 GPa, not 203053 psi).
    const k = get("profiles.standard.fluid.bulkModulus");
    expect(shownText(k, US_UNITS)).toBe("1.4 GPa");
    const csv = resultTables({ ...emptyResults, assumptions: list }).find((t) => t.name === "assumptions")!;
    expect(csv.columns).toEqual(["key", "label", "shown", "kind", "value", "unit", "at_temp_c", "origin"]);
    const row = csv.rows.find((r) => r[0] === k.key)!;
    expect(row.slice(2, 6)).toEqual(["1.4 GPa", "pressureDifference", 1.4e6, "kPa"]);
    expect(csv.rows.find((r) => r[0] === "climate.gapHours")![2]).toBe("3 h");
    // A written text a spreadsheet would take for a formula is neutralised (OWASP, "CSV Injection").
    expect(toCsv(csv)).toContain("'-40 F,temperature,-40,°C,");
  });
});
