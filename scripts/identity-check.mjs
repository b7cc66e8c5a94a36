#!/usr/bin/env node
/**
 * Identity check of the simulation between two revisions (a reviewer's tool, not part of `npm test`).
 *
 * With τ = 0 (the accumulator at the air temperature), no hangar, no thermal relief valve and the
 * accumulator arriving charged, the exact lag, the hangar models, the relief model and the arrival
 * states reduce to the simulation as it was: the figures must not move. This script builds a base
 * revision (default `main`) from git into a temporary folder, builds the working tree, runs the demo
 * plan so modified (written from the base revision's demo plan, so both read the same file) through
 * both, and compares:
 *   - `bases[].months` of results.json, and
 *   - every CSV the base revision writes, except traces.csv and assumptions.csv,
 * byte for byte. It then lists every other difference (files only one side writes, other results.json
 * keys that differ). Exit 0 when the compared parts are identical, 1 otherwise.
 *
 *   node scripts/identity-check.mjs [base revision]
 *
 * Needs git, the installed node_modules of the working tree, and about a minute on two cores.
 */
import { execFileSync } from "node:child_process";
import { mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, symlinkSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { parse, stringify } from "yaml";

const ROOT = resolve(fileURLToPath(new URL("..", import.meta.url)));
const BASE = process.argv[2] ?? "main";
const EXEMPT = new Set(["traces.csv", "assumptions.csv"]);

const run = (cmd, args, cwd) => execFileSync(cmd, args, { cwd, stdio: ["ignore", "pipe", "pipe"] });

const tmp = mkdtempSync(join(tmpdir(), "coldsoak-identity-"));
try {
  // 1. The base revision, built in its own folder with the working tree's node_modules.
  const baseDir = join(tmp, "base");
  mkdirSync(baseDir);
  const archive = join(tmp, "base.tar");
  run("git", ["archive", "--format=tar", "-o", archive, BASE], ROOT);
  run("tar", ["-xf", archive, "-C", baseDir], tmp);
  symlinkSync(join(ROOT, "node_modules"), join(baseDir, "node_modules"), "dir");
  run(process.execPath, [join(ROOT, "node_modules/typescript/bin/tsc"), "-p", "tsconfig.build.json"], baseDir);
  run(process.execPath, [join(ROOT, "node_modules/typescript/bin/tsc"), "-p", "tsconfig.build.json"], ROOT);

  // 2. The demo so modified: τ = 0, no hangar, no relief valve, arrival charged (the default).
  const demoDir = join(baseDir, "sample-data");
  const tree = parse(readFileSync(join(demoDir, "demo-plan.yaml"), "utf8"));
  for (const b of tree.bases) delete b.hangar;
  for (const p of tree.profiles) {
    p.thermalTimeConstant = "0 s";
    delete p.reliefPressure;
  }
  delete tree.operations.arrival;
  tree.schedule = join(demoDir, tree.schedule);
  tree.climate.paths = tree.climate.paths.map((p) => join(demoDir, p));
  if (tree.climate.stationHistory) tree.climate.stationHistory = join(demoDir, tree.climate.stationHistory);
  const planFile = join(tmp, "identity-plan.yaml");
  writeFileSync(planFile, stringify(tree));

  // 3. Both revisions on that plan.
  const outputs = {};
  for (const [side, dir] of [
    ["base", baseDir],
    ["tree", ROOT],
  ]) {
    const out = join(tmp, `out-${side}`);
    run(process.execPath, [join(dir, "dist/cli/main.js"), "plan", planFile, "--out", out, "--cache-dir", join(tmp, "cache")], dir);
    const folder = join(out, tree.name);
    outputs[side] = Object.fromEntries(readdirSync(folder).map((f) => [f, readFileSync(join(folder, f))]));
  }

  // 4. The comparison.
  let failed = false;
  const baseJson = JSON.parse(outputs.base["results.json"].toString("utf8"));
  const treeJson = JSON.parse(outputs.tree["results.json"].toString("utf8"));
  const monthsOf = (r) => JSON.stringify(r.bases.map((b) => [b.name, b.months]));
  const monthsSame = monthsOf(baseJson) === monthsOf(treeJson);
  console.log(`results.json bases[].months: ${monthsSame ? "identical" : "DIFFERENT"}`);
  failed ||= !monthsSame;
  for (const f of Object.keys(outputs.base).sort()) {
    if (!f.endsWith(".csv")) continue;
    const same = outputs.tree[f] !== undefined && outputs.base[f].equals(outputs.tree[f]);
    const exempt = EXEMPT.has(f);
    console.log(`${f}: ${same ? "identical" : exempt ? "differs (exempt)" : "DIFFERENT"}`);
    if (!same && !exempt) failed = true;
  }
  console.log("\nOther differences:");
  for (const f of Object.keys(outputs.tree).sort())
    if (outputs.base[f] === undefined) console.log(`  new file ${f}`);
  for (const f of Object.keys(outputs.base).sort())
    if (outputs.tree[f] === undefined) console.log(`  file no longer written: ${f}`);
  const keys = new Set([...Object.keys(baseJson), ...Object.keys(treeJson)]);
  for (const k of [...keys].sort()) {
    if (k === "bases") continue;
    if (JSON.stringify(baseJson[k]) !== JSON.stringify(treeJson[k])) console.log(`  results.json ${k} differs`);
  }
  const baseKeys = new Set([...baseJson.bases.flatMap((b) => Object.keys(b)), ...treeJson.bases.flatMap((b) => Object.keys(b))]);
  for (const k of [...baseKeys].sort()) {
    if (k === "months") continue;
    const a = JSON.stringify(baseJson.bases.map((b) => b[k]));
    const b = JSON.stringify(treeJson.bases.map((x) => x[k]));
    if (a !== b) console.log(`  results.json bases[].${k} differs`);
  }
  console.log(failed ? "\nIDENTITY CHECK FAILED" : "\nidentity check passed");
  process.exitCode = failed ? 1 : 0;
} finally {
  rmSync(tmp, { recursive: true, force: true });
}
