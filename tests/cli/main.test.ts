import { describe, expect, it } from "vitest";
import { runCli } from "./runCli.js";

const COMMANDS = ["init", "plan", "climate", "precharge", "band", "energy", "pdf"];

describe("command line", () => {
  // Exit codes: README, Outputs (0 success, 2 input or usage error).
  it("exits 2 on an unknown command, with a one-line message", async () => {
    const r = await runCli(["no-such-command"]);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/unknown command 'no-such-command'/);
    expect(r.out).toBe("");
  });

  it("exits 2 without a command, showing the help on stderr", async () => {
    const r = await runCli([]);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/Usage: coldsoak/);
  });

  it("--help lists every command with an example, and the caution (README)", async () => {
    const r = await runCli(["--help"]);
    expect(r.code).toBe(0);
    for (const c of COMMANDS) {
      expect(r.out).toMatch(new RegExp(`^  ${c} `, "m"));
      expect(r.out).toMatch(new RegExp(`^  coldsoak ${c} `, "m"));
    }
    expect(r.out).toMatch(/Planning estimates, not maintenance data/);
  });

  for (const c of COMMANDS) {
    it(`${c} --help shows at least one example (README: every command has --help with examples)`, async () => {
      const r = await runCli([c, "--help"]);
      expect(r.code).toBe(0);
      expect(r.out).toMatch(/Examples:\n {2}coldsoak /);
      expect(r.out).toContain(`coldsoak ${c}`);
    });
  }
});
