import { describe, expect, it } from "vitest";
import { gasAmountMol, startDischarge } from "../../src/physics/accumulator.js";
import { tabulatedGas } from "../../src/physics/gasTable.js";
import { realGas } from "../../src/physics/nitrogen.js";
import { dischargeGrid } from "../../src/plan/dischargeGrid.js";
import { PA_PER_PSI } from "../../src/units/index.js";

describe("interpolated start discharges", () => {
  it("stay within 0.5 % of the delivered energy of the exact real-gas discharge", () => {
    // Reference: the physics module's exact isentropic discharge (Span et al. 2000); the tolerance is
    // this project's accuracy budget for the interpolation (common practice, no source).
    const model = tabulatedGas(realGas);
    const geometry = { v0M3: 4.916e-3, vminM3: 0.983e-3 };
    const atm = 101325;
    const starter = { minUsefulAbsPa: 1000 * PA_PER_PSI + atm, returnAbsPa: atm };
    const n0 = gasAmountMol(model, 1450 * PA_PER_PSI + atm, 294.26, geometry.v0M3);
    const grid = dischargeGrid(model, geometry, starter, n0);
    const out = new Float64Array(2);
    let worst = 0;
    for (let i = 0; i < 60; i++) {
      const tempK = 233 + ((i * 37) % 70) + 0.37;
      const n = n0 * (0.93 + ((i * 13) % 14) * 0.01 + 0.0021);
      const vol =
        geometry.vminM3 + (0.15 + ((i * 7) % 11) * 0.05 + 0.013) * (geometry.v0M3 - geometry.vminM3);
      const exact = startDischarge(model, geometry, 1, n, tempK, vol, starter);
      grid.lookup(n, tempK, vol, out);
      if (exact.hydraulicEnergyJ > 1000) {
        worst = Math.max(worst, Math.abs(out[0]! - exact.hydraulicEnergyJ) / exact.hydraulicEnergyJ);
      } else {
        expect(Math.abs(out[0]! - exact.hydraulicEnergyJ)).toBeLessThan(100);
      }
    }
    console.log(`discharge grid: worst relative error ${(worst * 100).toFixed(3)} %`);
    expect(worst).toBeLessThan(0.005);
  });
});
