/**
 * What-if variants (docs/methods.md, "What-if variants"): the baseline and a variant equal to it give
 * no change, the baseline is the plan's own worst month, the low precharge line never raises a morning
 * gas pressure where nothing resets it, and the figures are the same on every run and thread.
 */
import { existsSync } from "node:fs";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import { runPlan } from "../../src/plan/engine.js";
import type { Plan } from "../../src/plan/planFile.js";
import type { BaseClimate } from "../../src/plan/samples.js";
import { runTask, simulateTask, whatIfBase, worstMonth } from "../../src/plan/whatIf.js";
import { planData, whatIfNames, withWhatIf } from "../../src/plan/whatIfRun.js";
import { DEFAULT_HANGAR, variantEdit, WHAT_IF_NAMES } from "../../src/plan/whatIfVariants.js";
import { fixturePlan, fixtureStay, syntheticClimate, type Tree } from "./helpers.js";

/** A cold January with a 12 K daily swing (invented, for the tests only). */
function coldJanuary(): BaseClimate {
  return syntheticClimate(
    (t) => -25 + 6 * Math.sin((2 * Math.PI * (t / 3_600_000 - 9)) / 24),
    Date.UTC(2014, 0, 1),
    Date.UTC(2014, 2, 1),
  );
}

/** Two aircraft in January and February 2027 (2014 as the climate year), one with the option. */
const STAYS = [
  fixtureStay("A01", "2027-01-02", "2027-02-20"),
  { ...fixtureStay("A02", "2027-01-09", "2027-02-10"), coldStartOption: true },
];

function setup(edit: (t: Tree) => void = () => {}) {
  const plan = fixturePlan((t) => {
    t.climate.years = { from: 2014, to: 2014 };
    t.operations.weekdays = ["Mon", "Tue", "Wed", "Thu", "Fri", "Sat", "Sun"];
    edit(t);
  });
  const climate = new Map([["North Field", coldJanuary()]]);
  const { results } = runPlan(plan, STAYS, climate);
  return { plan, climate, results, inputs: { plan, stays: STAYS, climates: [climate.get("North Field")!] } };
}

describe("what-if variants", () => {
  it("the baseline is the plan's own worst month; run as a variant it changes nothing", () => {
    // Definitions (docs/methods.md): the worst month has the highest short share with one accumulator,
    // and the what-if runs simulate up to its end only, whose records are those of the whole run.
    const { results, inputs } = setup();
    const month = worstMonth(results.bases[0]!)!;
    const row = results.bases[0]!.months[month - 1]!;
    expect(row.shortPctOne).toBeGreaterThan(0);
    const [baseline] = runTask(inputs, { baseIndex: 0, month, variant: null });
    const w = whatIfBase(month, baseline!, [{ name: "tau-half", label: "τ × 0.5", tally: baseline! }]);
    expect(w.baseline.shortPctOne).toBe(row.shortPctOne);
    expect(w.baseline.shortPctTwo).toBe(row.shortPctTwo);
    expect(w.baseline.outOfBandPct).toBe(row.outOfBandPct);
    expect(w.baseline.preflights).toBe(row.preflights);
    expect(w.variants[0]).toMatchObject({
      shortPctOneChange: 0,
      shortPctTwoChange: 0,
      outOfBandPctChange: 0,
    });
  });

  it("a variant equal to the baseline gives zero change everywhere: half of a zero time constant", () => {
    // τ × 0.5 = τ when τ = 0: the variant is the plan itself (identity).
    const { plan, climate, results } = setup((t) => {
      t.profiles[0].thermalTimeConstant = "0 s";
    });
    return withWhatIf(plan, STAYS, climate, results, ["tau-half", "tau-double"], { threads: 0 }).then((r) => {
      for (const v of r.bases[0]!.whatIf!.variants) {
        expect(v.shortPctOneChange).toBe(0);
        expect(v.shortPctTwoChange).toBe(0);
        expect(v.outOfBandPctChange).toBe(0);
      }
      expect(r.whatIf!.variants.map((v) => v.name)).toEqual(["tau-half", "tau-double"]);
      // Nothing else of the results changes.
      expect({ ...r, bases: [{ ...r.bases[0]!, whatIf: null }], whatIf: null }).toEqual(results);
    });
  });

  it("low precharge line: a lower or equal morning gas pressure at every preflight (log, no checks, no loss)", () => {
    // Physics: with the fluid side charged to the same system pressure, less gas sits at a lower volume
    // and, trapped and cooled alike, at a lower or equal pressure (docs/methods.md §3). With outOfBand:
    // log, no precharge check within the stays and no gas loss, nothing services either run back to the
    // line, so the order holds at every preflight.
    const { results, inputs } = setup((t) => {
      t.operations.outOfBand = "log";
      t.operations.prechargeCheckDays = 1000;
      t.profiles[0].gasLoss = { rate: "0 psi/month", spread: 0 };
    });
    const month = worstMonth(results.bases[0]!)!;
    // Every sample's preflights, in the order simulated, with where each sample's records start.
    const run = (variant: "precharge-low" | "precharge-high" | null) =>
      simulateTask(inputs, { baseIndex: 0, month, variant }).outcomes.preflights;
    const [low, nominal, high] = [run("precharge-low"), run(null), run("precharge-high")];
    expect([...low.at]).toEqual([...nominal.at]);
    expect([...high.at]).toEqual([...nominal.at]);
    let compared = 0;
    let lower = 0;
    for (const [k, p] of nominal.gasKPaGauge.entries()) {
      expect(low.gasKPaGauge[k]!).toBeLessThanOrEqual(p + 1e-9);
      expect(high.gasKPaGauge[k]!).toBeGreaterThanOrEqual(p - 1e-9);
      compared++;
      if (low.gasKPaGauge[k]! < p - 1) lower++;
    }
    expect(compared).toBeGreaterThan(30);
    expect(lower).toBeGreaterThan(0);
  });

  it("is deterministic: the same figures on every run", async () => {
    const { plan, climate, results } = setup();
    const a = await withWhatIf(plan, STAYS, climate, results, WHAT_IF_NAMES, { threads: 0 });
    const b = await withWhatIf(plan, STAYS, climate, results, WHAT_IF_NAMES, { threads: 0 });
    expect(b).toEqual(a);
    expect(a.bases[0]!.whatIf!.variants.map((v) => v.name)).toEqual([...WHAT_IF_NAMES]);
  });

  it("the variants' edits: hangar switched, first start 2 h later, the option on every stay", () => {
    // The variant set of docs/methods.md.
    const plan = fixturePlan();
    const off = variantEdit("hangar", plan, STAYS, 0).plan.bases[0]!;
    expect(off.hangar).toBeUndefined();
    const bare = fixturePlan((t) => delete t.bases[0].hangar);
    expect(variantEdit("hangar", bare, STAYS, 0).plan.bases[0]!.hangar).toEqual(DEFAULT_HANGAR);
    // 06:30 and 13:00 → 08:30 and 13:00 (minutes of the local day).
    expect(variantEdit("first-start-later", plan, STAYS, 0).plan.operations.startTimes).toEqual([510, 780]);
    const late = fixturePlan((t) => (t.operations.startTimes = ["07:00", "08:00", "23:00"]));
    expect(variantEdit("first-start-later", late, STAYS, 0).plan.operations.startTimes).toEqual([540, 1380]);
    expect(variantEdit("option-all", plan, STAYS, 0).stays.every((s) => s.coldStartOption)).toBe(true);
    expect(variantEdit("energy-plus-10", plan, STAYS, 0).energyFactor).toBe(1.1);
    expect(plan.bases[0]!.hangar).toBeDefined(); // the plan itself is not changed
  });

  it("which variants run: the plan's whatIf list, else all with --what-if", () => {
    const listed = fixturePlan((t) => (t.whatIf = ["option-all", "tau-half"]));
    expect(whatIfNames(listed, false)).toEqual(["option-all", "tau-half"]);
    expect(whatIfNames(fixturePlan(), true)).toEqual([...WHAT_IF_NAMES]);
    expect(whatIfNames(fixturePlan(), false)).toEqual([]);
    expect(() => fixturePlan((t) => (t.whatIf = ["colder"]))).toThrow(
      /whatIf\[0\]: "colder": expected one of/,
    );
  });
});

const DIST = fileURLToPath(new URL("../../dist/", import.meta.url));
const HAVE_BUILD = existsSync(join(DIST, "plan", "whatIfWorker.js"));
if (!HAVE_BUILD) console.warn(`what-if worker test skipped: ${DIST} holds no build (run npm run build)`);

describe.skipIf(!HAVE_BUILD)("what-if variants on worker threads", () => {
  it("give the same figures as on this thread", async () => {
    const run = (await import(
      join(DIST, "plan", "whatIfRun.js")
    )) as typeof import("../../src/plan/whatIfRun.js");
    const { plan, climate, results } = setup();
    const here = await withWhatIf(plan, STAYS, climate, results, WHAT_IF_NAMES, { threads: 0 });
    const data = planData(plan) as Plan;
    const there = await run.withWhatIf(
      { ...data, lineOf: plan.lineOf, has: plan.has, written: plan.written },
      STAYS,
      climate,
      results,
      WHAT_IF_NAMES,
      { threads: 2 },
    );
    expect(there.bases.map((b) => b.whatIf)).toEqual(here.bases.map((b) => b.whatIf));
  });
});
