/**
 * The benchmark's own measuring harness: whole commands as spawned processes, timed from spawn to
 * exit, in A/B pairs whose order alternates (A B, B A, A B, …) after a warm-up, so that a change of
 * machine load touches both sides of a pair alike; and in-process figures repeated after a warm-up.
 * Every figure is reported as the median and the range (min–max) of its repetitions: on a shared
 * machine a single run says little.
 */
import { spawn } from "node:child_process";
import { readFileSync, rmSync } from "node:fs";

/** A measured figure: median and range over the repetitions. */
export interface Figure {
  median: number;
  min: number;
  max: number;
  /** How many repetitions (after the warm-up) the figure is taken from. */
  n: number;
}

export function figureOf(values: number[]): Figure {
  if (values.length === 0) return { median: Number.NaN, min: Number.NaN, max: Number.NaN, n: 0 };
  const s = [...values].sort((a, b) => a - b);
  const mid = Math.floor(s.length / 2);
  const median = s.length % 2 === 1 ? s[mid]! : (s[mid - 1]! + s[mid]!) / 2;
  return { median, min: s[0]!, max: s[s.length - 1]!, n: s.length };
}

/** Repetitions of every measurement after its warm-up (the minimum is 5). */
export const REPEATS = 5;

/**
 * Runs `measure` once to warm up, then `runs` times; each call returns one value (a time, a rate).
 */
export async function repeated(
  measure: () => number | Promise<number>,
  runs = REPEATS,
  warmups = 1,
): Promise<Figure> {
  for (let i = 0; i < warmups; i++) await measure();
  const values: number[] = [];
  for (let i = 0; i < runs; i++) values.push(await measure());
  return figureOf(values);
}

/** A command to run as its own process. */
export interface Command {
  label: string;
  file: string;
  args: string[];
  cwd?: string;
  env?: Record<string, string>;
  /** Called before every run, outside the timing (e.g. to empty a cache folder). */
  prepare?: () => void;
}

/** What one run of a command gave: wall seconds, and the figures the command wrote (see RUN_STATS). */
export interface RunResult {
  wallS: number;
  stats: Record<string, number>;
}

/**
 * Environment variable naming a file where coldsoak writes the figures of its run when it exits: its
 * peak resident set size (`maxRssKiB`) and, for `plan`, the simulation's own seconds and
 * accumulator-hours (src/cli/runStats.ts).
 */
export const RUN_STATS_ENV = "COLDSOAK_RUN_STATS";

/** Runs a command once, its output discarded; rejects when it fails. */
export function runOnce(cmd: Command, statsFile?: string): Promise<RunResult> {
  cmd.prepare?.();
  if (statsFile !== undefined) rmSync(statsFile, { force: true });
  return new Promise((resolve, reject) => {
    const t0 = process.hrtime.bigint();
    const child = spawn(cmd.file, cmd.args, {
      cwd: cmd.cwd,
      env: { ...process.env, ...cmd.env, ...(statsFile ? { [RUN_STATS_ENV]: statsFile } : {}) },
      stdio: ["ignore", "ignore", "pipe"],
    });
    let err = "";
    child.stderr.on("data", (d: Buffer) => {
      if (err.length < 4000) err += d.toString();
    });
    child.on("error", reject);
    child.on("close", (code) => {
      const wallS = Number(process.hrtime.bigint() - t0) / 1e9;
      if (code !== 0) {
        reject(
          new Error(`${cmd.label} exited with ${code}: ${err.trim().split("\n").slice(-3).join(" / ")}`),
        );
        return;
      }
      let stats: Record<string, number> = {};
      if (statsFile !== undefined) {
        try {
          stats = JSON.parse(readFileSync(statsFile, "utf8")) as Record<string, number>;
        } catch {
          stats = {};
        }
      }
      resolve({ wallS, stats });
    });
  });
}

/** Both sides of a paired measurement and the ratio B/A of each pair. */
export interface PairedResult {
  a: Figure;
  b: Figure;
  ratio: Figure;
  /** The runs themselves, for figures taken from what the commands wrote. */
  runsA: RunResult[];
  runsB: RunResult[];
}

/**
 * Runs A and B `warmups` times each, then `pairs` pairs in alternating order; the ratio of a pair is
 * B's wall time over A's.
 */
export async function paired(
  a: Command,
  b: Command,
  options: { pairs?: number; warmups?: number; statsFile?: string } = {},
): Promise<PairedResult> {
  const { pairs = REPEATS, warmups = 1, statsFile } = options;
  for (let i = 0; i < warmups; i++) {
    await runOnce(a, statsFile);
    await runOnce(b, statsFile);
  }
  const runsA: RunResult[] = [];
  const runsB: RunResult[] = [];
  for (let i = 0; i < pairs; i++) {
    if (i % 2 === 0) {
      runsA.push(await runOnce(a, statsFile));
      runsB.push(await runOnce(b, statsFile));
    } else {
      runsB.push(await runOnce(b, statsFile));
      runsA.push(await runOnce(a, statsFile));
    }
  }
  return {
    a: figureOf(runsA.map((r) => r.wallS)),
    b: figureOf(runsB.map((r) => r.wallS)),
    ratio: figureOf(runsA.map((r, i) => runsB[i]!.wallS / r.wallS)),
    runsA,
    runsB,
  };
}

/** "1.23 (1.10–1.41)": a figure's median and range. */
export function showFigure(f: Figure, digits = 2): string {
  const fmt = (v: number) =>
    Math.abs(v) >= 1000 ? Math.round(v).toLocaleString("en-US") : v.toFixed(digits);
  return `${fmt(f.median)} (${fmt(f.min)}–${fmt(f.max)})`;
}
