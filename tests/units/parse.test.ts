import { describe, expect, it } from "vitest";
import * as units from "../../src/units/index.js";

describe("quantity grammar", () => {
  it("parses point pressures with explicit gauge or absolute units, with or without a space", () => {
    // Unit definitions: 1 psi = 6894.757293168 Pa (NIST SP 811, Appendix B.8); 1 bar = 100 kPa
    // (SI brochure). psig, bar, barg, kPa, kPag, MPa, MPag are gauge; psia, bara, kPaa, MPaa absolute.
    expect(units.parsePointPressure("1450psig")).toEqual({ pa: 1450 * units.PA_PER_PSI, isGauge: true });
    expect(units.parsePointPressure("14.696 psia")).toEqual({
      pa: 14.696 * units.PA_PER_PSI,
      isGauge: false,
    });
    expect(units.parsePointPressure("100bar")).toEqual({ pa: 100e5, isGauge: true });
    expect(units.parsePointPressure("100 barg")).toEqual({ pa: 100e5, isGauge: true });
    expect(units.parsePointPressure("100bara")).toEqual({ pa: 100e5, isGauge: false });
    expect(units.parsePointPressure("2000kPaa")).toEqual({ pa: 2e6, isGauge: false });
    expect(units.parsePointPressure("2000 KPA")).toEqual({ pa: 2e6, isGauge: true });
    expect(units.parsePointPressure("20MPa")).toEqual({ pa: 20e6, isGauge: true });
    expect(() => units.parsePointPressure("1450psi")).toThrow(/bare "psi" is a pressure difference/);
    expect(() => units.parsePointPressure("1450")).toThrow(units.QuantityError);
    expect(() => units.parsePointPressure("abc psig")).toThrow(/is not a number with a unit/);
    expect(() => units.parsePointPressure("-5 psia")).toThrow(/absolute pressure cannot be negative/);
  });

  it("parses temperatures in F, C and K, with °, deg or nothing before the letter", () => {
    // °F and °C scale definitions (NIST SP 811, 4.2.1.1 and Appendix B.8): 70 °F = 294.261 K.
    expect(units.parseTemperatureK("70F")).toBeCloseTo(294.261, 3);
    expect(units.parseTemperatureK("70 °F")).toBe(units.fToK(70));
    expect(units.parseTemperatureK("70degF")).toBe(units.fToK(70));
    expect(units.parseTemperatureK("-40C")).toBeCloseTo(233.15, 9);
    expect(units.parseTemperatureK("21 °C")).toBeCloseTo(294.15, 9);
    expect(units.parseTemperatureK("294K")).toBe(294);
    expect(() => units.parseTemperatureK("70")).toThrow(/unknown or missing unit ""/);
    expect(() => units.parseTemperatureK("-500F")).toThrow(/below absolute zero/);
  });

  it("parses temperature differences and values on a display scale", () => {
    // A temperature difference of 1 K is 9/5 °F (NIST SP 811, Appendix B.8).
    expect(units.parseTemperatureDifferenceK("18 F")).toBeCloseTo(10, 12);
    expect(units.parseTemperatureDifferenceK("10C")).toBe(10);
    expect(units.parseTemperatureOnScale("-40", "F")).toBe(-40);
    expect(units.parseTemperatureOnScale("-40C", "F")).toBeCloseTo(-40, 12);
    expect(units.parseTemperatureOnScale("32 F", "C")).toBeCloseTo(0, 12);
    expect(units.parseTemperatureDifferenceOnScale("5", "C")).toBe(5);
    expect(units.parseTemperatureDifferenceOnScale("10 C", "F")).toBeCloseTo(18, 12);
  });

  it("parses a pressure at a temperature with or without spaces around @", () => {
    // Same unit definitions as above.
    const a = units.parsePressureAt("1450 psig @ 70 F");
    expect(a).toEqual(units.parsePressureAt("1450psig@70F"));
    expect(a.pressure).toEqual({ pa: 1450 * units.PA_PER_PSI, isGauge: true });
    expect(a.tempK).toBe(units.fToK(70));
    expect(units.parsePressureAt("100 barg @ 21 C")).toEqual(units.parsePressureAt("100barg@21C"));
    expect(() => units.parsePressureAt("1450 psig")).toThrow(/expected a pressure at a temperature/);
    expect(() => units.parsePressureAt("1450 psig @ 70 F @ 1 K")).toThrow(units.QuantityError);
  });

  it("parses an amount of nitrogen as a mass or a gas volume at standard conditions, and weeks", () => {
    // 1 lb = 0.45359237 kg exactly (NIST SP 811, Appendix B.8).
    expect(units.parseGasAmountKg("1 lb")).toBe(units.KG_PER_LB);
    expect(units.parseGasAmountKg("250 g")).toBeCloseTo(0.25, 12);
    // Industrial gas conversion tables: 1 lb of nitrogen = 13.80 scf at 70 °F, 1 atm (from memory).
    expect(units.parseGasAmountKg("13.80 scf") / units.KG_PER_LB).toBeCloseTo(1, 2);
    // Same tables: 1 kg of nitrogen = 0.800 normal m³ at 0 °C, 1 atm (from memory).
    expect(units.parseGasAmountKg("0.8 Nm3")).toBeCloseTo(1, 2);
    expect(units.parseGasAmountKg("0.8 normal m³")).toBe(units.parseGasAmountKg("0.8 Nm3"));
    expect(() => units.parseGasAmountKg("2 psi")).toThrow(/unknown or missing unit "psi"/);
    expect(() => units.parseGasAmountKg("-1 kg")).toThrow(/cannot be negative/);
    // A week is 7 days of 86 400 s (definition).
    expect(units.parseTimeS("4 weeks")).toBe(28 * 86400);
    expect(units.parseTimeS("1 week")).toBe(7 * 86400);
  });

  it("parses differences, volumes, durations, energies, flows, expansion and rates into SI", () => {
    // NIST SP 811, Appendix B.8: 1 in³ = 16.387064 cm³; 1 gal (US) = 231 in³;
    // 1 ft·lbf = 1.355818 J; mean Gregorian month = 30.436875 d.
    expect(units.parsePressureDifference("50 psi")).toBeCloseTo(50 * units.PA_PER_PSI, 9);
    expect(units.parsePressureDifference("1.4 GPa")).toBe(1.4e9);
    expect(units.parsePressureDifference("2 ksi")).toBeCloseTo(2000 * units.PA_PER_PSI, 6);
    expect(units.parseVolumeM3("300 in3")).toBeCloseTo(300 * units.M3_PER_IN3, 15);
    expect(units.parseVolumeM3("300in³")).toBeCloseTo(300 * units.M3_PER_IN3, 15);
    expect(units.parseVolumeM3("1 gal")).toBeCloseTo(231 * units.M3_PER_IN3, 15);
    expect(units.parseVolumeM3("4.9 L")).toBeCloseTo(4.9e-3, 15);
    expect(units.parseTimeS("2 h")).toBe(7200);
    expect(units.parseTimeS("3min")).toBe(180);
    expect(units.parseEnergyJ("30 kJ")).toBe(30000);
    expect(units.parseEnergyJ("1000 ft-lbf")).toBeCloseTo(1355.818, 3);
    expect(units.parseFlowM3S("1.2 L/min")).toBeCloseTo(2e-5, 15);
    expect(units.parseFlowM3S("1 gpm")).toBeCloseTo((231 * units.M3_PER_IN3) / 60, 15);
    expect(units.parseExpansionPerK("8e-4 /K")).toBe(8e-4);
    expect(units.parseExpansionPerK("4.4e-4 /F")).toBeCloseTo(7.92e-4, 15);
    expect(units.parsePressureRatePaS("5 psi/month")).toBeCloseTo(
      (5 * units.PA_PER_PSI) / (30.436875 * 86400),
      12,
    );
    expect(() => units.parseVolumeM3("3 furlongs")).toThrow(/unknown or missing unit "furlongs"/);
  });
});
