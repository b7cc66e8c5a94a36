/**
 * The region screen is the planning engine run on one aircraft parked outside all year (docs/methods.md,
 * "Region screen"): a screen of the demo's four stations must give, station by station and month by
 * month, what plans with one aircraft present all year at each station, no hangar, give. The reference
 * is the plan engine itself on the same invented demo climate (sample-data/climate), 2011–2014.
 */
import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { beforeAll, describe, expect, it } from "vitest";
import { parse, stringify } from "yaml";
import { designTemperatures } from "../../src/climate/designTemps.js";
import { realGas } from "../../src/physics/nitrogen.js";
import { defaultEnergyRangeK, equilibriumBreakEven } from "../../src/plan/breakEven.js";
import { type BaseClimate, runPlan } from "../../src/plan/engine.js";
import { type Plan, parsePlanFileText, parsePlanText } from "../../src/plan/planFile.js";
import type { Results } from "../../src/plan/results.js";
import { loadPlanClimate } from "../../src/plan/run.js";
import { SCREEN_AIRCRAFT, screenStation, screenStays } from "../../src/plan/screen.js";
import { screenExtras } from "../../src/plan/screenExtras.js";
import type { ScreenStation } from "../../src/plan/screenResults.js";

const DEMO = fileURLToPath(new URL("../../sample-data/demo-plan.yaml", import.meta.url));

/** The demo plan on 2011–2014, each base named by its station and without a hangar. */
function demoText(): string {
  const t = parse(readFileSync(DEMO, "utf8"));
  t.climate.years = { from: 2011, to: 2014 };
  t.climate.cacheDir = undefined;
  for (const b of t.bases) {
    b.name = b.stations[0];
    delete b.hangar;
  }
  delete t.nitrogen.stock; // names the former bases
  return stringify(t);
}

describe("screen of the demo's stations = plans with one aircraft there all year, no hangar", () => {
  let plan: Plan;
  let climate: Map<string, BaseClimate>;
  let without: Results;
  let withOption: Results;
  let screened: ScreenStation[];

  beforeAll(async () => {
    const text = demoText();
    plan = parsePlanText(text, DEMO);
    climate = await loadPlanClimate(plan, { cacheDir: null });
    const stays = (i: 0 | 1) => plan.bases.map((b) => screenStays(b.name, "utility")[i]!);
    without = runPlan(plan, stays(0), climate).results;
    withOption = runPlan(plan, stays(1), climate).results;
    const file = parsePlanFileText(text, DEMO);
    screened = plan.bases.map((b) =>
      screenStation(file, "utility", climate.get(b.name)!.stations[0]!, screenExtras(file, "utility")),
    );
  }, 300_000);

  it("gives each month's shares, intervals and statuses of the plans, station by station", () => {
    expect(screened.map((s) => s.station.id)).toEqual(plan.bases.map((b) => b.name));
    plan.bases.forEach((b, i) => {
      const s = screened[i]!;
      const one = without.stays.find((x) => x.base === b.name && x.aircraft === SCREEN_AIRCRAFT.without)!;
      const two = withOption.stays.find((x) => x.base === b.name && x.aircraft === SCREEN_AIRCRAFT.with)!;
      expect(s.yearsUsed).toEqual(one.yearsUsed);
      expect(s.months.map((m) => m.month)).toEqual(one.months.map((m) => m.month));
      s.months.forEach((m, k) => {
        const a = one.months[k]!;
        const c = two.months[k]!;
        expect([m.shortPctOne, m.shortPctOneLo90, m.shortPctOneHi90]).toEqual([
          a.shortPctOne,
          a.shortPctOneLo90,
          a.shortPctOneHi90,
        ]);
        expect([m.outOfBandPct, m.outOfBandPctLo90, m.outOfBandPctHi90]).toEqual([
          a.outOfBandPct,
          a.outOfBandPctLo90,
          a.outOfBandPctHi90,
        ]);
        expect([m.shortPctTwo, m.shortPctTwoLo90, m.shortPctTwoHi90]).toEqual([
          c.shortPctTwo,
          c.shortPctTwoLo90,
          c.shortPctTwoHi90,
        ]);
        expect(m.outOfBandPctWithOption).toBe(c.outOfBandPct);
        expect([m.preflights, m.starts]).toEqual([a.preflights, a.starts]);
        const base = without.bases[i]!.months[k]!;
        expect([m.status, m.lowConfidence]).toEqual([base.status, base.lowConfidence]);
        expect(m.statusWithOption).toBe(withOption.bases[i]!.months[k]!.status);
      });
      const action = without.actions.find((x) => x.base === b.name)!;
      expect(s.monthsNeedingOption).toEqual([...action.monthsAbove].sort((x, y) => x - y));
      const base = without.bases[i]!;
      expect([s.coldestMorningC, s.coldest1in10C, s.coldest1in10CLo90, s.coldest1in10CHi90]).toEqual([
        base.coldestMorningC,
        base.coldest1in10C,
        base.coldest1in10CLo90,
        base.coldest1in10CHi90,
      ]);
      expect(s.atmosphere).toEqual(base.atmosphere);
    });
  });

  it("compares figures, not empty months: the cold stations need the option, the warm one does not", () => {
    // Demo climate targets (src/demo/stations.ts): 999702 cold continental, 999703 Arctic coast,
    // 999704 hot and dry; on the demo profile the two cold ones are short in winter.
    const byId = new Map(screened.map((s) => [s.station.id, s]));
    expect(byId.get("999702-99999")!.monthsNeedingOption).toContain(1);
    expect(byId.get("999703-99999")!.monthsNeedingOption).toContain(1);
    expect(byId.get("999704-99999")!.monthsNeedingOption).toEqual([]);
    for (const s of screened) {
      expect(s.months.every((m) => m.starts > 0)).toBe(true);
      expect(s.yearsUsed).toEqual([2011, 2012, 2013, 2014]);
    }
  });

  it("gives the break-even margins and design temperatures of the engineer's modules at the station", () => {
    // Margin = the station's 1-in-10-year coldest morning minus the equilibrium break-even temperature
    // at nominal precharge and system pressure (docs/methods.md, "Break-even temperatures"); the design
    // temperatures are those of the station's own series on the plan's years (docs/methods.md,
    // "Climate design temperatures").
    const file = parsePlanFileText(demoText(), DEMO);
    const profile = file.profiles.find((p) => p.name === "utility")!;
    plan.bases.forEach((b, i) => {
      const s = screened[i]!;
      const bc = climate.get(b.name)!;
      const rows = equilibriumBreakEven(
        profile,
        without.bases[i]!.atmosphere.pressureKPaAbsolute * 1000,
        realGas,
        defaultEnergyRangeK(file.units),
      );
      const nominal = rows.filter((r) => r.precharge === "nominal" && r.system === "nominal");
      expect(s.breakEven.map((m) => m.units)).toEqual([1, 2]);
      for (const m of s.breakEven) {
        const r = nominal.find((x) => x.units === m.units)!;
        if (r.ambientC === null) {
          expect([m.breakEvenC, m.marginC]).toEqual([null, null]);
          expect(m.reason).toContain(r.reason);
          continue;
        }
        expect(m.breakEvenC).toBeCloseTo(r.ambientC, 6);
        if (s.coldest1in10C === null)
          expect([m.marginC, m.reason]).toEqual([null, "no 1-in-10-year coldest morning"]);
        else expect(m.marginC).toBeCloseTo(s.coldest1in10C - r.ambientC!, 6);
      }
      const design = designTemperatures(bc.series, bc.timeZone, {
        years: { from: 2011, to: 2014 },
        minYearShare: file.climate.minYearShare,
        coldThresholdsC: nominal.flatMap((r) => (r.ambientC === null ? [] : [r.ambientC])),
      });
      expect(s.design).toEqual(design);
      expect(s.design.years).toEqual([2011, 2012, 2013, 2014]);
    });
  });
});
