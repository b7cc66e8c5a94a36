/**
 * The fleet's nitrogen (docs/methods.md §7), from the bases' results: demand quantiles of the fleet
 * sum per climate year and draw of the seeded events — every base on one real-time mapping onto the
 * climate years (the fleet's earliest arrival year onto the sample's year), so that bases count the
 * same weather at the same real time — never sums of the bases' quantiles. Cylinders and carts are the
 * sums of the bases' own counts (stock cannot move between bases); mean flows add up.
 */
import { N2_NORMAL_DENSITY_KG_M3 } from "../units/index.js";
import type { BaseResult, NitrogenFleet, NitrogenFlows } from "./results.js";
import { quantile } from "./stats.js";
import { FLOW_KEYS } from "./supplyPlan.js";

/** Sum of the bases' values of one field. */
const sumOf = (bases: BaseResult[], f: (b: BaseResult) => number): number =>
  bases.reduce((a, b) => a + f(b), 0);

/** Each included base's gas drawn per fleet year and draw: year → kg by draw. */
function byFleetYear(b: BaseResult, fleetRefYear: number): Map<number, number[]> {
  const offset = b.nitrogen.referenceYear! - fleetRefYear;
  const out = new Map<number, number[]>();
  for (const s of b.nitrogen.samples) {
    const year = s.climateYear - offset;
    const kg = out.get(year) ?? [];
    kg[s.draw] = s.kg;
    out.set(year, kg);
  }
  return out;
}

/** The fleet roll-up of the bases' nitrogen. */
export function nitrogenFleet(bases: BaseResult[], draws: number): NitrogenFleet {
  const included = bases.filter((b) => b.nitrogen.samples.length > 0 && b.nitrogen.referenceYear !== null);
  const fleetRef = Math.min(...included.map((b) => b.nitrogen.referenceYear!));
  const perBase = included.map((b) => byFleetYear(b, fleetRef));
  const years =
    perBase.length === 0 ? [] : [...perBase[0]!.keys()].filter((y) => perBase.every((m) => m.has(y)));
  years.sort((a, b) => a - b);
  const totals: number[] = [];
  for (const y of years) {
    for (let d = 0; d < draws; d++) totals.push(perBase.reduce((a, m) => a + (m.get(y)![d] ?? 0), 0));
  }
  const q = (p: number) => quantile(totals, p) ?? 0;
  const meanKg = Object.fromEntries(
    FLOW_KEYS.map((k) => [k, sumOf(bases, (b) => b.nitrogen.meanKg[k])]),
  ) as unknown as NitrogenFlows;
  return {
    bases: included.map((b) => b.name),
    climateYears: years,
    draws,
    kgP50: q(0.5),
    kgP90: q(0.9),
    kgP95: q(0.95),
    normalM3P50: q(0.5) / N2_NORMAL_DENSITY_KG_M3,
    normalM3P90: q(0.9) / N2_NORMAL_DENSITY_KG_M3,
    normalM3P95: q(0.95) / N2_NORMAL_DENSITY_KG_M3,
    meanKg,
    unscheduledRechargesMean: sumOf(bases, (b) => b.nitrogen.unscheduledRechargesMean),
    cylindersP50: sumOf(bases, (b) => b.nitrogen.cylindersP50),
    cylindersP90: sumOf(bases, (b) => b.nitrogen.cylindersP90),
    cylindersP95: sumOf(bases, (b) => b.nitrogen.cylindersP95),
    cartsP50: sumOf(bases, (b) => b.nitrogen.cartsP50),
    cartsP90: sumOf(bases, (b) => b.nitrogen.cartsP90),
    cartsP95: sumOf(bases, (b) => b.nitrogen.cartsP95),
  };
}
