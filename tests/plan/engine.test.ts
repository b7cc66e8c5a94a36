/** Planning-engine definitions (docs/methods.md §5; README, Outputs): configurations, climate samples, statistics. */
import { describe, expect, it } from "vitest";
import { chargedState, startDischarge } from "../../src/physics/accumulator.js";
import { tabulatedGas } from "../../src/physics/gasTable.js";
import { realGas } from "../../src/physics/nitrogen.js";
import { profileContext } from "../../src/plan/context.js";
import { runPlan } from "../../src/plan/engine.js";
import type { Stay } from "../../src/plan/schedule.js";
import { fixturePlan, HOUR_MS, oneLitreUnit, simulateUtcStay, syntheticClimate } from "./helpers.js";

const ATM = 101325;

function stay(aircraft: string, arrive: string, depart: string, coldStartOption = false): Stay {
  return { aircraft, base: "North Field", arrive, depart, coldStartOption, profile: "standard", line: 2 };
}

describe("energy with one and with two accumulators (README; docs/methods.md §5)", () => {
  // A pump timer too short for one unit to refill after a start (2 s at 1 L/min is 33 mL, a start
  // draws about half a litre from this unit) and an option timer long enough for two units.
  const plan = fixturePlan((t) => {
    oneLitreUnit(t);
    t.profiles[0].pump = {
      curve: [
        { pressure: "0 psig", flow: "1 L/min" },
        { pressure: "3000 psig", flow: "1 L/min" },
      ],
      timer: "2 s",
    };
    t.profiles[0].coldStartOption = { count: 2, timer: "10 min" };
    t.operations.startTimes = ["07:00", "12:00", "17:00"];
    t.operations.prechargeCheckDays = 30;
    t.operations.outOfBand = "log";
  });
  const model = tabulatedGas(realGas);
  const climate = syntheticClimate(() => 5, Date.UTC(2014, 0, 1), Date.UTC(2014, 0, 6));
  const simulate = (fitted: boolean) =>
    simulateUtcStay(
      plan,
      climate.series,
      { arrive: "2027-01-01", depart: "2027-01-04", climateYear: 2014 },
      { ctx: profileContext(plan.profiles[0]!, model, ATM, fitted, { exactDischarge: true }) },
    ).starts;

  it("two: the option's count × a fully recharged unit; one: the single unit the short timer leaves", () => {
    // Reference: the physics module's exact discharge (Span et al. 2000 isentropic) of one unit charged
    // to nominal system pressure at 5 °C; with the option's timer every recharge completes, so every
    // start with two units delivers twice that (docs/methods.md §3: n units deliver n times one unit's energy).
    const ctx = profileContext(plan.profiles[0]!, model, ATM, false, { exactDischarge: true });
    const tempK = 278.15;
    const full = chargedState(model, ctx.geometry, ctx.fluid, ctx.nominalMol, tempK, ctx.systemNominalAbsPa);
    const fullJ = startDischarge(
      model,
      ctx.geometry,
      1,
      ctx.nominalMol,
      tempK,
      full.gasVolumeM3,
      ctx.starter,
    ).hydraulicEnergyJ;
    const starts = simulate(false);
    expect(starts).toHaveLength(9); // 3 days × 3 start times (the schedule above)
    for (const s of starts) expect(s.energyTwoJ / (2 * fullJ)).toBeCloseTo(1, 6);
    // The first start follows the arrival charge; afterwards the 2 s timer leaves one unit far short
    // (33 mL refilled of about half a litre drawn: common arithmetic, no source).
    expect(starts[0]!.energyOneJ / fullJ).toBeCloseTo(1, 6);
    for (const s of starts.slice(1)) expect(s.energyOneJ).toBeLessThan(0.5 * fullJ);
  });

  it("do not depend on which configuration the stay has fitted (same servicing, same climate)", () => {
    // Definition (docs/methods.md §5): "one" and "two" are the two configurations, whichever is fitted.
    const a = simulate(false);
    const b = simulate(true);
    expect(b).toHaveLength(a.length);
    a.forEach((s, i) => {
      expect(b[i]!.energyOneJ / s.energyOneJ).toBeCloseTo(1, 9);
      expect(b[i]!.energyTwoJ / s.energyTwoJ).toBeCloseTo(1, 9);
    });
  });
});

describe("climate samples shared by the stays of a base (docs/methods.md §5)", () => {
  it("stays that overlap in real time see the same climate year in every sample", () => {
    // Synthetic climate: every hour of calendar year Y is −5·(Y − 2010) °C (2013 −15 … 2017 −35).
    const plan = fixturePlan((t) => {
      oneLitreUnit(t);
      t.climate.years = { from: 2013, to: 2016 };
    });
    const climate = new Map([
      [
        "North Field",
        syntheticClimate(
          (ms) => -5 * (new Date(ms).getUTCFullYear() - 2010),
          Date.UTC(2013, 0, 1),
          Date.UTC(2018, 0, 1),
        ),
      ],
    ]);
    // A is at the base over 20–31 December 2026, B over 5–19 January 2027: in a sample where December
    // 2026 is climate year Y, January 2027 is climate year Y + 1 for both.
    const stays = [stay("A1", "2026-12-20", "2027-01-01"), stay("B1", "2027-01-05", "2027-01-20")];
    const b = runPlan(plan, stays, climate).results.bases[0]!;
    expect(b.yearsUsed).toEqual([2013, 2014, 2015]); // 2016 + 1 is outside climate.years
    // Coldest morning of each sample: B's January, climate year Y + 1 (values from the climate above).
    expect(b.coldestMorningByYear).toEqual([
      { year: 2013, tempC: -20 },
      { year: 2014, tempC: -25 },
      { year: 2015, tempC: -30 },
    ]);
    // January preflights all come from climate years 2014–2016.
    expect(b.months[0]!.preflights).toBe(3 * 15); // 3 samples × 15 days of B's stay
  });
});

describe("monthly statistics (docs/methods.md §5; README, Outputs)", () => {
  it("daily range over the days the stays cover; null in months without preflights", () => {
    // Synthetic climate: 0 °C except at 14:00 UTC, when it is 4 °C on 10–19 January and 10 °C on
    // every other day, so each local (UTC) day's range is 4 or 10 °C (docs/methods.md §4 definition).
    const plan = fixturePlan((t) => {
      oneLitreUnit(t);
      t.climate.years = { from: 2014, to: 2015 };
    });
    const climate = new Map([
      [
        "North Field",
        syntheticClimate(
          (ms) => {
            const d = new Date(ms);
            if (d.getUTCHours() !== 14) return 0;
            return d.getUTCMonth() === 0 && d.getUTCDate() >= 10 && d.getUTCDate() < 20 ? 4 : 10;
          },
          Date.UTC(2014, 0, 1),
          Date.UTC(2016, 0, 1),
        ),
      ],
    ]);
    const b = runPlan(plan, [stay("A1", "2027-01-10", "2027-01-20")], climate).results.bases[0]!;
    const jan = b.months[0]!;
    expect(jan.preflights).toBe(20); // 2 years × 10 days
    expect(jan.dailyRangeMeanC).toBe(4);
    expect(jan.dailyRangeP90C).toBe(4);
    const feb = b.months[1]!;
    expect(feb.preflights).toBe(0);
    expect(feb.dailyRangeMeanC).toBeNull();
    expect(feb.dailyRangeP90C).toBeNull();
    expect(feb.morningKPaGaugeP50).toBeNull();
    // The climate table still describes every month of record (climatology, README, Outputs).
    expect(b.climateMonths[1]!.meanDailyRangeC).toBe(10);
  });

  it("a base with fewer usable years than climate.minYears gets a warning listing them", () => {
    // docs/methods.md, "Usable years, window by window": a base below climate.minYears is warned about, naming its years.
    const plan = fixturePlan((t) => {
      oneLitreUnit(t);
      t.climate.years = { from: 2013, to: 2014 };
      t.climate.minYears = 5;
    });
    const climate = new Map([
      ["North Field", syntheticClimate(() => 0, Date.UTC(2013, 0, 1), Date.UTC(2015, 0, 1))],
    ]);
    const { results } = runPlan(plan, [stay("A1", "2027-01-10", "2027-01-12")], climate);
    expect(results.warnings).toContain(
      'base "North Field": 2 usable climate years (2013, 2014), fewer than climate.minYears = 5',
    );
  });
});

describe("29 February (docs/methods.md §5)", () => {
  it("a real 29 February on a common climate year repeats 28 February's weather; the state carries over", () => {
    // Synthetic climate: 28 February 2014 is −10 °C, every other hour 0 °C.
    const plan = fixturePlan((t) => {
      oneLitreUnit(t);
      t.operations.startTimes = ["07:00"];
    });
    const feb28 = Date.UTC(2014, 1, 28);
    const climate = syntheticClimate(
      (ms) => (ms >= feb28 && ms < feb28 + 24 * HOUR_MS ? -10 : 0),
      Date.UTC(2014, 0, 1),
      Date.UTC(2014, 3, 1),
    );
    const out = simulateUtcStay(plan, climate.series, {
      arrive: "2028-02-27",
      depart: "2028-03-02",
      climateYear: 2014,
    });
    expect(out.preflights.map((p) => p.ambientC)).toEqual([0, -10, -10, 0]); // 27, 28, 29→28 Feb, 1 Mar
    // The folded morning follows a recharge at −10 °C and a night at −10 °C (lag 0, no gas loss): the
    // trapped charge still holds the nominal 3000 psig (physics identity; psi = 6.894757 kPa, NIST SP 811).
    expect(out.preflights[2]!.gasKPaGauge / 6.894757).toBeCloseTo(3000, 2);
    // The first morning at −10 °C follows a recharge at 0 °C: the gas has cooled below it.
    expect(out.preflights[1]!.gasKPaGauge / 6.894757).toBeLessThan(2990);
    expect(out.drops).toHaveLength(3);
  });
});

describe("nitrogen per base (docs/methods.md §5, §7)", () => {
  it("concurrent stays at a base draw on one cylinder pool; base totals sum the stays", () => {
    // Fast gas loss (100 psi/month) so that the weekly precharge checks find the gas under its
    // tolerance and top it up; one 49 L cylinder at 2200 psig holds far more than these top-ups.
    const plan = fixturePlan((t) => {
      oneLitreUnit(t);
      t.profiles[0].gasLoss = { rate: "100 psi/month", spread: 0 };
      t.operations.prechargeCheckDays = 7;
      t.operations.outOfBand = "log";
      t.climate.years = { from: 2014, to: 2014 };
    });
    const climate = new Map([
      ["North Field", syntheticClimate(() => 0, Date.UTC(2014, 0, 1), Date.UTC(2015, 0, 1))],
    ]);
    const stays = [stay("A1", "2027-01-04", "2027-02-01"), stay("B1", "2027-01-06", "2027-02-03")];
    const n = runPlan(plan, stays, climate).results.bases[0]!.nitrogen;
    const [a, b] = n.stays;
    expect(a!.kgAddedP50).toBeGreaterThan(0);
    // One climate year: each quantile is that year's value, so base = sum of the stays (definition).
    expect(n.kgP50).toBeCloseTo(a!.kgP50 + b!.kgP50, 12);
    expect(n.kgAddedP50).toBeCloseTo(a!.kgAddedP50 + b!.kgAddedP50, 12);
    expect(n.kgHoseVentedP50).toBeCloseTo(a!.kgHoseVentedP50 + b!.kgHoseVentedP50, 12);
    expect(n.kgReleasedP50).toBeCloseTo(a!.kgReleasedP50 + b!.kgReleasedP50, 12);
    expect(n.servicingEventsP50).toBe(a!.servicingEventsP50 + b!.servicingEventsP50);
    // One shared pool: a single cylinder serves both aircraft; carts = ceil(1 / 2 per cart).
    expect(n.cylindersP50).toBe(1);
    expect(n.cartsP50).toBe(1);
  });
});
