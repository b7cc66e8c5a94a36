/**
 * Nitrogen demand, cascade, stock and fleet roll-up (docs/methods.md §7): the demand items of the
 * plan's `nitrogen:` section, the one vocabulary of the flows, the timeline against the stock, the
 * fleet quantiles of sums.
 */
import { describe, expect, it } from "vitest";
import { resultsJson } from "../../src/output/tables.js";
import { tabulatedGas } from "../../src/physics/gasTable.js";
import { N2_MOLAR_MASS_KG_MOL, realGas } from "../../src/physics/nitrogen.js";
import { cylinderGas, fullCylinder } from "../../src/physics/supply.js";
import { prechargeLineAbsPa, profileContext } from "../../src/plan/context.js";
import { runPlan } from "../../src/plan/engine.js";
import { EVENT_DRAWS, type SupplyEvent } from "../../src/plan/nitrogenDemand.js";
import { nitrogenFleet } from "../../src/plan/nitrogenFleet.js";
import type { BaseResult, NitrogenBase, NitrogenFlows } from "../../src/plan/results.js";
import type { Stay } from "../../src/plan/schedule.js";
import { cascadeSample, supplySpec } from "../../src/plan/supplyPlan.js";
import { fixturePlan, oneLitreUnit, stayAt, syntheticClimate, type Tree } from "./helpers.js";

const ATM = 101325;

const stay = (aircraft: string, arrive: string, depart: string): Stay => stayAt(aircraft, arrive, depart);

/** The 1 L unit at a constant 0 °C over 2013–2015; `edit` sets the nitrogen section. */
function run(edit: (t: Tree) => void, stays: Stay[], seed = 42) {
  const plan = fixturePlan((t) => {
    oneLitreUnit(t);
    t.seed = seed;
    t.operations.outOfBand = "log";
    t.climate.years = { from: 2013, to: 2015 };
    edit(t);
  });
  const climate = new Map([
    ["North Field", syntheticClimate(() => 0, Date.UTC(2013, 0, 1), Date.UTC(2016, 0, 1))],
  ]);
  return { plan, results: runPlan(plan, stays, climate).results };
}

/** A1 for 56 days from Monday 2027-01-04, B1 for 28 days from 2027-01-06 (2027-01-01 is a Friday). */
const STAYS = [stay("A1", "2027-01-04", "2027-03-01"), stay("B1", "2027-01-06", "2027-02-03")];

/** drawn = added + hose vented + other uses; added = by servicing + by unscheduled recharges. */
function expectIdentity(f: NitrogenFlows, what: string) {
  const scale = Math.max(1, f.drawn);
  expect(Math.abs(f.drawn - (f.added + f.hoseVented + f.otherUse)) / scale, what).toBeLessThan(1e-12);
  expect(Math.abs(f.added - (f.addedServicing + f.addedUnscheduled)) / scale, what).toBeLessThan(1e-12);
}

/** The demand figures of a base's nitrogen (what the demand items could change). */
function demandFigures(n: NitrogenBase) {
  const { stock: _s, timeline, usableGas: _u, ...rest } = n;
  return { ...rest, timeline: timeline.map(({ stockUsableKg: _k, ...d }) => d) };
}

describe("one vocabulary for the flows (docs/methods.md §7)", () => {
  it("what the cylinders give is what the stays' accumulators, hoses and other uses receive, per stay", () => {
    // Conservation of gas (no outside source): opened cylinders × a full one − the gas left in them =
    // Σ over stays (added by servicing + added by unscheduled recharges + hose vented + other uses),
    // and the same sum by day. Events of two stays at 0 °C on a 1 L gas side, fixture cylinders.
    const plan = fixturePlan(oneLitreUnit);
    const model = tabulatedGas(realGas);
    const ctx = profileContext(plan.profiles[0]!, model, ATM, false);
    const t = 273.15;
    const fill = (stay: number, realDay: number, cause: "servicing" | "unscheduled", fromMol: number) => ({
      cause,
      realDay,
      utcMs: realDay * 86_400_000,
      stay,
      tempK: t,
      v0M3: 0.001,
      fromMol,
      toMol: ctx.nominalMol,
      units: cause === "servicing" ? 2 : 1,
    });
    const floorAbsPa = prechargeLineAbsPa(ctx, t) + plan.nitrogen.transferDifferential;
    const events: SupplyEvent[] = [
      fill(0, 0, "servicing", 0.97 * ctx.nominalMol),
      fill(1, 1, "unscheduled", model.densityMolM3(ATM, t) * 0.001),
      {
        cause: "otherUse",
        realDay: 1,
        utcMs: 1.5 * 86_400_000,
        stay: 0,
        tempK: t,
        amountMol: 40,
        floorAbsPa,
      },
      fill(1, 2, "unscheduled", model.densityMolM3(ATM, t) * 0.001),
      { cause: "otherUse", realDay: 3, utcMs: 3 * 86_400_000, stay: 1, tempK: t, amountMol: 90, floorAbsPa },
    ];
    const c = cascadeSample(model, supplySpec(plan), events, 2, 4);
    expect(c.cylindersOpened).toBeGreaterThan(1);
    const given = c.cylindersOpened * fullCylinder(model, supplySpec(plan)).amountMol - c.gasLeftMol;
    let received = 0;
    for (const si of [0, 1]) {
      received += c.addedServicingMol[si]! + c.addedUnscheduledMol[si]! + c.hoseMol[si]! + c.otherUseMol[si]!;
    }
    expect(received).toBeCloseTo(given, 9);
    expect(c.drawnMolByDay.reduce((a, b) => a + b, 0)).toBeCloseTo(given, 9);
    expect(c.otherUseMol[0]).toBeCloseTo(40, 9);
    expect(c.otherUseMol[1]).toBeCloseTo(90, 9);
    expect(c.addedServicingMol[1]).toBe(0);
    expect(c.addedUnscheduledMol[0]).toBe(0);
    expect(c.hoseMol[0]! > 0 && c.hoseMol[1]! > 0).toBe(true);
  });
});

describe("the demand items at zero (docs/methods.md §7)", () => {
  it("leave every existing nitrogen figure as it is without them", () => {
    // Fast gas loss, so that weekly checks top the gas up and the cascade has work to do.
    const loss = (t: Tree) => {
      t.profiles[0].gasLoss = { rate: "100 psi/month", spread: 0 };
    };
    const zero = run(loss, STAYS).results.bases[0]!.nitrogen;
    const absent = run((t) => {
      loss(t);
      delete t.nitrogen.unscheduledRechargesPerAircraftMonth;
      delete t.nitrogen.otherUse;
    }, STAYS).results.bases[0]!.nitrogen;
    expect(zero.kgAddedP50).toBeGreaterThan(0);
    expect(demandFigures(zero)).toEqual(demandFigures(absent));
    expect(zero.draws).toBe(1);
    expect(zero.meanKg.addedUnscheduled).toBe(0);
    expect(zero.meanKg.otherUse).toBe(0);
    // Without the new items, drawn = added by servicing + hose vented, sample by sample (definition).
    for (const s of zero.stays) {
      expect(s.meanKg.drawn).toBeCloseTo(s.meanKg.addedServicing + s.meanKg.hoseVented, 12);
    }
  });
});

describe("other uses of the carts (docs/methods.md §7)", () => {
  it("draw the plan's amount on each flown day, or once a week with the last week in proportion", () => {
    // Definition: A1 flies 56 days (8 weeks of 7 flown days; 40 weekdays), B1 28 days, C1 10 days.
    const stays = [...STAYS, stay("C1", "2027-01-10", "2027-01-20")];
    const perDay = run((t) => {
      t.nitrogen.otherUse = { amount: "0.1 kg", per: "flown-day" };
    }, stays).results.bases[0]!.nitrogen;
    expect(perDay.stays.map((s) => s.meanKg.otherUse)).toEqual(
      [5.6, 2.8, 1].map((x) => expect.closeTo(x, 9)),
    );
    const weekdays = run((t) => {
      t.nitrogen.otherUse = { amount: "0.1 kg", per: "flown-day" };
      t.operations.weekdays = ["Mon", "Tue", "Wed", "Thu", "Fri"];
    }, STAYS).results.bases[0]!.nitrogen;
    expect(weekdays.stays[0]!.meanKg.otherUse).toBeCloseTo(4, 9);
    const weekly = run((t) => {
      t.nitrogen.otherUse = { amount: "0.7 kg", per: "week" };
    }, stays).results.bases[0]!.nitrogen;
    // 0.7 kg × 56/7, × 28/7, × 10/7.
    expect(weekly.stays.map((s) => s.meanKg.otherUse)).toEqual(
      [5.6, 2.8, 1].map((x) => expect.closeTo(x, 9)),
    );
    expect(weekly.cylindersP50).toBeGreaterThan(1); // 9.4 kg needs several cylinders of the fixture
    for (const n of [perDay, weekly]) {
      expectIdentity(n.meanKg, "base");
      for (const s of n.stays) expectIdentity(s.meanKg, s.aircraft);
    }
  });
});

describe("unscheduled full recharges (docs/methods.md §7)", () => {
  const rate = 1;
  const { plan, results } = run((t) => {
    t.nitrogen.unscheduledRechargesPerAircraftMonth = rate;
    t.nitrogen.hoseVolume = "0 in3";
  }, STAYS);
  const n = results.bases[0]!.nitrogen;

  it("occur at the plan's rate: mean count per stay near rate × months over the samples", () => {
    // Poisson (definition): 3 climate years × 20 draws = 60 samples; the mean count of a stay of m
    // months has standard error √(rate·m/60). Tolerance 4 standard errors. A month = 365.2425/12 days.
    expect(n.draws).toBe(EVENT_DRAWS);
    expect(n.samples).toHaveLength(3 * EVENT_DRAWS);
    for (const [s, days] of [
      [n.stays[0]!, 56],
      [n.stays[1]!, 28],
    ] as const) {
      const expected = (rate * days) / (365.2425 / 12);
      expect(Math.abs(s.unscheduledRechargesMean - expected)).toBeLessThan(4 * Math.sqrt(expected / 60));
    }
  });

  it("each adds the reference amount minus ρ(local atmosphere, T)·V0 and releases as much", () => {
    // Physics identity: gas and site at 0 °C, hose volume 0, so each recharge adds exactly
    // n_ref − ρ(101.325 kPa, 273.15 K)·V0 (the gas side vented to the local atmosphere before).
    const ctx = profileContext(plan.profiles[0]!, tabulatedGas(realGas), ATM, false);
    const perEventKg = (ctx.nominalMol - realGas.densityMolM3(ATM, 273.15) * 0.001) * N2_MOLAR_MASS_KG_MOL;
    for (const s of n.stays) {
      expect(s.meanKg.addedUnscheduled).toBeCloseTo(s.unscheduledRechargesMean * perEventKg, 4);
      // No gas loss and in-band readings: all the gas released is the emptied gas sides.
      expect(s.meanKg.released).toBeCloseTo(s.meanKg.addedUnscheduled, 4);
      expectIdentity(s.meanKg, s.aircraft);
    }
    expectIdentity(n.meanKg, "base");
    expect(results.randomInputs.map((r) => r.name)).toContain("unscheduled full recharges");
  });

  it("are seeded: the same inputs give the same bytes, another seed other events", () => {
    // Determinism (docs/methods.md §5): same seed, byte-identical results.json.
    const again = run((t) => {
      t.nitrogen.unscheduledRechargesPerAircraftMonth = rate;
      t.nitrogen.hoseVolume = "0 in3";
    }, STAYS).results;
    expect(resultsJson(again)).toBe(resultsJson(results));
    const other = run(
      (t) => {
        t.nitrogen.unscheduledRechargesPerAircraftMonth = rate;
        t.nitrogen.hoseVolume = "0 in3";
      },
      STAYS,
      43,
    ).results.bases[0]!.nitrogen;
    expect(other.samples.map((s) => s.kg)).not.toEqual(n.samples.map((s) => s.kg));
  });
});

describe("usable gas, stock and timeline (docs/methods.md §7)", () => {
  const amountKg = 0.1;
  const edit = (resupplyEvery?: string) => (t: Tree) => {
    t.nitrogen.otherUse = { amount: `${amountKg} kg`, per: "flown-day" };
    t.nitrogen.stock = resupplyEvery ? { cylinders: 1, resupplyEvery } : { cylinders: 1 };
  };
  const { plan, results } = run(edit(), [STAYS[0]!]);
  const n = results.bases[0]!.nitrogen;
  // Usable gas of one cylinder at 0 °C: fill less the gas left at the profile's precharge line at
  // 0 °C plus the 50 psi differential (physics/supply.ts cylinderGas, itself checked against the
  // independent re-derivation in tests/physics/supply.test.ts).
  const model = tabulatedGas(realGas);
  const ctx = profileContext(plan.profiles[0]!, model, ATM, false);
  const usableKg = (tempK: number) =>
    cylinderGas(model, supplySpec(plan), prechargeLineAbsPa(ctx, tempK), tempK).usableMol *
    N2_MOLAR_MASS_KG_MOL;

  it("shows one cylinder's full, residual and usable gas at the fill, mean and coldest site temperatures", () => {
    expect(n.usableGas.map((r) => r.at)).toEqual(["fill", "mean", "coldest"]);
    const [fill, mean, coldest] = n.usableGas;
    expect(fill!.tempC).toBeCloseTo(21.111, 3); // 70 °F
    expect(mean!.tempC).toBeCloseTo(0, 9); // the synthetic climate holds 0 °C
    expect(coldest!.tempC).toBeCloseTo(0, 9);
    expect(mean!.usableKg).toBeCloseTo(usableKg(273.15), 9);
    for (const r of n.usableGas) expect(r.fullKg - r.residualKg).toBeCloseTo(r.usableKg, 12);
  });

  it("draws the cumulative demand against the stock line and dates the stock-out at P90", () => {
    // Demand is deterministic here (0.1 kg on each of the 56 flown days, no servicing), so P50 = P90
    // = 0.1 kg × days so far; the stock runs out on the first day it exceeds one cylinder's usable gas.
    expect(n.timeline).toHaveLength(56);
    expect(n.timeline[0]!.date).toBe("2027-01-04");
    expect(n.timeline[55]!.drawnKgP90).toBeCloseTo(5.6, 9);
    for (const [d, day] of n.timeline.entries()) {
      expect(day.drawnKgP50).toBeCloseTo(amountKg * (d + 1), 9);
      expect(day.stockUsableKg).toBeCloseTo(usableKg(273.15), 9);
    }
    const outDay = Math.floor(usableKg(273.15) / amountKg); // first d with 0.1·(d + 1) > usable
    const expected = new Date(Date.UTC(2027, 0, 4 + outDay)).toISOString().slice(0, 10);
    expect(n.stock).toMatchObject({ cylinders: 1, resupplyEveryDays: null, stockOutP90: expected });
  });

  it("with a weekly top-up counts the demand since the last top-up, and the stock lasts", () => {
    // 7 days × 0.1 kg = 0.7 kg between top-ups, less than one cylinder's usable gas.
    expect(usableKg(273.15)).toBeGreaterThan(0.7);
    const weekly = run(edit("1 week"), [STAYS[0]!]).results.bases[0]!.nitrogen;
    expect(weekly.stock).toMatchObject({ cylinders: 1, resupplyEveryDays: 7, stockOutP90: null });
    expect(Math.max(...weekly.timeline.map((d) => d.sinceResupplyKgP90))).toBeCloseTo(0.7, 9);
    expect(weekly.timeline[7]!.sinceResupplyKgP50).toBeCloseTo(0.1, 9); // reset on day 7
    expect(weekly.timeline[55]!.drawnKgP50).toBeCloseTo(5.6, 9);
  });
});

describe("fleet roll-up (docs/methods.md §7)", () => {
  /** A base whose nitrogen carries only what the roll-up reads; `byYear`: each year's gas drawn (kg) by draw. */
  function base(name: string, referenceYear: number, byYear: Record<number, number[]>, cylinders: number) {
    const samples = Object.entries(byYear).flatMap(([y, kgs]) =>
      kgs.map((kg, draw) => ({ climateYear: Number(y), draw, kg })),
    );
    const flows = {
      drawn: 1,
      added: 1,
      addedServicing: 1,
      addedUnscheduled: 0,
      hoseVented: 0,
      otherUse: 0,
      released: 0,
    };
    const nitrogen = {
      referenceYear,
      samples,
      meanKg: flows,
      unscheduledRechargesMean: 0.5,
      cylindersP50: cylinders,
      cylindersP90: cylinders + 1,
      cylindersP95: cylinders + 1,
      cartsP50: 1,
      cartsP90: 1,
      cartsP95: 2,
    };
    return { name, nitrogen } as unknown as BaseResult;
  }

  it("takes quantiles of the fleet sum per climate year and draw, on one real-time mapping", () => {
    // Hand calculation. Base A maps real 2027 onto each sample's climate year, base B real 2028: the
    // fleet sample labelled y (real 2027 → y) takes A's year y and B's year y + 1. Sums by draw:
    // y = 2011: 1 + 10, 2 + 20; y = 2012: 3 + 30, 4 + 40 → [11, 22, 33, 44]; P50 = 27.5 (type 7).
    // B's 2011 (fleet year 2010) has no partner in A and is left out.
    const a = base("A", 2027, { 2011: [1, 2], 2012: [3, 4] }, 2);
    const b = base("B", 2028, { 2011: [99], 2012: [10, 20], 2013: [30, 40] }, 3);
    const f = nitrogenFleet([a, b], 2);
    expect(f.climateYears).toEqual([2011, 2012]);
    expect(f.kgP50).toBeCloseTo(27.5, 12);
    expect(f.kgP90).toBeCloseTo(40.7, 12);
    const reversed = base("B", 2028, { 2012: [40, 30], 2013: [20, 10] }, 3);
    // Sums [41, 32, 23, 14]: P90 = 32 + 0.7·(41 − 32) = 38.3; the bases' P90s sum to 3.7 + 37 = 40.7.
    expect(nitrogenFleet([a, reversed], 2).kgP90).toBeCloseTo(38.3, 12);
    // Cylinders and carts: sums of the bases' own counts; means add up.
    expect([f.cylindersP50, f.cylindersP90, f.cartsP95]).toEqual([5, 7, 4]);
    expect(f.meanKg.drawn).toBe(2);
    expect(f.unscheduledRechargesMean).toBe(1);
    expect(f.normalM3P50).toBeCloseTo(27.5 / 1.250386, 12); // normal m³ by the density of units/factors.ts
  });
});
