/**
 * Every value of the plan file is checked where it is read: out of its range, of the wrong type or not
 * a name, it is refused as `plan.yaml:LINE:yaml.path: "as written" …; expected … range` in the unit the
 * user wrote it in, before any work.
 */
import { describe, expect, it } from "vitest";
import { MAX_PLAN_NAME_LENGTH, parsePlanText } from "../../src/plan/planFile.js";
import { MAX_ALIAS_COUNT } from "../../src/plan/planYaml.js";
import { stream } from "../../src/plan/random.js";
import { errorOf, FIXTURE_TEXT } from "./helpers.js";

/** The fixture with one exact piece of text replaced (it must occur once). */
function edited(from: string, to: string): string {
  expect(FIXTURE_TEXT.split(from)).toHaveLength(2);
  return FIXTURE_TEXT.replace(from, to);
}

/** 1-based line of the fixture holding `text`. */
const lineOf = (text: string) => FIXTURE_TEXT.split("\n").findIndex((l) => l.includes(text)) + 1;

describe("physics-level values out of range: located, as written, with the range in the user's unit", () => {
  it("negative expansion coefficient, line volume, hose volume, differential and tolerance", () => {
    const at = (key: string) => `plan.yaml:${lineOf(key)}`;
    expect(errorOf(edited('expansionPerK: "8e-4 /K"', 'expansionPerK: "-8e-4 /K"'))).toBe(
      `${at("expansionPerK")}:profiles[0].fluid.expansionPerK: "-8e-4 /K" is below 0 /K; expected a volumetric expansion coefficient from 0 /K to 0.01 /K`,
    );
    // 1 m³ = 1000 L (definition); 1 m³ = 61,023.7 in³ (NIST SP 811, appendix B).
    expect(errorOf(edited('lineVolume: "0.2 L"', 'lineVolume: "-0.2 L"'))).toBe(
      `${at("lineVolume")}:profiles[0].fluid.lineVolume: "-0.2 L" is below 0 L; expected a volume from 0 L to 1000 L`,
    );
    expect(errorOf(edited('hoseVolume: "10 in3"', 'hoseVolume: "-10 in3"'))).toBe(
      `${at("hoseVolume")}:nitrogen.hoseVolume: "-10 in3" is below 0 in3; expected a volume from 0 in3 to 61023.7 in3`,
    );
    // 100 MPa = 14,503.8 psi (NIST SP 811, appendix B: 1 psi = 6894.757 Pa).
    expect(errorOf(edited('transferDifferential: "50 psi"', 'transferDifferential: "-50 psi"'))).toBe(
      `${at("transferDifferential")}:nitrogen.transferDifferential: "-50 psi" is below 0 psi; expected a pressure difference from 0 psi to 14503.8 psi`,
    );
    expect(errorOf(edited('tolerance: "50 psi"', 'tolerance: "-50 psi"'))).toBe(
      `${at('tolerance: "50 psi"')}:profiles[0].precharge.tolerance: "-50 psi" is below 0 psi; expected a pressure difference from 0 psi to 14503.8 psi`,
    );
  });

  it("temperatures outside the nitrogen equation's range, in the unit written, without float noise", () => {
    // Span et al. (2000): critical temperature 126.192 K = -146.958 °C = -232.524 °F; the equation
    // holds up to 1000 K = 726.85 °C = 1340.33 °F.
    const ref = lineOf('reference: "1450 psig @ 70 F"');
    expect(errorOf(edited('reference: "1450 psig @ 70 F"', 'reference: "1450 psig @ 1500 F"'))).toBe(
      `plan.yaml:${ref}:profiles[0].precharge.reference: "1450 psig @ 1500 F": the temperature 1500 F is above 1340.33 F, the upper limit of the nitrogen equation of state (Span et al. 2000); expected a temperature above -232.524 F and at most 1340.33 F`,
    );
    // A precharge reference below the critical point is named as such, not as a pressure problem.
    expect(errorOf(edited('reference: "1450 psig @ 70 F"', 'reference: "1450 psig @ -250 F"'))).toBe(
      `plan.yaml:${ref}:profiles[0].precharge.reference: "1450 psig @ -250 F": the temperature -250 F is below nitrogen's critical temperature, -232.524 F, where the charge may liquefy; expected a temperature above -232.524 F and at most 1340.33 F`,
    );
    expect(errorOf(edited('fill: "2200 psig @ 70 F"', 'fill: "2200 psig @ -200 C"'))).toBe(
      `plan.yaml:${lineOf("fill:")}:nitrogen.cylinder.fill: "2200 psig @ -200 C": the temperature -200 C is below nitrogen's critical temperature, -146.958 C, where the charge may liquefy; expected a temperature above -146.958 C and at most 726.85 C`,
    );
    expect(errorOf(edited('heatedTo: "50 F"', 'heatedTo: "-150 C"'))).toBe(
      `plan.yaml:${lineOf("heatedTo")}:bases[0].hangar.heatedTo: "-150 C" is below nitrogen's critical temperature, -146.958 C, where the charge may liquefy; expected a temperature above -146.958 C and at most 726.85 C`,
    );
    expect(errorOf(edited('ambient: "-40 F"', 'ambient: "-300 F"'))).toBe(
      `plan.yaml:${lineOf('ambient: "-40 F"')}:profiles[0].startEnergy[0].ambient: "-300 F" is below nitrogen's critical temperature, -232.524 F, where the charge may liquefy; expected a temperature above -232.524 F and at most 1340.33 F`,
    );
    expect(errorOf(edited('ambient: "-40 F"', 'ambient: "300 K"'))).toMatch(/in increasing order/);
  });

  it("negative energies and absurd volumes are refused with a sane range", () => {
    expect(errorOf(edited('energy: "30 kJ"', 'energy: "-30 kJ"'))).toBe(
      `plan.yaml:${lineOf('energy: "30 kJ"')}:profiles[0].startEnergy[0].energy: "-30 kJ" is below 0 kJ; expected an energy above 0 kJ and at most 10000 kJ`,
    );
    expect(errorOf(edited('gasVolumeEmpty: "300 in3"', 'gasVolumeEmpty: "1e308 in3"'))).toBe(
      `plan.yaml:${lineOf("gasVolumeEmpty")}:profiles[0].accumulator.gasVolumeEmpty: "1e308 in3" is above 61023.7 in3; expected a volume above 0 in3 and at most 61023.7 in3`,
    );
    expect(errorOf(edited("efficiency: 0.9", "efficiency: .nan"))).toBe(
      `plan.yaml:${lineOf("efficiency")}:profiles[0].handPump.efficiency: ".nan": expected a finite number`,
    );
  });
});

describe("names, types, seed and plan name", () => {
  it("a weekday must be a day's name or its start (Monkey is not Monday)", () => {
    const weekdays = "weekdays: [Mon, Tue, Wed, Thu, Fri]";
    expect(errorOf(edited(weekdays, "weekdays: [Monkey]"))).toBe(
      `plan.yaml:${lineOf(weekdays)}:operations.weekdays[0]: "Monkey" is not a day name; expected Mon, Tue, Wed, Thu, Fri, Sat or Sun`,
    );
    expect(parsePlanText(edited(weekdays, "weekdays: [Tues, Wednesday]"), "p").operations.weekdays).toEqual([
      2, 3,
    ]);
  });

  it("a wrong type is reported as a wrong type, never as missing", () => {
    expect(errorOf(edited("prechargeCheckDays: 7", 'prechargeCheckDays: "7"'))).toBe(
      `plan.yaml:${lineOf("prechargeCheckDays")}:operations.prechargeCheckDays: "7": expected a number, found a string`,
    );
    expect(errorOf(edited("prechargeCheckDays: 7", "prechargeCheckDays: [7]"))).toBe(
      `plan.yaml:${lineOf("prechargeCheckDays")}:operations.prechargeCheckDays: expected a number, found a list`,
    );
    expect(errorOf(edited('gasVolumeEmpty: "300 in3"', "gasVolumeEmpty: 300"))).toBe(
      `plan.yaml:${lineOf("gasVolumeEmpty")}:profiles[0].accumulator.gasVolumeEmpty: "300": expected a quantity with its unit, in quotes (e.g. "4.9 L"), found a number`,
    );
    expect(errorOf(edited('{ gasVolumeEmpty: "300 in3", gasVolumeFull: "60 in3" }', '"big"'))).toMatch(
      /accumulator: "big": expected an object, found a string$/,
    );
  });

  it("the seed is a 32-bit unsigned integer, and every one of them gives its own stream", () => {
    // The random streams take the seed as an unsigned 32-bit integer (SplitMix32, docs/methods.md §5).
    expect(parsePlanText(edited("seed: 42", "seed: 4294967295"), "p").seed).toBe(4294967295);
    expect(errorOf(edited("seed: 42", "seed: 4294967296"))).toBe(
      `plan.yaml:${lineOf("seed: 42")}:seed: "4294967296": expected a whole number from 0 to 4294967295`,
    );
    expect(errorOf(edited("seed: 42", "seed: -1"))).toMatch(/seed: "-1": expected a whole number from 0 to/);
    // The two ends of the range give different draws (no wrap-around onto seed 0).
    expect(stream(4294967295, "x")()).not.toBe(stream(0, "x")());
  });

  it(`a plan name over ${MAX_PLAN_NAME_LENGTH} characters is refused at load`, () => {
    expect(MAX_PLAN_NAME_LENGTH).toBe(100); // README, "Inputs"
    const long = "a".repeat(MAX_PLAN_NAME_LENGTH + 1);
    expect(errorOf(edited("name: minimal", `name: ${long}`))).toBe(
      `plan.yaml:${lineOf("name: minimal")}:name: "${long}": expected a name of at most 100 characters (it names the output folder)`,
    );
    const longest = "a".repeat(MAX_PLAN_NAME_LENGTH);
    expect(parsePlanText(edited("name: minimal", `name: ${longest}`), "p").name).toBe(longest);
  });
});

describe("YAML aliases", () => {
  it("an alias bomb is refused at its first alias, located, without expanding it", () => {
    const bomb = [
      'a: &a ["x", "x", "x", "x", "x", "x", "x", "x", "x", "x"]',
      "b: &b [*a, *a, *a, *a, *a, *a, *a, *a, *a, *a]",
      "c: &c [*b, *b, *b, *b, *b, *b, *b, *b, *b, *b]",
      "d: &d [*c, *c, *c, *c, *c, *c, *c, *c, *c, *c]",
      "e: &e [*d, *d, *d, *d, *d, *d, *d, *d, *d, *d]",
      "f: &f [*e, *e, *e, *e, *e, *e, *e, *e, *e, *e]",
      "name: bomb",
    ].join("\n");
    expect(errorOf(bomb)).toBe(
      `plan.yaml:2:b: its aliases expand more than ${MAX_ALIAS_COUNT} times (an alias bomb); expected a plan that writes its values out`,
    );
    // A few aliases, as a plan may use to repeat a profile's block, still read.
    const reused = edited(
      'handPump: { displacement: "1 in3", efficiency: 0.9 }',
      'handPump: &hp { displacement: "1 in3", efficiency: 0.9 }',
    );
    expect(errorOf(reused)).toBe("no error");
  });
});
