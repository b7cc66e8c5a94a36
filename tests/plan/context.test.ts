/** The profile context: gas loss through the physics function, and contexts built once per run. */
import { describe, expect, it } from "vitest";
import { gasLossMolPerS } from "../../src/physics/accumulator.js";
import { tabulatedGas } from "../../src/physics/gasTable.js";
import { idealGas, realGas } from "../../src/physics/nitrogen.js";
import { ProfileContexts, profileContext } from "../../src/plan/context.js";
import { absPa, S_PER_MONTH } from "../../src/units/index.js";
import { ATM_PA, fixturePlan } from "./helpers.js";

describe("gas loss of a profile", () => {
  const profile = fixturePlan().profiles[0]!;
  const refAbsPa = absPa(profile.precharge.reference.pressure, ATM_PA);
  const refTempK = profile.precharge.reference.tempK;
  const v0M3 = profile.accumulator.gasVolumeEmpty;

  it("is the monthly pressure drop at the reference as an amount, ΔP·V0/(R·T) per month for an ideal gas", () => {
    // Ideal gas law (textbook): n = P·V/(R·T), so a drop ΔP per month at V0 and T_ref is ΔP·V0/(R·T_ref)
    // per month; the plan's rate is ΔP per second. R of Span et al. (2000), 8.31451 J/(mol·K).
    const ctx = profileContext(profile, idealGas, ATM_PA, false);
    const expected = (profile.gasLoss.rate * v0M3) / (8.31451 * refTempK);
    expect(ctx.gasLossMolS / expected).toBeCloseTo(1, 9);
  });

  it("is what the physics function gives for the month's drop (real gas, the simulation's table)", () => {
    // Definition of the slow gas loss, docs/methods.md, "Slow gas loss"; month = 365.2425/12 days.
    const model = tabulatedGas(realGas);
    const ctx = profileContext(profile, model, ATM_PA, false);
    const monthDropPa = profile.gasLoss.rate * S_PER_MONTH;
    expect(ctx.gasLossMolS).toBe(gasLossMolPerS(model, refAbsPa, refTempK, v0M3, monthDropPa));
  });
});

describe("profile contexts of a run", () => {
  it("are built once per profile, atmosphere and option; the two options share their tables", () => {
    // Identity of cached values (no number asserted).
    const profile = fixturePlan().profiles[0]!;
    const contexts = new ProfileContexts(tabulatedGas(realGas));
    const one = contexts.get(profile, ATM_PA, false);
    const two = contexts.get(profile, ATM_PA, true);
    expect(contexts.get(profile, ATM_PA, false)).toBe(one);
    expect(two).not.toBe(one);
    expect(two.count).toBe(profile.coldStartOption.count);
    expect(two.bandTable).toBe(one.bandTable);
    expect(two.dischargeGrid).toBe(one.dischargeGrid);
    const elsewhere = contexts.get(profile, 80_000, false);
    expect(elsewhere).not.toBe(one);
    expect(elsewhere.bandTable).not.toBe(one.bandTable);
  });
});
