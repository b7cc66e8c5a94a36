import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import { planNameFromFolder, starterPlanText } from "../../src/cli/initRun.js";
import { main } from "../../src/cli/main.js";
import { chargedState, interpolateClamped, recharge, startDischarge } from "../../src/physics/accumulator.js";
import { realGas } from "../../src/physics/nitrogen.js";
import { profileContext } from "../../src/plan/context.js";
import { loadPlan, parsePlanText } from "../../src/plan/planFile.js";
import { parseScheduleText } from "../../src/plan/schedule.js";
import { fToK } from "../../src/units/index.js";

/** Standard sea-level atmosphere, Pa (ISO 2533). */
const ATM_PA = 101325;

describe("coldsoak init", () => {
  let dir: string;
  beforeEach(() => {
    dir = mkdtempSync(join(tmpdir(), "coldsoak-init-"));
    vi.spyOn(process.stdout, "write").mockImplementation(() => true);
    vi.spyOn(process.stderr, "write").mockImplementation(() => true);
  });
  afterEach(() => {
    vi.restoreAllMocks();
    rmSync(dir, { recursive: true, force: true });
  });

  it("writes a starter plan and schedule that pass the plan reader's validation", async () => {
    const folder = join(dir, "winter-fleet");
    expect(await main(["init", folder])).toBe(0);
    const plan = await loadPlan(join(folder, "plan.yaml"));
    expect(plan.name).toBe("winter-fleet");
    expect(plan.climate.paths).toEqual(["climate"]);
    expect(existsSync(join(folder, "climate"))).toBe(true);
    const schedulePath = join(folder, plan.schedule!);
    const stays = parseScheduleText(
      readFileSync(schedulePath, "utf8"),
      schedulePath,
      plan.bases.map((b) => b.name),
      plan.profiles.map((p) => p.name),
    );
    expect(stays.length).toBeGreaterThan(0);
  });

  it("shows the nitrogen demand items as commented examples that validate once uncommented", async () => {
    const folder = join(dir, "demand");
    expect(await main(["init", folder])).toBe(0);
    const text = readFileSync(join(folder, "plan.yaml"), "utf8");
    for (const key of ["unscheduledRechargesPerAircraftMonth", "otherUse", "stock"]) {
      expect(text).toMatch(new RegExp(`^  # ${key}: `, "m"));
    }
    const uncommented = text.replace(
      /^ {2}# (unscheduledRechargesPerAircraftMonth|otherUse|stock):/gm,
      "  $1:",
    );
    writeFileSync(join(folder, "plan.yaml"), uncommented);
    const plan = await loadPlan(join(folder, "plan.yaml"));
    expect(plan.nitrogen.unscheduledRechargesPerAircraftMonth).toBe(0.03);
    expect(plan.nitrogen.otherUse?.per).toBe("week");
    expect(plan.nitrogen.stock?.cylinders).toBe(4);
  });

  it("says in the folder where climate files go and where NOAA publishes them", async () => {
    expect(await main(["init", dir])).toBe(0);
    const note = readFileSync(join(dir, "README.txt"), "utf8");
    expect(note).toMatch(/climate\//);
    expect(note).toMatch(/Integrated Surface Data/);
    expect(note).toMatch(/NCEI|National Centers for Environmental Information/);
  });

  it("refuses to overwrite an existing file (exit 2) and leaves it untouched", async () => {
    writeFileSync(join(dir, "schedule.csv"), "mine\n");
    expect(await main(["init", dir])).toBe(2); // exit codes: README, Outputs
    expect(readFileSync(join(dir, "schedule.csv"), "utf8")).toBe("mine\n");
    expect(existsSync(join(dir, "plan.yaml"))).toBe(false);
  });

  it("makes a valid plan name from any folder name", () => {
    // Rule of planNameFromFolder (letters, digits, space, - _ . as the plan reader allows; no source).
    expect(planNameFromFolder("/tmp/My Fleet")).toBe("My Fleet");
    // Unicode NFD splits "é" into "e" and a combining accent, which is dropped.
    expect(planNameFromFolder("/tmp/été-2027")).toBe("ete-2027");
    expect(planNameFromFolder("/tmp/base/Øst")).toBe("st");
    expect(planNameFromFolder("/tmp/---")).toBe("my-plan");
  });
});

describe("the starter plan's example accumulator is physically consistent", () => {
  // Checked with the accumulator physics of docs/methods.md §3 (Span et al. 2000 real gas): the
  // example pump refills after a full start within its timer at the coldest row of the energy table,
  // and one accumulator meets the table down to the temperature the starter plan's comments state.
  const text = starterPlanText("starter");
  const plan = parsePlanText(text, "plan.yaml");
  const profile = plan.profiles[0]!;
  const ctx = profileContext(profile, realGas, ATM_PA, false, { exactDischarge: true });
  const option = profileContext(profile, realGas, ATM_PA, true, { exactDischarge: true });
  /** One unit charged to nominal system pressure at tempK, fully discharged: energy and end volume. */
  const fullStart = (tempK: number) => {
    const c = chargedState(realGas, ctx.geometry, ctx.fluid, ctx.nominalMol, tempK, ctx.systemNominalAbsPa);
    return startDischarge(realGas, ctx.geometry, 1, ctx.nominalMol, tempK, c.gasVolumeM3, ctx.starter);
  };

  it("recharges after a full start within the timer at the coldest ambient of its energy table", () => {
    const coldK = profile.startEnergy[0]!.ambient;
    const end = fullStart(coldK).end.gasVolumeM3;
    for (const c of [ctx, option]) {
      const r = recharge(
        realGas,
        c.geometry,
        c.count,
        ctx.nominalMol,
        coldK,
        end,
        ctx.systemNominalAbsPa,
        c.pump,
      );
      expect(r.reachedSystem).toBe(true);
      expect(r.timeS).toBeLessThan(c.pump.timerS);
    }
  });

  it("meets its energy table with one accumulator down to the temperature its comments state, not 10 °F below", () => {
    const stated = /meets this table down\s*#?\s*to (-?\d+) F/.exec(text);
    expect(stated).not.toBeNull();
    const limitK = fToK(Number(stated![1]));
    const margin = (tempK: number) =>
      fullStart(tempK).hydraulicEnergyJ - interpolateClamped(ctx.energyTable, tempK);
    for (const k of [limitK, limitK + 20, limitK + 60, fToK(70)]) expect(margin(k)).toBeGreaterThan(0);
    expect(margin(limitK - 10 / 1.8)).toBeLessThan(0);
    // The option's two accumulators meet the coldest row.
    const coldK = profile.startEnergy[0]!.ambient;
    expect(option.optionCount * fullStart(coldK).hydraulicEnergyJ).toBeGreaterThan(
      interpolateClamped(ctx.energyTable, coldK),
    );
  });
});
