/**
 * Nitrogen logistics of a base (docs/methods.md §7). In each sample — a climate year and a draw of
 * the seeded events — every demand event of every stay at the base (`nitrogenDemand.ts`: servicing by
 * the policy, unscheduled full recharges, other uses), in the order they happen, draws on one pool of
 * cylinders by the cascade of the physics module (lowest-pressure cylinder first, each giving gas while
 * its pressure exceeds the accumulator's plus the transfer differential; the hose vented at each
 * disconnect). When the pool cannot meet an event a new full cylinder is opened; the count of cylinders
 * opened is the sample's cylinder need. The base's figures are quantiles and means over the samples;
 * the usable gas, the stock and the timeline come from `nitrogenStock.ts`.
 */
import { type GasModel, N2_MOLAR_MASS_KG_MOL } from "../physics/nitrogen.js";
import type { SupplySpec } from "../physics/supply.js";
import { absPa, N2_NORMAL_DENSITY_KG_M3, STANDARD_ATMOSPHERE_PA } from "../units/index.js";
import type { ProfileContext } from "./context.js";
import { CylinderPool } from "./cylinderPool.js";
import {
  type BaseCalendar,
  baseCalendar,
  EVENT_DRAWS,
  groupContexts,
  inTimeOrder,
  otherUseEvents,
  type SupplyEvent,
  servicingEvents,
  unscheduledEvents,
} from "./nitrogenDemand.js";
import { stockAndTimeline, usableGasRows } from "./nitrogenStock.js";
import type { Plan } from "./planFile.js";
import type { NitrogenBase, NitrogenFlows, NitrogenSample, NitrogenStay } from "./results.js";
import type { BaseSamples } from "./samples.js";
import type { BaseOutcomes, Simulator } from "./simulateSamples.js";
import { quantile, sortedCopy } from "./stats.js";

/** One sample of a base through the cascade. Per stay (index) in mol; drawn = added + hose + other uses. */
export interface CascadeSample {
  cylindersOpened: number;
  addedServicingMol: Float64Array;
  addedUnscheduledMol: Float64Array;
  hoseMol: Float64Array;
  otherUseMol: Float64Array;
  /** Gas drawn from the cylinders on each real day, mol. */
  drawnMolByDay: Float64Array;
  /** Events no full cylinder could meet (fill pressure too low for the target and differential). */
  unreachable: number;
  /** Gas left in the cylinders opened, mol (what they gave = opened × a full cylinder − this). */
  gasLeftMol: number;
}

/** Replays a sample's events, in the order given, through one pool of cylinders. */
export function cascadeSample(
  model: GasModel,
  spec: SupplySpec,
  events: SupplyEvent[],
  nStays: number,
  nDays: number,
): CascadeSample {
  const pool = new CylinderPool(model, spec);
  const out: CascadeSample = {
    cylindersOpened: 0,
    addedServicingMol: new Float64Array(nStays),
    addedUnscheduledMol: new Float64Array(nStays),
    hoseMol: new Float64Array(nStays),
    otherUseMol: new Float64Array(nStays),
    drawnMolByDay: new Float64Array(nDays),
    unreachable: 0,
    gasLeftMol: 0,
  };
  for (const e of events) {
    let drawn = 0;
    if (e.cause === "otherUse") {
      drawn = pool.draw(e.amountMol, e.floorAbsPa, e.tempK);
      out.otherUseMol[e.stay]! += drawn;
    } else {
      const added = e.cause === "servicing" ? out.addedServicingMol : out.addedUnscheduledMol;
      for (let u = 0; u < e.units; u++) {
        const r = pool.fill(e.v0M3, e.fromMol, e.toMol, e.tempK);
        added[e.stay]! += r.addedMol;
        out.hoseMol[e.stay]! += r.hoseMol;
        drawn += r.addedMol + r.hoseMol;
      }
    }
    out.drawnMolByDay[e.realDay]! += drawn;
  }
  out.cylindersOpened = pool.opened;
  out.unreachable = pool.unreachable;
  out.gasLeftMol = pool.cylinders.reduce((a, c) => a + c.amountMol, 0);
  return out;
}

/** The flows of one vocabulary (`NitrogenFlows`), in the order they are listed. */
export const FLOW_KEYS = [
  "drawn",
  "added",
  "addedServicing",
  "addedUnscheduled",
  "hoseVented",
  "otherUse",
  "released",
] as const satisfies readonly (keyof NitrogenFlows)[];
const COUNT_KEYS = ["servicings", "checks", "strokes", "unscheduled", "cylinders"] as const;
type Key = (typeof FLOW_KEYS)[number] | (typeof COUNT_KEYS)[number];

const KEYS: readonly Key[] = [...FLOW_KEYS, ...COUNT_KEYS];

/** One value per sample of every figure (flows in kg, counts), index: the sample's. */
type Columns = Record<Key, Float64Array>;

function emptyColumns(samples: number): Columns {
  return Object.fromEntries(KEYS.map((k) => [k, new Float64Array(samples)])) as unknown as Columns;
}

/** Puts one sample's figures in the columns. */
function put(c: Columns, sample: number, figures: Record<Key, number>): void {
  for (const k of KEYS) c[k][sample] = figures[k];
}

const kgOf = (mol: number): number => mol * N2_MOLAR_MASS_KG_MOL;

/** The cylinder specification of the plan (fill pressure gauge at the standard atmosphere). */
export function supplySpec(plan: Plan): SupplySpec {
  const n2 = plan.nitrogen;
  return {
    cylinderWaterVolumeM3: n2.cylinder.waterVolume,
    fillAbsPa: absPa(n2.cylinder.fill.pressure, STANDARD_ATMOSPHERE_PA),
    fillTempK: n2.cylinder.fill.tempK,
    transferDifferentialPa: n2.transferDifferential,
    hoseVolumeM3: n2.hoseVolume,
  };
}

/** Every sample of a base replayed: per stay and base columns, the gas drawn by day, the samples. */
interface Replay {
  perStay: Columns[];
  totals: Columns;
  /** Gas drawn on each real day, kg, per sample. */
  drawnKgByDay: Float64Array[];
  samples: NitrogenSample[];
  unreachable: number;
}

/** The figures of stay `si` in one sample (kg and counts); `slot` is its simulated outcome's. */
function stayFigures(
  c: CascadeSample,
  si: number,
  released: { mol: Float64Array; count: Int32Array },
  outcomes: BaseOutcomes,
  slot: number,
): Record<Key, number> {
  const addedServicing = kgOf(c.addedServicingMol[si]!);
  const addedUnscheduled = kgOf(c.addedUnscheduledMol[si]!);
  const hoseVented = kgOf(c.hoseMol[si]!);
  const otherUse = kgOf(c.otherUseMol[si]!);
  const added = addedServicing + addedUnscheduled;
  return {
    drawn: added + hoseVented + otherUse,
    added,
    addedServicing,
    addedUnscheduled,
    hoseVented,
    otherUse,
    released: kgOf(outcomes.ventedMol(slot) + released.mol[si]!),
    servicings: outcomes.servicings(slot),
    checks: outcomes.checks(slot),
    strokes: outcomes.handPumpStrokes(slot),
    unscheduled: released.count[si]!,
    cylinders: 0,
  };
}

/** Every sample (usable year × draw) of a base through the cascade. */
function replaySamples(
  sim: Simulator,
  base: BaseSamples,
  outcomes: BaseOutcomes,
  cal: BaseCalendar,
  draws: number,
  contexts: ProfileContext[],
): Replay {
  const { plan, model } = sim;
  const spec = supplySpec(plan);
  const nStays = base.stays.length;
  const samples = base.years.length * draws;
  const r: Replay = {
    perStay: base.stays.map(() => emptyColumns(samples)),
    totals: emptyColumns(samples),
    drawnKgByDay: [],
    samples: [],
    unreachable: 0,
  };
  for (let yi = 0; yi < base.years.length; yi++) {
    const fixed: SupplyEvent[] = [
      ...servicingEvents(plan, base, outcomes, cal, yi),
      ...otherUseEvents(plan, base, contexts, cal, yi),
    ];
    for (let draw = 0; draw < draws; draw++) {
      const unscheduled = unscheduledEvents(plan, base, contexts, cal, yi, draw);
      const c = cascadeSample(model, spec, inTimeOrder([...fixed, ...unscheduled]), nStays, cal.nDays);
      r.unreachable += c.unreachable;
      // A gas side emptied by unscheduled work releases what the recharge puts back (docs/methods.md §7).
      const released = { mol: new Float64Array(nStays), count: new Int32Array(nStays) };
      for (const e of unscheduled) {
        released.mol[e.stay]! += (e.toMol - e.fromMol) * e.units;
        released.count[e.stay]!++;
      }
      const sample = yi * draws + draw;
      const total = Object.fromEntries(KEYS.map((k) => [k, 0])) as Record<Key, number>;
      for (const [si, gi] of base.groupOfStay.entries()) {
        const f = stayFigures(c, si, released, outcomes, outcomes.slot(yi, gi));
        put(r.perStay[si]!, sample, f);
        for (const k of KEYS) total[k] += f[k];
      }
      total.cylinders = c.cylindersOpened;
      put(r.totals, sample, total);
      r.drawnKgByDay.push(c.drawnMolByDay.map(kgOf));
      r.samples.push({ climateYear: base.years[yi]!, draw, kg: total.drawn });
    }
  }
  return r;
}

const q0 = (v: Float64Array, p: number) => quantile(v, p) ?? 0;
const mean = (v: Float64Array) => (v.length === 0 ? 0 : v.reduce((a, b) => a + b, 0) / v.length);

/** Mean flows of columns, kg. */
function meanFlows(c: Columns): NitrogenFlows {
  return Object.fromEntries(FLOW_KEYS.map((k) => [k, mean(c[k])])) as unknown as NitrogenFlows;
}

/** The per-stay figures of the results. */
function stayResults(base: BaseSamples, perStay: Columns[]): NitrogenStay[] {
  return base.stays.map((s, si) => {
    const c = perStay[si]!;
    return {
      aircraft: s.aircraft,
      arrive: s.arrive,
      depart: s.depart,
      profile: s.profile,
      coldStartOption: s.coldStartOption,
      servicingEventsP50: q0(c.servicings, 0.5),
      kgAddedP50: q0(c.added, 0.5),
      kgHoseVentedP50: q0(c.hoseVented, 0.5),
      kgReleasedP50: q0(c.released, 0.5),
      kgP50: q0(c.drawn, 0.5),
      kgP90: q0(c.drawn, 0.9),
      kgP95: q0(c.drawn, 0.95),
      prechargeChecksP50: q0(c.checks, 0.5),
      handPumpStrokesP50: q0(c.strokes, 0.5),
      unscheduledRechargesMean: mean(c.unscheduled),
      meanKg: meanFlows(c),
    };
  });
}

/** Draws of the seeded events per climate year: several only when the plan has unscheduled recharges. */
export function eventDraws(plan: Plan): number {
  return plan.nitrogen.unscheduledRechargesPerAircraftMonth > 0 ? EVENT_DRAWS : 1;
}

/**
 * The nitrogen of one base: every sample's events replayed through one cylinder pool; quantiles over
 * the samples of each stay's and of the base's totals (never summed quantiles); the usable gas per
 * cylinder, the stock and the timeline. A warning counts events no full cylinder could meet.
 */
export function baseNitrogen(
  sim: Simulator,
  base: BaseSamples,
  outcomes: BaseOutcomes,
  warnings: string[],
): NitrogenBase {
  const { plan } = sim;
  const draws = eventDraws(plan);
  const cal = baseCalendar(base);
  const contexts = groupContexts(sim, base);
  const r = replaySamples(sim, base, outcomes, cal, draws, contexts);
  if (r.unreachable > 0) {
    warnings.push(
      `base "${plan.bases[base.baseIndex]!.name}": ${r.unreachable} servicings or other uses could not be met from a full cylinder (fill pressure too low for the target and the transfer differential)`,
    );
  }
  const t = r.totals;
  const cylindersSorted = sortedCopy(t.cylinders);
  const cylinders = (p: number) => Math.ceil(quantile(cylindersSorted, p) ?? 0);
  const carts = (n: number) => Math.ceil(n / plan.nitrogen.cylindersPerCart);
  const spec = supplySpec(plan);
  const normal = (kg: number) => kg / N2_NORMAL_DENSITY_KG_M3;
  return {
    kgP50: q0(t.drawn, 0.5),
    kgP90: q0(t.drawn, 0.9),
    kgP95: q0(t.drawn, 0.95),
    normalM3P50: normal(q0(t.drawn, 0.5)),
    normalM3P90: normal(q0(t.drawn, 0.9)),
    normalM3P95: normal(q0(t.drawn, 0.95)),
    kgAddedP50: q0(t.added, 0.5),
    kgHoseVentedP50: q0(t.hoseVented, 0.5),
    kgReleasedP50: q0(t.released, 0.5),
    meanKg: meanFlows(t),
    servicingEventsP50: q0(t.servicings, 0.5),
    unscheduledRechargesMean: mean(t.unscheduled),
    unscheduledRechargesP50: q0(t.unscheduled, 0.5),
    unscheduledRechargesP90: q0(t.unscheduled, 0.9),
    unscheduledRechargesP95: q0(t.unscheduled, 0.95),
    cylindersP50: cylinders(0.5),
    cylindersP90: cylinders(0.9),
    cylindersP95: cylinders(0.95),
    cartsP50: carts(cylinders(0.5)),
    cartsP90: carts(cylinders(0.9)),
    cartsP95: carts(cylinders(0.95)),
    draws,
    referenceYear: Number.isFinite(base.refYear) ? base.refYear : null,
    samples: r.samples,
    usableGas: usableGasRows(sim.model, spec, contexts, cal, base.climate.atmPa),
    ...stockAndTimeline(plan, sim.model, spec, contexts, base, cal, r.drawnKgByDay),
    stays: stayResults(base, r.perStay),
  };
}
