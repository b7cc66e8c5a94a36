/**
 * Physics benchmark: density-from-pressure calls and trapped-charge solves per second, with the full
 * reference equation and with the interpolation table, plus the start and recharge steps. The baseline
 * is a closed-form ideal-gas loop measured in the same run, so ratios are comparable across machines.
 * The planning simulation needs at least 0.5 million accumulator-hours per second on one core, each
 * hour being about one trapped-state solve.
 */
import {
  type AccumulatorGeometry,
  chargedState,
  gasAmountMol,
  lagTempK,
  recharge,
  startDischarge,
  trappedState,
} from "../physics/accumulator.js";
import { tabulatedGas } from "../physics/gasTable.js";
import { type GasModel, realGas } from "../physics/nitrogen.js";
import { STANDARD_ATMOSPHERE_PA } from "../units/index.js";
import { type Figure, figureOf, REPEATS, showFigure } from "./harness.js";

const MIN_RUN_MS = 200;

/** Runs `batch` (which does `n` operations) until MIN_RUN_MS has passed; returns operations per second. */
function rate(batch: () => number): number {
  batch(); // warm-up
  let ops = 0;
  const start = performance.now();
  let elapsed = 0;
  do {
    ops += batch();
    elapsed = performance.now() - start;
  } while (elapsed < MIN_RUN_MS);
  return (ops / elapsed) * 1000;
}

let sink = 0; // keeps results alive so the work is not optimised away

/** Hourly ambient temperature of a cold-region day (invented demo figures): −25 °C ± 8 K. */
function ambientK(hour: number): number {
  return 248.15 + 8 * Math.sin((2 * Math.PI * (hour % 24)) / 24);
}

const geometry: AccumulatorGeometry = { v0M3: 5e-3, vminM3: 1.5e-3 };
const fluid = { alphaPerK: 8e-4, bulkModulusPa: 1.5e9, lineVolumeM3: 0.2e-3 };
const ATM = STANDARD_ATMOSPHERE_PA;

function trappedBatch(model: GasModel): () => number {
  const n0 = gasAmountMol(realGas, 10.1e6, 294.26, geometry.v0M3);
  const c = chargedState(realGas, geometry, fluid, n0, 283.15, 20.8e6);
  const out = { gasPressureAbsPa: 0, gasVolumeM3: 0, fluidPressureAbsPa: 0 };
  const hours = 2000;
  return () => {
    let t = 283.15;
    let n = n0;
    for (let h = 0; h < hours; h++) {
      t = lagTempK(t, { dtS: 3600, startK: ambientK(h - 1), endK: ambientK(h) }, 5400);
      n *= 1 - 1e-6; // slow gas loss
      trappedState(model, geometry, fluid, c, t, n, out);
      sink += out.gasPressureAbsPa;
    }
    return hours;
  };
}

/** One round of every rate and its ratios. */
function physicsRound(table: GasModel): Record<string, number> {
  const R = 8.31451;

  const baselineIdealPerSecond = rate(() => {
    let s = 0;
    for (let i = 0; i < 100000; i++) {
      const t = 230 + (i % 100) * 0.9;
      s += (1e6 + i * 300) / (R * t);
    }
    sink += s;
    return 100000;
  });

  const densityBatch = (model: GasModel) => () => {
    for (let i = 0; i < 2000; i++) {
      const t = 215 + (i % 140);
      const p = 0.5e6 + (i % 397) * 1e5;
      sink += model.densityMolM3(p, t);
    }
    return 2000;
  };
  const densityCallsPerSecond = rate(densityBatch(realGas));
  const densityCallsPerSecondTable = rate(densityBatch(table));

  const trappedSolvesPerSecondFull = rate(trappedBatch(realGas));
  const trappedSolvesPerSecondTable = rate(trappedBatch(table));

  const n = gasAmountMol(realGas, 10.1e6, 294.26, geometry.v0M3);
  const starter = { minUsefulAbsPa: 7.0e6, returnAbsPa: ATM };
  const startsPerSecondFull = rate(() => {
    for (let i = 0; i < 200; i++) {
      const d = startDischarge(realGas, geometry, 1, n, 240 + (i % 50), 2.6e-3, starter);
      sink += d.hydraulicEnergyJ;
    }
    return 200;
  });
  const pump = {
    curve: [
      { gaugePa: 0, flowM3S: 2e-4 },
      { gaugePa: 22e6, flowM3S: 0.8e-4 },
    ],
    timerS: 120,
    atmPa: ATM,
  };
  const startsPerSecondTable = rate(() => {
    for (let i = 0; i < 200; i++) {
      const d = startDischarge(table, geometry, 1, n, 240 + (i % 50), 2.6e-3, starter);
      sink += d.hydraulicEnergyJ;
    }
    return 200;
  });
  const rechargeBatch = (model: GasModel) => () => {
    for (let i = 0; i < 200; i++) {
      const r = recharge(model, geometry, 1, n, 240 + (i % 50), 4.5e-3, 20.8e6, pump);
      sink += r.timeS;
    }
    return 200;
  };
  const rechargesPerSecondFull = rate(rechargeBatch(realGas));
  const rechargesPerSecondTable = rate(rechargeBatch(table));

  const figures = {
    baselineIdealPerSecond,
    densityCallsPerSecond,
    densityCallsPerSecondTable,
    trappedSolvesPerSecondFull,
    trappedSolvesPerSecondTable,
    startsPerSecondFull,
    startsPerSecondTable,
    rechargesPerSecondFull,
    rechargesPerSecondTable,
    tableSpeedupTrapped: trappedSolvesPerSecondTable / trappedSolvesPerSecondFull,
    tableSpeedupDensity: densityCallsPerSecondTable / densityCallsPerSecond,
    trappedTableVsBaseline: trappedSolvesPerSecondTable / baselineIdealPerSecond,
    trappedTableVsTarget: trappedSolvesPerSecondTable / 500000,
  };
  return figures;
}

/**
 * Every rate once to warm up, then REPEATS rounds of all of them; each figure is the median and range
 * over the rounds, ratios taken within a round.
 */
export async function benchPhysics(): Promise<Record<string, Figure>> {
  const table = tabulatedGas(realGas);
  physicsRound(table);
  const rounds: Record<string, number>[] = [];
  for (let r = 0; r < REPEATS; r++) rounds.push(physicsRound(table));
  const figures = Object.fromEntries(
    Object.keys(rounds[0]!).map((k) => [k, figureOf(rounds.map((x) => x[k]!))]),
  ) as Record<string, Figure>;
  const fig = (k: string) => showFigure(figures[k]!, 3);
  const lines = [
    `physics (median and range of ${REPEATS} rounds):`,
    `  baseline ideal-gas closed form     ${fig("baselineIdealPerSecond")} /s`,
    `  density from pressure, full        ${fig("densityCallsPerSecond")} /s`,
    `  density from pressure, table       ${fig("densityCallsPerSecondTable")} /s  (×${fig("tableSpeedupDensity")})`,
    `  trapped-state solves, full         ${fig("trappedSolvesPerSecondFull")} /s`,
    `  trapped-state solves, table        ${fig("trappedSolvesPerSecondTable")} /s  (×${fig("tableSpeedupTrapped")}; ${fig("trappedTableVsTarget")} × the 500,000/s target)`,
    `  start discharges, full / table     ${fig("startsPerSecondFull")} / ${fig("startsPerSecondTable")} /s`,
    `  recharges, full / table            ${fig("rechargesPerSecondFull")} / ${fig("rechargesPerSecondTable")} /s`,
  ];
  process.stdout.write(`${lines.join("\n")}\n`);
  if (sink === 42) process.stdout.write("\n");
  return figures;
}
