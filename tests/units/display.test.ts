import { describe, expect, it } from "vitest";
import {
  formatDisplay,
  formatMachine,
  N2_NORMAL_DENSITY_KG_M3,
  N2_SCF_DENSITY_KG_M3,
  pct,
  SI_UNITS,
  US_UNITS,
} from "../../src/units/index.js";

describe("display units", () => {
  it("matches NIST SP 811 for pressure, temperature, volume, mass and length", () => {
    // NIST SP 811 (2008), appendix B.8: 1 psi = 6.894757 kPa.
    expect(US_UNITS.pressure.convert(6.894757)).toBeCloseTo(1, 6);
    // Definition of the Celsius and Fahrenheit scales: −40 °C = −40 °F, 100 °C = 212 °F.
    expect(US_UNITS.temp.convert(-40)).toBeCloseTo(-40, 12);
    expect(US_UNITS.temp.convert(100)).toBeCloseTo(212, 12);
    // A difference of 10 °C is 18 °F (9/5 scale, no offset).
    expect(US_UNITS.tempDelta.convert(10)).toBeCloseTo(18, 12);
    // NIST SP 811, appendix B.8: 1 L = 61.02374 in³.
    expect(US_UNITS.volume.convert(1)).toBeCloseTo(61.02374, 4);
    // NIST SP 811, appendix B.8: 1 kg = 2.204623 lb.
    expect(US_UNITS.mass.convert(1)).toBeCloseTo(2.204623, 6);
    // NIST SP 811: 1 m = 3.280840 ft.
    expect(US_UNITS.length.convert(1)).toBeCloseTo(3.28084, 5);
    // SI brochure: 1 bar = 100 kPa exactly.
    expect(SI_UNITS.pressure.convert(250)).toBe(2.5);
  });

  it("uses nitrogen densities at standard conditions consistent with the gas law and common tables", () => {
    // Ideal-gas density p·M/(R·T): R = 8.314462618 J/(mol·K) (CODATA 2018), M = 28.0134 g/mol (IUPAC).
    const ideal = (pPa: number, tK: number) => (pPa * 0.0280134) / (8.314462618 * tK);
    // Nitrogen is within 0.1 % of ideal near 1 atm and room temperature (second virial coefficient
    // about −10 cm³/mol at 273 K: Dymond and Smith, "The Virial Coefficients of Pure Gases", from memory).
    expect(Math.abs(N2_NORMAL_DENSITY_KG_M3 / ideal(101325, 273.15) - 1)).toBeLessThan(1e-3);
    expect(Math.abs(N2_SCF_DENSITY_KG_M3 / ideal(101325, 294.2611) - 1)).toBeLessThan(1e-3);
    // Industrial gas conversion tables: 1 lb of nitrogen = 13.80 scf at 70 °F, 1 atm (from memory).
    expect(US_UNITS.gasVolume.convert(0.45359237)).toBeCloseTo(13.8, 1);
    // Same tables: 1 kg of nitrogen = 0.800 normal m³ at 0 °C, 1 atm (from memory).
    expect(SI_UNITS.gasVolume.convert(1)).toBeCloseTo(0.8, 2);
  });

  it("formats numbers with grouping, a true minus sign and a dash for missing values", () => {
    // Display convention of this report (common practice, no source).
    expect(formatDisplay(12345.678, 1)).toBe("12,345.7");
    expect(formatDisplay(-1234, 0)).toBe("\u22121,234");
    expect(formatDisplay(-0.01, 1)).toBe("0.0");
    expect(formatDisplay(null, 1)).toBe("–");
    expect(formatDisplay(Number.NaN, 1)).toBe("–");
    expect(pct(12.345)).toBe("12.3");
  });

  it("writes machine numbers plainly: no grouping, at most 6 decimals, ASCII minus", () => {
    // Text for CSV cells and JSON (common practice, no source): shortest form, stable across runs.
    expect(formatMachine(12345)).toBe("12345");
    expect(formatMachine(-1234.5)).toBe("-1234.5");
    expect(formatMachine(1 / 3)).toBe("0.333333");
    expect(formatMachine(-1e-9)).toBe("0");
    expect(formatMachine(0.1 + 0.2)).toBe("0.3");
  });
});
