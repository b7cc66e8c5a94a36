import { describe, expect, it } from "vitest";
import { idealGas, realGas } from "../../src/physics/nitrogen.js";
import {
  cascadeFill,
  cylinderPressureAbsPa,
  cylindersForDemand,
  fullCylinder,
  gasToAddMol,
  isCylinderSpent,
  type SupplySpec,
} from "../../src/physics/supply.js";

// Hand calculation in ideal mode (ideal gas law PV = nRT at one temperature, so P·V is conserved in a
// transfer; R = 8.31451 J/(mol K), Span et al. 2000). Numbers written out:
//   T = 300 K, RT = 2494.353 J/mol. Accumulator gas volume 5 L at 8 MPa (16.0362 mol), target 10 MPa
//   (20.0452 mol). Hose 0.1 L, so receiver = 5.1 L. Differential 0.2 MPa. Cylinders of 50 L: A at 9 MPa,
//   B at 20 MPa (given in the order B, A).
//   A first (lower pressure): 9e6·0.05 + 8e6·0.005 = 490 000 Pa·m³ = (P + 0.2e6)·0.05 + P·0.0051
//     → P_receiver = 480 000/0.0551 = 8 711 433.76 Pa; A ends at 8 911 433.76 Pa; target not reached.
//   B finishes: needs (10e6 − 8 711 433.76)·0.0051 = 6 571.69 Pa·m³ → B drops 131 433.76 Pa → 19 868 566.24 Pa.
//   Added to the accumulator: (10e6 − 8e6)·0.005/RT = 4.00906 mol; vented hose: 10e6·0.0001/RT = 0.400906 mol.
const T = 300;
const RT = 8.31451 * T;
const spec: SupplySpec = {
  cylinderWaterVolumeM3: 0.05,
  fillAbsPa: 20e6,
  fillTempK: T,
  transferDifferentialPa: 0.2e6,
  hoseVolumeM3: 0.1e-3,
};

describe("cylinder cascade", () => {
  it("matches the hand calculation in ideal mode", () => {
    const a = { waterVolumeM3: 0.05, amountMol: (9e6 * 0.05) / RT };
    const b = { waterVolumeM3: 0.05, amountMol: (20e6 * 0.05) / RT };
    const from = (8e6 * 0.005) / RT;
    const target = (10e6 * 0.005) / RT;
    const r = cascadeFill(idealGas, [b, a], 0.005, from, target, T, spec);
    expect(r.reachedTarget).toBe(true);
    expect(cylinderPressureAbsPa(idealGas, r.cylinders[1]!, T)).toBeCloseTo(8911433.76, 0);
    expect(cylinderPressureAbsPa(idealGas, r.cylinders[0]!, T)).toBeCloseTo(19868566.24, 0);
    expect(r.addedMol).toBeCloseTo(4.00906, 4);
    expect(r.ventedMol).toBeCloseTo(0.400906, 5);
    // inputs not mutated; gas conserved: cylinders give added + vented
    expect(b.amountMol).toBe((20e6 * 0.05) / RT);
    const given = a.amountMol + b.amountMol - r.cylinders[0]!.amountMol - r.cylinders[1]!.amountMol;
    expect(given).toBeCloseTo(r.addedMol + r.ventedMol, 9);
  });

  it("a cylinder below accumulator pressure + differential gives nothing; the target may be missed", () => {
    // Cascade rule of docs/methods.md §7 (same hand-calculation numbers).
    const a = { waterVolumeM3: 0.05, amountMol: (8.1e6 * 0.05) / RT };
    const r = cascadeFill(idealGas, [a], 0.005, (8e6 * 0.005) / RT, (10e6 * 0.005) / RT, T, spec);
    expect(r.addedMol).toBe(0);
    expect(r.ventedMol).toBe(0);
    expect(r.reachedTarget).toBe(false);
  });

  it("already at or above target: no gas, no hose loss", () => {
    // Definition (docs/methods.md §7).
    expect(gasToAddMol(5, 4)).toBe(0);
    expect(gasToAddMol(4, 5)).toBe(1);
    const r = cascadeFill(idealGas, [fullCylinder(idealGas, spec)], 0.005, 20, 19, T, spec);
    expect(r.addedMol).toBe(0);
    expect(r.ventedMol).toBe(0);
  });

  it("real gas cascade conserves gas and ends at the target", () => {
    // Conservation (no outside source); real gas by Span et al. (2000).
    const cyl = fullCylinder(realGas, spec);
    const from = realGas.densityMolM3(8e6, T) * 0.005;
    const target = realGas.densityMolM3(10e6, T) * 0.005;
    const r = cascadeFill(realGas, [cyl], 0.005, from, target, T, spec);
    expect(r.reachedTarget).toBe(true);
    expect(realGas.pressurePa((from + r.addedMol) / 0.005, T) / 10e6).toBeCloseTo(1, 9);
    expect(cyl.amountMol - r.cylinders[0]!.amountMol).toBeCloseTo(r.addedMol + r.ventedMol, 9);
  });
});

describe("cylinder counts", () => {
  it("spent below the lowest target + differential; count for a demand by hand calculation", () => {
    // Ideal mode hand calculation: full 20 MPa × 50 L at 300 K = 400.906 mol; spent at 10.2 MPa = 204.462 mol;
    // usable 196.444 mol; 500 mol needs ⌈2.545⌉ = 3 cylinders.
    const full = fullCylinder(idealGas, spec);
    expect(full.amountMol).toBeCloseTo(400.906, 2);
    expect(
      isCylinderSpent(idealGas, { waterVolumeM3: 0.05, amountMol: (10.1e6 * 0.05) / RT }, T, 10e6, 0.2e6),
    ).toBe(true);
    expect(
      isCylinderSpent(idealGas, { waterVolumeM3: 0.05, amountMol: (10.3e6 * 0.05) / RT }, T, 10e6, 0.2e6),
    ).toBe(false);
    expect(cylindersForDemand(idealGas, 500, spec, 10e6, T)).toBe(3);
    expect(cylindersForDemand(idealGas, 196, spec, 10e6, T)).toBe(1);
    expect(cylindersForDemand(idealGas, 0, spec, 10e6, T)).toBe(0);
  });

  it("bad parameters name the parameter", () => {
    // Documented errors (README, exit codes).
    expect(() => cylindersForDemand(idealGas, -1, spec, 10e6, T)).toThrow(/demandMol: -1/);
    expect(() => cascadeFill(idealGas, [], -0.005, 1, 2, T, spec)).toThrow(/accumulatorVolumeM3/);
    expect(() => fullCylinder(idealGas, { ...spec, hoseVolumeM3: -1 })).toThrow(/hoseVolumeM3/);
    expect(() => cylindersForDemand(idealGas, 10, spec, 25e6, T)).toThrow(/fillAbsPa/);
  });
});
