import { mkdtemp, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { FIXTURE_TEXT } from "../plan/helpers.js";
import { runCli } from "./runCli.js";

let dir = "";
beforeAll(async () => {
  dir = await mkdtemp(join(tmpdir(), "coldsoak-energy-"));
  await writeFile(join(dir, "plan.yaml"), FIXTURE_TEXT);
  await writeFile(join(dir, "si.yaml"), FIXTURE_TEXT.replace("units: us ", "units: si "));
});
afterAll(async () => {
  await rm(dir, { recursive: true, force: true });
});

interface EnergyJson {
  profile: string;
  cases: { units: number; count: number; precharge: string; system: string }[];
  rows: { tempC: number; requiredJ: number; energyJ: number[] }[];
  breakEven: {
    units: number;
    precharge: string;
    system: string;
    ambientC: number | null;
    reason: string | null;
  }[];
  drop: null | { dropC: number; rows: { energyJ: number[] }[]; breakEven: { ambientC: number | null }[] };
}

describe("coldsoak energy", () => {
  it("--json: the fixture's 300 in³ unit delivers 24.98 kJ at 70 °F; requirement from the plan's table", async () => {
    const r = await runCli(["energy", join(dir, "plan.yaml"), "--json"]);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out) as EnergyJson;
    expect(j.profile).toBe("standard");
    expect(j.cases).toHaveLength(12);
    // −60 … 140 °F in steps of 10: the band command's default range (README).
    expect(j.rows).toHaveLength(21);
    const at70 = j.rows[13]!;
    expect(at70.tempC).toBeCloseTo((70 - 32) / 1.8, 5);
    // The 5 L unit's 25.4014 kJ (tests/physics/crosscheck/span2000_check.out) scaled by the volume ratio
    // 300 in³ / 5 L (an isentrope that reaches no stop scales with the gas amount; 1 in³ = 16.387064 cm³,
    // NIST SP 811): 24.975 kJ ± 0.3 %.
    const i = j.cases.findIndex((c) => c.units === 1 && c.precharge === "nominal" && c.system === "nominal");
    expect(Math.abs(at70.energyJ[i]! / 24975 - 1)).toBeLessThan(0.003);
    // Requirement: the plan's table, 30 kJ at −40 °F and 15 kJ at 70 °F (tests/fixtures/plan/minimal-plan.yaml).
    expect(j.rows[2]!.requiredJ).toBeCloseTo(30000, 6);
    expect(at70.requiredJ).toBeCloseTo(15000, 6);
    // Two units in parallel deliver twice one unit's energy at equilibrium (docs/methods.md §3).
    const two = j.cases.findIndex(
      (c) => c.units === 2 && c.precharge === "nominal" && c.system === "nominal",
    );
    expect(j.cases[two]!.count).toBe(2);
    expect(at70.energyJ[two]! / at70.energyJ[i]!).toBeCloseTo(2, 5);
    // The break-even lies between the rows where the margin changes sign (definition).
    const be = j.breakEven[i]!;
    expect(be.reason).toBeNull();
    const below = j.rows.filter((x) => x.tempC < be.ambientC!).at(-1)!;
    const above = j.rows.find((x) => x.tempC > be.ambientC!)!;
    expect(below.energyJ[i]!).toBeLessThan(below.requiredJ);
    expect(above.energyJ[i]!).toBeGreaterThanOrEqual(above.requiredJ);
    expect(j.drop).toBeNull();
  });

  it("--drop: less energy after the drop, warmer break-evens; SI plans print °C with the caution", async () => {
    const j = JSON.parse(
      (await runCli(["energy", join(dir, "si.yaml"), "--drop", "10", "--json"])).out,
    ) as EnergyJson;
    // A bare number is in the plan's unit: 10 K for an SI plan (README).
    expect(j.drop!.dropC).toBe(10);
    // Physics (docs/methods.md §3): a trapped charge cooled by the drop delivers less.
    for (const [k, row] of j.drop!.rows.entries())
      for (const [c, e] of row.energyJ.entries())
        expect(e).toBeLessThanOrEqual(j.rows[k]!.energyJ[c]! + 1e-6);
    for (const [c, r] of j.drop!.breakEven.entries()) {
      const eq = j.breakEven[c]!.ambientC;
      if (r.ambientC !== null && eq !== null) expect(r.ambientC).toBeGreaterThan(eq);
    }
    const t = await runCli(["energy", join(dir, "si.yaml"), "--step", "20"]);
    expect(t.code).toBe(0);
    expect(t.out).toMatch(/temp °C\s+required kJ/);
    expect(t.out).toMatch(/bar gauge/);
    expect(t.out).toMatch(/Model estimates, not servicing data/);
  });

  it("usage errors exit 2 with one line", async () => {
    const a = await runCli(["energy", join(dir, "plan.yaml"), "--profile", "light"]);
    expect(a.code).toBe(2);
    expect(a.err).toBe('coldsoak: --profile: unknown profile "light"; the plan has "standard"\n');
    const b = await runCli(["energy", join(dir, "plan.yaml"), "--drop", "warm"]);
    expect(b.code).toBe(2);
    expect(b.err).toMatch(/^coldsoak: --drop: /);
    expect(b.err.split("\n")).toHaveLength(2);
  });
});
