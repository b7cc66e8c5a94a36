import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { parsePlanFileText, parsePlanText } from "../../src/plan/planFile.js";
import { M3_PER_IN3, PA_PER_PSI } from "../../src/units/index.js";
import { errorOf } from "./helpers.js";

const FIXTURE = new URL("../fixtures/plan/minimal-plan.yaml", import.meta.url);
const text = readFileSync(FIXTURE, "utf8");

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
      /^plan\.yaml:\d+:units: "metric": expected one of "us", "si"$/,
    );
    expect(errorOf(text.replace("  prechargeCheckDays: 7\n", ""))).toMatch(
      /^plan\.yaml:\d+:operations\.prechargeCheckDays: missing; expected a number$/,
    );
    expect(errorOf(text.replace("seed: 42", "seed: 42\nsed: 1"))).toMatch(
      /^plan\.yaml:\d+:\(top\): unknown key "sed"$/,
    );
    expect(errorOf("name: [")).toMatch(/^plan\.yaml:1: not valid YAML/);
    expect(errorOf(text.replace('gasVolumeFull: "60 in3"', 'gasVolumeFull: "400 in3"'))).toMatch(
      /gasVolumeFull: "400 in3": expected a gas volume at 100 % fill smaller/,
    );
    // A loss of the whole 1450 psig reference in a month leaves nothing to convert (definition).
    expect(errorOf(text.replace('rate: "5 psi/month"', 'rate: "1500 psi/month"'))).toMatch(
      /^plan\.yaml:\d+:profiles\[0\]\.gasLoss\.rate: "1500 psi\/month": expected a loss per month smaller than the reference precharge$/,
    );
  });

  it("reads the nitrogen demand items and names file, line and field of a bad one", () => {
    // Definitions: 1 lb = 0.45359237 kg (NIST SP 811); a week = 7 × 86 400 s.
    const plan = parsePlanText(text, "plan.yaml");
    expect(plan.nitrogen.unscheduledRechargesPerAircraftMonth).toBe(0);
    expect(plan.nitrogen.otherUse).toEqual({ amount: 0, per: "flown-day" });
    expect(plan.nitrogen.stock).toEqual({ cylinders: 2, resupplyEvery: 28 * 86400 });
    const nitrogen = (lines: string) =>
      text.replace(
        / {2}unscheduledRechargesPerAircraftMonth[^\n]*\n {2}otherUse[^\n]*\n {2}stock[^\n]*\n/,
        lines,
      );
    const line =
      text.split("\n").findIndex((l) => l.startsWith("  unscheduledRechargesPerAircraftMonth")) + 1;
    const perBase = parsePlanText(
      nitrogen('  otherUse: { amount: "2 scf", per: week }\n  stock: { cylinders: { North Field: 3 } }\n'),
      "plan.yaml",
    );
    // One scf of nitrogen: 1.160424 kg/m³ (units/factors.ts, Span et al. 2000) × 0.028316847 m³ (NIST SP 811).
    expect(perBase.nitrogen.otherUse!.amount).toBeCloseTo(2 * 0.0328595, 6);
    expect(perBase.nitrogen.stock).toEqual({ cylinders: { "North Field": 3 } });
    expect(perBase.nitrogen.unscheduledRechargesPerAircraftMonth).toBe(0);
    expect(errorOf(nitrogen("  unscheduledRechargesPerAircraftMonth: -0.1\n"))).toBe(
      `plan.yaml:${line}:nitrogen.unscheduledRechargesPerAircraftMonth: "-0.1": expected a number from 0 to 30`,
    );
    expect(errorOf(nitrogen('  otherUse: { amount: "2 psi", per: flown-day }\n'))).toMatch(
      new RegExp(`^plan\\.yaml:${line}:nitrogen\\.otherUse\\.amount: "2 psi": unknown or missing unit "psi"`),
    );
    expect(errorOf(nitrogen('  otherUse: { amount: "2 lb", per: month }\n'))).toBe(
      `plan.yaml:${line}:nitrogen.otherUse.per: "month": expected one of "flown-day", "week"`,
    );
    expect(errorOf(nitrogen("  stock: { cylinders: { South Pad: 3 } }\n"))).toBe(
      `plan.yaml:${line}:nitrogen.stock.cylinders.South Pad: "South Pad" is not a base of the plan; expected one of the plan's bases: North Field`,
    );
    expect(errorOf(nitrogen("  stock: { cylinders: 2.5 }\n"))).toBe(
      `plan.yaml:${line}:nitrogen.stock.cylinders: "2.5": expected a whole number from 0 to 10000`,
    );
    expect(errorOf(nitrogen('  stock: { cylinders: 2, resupplyEvery: "12 h" }\n'))).toBe(
      `plan.yaml:${line}:nitrogen.stock.resupplyEvery: "12 h" is below 24 h; expected an interval from 24 h to 87658.2 h`,
    );
  });
});

describe("a plan file for the screen (no bases, schedule or nitrogen)", () => {
  const bases = /\nbases:\n(?: {2}[^\n]*\n)+/;
  const nitrogen = /\nnitrogen:\n(?: {2}[^\n]*\n)+/;
  const screenOnly = text
    .replace(bases, "\n")
    .replace(nitrogen, "\n")
    .replace(/\nschedule:[^\n]*/, "");

  it("is valid for the screen, with its profiles, operations, thresholds and climate settings", () => {
    expect(screenOnly).not.toMatch(/^(bases|nitrogen|schedule):/m);
    const p = parsePlanFileText(screenOnly, "plan.yaml");
    expect(p.bases).toBeUndefined();
    expect(p.nitrogen).toBeUndefined();
    expect(p.profiles.map((x) => x.name)).toEqual(["standard"]);
    expect(p.climate.minYears).toBe(1);
  });

  it("is refused by the planning engine at the plan's first key, naming the missing section", () => {
    const first = text.split("\n").findIndex((l) => l.startsWith("name:")) + 1;
    expect(errorOf(screenOnly)).toBe(
      `plan.yaml:${first}:bases: missing; expected a list of bases, each with its name and climate stations (only "coldsoak screen" reads a plan without it)`,
    );
    expect(errorOf(text.replace(nitrogen, "\n"))).toMatch(
      /^plan\.yaml:\d+:nitrogen: missing; expected the nitrogen section .*only "coldsoak screen" reads a plan without it\)$/,
    );
  });
});

describe("hangars in the plan file (docs/methods.md §3, Hangars)", () => {
  const HANGAR =
    'hangar: { kind: heated, heatedTo: "50 F", in: "20:00", out: "06:00", months: [Oct, Nov, Dec, Jan, Feb, Mar, Apr] }';
  const line = text.split("\n").findIndex((l) => l.includes("hangar: {")) + 1;
  const withHangar = (h: string) => text.replace(HANGAR, `hangar: ${h}`);

  it("reads a heated hangar with its months, and a shelter with its defaults", () => {
    expect(text).toContain(HANGAR);
    const heated = parsePlanText(text, "plan.yaml").bases[0]!.hangar!;
    expect(heated).toEqual({
      kind: "heated",
      heatedTo: 283.15, // 50 °F = 10 °C (°F scale definition)
      in: 20 * 60,
      out: 6 * 60,
      months: [10, 11, 12, 1, 2, 3, 4],
    });
    const shelter = parsePlanText(withHangar('{ kind: shelter, in: "20:00", out: "06:00" }'), "plan.yaml");
    // Defaults of docs/methods.md §3: a 6 h time constant, no offset, all year.
    expect(shelter.bases[0]!.hangar).toEqual({
      kind: "shelter",
      timeConstant: 6 * 3600,
      offset: 0,
      in: 20 * 60,
      out: 6 * 60,
      months: null,
    });
    const offset = parsePlanText(
      withHangar(
        '{ kind: shelter, timeConstant: "4 h", offset: "9 F", in: "20:00", out: "06:00", months: [12, 1] }',
      ),
      "plan.yaml",
    ).bases[0]!.hangar!;
    // A difference of 9 °F is 5 K (NIST SP 811, Appendix B.8).
    expect(offset).toMatchObject({ timeConstant: 4 * 3600, months: [12, 1] });
    expect(offset.kind === "shelter" ? offset.offset : Number.NaN).toBeCloseTo(5, 12);
  });

  it("refuses the former fixed temperature with its line, naming the keys that replace it", () => {
    expect(errorOf(withHangar('{ temperature: "50 F", in: "20:00", out: "06:00" }'))).toMatch(
      new RegExp(
        `^plan\\.yaml:${line}:bases\\[0\\]\\.hangar\\.temperature: a fixed hangar temperature is no longer read; write kind: heated with heatedTo .*kind: shelter .*timeConstant.*offset`,
      ),
    );
  });

  it("names what a hangar of each kind misses or does not take", () => {
    expect(errorOf(withHangar('{ kind: heated, in: "20:00", out: "06:00" }'))).toMatch(
      /^plan\.yaml:\d+:bases\[0\]\.hangar\.heatedTo: missing; a heated hangar needs its set point/,
    );
    expect(errorOf(withHangar('{ kind: shelter, heatedTo: "50 F", in: "20:00", out: "06:00" }'))).toMatch(
      /bases\[0\]\.hangar\.heatedTo: "50 F": belongs to kind: heated/,
    );
    expect(
      errorOf(withHangar('{ kind: heated, heatedTo: "50 F", offset: "2 F", in: "20:00", out: "06:00" }')),
    ).toMatch(/bases\[0\]\.hangar\.offset: "2 F": belongs to kind: shelter/);
    expect(errorOf(withHangar('{ kind: warm, in: "20:00", out: "06:00" }'))).toMatch(
      /bases\[0\]\.hangar\.kind: "warm": expected one of "heated", "shelter"/,
    );
    expect(errorOf(withHangar('{ in: "20:00", out: "06:00" }'))).toMatch(/bases\[0\]\.hangar\.kind: missing/);
    expect(errorOf(withHangar('{ kind: shelter, in: "20:00", out: "06:00", months: [Smarch] }'))).toMatch(
      /bases\[0\]\.hangar\.months\[0\]: "Smarch" is not a month; expected Jan … Dec or a number 1–12/,
    );
  });
});
