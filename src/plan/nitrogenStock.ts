/**
 * What a base's cylinders hold and how long its stock lasts (docs/methods.md §7): the full, residual
 * and usable gas of one cylinder at the fill temperature and at the base's mean and coldest site
 * temperatures; the timeline of the gas drawn against date (P50 and P90 over the samples) with the
 * usable gas of the stock shipped (plan `nitrogen.stock`) at each day's site temperature, and the date
 * on which the P90 demand since the last top-up first exceeds it.
 */
import type { GasModel } from "../physics/nitrogen.js";
import { N2_MOLAR_MASS_KG_MOL } from "../physics/nitrogen.js";
import { cylinderGas, type SupplySpec } from "../physics/supply.js";
import { kToC, S_PER_DAY } from "../units/index.js";
import type { ProfileContext } from "./context.js";
import { type BaseCalendar, distinctContexts, isoOfDay, lowestTargetAbsPa } from "./nitrogenDemand.js";
import { forBase, type Plan } from "./planFile.js";
import type { CylinderGasRow, NitrogenDay, NitrogenStock } from "./results.js";
import type { BaseSamples } from "./samples.js";
import { quantileOfSorted } from "./stats.js";

/** Usable gas of one full cylinder at tempK at the base, kg. */
function usableKg(model: GasModel, spec: SupplySpec, contexts: ProfileContext[], tempK: number): number {
  return cylinderGas(model, spec, lowestTargetAbsPa(contexts, tempK), tempK).usableMol * N2_MOLAR_MASS_KG_MOL;
}

/** Mean and lowest site temperature over the days a stay covers, all usable years, K. */
function siteTemperatures(cal: BaseCalendar): { meanK: number; coldestK: number } | null {
  let sum = 0;
  let n = 0;
  let coldestK = Number.POSITIVE_INFINITY;
  for (const temps of cal.dayTempK) {
    temps.forEach((t, d) => {
      if (cal.covered[d] === 0 || Number.isNaN(t)) return;
      sum += t;
      n++;
      coldestK = Math.min(coldestK, t);
    });
  }
  return n === 0 ? null : { meanK: sum / n, coldestK };
}

/**
 * Full, residual and usable gas of one cylinder at the fill temperature and at the base's mean and
 * coldest site temperatures (none for a base without stays or usable years).
 */
export function usableGasRows(
  model: GasModel,
  spec: SupplySpec,
  contexts: ProfileContext[],
  cal: BaseCalendar,
  atmPa: number,
): CylinderGasRow[] {
  const site = siteTemperatures(cal);
  if (site === null || contexts.length === 0) return [];
  const targets = distinctContexts(contexts);
  const at: [CylinderGasRow["at"], number][] = [
    ["fill", spec.fillTempK],
    ["mean", site.meanK],
    ["coldest", site.coldestK],
  ];
  return at.map(([label, tempK]) => {
    const g = cylinderGas(model, spec, lowestTargetAbsPa(targets, tempK), tempK);
    const kg = (mol: number) => mol * N2_MOLAR_MASS_KG_MOL;
    return {
      at: label,
      tempC: kToC(tempK),
      fullKPaGauge: (g.fullAbsPa - atmPa) / 1000,
      residualKPaGauge: (g.residualAbsPa - atmPa) / 1000,
      fullKg: kg(g.fullMol),
      residualKg: kg(g.residualMol),
      usableKg: kg(g.usableMol),
      usablePct: (100 * g.usableMol) / g.fullMol,
    };
  });
}

/** Quantiles of each day over the samples: `values[sample][day]` → P50 and P90 per day. */
function dailyQuantiles(values: Float64Array[], nDays: number): { p50: number[]; p90: number[] } {
  const p50: number[] = [];
  const p90: number[] = [];
  const column = new Float64Array(values.length);
  for (let d = 0; d < nDays; d++) {
    for (let s = 0; s < values.length; s++) column[s] = values[s]![d]!;
    column.sort();
    p50.push(quantileOfSorted(column, 0.5) ?? 0);
    p90.push(quantileOfSorted(column, 0.9) ?? 0);
  }
  return { p50, p90 };
}

/** Running sums of each sample's daily gas, from the start and since the last top-up (reset on `resets`). */
function runningSums(
  drawnKgByDay: Float64Array[],
  resets: Uint8Array,
): { cumulative: Float64Array[]; since: Float64Array[] } {
  const cumulative: Float64Array[] = [];
  const since: Float64Array[] = [];
  for (const daily of drawnKgByDay) {
    const c = new Float64Array(daily.length);
    const s = new Float64Array(daily.length);
    let total = 0;
    let sinceTopUp = 0;
    daily.forEach((kg, d) => {
      if (resets[d] === 1) sinceTopUp = 0;
      total += kg;
      sinceTopUp += kg;
      c[d] = total;
      s[d] = sinceTopUp;
    });
    cumulative.push(c);
    since.push(s);
  }
  return { cumulative, since };
}

/** The days (from the first arrival) on which the stock is topped back up: every interval after the start. */
function topUpDays(nDays: number, everyDays: number | null): Uint8Array {
  const resets = new Uint8Array(nDays);
  if (everyDays === null) return resets;
  for (let k = 1; Math.floor(k * everyDays) < nDays; k++) resets[Math.floor(k * everyDays)] = 1;
  return resets;
}

/**
 * The base's stock (plan `nitrogen.stock`, for this base) and the timeline of its deployment: per real
 * day the site temperature (the day's mean outdoor temperature averaged over the climate years), the
 * P50 and P90 over the samples of the gas drawn since the first arrival and since the last top-up, and
 * the usable gas of the stock at that temperature. The stock runs out at P90 on the first day whose
 * P90 demand since the last top-up exceeds the stock's usable gas.
 */
export function stockAndTimeline(
  plan: Plan,
  model: GasModel,
  spec: SupplySpec,
  contexts: ProfileContext[],
  base: BaseSamples,
  cal: BaseCalendar,
  drawnKgByDay: Float64Array[],
): { stock: NitrogenStock; timeline: NitrogenDay[] } {
  const name = plan.bases[base.baseIndex]!.name;
  const cylinders = forBase(plan.nitrogen.stock?.cylinders, name) ?? null;
  const everyS = cylinders === null ? undefined : forBase(plan.nitrogen.stock?.resupplyEvery, name);
  const everyDays = everyS === undefined ? null : everyS / S_PER_DAY;
  const stock: NitrogenStock = {
    cylinders,
    resupplyEveryDays: everyDays,
    usableKgAtMean: null,
    stockOutP90: null,
  };
  const site = siteTemperatures(cal);
  if (drawnKgByDay.length === 0 || site === null) return { stock, timeline: [] };
  const targets = distinctContexts(contexts);
  if (cylinders !== null) stock.usableKgAtMean = cylinders * usableKg(model, spec, targets, site.meanK);
  const { cumulative, since } = runningSums(drawnKgByDay, topUpDays(cal.nDays, everyDays));
  const drawn = dailyQuantiles(cumulative, cal.nDays);
  const sinceTopUp = dailyQuantiles(since, cal.nDays);
  const timeline: NitrogenDay[] = [];
  for (let d = 0; d < cal.nDays; d++) {
    let sum = 0;
    for (const temps of cal.dayTempK) sum += temps[d]!;
    const tempK = sum / cal.dayTempK.length;
    const stockUsableKg = cylinders === null ? null : cylinders * usableKg(model, spec, targets, tempK);
    const date = isoOfDay(cal.startDay, d);
    if (stockUsableKg !== null && stock.stockOutP90 === null && sinceTopUp.p90[d]! > stockUsableKg) {
      stock.stockOutP90 = date;
    }
    timeline.push({
      date,
      siteTempC: kToC(tempK),
      drawnKgP50: drawn.p50[d]!,
      drawnKgP90: drawn.p90[d]!,
      sinceResupplyKgP50: sinceTopUp.p50[d]!,
      sinceResupplyKgP90: sinceTopUp.p90[d]!,
      stockUsableKg,
    });
  }
  return { stock, timeline };
}
