import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { parsePlanText } from "../../src/plan/planFile.js";
import { M3_PER_IN3, PA_PER_PSI } from "../../src/units/index.js";

const FIXTURE = new URL("../fixtures/plan/minimal-plan.yaml", import.meta.url);
const text = readFileSync(FIXTURE, "utf8");

function errorOf(src: string): string {
  try {
    parsePlanText(src, "plan.yaml");
  } catch (err) {
    return (err as Error).message;
  }
  return "no error";
}

describe("plan file", () => {
  it("reads the complete example", () => {
    const plan = parsePlanText(text, "plan.yaml");
    const p = plan.profiles[0]!;
    // Unit definitions: NIST SP 811 appendix B (psi, in³); °F scale definition.
    expect(p.precharge.reference.pressure.pa).toBeCloseTo(1450 * PA_PER_PSI, 6);
    expect(p.precharge.reference.pressure.isGauge).toBe(true);
    expect(p.precharge.reference.tempK).toBeCloseTo(294.261111, 5);
    expect(p.accumulator.gasVolumeEmpty).toBeCloseTo(300 * M3_PER_IN3, 12);
    expect(p.pump.timer).toBe(180);
    expect(plan.operations.weekdays).toEqual([1, 2, 3, 4, 5]);
    expect(plan.operations.startTimes).toEqual([390, 780]);
    expect(plan.has(["climate", "gapHours"])).toBe(true);
    expect(plan.lineOf(["profiles", 0, "pump", "timer"])).toBe(
      text.split("\n").findIndex((l) => l.includes('timer: "3 min"')) + 1,
    );
  });

  it("names file, line, path and what was expected", () => {
    const bad = text.replace('reference: "1450 psig @ 70 F"', 'reference: "1450 psi @ 70 F"');
    const line = text.split("\n").findIndex((l) => l.includes('reference: "1450 psig')) + 1;
    expect(errorOf(bad)).toBe(
      `plan.yaml:${line}:profiles[0].precharge.reference: "1450 psi": a bare "psi" is a pressure difference; say "psig" (gauge) or "psia" (absolute) for a pressure`,
    );
    expect(errorOf(text.replace("units: us", "units: metric"))).toMatch(
      /^plan\.yaml:\d+:units: expected one of "us", "si"$/,
    );
    expect(errorOf(text.replace("  prechargeCheckDays: 7\n", ""))).toMatch(
      /^plan\.yaml:\d+:operations\.prechargeCheckDays: missing; expected a number$/,
    );
    expect(errorOf(text.replace("seed: 42", "seed: 42\nsed: 1"))).toMatch(
      /^plan\.yaml:\d+:\(top\): unknown key "sed"$/,
    );
    expect(errorOf("name: [")).toMatch(/^plan\.yaml:1: not valid YAML/);
    expect(errorOf(text.replace('gasVolumeFull: "60 in3"', 'gasVolumeFull: "400 in3"'))).toMatch(
      /gasVolumeFull: expected a gas volume at 100 % fill smaller/,
    );
    // A loss of the whole 1450 psig reference in a month leaves nothing to convert (definition).
    expect(errorOf(text.replace('rate: "5 psi/month"', 'rate: "1500 psi/month"'))).toMatch(
      /^plan\.yaml:\d+:profiles\[0\]\.gasLoss\.rate: expected a loss per month smaller than the reference precharge$/,
    );
  });
});
