/**
 * Every form of quantity the README lists ("Inputs" and "Commands") is accepted by the plan file and by
 * the command line alike, with and without spaces, and both read it as the same value: the two paths
 * share one grammar (src/units/parse.ts).
 */
import { readFileSync } from "node:fs";
import { mkdtemp, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { prechargeAnswer } from "../../src/cli/prechargeRun.js";
import { parsePlanText } from "../../src/plan/planFile.js";
import { runCli } from "../cli/runCli.js";
import { FIXTURE_TEXT } from "../plan/helpers.js";

const README = readFileSync(new URL("../../README.md", import.meta.url), "utf8");

/** Standard sea-level atmosphere, Pa (ISO 2533): the precharge command's atmosphere at 0 m. */
const ATM_PA = 101325;

/** The text with single spaces between number, unit and "@", and the same with every space removed. */
const spacings = (form: string) => [form, form.replace(/\s+/g, "")];

/** The fixture plan with one quoted value replaced. */
function planWith(from: string, to: string) {
  expect(FIXTURE_TEXT).toContain(from);
  return parsePlanText(FIXTURE_TEXT.replace(from, to), "plan.yaml");
}

// Point pressures of the README (Inputs: psig/psia, bar/bara, kPa/kPaa, MPa/MPaa; Commands: the same
// list for --ref), plus the explicit gauge spellings barg, kPag, MPag. Values are chosen so that the
// fixture's checks (precharge + tolerance below the lowest system pressure) still hold.
const PRESSURES = [
  "1450 psig",
  "1400 psia",
  "100 bar",
  "100 barg",
  "100 bara",
  "10000 kPa",
  "10000 kPag",
  "10000 kPaa",
  "10 MPa",
  "10 MPag",
  "10 MPaa",
];
// Temperatures of the README (Inputs: F, C, K), also written with a degree sign.
const TEMPERATURES = ["70 F", "21 C", "294 K", "70 °F", "21 °C"];

describe("the README's quantity forms in the plan file and on the command line", () => {
  it("lists exactly these units in the README", () => {
    // The README is the source of the forms tested here.
    for (const unit of ["psig", "psia", "bar", "bara", "kPa", "kPaa", "MPa", "MPaa", "barg", "kPag", "MPag"])
      expect(README).toContain(`\`${unit}\``);
    for (const unit of ["F", "C", "K", "°F", "°C", "in3", "L", "m3", "gal", "s", "min", "h", "d", "month"])
      expect(README).toContain(`\`${unit}\``);
    for (const unit of ["J", "kJ", "ft-lbf", "L/min", "gpm", "in3/s", "psi", "ksi", "GPa"])
      expect(README).toContain(`\`${unit}\``);
    expect(README).toContain("coldsoak precharge --ref 1450psig@70F --at 50F");
  });

  for (const p of PRESSURES) {
    for (const t of TEMPERATURES) {
      for (const form of spacings(`${p} @ ${t}`)) {
        it(`"${form}": the plan's precharge reference and --ref read the same`, async () => {
          // Same value through both paths; the physics of the answer is tested in tests/cli/precharge.
          const plan = planWith('reference: "1450 psig @ 70 F"', `reference: "${form}"`);
          const ref = plan.profiles[0]!.precharge.reference;
          const answer = prechargeAnswer(form, "50F");
          expect(answer.refIsGauge).toBe(ref.pressure.isGauge);
          expect(answer.refAbsPa).toBe(ref.pressure.isGauge ? ref.pressure.pa + ATM_PA : ref.pressure.pa);
          expect(answer.refTempK).toBe(ref.tempK);
          const run = await runCli(["precharge", "--ref", form, "--at", "50F", "--json"]);
          expect(run.code, run.err).toBe(0);
        });
      }
    }
  }

  for (const t of TEMPERATURES) {
    for (const form of spacings(t)) {
      it(`"${form}": the plan's hangar set point, precharge --at and band --from/--to read the same`, async () => {
        // Same value through every path (the °F/°C/K relations are tested in tests/units/factors).
        const plan = planWith('heatedTo: "50 F"', `heatedTo: "${form}"`);
        const hangar = plan.bases[0]!.hangar!;
        const tempK = hangar.kind === "heated" ? hangar.heatedTo : Number.NaN;
        expect(prechargeAnswer("1450psig@70F", form).atTempK).toBe(tempK);
        const at = await runCli(["precharge", "--ref", "1450psig@70F", "--at", form, "--json"]);
        expect(at.code, at.err).toBe(0);
        expect(JSON.parse(at.out).atTempC).toBeCloseTo(tempK - 273.15, 3);
        const band = await runCli(["band", planFile, "--from", form, "--to", form, "--json"]);
        expect(band.code, band.err).toBe(0);
        expect(JSON.parse(band.out).rows[0].tempC).toBeCloseTo(tempK - 273.15, 6);
      });
    }
  }

  it("band --step takes a bare number in the plan's unit or a temperature difference with its unit", async () => {
    // A difference of 10 °C is 18 °F (NIST SP 811, Appendix B.8): a US plan steps by 18 °F.
    const bare = await runCli(["band", planFile, "--from", "0", "--to", "36", "--step", "18", "--json"]);
    const unit = await runCli(["band", planFile, "--from", "0", "--to", "36", "--step", "10 C", "--json"]);
    expect(unit.code, unit.err).toBe(0);
    expect(JSON.parse(unit.out)).toEqual(JSON.parse(bare.out));
    expect(JSON.parse(unit.out).rows).toHaveLength(3);
  });

  // Plan-file forms the README lists for which the command line has no option: each in a field of its
  // kind, with and without the space, gives the same SI value.
  const FIELDS: [field: string, fixture: string, forms: string[], read: (p: PlanOf) => number][] = [
    [
      "precharge.tolerance (pressure difference)",
      'tolerance: "50 psi"',
      ["50 psi", "3.5 bar", "350 kPa", "0.35 MPa", "0.05 ksi"],
      (p) => p.profiles[0]!.precharge.tolerance,
    ],
    [
      "fluid.bulkModulus (pressure difference)",
      'bulkModulus: "1.5 GPa"',
      ["1.5 GPa", "1500 MPa", "220 ksi"],
      (p) => p.profiles[0]!.fluid.bulkModulus,
    ],
    [
      "accumulator.gasVolumeEmpty (volume)",
      'gasVolumeEmpty: "300 in3"',
      ["300 in3", "4.9 L", "0.0049 m3", "1.3 gal"],
      (p) => p.profiles[0]!.accumulator.gasVolumeEmpty,
    ],
    [
      "thermalTimeConstant (time)",
      'thermalTimeConstant: "2 h"',
      ["7200 s", "120 min", "2 h", "0.1 d", "0.01 month"],
      (p) => p.profiles[0]!.thermalTimeConstant,
    ],
    [
      "startEnergy[0].energy (energy)",
      'energy: "30 kJ"',
      ["30000 J", "30 kJ", "22000 ft-lbf"],
      (p) => p.profiles[0]!.startEnergy[0]!.energy,
    ],
    [
      "pump.curve[0].flow (flow)",
      'flow: "1.2 L/min"',
      ["1.2 L/min", "0.3 gpm", "5 in3/s"],
      (p) => p.profiles[0]!.pump.curve[0]!.flow,
    ],
  ];
  for (const [field, fixture, forms, read] of FIELDS) {
    for (const form of forms) {
      it(`plan field ${field}: "${form}" and "${form.replace(/\s+/g, "")}" read the same`, () => {
        // Parsing identity (no numeric source needed: both spellings must give one value).
        const key = fixture.slice(0, fixture.indexOf(":"));
        const spaced = read(planWith(fixture, `${key}: "${form}"`));
        const tight = read(planWith(fixture, `${key}: "${form.replace(/\s+/g, "")}"`));
        expect(spaced).toBeGreaterThan(0);
        expect(tight).toBe(spaced);
      });
    }
  }
});

type PlanOf = ReturnType<typeof parsePlanText>;

describe("errors stay located", () => {
  it("the plan file names file, line and field; the command line names the option; both exit 2", async () => {
    // Error format of the README ("Commands": one line, `file:line:field: message`, exit 2).
    const line = FIXTURE_TEXT.split("\n").findIndex((l) => l.includes('reference: "1450 psig @ 70 F"')) + 1;
    expect(() => planWith('reference: "1450 psig @ 70 F"', 'reference: "1450 psi@70F"')).toThrow(
      `plan.yaml:${line}:profiles[0].precharge.reference: "1450 psi": a bare "psi" is a pressure difference`,
    );
    const run = await runCli(["precharge", "--ref", "1450 psi@70F", "--at", "50F"]);
    expect(run.code).toBe(2);
    expect(run.err).toMatch(/^coldsoak: --ref: "1450 psi": a bare "psi" is a pressure difference/);
    const band = await runCli(["band", planFile, "--from", "-40 X"]);
    expect(band.code).toBe(2);
    expect(band.err).toMatch(/^coldsoak: --from: "-40 X": unknown or missing unit "X"/);
  });
});

let dir = "";
let planFile = "";
beforeAll(async () => {
  dir = await mkdtemp(join(tmpdir(), "coldsoak-grammar-"));
  planFile = join(dir, "plan.yaml");
  await writeFile(planFile, FIXTURE_TEXT);
});
afterAll(async () => {
  await rm(dir, { recursive: true, force: true });
});
