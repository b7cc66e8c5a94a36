/**
 * First run: `coldsoak --help` lists every command the program registers, with its one-line
 * description, and each command answers `--help` on its own. No numbers asserted.
 */
import { describe, expect, it } from "vitest";
import { buildProgram } from "../../src/cli/main.js";
import { runCli } from "../cli/runCli.js";

describe("coldsoak --help", () => {
  // The commands as the program registers them (src/cli/commands.ts), read from commander itself, not
  // from the help text under test.
  const registered = buildProgram().commands.map((c) => ({
    name: c.name(),
    // The list shows a command's summary where it has one, else its description (commander's rule).
    summary: (c.summary() || c.description()).split(/\s+/).slice(0, 4).join(" "),
  }));

  it("registers at least the commands the issues call for", () => {
    // Commands the README lists (climate, precharge, init); plan runs the demo.
    const names = registered.map((c) => c.name);
    for (const name of ["init", "plan", "climate", "precharge"]) expect(names).toContain(name);
  });

  it("lists every registered command with the start of its description", async () => {
    const { code, out } = await runCli(["--help"]);
    expect(code).toBe(0);
    // Commander wraps long descriptions: compare with whitespace collapsed.
    const flat = out.replace(/\s+/g, " ");
    for (const c of registered) {
      expect(out, c.name).toMatch(new RegExp(`^\\s+${c.name}\\b`, "m"));
      expect(flat, c.name).toContain(c.summary);
    }
  });

  it("each command answers --help with its own usage line", async () => {
    for (const c of registered) {
      const { code, out } = await runCli([c.name, "--help"]);
      expect(code, c.name).toBe(0);
      expect(out, c.name).toContain(`Usage: coldsoak ${c.name}`);
    }
  });
});
