import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import { planNameFromFolder } from "../../src/cli/initRun.js";
import { main } from "../../src/cli/main.js";
import { loadPlan } from "../../src/plan/planFile.js";
import { parseScheduleText } from "../../src/plan/schedule.js";

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
