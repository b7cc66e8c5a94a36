/** Shared helpers of the plan tests: the fixture plan with edits, and synthetic climate. */
import { readFileSync } from "node:fs";
import { parse, stringify } from "yaml";
import { emptyQc } from "../../src/climate/qc.js";
import type { StationClimate } from "../../src/climate/types.js";
import type { BaseClimate } from "../../src/plan/engine.js";
import { type Plan, parsePlanText } from "../../src/plan/planFile.js";

export const FIXTURE_DIR = new URL("../fixtures/plan/", import.meta.url);
export const FIXTURE_TEXT = readFileSync(new URL("minimal-plan.yaml", FIXTURE_DIR), "utf8");

// biome-ignore lint/suspicious/noExplicitAny: test edits of a parsed YAML tree
export type Tree = any;

/** The fixture plan with edits applied to its YAML tree. */
export function fixturePlan(edit: (t: Tree) => void = () => {}, file = "plan.yaml"): Plan {
  const tree = parse(FIXTURE_TEXT);
  edit(tree);
  return parsePlanText(stringify(tree), file);
}

export const HOUR_MS = 3_600_000;

/** A one-station climate whose hourly temperature is fn(utcMs), over [fromUtcMs, toUtcMs). */
export function syntheticClimate(
  fn: (utcMs: number) => number,
  fromUtcMs: number,
  toUtcMs: number,
  opts: { timeZone?: string; atmPa?: number; id?: string } = {},
): BaseClimate {
  const n = (toUtcMs - fromUtcMs) / HOUR_MS;
  const tempC = new Float64Array(n);
  for (let i = 0; i < n; i++) tempC[i] = fn(fromUtcMs + i * HOUR_MS);
  const series = { startUtcMs: fromUtcMs, tempC, filled: new Uint8Array(n) };
  const station: StationClimate = {
    meta: {
      id: opts.id ?? "999999-99999",
      name: "synthetic",
      lat: 0,
      lon: 0,
      elevationM: 0,
      timeZone: opts.timeZone ?? "UTC",
      callLetters: null,
    },
    series,
    qc: { ...emptyQc(), read: n, kept: n },
    extremes: null,
    meanStationPressureHpa: null,
    malformedExamples: [],
  };
  return { stations: [station], series, timeZone: opts.timeZone ?? "UTC", atmPa: opts.atmPa ?? 101325 };
}
