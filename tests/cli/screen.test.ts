/**
 * The region screen as users run it, in separate processes of the built tool (which `npm test` makes
 * first; skipped, saying so, without it): the unsharded screen, the same split into n = 1, 2 and 7
 * shards run as separate processes and merged, byte for byte (README, "Scale past one machine"); a
 * shard count above the number of stations (empty partials); partials of another plan file or tool
 * version refused with exit 2; a screen-only plan refused by `plan`. Climate: invented synthetic
 * stations (src/bench/plan.ts), five of them, 2014, one of them with January and February only.
 */
import { execFile } from "node:child_process";
import { existsSync, readFileSync } from "node:fs";
import { mkdir, mkdtemp, readdir, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { gunzipSync, gzipSync } from "node:zlib";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { parse, stringify } from "yaml";
import { type SyntheticStation, writeSyntheticIsdLite } from "../../src/bench/plan.js";
import { TOOL_VERSION } from "../../src/version.js";
import { FIXTURE_TEXT } from "../plan/helpers.js";
import { folderFiles } from "./planCase.js";

const CLI = fileURLToPath(new URL("../../dist/cli/main.js", import.meta.url));
const HAVE_BUILD = existsSync(CLI);
if (!HAVE_BUILD) console.warn(`screen process tests skipped: ${CLI} is not built (run npm run build)`);

/** Invented stations (ids 999811…), from a cold continental to a mild climate. */
const STATIONS: SyntheticStation[] = [-16, -8, 0, 8, 14].map((meanC, i) => ({
  id: `9998${11 + i}-99999`,
  lat: 45 + i * 3,
  lon: -100 + i * 7,
  elevationM: 100 * i,
  meanC,
  annualC: 14,
  dailyC: 5,
}));

/** The fixture plan without bases, schedule or nitrogen, on the synthetic climate. */
function screenPlanText(edit: (t: ReturnType<typeof parse>) => void = () => {}): string {
  const t = parse(FIXTURE_TEXT);
  delete t.bases;
  delete t.schedule;
  delete t.nitrogen;
  t.name = "region";
  t.climate = {
    paths: ["climate"],
    stationHistory: "station-history.csv",
    years: { from: 2014, to: 2014 },
    minYears: 1,
  };
  edit(t);
  return stringify(t);
}

interface Run {
  code: number;
  out: string;
  err: string;
}

function cli(args: string[], cwd: string): Promise<Run> {
  return new Promise((resolve) => {
    execFile(
      process.execPath,
      [CLI, ...args],
      { cwd, env: { ...process.env, SOURCE_DATE_EPOCH: "1700000000" }, maxBuffer: 64 << 20 },
      (err, out, errText) =>
        resolve({ code: err ? Number((err as { code?: number }).code ?? 1) : 0, out, err: errText }),
    );
  });
}

let root = "";
const unsharded = new Map<string, string>();

describe.skipIf(!HAVE_BUILD)("screen in separate processes", () => {
  beforeAll(async () => {
    root = await mkdtemp(join(tmpdir(), "coldsoak-screen-"));
    await mkdir(join(root, "climate"));
    await writeSyntheticIsdLite(join(root, "climate"), STATIONS, [2014]);
    // The last station keeps January and February only (under the plan's 80 % of the year): no usable year.
    const cut = join(root, "climate", `${STATIONS[4]!.id}-2014.gz`);
    const lines = gunzipSync(readFileSync(cut)).toString().split("\n");
    await writeFile(cut, gzipSync(`${lines.slice(0, 59 * 24).join("\n")}\n`));
    await writeFile(join(root, "plan.yaml"), screenPlanText());
    const r = await cli(["screen", "plan.yaml", "climate", "--out", "whole", "--workers", "2"], root);
    expect(r.err).toBe("");
    expect(r.code).toBe(0);
    for (const [name, text] of folderFiles(join(root, "whole", "region-screen"))) unsharded.set(name, text);
  }, 300_000);
  afterAll(async () => {
    if (root !== "") await rm(root, { recursive: true, force: true });
  });

  it("screens every station, shows the one without a usable year, and writes the three files", () => {
    expect([...unsharded.keys()]).toEqual(["screen.csv", "screen.html", "screen.json"]);
    const json = JSON.parse(unsharded.get("screen.json")!);
    expect(json.stations.map((s: { station: { id: string } }) => s.station.id)).toEqual(
      STATIONS.map((s) => s.id),
    );
    const few = json.stations.filter((s: { tooFewYears: boolean }) => s.tooFewYears);
    expect(few.map((s: { station: { id: string } }) => s.station.id)).toEqual([STATIONS[4]!.id]);
    expect(few[0].yearsUsed).toEqual([]);
    expect(few[0].months.map((m: { status: string }) => m.status)).toEqual(new Array(12).fill("no-data"));
    // Twelve local months per station, and a header row (the CSV's definition, README).
    expect(unsharded.get("screen.csv")!.trimEnd().split("\r\n")).toHaveLength(1 + 12 * STATIONS.length);
    // The coldest invented station (annual mean −16 °C) needs the option in winter on the fixture profile.
    expect(json.stations[0].monthsNeedingOption).toContain(1);
  });

  it.each([1, 2, 7])(
    "gives the same files when split into %i shards run as separate processes",
    async (n) => {
      const parts = join(root, `parts-${n}`);
      const runs = await Promise.all(
        Array.from({ length: n }, (_v, k) =>
          cli(
            ["screen", "plan.yaml", "climate", "--shard", `${k}/${n}`, "--out", parts, "--workers", "1"],
            root,
          ),
        ),
      );
      for (const r of runs) expect([r.code, r.err]).toEqual([0, ""]);
      const files = (await readdir(parts)).sort();
      expect(files).toEqual(Array.from({ length: n }, (_v, k) => `screen-part-${k}-of-${n}.json`).sort());
      const sizes = files.map((f) => JSON.parse(readFileSync(join(parts, f), "utf8")).stations.length);
      expect(sizes.reduce((a, b) => a + b, 0)).toBe(STATIONS.length);
      // Seven shards for five stations: at least one shard is empty, and its partial merges like the others.
      if (n === 7) expect(sizes).toContain(0);
      const merged = await cli(
        ["screen-merge", ...files.map((f) => join(parts, f)), "--out", join(root, `merged-${n}`)],
        root,
      );
      expect([merged.code, merged.err]).toEqual([0, ""]);
      const out = folderFiles(join(root, `merged-${n}`, "region-screen"));
      for (const name of ["screen.csv", "screen.json", "screen.html"])
        expect(out.get(name)).toBe(unsharded.get(name));
    },
  );

  it("refuses partials of another tool version or plan file with exit 2 and a clear message", async () => {
    const parts = join(root, "parts-2");
    const p0 = join(parts, "screen-part-0-of-2.json");
    const p1 = join(parts, "screen-part-1-of-2.json");
    const older = join(root, "older.json");
    await writeFile(
      older,
      readFileSync(p1, "utf8").replace(/"generatedBy": "coldsoak [^"]+"/, '"generatedBy": "coldsoak 0.0.9"'),
    );
    const version = await cli(["screen-merge", p0, older, "--out", join(root, "refused")], root);
    expect(version.code).toBe(2);
    expect(version.err).toBe(
      `coldsoak: ${older}: written by coldsoak 0.0.9, the first partial by coldsoak ${TOOL_VERSION}; run every shard with one version of the tool\n`,
    );
    await writeFile(
      join(root, "other.yaml"),
      screenPlanText((t) => (t.seed = 43)),
    );
    const other = await cli(
      ["screen", "other.yaml", "climate", "--shard", "1/2", "--out", join(root, "other")],
      root,
    );
    expect(other.code).toBe(0);
    const foreign = await cli(
      ["screen-merge", p0, join(root, "other", "screen-part-1-of-2.json"), "--out", join(root, "refused")],
      root,
    );
    expect(foreign.code).toBe(2);
    expect(foreign.err).toMatch(/screen-part-1-of-2\.json: from another plan file \(SHA-256 [0-9a-f]{12}…/);
    expect(existsSync(join(root, "refused"))).toBe(false);
  });

  it("refuses a plan name ending in -screen, and plan refuses a plan without bases", async () => {
    await writeFile(
      join(root, "clash.yaml"),
      screenPlanText((t) => (t.name = "winter-screen")),
    );
    const clash = await cli(["screen", "clash.yaml", "climate"], root);
    expect(clash.code).toBe(2);
    expect(clash.err).toMatch(
      /clash\.yaml:\d+:name: "winter-screen": expected a name not ending in "-screen"/,
    );
    const plan = await cli(["plan", "plan.yaml"], root);
    expect(plan.code).toBe(2);
    expect(plan.err).toMatch(/^coldsoak: plan\.yaml:\d+:bases: missing; expected a list of bases/);
  });
});
