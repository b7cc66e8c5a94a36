/**
 * Nitrogen logistics of a base (docs/methods.md, "Nitrogen supply"): in each climate year the
 * servicings of every stay at the base, in the order they happen, draw on one pool of cylinders by
 * the cascade of the physics module (lowest-pressure cylinder first, each giving gas while its
 * pressure exceeds the accumulator's plus the transfer differential; the hose vented at each
 * disconnect). When the pool cannot reach a servicing's target a new full cylinder is opened; the
 * count of cylinders opened is the year's cylinder need. The base's totals are quantiles over years.
 */
import { type GasModel, N2_MOLAR_MASS_KG_MOL } from "../physics/nitrogen.js";
import { type Cylinder, cascadeFill, fullCylinder, type SupplySpec } from "../physics/supply.js";
import { STANDARD_ATMOSPHERE_PA } from "../units/index.js";
import { absPa } from "./context.js";
import type { Plan } from "./planFile.js";
import type { NitrogenBase, NitrogenStay } from "./results.js";
import type { BaseSamples } from "./samples.js";
import type { NitrogenEvent } from "./simulate.js";
import type { BaseOutcomes } from "./simulateSamples.js";
import { quantile, sortedCopy } from "./stats.js";

export interface OrderedEvent {
  /** Sort key: real date (YYYY-MM-DD) of the event, then the instant. */
  realIso: string;
  utcMs: number;
  stay: number;
  /** Gas volume of the accumulator on its fluid-side stop (where the gas goes), m³. */
  v0M3: number;
  event: NitrogenEvent;
}

export interface CascadeYear {
  cylindersOpened: number;
  /** Gas into accumulators and vented from the hose, per stay index, mol. */
  addedMol: Map<number, number>;
  hoseMol: Map<number, number>;
  /** Servicings whose target no full cylinder could reach (fill pressure too low). */
  unreachable: number;
}

const MAX_CYLINDERS_PER_SERVICING = 20;

export function cascadeYear(model: GasModel, spec: SupplySpec, events: OrderedEvent[]): CascadeYear {
  const sorted = [...events].sort((a, b) =>
    a.realIso < b.realIso ? -1 : a.realIso > b.realIso ? 1 : a.utcMs - b.utcMs || a.stay - b.stay,
  );
  let pool: Cylinder[] = [];
  const out: CascadeYear = { cylindersOpened: 0, addedMol: new Map(), hoseMol: new Map(), unreachable: 0 };
  const add = (m: Map<number, number>, k: number, v: number) => m.set(k, (m.get(k) ?? 0) + v);
  for (const { stay, event, v0M3 } of sorted) {
    for (let u = 0; u < event.units; u++) {
      let from = event.fromMol;
      for (let k = 0; k <= MAX_CYLINDERS_PER_SERVICING; k++) {
        const r = cascadeFill(model, pool, v0M3, from, event.toMol, event.tempK, spec);
        pool = r.cylinders;
        add(out.addedMol, stay, r.addedMol);
        add(out.hoseMol, stay, r.ventedMol);
        from += r.addedMol;
        if (r.reachedTarget) break;
        if (k === MAX_CYLINDERS_PER_SERVICING || (k > 0 && r.addedMol <= 0)) {
          out.unreachable++;
          break;
        }
        pool = [...pool, fullCylinder(model, spec)];
        out.cylindersOpened++;
      }
    }
  }
  return out;
}

/** One stay's figures on each climate year, kg and counts. */
interface StayYears {
  kg: number[];
  addedKg: number[];
  ventedKg: number[];
  servicings: number[];
  checks: number[];
  strokes: number[];
}

/** The base's totals on each climate year. */
interface BaseYears {
  kg: number[];
  addedKg: number[];
  ventedKg: number[];
  servicings: number[];
  cylinders: number[];
  /** Servicings no full cylinder could bring to target, all years together. */
  unreachable: number;
}

const kgOf = (mol: number): number => mol * N2_MOLAR_MASS_KG_MOL;

/** The cylinder specification of the plan (fill pressure gauge at the standard atmosphere). */
function supplySpec(plan: Plan): SupplySpec {
  const n2 = plan.nitrogen;
  return {
    cylinderWaterVolumeM3: n2.cylinder.waterVolume,
    fillAbsPa: absPa(n2.cylinder.fill.pressure, STANDARD_ATMOSPHERE_PA),
    fillTempK: n2.cylinder.fill.tempK,
    transferDifferentialPa: n2.transferDifferential,
    hoseVolumeM3: n2.hoseVolume,
  };
}

/** The servicings of every stay of a base on its usable year `yi`, for the cascade. */
function yearEvents(plan: Plan, base: BaseSamples, outcomes: BaseOutcomes, yi: number): OrderedEvent[] {
  const events: OrderedEvent[] = [];
  for (const [si, gi] of base.groupOfStay.entries()) {
    const days = base.days[yi]![gi]!;
    const v0M3 = plan.profiles[base.groups[gi]!.profileIndex]!.accumulator.gasVolumeEmpty;
    for (const e of outcomes[yi]![gi]!.nitrogen) {
      events.push({ realIso: days[e.day]!.realIso, utcMs: e.utcMs, stay: si, v0M3, event: e });
    }
  }
  return events;
}

/** Every year of a base through the cylinder cascade: per stay and base totals by year. */
function replayYears(
  plan: Plan,
  model: GasModel,
  base: BaseSamples,
  outcomes: BaseOutcomes,
): { perStay: StayYears[]; totals: BaseYears } {
  const spec = supplySpec(plan);
  const perStay: StayYears[] = base.stays.map(() => ({
    kg: [],
    addedKg: [],
    ventedKg: [],
    servicings: [],
    checks: [],
    strokes: [],
  }));
  const totals: BaseYears = {
    kg: [],
    addedKg: [],
    ventedKg: [],
    servicings: [],
    cylinders: [],
    unreachable: 0,
  };
  for (let yi = 0; yi < base.years.length; yi++) {
    const c = cascadeYear(model, spec, yearEvents(plan, base, outcomes, yi));
    totals.unreachable += c.unreachable;
    let kg = 0;
    let addedKg = 0;
    let ventedKg = 0;
    let servicings = 0;
    for (const [si, gi] of base.groupOfStay.entries()) {
      const o = outcomes[yi]![gi]!;
      const added = c.addedMol.get(si) ?? 0;
      const hose = c.hoseMol.get(si) ?? 0;
      const ps = perStay[si]!;
      ps.kg.push(kgOf(added + hose));
      ps.addedKg.push(kgOf(added));
      ps.ventedKg.push(kgOf(o.ventedMol + hose));
      ps.servicings.push(o.servicings);
      ps.checks.push(o.checks);
      ps.strokes.push(o.handPumpStrokes);
      kg += kgOf(added + hose);
      addedKg += kgOf(added);
      ventedKg += kgOf(o.ventedMol + hose);
      servicings += o.servicings;
    }
    totals.kg.push(kg);
    totals.addedKg.push(addedKg);
    totals.ventedKg.push(ventedKg);
    totals.servicings.push(servicings);
    totals.cylinders.push(c.cylindersOpened);
  }
  return { perStay, totals };
}

/**
 * The nitrogen of one base: the year's servicings of all its stays replayed through one cylinder pool
 * per climate year; quantiles over years of each stay's and of the base's yearly totals (never summed
 * quantiles). A warning counts servicings no full cylinder could bring to target.
 */
export function baseNitrogen(
  plan: Plan,
  model: GasModel,
  base: BaseSamples,
  outcomes: BaseOutcomes,
  warnings: string[],
): NitrogenBase {
  const { perStay, totals } = replayYears(plan, model, base, outcomes);
  if (totals.unreachable > 0) {
    warnings.push(
      `base "${plan.bases[base.baseIndex]!.name}": ${totals.unreachable} servicings could not reach the precharge target from a full cylinder (fill pressure too low for the transfer differential)`,
    );
  }
  const q0 = (v: number[], p: number) => quantile(v, p) ?? 0;
  const stays: NitrogenStay[] = base.stays.map((s, si) => {
    const ps = perStay[si]!;
    return {
      aircraft: s.aircraft,
      arrive: s.arrive,
      depart: s.depart,
      profile: s.profile,
      coldStartOption: s.coldStartOption,
      servicingEventsP50: q0(ps.servicings, 0.5),
      kgAddedP50: q0(ps.addedKg, 0.5),
      kgVentedP50: q0(ps.ventedKg, 0.5),
      kgP50: q0(ps.kg, 0.5),
      kgP90: q0(ps.kg, 0.9),
      kgP95: q0(ps.kg, 0.95),
      prechargeChecksP50: q0(ps.checks, 0.5),
      handPumpStrokesP50: q0(ps.strokes, 0.5),
    };
  });
  const cylindersSorted = sortedCopy(totals.cylinders);
  const cylinders = (p: number) => Math.ceil(quantile(cylindersSorted, p) ?? 0);
  const carts = (n: number) => Math.ceil(n / plan.nitrogen.cylindersPerCart);
  return {
    kgP50: q0(totals.kg, 0.5),
    kgP90: q0(totals.kg, 0.9),
    kgP95: q0(totals.kg, 0.95),
    kgAddedP50: q0(totals.addedKg, 0.5),
    kgVentedP50: q0(totals.ventedKg, 0.5),
    servicingEventsP50: q0(totals.servicings, 0.5),
    cylindersP50: cylinders(0.5),
    cylindersP90: cylinders(0.9),
    cylindersP95: cylinders(0.95),
    cartsP50: carts(cylinders(0.5)),
    cartsP90: carts(cylinders(0.9)),
    cartsP95: carts(cylinders(0.95)),
    stays,
  };
}
