import { describe, expect, it } from "vitest";
import { N2_MOLAR_MASS_KG_MOL, realGas } from "../../src/physics/nitrogen.js";
import * as units from "../../src/units/index.js";

describe("conversion factors", () => {
  it("match NIST SP 811 (2008), Appendix B.8", () => {
    // NIST SP 811 (2008), Appendix B.8 (from memory): pound-force per square inch = 6.894757 E+03 Pa;
    // cubic inch = 1.6387064 E−05 m³ (exact); cubic foot = 2.831685 E−02 m³; gallon (U.S.) =
    // 3.785412 E−03 m³; pound = 4.5359237 E−01 kg (exact); pound-force = 4.448222 N;
    // foot pound-force = 1.355818 J; atmosphere, standard = 1.01325 E+05 Pa (exact).
    expect(units.PA_PER_PSI).toBeCloseTo(6894.757, 3);
    expect(units.PA_PER_PSI).toBeCloseTo(6894.757293168, 9);
    expect(units.M3_PER_IN3).toBeCloseTo(1.6387064e-5, 17);
    expect(units.M3_PER_FT3).toBeCloseTo(0.028316846592, 15);
    expect(units.M3_PER_US_GALLON).toBeCloseTo(3.785411784e-3, 15);
    expect(units.KG_PER_LB).toBe(0.45359237);
    expect(units.N_PER_LBF).toBeCloseTo(4.448222, 6);
    expect(units.J_PER_FT_LBF).toBeCloseTo(1.355818, 6);
    expect(units.STANDARD_ATMOSPHERE_PA).toBe(101325);
  });

  it("relate °F, °C and K as NIST SP 811 defines them", () => {
    // NIST SP 811 (2008), 4.2.1.1 and Appendix B.8 (from memory): T/K = t/°C + 273.15;
    // t/°C = (t/°F − 32)/1.8. Fixed points: 32 °F = 0 °C, 212 °F = 100 °C, −40 °F = −40 °C.
    expect(units.cToK(0)).toBe(273.15);
    expect(units.kToC(273.15)).toBe(0);
    expect(units.fToK(32)).toBeCloseTo(273.15, 12);
    expect(units.fToK(-40)).toBeCloseTo(233.15, 12);
    expect(units.kToF(373.15)).toBeCloseTo(212, 12);
    expect(units.cToF(100)).toBe(212);
    expect(units.cToF(-40)).toBe(-40);
  });

  it("uses the mean Gregorian month for rates per month", () => {
    // Gregorian calendar: 146 097 days in 400 years, so a mean month is 146097/4800 d = 30.436875 d.
    expect(units.S_PER_MONTH / 86400).toBeCloseTo(30.436875, 12);
  });

  it("defines the normal m³ and the scf of nitrogen by the reference equation's density", () => {
    // Span et al. (2000) equation (physics/nitrogen.ts, itself checked against the paper's tables in
    // tests/physics/nitrogen.test.ts) at the reference conditions: 0 °C, 101.325 kPa (DIN 1343) and
    // 70 °F, 14.696 psia; the constants carry 7 significant digits.
    const density = (pPa: number, tK: number) => realGas.densityMolM3(pPa, tK) * N2_MOLAR_MASS_KG_MOL;
    const normal = density(units.NORMAL_PRESSURE_PA, units.NORMAL_TEMP_K);
    const scf = density(units.SCF_PRESSURE_PA, units.SCF_TEMP_K);
    expect(Math.abs(units.N2_NORMAL_DENSITY_KG_M3 / normal - 1)).toBeLessThan(5e-7);
    expect(Math.abs(units.N2_SCF_DENSITY_KG_M3 / scf - 1)).toBeLessThan(5e-7);
    // NIST Chemistry WebBook, nitrogen at 0 °C and 1 atm (from memory): 1.2504 kg/m³.
    expect(units.N2_NORMAL_DENSITY_KG_M3).toBeCloseTo(1.2504, 4);
  });
});
