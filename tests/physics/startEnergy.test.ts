import { describe, expect, it } from "vitest";
import {
  type AccumulatorGeometry,
  chargedState,
  gasAmountMol,
  startDischarge,
  trappedState,
} from "../../src/physics/accumulator.js";
import { realGas } from "../../src/physics/nitrogen.js";
import { equilibriumStartEnergyJ, trappedStartEnergyJ } from "../../src/physics/startEnergy.js";
import { cToK, fToK, PA_PER_PSI } from "../../src/units/index.js";

// Gauge pressures at sea-level atmospheric pressure, as in tests/physics/crosscheck.
const ATM = 101325;
const psigToAbs = (psig: number) => psig * PA_PER_PSI + ATM;
const starter = { minUsefulAbsPa: psigToAbs(1000), returnAbsPa: ATM };

describe("start energy at equilibrium", () => {
  const five: AccumulatorGeometry = { v0M3: 5e-3, vminM3: 1.5e-3 };

  it("5 L unit, 1450 psig at 70 °F, charged to 3000 psig at 70 °F, 3000 → 1000 psig: 25.40 kJ", () => {
    // tests/physics/accumulator.test.ts "from 3000 psig at 70 °F to 1000 psig", cross-checked in
    // tests/physics/crosscheck/span2000_check.out (mpmath from the Span et al. 2000 coefficients):
    // hydraulic 25.4014 kJ; ± 0.3 %.
    const n = gasAmountMol(realGas, psigToAbs(1450), fToK(70), five.v0M3);
    const at = (count: number) =>
      equilibriumStartEnergyJ(realGas, { geometry: five, count, starter }, n, fToK(70), psigToAbs(3000));
    expect(Math.abs(at(1) / 25401.4 - 1)).toBeLessThan(0.003);
    // Two units in parallel: twice the energy (docs/methods.md §3).
    expect(at(2) / at(1)).toBeCloseTo(2, 12);
  });

  it("1 L unit charged to 3000 psig at 0 °C: 4.413 kJ", () => {
    // tests/physics/crosscheck/relief_check.out, "start energy from the charged state": 4.413 kJ
    // (1 L, 1450 psig at 70 °F, isentropic to 1000 psig, return at atmospheric; mpmath, Span et al. 2000).
    const one: AccumulatorGeometry = { v0M3: 1e-3, vminM3: 0.1e-3 };
    const n = gasAmountMol(realGas, psigToAbs(1450), fToK(70), one.v0M3);
    const e = equilibriumStartEnergyJ(
      realGas,
      { geometry: one, count: 1, starter },
      n,
      cToK(0),
      psigToAbs(3000),
    );
    expect(e / 1000).toBeCloseTo(4.413, 3);
  });

  it("a precharge at or above the system pressure stores no fluid: no energy", () => {
    // Definition (docs/methods.md §3): the piston rests on its fluid-side stop.
    const one: AccumulatorGeometry = { v0M3: 1e-3, vminM3: 0.1e-3 };
    const n = gasAmountMol(realGas, psigToAbs(1450), fToK(70), one.v0M3);
    expect(
      equilibriumStartEnergyJ(realGas, { geometry: one, count: 1, starter }, n, fToK(70), psigToAbs(1400)),
    ).toBe(0);
  });
});

describe("start energy after an overnight drop", () => {
  const one: AccumulatorGeometry = { v0M3: 1e-3, vminM3: 0.1e-3 };
  const fluid = { alphaPerK: 8e-4, bulkModulusPa: 1.5e9, lineVolumeM3: 0.2e-3 };
  const n = gasAmountMol(realGas, psigToAbs(1450), fToK(70), one.v0M3);
  const units = { geometry: one, count: 1, starter };

  it("charged at 20 °C, cooled to −20 °C: the discharge starts from 2311.6 psig", () => {
    // The trapped state: tests/physics/crosscheck/span2000_check.out, "1 L with fluid alpha/K/0.2 L":
    // 2311.565 psig (mpmath, the fluid model of docs/methods.md §3). The energy from a gas at that pressure
    // and −20 °C, discharged by the same isentropic law, must agree to 0.1 %.
    const e = trappedStartEnergyJ(realGas, units, fluid, n, cToK(20), cToK(-20), psigToAbs(3000));
    const v = n / realGas.densityMolM3(psigToAbs(2311.565), cToK(-20));
    const fromCheck = startDischarge(realGas, one, 1, n, cToK(-20), v, starter).hydraulicEnergyJ;
    expect(Math.abs(e / fromCheck - 1)).toBeLessThan(0.001);
    // A trapped charge cooled by 40 K holds less energy than one charged at the morning's temperature
    // (its gas pressure fell below system pressure; physics, docs/methods.md §3).
    expect(e).toBeLessThan(equilibriumStartEnergyJ(realGas, units, n, cToK(-20), psigToAbs(3000)));
  });

  it("no drop is the equilibrium energy", () => {
    // Identity: with no temperature change the trapped state is the charged state (docs/methods.md §3).
    const c = chargedState(realGas, one, fluid, n, cToK(5), psigToAbs(3000));
    expect(trappedState(realGas, one, fluid, c, cToK(5), n).gasPressureAbsPa / psigToAbs(3000)).toBeCloseTo(
      1,
      9,
    );
    const trapped = trappedStartEnergyJ(realGas, units, fluid, n, cToK(5), cToK(5), psigToAbs(3000));
    const equilibrium = equilibriumStartEnergyJ(realGas, units, n, cToK(5), psigToAbs(3000));
    expect(trapped / equilibrium).toBeCloseTo(1, 6);
  });
});
