import { mkdtemp, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { FIXTURE_TEXT } from "../plan/helpers.js";
import { runCli } from "./runCli.js";

let dir = "";
beforeAll(async () => {
  dir = await mkdtemp(join(tmpdir(), "coldsoak-band-"));
  await writeFile(join(dir, "plan.yaml"), FIXTURE_TEXT);
  await writeFile(join(dir, "si.yaml"), FIXTURE_TEXT.replace("units: us ", "units: si "));
});
afterAll(async () => {
  await rm(dir, { recursive: true, force: true });
});

const run = runCli;

const PSI_KPA = 6.894757293168; // NIST SP 811: 1 psi = 6.894 757 kPa

describe("coldsoak band", () => {
  it("--json: the issue's shape; at the reference temperature the line is the reference pressure", async () => {
    const r = await run([
      "band",
      join(dir, "plan.yaml"),
      "--from",
      "-60",
      "--to",
      "140",
      "--step",
      "10",
      "--json",
    ]);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(j.profile).toBe("standard");
    expect(j.rows).toHaveLength(21);
    expect(Object.keys(j.rows[0])).toEqual([
      "tempC",
      "prechargeKPaGauge",
      "prechargeLowKPaGauge",
      "prechargeHighKPaGauge",
      "readingLowPct",
      "readingNominalPct",
      "readingHighPct",
      "idealReadingNominalPct",
    ]);
    const at70 = j.rows.find((x: { tempC: number }) => Math.abs(x.tempC - (70 - 32) / 1.8) < 1e-6);
    // Definition (docs/methods.md §3): the precharge line passes through the reference "1450 psig @ 70 F",
    // the tolerance lines through ±50 psi there.
    expect(at70.prechargeKPaGauge).toBeCloseTo(1450 * PSI_KPA, 3);
    expect(at70.prechargeLowKPaGauge).toBeCloseTo(1400 * PSI_KPA, 3);
    expect(at70.prechargeHighKPaGauge).toBeCloseTo(1500 * PSI_KPA, 3);
    // Ideal gas law at one temperature (Boyle): Vgas/V0 = P_ref,abs / P_sys,abs, so
    // nominal reading = (1 − P_ref/P_sys)·V0/(V0 − Vmin) with V0 = 300 in³, Vmin = 60 in³.
    const atm = 101.325;
    const ideal = (1 - (1450 * PSI_KPA + atm) / (3000 * PSI_KPA + atm)) * (300 / 240) * 100;
    expect(at70.idealReadingNominalPct).toBeCloseTo(ideal, 4);
    // The band is ordered and the line rises with temperature.
    for (const row of j.rows) expect(row.readingLowPct).toBeLessThanOrEqual(row.readingHighPct);
    expect(j.rows[20].prechargeKPaGauge).toBeGreaterThan(j.rows[0].prechargeKPaGauge);
  });

  it("defaults to −50 … 60 °C in steps of 10 for an SI plan, and prints a table without --json", async () => {
    const j = JSON.parse((await run(["band", join(dir, "si.yaml"), "--json"])).out);
    expect(j.rows.map((x: { tempC: number }) => x.tempC)).toEqual([
      -50, -40, -30, -20, -10, 0, 10, 20, 30, 40, 50, 60,
    ]);
    const t = await run(["band", join(dir, "si.yaml")]);
    expect(t.out).toMatch(/temp °C\s+precharge bar/);
  });

  it("usage errors exit 2 with one line", async () => {
    const a = await run(["band", join(dir, "plan.yaml"), "--profile", "light"]);
    expect(a.code).toBe(2);
    expect(a.err).toBe('coldsoak: --profile: unknown profile "light"; the plan has "standard"\n');
    const b = await run(["band", join(dir, "plan.yaml"), "--step", "0"]);
    expect(b.code).toBe(2);
    const c = await run(["band", join(dir, "missing.yaml")]);
    expect(c.code).toBe(2);
    expect(c.err).toMatch(/missing\.yaml: cannot read the plan file/);
  });
});
