/** One base's results: the atmosphere used and the curves at it (docs/methods.md §1; README, Outputs). */
import { describe, expect, it } from "vitest";
import { runPlan } from "../../src/plan/engine.js";
import { fToK, PA_PER_PSI } from "../../src/units/index.js";
import { fixturePlan, fixtureStay, HOUR_MS, oneLitreUnit, syntheticClimate } from "./helpers.js";

describe("the atmosphere of a base", () => {
  const from = Date.UTC(2014, 0, 1);
  const atmPa = 90_000; // a base about 1 km up (ISO 2533 gives 89.9 kPa at 1000 m)
  const climate = new Map([
    ["North Field", syntheticClimate(() => 0, from, from + 10 * 24 * HOUR_MS, { atmPa })],
  ]);
  const stays = [fixtureStay("A1", "2027-01-02", "2027-01-05")];
  const { results } = runPlan(fixturePlan(oneLitreUnit), stays, climate);
  const base = results.bases[0]!;

  it("is reported with its source and station", () => {
    expect(base.atmosphere).toEqual({
      pressureKPaAbsolute: 90,
      source: "standard atmosphere",
      station: "999999-99999",
      elevationM: 0,
    });
  });

  it("moves the base's curves and leaves the profile-level curves at 101.325 kPa", () => {
    expect(results.profiles[0]!.atmosphereKPaAbsolute).toBe(101.325);
    const curves = base.profileCurves[0]!;
    expect(curves.name).toBe("standard");
    expect(curves.atmosphereKPaAbsolute).toBe(90);
    // Ideal gas at constant volume (Gay-Lussac): P_abs(T) = (P_ref,gauge + atm)·T/T_ref, so the ideal
    // line reads (1450 psi + atm)·T/T_ref − atm in gauge, whatever atmosphere it is drawn for.
    const refAbs = (atmKPa: number) => (1450 * PA_PER_PSI) / 1000 + atmKPa;
    for (const [rows, atmKPa] of [
      [curves.prechargeLine, 90],
      [results.profiles[0]!.prechargeLine, 101.325],
    ] as const) {
      for (const r of rows) {
        const expected = (refAbs(atmKPa) * (r.tempC + 273.15)) / fToK(70) - atmKPa;
        expect(r.idealPrechargeKPaGauge).toBeCloseTo(expected, 6);
      }
    }
  });
});
