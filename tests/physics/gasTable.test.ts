import { describe, expect, it } from "vitest";
import { gasAmountMol, gasVolumeM3, recharge, startDischarge } from "../../src/physics/accumulator.js";
import { tabulatedGas } from "../../src/physics/gasTable.js";
import { idealGas, realGas } from "../../src/physics/nitrogen.js";

describe("interpolation table", () => {
  const table = tabulatedGas(realGas);

  it("stays within 0.05 % of the full equation over −60…+80 °C and 0…40 MPa", () => {
    // Simulation accuracy budget (common practice, no source); the full equation
    // is Span et al. (2000). Sample points are deliberately off the table's nodes.
    let worstP = 0;
    let worstRho = 0;
    for (let tc = -60; tc <= 80; tc += 3.7) {
      const t = tc + 273.15;
      for (let pMPa = 0.013; pMPa <= 40; pMPa += 0.397) {
        const p = pMPa * 1e6;
        const rho = realGas.densityMolM3(p, t);
        worstP = Math.max(worstP, Math.abs(table.pressurePa(rho, t) / p - 1));
        worstRho = Math.max(worstRho, Math.abs(table.densityMolM3(p, t) / rho - 1));
      }
      // the corners of the range
      for (const p of [40e6, 0.101325e6]) {
        const rho = realGas.densityMolM3(p, t);
        worstP = Math.max(worstP, Math.abs(table.pressurePa(rho, t) / p - 1));
        worstRho = Math.max(worstRho, Math.abs(table.densityMolM3(p, t) / rho - 1));
      }
    }
    expect(worstP).toBeLessThan(5e-4);
    expect(worstRho).toBeLessThan(5e-4);
  });

  it("density and pressure lookups are inverse to each other, slopes match the interpolant", () => {
    // Internal consistency (no outside source).
    const out = new Float64Array(2);
    for (const [p, t] of [
      [20.8e6, 294.26],
      [5e6, 230],
      [35e6, 340],
    ] as const) {
      const rho = table.densityMolM3(p, t);
      expect(table.pressurePa(rho, t) / p).toBeCloseTo(1, 9);
      table.pressureAndSlope(rho, t, out);
      const fd = (table.pressurePa(rho + 0.01, t) - table.pressurePa(rho - 0.01, t)) / 0.02;
      expect(out[1]! / fd).toBeCloseTo(1, 5);
    }
  });

  it("falls back to the full equation outside its grid and is built once per model", () => {
    // Internal behaviour (no outside source).
    expect(table.kind).toBe("table");
    expect(table.densityMolM3(60e6, 300)).toBe(realGas.densityMolM3(60e6, 300));
    expect(table.pressurePa(5000, 100)).toBe(realGas.pressurePa(5000, 100));
    expect(tabulatedGas(realGas)).toBe(table);
    expect(tabulatedGas(table)).toBe(table);
    const ideal = tabulatedGas(idealGas);
    expect(ideal.pressurePa(1000, 300) / idealGas.pressurePa(1000, 300)).toBeCloseTo(1, 12);
    expect(() => table.pressurePa(-3, 300)).toThrow(/densityMolM3: -3/);
  });

  it("entropy, internal energy and cv follow the full equation closely over the range", () => {
    // Full equation: Span et al. (2000). Tolerances: 0.002 J/(mol K) in s, 0.5 J/mol in u, 0.05 % in cv
    // (small against the start-energy budget; common practice, no source).
    const out = new Float64Array(6);
    const ref = new Float64Array(6);
    for (let tc = -60; tc <= 80; tc += 7.3) {
      for (let pMPa = 0.5; pMPa <= 40; pMPa += 1.93) {
        const t = tc + 273.15;
        const rho = realGas.densityMolM3(pMPa * 1e6, t);
        table.stateProperties(rho, t, out);
        realGas.stateProperties(rho, t, ref);
        expect(Math.abs(out[3]! - ref[3]!)).toBeLessThan(0.002);
        expect(Math.abs(out[4]! - ref[4]!)).toBeLessThan(0.5);
        expect(Math.abs(out[5]! / ref[5]! - 1)).toBeLessThan(5e-4);
        expect(Math.abs(out[2]! / ref[2]! - 1)).toBeLessThan(5e-4);
      }
    }
  });

  it("start discharge and recharge with the table agree with the full equation within 0.1 %", () => {
    // Full equation: Span et al. (2000); 0.1 % budget (common practice, no source). 5 L unit, 1450 psig
    // at 70 °F, charged to 3000 psig, expanded to 1000 psig (the 5 L unit of tests/physics/accumulator.test.ts).
    const atm = 101325;
    const psi = 6894.757293168361;
    const geometry = { v0M3: 5e-3, vminM3: 1.5e-3 };
    const starter = { minUsefulAbsPa: 1000 * psi + atm, returnAbsPa: atm };
    for (const tempK of [233.15, 294.26, 330]) {
      const n = gasAmountMol(realGas, 1450 * psi + atm, 294.26, geometry.v0M3);
      const v = gasVolumeM3(realGas, n, tempK, 3000 * psi + atm);
      const full = startDischarge(realGas, geometry, 1, n, tempK, v, starter);
      const fast = startDischarge(table, geometry, 1, n, tempK, v, starter);
      expect(Math.abs(fast.hydraulicEnergyJ / full.hydraulicEnergyJ - 1)).toBeLessThan(1e-3);
      expect(Math.abs(fast.fluidDeliveredM3 / full.fluidDeliveredM3 - 1)).toBeLessThan(1e-3);
      const pump = {
        curve: [
          { gaugePa: 0, flowM3S: 2e-4 },
          { gaugePa: 25e6, flowM3S: 1e-4 },
        ],
        timerS: 600,
        atmPa: atm,
      };
      const rFull = recharge(realGas, geometry, 2, n, tempK, full.end.gasVolumeM3, 3000 * psi + atm, pump);
      const rFast = recharge(table, geometry, 2, n, tempK, full.end.gasVolumeM3, 3000 * psi + atm, pump);
      expect(Math.abs(rFast.timeS / rFull.timeS - 1)).toBeLessThan(1e-3);
    }
  });
});
