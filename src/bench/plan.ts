/**
 * Benchmark of the planning engine: accumulator-hours simulated per second on one core, and
 * the wall time of a plan of 10 bases × 30 years × 180-day stays on generated ISD-Lite climate files,
 * with an empty climate cache and with a warm one; each a warm-up, then the median and range of 5. Also exports the synthetic-climate writer the
 * plan tests use (invented stations 999801-99999 … in a temporary folder).
 */
import { mkdtemp, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { gzipSync } from "node:zlib";
import { runPlan } from "../plan/engine.js";
import { parsePlanText } from "../plan/planFile.js";
import { loadPlanClimate } from "../plan/run.js";
import type { Stay } from "../plan/schedule.js";
import { type Figure, figureOf, REPEATS, repeated, showFigure } from "./harness.js";

export interface SyntheticStation {
  id: string; // "USAF-WBAN", invented
  lat: number;
  lon: number;
  elevationM: number;
  /** Annual mean, annual half-swing and daily half-swing, °C. */
  meanC: number;
  annualC: number;
  dailyC: number;
}

/** A deterministic pseudo-noise in [−1, 1] from an integer (no global state). */
function noise(i: number): number {
  let z = (i * 0x9e3779b1) >>> 0;
  z = Math.imul(z ^ (z >>> 15), 0x85ebca6b) >>> 0;
  z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35) >>> 0;
  return ((z ^ (z >>> 16)) >>> 0) / 2147483648 - 1;
}

/** Hourly temperature of a synthetic station: annual and daily cosines plus a slow pseudo-random walk. */
export function syntheticTempC(s: SyntheticStation, utcMs: number): number {
  const day = utcMs / 86_400_000;
  const annual = -s.annualC * Math.cos((2 * Math.PI * (day - 15)) / 365.2425);
  const localSolarHour = (((utcMs / 3_600_000 + s.lon / 15) % 24) + 24) % 24;
  const daily = -s.dailyC * Math.cos((2 * Math.PI * (localSolarHour - 3)) / 24);
  const d = Math.floor(day);
  const weather = 4 * (noise(d) * 0.6 + noise(d - 1) * 0.3 + noise(d - 2) * 0.1);
  return s.meanC + annual + daily + weather;
}

/** Writes one gzipped ISD-Lite file per station and year, plus a station-history CSV; returns its path. */
export async function writeSyntheticIsdLite(
  dir: string,
  stations: SyntheticStation[],
  years: number[],
): Promise<string> {
  const pad = (n: number, w: number) => String(n).padStart(w, " ");
  for (const s of stations) {
    for (const y of years) {
      const start = Date.UTC(y, 0, 1);
      const end = Date.UTC(y + 1, 0, 1);
      const lines: string[] = [];
      for (let t = start; t < end; t += 3_600_000) {
        const d = new Date(t);
        const tenths = Math.round(syntheticTempC(s, t) * 10);
        lines.push(
          `${d.getUTCFullYear()} ${pad(d.getUTCMonth() + 1, 2)} ${pad(d.getUTCDate(), 2)} ${pad(d.getUTCHours(), 2)} ${pad(tenths, 5)} ${pad(tenths - 30, 5)} 10132   270    30     4     0 -9999`,
        );
      }
      await writeFile(join(dir, `${s.id}-${y}.gz`), gzipSync(`${lines.join("\n")}\n`, { level: 1 }));
    }
  }
  const history = join(dir, "..", "station-history.csv");
  const rows = stations.map(
    (s) =>
      `"${s.id.slice(0, 6)}","${s.id.slice(7)}","SYNTHETIC ${s.id}","","","","${s.lat.toFixed(3)}","${s.lon.toFixed(3)}","${s.elevationM.toFixed(1)}","19000101","20991231"`,
  );
  await writeFile(
    history,
    `"USAF","WBAN","STATION NAME","CTRY","STATE","ICAO","LAT","LON","ELEV(M)","BEGIN","END"\n${rows.join("\n")}\n`,
  );
  return history;
}

/** A plan text for the given bases (one station each) in the given folder layout. */
export function syntheticPlanText(
  bases: { name: string; station: string }[],
  years: [number, number],
  seed = 1,
): string {
  return `name: bench
units: us
seed: ${seed}
climate:
  paths: [climate]
  stationHistory: station-history.csv
  cacheDir: cache
  years: { from: ${years[0]}, to: ${years[1]} }
  minYears: 1
bases:
${bases.map((b) => `  - name: ${b.name}\n    stations: ["${b.station}"]`).join("\n")}
profiles:
  - name: standard
    accumulator: { gasVolumeEmpty: "300 in3", gasVolumeFull: "60 in3" }
    precharge: { reference: "1450 psig @ 70 F", tolerance: "50 psi" }
    system: { low: "2850 psig", nominal: "3000 psig", high: "3150 psig" }
    fluid: { expansionPerK: "8e-4 /K", bulkModulus: "1.5 GPa", lineVolume: "0.2 L" }
    thermalTimeConstant: "2 h"
    gasLoss: { rate: "5 psi/month", spread: 0.3 }
    starter: { minUsefulPressure: "1000 psig" }
    startEnergy: [ { ambient: "-40 F", energy: "30 kJ" }, { ambient: "70 F", energy: "15 kJ" } ]
    pump: { curve: [ { pressure: "0 psig", flow: "1.2 L/min" }, { pressure: "3000 psig", flow: "0.8 L/min" } ], timer: "3 min" }
    handPump: { displacement: "1 in3", efficiency: 0.9 }
    coldStartOption: { count: 2, timer: "6 min" }
operations:
  startTimes: ["06:30", "13:00"]
  weekdays: [Mon, Tue, Wed, Thu, Fri]
  prechargeCheckDays: 7
  outOfBand: adjust-precharge
nitrogen:
  cylinder: { waterVolume: "49 L", fill: "2200 psig @ 70 F" }
  transferDifferential: "50 psi"
  hoseVolume: "10 in3"
  cylindersPerCart: 2
`;
}

export async function benchPlan(): Promise<Record<string, Figure>> {
  const root = await mkdtemp(join(tmpdir(), "coldsoak-bench-plan-"));
  try {
    const nBases = 10;
    const years: [number, number] = [1991, 2020];
    const stations: SyntheticStation[] = Array.from({ length: nBases }, (_, i) => ({
      id: `9998${String(i).padStart(2, "0")}-99999`,
      lat: 45 + i,
      lon: -100 + 3 * i,
      elevationM: 100 * i,
      meanC: 8 - 2 * i,
      annualC: 14,
      dailyC: 5,
    }));
    const climateDir = join(root, "climate");
    await import("node:fs/promises").then((fs) => fs.mkdir(climateDir));
    const yearList = Array.from({ length: years[1] - years[0] + 1 }, (_, i) => years[0] + i);
    const t = performance.now();
    await writeSyntheticIsdLite(climateDir, stations, yearList);
    const genS = (performance.now() - t) / 1000;
    const bases = stations.map((s, i) => ({ name: `Base ${i + 1}`, station: s.id }));
    const planFile = join(root, "plan.yaml");
    const text = syntheticPlanText(bases, years);
    await writeFile(planFile, text);
    const plan = parsePlanText(text, planFile);
    // One 180-day stay per base (from 1 October), one aircraft each.
    const stays: Stay[] = bases.map((b, i) => ({
      aircraft: `X${i + 1}`,
      base: b.name,
      arrive: "2027-10-01",
      depart: "2028-03-29",
      coldStartOption: false,
      profile: "standard",
      line: i + 2,
    }));

    // Throughput on one base (climate already loaded).
    const oneBase = { ...plan, bases: plan.bases.slice(0, 1) } as typeof plan;
    const climate1 = await loadPlanClimate(oneBase, { cacheDir: null });
    const engineRates: number[] = [];
    let hours = 0;
    const simHoursPerSecond = await repeated(() => {
      const t0 = performance.now();
      const one = runPlan(oneBase, stays.slice(0, 1), climate1);
      engineRates.push(one.stats.accumulatorHours / ((performance.now() - t0) / 1000));
      hours = one.stats.accumulatorHours;
      return one.stats.accumulatorHours / one.stats.simulationS;
    });
    const engineHoursPerSecond = figureOf(engineRates.slice(1));
    console.log(
      `plan: ${hours} accumulator-hours per run (1 base): hour-by-hour loop ${showFigure(simHoursPerSecond, 0)} accumulator-hours/s (target ≥ 500,000); whole engine ${showFigure(engineHoursPerSecond, 0)} /s`,
    );

    // Whole plan: an empty cache (a fresh folder each time), then the filled one.
    const loads: number[][] = [[], []];
    const sims: number[][] = [[], []];
    for (let i = 0; i <= REPEATS; i++) {
      const cacheDir = join(root, `cache-${i}`);
      for (const k of [0, 1]) {
        // k = 0: the folder is empty; k = 1: the first load filled it.
        const t0 = performance.now();
        const climate = await loadPlanClimate(plan, { cacheDir });
        const t1 = performance.now();
        runPlan(plan, stays, climate);
        const t2 = performance.now();
        if (i === 0) continue; // warm-up
        loads[k]!.push((t1 - t0) / 1000);
        sims[k]!.push((t2 - t1) / 1000);
      }
    }
    const total = (k: number) => figureOf(loads[k]!.map((l, i) => l + sims[k]![i]!));
    const figures: Record<string, Figure> = {
      simHoursPerSecond,
      engineHoursPerSecond,
      planColdCacheS: total(0),
      planWarmCacheS: total(1),
      planColdClimateS: figureOf(loads[0]!),
      planWarmClimateS: figureOf(loads[1]!),
      planSimulationS: figureOf(sims[1]!),
      coldOverWarmRatio: figureOf(
        loads[0]!.map((l, i) => (l + sims[0]![i]!) / (loads[1]![i]! + sims[1]![i]!)),
      ),
    };
    console.log(
      `plan: generated ${nBases} stations × ${yearList.length} years of ISD-Lite in ${genS.toFixed(1)} s`,
    );
    console.log(
      `plan: 10 bases × 30 years × 180 days, empty cache ${showFigure(figures["planColdCacheS"]!)} s (climate ${showFigure(figures["planColdClimateS"]!)} s); warm cache ${showFigure(figures["planWarmCacheS"]!)} s (climate ${showFigure(figures["planWarmClimateS"]!)} s, engine ${showFigure(figures["planSimulationS"]!)} s)`,
    );
    return figures;
  } finally {
    await rm(root, { recursive: true, force: true });
  }
}
