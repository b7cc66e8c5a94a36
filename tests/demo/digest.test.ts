/**
 * Output digest of the full demo: results.json, every CSV and report.html (with SOURCE_DATE_EPOCH
 * fixed) hashed file by file and compared with the committed `demo-digest.json`. A restructuring of
 * the code must leave every hash unchanged; a deliberate change of the figures or of the report updates
 * the digest on purpose, in its own commit that says what changed:
 *
 *   UPDATE_DEMO_DIGEST=1 npx vitest run tests/demo/digest.test.ts
 *
 * The expected hashes are the program's own earlier output (a regression guard, not a check against
 * an outside source); the outside checks of the figures live in the physics, climate and plan tests.
 */
import { createHash } from "node:crypto";
import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { main } from "../../src/cli/main.js";

const PLAN = fileURLToPath(new URL("../../sample-data/demo-plan.yaml", import.meta.url));
const DIGEST = fileURLToPath(new URL("./demo-digest.json", import.meta.url));

describe("demo outputs against the committed digest", () => {
  let dir: string;
  let code: number;
  let digest: Record<string, string>;
  /** The summary printed on stdout and the text of every output file, by name. */
  const texts = new Map<string, string>();
  beforeAll(async () => {
    dir = mkdtempSync(join(tmpdir(), "coldsoak-digest-"));
    vi.stubEnv("SOURCE_DATE_EPOCH", "1767225600"); // 2026-01-01T00:00:00Z, any fixed instant
    let stdout = "";
    vi.spyOn(process.stdout, "write").mockImplementation((s: string | Uint8Array) => {
      stdout += String(s);
      return true;
    });
    vi.spyOn(process.stderr, "write").mockImplementation(() => true);
    try {
      code = await main(["plan", PLAN, "--out", join(dir, "out"), "--cache-dir", join(dir, "cache")]);
    } finally {
      vi.restoreAllMocks();
      vi.unstubAllEnvs();
    }
    texts.set("(stdout)", stdout);
    const folder = join(dir, "out", "demo");
    digest = {};
    for (const f of readdirSync(folder).sort()) {
      texts.set(f, readFileSync(join(folder, f), "utf8"));
      digest[f] = createHash("sha256")
        .update(readFileSync(join(folder, f)))
        .digest("hex");
    }
    if (process.env["UPDATE_DEMO_DIGEST"] === "1")
      writeFileSync(DIGEST, `${JSON.stringify(digest, null, 2)}\n`);
  });
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it("runs the demo", () => {
    expect(code).toBe(0);
  });

  it("prints no NaN or infinity in its summary, results.json, CSVs or report", () => {
    // A guard over every output path: a number that is not finite is shown as "–" or left empty.
    expect(texts.size).toBeGreaterThan(3);
    for (const [name, text] of texts) expect(text, name).not.toMatch(/\bNaN\b|Infinity|undefined/);
  });

  it("writes the same bytes, file by file, as the committed digest", () => {
    const expected = JSON.parse(readFileSync(DIGEST, "utf8")) as Record<string, string>;
    expect(Object.keys(digest)).toEqual(Object.keys(expected));
    for (const [f, hash] of Object.entries(expected)) expect(digest[f], f).toBe(hash);
  });
});
