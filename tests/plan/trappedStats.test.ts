/**
 * Thermal relief of the trapped charge in the simulation and its statistics by base-month
 * (docs/methods.md §3, "Thermal relief"; README, Outputs: `bases[].trappedCharge`, trapped_charge.csv).
 */
import { describe, expect, it } from "vitest";
import { runPlan } from "../../src/plan/engine.js";
import { PA_PER_PSI } from "../../src/units/index.js";
import {
  ATM_PA,
  fixturePlan,
  fixtureStay,
  HOUR_MS,
  oneLitreUnit,
  simulateUtcStay,
  syntheticClimate,
} from "./helpers.js";

// The unit and figures of the physics tests' relief check values (Span et al. 2000 and the trapped-fluid
// model of docs/methods.md §3, computed independently by tests/physics/crosscheck/relief_check.py):
// charged to 3000 psig at 0 °C, warmed to 30 °C: 3645.8 psig; relief at 3300 psig lets out 39.4 mL
// and the charge cooled back to 0 °C reads 2736.5 psig.
const DAY = Date.UTC(2014, 0, 1);
/** 0 °C at arrival midnight, 30 °C from 01:00 to 11:00, 0 °C again from 12:00 (UTC). */
const warmDay = (ms: number) => {
  const h = (ms - DAY) / HOUR_MS;
  return h >= 1 && h <= 11 ? 30 : 0;
};
const psig = (kPaGauge: number) => (kPaGauge * 1000) / PA_PER_PSI;

function planWith(relief: string | null) {
  return fixturePlan((t) => {
    oneLitreUnit(t);
    if (relief === null) delete t.profiles[0].reliefPressure;
    else t.profiles[0].reliefPressure = relief;
    t.operations.startTimes = ["23:00"];
  });
}

describe("thermal relief in the simulation", () => {
  const climate = syntheticClimate(warmDay, DAY, DAY + 48 * HOUR_MS);
  const stay = { arrive: "2027-01-01", depart: "2027-01-02", climateYear: 2014 };

  it("without a valve the warmed charge peaks at 3645.8 psig and comes back to 3000 psig", () => {
    const out = simulateUtcStay(planWith(null), climate.series, stay);
    expect(psig((out.peakTrappedAbsPa[1]! - ATM_PA) / 1000)).toBeCloseTo(3645.8, 0);
    expect(out.reliefs).toHaveLength(0);
    // Reversible without relief: the same state at the same temperature (docs/methods.md §3).
    expect(psig(out.preflights[0]!.gasKPaGauge)).toBeCloseTo(3000, 0);
  });

  it("with relief at 3300 psig: one opening, 39.4 mL, the morning charge 2736.5 psig", () => {
    const out = simulateUtcStay(planWith("3300 psig"), climate.series, stay);
    expect(out.reliefs).toHaveLength(1);
    expect(out.reliefs[0]!.month).toBe(1);
    expect(out.reliefs[0]!.relievedM3 * 1e6).toBeCloseTo(39.4, 0);
    expect(psig((out.peakTrappedAbsPa[1]! - ATM_PA) / 1000)).toBeCloseTo(3300, 3);
    // The simulation uses the interpolation table of the equation (< 0.005 %): ± 0.5 psi.
    expect(Math.abs(psig(out.preflights[0]!.gasKPaGauge) - 2736.5)).toBeLessThan(0.5);
  });

  it("a relief pressure must lie above the system high (plan file error at its line)", () => {
    expect(() => planWith("3100 psig")).toThrow(
      /plan\.yaml:\d+:profiles\[0\]\.reliefPressure: .*system\.high/,
    );
  });
});

describe("trapped charge by base-month", () => {
  const climate = new Map([["North Field", syntheticClimate(warmDay, DAY, DAY + 60 * 24 * HOUR_MS)]]);
  // A1 meets the warm day in January; A2 stays in February at a steady 0 °C.
  const stays = [
    fixtureStay("A1", "2027-01-01", "2027-01-02"),
    fixtureStay("A2", "2027-02-01", "2027-02-02"),
  ];

  it("counts openings and fluid per month and year; a profile without a valve above 1.1 × high is warned about", () => {
    const relieved = runPlan(planWith("3300 psig"), stays, climate).results;
    const jan = relieved.bases[0]!.trappedCharge[0]!;
    expect(jan.reliefEvents).toBe(1);
    expect(jan.reliefEventsPerYear).toBe(1); // one climate year used
    expect(jan.relievedL * 1000).toBeCloseTo(39.4, 0);
    expect(psig(jan.peakTrappedKPaGauge!)).toBeCloseTo(3300, 3);
    // February: charged to 3000 psig at 0 °C and kept there (arrival charge, docs/methods.md §5).
    expect(psig(relieved.bases[0]!.trappedCharge[1]!.peakTrappedKPaGauge!)).toBeCloseTo(3000, 3);
    expect(relieved.bases[0]!.trappedCharge[2]!.peakTrappedKPaGauge).toBeNull(); // no stay in March
    expect(relieved.warnings.some((w) => /relief/.test(w))).toBe(false);

    // 3645.8 psig > 1.1 × 3150 psig = 3465 psig (arithmetic): one warning for the base-month.
    const open = runPlan(planWith(null), stays, climate).results;
    const warned = open.warnings.filter((w) => /no thermal relief valve/.test(w));
    expect(warned).toHaveLength(1);
    expect(warned[0]).toMatch(/North Field", Jan: trapped pressure up to 3,646 psig.*3,465 psig/);
  });
});
