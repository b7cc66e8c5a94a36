import { existsSync, readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import { InputError } from "../../src/errors.js";
import {
  gasModel,
  idealGas,
  isentropicToPressure,
  isentropicToVolume,
  N2_CRITICAL_TEMP_K,
  N2_MOLAR_MASS_KG_MOL,
  realGas,
} from "../../src/physics/nitrogen.js";

const refFile = fileURLToPath(new URL("../../../shared/reference/nitrogen-span2000.json", import.meta.url));

interface CheckPoint {
  T_K: number;
  P_MPa: number;
  rho_mol_per_dm3: number;
  cv: number;
  cp: number;
  w: number;
}

/** Half a unit of the last printed digit of a published value (as stored in the JSON file). */
function halfLastDigit(x: number): number {
  const s = String(x);
  const dot = s.indexOf(".");
  const decimals = dot < 0 ? 0 : s.length - dot - 1;
  return 0.5 * 10 ** -decimals;
}

describe.skipIf(!existsSync(refFile))("Span et al. (2000) check values", () => {
  const ref = existsSync(refFile) ? JSON.parse(readFileSync(refFile, "utf8")) : null;
  const points: CheckPoint[] = ref ? ref.check_values_single_phase.points : [];

  it("uses the paper's molar mass", () => {
    // Span et al. (2000), via reference/nitrogen-span2000.json: M = 28.01348 g/mol
    expect(N2_MOLAR_MASS_KG_MOL * 1000).toBe(ref.constants.M_g_per_mol);
  });

  // Span et al. (2000), p. 1410: every single-phase point to the last published digit.
  for (const p of points) {
    it(`${p.T_K} K, ${p.P_MPa} MPa: ρ, cv, cp, w as published`, () => {
      const liquidLike = p.T_K < N2_CRITICAL_TEMP_K && p.rho_mol_per_dm3 > 11.18;
      const rho = realGas.densityMolM3(
        p.P_MPa * 1e6,
        p.T_K,
        liquidLike ? { guessMolM3: 30000 } : undefined, // liquid-like start (the file's note)
      );
      expect(Math.abs(rho / 1000 - p.rho_mol_per_dm3)).toBeLessThanOrEqual(halfLastDigit(p.rho_mol_per_dm3));
      expect(Math.abs(realGas.cvJMolK(rho, p.T_K) - p.cv)).toBeLessThanOrEqual(halfLastDigit(p.cv));
      expect(Math.abs(realGas.cpJMolK(rho, p.T_K) - p.cp)).toBeLessThanOrEqual(halfLastDigit(p.cp));
      expect(Math.abs(realGas.speedOfSoundMS(rho, p.T_K) - p.w)).toBeLessThanOrEqual(halfLastDigit(p.w));
      // Pressure from the density found returns the input pressure (consistency, no outside source).
      expect(realGas.pressurePa(rho, p.T_K) / (p.P_MPa * 1e6)).toBeCloseTo(1, 10);
    });
  }

  it("finds the stable liquid at 100 K, 5 MPa even without a liquid-like guess (lowest Gibbs energy)", () => {
    // Span et al. (2000), p. 1410: 25.436 mol/dm³ (compressed liquid)
    expect(realGas.densityMolM3(5e6, 100) / 1000).toBeCloseTo(25.436, 3);
  });
});

describe("nitrogen equation of state", () => {
  it("(Z − 1)/ρ at vanishing density changes sign between 320 K and 335 K (Boyle temperature)", () => {
    // Nitrogen's Boyle temperature is about 327 K (from memory).
    const b = (t: number) => (realGas.compressibility(1e-3, t) - 1) / 1e-3;
    expect(b(320)).toBeLessThan(0);
    expect(b(335)).toBeGreaterThan(0);
  });

  it("ideal model: Z = 1, P = ρRT, cp − cv = R", () => {
    // Ideal-gas law and Mayer's relation (textbook thermodynamics); R = 8.31451 J/(mol K) (Span et al. 2000)
    expect(idealGas.compressibility(5000, 250)).toBe(1);
    expect(idealGas.pressurePa(1000, 300)).toBeCloseTo(1000 * 8.31451 * 300, 6);
    expect(idealGas.cpJMolK(1000, 300) - idealGas.cvJMolK(1000, 300)).toBeCloseTo(8.31451, 9);
    // cp0 of nitrogen near room temperature is about 3.5 R (from memory)
    expect(idealGas.cpJMolK(1, 300) / 8.31451).toBeCloseTo(3.5, 2);
    expect(gasModel("ideal")).toBe(idealGas);
    expect(gasModel("real")).toBe(realGas);
  });

  it("thermodynamic consistency: (∂u/∂ρ)_T = (P − T(∂P/∂T)_ρ)/ρ² (Maxwell relation)", () => {
    // Exact identity of any Helmholtz equation (textbook thermodynamics), checked by finite differences.
    const rho = 8000;
    const t = 280;
    const h = 1e-3;
    const dudrho =
      (realGas.internalEnergyJMol(rho + h * rho, t) - realGas.internalEnergyJMol(rho - h * rho, t)) /
      (2 * h * rho);
    const dPdT = (realGas.pressurePa(rho, t + 0.01) - realGas.pressurePa(rho, t - 0.01)) / 0.02;
    const rhs = (realGas.pressurePa(rho, t) - t * dPdT) / (rho * rho);
    expect(dudrho / rhs).toBeCloseTo(1, 5);
    // (∂s/∂T)_ρ = cv/T
    const dsdT = (realGas.entropyJMolK(rho, t + 0.01) - realGas.entropyJMolK(rho, t - 0.01)) / 0.02;
    expect(dsdT / (realGas.cvJMolK(rho, t) / t)).toBeCloseTo(1, 6);
    // pressureAndSlope agrees with a finite difference of pressurePa
    const out = new Float64Array(2);
    realGas.pressureAndSlope(rho, t, out);
    const fd = (realGas.pressurePa(rho + 1, t) - realGas.pressurePa(rho - 1, t)) / 2;
    expect(out[1]! / fd).toBeCloseTo(1, 7);
    expect(out[0]).toBe(realGas.pressurePa(rho, t));
  });

  it("isentropic change keeps entropy; to-volume and to-pressure agree", () => {
    // Definition of an isentropic state change (textbook thermodynamics); internal consistency check.
    const n = 2;
    const t1 = 294.26;
    const v1 = 2.5e-3;
    const s1 = realGas.entropyJMolK(n / v1, t1);
    const st = isentropicToVolume(realGas, n, t1, v1, 4.5e-3);
    expect(realGas.entropyJMolK(st.densityMolM3, st.tempK)).toBeCloseTo(s1, 9);
    expect(st.tempK).toBeLessThan(t1);
    const back = isentropicToPressure(realGas, n / v1, t1, st.pressurePa);
    expect(back.tempK).toBeCloseTo(st.tempK, 7);
    expect(back.densityMolM3 / st.densityMolM3).toBeCloseTo(1, 9);
  });

  it("rejects states outside the equation's validity, naming the value", () => {
    // Validity range from the paper's title: 63.151–1000 K, up to 2200 MPa (Span et al. 2000).
    expect(() => realGas.pressurePa(100, 50)).toThrow(InputError);
    expect(() => realGas.pressurePa(100, 50)).toThrow(/tempK: 50 K/);
    expect(() => realGas.densityMolM3(1e6, 1200)).toThrow(/tempK: 1200 K/);
    expect(() => realGas.densityMolM3(2300e6, 300)).toThrow(/pressurePa: 2300000000 Pa/);
    expect(() => realGas.densityMolM3(-5, 300)).toThrow(/pressurePa: -5 Pa/);
    expect(() => realGas.pressurePa(-1, 300)).toThrow(/densityMolM3: -1/);
    expect(() => idealGas.densityMolM3(1e6, 20)).toThrow(/tempK: 20 K/);
    expect(() => realGas.pressurePa(Number.NaN, 300)).toThrow(/densityMolM3: NaN/);
  });
});
