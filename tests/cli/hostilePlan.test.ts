/**
 * Hostile plan files through the command: an alias bomb, a value out of its physical range and an
 * over-long plan name all stop `coldsoak plan` with exit 2 and one located line, before any climate is
 * read or any output written.
 */
import { existsSync, readdirSync } from "node:fs";
import { writeFile } from "node:fs/promises";
import { describe, expect, it } from "vitest";
import { planText, useClimateRoot } from "./planCase.js";
import { runCli } from "./runCli.js";

const { writeCase } = useClimateRoot();

/** Runs `coldsoak plan` on a case and checks the one-line refusal: exit 2, the message, no output. */
async function refusedPlan(plan: string, message: RegExp): Promise<void> {
  const c = await writeCase(plan);
  // A climate path that does not exist: a refusal of the plan comes before any climate is read.
  const text = plan.replace("paths:\n    - climate", "paths:\n    - no-such-climate");
  await writeFile(c.plan, text);
  const r = await runCli(["plan", c.plan, "--out", c.out, "--no-cache"]);
  expect(r.code).toBe(2);
  expect(r.err).toMatch(message);
  expect(r.err.trim().split("\n")).toHaveLength(1);
  expect(existsSync(c.out) ? readdirSync(c.out) : []).toEqual([]);
}

describe("hostile plan files stop the plan at load: exit 2, located", () => {
  it("an alias bomb", async () => {
    const rows = ["x", "*a", "*b", "*c", "*d", "*e", "*f"];
    const anchors = rows
      .slice(1)
      .map((ref, i) => `${"bcdefgh"[i]}: &${"bcdefgh"[i]} [${Array(10).fill(ref).join(", ")}]`);
    const bomb = `a: &a [${Array(10).fill('"x"').join(", ")}]\n${anchors.join("\n")}\n${planText()}`;
    await refusedPlan(bomb, /plan\.yaml:2:b: its aliases expand more than 100 times \(an alias bomb\)/);
  });

  it("a negative expansion coefficient", async () => {
    await refusedPlan(
      planText((t) => {
        t.profiles[0].fluid.expansionPerK = "-8e-4 /K";
      }),
      /plan\.yaml:\d+:profiles\[0\]\.fluid\.expansionPerK: "-8e-4 \/K" is below 0 \/K; expected a volumetric expansion coefficient from 0 \/K to 0\.01 \/K/,
    );
  });

  it("a plan name of 300 characters", async () => {
    await refusedPlan(
      planText((t) => {
        t.name = "n".repeat(300);
      }),
      /plan\.yaml:\d+:name: "n{300}": expected a name of at most 100 characters/,
    );
  });
});
