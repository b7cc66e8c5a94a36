/**
 * Hostile inputs to `coldsoak plan` and `coldsoak climate`: files that are devices, pipes or far too
 * large are refused at once with the reason (exit 2); a station the plan does not use never stops it;
 * the climate cache lives where no plan folder can replace it, follows --out, and a cache that
 * cannot be written only warns.
 */
import { execFileSync } from "node:child_process";
import { existsSync, readdirSync } from "node:fs";
import { mkdir, open, rm, writeFile } from "node:fs/promises";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { cacheStats, resetCacheStats } from "../../src/climate/index.js";
import { formatIsdLine } from "../../src/demo/isdRecord.js";
import { planText, useClimateRoot } from "./planCase.js";
import { runCli } from "./runCli.js";

const { root: climateRoot, writeCase } = useClimateRoot();

/** A sparse file of `bytes` bytes (no disk space used). */
async function sparseFile(path: string, bytes: number): Promise<string> {
  const fh = await open(path, "w");
  await fh.truncate(bytes);
  await fh.close();
  return path;
}

/** A named pipe (FIFO), made with the system's mkfifo. */
function fifo(path: string): string {
  execFileSync("mkfifo", [path]);
  return path;
}

/** Runs the CLI and checks the one-line error of an input refused: exit 2, the message, no output folder. */
async function refused(args: string[], message: RegExp, out?: string): Promise<void> {
  const r = await runCli(args);
  expect(r.code).toBe(2);
  expect(r.err).toMatch(message);
  expect(r.err.trim().split("\n")).toHaveLength(1);
  if (out !== undefined) expect(existsSync(out) ? readdirSync(out) : []).toEqual([]);
}

describe("devices, pipes and oversized files are refused with the reason, exit 2", () => {
  it("/dev/urandom as the plan", async () => {
    await refused(
      ["plan", "/dev/urandom"],
      /coldsoak: \/dev\/urandom: cannot read the plan file: is a character device, not a regular file/,
    );
  });

  it("/dev/zero as the schedule", async () => {
    const c = await writeCase(planText());
    await refused(
      ["plan", c.plan, "--schedule", "/dev/zero", "--out", c.out, "--no-cache"],
      /\/dev\/zero: cannot read the schedule: is a character device, not a regular file/,
      c.out,
    );
  });

  it("a named pipe as the plan, as the schedule and as a climate path (never waits for a writer)", async () => {
    const c = await writeCase(planText());
    await refused(
      ["plan", fifo(join(c.dir, "plan.fifo"))],
      /plan\.fifo: cannot read the plan file: is a named pipe/,
    );
    await refused(
      ["plan", c.plan, "--schedule", fifo(join(c.dir, "schedule.fifo")), "--out", c.out, "--no-cache"],
      /schedule\.fifo: cannot read the schedule: is a named pipe \(FIFO\), not a regular file/,
      c.out,
    );
    await refused(
      ["climate", fifo(join(c.dir, "climate.fifo")), "--no-cache"],
      /climate\.fifo: is a named pipe \(FIFO\), not a regular file; expected a climate file/,
    );
  });

  it("a plan and a schedule over 16 MiB, refused with their size", async () => {
    const c = await writeCase(planText());
    // 16 MiB is the documented limit of a plan or schedule file (README, "Inputs").
    const big = await sparseFile(join(c.dir, "big.yaml"), 17 * 1024 * 1024);
    await refused(
      ["plan", big],
      /big\.yaml: cannot read the plan file: it is 17825792 bytes \(17\.0 MiB\); the plan file may hold at most 16777216 bytes/,
    );
    const bigCsv = await sparseFile(join(c.dir, "big.csv"), 16 * 1024 * 1024 + 1);
    await refused(
      ["plan", c.plan, "--schedule", bigCsv, "--out", c.out, "--no-cache"],
      /big\.csv: cannot read the schedule: it is 16777217 bytes/,
      c.out,
    );
  });
});

/**
 * A file holding one summary-of-day record (report type SOD, ISD format document POS 42-46) of an
 * invented station the plan does not use: a record with coordinates that quality control never keeps.
 */
async function unrelatedStationFile(dir: string): Promise<string> {
  const line = formatIsdLine({
    usaf: "999890",
    wban: "99999",
    utcMs: Date.UTC(2015, 5, 1, 23, 59),
    reportType: "FM-15",
    latDeg: 60.5,
    lonDeg: -150.25,
    elevationM: 120,
    windDeg: 0,
    windMps: 0,
    ceilingM: null,
    visibilityM: 16000,
    tempC: 12.5,
    tempQuality: "1",
    dewPointC: 5,
    seaLevelHpa: 1013,
    altimeterHpa: 1013,
    stationHpa: 1000,
    quality: "1",
  });
  const path = join(dir, "other-station.txt");
  await writeFile(path, `${line.slice(0, 41)}SOD  ${line.slice(46)}\n`);
  return path;
}

describe("a station the plan does not use", () => {
  it("is skipped: an unrelated station with no kept record does not stop the plan", async () => {
    const c = await writeCase(
      planText((t) => {
        t.climate.paths = ["climate", "other-station.txt"];
      }),
    );
    await unrelatedStationFile(c.dir);
    const r = await runCli(["plan", c.plan, "--out", c.out, "--no-cache"]);
    expect(r.err).not.toMatch(/999890/);
    expect(r.code).toBe(0);
  });

  it("coldsoak climate warns of a station without a kept record and takes its position from all its records", async () => {
    const dir = join(climateRoot(), "unrelated");
    await mkdir(dir);
    const r = await runCli(["climate", await unrelatedStationFile(dir), "--no-cache", "--json"]);
    expect(r.code).toBe(0);
    expect(r.err).toMatch(
      /warning: station 999890-99999: none of its 1 record\(s\) is kept \(summary 1\); its position comes from all its records/,
    );
    // The record's own position (written above).
    expect(JSON.parse(r.out).stations[0]).toMatchObject({ id: "999890-99999", lat: 60.5, lon: -150.25 });
  });
});

describe("the climate cache", () => {
  it("lives in <out>/.cache/climate by default, and a plan named cache leaves it alone", async () => {
    const c = await writeCase(
      planText((t) => {
        t.name = "cache";
      }),
    );
    resetCacheStats();
    expect((await runCli(["plan", c.plan, "--out", c.out])).code).toBe(0);
    const entries = readdirSync(join(c.out, ".cache", "climate"));
    expect(entries.filter((f) => f.endsWith(".json"))).toHaveLength(1);
    expect((await runCli(["plan", c.plan, "--out", c.out])).code).toBe(0);
    expect(readdirSync(join(c.out, ".cache", "climate"))).toEqual(entries);
    expect(cacheStats()).toMatchObject({ hits: 1, misses: 1 });
    expect(readdirSync(join(c.out, "cache")).sort()).toContain("results.json");
  });

  it("a file where the cache folder should be: one warning, and the run carries on", async () => {
    const c = await writeCase(planText());
    const blocked = join(c.dir, "not-a-folder");
    await writeFile(blocked, "a file, not a folder\n");
    const r = await runCli(["plan", c.plan, "--out", c.out, "--cache-dir", blocked]);
    expect(r.code).toBe(0);
    const warnings = r.err.split("\n").filter((l) => l.includes("climate cache"));
    expect(warnings).toEqual([
      `warning: climate cache ${blocked} cannot be written (a file stands where a folder should); carrying on without it`,
    ]);
  });

  it("folders where the entry's files should be: one warning, and the run carries on", async () => {
    const c = await writeCase(planText());
    const cacheDir = join(c.dir, "cache");
    expect((await runCli(["plan", c.plan, "--out", c.out, "--cache-dir", cacheDir])).code).toBe(0);
    for (const f of readdirSync(cacheDir)) {
      await rm(join(cacheDir, f));
      await mkdir(join(cacheDir, f));
    }
    const r = await runCli(["plan", c.plan, "--out", c.out, "--cache-dir", cacheDir]);
    expect(r.code).toBe(0);
    expect(r.err.split("\n").filter((l) => l.includes("climate cache"))).toEqual([
      `warning: climate cache ${cacheDir} cannot be written (a folder stands where a file should); carrying on without it`,
    ]);
  });
});
