import { describe, expect, it } from "vitest";
import { InputError } from "../../src/errors.js";
import {
  absToGaugePa,
  fToK,
  gaugeToAbsPa,
  in3ToM3,
  kgToLb,
  kgToMol,
  kToF,
  lbToKg,
  molToNormalM3,
  molToScf,
  PA_PER_PSI,
  parsePressure,
  parseTemperature,
  standardAtmospherePa,
} from "../../src/physics/units.js";

describe("units", () => {
  it("exact unit definitions", () => {
    // 1 psi = 6894.757 Pa, 1 in³ = 16.387064 cm³, 1 lb = 0.45359237 kg, 32 °F = 273.15 K (NIST SP 811, from memory)
    expect(PA_PER_PSI).toBeCloseTo(6894.757, 3);
    expect(in3ToM3(1)).toBeCloseTo(16.387064e-6, 12);
    expect(lbToKg(1)).toBe(0.45359237);
    expect(kgToLb(lbToKg(3))).toBeCloseTo(3, 12);
    expect(fToK(32)).toBeCloseTo(273.15, 12);
    expect(fToK(-40)).toBeCloseTo(233.15, 12);
    expect(kToF(373.15)).toBeCloseTo(212, 12);
  });

  it("1 lb of nitrogen is 13.80 scf at 70 °F and 14.696 psia", () => {
    // Common compressed-gas conversion (from memory), within 0.2 %.
    const scf = molToScf(kgToMol(lbToKg(1)));
    expect(Math.abs(scf / 13.8 - 1)).toBeLessThan(0.002);
  });

  it("1 kg of nitrogen is 0.800 normal m³ (0 °C, 101.325 kPa)", () => {
    // Ideal-gas molar volume 22.414 L/mol at 0 °C, 101.325 kPa (from memory): 1000/28.0135 × 22.414 L = 0.8001 m³
    expect(molToNormalM3(kgToMol(1))).toBeCloseTo(0.8001, 3);
  });

  it("standard atmosphere", () => {
    // ISO 2533 (from memory): 101.325 kPa at sea level, 84.56 kPa at 1500 m, 89.87 kPa at 1000 m.
    expect(standardAtmospherePa(0)).toBeCloseTo(101325, 6);
    expect(standardAtmospherePa(1500) / 1000).toBeCloseTo(84.56, 2);
    expect(standardAtmospherePa(1000) / 1000).toBeCloseTo(89.87, 1);
    expect(() => standardAtmospherePa(20000)).toThrow(/elevationM: 20000 m/);
  });

  it("gauge and absolute", () => {
    // Definition: gauge = absolute − local atmospheric pressure (product brief, section 3)
    expect(gaugeToAbsPa(1e6, 101325)).toBe(1101325);
    expect(absToGaugePa(1101325, 101325)).toBe(1e6);
    expect(() => gaugeToAbsPa(1e6, -3)).toThrow(/atmPa: -3 Pa/);
  });

  it("parses pressures with explicit gauge or absolute units", () => {
    // Unit grammar of issue 3 / product brief, section 3: psig, bar, kPa gauge; psia, bara, kPaa absolute.
    expect(parsePressure("1450psig")).toEqual({ pa: 1450 * PA_PER_PSI, isGauge: true });
    expect(parsePressure("14.696 psia")).toEqual({ pa: 14.696 * PA_PER_PSI, isGauge: false });
    expect(parsePressure("100bar")).toEqual({ pa: 100e5, isGauge: true });
    expect(parsePressure("100bara")).toEqual({ pa: 100e5, isGauge: false });
    expect(parsePressure("2000kPaa")).toEqual({ pa: 2e6, isGauge: false });
    expect(parsePressure("2000kPa")).toEqual({ pa: 2e6, isGauge: true });
    expect(parsePressure("20MPa")).toEqual({ pa: 20e6, isGauge: true });
    expect(() => parsePressure("1450psi")).toThrow(InputError);
    expect(() => parsePressure("1450")).toThrow(/e\.g\. 1450psig/);
    expect(() => parsePressure("abc psig")).toThrow(InputError);
  });

  it("parses temperatures", () => {
    // °F/°C/K definitions (NIST SP 811, from memory)
    expect(parseTemperature("70F")).toBeCloseTo(294.261, 3);
    expect(parseTemperature("-40C")).toBeCloseTo(233.15, 9);
    expect(parseTemperature("294K")).toBe(294);
    expect(parseTemperature("21 °C")).toBeCloseTo(294.15, 9);
    expect(() => parseTemperature("70")).toThrow(/e\.g\. 70F/);
    expect(() => parseTemperature("-500F")).toThrow(/below absolute zero/);
  });
});
