import { describe, expect, it } from "vitest";
import { tabulatedGas } from "../../src/physics/gasTable.js";
import { idealGas, realGas } from "../../src/physics/nitrogen.js";

describe("interpolation table", () => {
  const table = tabulatedGas(realGas);

  it("stays within 0.05 % of the full equation over −60…+80 °C and 0…40 MPa", () => {
    // Requirement of issue 3 (simulation accuracy budget, common practice, no source); the full equation
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
    expect(table.pressurePa(5000, 150)).toBe(realGas.pressurePa(5000, 150));
    expect(tabulatedGas(realGas)).toBe(table);
    expect(tabulatedGas(table)).toBe(table);
    const ideal = tabulatedGas(idealGas);
    expect(ideal.pressurePa(1000, 300) / idealGas.pressurePa(1000, 300)).toBeCloseTo(1, 12);
    expect(() => table.pressurePa(-3, 300)).toThrow(/densityMolM3: -3/);
  });
});
