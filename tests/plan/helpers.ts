/** Shared helpers of the plan tests: the fixture plan with edits, and synthetic climate. */
import { readFileSync } from "node:fs";
import { parse, stringify } from "yaml";
import { emptyQc } from "../../src/climate/qc.js";
import type { HourlySeries, StationClimate } from "../../src/climate/types.js";
import { tabulatedGas } from "../../src/physics/gasTable.js";
import { realGas } from "../../src/physics/nitrogen.js";
import type { HangarAir } from "../../src/plan/air.js";
import { stayDays } from "../../src/plan/calendar.js";
import { type ProfileContext, profileContext } from "../../src/plan/context.js";
import { buildDays } from "../../src/plan/days.js";
import type { BaseClimate } from "../../src/plan/engine.js";
import { type Plan, parsePlanText } from "../../src/plan/planFile.js";
import type { Stay } from "../../src/plan/schedule.js";
import { type ArrivalState, type SimOutcome, simulateStayYear } from "../../src/plan/simulate.js";

const ALL_DAYS = ["Mon", "Tue", "Wed", "Thu", "Fri", "Sat", "Sun"];

/** A stay at the fixture's base "North Field" with its profile "standard", no option (or as `extra` says). */
export function stayAt(aircraft: string, arrive: string, depart: string, extra: Partial<Stay> = {}): Stay {
  return {
    aircraft,
    base: "North Field",
    arrive,
    depart,
    coldStartOption: false,
    profile: "standard",
    line: 2,
    ...extra,
  };
}

/** Standard sea-level atmosphere, Pa (ISO 2533). */
export const ATM_PA = 101325;

export const FIXTURE_DIR = new URL("../fixtures/plan/", import.meta.url);
export const FIXTURE_TEXT = readFileSync(new URL("minimal-plan.yaml", FIXTURE_DIR), "utf8");

/** The message of the error a plan text is refused with, or "no error". */
export function errorOf(src: string): string {
  try {
    parsePlanText(src, "plan.yaml");
  } catch (err) {
    return (err as Error).message;
  }
  return "no error";
}

// biome-ignore lint/suspicious/noExplicitAny: test edits of a parsed YAML tree
export type Tree = any;

/** The fixture plan with edits applied to its YAML tree. */
export function fixturePlan(edit: (t: Tree) => void = () => {}, file = "plan.yaml"): Plan {
  const tree = parse(FIXTURE_TEXT);
  edit(tree);
  return parsePlanText(stringify(tree), file);
}

export const HOUR_MS = 3_600_000;

/**
 * The 1 L unit of the physics tests on the fixture plan: 1450 psig at 70 °F, 3000 psig, α 8e-4/K,
 * K 1.5 GPa, 0.2 L line; lag 0, no gas loss, every weekday flown, no hangar.
 */
export function oneLitreUnit(t: Tree): void {
  const p = t.profiles[0];
  p.accumulator = { gasVolumeEmpty: "1 L", gasVolumeFull: "0.1 L" };
  p.precharge = { reference: "1450 psig @ 70 F", tolerance: "50 psi" };
  p.system = { low: "2850 psig", nominal: "3000 psig", high: "3150 psig" };
  p.fluid = { expansionPerK: "8e-4 /K", bulkModulus: "1.5 GPa", lineVolume: "0.2 L" };
  p.thermalTimeConstant = "0 s";
  p.gasLoss = { rate: "0 psi/month", spread: 0 };
  t.operations.weekdays = ALL_DAYS;
  delete t.bases[0].hangar;
}

/** A stay of the schedule at the fixture's base, with its profile and no cold-start option. */
export function fixtureStay(aircraft: string, arrive: string, depart: string): Stay {
  const rest = { base: "North Field", coldStartOption: false, profile: "standard", line: 2 };
  return { aircraft, arrive, depart, ...rest };
}

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
  return {
    stations: [station],
    series,
    timeZone: opts.timeZone ?? "UTC",
    atmPa: opts.atmPa ?? 101325,
    // 101 325 Pa is the ISO 2533 standard atmosphere at the synthetic station's 0 m.
    atmSource: "standard atmosphere",
  };
}

/**
 * One stay simulated on UTC days of one climate year, every weekday flown, checks every 30 days and
 * the "log" policy (the setting of the hand-checked simulation tests), with the real gas table.
 */
export function simulateUtcStay(
  plan: Plan,
  series: HourlySeries,
  stay: { arrive: string; depart: string; climateYear: number },
  options: {
    ctx?: ProfileContext;
    hangar?: { inMin: number; outMin: number; air: HangarAir; months?: ReadonlySet<number> };
    arrival?: ArrivalState;
  } = {},
): SimOutcome {
  const days = buildDays(stayDays(stay.arrive, stay.depart), stay.climateYear, {
    timeZone: "UTC",
    startMinutes: plan.operations.startTimes,
    flownWeekdays: new Set([1, 2, 3, 4, 5, 6, 7]),
    hangar: options.hangar
      ? { inMin: options.hangar.inMin, outMin: options.hangar.outMin, months: options.hangar.months ?? null }
      : null,
  });
  return simulateStayYear({
    ctx: options.ctx ?? profileContext(plan.profiles[0]!, tabulatedGas(realGas), ATM_PA, false),
    series,
    timeZone: "UTC",
    days,
    gasLossFactor: 1,
    hangar: options.hangar?.air ?? null,
    prechargeCheckDays: 30,
    policy: "log",
    arrival: options.arrival ?? "charged",
  });
}
