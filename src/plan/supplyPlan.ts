/**
 * Nitrogen logistics of one base in one climate year (product brief §3, "Nitrogen supply"): the
 * servicings of every stay at the base, in the order they happen, draw on one pool of cylinders by
 * the cascade of the physics module (lowest-pressure cylinder first, each giving gas while its
 * pressure exceeds the accumulator's plus the transfer differential; the hose vented at each
 * disconnect). When the pool cannot reach a servicing's target a new full cylinder is opened; the
 * count of cylinders opened is the year's cylinder need.
 */
import type { GasModel } from "../physics/nitrogen.js";
import { type Cylinder, cascadeFill, fullCylinder, type SupplySpec } from "../physics/supply.js";
import type { NitrogenEvent } from "./simulate.js";

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
