/**
 * Input files of the whole-command benchmarks, built in a temporary folder: one real ISD station-year
 * (../shared/isd-samples/725300-94846-2014.gz, or $COLDSOAK_ISD_SAMPLES) copied to the twenty years
 * 1960–1979 with its year field moved (ISD positions 16–19), as twenty station-year files and as one
 * file holding all twenty; where the samples are absent, twenty of the demo's generated files and
 * their concatenation. Also plan files with N copies of one demo base, for the memory figures.
 */
import { existsSync, mkdirSync, readdirSync, readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { gunzipSync, gzipSync } from "node:zlib";
import { parseDocument } from "yaml";
import { fnv1a32, mulberry32 } from "../demo/prng.js";

export const DEMO_PLAN = fileURLToPath(new URL("../../sample-data/demo-plan.yaml", import.meta.url));
const DEMO_DIR = fileURLToPath(new URL("../../sample-data/", import.meta.url));

export function samplesDir(): string {
  return (
    process.env["COLDSOAK_ISD_SAMPLES"] ??
    fileURLToPath(new URL("../../../shared/isd-samples/", import.meta.url))
  );
}

const STATION_YEAR = "725300-94846-2014.gz";

export interface ClimateInputs {
  /** Where the files come from, for the report. */
  source: string;
  /** The twenty files (in a folder of their own). */
  twentyDir: string;
  twentyFiles: string[];
  /** The same text as one gzip file. */
  oneFile: string;
  textBytes: number;
}

/** Writes the twenty files and the one file into `dir`. */
export function climateInputs(dir: string): ClimateInputs {
  const twentyDir = join(dir, "twenty");
  mkdirSync(twentyDir, { recursive: true });
  const sample = join(samplesDir(), STATION_YEAR);
  const texts: { name: string; text: string }[] = [];
  let source: string;
  if (existsSync(sample)) {
    source = `${STATION_YEAR} (NOAA ISD) copied to 1960–1979`;
    const text = gunzipSync(readFileSync(sample)).toString("latin1");
    for (let year = 1960; year < 1980; year++)
      texts.push({
        name: `725300-94846-${year}.gz`,
        text: text.replace(/^(.{15})2014/gm, (_m, head: string) => `${head}${year}`),
      });
  } else {
    source = "twenty of the demo's generated station-years (../shared/isd-samples absent)";
    const climate = join(DEMO_DIR, "climate");
    for (const name of readdirSync(climate)
      .filter((n) => n.endsWith(".gz"))
      .sort()
      .slice(0, 20))
      texts.push({ name, text: gunzipSync(readFileSync(join(climate, name))).toString("latin1") });
  }
  const twentyFiles = texts.map(({ name, text }) => {
    const path = join(twentyDir, name);
    writeFileSync(path, gzipSync(Buffer.from(text, "latin1")));
    return path;
  });
  const all = texts.map((t) => (t.text.endsWith("\n") ? t.text : `${t.text}\n`)).join("");
  // A name without USAF-WBAN-YEAR, so that no one-year rule applies to the file holding twenty years.
  const oneFile = join(dir, "twenty-years.isd.gz");
  writeFileSync(oneFile, gzipSync(Buffer.from(all, "latin1")));
  return { source, twentyDir, twentyFiles, oneFile, textBytes: Buffer.byteLength(all, "latin1") };
}

/** The demo base copied for the memory figures: the one with the most stays. */
export const COPIED_BASE = "Veldmoor";

interface DemoPlanData {
  name: string;
  schedule: string;
  climate: { paths: string[]; stationHistory?: string };
  bases: { name: string }[];
  nitrogen?: { stock?: Record<string, unknown> };
  whatIf?: string[];
}

/** The demo plan's data with its files named by absolute paths and without its what-if variants. */
function plainDemoPlan(): DemoPlanData {
  const plan = parseDocument(readFileSync(DEMO_PLAN, "utf8")).toJS() as DemoPlanData;
  plan.climate.paths = plan.climate.paths.map((p) => join(DEMO_DIR, p));
  if (plan.climate.stationHistory) plan.climate.stationHistory = join(DEMO_DIR, plan.climate.stationHistory);
  plan.schedule = join(DEMO_DIR, plan.schedule);
  delete plan.whatIf;
  return plan;
}

/**
 * The demo plan in `dir` without its `whatIf:` list (the plain run; every other setting and file the
 * demo's own). Returns the plan file.
 */
export function plainDemoPlanFile(dir: string): string {
  mkdirSync(dir, { recursive: true });
  return writePlanData(dir, plainDemoPlan());
}

/** Writes a plan's data as `plan.yaml` in `dir`; returns its path. */
function writePlanData(dir: string, plan: unknown): string {
  const file = join(dir, "plan.yaml");
  writeFileSync(file, JSON.stringify(plan)); // JSON is YAML
  return file;
}

/**
 * A stock entry given per base (`{ <base>: value }`) names the copied base: each copy gets that
 * base's value; entries of other bases are dropped (their bases are not in the copied plan).
 */
function copyPerBaseEntries(stock: Record<string, unknown> | undefined, copies: number): void {
  if (stock === undefined) return;
  for (const [key, value] of Object.entries(stock)) {
    if (value === null || typeof value !== "object" || Array.isArray(value)) continue;
    const perBase = value as Record<string, unknown>;
    if (!(COPIED_BASE in perBase)) {
      delete stock[key];
      continue;
    }
    stock[key] = Object.fromEntries(
      Array.from({ length: copies }, (_, k) => [`${COPIED_BASE} ${k + 1}`, perBase[COPIED_BASE]]),
    );
  }
}

/**
 * A plan (and its schedule) in `dir` with `copies` copies of the demo base COPIED_BASE, each with the
 * demo's stays at that base under aircraft names of its own; the demo's climate files; no what-if
 * variants. Returns the plan.
 */
export function copiedBasePlan(dir: string, copies: number): string {
  mkdirSync(dir, { recursive: true });
  const plan = plainDemoPlan();
  const base = plan.bases.find((b) => b.name === COPIED_BASE)!;
  plan.name = `bench-${copies}`;
  plan.schedule = "schedule.csv"; // the copies' schedule written below, not the demo's
  plan.bases = Array.from({ length: copies }, (_, k) => ({ ...base, name: `${COPIED_BASE} ${k + 1}` }));
  copyPerBaseEntries(plan.nitrogen?.stock, copies);
  const [header, ...rows] = readFileSync(join(DEMO_DIR, "demo-schedule.csv"), "utf8").trim().split("\n");
  const stays = rows.map((r) => r.split(",")).filter((c) => c[1] === COPIED_BASE);
  const schedule = [header!];
  for (let k = 1; k <= copies; k++)
    for (const c of stays) schedule.push([`${c[0]}-${k}`, `${COPIED_BASE} ${k}`, ...c.slice(2)].join(","));
  writeFileSync(join(dir, "schedule.csv"), `${schedule.join("\n")}\n`);
  return writePlanData(dir, plan);
}

/** Bases of the demo, in the order the generated schedule rotates through them. */
const DEMO_BASES = ["Veldmoor", "Korrash", "Iskarra", "Sabreth"];

/**
 * A plan in `dir` on the demo's climate and profile with a generated schedule of `rows` stays: invented
 * aircraft ids (`G00001` …), each with stays of 20–60 days one after another from 2027-10-01, moving
 * between the demo's four bases; lengths and bases drawn from a fixed seed (the same file each time).
 * Returns the plan.
 */
export function generatedSchedulePlan(dir: string, rows: number, staysPerAircraft = 8): string {
  mkdirSync(dir, { recursive: true });
  const plan = plainDemoPlan();
  plan.name = `bench-schedule-${rows}`;
  plan.schedule = "schedule.csv";
  const random = mulberry32(fnv1a32(`bench-schedule:${rows}`));
  const lines = ["aircraft,base,arrive,depart,cold_start_option,profile"];
  const day = (d: number) => new Date(Date.UTC(2027, 9, 1 + d)).toISOString().slice(0, 10);
  for (let a = 0; lines.length <= rows; a++) {
    const id = `G${String(a + 1).padStart(5, "0")}`;
    let start = Math.floor(random() * 14);
    for (let s = 0; s < staysPerAircraft && lines.length <= rows; s++) {
      const end = start + 20 + Math.floor(random() * 41);
      const base = DEMO_BASES[Math.floor(random() * DEMO_BASES.length)]!;
      lines.push(`${id},${base},${day(start)},${day(end)},${random() < 0.3 ? "yes" : "no"},utility`);
      start = end;
    }
  }
  writeFileSync(join(dir, "schedule.csv"), `${lines.join("\n")}\n`);
  return writePlanData(dir, plan);
}
