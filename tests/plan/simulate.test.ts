import { describe, expect, it } from "vitest";
import { chargedState } from "../../src/physics/accumulator.js";
import { tabulatedGas } from "../../src/physics/gasTable.js";
import { realGas } from "../../src/physics/nitrogen.js";
import { profileContext } from "../../src/plan/context.js";
import { runPlan } from "../../src/plan/engine.js";
import { PA_PER_PSI } from "../../src/units/index.js";
import {
  ATM_PA,
  fixturePlan,
  HOUR_MS,
  oneLitreUnit,
  simulateUtcStay,
  syntheticClimate,
  type Tree,
} from "./helpers.js";

/** The 1 L unit of the physics tests (helpers.ts), with a pump that always finishes. */
function oneLitreUnitFullPump(t: Tree) {
  oneLitreUnit(t);
  const p = t.profiles[0];
  // A pump that always finishes within its timer, and a requirement far below delivery.
  p.pump = {
    curve: [
      { pressure: "0 psig", flow: "100 L/min" },
      { pressure: "3000 psig", flow: "100 L/min" },
    ],
    timer: "10 min",
  };
  p.startEnergy = [{ ambient: "-60 C", energy: "0.1 kJ" }];
}

describe("simulation physics identities", () => {
  it("constant temperature, no gas loss, complete recharge: no drop, no out-of-band, no short start", () => {
    // Physics identity (docs/methods.md §3): at one temperature with the fluid trapped and no gas loss,
    // the state after each recharge is the same equilibrium, so nothing moves overnight.
    const plan = fixturePlan((t) => {
      oneLitreUnitFullPump(t);
      t.profiles[0].thermalTimeConstant = "2 h";
      t.operations.startTimes = ["06:30", "13:00", "18:00"];
    });
    const from = Date.UTC(2014, 0, 1);
    const climate = new Map([["North Field", syntheticClimate(() => 5, from, Date.UTC(2015, 0, 1))]]);
    const stays = [
      {
        aircraft: "A1",
        base: "North Field",
        arrive: "2027-01-04",
        depart: "2027-02-15",
        coldStartOption: false,
        profile: "standard",
        line: 2,
      },
    ];
    const { results } = runPlan(plan, stays, climate);
    const b = results.bases[0]!;
    const jan = b.months[0]!;
    const feb = b.months[1]!;
    expect(jan.preflights + feb.preflights).toBe(42); // 4 January – 14 February: 42 days, all flown
    for (const m of [jan, feb]) {
      expect(m.belowBandPct).toBe(0);
      expect(m.aboveBandPct).toBe(0);
      expect(m.shortPctOne).toBe(0);
      expect(Math.abs(m.overnightDropKPaP90!)).toBeLessThan(1e-3);
      expect(Math.abs(m.overnightDropTempP90C!)).toBeLessThan(1e-9);
      expect(Math.abs(m.overnightDropReadingP90Pct!)).toBeLessThan(1e-6);
    }
    expect(b.outOfBandByHour.every((h) => h.outOfBandPct === null || h.outOfBandPct === 0)).toBe(true);
    expect(b.nitrogen.kgP95).toBe(0); // no gas loss, so no check finds the gas out of tolerance
  });

  it("20 °C at the last recharge, −20 °C by morning, lag zero: morning gas 2311.6 ± 1 psig", () => {
    // Computed independently from the equation of state (Span et al. 2000) and
    // the fluid model of docs/methods.md §3: 2311.6 psig ± 1.
    const plan = fixturePlan((t) => {
      oneLitreUnitFullPump(t);
      t.operations.startTimes = ["07:00", "18:00"];
    });
    const day2 = Date.UTC(2014, 0, 2);
    const climate = syntheticClimate(
      (ms) => (ms < day2 - 4 * HOUR_MS ? 20 : -20),
      Date.UTC(2014, 0, 1),
      Date.UTC(2014, 0, 4),
    );
    const out = simulateUtcStay(plan, climate.series, {
      arrive: "2027-01-01",
      depart: "2027-01-03",
      climateYear: 2014,
    });
    expect(out.preflights).toHaveLength(2);
    const morning = out.preflights[1]!;
    expect(morning.ambientC).toBe(-20);
    expect(Math.abs((morning.gasKPaGauge * 1000) / PA_PER_PSI - 2311.6)).toBeLessThanOrEqual(1);
    // The overnight drop is 3000 psig at the recharge minus the morning value (definition, docs/methods.md §5).
    expect(out.drops).toHaveLength(1);
    expect(Math.abs((out.drops[0]!.gasKPa * 1000) / PA_PER_PSI - (3000 - 2311.6))).toBeLessThanOrEqual(1);
    expect(out.drops[0]!.tempC).toBeCloseTo(40, 9);
  });
});

describe("hangar hours and the accumulator lag", () => {
  it("on a steadily falling air temperature the accumulator follows the exact ramp solution, also between grid hours", () => {
    // Exact solution of dT/dt = (Ta(t) − T)/τ for Ta linear in time, from T = Ta at arrival (local
    // midnight; docs/methods.md, "Accumulator temperature"): T(t) = Ta(t) − r·τ·(1 − e^(−t/τ)).
    // τ = 2 h, r = −0.5 K/h, preflight at 06:30 (between grid hours, where the air is interpolated
    // linearly): T = Ta(6.5 h) + 1·(1 − e^(−3.25)).
    const plan = fixturePlan((t) => {
      oneLitreUnitFullPump(t);
      t.profiles[0].thermalTimeConstant = "2 h";
      t.operations.startTimes = ["06:30", "12:00"];
    });
    const from = Date.UTC(2014, 0, 1);
    const climate = syntheticClimate((ms) => 10 - (0.5 * (ms - from)) / HOUR_MS, from, from + 72 * HOUR_MS);
    const out = simulateUtcStay(plan, climate.series, {
      arrive: "2027-01-01",
      depart: "2027-01-02",
      climateYear: 2014,
    });
    const p = out.preflights[0]!;
    expect(p.ambientC).toBeCloseTo(10 - 0.5 * 6.5, 12);
    expect(p.accumulatorC).toBeCloseTo(10 - 0.5 * 6.5 + 1 - Math.exp(-3.25), 9);
  });

  it("the accumulator leaves a hangar heated to 15 °C at 06:00 and follows −20 °C by the exact first-order lag", () => {
    // Exact solution of dT/dt = (Ta − T)/τ for a constant ambient: T = Ta + (T0 − Ta)·exp(−t/τ)
    // (first-order linear ODE); τ = 2 h, one hour outside: −20 + 35·e^(−1/2) °C.
    const plan = fixturePlan((t) => {
      oneLitreUnitFullPump(t);
      t.profiles[0].thermalTimeConstant = "2 h";
      t.bases[0].hangar = { kind: "heated", heatedTo: "15 C", in: "18:00", out: "06:00" };
      t.operations.startTimes = ["07:00", "12:00"];
    });
    const climate = syntheticClimate(() => -20, Date.UTC(2014, 0, 1), Date.UTC(2014, 0, 5));
    const out = simulateUtcStay(
      plan,
      climate.series,
      { arrive: "2027-01-01", depart: "2027-01-04", climateYear: 2014 },
      { hangar: { inMin: 18 * 60, outMin: 6 * 60, air: { kind: "heated", heatedToK: 288.15 } } },
    );
    const p = out.preflights[1]!;
    expect(p.ambientC).toBe(-20);
    // Arrival at midnight in the hangar (15 °C) until 06:00, outside until 18:00, in the hangar
    // until 06:00, then one hour outside before the second morning's preflight.
    const lag = (t0: number, ta: number, hours: number) => ta + (t0 - ta) * Math.exp(-hours / 2);
    const t = lag(lag(lag(15, -20, 12), 15, 12), -20, 1);
    expect(p.accumulatorC).toBeCloseTo(t, 9);
  });
});

describe("heated hangars and unheated shelters (docs/methods.md §3, Hangars)", () => {
  const from = Date.UTC(2014, 0, 1);
  const night = { inMin: 18 * 60, outMin: 8 * 60 };
  const stay = { arrive: "2027-01-01", depart: "2027-01-05", climateYear: 2014 };
  const planOf = (tau: string) =>
    fixturePlan((t) => {
      oneLitreUnitFullPump(t);
      t.profiles[0].thermalTimeConstant = tau;
      t.operations.startTimes = ["07:00", "12:00", "19:30"];
    });
  /** A day-night swing of ±8 °C around `meanC`, coldest at 05:00 UTC. */
  const swing = (meanC: number) => (ms: number) =>
    meanC - 8 * Math.cos((2 * Math.PI * ((ms - from) / HOUR_MS - 5)) / 24);

  it("a heated hangar whose set point is below every hour's air changes nothing", () => {
    // Definition: the inside of a heated hangar is max(outdoor, set point), the outdoor air itself when
    // every hour is above the set point.
    const plan = planOf("2 h");
    const series = syntheticClimate(swing(10), from, from + 6 * 24 * HOUR_MS).series; // 2…18 °C
    const none = simulateUtcStay(plan, series, stay);
    const heated = simulateUtcStay(plan, series, stay, {
      hangar: { ...night, air: { kind: "heated", heatedToK: 273.15 } },
    });
    expect(heated).toEqual(none);
  });

  it("an unheated shelter with a zero time constant and zero offset is the outdoor air", () => {
    // Definition: the shelter's air follows the outdoor air through its lag (τ = 0: no lag) plus its offset.
    const plan = planOf("2 h");
    const series = syntheticClimate(swing(-5), from, from + 6 * 24 * HOUR_MS).series;
    const none = simulateUtcStay(plan, series, stay);
    const shelter = simulateUtcStay(plan, series, stay, {
      hangar: { ...night, air: { kind: "shelter", timeConstantS: 0, offsetK: 0 } },
    });
    expect(shelter).toEqual(none);
  });

  it("a shelter's air lags a falling outdoor air by its own time constant, also while the aircraft is out", () => {
    // Exact ramp response of the shelter's first-order lag from the outdoor air at the start of the
    // window (docs/methods.md §3): S(t) = Ta(t) − r·τs·(1 − e^(−t/τs)); r = −0.5 K/h, τs = 6 h, plus a
    // 2 K offset. The accumulator (τ = 0) is at the shelter's air at the 07:00 preflights, inside the
    // shelter on both mornings (in 18:00, out 08:00); between them the aircraft was out 08:00–18:00.
    const plan = planOf("0 s");
    const ta = (h: number) => 10 - 0.5 * h;
    const series = syntheticClimate((ms) => ta((ms - from) / HOUR_MS), from, from + 6 * 24 * HOUR_MS).series;
    const out = simulateUtcStay(plan, series, stay, {
      hangar: { ...night, air: { kind: "shelter", timeConstantS: 6 * 3600, offsetK: 2 } },
    });
    const inside = (h: number) => ta(h) + 3 * (1 - Math.exp(-h / 6)) + 2;
    expect(out.preflights[0]!.ambientC).toBeCloseTo(inside(7), 9);
    expect(out.preflights[0]!.accumulatorC).toBeCloseTo(inside(7), 9);
    expect(out.preflights[1]!.accumulatorC).toBeCloseTo(inside(31), 9);
    // Outside at noon the accumulator is at the outdoor air.
    expect(out.starts[1]!.ambientC).toBeCloseTo(ta(12), 9);
  });

  it("a heated hangar keeps the air at its set point on a cold night and at the outdoor air on a warm one", () => {
    // Definition max(outdoor, set point): −20 °C outside, heated to 10 °C; 15 °C outside stays 15 °C.
    const plan = planOf("0 s");
    const cold = syntheticClimate(() => -20, from, from + 6 * 24 * HOUR_MS).series;
    const warm = syntheticClimate(() => 15, from, from + 6 * 24 * HOUR_MS).series;
    const air = { kind: "heated" as const, heatedToK: 283.15 };
    expect(
      simulateUtcStay(plan, cold, stay, { hangar: { ...night, air } }).preflights[0]!.ambientC,
    ).toBeCloseTo(10, 9);
    expect(
      simulateUtcStay(plan, warm, stay, { hangar: { ...night, air } }).preflights[0]!.ambientC,
    ).toBeCloseTo(15, 9);
  });
});

describe("arrival state (docs/methods.md §5, Arrival)", () => {
  const from = Date.UTC(2014, 0, 1);
  const plan = fixturePlan((t) => {
    oneLitreUnitFullPump(t);
    t.operations.startTimes = ["07:00", "12:00"];
    t.profiles[0].handPump = { displacement: "10 mL", efficiency: 0.8 };
  });
  const series = syntheticClimate(() => -10, from, from + 6 * 24 * HOUR_MS).series;
  const stay = { arrive: "2027-01-01", depart: "2027-01-03", climateYear: 2014 };

  it("precharge-only: the hand pump charges the empty fluid side to nominal system pressure at the first start", () => {
    const charged = simulateUtcStay(plan, series, stay);
    const empty = simulateUtcStay(plan, series, stay, { arrival: "precharge-only" });
    // Charged on arrival at −10 °C and kept there: no servicing, no stroke.
    expect(charged.handPumpStrokes).toBe(0);
    // Hand-pump strokes = fluid / (displacement × volumetric efficiency) (docs/methods.md §3), the fluid
    // being V0 − V_gas at nominal system pressure and −10 °C (the physics module's charged state).
    const ctx = profileContext(plan.profiles[0]!, tabulatedGas(realGas), ATM_PA, false);
    const full = chargedState(
      ctx.model,
      ctx.geometry,
      ctx.fluid,
      ctx.nominalMol,
      263.15,
      ctx.systemNominalAbsPa,
    );
    expect(empty.handPumpStrokes).toBeCloseTo((1e-3 - full.gasVolumeM3) / (10e-6 * 0.8), 6);
    // From the first start on both are the same charge at the same temperature.
    expect(empty.preflights).toEqual(charged.preflights);
    expect(empty.starts).toEqual(charged.starts);
    // No trapped charge to read before the first start: the 8 grid hours 00:00–07:00 of the first day
    // (a grid hour is taken before a start at the same instant, docs/methods.md §5).
    const count = (o: typeof charged) => o.hourlyReadings.reduce((a, b) => a + b, 0);
    expect(count(charged) - count(empty)).toBe(8);
  });
});
