import { readdirSync, readFileSync } from "node:fs";
import { dirname, join, relative, resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";

// The report and the output files are written from `results.json` (and the screen's pages and tables
// from `screen.json`) alone: from the plan they may import only the contract types (plan/results.ts,
// plan/screenResults.ts, type-only), and nothing from the climate code or the CLI. Checked on the
// source text of every module in src/report and src/output.

const SRC = fileURLToPath(new URL("../../src/", import.meta.url));

function modules(folder: string): string[] {
  return readdirSync(join(SRC, folder), { recursive: true, encoding: "utf8" })
    .filter((f) => f.endsWith(".ts"))
    .map((f) => join(SRC, folder, f));
}

interface Import {
  file: string;
  /** Target relative to src/, without extension ("plan/results"). */
  target: string;
  typeOnly: boolean;
}

function imports(file: string): Import[] {
  const text = readFileSync(file, "utf8");
  const found: Import[] = [];
  const re = /^(?:import|export)\s+(type\s+)?[\s\S]*?\s+from\s+"(\.[^"]+)";|\bimport\(\s*"(\.[^"]+)"\s*\)/gm;
  for (const m of text.matchAll(re)) {
    const spec = m[2] ?? m[3]!;
    const target = relative(SRC, resolve(dirname(file), spec)).replace(/\.js$/, "");
    found.push({ file: relative(SRC, file), target, typeOnly: m[1] !== undefined });
  }
  return found;
}

describe("report and output dependencies", () => {
  const all = ["report", "output"].flatMap(modules).flatMap(imports);

  it("finds the modules and their imports", () => {
    expect(all.some((i) => i.target === "plan/results")).toBe(true);
    expect(all.some((i) => i.file.startsWith("report/sections/"))).toBe(true);
  });

  it("import from the plan only the contract types, type-only", () => {
    const contracts = new Set(["plan/results", "plan/screenResults"]);
    const plan = all.filter((i) => i.target.startsWith("plan/"));
    expect(plan.filter((i) => !contracts.has(i.target) || !i.typeOnly)).toEqual([]);
    expect(all.some((i) => i.target === "plan/screenResults")).toBe(true);
  });

  it("import nothing from the climate code or the CLI", () => {
    expect(all.filter((i) => /^(climate|cli)\//.test(i.target))).toEqual([]);
  });
});
