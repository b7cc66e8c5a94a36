import { describe, expect, it } from "vitest";
import { idealGas, N2_MOLAR_MASS_KG_MOL, realGas } from "../../src/physics/nitrogen.js";
import {
  cascadeFill,
  cylinderGas,
  cylinderPressureAbsPa,
  cylindersForDemand,
  drawFromCylinders,
  fullCylinder,
  gasToAddMol,
  isCylinderSpent,
  type SupplySpec,
  usableMolPerCylinder,
} from "../../src/physics/supply.js";
import {
  cToK,
  fToK,
  M3_PER_FT3,
  M3_PER_IN3,
  N2_SCF_DENSITY_KG_M3,
  PA_PER_PSI,
} from "../../src/units/index.js";

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

// The cylinder figures below are re-derived twice: with the project's equation of state (Span et al.
// 2000, physics/nitrogen.ts, checked against the paper's tables in nitrogen.test.ts) and by the
// independent 40-digit calculation tests/physics/crosscheck/span2000_check.py (mpmath, numerical
// derivatives, from ../shared/reference/nitrogen-span2000.json), whose output span2000_check.out reads
// "full kg 10.04677 scf 305.749", "residual kg 5.950199 usable kg 4.096569 usable % 40.775",
// "full at -30 C reads psig 1998.655", "-30 C, residual at 1500 psig: usable kg 2.434227",
// "line at -30 C psig 1134.838; residual at line + 50 psi: usable kg 4.031768". Gauge = absolute −
// 101.325 kPa (standard atmosphere).
const ATM = 101325;
const psigAbs = (psig: number) => psig * PA_PER_PSI + ATM;
const absPsig = (pa: number) => (pa - ATM) / PA_PER_PSI;
const kg = (mol: number) => mol * N2_MOLAR_MASS_KG_MOL;
const cylinder49: SupplySpec = {
  cylinderWaterVolumeM3: 49.9e-3,
  fillAbsPa: psigAbs(2640),
  fillTempK: fToK(70),
  transferDifferentialPa: 50 * PA_PER_PSI,
  hoseVolumeM3: 0,
};

describe("full, residual and usable gas of a cylinder (docs/methods.md §7)", () => {
  it("49.9 L at 2640 psig and 70 °F holds 10.05 kg; spent at 1450 + 50 psig it gives 4.10 kg (40.8 %)", () => {
    const g = cylinderGas(realGas, cylinder49, psigAbs(1450), fToK(70));
    expect(kg(g.fullMol)).toBeCloseTo(10.0468, 3); // crosscheck: 10.04677 kg
    expect(kg(g.residualMol)).toBeCloseTo(5.9502, 3); // crosscheck: 5.950199 kg
    expect(kg(g.usableMol)).toBeCloseTo(4.0966, 3); // crosscheck: 4.096569 kg
    expect((100 * g.usableMol) / g.fullMol).toBeCloseTo(40.78, 1); // crosscheck: 40.775 %
    expect(absPsig(g.fullAbsPa)).toBeCloseTo(2640, 6); // filled at 70 °F: the fill pressure itself
    expect(absPsig(g.residualAbsPa)).toBeCloseTo(1500, 9);
    // About 306 scf at 13.80 scf/lb; an industrial cylinder of this size is commonly rated at about
    // 300 scf (common practice, from memory).
    const scf = kg(g.fullMol) / N2_SCF_DENSITY_KG_M3 / M3_PER_FT3;
    expect(scf).toBeCloseTo(305.75, 1); // crosscheck: 305.749 scf
    expect(Math.abs(scf / 300 - 1)).toBeLessThan(0.03);
    expect(usableMolPerCylinder(realGas, cylinder49, psigAbs(1450), fToK(70))).toBe(g.usableMol);
  });

  it("the same cylinder at −30 °C reads 1998.7 psig and gives 2.43 kg spent at 1500 psig, 4.03 kg at the line", () => {
    const t = cToK(-30);
    const fixed = cylinderGas(realGas, cylinder49, psigAbs(1450), t);
    expect(absPsig(fixed.fullAbsPa)).toBeCloseTo(1998.66, 1); // crosscheck: 1998.655 psig
    expect(kg(fixed.fullMol)).toBeCloseTo(10.0468, 3); // the same gas, colder
    expect(kg(fixed.usableMol)).toBeCloseTo(2.4342, 3); // crosscheck: 2.434227 kg
    // The target falls with the temperature: the 1450 psig @ 70 °F line at −30 °C.
    const lineAbs = realGas.pressurePa(realGas.densityMolM3(psigAbs(1450), fToK(70)), t);
    expect(absPsig(lineAbs)).toBeCloseTo(1134.84, 1); // crosscheck: 1134.838 psig
    const onLine = cylinderGas(realGas, cylinder49, lineAbs, t);
    expect(kg(onLine.usableMol)).toBeCloseTo(4.0318, 3); // crosscheck: 4.031768 kg
    // A cylinder filled warm holds less usable gas in the cold (both ways of setting the target).
    expect(onLine.usableMol).toBeLessThan(
      cylinderGas(realGas, cylinder49, psigAbs(1450), fToK(70)).usableMol,
    );
  });

  it("a fill below the spent pressure gives nothing usable", () => {
    // Definition (docs/methods.md §7): residual capped at the fill, usable = full − residual ≥ 0.
    const g = cylinderGas(realGas, { ...cylinder49, fillAbsPa: psigAbs(1400) }, psigAbs(1450), fToK(70));
    expect(g.usableMol).toBe(0);
    expect(g.residualMol).toBe(g.fullMol);
  });
});

describe("full recharge from vented (docs/methods.md §7)", () => {
  it("adds the precharge reference's amount minus ρ(local atmosphere, T)·V0, gas and site at T", () => {
    // Physics identity (mass balance; the isothermal cascade ends on the target amount). Demo profile's
    // gas side: 250 in³ serviced to 1200 psig @ 70 °F; crosscheck: adds 0.3889626 kg at 70 °F and
    // 0.3881877 kg at −20 °C, the vented gas being 1.207 % and 1.404 % of the charge, so "from empty"
    // is not exact.
    const v0 = 250 * M3_PER_IN3;
    const refMol = realGas.densityMolM3(psigAbs(1200), fToK(70)) * v0;
    for (const [tempK, addsKg, ventedPct] of [
      [fToK(70), 0.38896, 1.207],
      [cToK(-20), 0.38819, 1.404],
    ] as const) {
      const fromMol = realGas.densityMolM3(ATM, tempK) * v0;
      const r = cascadeFill(
        realGas,
        [fullCylinder(realGas, cylinder49)],
        v0,
        fromMol,
        refMol,
        tempK,
        cylinder49,
      );
      expect(r.reachedTarget).toBe(true);
      expect(r.addedMol).toBeCloseTo(refMol - fromMol, 9);
      expect(kg(r.addedMol)).toBeCloseTo(addsKg, 4);
      expect((100 * fromMol) / refMol).toBeCloseTo(ventedPct, 2);
    }
  });
});

describe("other uses of the cylinders (docs/methods.md §7)", () => {
  it("draw the lowest-pressure cylinder down to the floor first, conserving gas; a short pool says so", () => {
    // Ideal-mode hand calculation (PV = nRT at 300 K, RT = 2494.353 J/mol): floor 10.2 MPa in 50 L holds
    // 204.462 mol. Cylinder A at 12 MPa (240.544 mol) gives 36.082 mol, B at 20 MPa (400.906 mol) the
    // rest of a 50 mol draw, 13.918 mol, leaving 386.988 mol.
    const a = { waterVolumeM3: 0.05, amountMol: (12e6 * 0.05) / RT };
    const b = { waterVolumeM3: 0.05, amountMol: (20e6 * 0.05) / RT };
    const r = drawFromCylinders(idealGas, [b, a], 50, 10.2e6, T);
    expect(r.reachedAmount).toBe(true);
    expect(r.drawnMol).toBeCloseTo(50, 9);
    expect(r.cylinders[1]!.amountMol).toBeCloseTo(204.462, 2);
    expect(r.cylinders[0]!.amountMol).toBeCloseTo(386.988, 2);
    expect(b.amountMol).toBe((20e6 * 0.05) / RT); // input not changed
    const short = drawFromCylinders(idealGas, [a], 50, 10.2e6, T);
    expect(short.reachedAmount).toBe(false);
    expect(short.drawnMol).toBeCloseTo(36.082, 2);
    expect(() => drawFromCylinders(idealGas, [a], -1, 10.2e6, T)).toThrow(/amountMol/);
  });
});
