import { describe, expect, it } from "vitest";
import { main } from "../../src/cli/main.js";

describe("command line", () => {
  // Exit codes: product brief, section 6 (2 for usage errors).
  it("exits 2 on an unknown command", async () => {
    const code = await main(["no-such-command"]);
    expect(code).toBe(2);
  });
});
