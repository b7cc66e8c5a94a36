import { describe, expect, it } from "vitest";
import { standardAtmospherePa } from "../../src/physics/atmosphere.js";

describe("standard atmosphere", () => {
  it("gives the ISO 2533 pressures at sea level, 1000 m and 1500 m", () => {
    // ISO 2533 (from memory): 101.325 kPa at sea level, 84.56 kPa at 1500 m, 89.87 kPa at 1000 m.
    expect(standardAtmospherePa(0)).toBeCloseTo(101325, 6);
    expect(standardAtmospherePa(1500) / 1000).toBeCloseTo(84.56, 2);
    expect(standardAtmospherePa(1000) / 1000).toBeCloseTo(89.87, 1);
    expect(() => standardAtmospherePa(20000)).toThrow(/elevationM: 20000 m/);
  });
});
