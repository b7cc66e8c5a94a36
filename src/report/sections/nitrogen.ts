/**
 * Report section "Nitrogen and cylinders" of a base (partial `nitrogen`): the totals to ship for the
 * base (mass, gas at standard conditions, cylinders, carts, servicing events) and the nitrogen by stay.
 * Reads `BaseResult.nitrogen`.
 */

import { formatDisplay, show } from "../../units/index.js";
import type { BaseContext, TableRow } from "../shared.js";
import { sectionId } from "./glance.js";

export interface NitrogenView {
  /** Fragment id of the section, linked from the first screen. */
  id: string;
  totals: TableRow[];
  stays: TableRow[];
}

export async function nitrogenSection({ base, u, anchor }: BaseContext): Promise<NitrogenView> {
  const n = base.nitrogen;
  const M = u.mass;
  const G = u.gasVolume;
  /** One totals row: label, unit, then P50/P90/P95 ("–" where only the median is computed). */
  const row = (label: string, unit: string, ...values: string[]): TableRow => ({
    cells: [label, unit, ...values, ...Array(3 - values.length).fill("–")],
  });
  const mass = (kg: number) => show(M, kg);
  const gas = (kg: number) => show(G, kg);
  const count = (x: number) => formatDisplay(x, 0);
  return {
    id: sectionId(anchor, "nitrogen"),
    totals: [
      row("Nitrogen mass drawn from cylinders", M.unit, mass(n.kgP50), mass(n.kgP90), mass(n.kgP95)),
      row("Nitrogen at standard conditions", G.unit, gas(n.kgP50), gas(n.kgP90), gas(n.kgP95)),
      row("Cylinders", "count", count(n.cylindersP50), count(n.cylindersP90), count(n.cylindersP95)),
      row("Carts", "count", count(n.cartsP50), count(n.cartsP90), count(n.cartsP95)),
      row("Nitrogen left in accumulators", M.unit, mass(n.kgAddedP50)),
      row("Nitrogen vented (hose, lowered precharges)", M.unit, mass(n.kgVentedP50)),
      row("Servicing events", "count", formatDisplay(n.servicingEventsP50, 1)),
    ],
    stays: n.stays.map((s) => ({
      cells: [
        s.aircraft,
        s.arrive,
        s.depart,
        s.profile,
        s.coldStartOption ? "yes" : "no",
        formatDisplay(s.prechargeChecksP50, 1),
        formatDisplay(s.servicingEventsP50, 1),
        formatDisplay(s.handPumpStrokesP50, 0),
        mass(s.kgAddedP50),
        mass(s.kgVentedP50),
        mass(s.kgP50),
        mass(s.kgP90),
        mass(s.kgP95),
      ],
    })),
  };
}
