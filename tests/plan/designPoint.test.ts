/**
 * The design point of a base and its design temperatures in the results (docs/methods.md, "Design
 * point", "Climate design temperatures"): the figures the engine puts in `bases[]`, each against its
 * definition or an independent calculation.
 */
import { describe, expect, it } from "vitest";
import { designTemperatures } from "../../src/climate/index.js";
import { realGas } from "../../src/physics/nitrogen.js";
import { afterDropBreakEven, defaultEnergyRangeK } from "../../src/plan/breakEven.js";
import { runPlan } from "../../src/plan/engine.js";
import { cToK, fToK, kToC, PA_PER_KPA } from "../../src/units/index.js";
import { fixturePlan, fixtureStay, oneLitreUnit, syntheticClimate } from "./helpers.js";

// The 1 L unit with a pump of constant flow (1 L/min at every pressure) and an invented requirement.
const plan = fixturePlan((t) => {
  oneLitreUnit(t);
  t.profiles[0].thermalTimeConstant = "1 h";
  t.profiles[0].pump = {
    curve: [
      { pressure: "0 psig", flow: "1 L/min" },
      { pressure: "3500 psig", flow: "1 L/min" },
    ],
    timer: "3 min",
  };
  t.profiles[0].startEnergy = [
    { ambient: "-40 F", energy: "5 kJ" },
    { ambient: "70 F", energy: "4 kJ" },
  ];
  t.climate.years = { from: 2014, to: 2015 };
  t.climate.coldThresholds = ["-20 C", "-30 C"];
});
// Two invented winters: a daily swing of ±7 K around a mean falling to −20 °C in January.
const climate = syntheticClimate(
  (t) => {
    const day = t / 86_400_000;
    return -5 - 15 * Math.cos((2 * Math.PI * (day - 15)) / 365.25) + 7 * Math.sin(2 * Math.PI * day);
  },
  Date.UTC(2014, 0, 1),
  Date.UTC(2016, 0, 1),
);
const stays = [fixtureStay("A01", "2027-01-01", "2027-03-01")];
const { results } = runPlan(plan, stays, new Map([["North Field", climate]]));
const base = results.bases[0]!;
const w = base.designWorksheets[0]!;

describe("design point of a base", () => {
  it("the cold design point is the base's 1-in-10-year coldest morning", () => {
    // Definition (docs/methods.md, "Design point").
    expect(w.designTempC).toBe(base.coldest1in10C);
    expect(w.profile).toBe("standard");
  });

  it("recharge after a start at a pump of constant flow: the fluid drawn × units ÷ flow", () => {
    // Common arithmetic: the isothermal recharge of the same gas at the same temperature back to the
    // system pressure returns the piston to the charged volume; each unit takes its fluid back through
    // one pump of 1 L/min shared by the units.
    const drawnL = w.gasVolumeEndL! - w.gasVolumeChargedL!;
    for (const r of w.recharge) {
      expect(r.reachedSystem).toBe(true);
      const flowLPerS = 1 / 60;
      expect(r.timeS).toBeCloseTo((drawnL * r.count) / flowLPerS, 3);
    }
    expect(w.recharge.map((r) => r.timerS)).toEqual([180, 360]); // 3 min; the option's 6 min (fixture)
  });

  it("precharge ratio: nominal line over nominal system pressure, both absolute", () => {
    // Definition; the base's atmosphere is 101.325 kPa (synthetic climate).
    const atm = base.atmosphere.pressureKPaAbsolute;
    const systemKPa = (3000 * 6894.757293168) / PA_PER_KPA; // 3000 psig (NIST SP 811: 1 psi = 6.894757 kPa)
    expect(w.prechargeRatio).toBeCloseTo((w.prechargeKPaGauge! + atm) / (systemKPa + atm), 9);
    expect(w.prechargeLowKPaGauge!).toBeLessThan(w.prechargeKPaGauge!);
    expect(w.prechargeHighKPaGauge!).toBeGreaterThan(w.prechargeKPaGauge!);
  });

  it("the drops are the median and P90 of the simulated overnight drops; the after-drop rows use them", () => {
    // Definition (docs/methods.md, "Design point"): type-7 quantiles of the drops of every stay and year.
    expect(w.dropTypicalC).not.toBeNull();
    expect(w.dropP90C!).toBeGreaterThan(w.dropTypicalC!);
    const range = defaultEnergyRangeK("us");
    expect(range.fromK).toBeCloseTo(fToK(-60), 9);
    const typical = afterDropBreakEven(plan.profiles[0]!, 101325, realGas, range, {
      drop: "typical",
      dropK: w.dropTypicalC!,
    });
    expect(base.designPoint.filter((r) => r.drop === "typical")).toEqual(typical);
    expect(base.designPoint).toHaveLength(24);
    const margins = w.margins.filter((m) => m.drop === "none");
    expect(margins.map((m) => m.count)).toEqual([1, 2]);
  });

  it("the design temperatures are those of the base's series over the plan's years, with its thresholds", () => {
    // Definition: the climate module's figures (checked by hand in tests/climate/designTemps.test.ts).
    const d = designTemperatures(climate.series, "UTC", {
      years: { from: 2014, to: 2015 },
      minYearShare: 0.8,
      coldThresholdsC: [-20, -30],
    });
    const r = base.designTemperatures;
    expect(r.annual996C).toBe(d.annual996C);
    expect(r.coldestMonth).toEqual(d.coldestMonth);
    expect(r.hoursBelow.map((h) => h.thresholdC)).toEqual([kToC(cToK(-20)), kToC(cToK(-30))]);
    expect(r.coldestHour.byYear).toEqual(d.coldestHour.byYear);
    expect(r.coldestMorningMeanC).toBeCloseTo(
      base.coldestMorningByYear.reduce((a, c) => a + c.tempC, 0) / base.coldestMorningByYear.length,
      9,
    );
  });
});
