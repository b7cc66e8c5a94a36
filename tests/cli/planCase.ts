/**
 * Plan cases of the CLI tests: a folder of synthetic ISD-Lite climate with its station history, and
 * plan + schedule files written beside it, one fresh folder per case; the output root as a user sees it.
 */
import { readdirSync, readFileSync, readlinkSync } from "node:fs";
import { mkdir, mkdtemp, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, expect } from "vitest";
import { parse, stringify } from "yaml";
import { type SyntheticStation, writeSyntheticIsdLite } from "../../src/bench/plan.js";
import { FIXTURE_TEXT, type Tree } from "../plan/helpers.js";

export const STATION: SyntheticStation = {
  id: "999801-99999", // invented id (synthetic climate)
  lat: 61.2,
  lon: -149.9,
  elevationM: 40,
  meanC: 2,
  annualC: 15,
  dailyC: 5,
};

export const SCHEDULE =
  "aircraft,base,arrive,depart,cold_start_option,profile\nA01,North Field,2027-01-04,2027-02-01,no,standard\nA02,North Field,2027-01-11,2027-02-08,yes,standard\n";

/** The fixture plan on the synthetic climate (2014–2016), with edits. */
export function planText(edit: (t: Tree) => void = () => {}): string {
  const t = parse(FIXTURE_TEXT);
  t.climate.paths = ["climate"];
  t.climate.stationHistory = "station-history.csv";
  t.climate.years = { from: 2014, to: 2016 };
  t.bases[0].stations = [STATION.id];
  edit(t);
  return stringify(t);
}

/** A temporary folder holding `climate/` (the synthetic station, 2014–2016) and `station-history.csv`. */
export async function makeClimateRoot(): Promise<string> {
  const root = await mkdtemp(join(tmpdir(), "coldsoak-plan-cli-"));
  await mkdir(join(root, "climate"));
  await writeSyntheticIsdLite(join(root, "climate"), [STATION], [2014, 2015, 2016]);
  return root;
}

let caseNo = 0;

/**
 * Registers the setup hooks of a test file's climate root (made before its tests, with a fixed
 * SOURCE_DATE_EPOCH, and removed after them); returns the root's path and a case writer in it.
 */
export function useClimateRoot(): {
  root: () => string;
  writeCase: (plan: string, schedule?: string) => ReturnType<typeof writeCaseIn>;
} {
  let root = "";
  beforeAll(async () => {
    root = await makeClimateRoot();
    process.env.SOURCE_DATE_EPOCH = "1700000000";
  }, 120_000);
  afterAll(async () => {
    if (root !== "") await rm(root, { recursive: true, force: true });
  });
  return { root: () => root, writeCase: (plan, schedule = SCHEDULE) => writeCaseIn(root, plan, schedule) };
}

/** Writes plan + schedule in a fresh case folder under `root` (sharing its climate) and returns their paths. */
export async function writeCaseIn(
  root: string,
  plan: string,
  schedule = SCHEDULE,
): Promise<{ dir: string; plan: string; schedule: string; out: string }> {
  const dir = join(root, `case${caseNo++}`);
  await mkdir(dir);
  await writeFile(
    join(dir, "plan.yaml"),
    plan
      .replace("paths:\n    - climate", "paths:\n    - ../climate")
      .replace("stationHistory: station-history.csv", "stationHistory: ../station-history.csv"),
  );
  await writeFile(join(dir, "minimal-schedule.csv"), schedule);
  return {
    dir,
    plan: join(dir, "plan.yaml"),
    schedule: join(dir, "minimal-schedule.csv"),
    out: join(dir, "out"),
  };
}

/**
 * The entries of an output root as a user sees them: the visible names, after checking that every
 * hidden entry is the version folder a visible link points at (nothing else is left behind; the
 * climate cache `.cache` aside).
 */
export function visibleEntries(out: string): string[] {
  const entries = readdirSync(out).filter((f) => f !== ".cache");
  const visible = entries.filter((f) => !f.startsWith("."));
  const targets = visible.map((f) => readlinkSync(join(out, f)));
  expect(entries.filter((f) => f.startsWith(".")).sort()).toEqual(targets.sort());
  return visible;
}

/** Every file of a folder (through a link) with its text, by name. */
export function folderFiles(dir: string): Map<string, string> {
  return new Map(
    readdirSync(dir)
      .sort()
      .map((f) => [f, readFileSync(join(dir, f), "utf8")]),
  );
}
